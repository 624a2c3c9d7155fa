/**
 * Colour: the suggested colour value and family of a bundle from its photos.
 *
 * Relative luminance and contrast follow W3C WCAG 2.2; lightness is CIE 1976 L*.
 * The value classes and the hue → family rule are design choices, written down below.
 * A suggestion only: the seller can always override it.
 */
import type { ColourFamily, ColourValue } from './fibres.ts';

export interface Rgb {
  r: number;
  g: number;
  b: number;
}

const clampByte = (n: number): number => Math.min(255, Math.max(0, Math.round(n)));

/** "#7a7a7a", "7A7A7A" or "#777" to 8-bit channels; null when not a hex colour. */
export function parseHex(hex: string): Rgb | null {
  const m = /^#?([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) return null;
  const digits = m[1] ?? '';
  const full = digits.length === 3 ? [...digits].map((d) => d + d).join('') : digits;
  const n = Number.parseInt(full, 16);
  return { r: (n >> 16) & 255, g: (n >> 8) & 255, b: n & 255 };
}

export function toHex({ r, g, b }: Rgb): string {
  return `#${[r, g, b].map((c) => clampByte(c).toString(16).padStart(2, '0')).join('')}`;
}

/** sRGB 8-bit channel → linear light 0–1 (WCAG 2.2 relative luminance definition). */
export function linearise(channel: number): number {
  const c = channel / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Linear light 0–1 → sRGB 8-bit channel (the inverse of linearise, rounded). */
export function encodeSrgb(linear: number): number {
  const l = Math.min(1, Math.max(0, linear));
  const c = l <= 0.0031308 ? l * 12.92 : 1.055 * l ** (1 / 2.4) - 0.055;
  return clampByte(c * 255);
}

/** WCAG 2.2 relative luminance, 0 (black) to 1 (white). */
export function relativeLuminance({ r, g, b }: Rgb): number {
  return 0.2126 * linearise(r) + 0.7152 * linearise(g) + 0.0722 * linearise(b);
}

/** WCAG 2.2 contrast ratio, 1 to 21. */
export function contrastRatio(a: Rgb, b: Rgb): number {
  const [light, dark] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number];
  return (light + 0.05) / (dark + 0.05);
}

/** CIE 1976 L* (0–100) from relative luminance (white point Y = 1). */
export function lStarFromLuminance(luminance: number): number {
  return luminance <= 0.008856 ? 903.3 * luminance : 116 * Math.cbrt(luminance) - 16;
}

/** Value classes (design choice): thirds of the L* scale. */
export const DARK_BELOW_L_STAR = 100 / 3;
export const LIGHT_FROM_L_STAR = 200 / 3;

/** light / medium / dark by L*: dark below 33⅓, light from 66⅔, medium between. */
export function colourValueFromLStar(lStar: number): Exclude<ColourValue, 'mixed'> {
  if (lStar < DARK_BELOW_L_STAR) return 'dark';
  if (lStar >= LIGHT_FROM_L_STAR) return 'light';
  return 'medium';
}

/** HSV hue in degrees (0 ≤ h < 360; 0 for greys) and saturation 0–1. */
export function hueAndSaturation({ r, g, b }: Rgb): { hue: number; saturation: number } {
  const max = Math.max(r, g, b);
  const min = Math.min(r, g, b);
  const chroma = max - min;
  if (chroma === 0) return { hue: 0, saturation: 0 };
  let sector: number;
  if (max === r) sector = ((g - b) / chroma + 6) % 6;
  else if (max === g) sector = (b - r) / chroma + 2;
  else sector = (r - g) / chroma + 4;
  return { hue: (sector * 60) % 360, saturation: chroma / max };
}

/**
 * Colour family rule (design choice):
 * - below NEUTRAL_MAX_SATURATION (HSV) the colour is unsaturated: black_white when very
 *   dark (L* < 20) or very light (L* > 90), neutral otherwise (greys, beiges, taupes);
 * - otherwise warm for hues from 300° through red, orange and yellow to 75°, cool for
 *   75°–300° (greens, blues, purples).
 * `multi` is never suggested: an average colour cannot see several colours; the seller
 * picks it.
 */
export const NEUTRAL_MAX_SATURATION = 0.2;
const WARM_BELOW_HUE = 75;
const WARM_FROM_HUE = 300;
const BLACK_BELOW_L_STAR = 20;
const WHITE_ABOVE_L_STAR = 90;

export function colourFamilyOf(rgb: Rgb): Exclude<ColourFamily, 'multi'> {
  const { hue, saturation } = hueAndSaturation(rgb);
  if (saturation < NEUTRAL_MAX_SATURATION) {
    const lStar = lStarFromLuminance(relativeLuminance(rgb));
    return lStar < BLACK_BELOW_L_STAR || lStar > WHITE_ABOVE_L_STAR ? 'black_white' : 'neutral';
  }
  return hue < WARM_BELOW_HUE || hue >= WARM_FROM_HUE ? 'warm' : 'cool';
}

/**
 * Average colour of raw pixels (RGB or RGBA, 8-bit, row after row).
 * Averages in linear light, then re-encodes to sRGB (design choice): mixing light is
 * linear, so a black-and-white check averages to the mid grey the eye sees from a
 * distance (#bcbcbc), not the darker #808080 an average of encoded values gives.
 * RGBA pixels with alpha 0 are skipped; all others count fully. Null when no pixel counts.
 */
export function averageColour(pixels: Uint8Array | Uint8ClampedArray | readonly number[], channels: 3 | 4): Rgb | null {
  if (pixels.length % channels !== 0) throw new RangeError(`Pixel data length ${pixels.length} is not a multiple of ${channels}`);
  let r = 0;
  let g = 0;
  let b = 0;
  let counted = 0;
  for (let i = 0; i < pixels.length; i += channels) {
    if (channels === 4 && pixels[i + 3] === 0) continue;
    r += linearise(pixels[i] ?? 0);
    g += linearise(pixels[i + 1] ?? 0);
    b += linearise(pixels[i + 2] ?? 0);
    counted++;
  }
  if (counted === 0) return null;
  return { r: encodeSrgb(r / counted), g: encodeSrgb(g / counted), b: encodeSrgb(b / counted) };
}

export interface ColourSuggestion {
  value: Exclude<ColourValue, 'mixed'>;
  family: Exclude<ColourFamily, 'multi'>;
  hex: string;
  /** CIE L*, to two decimals. */
  lStar: number;
}

/** The value and family to pre-fill from a bundle's average colour. */
export function suggestColour(average: Rgb): ColourSuggestion {
  const lStar = lStarFromLuminance(relativeLuminance(average));
  return {
    value: colourValueFromLStar(lStar),
    family: colourFamilyOf(average),
    hex: toHex(average),
    lStar: Math.round(lStar * 100) / 100,
  };
}
