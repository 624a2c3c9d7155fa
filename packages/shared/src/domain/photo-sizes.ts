import type { BundleCard } from '../contracts/index.ts';

/** The long side of each size the photo pipeline stores, in px (apps/api/src/modules/bundles/photo-pipeline.ts). */
export const STORED_LONG_SIDE = { thumb: 400, medium: 800, display: 1600 } as const;

/**
 * A shelf card's `srcset`: the thumbnail and, where the photo has one, the medium size. The shelf does not send
 * the photo's proportions, so these are the long sides, which is the width of the usual landscape phone photo.
 */
export function cardSrcSet(card: Pick<BundleCard, 'thumbUrl' | 'thumb2xUrl'>): string | undefined {
  if (!card.thumbUrl || !card.thumb2xUrl) return undefined;
  return `${card.thumbUrl} ${STORED_LONG_SIDE.thumb}w, ${card.thumb2xUrl} ${STORED_LONG_SIDE.medium}w`;
}

/**
 * The card photo's width in CSS px at each layout of the shelf, in px because the web app's root size is 18 px
 * (apps/web/src/styles.css) while `sizes` reads rem as 16: main padding 18 px a side, 27 from 640 px; the filters
 * column (324 px + 27 gap) from 768; the menu (270 px) once the shell is 1080 px wide; three cards from 1280; the
 * shell stops growing at 1440; cards 18 px apart inside a 2 px border. Measured in Chromium at 412, 800, 1100 and
 * 1440 px. Shared because the API names the first card's photo in the shelf page's headers, and the browser must
 * pick the same file there as the card does.
 */
export const CARD_PHOTO_SIZES = [
  '(min-width: 1440px) 239px',
  '(min-width: 1280px) calc(33.33vw - 241px)',
  '(min-width: 1080px) calc(50vw - 351px)',
  '(min-width: 768px) calc(50vw - 216px)',
  '(min-width: 640px) calc(50vw - 40px)',
  'calc(100vw - 40px)',
].join(', ');
