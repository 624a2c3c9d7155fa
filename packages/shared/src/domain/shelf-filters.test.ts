import { describe, expect, it } from 'vitest';
import { describeShelfFilters } from './shelf-filters.ts';

describe('filters in words', () => {
  const usd = { units: 'imperial' as const, currency: 'USD' };

  it('reads like a request', () => {
    expect(describeShelfFilters({ fibre: 'batik', value: 'dark', cut: 'strips' }, usd)).toBe('Batik, dark, strips (by width)');
    expect(describeShelfFilters({ family: 'black_white', offer: 'postage_only' }, usd)).toBe('Black and white, free — postage only');
  });

  it('keeps the capital of English paper piecing inside the sentence', () => {
    expect(describeShelfFilters({ value: 'light', cut: 'epp_shapes' }, usd)).toBe('Light, English paper piecing shapes');
  });

  it('gives weights in the member’s units and the price in the guild’s currency', () => {
    // 454 g is 1 lb to the nearest ounce (NIST SP 811: 1 lb = 453.59237 g).
    expect(describeShelfFilters({ minGrams: 454, maxGrams: 907 }, usd)).toBe('1 lb to 2 lb');
    expect(describeShelfFilters({ minGrams: 500 }, { units: 'metric', currency: 'GBP' })).toBe('At least 500 g');
    expect(describeShelfFilters({ maxGrams: 1500, maxPriceMinor: 750 }, { units: 'metric', currency: 'GBP' })).toBe('Up to 1.5 kg, costing up to £7.50');
    expect(describeShelfFilters({ q: 'reds' }, usd)).toBe('Matching “reds”');
  });

  it('says when nothing is chosen', () => {
    expect(describeShelfFilters({}, usd)).toBe('Everything on the shelf');
  });
});
