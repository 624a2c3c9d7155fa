import type { YieldEstimate } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import { formatOffer, formatYieldLine } from './bundle-text.ts';

const estimate = (fiveInchSquares: number, stripEquivalents: number): YieldEstimate => ({
  gsm: 140,
  waste: 0.25,
  usableWidthIn: 42,
  areaSqIn: fiveInchSquares * 25,
  areaCm2: 0,
  linearYards: 0,
  lengthMm: 0,
  stripEquivalents,
  fiveInchSquares,
  twoAndHalfInchSquares: fiveInchSquares * 4,
  tenInchSquares: Math.floor(fiveInchSquares / 4),
});

describe('a bundle’s offer in a list', () => {
  it('shows a sale as its price in the bundle’s currency', () => {
    expect(formatOffer('sale', 1200, 'USD')).toBe('$12.00');
    expect(formatOffer('sale', 1200, 'JPY')).toBe('¥1,200');
  });

  it('says what a free offer costs the taker', () => {
    expect(formatOffer('postage_only', null, 'USD')).toBe('free — postage only');
    expect(formatOffer('meeting', null, 'USD')).toBe('free at the meeting');
  });
});

describe('the yield estimate in one line', () => {
  it('gives squares and strips', () => {
    expect(formatYieldLine(estimate(48, 12))).toBe('≈ 48 five-inch squares · 12 strips');
    expect(formatYieldLine(estimate(1200, 1))).toBe('≈ 1,200 five-inch squares · 1 strip');
  });

  it('leaves out strips when there is not enough for one', () => {
    expect(formatYieldLine(estimate(3, 0))).toBe('≈ 3 five-inch squares');
    expect(formatYieldLine(estimate(1, 0))).toBe('≈ 1 five-inch square');
    expect(formatYieldLine(estimate(0, 0))).toBe('less than one five-inch square');
  });
});
