import { estimateYield, type YieldEstimate } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import { formatCount, yieldFacts } from './yield-text.ts';

/** The figures of the sunset-reds bundle the librarian saw as "1054" and "4.36 yd" while members saw "1,054" and "about 4.4 yd". */
const sunsetReds: YieldEstimate = {
  gsm: 140,
  waste: 0.25,
  usableWidthIn: 42,
  areaSqIn: 6593,
  areaCm2: 42_535,
  linearYards: 4.36,
  lengthMm: 3987,
  stripEquivalents: 62,
  fiveInchSquares: 263,
  twoAndHalfInchSquares: 1054,
  tenInchSquares: 65,
};

describe('the yield estimate in words', () => {
  it('separates thousands and rounds the length to a tenth, as the bundle page always has', () => {
    expect(yieldFacts(sunsetReds, 'imperial')).toEqual([
      { label: 'Usable fabric', value: 'about 6,593 sq in' },
      // 3987 mm ÷ 914.4 mm a yard = 4.36 yd, read as an estimate: about 4.4 yd.
      { label: 'Length at 42 in wide', value: 'about 4.4 yd' },
      { label: '2½-inch strips across the width', value: '62' },
      { label: '5-inch squares', value: '263' },
      { label: '2½-inch squares', value: '1,054' },
      { label: '10-inch squares', value: '65' },
    ]);
  });

  it('gives metric readers square metres and metres', () => {
    const facts = Object.fromEntries(yieldFacts(sunsetReds, 'metric').map((f) => [f.label, f.value]));
    expect(facts['Usable fabric']).toBe('about 4.25 m²');
    expect(Object.values(facts)).toContain('about 4.0 m');
  });

  it('works on what the shared estimate computes', () => {
    const estimate = estimateYield({ grams: 2000, fibre: 'quilting_cotton' });
    const squares = yieldFacts(estimate, 'imperial').find((f) => f.label === '2½-inch squares')!;
    expect(squares.value).toBe(formatCount(estimate.twoAndHalfInchSquares));
    expect(squares.value).toMatch(/^\d{1,3}(,\d{3})+$/);
  });
});
