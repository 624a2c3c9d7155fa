import { formatMoney, OFFER_LABELS, type BundleView } from '@scrap-relay/shared';

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
