import { currencyMinorUnits, wallClockAt } from '@scrap-relay/shared';

/**
 * Integer minor units as a plain decimal in the currency's own units, for spreadsheets: (5170, "USD") → "51.70",
 * (-5, "USD") → "-0.05", (1200, "JPY") → "1200" (ISO 4217 gives JPY no minor unit). Worked on the digits, never
 * through a float, and without thousands separators or a symbol, so every spreadsheet reads it as the number it is.
 */
export function decimalAmount(minor: number, currency: string): string {
  if (!Number.isInteger(minor)) throw new RangeError(`Money must be whole minor units, got ${minor}`);
  const digits = currencyMinorUnits(currency);
  const sign = minor < 0 ? '-' : '';
  const whole = String(Math.abs(minor));
  if (digits === 0) return `${sign}${whole}`;
  const padded = whole.padStart(digits + 1, '0');
  return `${sign}${padded.slice(0, -digits)}.${padded.slice(-digits)}`;
}

/** Ends the header name of an amount: the figures are in the currency's units (dollars, not cents). */
export const IN_CURRENCY_UNITS = 'in_currency_units';
export const AMOUNT_COLUMN = `amount_${IN_CURRENCY_UNITS}`;

/**
 * An instant as a clock in `timeZone` shows it, written the way spreadsheets read a date and time without being
 * told a format: "2026-11-30 23:30:00". The zone goes in the column's header (`timeColumn`), as the currency
 * goes beside amounts.
 */
export function wallClockText(instant: Date, timeZone: string): string {
  const t = wallClockAt(instant, timeZone);
  const two = (n: number) => String(n).padStart(2, '0');
  return `${t.year}-${two(t.month)}-${two(t.day)} ${two(t.hour)}:${two(t.minute)}:${two(t.second)}`;
}

/** The header of a column of times: "time_in_Pacific/Auckland", so whoever opens the file knows whose clock it is. */
export const timeColumn = (timeZone: string) => `time_in_${timeZone}`;
