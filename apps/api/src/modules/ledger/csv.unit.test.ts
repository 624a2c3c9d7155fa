import { describe, expect, it } from 'vitest';
import { decimalAmount, timeColumn, wallClockText } from './csv.ts';

describe('amounts in the CSV exports', () => {
  it('writes cents as dollars and cents, with no separators or symbol, negatives included', () => {
    expect(decimalAmount(5170, 'USD')).toBe('51.70');
    expect(decimalAmount(-2790, 'USD')).toBe('-27.90');
    expect(decimalAmount(5, 'usd')).toBe('0.05');
    expect(decimalAmount(-5, 'EUR')).toBe('-0.05');
    expect(decimalAmount(0, 'GBP')).toBe('0.00');
    expect(decimalAmount(123456789, 'USD')).toBe('1234567.89');
  });

  it('uses the currency’s own minor unit: none for yen (ISO 4217 exponent 0, from memory)', () => {
    expect(decimalAmount(1200, 'JPY')).toBe('1200');
    expect(decimalAmount(-50, 'JPY')).toBe('-50');
  });

  it('refuses a fraction of a minor unit', () => {
    expect(() => decimalAmount(12.5, 'USD')).toThrow(RangeError);
  });
});

/*
 * Offsets from the IANA tz database: Pacific/Auckland is UTC+13 in the southern summer (daylight time from the last
 * Sunday of September, 28 September 2025, to the first Sunday of April) and UTC+12 in winter; America/Los_Angeles
 * is UTC−7 in summer and UTC−8 in winter, going back on the first Sunday of November (1 November 2026, at 2 AM).
 */
describe('times in the ledger export', () => {
  it('writes the guild’s wall-clock time, on the guild’s side of midnight', () => {
    expect(wallClockText(new Date('2026-11-30T10:59:59Z'), 'Pacific/Auckland')).toBe('2026-11-30 23:59:59');
    expect(wallClockText(new Date('2026-11-30T11:00:00Z'), 'Pacific/Auckland')).toBe('2026-12-01 00:00:00');
    expect(wallClockText(new Date('2026-07-15T12:00:00Z'), 'Pacific/Auckland')).toBe('2026-07-16 00:00:00');
    expect(wallClockText(new Date('2026-12-01T07:59:00Z'), 'America/Los_Angeles')).toBe('2026-11-30 23:59:00');
    expect(wallClockText(new Date('2026-11-30T11:00:00Z'), 'UTC')).toBe('2026-11-30 11:00:00');
  });

  it('follows summer time ending: the hour from 1 AM comes twice in Los Angeles on 1 November 2026', () => {
    expect(wallClockText(new Date('2026-11-01T08:30:00Z'), 'America/Los_Angeles')).toBe('2026-11-01 01:30:00');
    expect(wallClockText(new Date('2026-11-01T09:30:00Z'), 'America/Los_Angeles')).toBe('2026-11-01 01:30:00');
    expect(wallClockText(new Date('2026-11-01T10:30:00Z'), 'America/Los_Angeles')).toBe('2026-11-01 02:30:00');
  });

  it('names the zone in the column header', () => {
    expect(timeColumn('Pacific/Auckland')).toBe('time_in_Pacific/Auckland');
    expect(timeColumn('UTC')).toBe('time_in_UTC');
  });
});
