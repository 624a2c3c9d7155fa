import { CARD_PHOTO_SIZES, cardSrcSet, type BundleCard } from '@scrap-relay/shared';

/**
 * Asks for a card's photo before the card is drawn (the first card's photo is the shelf's largest paint on a
 * phone): a preload with the card's own `srcset` and `sizes`, so the browser picks the same file the card will
 * show and the card finds it already on its way. Nothing happens when the card is already on the page.
 */
export function preloadCardPhoto(card: Pick<BundleCard, 'thumbUrl' | 'thumb2xUrl'>): void {
  if (!card.thumbUrl || document.querySelector(`img[src="${CSS.escape(card.thumbUrl)}"]`)) return;
  const link = document.createElement('link');
  link.rel = 'preload';
  link.as = 'image';
  link.href = card.thumbUrl;
  const srcSet = cardSrcSet(card);
  if (srcSet) {
    link.setAttribute('imagesrcset', srcSet);
    link.setAttribute('imagesizes', CARD_PHOTO_SIZES);
  }
  link.setAttribute('fetchpriority', 'high');
  document.head.append(link);
}
