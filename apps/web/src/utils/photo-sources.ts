import { STORED_LONG_SIDE, type PhotoView } from '@scrap-relay/shared';

/** The pipeline fits each size inside long side × long side from the size above it and never enlarges. */
const fitWidth = (width: number, height: number, longSide: number) => {
  const scale = Math.min(1, longSide / Math.max(width, height));
  return { width: Math.round(width * scale), height: Math.round(height * scale) };
};

/**
 * A `srcset` of every stored size of a photo with its real width (`width`/`height` are the display size's).
 * Photos stored before the medium size existed offer the thumbnail and the display size only.
 */
export function photoSrcSet(photo: PhotoView): string {
  const medium = fitWidth(photo.width, photo.height, STORED_LONG_SIDE.medium);
  const thumb = fitWidth(medium.width, medium.height, STORED_LONG_SIDE.thumb);
  const candidates: Array<[string, number]> = [[photo.thumbUrl, thumb.width]];
  if (photo.mediumUrl) candidates.push([photo.mediumUrl, medium.width]);
  candidates.push([photo.url, photo.width]);
  // A small photo is stored at the same width more than once: offer the smallest file for each width.
  const seen = new Set<number>();
  return candidates
    .filter(([, width]) => !seen.has(width) && seen.add(width))
    .map(([url, width]) => `${url} ${width}w`)
    .join(', ');
}
