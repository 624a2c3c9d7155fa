import { describe, expect, it } from 'vitest';
import { SCRAP_BAG_WASTE, estimateYield } from './yield.ts';
import { GRAMS_PER_POUND } from './units.ts';

const within = (actual: number, expected: number, share: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(expected * share);

describe('estimateYield (design choice: CHECKS.md scrap bag yield)', () => {
  it('keeps a quarter of a scrap bag back as waste (design choice)', () => {
    expect(SCRAP_BAG_WASTE).toBe(0.25);
  });

  it('zero waste at 140 g/m²: 1 lb ≈ 200 five-inch squares ≈ 48 WOF 2½-in strips (CHECKS.md, ±15 %)', () => {
    const y = estimateYield({ grams: GRAMS_PER_POUND, gsm: 140, waste: 0 });
    within(y.fiveInchSquares, 200, 0.15);
    within(y.stripEquivalents, 48, 0.15);
    expect(y.areaSqIn).toBe(5022); // 453.59237 ÷ 140 × 1550.0031 = 5021.9
    expect(y.fiveInchSquares).toBe(200);
    expect(y.stripEquivalents).toBe(47); // 5021.9 ÷ 105
    expect(y.twoAndHalfInchSquares).toBe(803);
    expect(y.tenInchSquares).toBe(50);
  });

  it('at 44 in wide and zero waste, 1 lb ≈ 3.17 yd (CHECKS.md, common practice: about 3 yd per pound)', () => {
    const y = estimateYield({ grams: GRAMS_PER_POUND, fibre: 'quilting_cotton', waste: 0, usableWidthIn: 44 });
    expect(y.linearYards).toBe(3.17);
    expect(y.lengthMm).toBe(2899); // 3.17 yd × 914.4
  });

  it('2 lb → 6 yd ± 1 (CHECKS.md, common practice)', () => {
    const y = estimateYield({ grams: 2 * GRAMS_PER_POUND, fibre: 'quilting_cotton', waste: 0, usableWidthIn: 44 });
    expect(Math.abs(y.linearYards - 6)).toBeLessThanOrEqual(1);
  });

  it('applies the waste factor and the 42-in default width', () => {
    const whole = estimateYield({ grams: 1000, fibre: 'quilting_cotton', waste: 0 });
    const scrap = estimateYield({ grams: 1000, fibre: 'quilting_cotton' });
    expect(scrap.usableWidthIn).toBe(42);
    expect(scrap.waste).toBe(0.25);
    expect(whole.areaSqIn).toBe(11071); // 1000 ÷ 140 × 1550.0031 = 11071.45
    expect(scrap.areaSqIn).toBe(8304); // × 0.75 = 8303.6
    expect(scrap.fiveInchSquares).toBe(332);
    expect(scrap.stripEquivalents).toBe(79); // 8303.6 ÷ (2.5 × 42)
    expect(scrap.areaCm2).toBe(53571); // 1000 ÷ 140 m² × 0.75 = 5.3571 m²
  });

  it('uses the fibre weight: flannel (185 g/m²) gives less area per gram than cotton', () => {
    const flannel = estimateYield({ grams: 1000, fibre: 'flannel', waste: 0 });
    expect(flannel.gsm).toBe(185);
    expect(flannel.areaSqIn).toBe(8378); // 1000 ÷ 185 × 1550.0031
    expect(estimateYield({ grams: 1000, fibre: 'flannel', gsm: 140, waste: 0 }).areaSqIn).toBe(11071);
  });

  it('is zero for an empty bag and refuses nonsense', () => {
    expect(estimateYield({ grams: 0, fibre: 'batik' }).fiveInchSquares).toBe(0);
    expect(() => estimateYield({ grams: -1 })).toThrow(RangeError);
    expect(() => estimateYield({ grams: 100, waste: 1 })).toThrow(RangeError);
    expect(() => estimateYield({ grams: 100, gsm: 0 })).toThrow(RangeError);
  });
});
