import { FIBRE_LABELS, type Fibre, type UnitSystem, type YieldEstimate } from '@scrap-relay/shared';
import { yieldFacts } from '../../../utils/yield-text.ts';
import { pageSection, stepSection } from './section-styles.ts';

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
  const rows = yieldFacts(estimate, units);
  return (
    <section aria-label="Yield estimate" className={headingLevel === 2 ? pageSection : stepSection}>
      <Heading className={headingLevel === 2 ? 'text-xl font-bold' : 'text-lg font-bold'}>Yield estimate</Heading>
      <dl className="grid max-w-lg grid-cols-[1fr_auto] gap-x-6 gap-y-1">
        {rows.map(({ label, value }) => (
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
