import { BUNDLE_STATE_LABELS, formatMoney, OFFER_LABELS, type BundleState, type BundleView, type Offer } from '@scrap-relay/shared';

/** "For sale, $12.00" or "Free, buyer pays postage". */
export function offerSummary(bundle: Pick<BundleView, 'offer' | 'priceMinor' | 'currency'>): string {
  if (!bundle.offer) return 'Offer not chosen yet';
  if (bundle.offer === 'sale' && bundle.priceMinor != null) return `${OFFER_LABELS.sale}, ${formatMoney(bundle.priceMinor, bundle.currency)}`;
  return OFFER_LABELS[bundle.offer];
}

/** "has rehomed 3 bundles through the guild" (or "have …" when speaking to the seller). */
export function rehomedHistory(count: number, person: 'seller' | 'you' = 'seller'): string {
  const has = person === 'you' ? 'have' : 'has';
  if (count === 0) return `${has} not rehomed a bundle through the guild yet`;
  return `${has} rehomed ${count} ${count === 1 ? 'bundle' : 'bundles'} through the guild`;
}

// A starter bundle is claimed through the programme, never sold from the shelf or held at a checkout.
const STARTER_STATE_LABELS: Partial<Record<BundleState, string>> = {
  on_shelf: 'Free for a new quilter to claim',
  held: 'Kept for a new quilter on the waiting list',
  rehomed: 'Claimed by a new quilter',
};

/** The bundle's state in words, in the starter programme's own terms for a starter bundle. */
export function bundleStateLabel(state: BundleState, offer: Offer | null): string {
  return (offer === 'starter' ? STARTER_STATE_LABELS[state] : undefined) ?? BUNDLE_STATE_LABELS[state];
}
