import type { BundleCard } from '@scrap-relay/shared';
import { cardSrcSet } from '../../../utils/photo-sources.ts';

/**
 * The card photo's width in CSS px at each layout of the shelf, in px because the app's root size is 18 px
 * (styles.css) while `sizes` reads rem as 16: main padding 18 px a side, 27 from 640 px; the filters column
 * (324 px + 27 gap) from 768; the menu (270 px) once the shell is 1080 px wide; three cards from 1280; the
 * shell stops growing at 1440; cards 18 px apart inside a 2 px border. Measured in Chromium at 412, 800,
 * 1100 and 1440 px.
 */
export const CARD_PHOTO_SIZES = [
  '(min-width: 1440px) 239px',
  '(min-width: 1280px) calc(33.33vw - 241px)',
  '(min-width: 1080px) calc(50vw - 351px)',
  '(min-width: 768px) calc(50vw - 216px)',
  '(min-width: 640px) calc(50vw - 40px)',
  'calc(100vw - 40px)',
].join(', ');

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
