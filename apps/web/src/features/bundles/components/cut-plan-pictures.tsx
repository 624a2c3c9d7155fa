import { STANDARD_CUT_LABELS, STANDARD_CUTS, type BundleCutPlan, type PiecePlan, type StandardCut, type UnitSystem } from '@scrap-relay/shared';
import { useId, useState } from 'react';
import { cn } from '../../../utils/cn.ts';
import { cutTotals, describeCuts, pieceSize } from '../utils/cut-plan-text.ts';
import { pageSection, stepSection } from './section-styles.ts';

type Choice = 'suggested' | StandardCut;

const CHOICES: ReadonlyArray<{ value: Choice; label: string }> = [
  { value: 'suggested', label: 'The best cut for each piece' },
  ...STANDARD_CUTS.map((cut) => ({ value: cut, label: STANDARD_CUT_LABELS[cut] })),
];

// Neighbouring cuts alternate between two washes so each one can be told apart.
const CUT_FILLS = ['fill-madder-wash', 'fill-sage-wash'] as const;

export interface CutPlanPicturesProps {
  plan: BundleCutPlan;
  units: UnitSystem;
  headingLevel?: 2 | 3;
}

/**
 * One drawing per listed piece, to scale with each other, of how it cuts into a
 * standard cut (straight rotary-cutter cuts), with the same plan in words under
 * each drawing and a table of totals.
 */
export function CutPlanPictures({ plan, units, headingLevel = 3 }: CutPlanPicturesProps) {
  const [choice, setChoice] = useState<Choice>('suggested');
  const groupName = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const largest = Math.max(...plan.pieces.map(({ piece }) => Math.max(piece.widthMm, piece.heightMm)), 1);

  return (
    <section aria-label="Cut plan" className={headingLevel === 2 ? pageSection : stepSection}>
      <Heading className={headingLevel === 2 ? 'text-xl font-bold' : 'text-lg font-bold'}>Cut plan for the listed pieces</Heading>
      <fieldset className="space-y-1">
        <legend className="font-semibold">Show on the pictures</legend>
        <div className="flex flex-wrap gap-x-4">
          {CHOICES.map((option) => (
            <label key={option.value} className="flex min-h-11 cursor-pointer items-center gap-2">
              <input
                type="radio"
                name={groupName}
                value={option.value}
                checked={choice === option.value}
                onChange={() => setChoice(option.value)}
                className="size-5 accent-thread"
              />
              {option.label}
            </label>
          ))}
        </div>
      </fieldset>

      <Legend />

      <ol className="grid gap-4 sm:grid-cols-2">
        {plan.pieces.map((piecePlan, index) => (
          <li key={index}>
            <PieceFigure piecePlan={piecePlan} index={index} choice={choice} units={units} largest={largest} />
          </li>
        ))}
      </ol>

      <table className="w-full max-w-lg border-collapse">
        <caption className="text-left font-semibold">Cut from all the pieces, one cut at a time</caption>
        <thead>
          <tr className="border-b-2 border-thread">
            <th scope="col" className="py-1 pr-3 text-left">
              Cut
            </th>
            <th scope="col" className="py-1 pr-3 text-right">
              How many
            </th>
          </tr>
        </thead>
        <tbody>
          {cutTotals(plan, units).map((line) => (
            <tr key={line.cut} className="border-b border-seam">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                {line.label}
              </th>
              <td className="py-1 pr-3 text-right tabular-nums">
                <span className="font-semibold">{line.count}</span>
                {line.detail ? <span className="block text-thread-soft">{line.detail}</span> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-thread-soft">Each line counts one kind of cut only: a piece cut into strips gives no squares as well.</p>
    </section>
  );
}

function PieceFigure({ piecePlan, index, choice, units, largest }: { piecePlan: PiecePlan; index: number; choice: Choice; units: UnitSystem; largest: number }) {
  const captionId = useId();
  const { piece } = piecePlan;
  const cut = choice === 'suggested' ? piecePlan.suggested : choice;
  const result = cut ? piecePlan.plans[cut] : null;
  const each = piece.count > 1 ? ` from each of the ${piece.count}` : '';
  const words = result ? `${describeCuts(result, units)}${each}` : 'too small for any of the standard cuts';
  // Drawn to one scale for every piece, with a floor so a small scrap is still visible.
  const widthShare = Math.max(piece.widthMm / largest, 0.2);

  return (
    <figure className="space-y-2">
      <svg
        role="img"
        aria-labelledby={captionId}
        viewBox={`0 0 ${piece.widthMm} ${piece.heightMm}`}
        style={{ width: `${widthShare * 100}%` }}
        className="block max-h-72 overflow-visible"
        preserveAspectRatio="xMinYMin meet"
      >
        <rect x={0} y={0} width={piece.widthMm} height={piece.heightMm} className="fill-linen-deep stroke-thread" strokeWidth={2} vectorEffect="non-scaling-stroke" />
        {result?.rects.map((rect, i) => (
          <rect
            key={i}
            x={rect.x}
            y={rect.y}
            width={rect.w}
            height={rect.h}
            className={cn(CUT_FILLS[i % 2], 'stroke-madder-deep')}
            strokeWidth={1}
            vectorEffect="non-scaling-stroke"
          />
        ))}
      </svg>
      <figcaption id={captionId}>
        <span className="font-semibold">
          Piece {index + 1}: {pieceSize(piece, units)}
          {piece.count > 1 ? `, ${piece.count} of them` : ''}
        </span>
        <span className="block">{words.charAt(0).toUpperCase() + words.slice(1)}</span>
      </figcaption>
    </figure>
  );
}

function Legend() {
  return (
    <ul aria-label="Key to the pictures" className="flex flex-wrap gap-x-6 gap-y-1">
      <li className="flex items-center gap-2">
        <span aria-hidden="true" className="inline-block size-5 border-2 border-thread bg-linen-deep" />
        Fabric left over
      </li>
      <li className="flex items-center gap-2">
        <span aria-hidden="true" className="inline-flex">
          <span className="inline-block size-5 border border-madder-deep bg-madder-wash" />
          <span className="inline-block size-5 border border-madder-deep bg-sage-wash" />
        </span>
        Cut pieces (alternate shades)
      </li>
    </ul>
  );
}
