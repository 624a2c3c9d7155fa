import type { Metadata, Sharp, SharpOptions } from 'sharp';
import { averageColour, STORED_LONG_SIDE, type Rgb } from '@scrap-relay/shared';
import { unprocessable, unsupportedMediaType } from '../../errors/index.ts';

/** 100 megapixels: far above any phone camera, far below a decompression bomb. */
export const MAX_INPUT_PIXELS = 100_000_000;
const READABLE_FORMATS = new Set(['jpeg', 'png', 'webp', 'heif', 'avif', 'tiff']);
export const DISPLAY_MAX_PX = STORED_LONG_SIDE.display;
/** The thumbnail at twice its size, for sharp screens and wider cards. */
export const MEDIUM_MAX_PX = STORED_LONG_SIDE.medium;
export const THUMB_MAX_PX = STORED_LONG_SIDE.thumb;

type SharpFactory = (input?: Buffer, options?: SharpOptions) => Sharp;
let sharpLoading: Promise<SharpFactory> | undefined;

/**
 * sharp (and libvips with it) is loaded at the first photo, not at boot: most API processes
 * serve pages and never touch a photo, and libvips costs them memory for nothing.
 */
export function loadSharp(): Promise<SharpFactory> {
  sharpLoading ??= import('sharp').then((m) => m.default);
  return sharpLoading;
}

interface PhotoSize {
  data: Buffer;
  width: number;
  height: number;
}

export interface ProcessedPhoto {
  display: PhotoSize;
  medium: PhotoSize;
  thumb: PhotoSize;
  average: Rgb;
  contentType: 'image/webp';
}

/**
 * Reads a photo by its content (never its name), turns it upright, and writes a display
 * size, a medium size and a thumbnail as WebP. sharp writes no metadata unless asked, so
 * location and camera data are gone from all three. The average colour is taken from the thumbnail.
 */
export async function processPhoto(input: Buffer, field = 'photos'): Promise<ProcessedPhoto> {
  const sharp = await loadSharp();
  let meta: Metadata;
  try {
    meta = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS }).metadata();
  } catch (err) {
    if (err instanceof Error && /pixel limit/i.test(err.message)) throw tooBig(field);
    throw unreadable(field);
  }
  if (!meta.format || !READABLE_FORMATS.has(meta.format)) throw unreadable(field);
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_INPUT_PIXELS) throw tooBig(field);

  try {
    // Decode once; every size is made from the same upright pixels, each smaller one from the one above it
    // (WebP effort 2: fast, nearly as small).
    const upright = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS })
      .rotate()
      .resize({ width: DISPLAY_MAX_PX, height: DISPLAY_MAX_PX, fit: 'inside', withoutEnlargement: true })
      .removeAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    const shrink = async (pixels: typeof upright, maxPx: number) =>
      sharp(pixels.data, { raw: rawInfo(pixels.info) })
        .resize({ width: maxPx, height: maxPx, fit: 'inside', withoutEnlargement: true })
        .raw()
        .toBuffer({ resolveWithObject: true });
    const encode = async (pixels: typeof upright, quality: number): Promise<PhotoSize> => {
      const out = await sharp(pixels.data, { raw: rawInfo(pixels.info) }).webp({ quality, effort: 2 }).toBuffer({ resolveWithObject: true });
      return { data: out.data, width: out.info.width, height: out.info.height };
    };
    // The display size encodes while the smaller sizes are made (libvips works off the main thread).
    const [display, smaller] = await Promise.all([
      encode(upright, 80),
      (async () => {
        const mediumPixels = await shrink(upright, MEDIUM_MAX_PX);
        const thumbPixels = await shrink(mediumPixels, THUMB_MAX_PX);
        // Medium and thumbnail share their settings: the medium is the thumbnail for sharp screens.
        const [medium, thumb] = await Promise.all([encode(mediumPixels, 72), encode(thumbPixels, 72)]);
        return { medium, thumb, thumbPixels };
      })(),
    ]);
    const { medium, thumb, thumbPixels } = smaller;
    const average = averageColour(thumbPixels.data, thumbPixels.info.channels as 3 | 4) ?? { r: 128, g: 128, b: 128 };
    return { display, medium, thumb, average, contentType: 'image/webp' };
  } catch (err) {
    if (err instanceof Error && /pixel limit/i.test(err.message)) throw tooBig(field);
    throw unreadable(field);
  }
}

const rawInfo = (info: { width: number; height: number; channels: number }) => ({
  width: info.width,
  height: info.height,
  channels: info.channels as 1 | 2 | 3 | 4,
});

const unreadable = (field: string) =>
  unsupportedMediaType(field, 'That file is not a photo we can read. Use a JPEG, PNG or WebP photo.');
const tooBig = (field: string) =>
  unprocessable('That image is far larger than any camera photo, so it was refused.', { [field]: 'Image is too large to open.' });
