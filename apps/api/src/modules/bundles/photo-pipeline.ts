import sharp, { type Metadata } from 'sharp';
import { averageColour, type Rgb } from '@scrap-relay/shared';
import { unprocessable, unsupportedMediaType } from '../../errors/index.ts';

/** 100 megapixels: far above any phone camera, far below a decompression bomb. */
export const MAX_INPUT_PIXELS = 100_000_000;
const READABLE_FORMATS = new Set(['jpeg', 'png', 'webp', 'heif', 'avif', 'tiff']);
export const DISPLAY_MAX_PX = 1600;
export const THUMB_MAX_PX = 400;

export interface ProcessedPhoto {
  display: { data: Buffer; width: number; height: number };
  thumb: { data: Buffer; width: number; height: number };
  average: Rgb;
  contentType: 'image/webp';
}

/**
 * Reads a photo by its content (never its name), turns it upright, and writes a display
 * size and a thumbnail as WebP. sharp writes no metadata unless asked, so location and
 * camera data are gone from both. The average colour is taken from the thumbnail.
 */
export async function processPhoto(input: Buffer, field = 'photos'): Promise<ProcessedPhoto> {
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
    // Decode and resize once; both sizes are encoded from the same upright pixels (WebP effort 2: fast, nearly as small).
    const upright = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS })
      .rotate()
      .resize({ width: DISPLAY_MAX_PX, height: DISPLAY_MAX_PX, fit: 'inside', withoutEnlargement: true })
      .removeAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    const raw = { raw: { width: upright.info.width, height: upright.info.height, channels: upright.info.channels } };
    const display = await sharp(upright.data, raw).webp({ quality: 80, effort: 2 }).toBuffer({ resolveWithObject: true });
    const thumbPixels = await sharp(upright.data, raw)
      .resize({ width: THUMB_MAX_PX, height: THUMB_MAX_PX, fit: 'inside', withoutEnlargement: true })
      .raw()
      .toBuffer({ resolveWithObject: true });
    const thumbRaw = { raw: { width: thumbPixels.info.width, height: thumbPixels.info.height, channels: thumbPixels.info.channels } };
    const thumb = await sharp(thumbPixels.data, thumbRaw).webp({ quality: 72, effort: 2 }).toBuffer({ resolveWithObject: true });
    const average = averageColour(thumbPixels.data, thumbPixels.info.channels as 3 | 4) ?? { r: 128, g: 128, b: 128 };
    return {
      display: { data: display.data, width: display.info.width, height: display.info.height },
      thumb: { data: thumb.data, width: thumb.info.width, height: thumb.info.height },
      average,
      contentType: 'image/webp',
    };
  } catch (err) {
    if (err instanceof Error && /pixel limit/i.test(err.message)) throw tooBig(field);
    throw unreadable(field);
  }
}

const unreadable = (field: string) =>
  unsupportedMediaType(field, 'That file is not a photo we can read. Use a JPEG, PNG or WebP photo.');
const tooBig = (field: string) =>
  unprocessable('That image is far larger than any camera photo, so it was refused.', { [field]: 'Image is too large to open.' });
