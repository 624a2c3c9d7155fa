import {
  COLOUR_FAMILIES,
  COLOUR_FAMILY_LABELS,
  COLOUR_VALUE_LABELS,
  COLOUR_VALUES,
  CUT_KIND_LABELS,
  CUT_KINDS,
  CUT_SIZE_KIND,
  CUT_SIZE_LABELS,
  CUT_SIZES,
  FIBRE_LABELS,
  FIBRES,
} from '@scrap-relay/shared';
import { useFormContext, useFormState, useWatch, get } from 'react-hook-form';
import { ColourSwatch } from '../../../components/colour-swatch.tsx';
import { SafetyNotes } from '../../../components/safety-notes.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Checkbox, FieldError } from '../../../components/ui/field.tsx';
import { CheckboxField, FieldGroup, SelectField, TextField } from '../../../components/ui/form.tsx';
import type { ListingFormValues } from '../utils/listing-form.ts';
import { TextAreaField } from './text-area-field.tsx';
import { useListingWizard } from './listing-context.ts';

const fibreOptions = [{ value: '', label: 'Choose the fibre…' }, ...FIBRES.map((fibre) => ({ value: fibre, label: FIBRE_LABELS[fibre] }))];
const valueOptions = [{ value: '', label: 'Not chosen' }, ...COLOUR_VALUES.map((value) => ({ value, label: COLOUR_VALUE_LABELS[value] }))];
const familyOptions = [{ value: '', label: 'Not chosen' }, ...COLOUR_FAMILIES.map((family) => ({ value: family, label: COLOUR_FAMILY_LABELS[family] }))];

/** Step 2: what is in the bundle, its colour, and what the home it comes from is like. */
export function ContentsStep() {
  return (
    <div className="space-y-6">
      <FieldGroup legend="Title and description">
        <TextField name="title" label="Title" hint="A few words buyers will see first, for example “Warm reds: fat quarters and strips”." autoComplete="off" />
        <TextAreaField name="description" label="Description (optional)" hint="Anything else worth knowing: sizes, designers’ styles, how it was stored." />
      </FieldGroup>
      <CutKindsGroup />
      <FieldGroup legend="Fibre and colour">
        <SelectField name="fibre" label="Fibre" hint="Mostly. If the bag is mixed or you are not sure, say so." options={fibreOptions} />
        <ColourSuggestion />
        <div className="grid gap-5 sm:grid-cols-2">
          <SelectField name="colourValue" label="Colour value" hint="How light or dark the fabrics are." options={valueOptions} />
          <SelectField name="colourFamily" label="Colour family" hint="The colours most of it shares." options={familyOptions} />
        </div>
        <CheckboxField name="prewashed" label="Prewashed" hint="Tick if the fabric has been washed since it was bought." />
      </FieldGroup>
      <SafetyNotes title="Before you bag it up" />
      <FieldGroup legend="Your home" description="Members with allergies rely on these. Tick only what is true.">
        <CheckboxField name="smokeFree" label="Smoke-free home" hint="Nobody smokes where the fabric was kept." />
        <CheckboxField name="petFree" label="Pet-free home" hint="Leave this unticked if pets live in your home, even if they never go near the fabric." />
      </FieldGroup>
    </div>
  );
}

function CutKindsGroup() {
  const { register } = useFormContext<ListingFormValues>();
  const { errors } = useFormState<ListingFormValues>({ name: 'cutKinds' });
  const error = get(errors, 'cutKinds') as { message?: string } | undefined;
  return (
    <fieldset aria-describedby={error?.message ? 'cut-kinds-error' : undefined} className="space-y-3 rounded-stitch border-2 border-seam bg-muslin p-4 sm:p-6">
      <legend className="px-2 text-lg font-bold">Cut kinds</legend>
      <p className="text-thread-soft">Tick everything the bundle holds.</p>
      <div className="grid gap-x-6 sm:grid-cols-2">
        {CUT_KINDS.map((kind) => (
          <Checkbox key={kind} label={CUT_KIND_LABELS[kind]} value={kind} {...register('cutKinds')} />
        ))}
      </div>
      {error?.message ? <FieldError id="cut-kinds-error">{error.message}</FieldError> : null}
      <CutSizesGroup />
    </fieldset>
  );
}

/** The standard widths of the strips and sizes of the squares, once strips or squares are ticked. */
function CutSizesGroup() {
  const { register } = useFormContext<ListingFormValues>();
  const kinds = useWatch<ListingFormValues, 'cutKinds'>({ name: 'cutKinds' });
  const { errors } = useFormState<ListingFormValues>({ name: 'cutSizes' });
  const error = get(errors, 'cutSizes') as { message?: string } | undefined;
  const sizes = CUT_SIZES.filter((size) => (kinds ?? []).includes(CUT_SIZE_KIND[size]));
  if (sizes.length === 0) return null;
  return (
    <fieldset aria-describedby={error?.message ? 'cut-sizes-error' : undefined} className="space-y-2 border-t-2 border-seam pt-4">
      <legend className="text-base font-bold">Standard sizes (optional)</legend>
      <p className="text-thread-soft">Tick the sizes that make up most of the bag, so members looking for them find it.</p>
      <div className="grid gap-x-6 sm:grid-cols-2">
        {sizes.map((size) => (
          <Checkbox key={size} label={CUT_SIZE_LABELS[size]} value={size} {...register('cutSizes')} />
        ))}
      </div>
      {error?.message ? <FieldError id="cut-sizes-error">{error.message}</FieldError> : null}
    </fieldset>
  );
}

/** The value and family worked out from the photos' average colour; the seller may take or change them. */
function ColourSuggestion() {
  const { bundle } = useListingWizard();
  const { setValue } = useFormContext<ListingFormValues>();
  const [value, family] = useWatch<ListingFormValues, ['colourValue', 'colourFamily']>({ name: ['colourValue', 'colourFamily'] });
  const suggested = bundle?.colour.suggested ?? null;
  if (!suggested) {
    return <p className="text-thread-soft">Once the photos are in, a suggested colour value and family appears here.</p>;
  }
  const taken = value === suggested.value && family === suggested.family;
  const use = () => {
    setValue('colourValue', suggested.value, { shouldDirty: true, shouldValidate: true });
    setValue('colourFamily', suggested.family, { shouldDirty: true, shouldValidate: true });
  };
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-stitch border-2 border-seam bg-linen p-3">
      <ColourSwatch hex={suggested.hex} className="size-11 rounded-stitch border-2 border-thread" />
      <p className="min-w-0 flex-1">
        Suggested from your photos:{' '}
        <strong>
          {COLOUR_VALUE_LABELS[suggested.value].toLowerCase()}, {COLOUR_FAMILY_LABELS[suggested.family].toLowerCase()}
        </strong>
        {taken ? <span className="block text-thread-soft">In use below; change it if your eye says otherwise.</span> : null}
      </p>
      {taken ? null : (
        <Button variant="secondary" onClick={use}>
          Use the suggestion
        </Button>
      )}
    </div>
  );
}
