import { FIBRE_LABELS, formatLength, MM_PER_INCH, type Fibre, type UnitSystem, type YieldEstimate } from '@scrap-relay/shared';
import { longLength } from '../utils/cut-plan-text.ts';
import { pageSection, stepSection } from './section-styles.ts';

const number = new Intl.NumberFormat('en');

/** "about 1,240 sq in" or "about 0.8 m²". */
function area(estimate: YieldEstimate, units: UnitSystem): string {
  if (units === 'metric') return `${(estimate.areaCm2 / 10_000).toFixed(2)} m²`;
  return `${number.format(estimate.areaSqIn)} sq in`;
}

export interface YieldEstimateProps {
  estimate: YieldEstimate;
  units: UnitSystem;
  /** The fibre chosen, or null while the seller has not said (the estimate then assumes quilting cotton). */
  fibre: Fibre | null;
  /** Heading level inside the page: 2 on the bundle page, 3 inside a listing step. */
  headingLevel?: 2 | 3;
}

/**
 * What a bundle's weight is likely to make. The counts are equivalents of the
 * fabric's area, worded so nobody reads them as a promise of whole pieces.
 */
export function YieldEstimateView({ estimate, units, fibre, headingLevel = 3 }: YieldEstimateProps) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const width = formatLength(estimate.usableWidthIn * MM_PER_INCH, units);
  const rows: Array<[string, string]> = [
    ['Usable fabric', `about ${area(estimate, units)}`],
    [`Length at ${width} wide`, `about ${longLength(estimate.lengthMm, units)}`],
    ['2½-inch strips across the width', number.format(estimate.stripEquivalents)],
    ['5-inch squares', number.format(estimate.fiveInchSquares)],
    ['2½-inch squares', number.format(estimate.twoAndHalfInchSquares)],
    ['10-inch squares', number.format(estimate.tenInchSquares)],
  ];
  return (
    <section aria-label="Yield estimate" className={headingLevel === 2 ? pageSection : stepSection}>
      <Heading className={headingLevel === 2 ? 'text-xl font-bold' : 'text-lg font-bold'}>Yield estimate</Heading>
      <dl className="grid max-w-lg grid-cols-[1fr_auto] gap-x-6 gap-y-1">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt>{label}</dt>
            <dd className="text-right font-semibold tabular-nums">{value}</dd>
          </div>
        ))}
      </dl>
      <p className="max-w-prose text-thread-soft">
        Worked out from the weight and the usual weight of {fibre ? FIBRE_LABELS[fibre].toLowerCase() : 'quilting cotton'} (
        {estimate.gsm} g/m²), less {Math.round(estimate.waste * 100)} % for trimming and odd shapes. The counts say how much fabric
        there is, not that every scrap is big enough for that cut.
        {fibre ? null : ' Choose the fibre for a closer estimate.'}
      </p>
    </section>
  );
}
