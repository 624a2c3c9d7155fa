import { allowsFulfilment, type BundleView, type Fulfilment, type SellerSummary } from '@scrap-relay/shared';
import type { BasketItem } from '../../../lib/basket-store.ts';

/**
 * What the basket can check out, worked out from what the shelf says now. Pure,
 * so the rules (what is removed, what waits, what goes in which order) are tested
 * without a browser.
 */

export type BundleLookup =
  | { status: 'found'; bundle: BundleView }
  /** 404 or 403: deleted, withdrawn before it was ever shown, or never ours to see. */
  | { status: 'gone' }
  | { status: 'pending' }
  | { status: 'failed' };

export interface BasketLine {
  bundleId: string;
  quantity: number;
  bundle: BundleView;
}

export interface BasketRemoval {
  bundleId: string;
  title: string | null;
  reason: string;
}

export interface BasketReview {
  /** Lines that can be ordered now. */
  lines: BasketLine[];
  /** Held while another member pays; they may come back, so they stay in the basket. */
  waiting: BasketLine[];
  /** To take out of the basket, each with the reason shown to the member. */
  removals: BasketRemoval[];
  /** Fewer copies left than asked for: the quantity to keep. */
  reductions: Array<{ bundleId: string; title: string; quantity: number }>;
  /** Still loading or could not be checked (network): kept as they are, shown as "checking". */
  unchecked: BasketItem[];
}

const GONE_REASON: Partial<Record<BundleView['state'], string>> = {
  rehomed: 'has found a new home.',
  withdrawn: 'was withdrawn by its owner.',
  expired: 'has left the shelf (listed too long).',
  returned: 'is back with its owner for changes.',
  draft: 'is not on the shelf.',
  in_review: 'is not on the shelf yet.',
};

export function reviewBasket(items: readonly BasketItem[], lookups: ReadonlyMap<string, BundleLookup>, memberId: string): BasketReview {
  const review: BasketReview = { lines: [], waiting: [], removals: [], reductions: [], unchecked: [] };
  for (const item of items) {
    const lookup = lookups.get(item.bundleId) ?? { status: 'pending' };
    if (lookup.status === 'pending' || lookup.status === 'failed') {
      review.unchecked.push(item);
      continue;
    }
    if (lookup.status === 'gone') {
      review.removals.push({ bundleId: item.bundleId, title: null, reason: 'is no longer on the shelf.' });
      continue;
    }
    const { bundle } = lookup;
    const gone = GONE_REASON[bundle.state];
    if (gone) {
      review.removals.push({ bundleId: bundle.id, title: bundle.title, reason: gone });
    } else if (bundle.seller.id === memberId) {
      review.removals.push({ bundleId: bundle.id, title: bundle.title, reason: 'is your own bundle.' });
    } else if (bundle.offer === null || (bundle.offer === 'starter' && !bundle.abilities.claim)) {
      review.removals.push({ bundleId: bundle.id, title: bundle.title, reason: 'is a starter bundle: new quilters claim those on the starter page.' });
    } else if (bundle.state === 'held' || bundle.quantityAvailable === 0) {
      review.waiting.push({ bundleId: bundle.id, quantity: item.quantity, bundle });
    } else if (item.quantity > bundle.quantityAvailable) {
      review.reductions.push({ bundleId: bundle.id, title: bundle.title, quantity: bundle.quantityAvailable });
      review.lines.push({ bundleId: bundle.id, quantity: bundle.quantityAvailable, bundle });
    } else {
      review.lines.push({ bundleId: bundle.id, quantity: item.quantity, bundle });
    }
  }
  return review;
}

export interface SellerGroup {
  seller: SellerSummary;
  lines: BasketLine[];
}

/** One order per seller: bundles from one member travel together. Groups keep the order things were added in. */
export function groupBySeller(lines: readonly BasketLine[]): SellerGroup[] {
  const groups = new Map<string, SellerGroup>();
  for (const line of lines) {
    const group = groups.get(line.bundle.seller.id);
    if (group) group.lines.push(line);
    else groups.set(line.bundle.seller.id, { seller: line.bundle.seller, lines: [line] });
  }
  return [...groups.values()];
}

export interface FulfilmentPlan {
  fulfilment: Fulfilment;
  /** Lines that go in this order. */
  lines: BasketLine[];
  /** Lines that cannot travel this way and stay in the basket for another order. */
  leftOut: BasketLine[];
}

/** The ways a seller's group can be sent, each with what it would include; a way that fits none of the lines is left out. */
export function fulfilmentPlans(lines: readonly BasketLine[]): FulfilmentPlan[] {
  const plans: FulfilmentPlan[] = [];
  for (const fulfilment of ['post', 'meeting'] as const) {
    const fits = lines.filter((line) => allowsFulfilment(line.bundle, fulfilment));
    if (fits.length > 0) plans.push({ fulfilment, lines: fits, leftOut: lines.filter((line) => !fits.includes(line)) });
  }
  return plans;
}

/** Post when everything can be posted; otherwise whichever way takes the most lines (post on a tie). */
export function preferredFulfilment(plans: readonly FulfilmentPlan[]): Fulfilment | null {
  const best = [...plans].sort((a, b) => b.lines.length - a.lines.length)[0];
  return best?.fulfilment ?? null;
}

/** Price of the sale bundles; gifts are free (the buyer pays postage only). */
export const itemsSubtotalMinor = (lines: readonly BasketLine[]): number =>
  lines.reduce((sum, line) => sum + (line.bundle.offer === 'sale' ? (line.bundle.priceMinor ?? 0) * line.quantity : 0), 0);

export const orderItemsOf = (lines: readonly BasketLine[]) => lines.map((line) => ({ bundleId: line.bundleId, quantity: line.quantity }));
