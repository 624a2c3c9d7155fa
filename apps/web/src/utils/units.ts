/**
 * Edge conversions between what people type and the integers the API stores:
 * basis points shown as percent, minor currency units shown in the main unit.
 * Parsers return NaN for anything that is not a plain number, so the schema
 * reports it as a field error instead of the form guessing.
 */

const DECIMAL = /^\d+(?:[.,]\d*)?$/;

function parseDecimal(text: string, maxFractionDigits: number): number {
  const trimmed = text.trim();
  if (!DECIMAL.test(trimmed)) return Number.NaN;
  const [whole = '', fraction = ''] = trimmed.replace(',', '.').split('.');
  // "5.50" is fine for a two-digit currency and "30.0" for yen; a real extra digit is not.
  if (fraction.length > maxFractionDigits && /[1-9]/.test(fraction.slice(maxFractionDigits))) return Number.NaN;
  const kept = fraction.slice(0, maxFractionDigits);
  // Work on digits, not floats, so 2.9 % is exactly 290 basis points.
  return Number(whole) * 10 ** maxFractionDigits + Number(kept.padEnd(maxFractionDigits, '0') || '0');
}

function formatScaled(value: number, fractionDigits: number, trimZeros: boolean): string {
  if (!Number.isFinite(value)) return '';
  const sign = value < 0 ? '-' : '';
  const digits = String(Math.abs(Math.trunc(value))).padStart(fractionDigits + 1, '0');
  const whole = digits.slice(0, digits.length - fractionDigits);
  let fraction = digits.slice(digits.length - fractionDigits);
  if (trimZeros) fraction = fraction.replace(/0+$/, '');
  return fraction ? `${sign}${whole}.${fraction}` : `${sign}${whole}`;
}

/** 1000 basis points → "10"; 290 → "2.9". */
export const basisPointsToPercentText = (basisPoints: number): string => formatScaled(basisPoints, 2, true);

/** "10" → 1000; "2.9" → 290; "2.955" → NaN (a basis point is the finest step). */
export const percentTextToBasisPoints = (text: string): number => parseDecimal(text, 2);

/** Digits after the decimal point for a currency (JPY 0, USD 2), as the runtime's ISO 4217 data says. */
export function currencyExponent(currency: string): number {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

/** 30 minor units in USD → "0.30"; 30 in JPY → "30". */
export const minorToMajorText = (minor: number, currency: string): string =>
  formatScaled(minor, currencyExponent(currency), false);

/** "0.30" USD → 30; "0.305" USD → NaN. */
export const majorTextToMinor = (text: string, currency: string): number => parseDecimal(text, currencyExponent(currency));
