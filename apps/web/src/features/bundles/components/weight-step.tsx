import { estimateYield, formatWeight, planBundle, type Piece, type UnitSystem } from '@scrap-relay/shared';
import { useMemo } from 'react';
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { Button } from '../../../components/ui/button.tsx';
import { FieldGroup, TextField } from '../../../components/ui/form.tsx';
import { bareWeightNote } from '../../../utils/weight-text.ts';
import { emptyPieceRow, parseLengthText, parseWeightText, type ListingFormValues } from '../utils/listing-form.ts';
import { CutPlanPictures } from './cut-plan-pictures.tsx';
import { useListingWizard } from './listing-context.ts';
import { YieldEstimateView } from './yield-estimate.tsx';

const MAX_PIECE_ROWS = 50;

/** Step 3: the weight (for the yield estimate and postage) and, if the seller wants, a list of the larger pieces. */
export function WeightStep() {
  const { units } = useListingWizard();
  const [weightText, fibre, rows] = useWatch<ListingFormValues, ['weightText', 'fibre', 'pieces']>({ name: ['weightText', 'fibre', 'pieces'] });
  const grams = parseWeightText(weightText ?? '', units);

  const estimate = useMemo(() => (grams && grams > 0 ? estimateYield({ grams, fibre: fibre || 'mixed_unknown' }) : null), [grams, fibre]);
  const pieces = useMemo(() => readPieces(rows ?? [], units), [rows, units]);
  const plan = useMemo(() => (pieces.length > 0 ? planBundle(pieces) : null), [pieces]);

  return (
    <div className="space-y-6">
      <FieldGroup legend="Weight">
        <TextField
          name="weightText"
          label="Weight of one pack"
          hint={`Weigh the fabric without the bag, for example ${units === 'metric' ? '750 g or 1.2 kg' : '1 lb 4 oz, 12 oz or 1.5 lb'}. ${bareWeightNote(units)}`}
          autoComplete="off"
          className="max-w-md"
        />
        <p aria-live="polite" className="font-semibold text-thread-soft">
          {grams !== null && grams > 0 ? `Reads as ${grams} g${units === 'imperial' ? ` (${formatWeight(grams, 'imperial')})` : ''}.` : null}
        </p>
        {estimate ? <YieldEstimateView estimate={estimate} units={units} fibre={fibre || null} /> : null}
      </FieldGroup>
      <PiecesGroup />
      {plan ? <CutPlanPictures plan={plan} units={units} /> : null}
    </div>
  );
}

/** Rows that read as whole pieces; half-typed rows are left out of the live pictures. */
function readPieces(rows: ListingFormValues['pieces'], units: UnitSystem): Piece[] {
  return rows.flatMap((row) => {
    const widthMm = parseLengthText(row.width, units);
    const heightMm = parseLengthText(row.height, units);
    const count = /^\d+$/.test(row.count.trim()) ? Number(row.count.trim()) : 0;
    return widthMm && heightMm && count > 0 && count <= 500 ? [{ widthMm, heightMm, count }] : [];
  });
}

function PiecesGroup() {
  const { units } = useListingWizard();
  const { control } = useFormContext<ListingFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'pieces' });
  const unit = units === 'metric' ? 'cm' : 'in';
  const sizes = units === 'metric' ? 'centimetres (for example 6.5 or 45)' : 'inches (for example 2½, 2 1/2 or 18)';
  return (
    <FieldGroup
      legend="Pieces (optional)"
      description={`List the larger pieces to get an exact cut plan: width × height in ${sizes} and how many of that size. Small scraps need no list; the weight covers them.`}
    >
      {fields.length > 0 ? (
        <ol className="space-y-4">
          {fields.map((field, index) => (
            <li key={field.id}>
              <fieldset className="space-y-3 rounded-stitch border-2 border-seam p-3">
                <legend className="px-1 font-semibold">Piece row {index + 1}</legend>
                <div className="grid grid-cols-2 gap-3 sm:grid-cols-[1fr_1fr_8rem]">
                  <TextField name={`pieces.${index}.width`} label={`Width (${unit})`} autoComplete="off" />
                  <TextField name={`pieces.${index}.height`} label={`Height (${unit})`} autoComplete="off" />
                  <TextField name={`pieces.${index}.count`} label="How many" inputMode="numeric" autoComplete="off" className="col-span-2 max-w-40 sm:col-span-1" />
                </div>
                <PieceEcho index={index} />
                <Button variant="quiet" onClick={() => remove(index)}>
                  Remove piece row {index + 1}
                </Button>
              </fieldset>
            </li>
          ))}
        </ol>
      ) : null}
      <Button variant="secondary" onClick={() => append(emptyPieceRow())} disabled={fields.length >= MAX_PIECE_ROWS}>
        Add a row of pieces
      </Button>
    </FieldGroup>
  );
}

/** The row read back in millimetres, so a typo ("25" for "2.5") shows before the picture looks odd. */
function PieceEcho({ index }: { index: number }) {
  const { units } = useListingWizard();
  const row = useWatch<ListingFormValues, `pieces.${number}`>({ name: `pieces.${index}` });
  const width = parseLengthText(row?.width ?? '', units);
  const height = parseLengthText(row?.height ?? '', units);
  if (!width || !height) return null;
  return <p className="text-thread-soft">Reads as {width} × {height} mm.</p>;
}
