import { formatLength, MM_PER_INCH, MM_PER_YARD, type UnitSystem, type YieldEstimate } from '@scrap-relay/shared';

/**
 * The yield estimate in words, the same on the bundle page, in the listing form and on the librarian's review
 * page: counts with thousands separators, areas and long lengths rounded as an estimate deserves.
 */

const number = new Intl.NumberFormat('en');

/** A whole count as people read it: 1,054. */
export const formatCount = (count: number): string => number.format(count);

/** A long length of fabric or strips in yards or metres, to one decimal: "13.8 yd", "12.6 m". */
export function longLength(mm: number, units: UnitSystem): string {
  if (units === 'metric') return `${(Math.round(mm / 100) / 10).toFixed(1)} m`;
  return `${(Math.round((mm / MM_PER_YARD) * 10) / 10).toFixed(1)} yd`;
}

/** "1,240 sq in" or "0.80 m²". */
export function yieldArea(estimate: YieldEstimate, units: UnitSystem): string {
  if (units === 'metric') return `${(estimate.areaCm2 / 10_000).toFixed(2)} m²`;
  return `${formatCount(estimate.areaSqIn)} sq in`;
}

export interface YieldFact {
  label: string;
  value: string;
}

/** One line per figure of the estimate, labelled for a reader who may not know the trade's shorthand. */
export function yieldFacts(estimate: YieldEstimate, units: UnitSystem): YieldFact[] {
  const width = formatLength(estimate.usableWidthIn * MM_PER_INCH, units);
  return [
    { label: 'Usable fabric', value: `about ${yieldArea(estimate, units)}` },
    { label: `Length at ${width} wide`, value: `about ${longLength(estimate.lengthMm, units)}` },
    { label: '2½-inch strips across the width', value: formatCount(estimate.stripEquivalents) },
    { label: '5-inch squares', value: formatCount(estimate.fiveInchSquares) },
    { label: '2½-inch squares', value: formatCount(estimate.twoAndHalfInchSquares) },
    { label: '10-inch squares', value: formatCount(estimate.tenInchSquares) },
  ];
}
