import { describe, expect, it } from 'vitest';
import { decimalAmount } from './csv.ts';

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
