import { formatMoney, type Offer, type YieldEstimate } from '@scrap-relay/shared';

/** How a bundle reads in lists (shelf cards, the review queue): its offer and its yield estimate in one line each. */

/** "$12.00", or what "free" means for this bundle. */
export function formatOffer(offer: Offer, priceMinor: number | null, currency: string): string {
  switch (offer) {
    case 'sale':
      return priceMinor === null ? 'for sale' : formatMoney(priceMinor, currency);
    case 'postage_only':
      return 'free — postage only';
    case 'meeting':
      return 'free at the meeting';
    case 'starter':
      return 'starter bundle, claimed by a new quilter';
  }
}

const plural = (count: number, one: string, many: string) => `${count.toLocaleString('en')} ${count === 1 ? one : many}`;

/**
 * "≈ 48 five-inch squares · 12 strips": the two cuts scrap quilters keep most
 * (CHECKS.md, common practice). Strips are 2½-inch, across the width of fabric.
 */
export function formatYieldLine(estimate: YieldEstimate): string {
  if (estimate.fiveInchSquares === 0) return 'less than one five-inch square';
  const squares = plural(estimate.fiveInchSquares, 'five-inch square', 'five-inch squares');
  if (estimate.stripEquivalents === 0) return `≈ ${squares}`;
  return `≈ ${squares} · ${plural(estimate.stripEquivalents, 'strip', 'strips')}`;
}
