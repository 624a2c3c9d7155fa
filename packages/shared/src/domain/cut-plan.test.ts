import { describe, expect, it } from 'vitest';
import { MIN_STRIP_LENGTH_MM, planBundle, planPiece } from './cut-plan.ts';
import { parseLengthToMm } from './units.ts';

/** A piece measured in inches and stored as whole mm, as the listing form does. */
const inches = (w: string, h: string, count = 1) => ({
  widthMm: parseLengthToMm(w) ?? Number.NaN,
  heightMm: parseLengthToMm(h) ?? Number.NaN,
  count,
});

describe('cut plan: standard cuts (CHECKS.md, common practice: floor(a/s) × floor(b/s))', () => {
  it('one yard, 36 × 42 usable: 14 strips, 56 five-inch, 12 ten-inch, 224 2½-in squares', () => {
    const plan = planPiece(inches('42', '36'));
    expect(plan.plans.strip_2_5in.count).toBe(14);
    expect(plan.plans.strip_2_5in.stripLengthMm).toBe(1067); // width of fabric
    expect(plan.plans.square_5in.count).toBe(56);
    expect(plan.plans.square_10in.count).toBe(12);
    expect(plan.plans.square_2_5in.count).toBe(224);
  });

  it('one yard gives 56 five-inch squares at 40 or 44 in too (CHECKS.md)', () => {
    expect(planPiece(inches('40', '36')).plans.square_5in.count).toBe(56);
    expect(planPiece(inches('44', '36')).plans.square_5in.count).toBe(56);
  });

  it('fat quarter 18 × 22: 7 strips of 22 in, 12 five-inch, 2 ten-inch, 56 2½-in squares', () => {
    const plan = planPiece(inches('18', '22'));
    expect(plan.plans.strip_2_5in.count).toBe(7);
    expect(plan.plans.strip_2_5in.stripLengthMm).toBe(559); // 22 in
    expect(plan.plans.square_5in.count).toBe(12);
    expect(plan.plans.square_10in.count).toBe(2);
    expect(plan.plans.square_2_5in.count).toBe(56);
  });

  it('fat eighth 9 × 22: 3 strips of 22 in and 4 five-inch squares', () => {
    const plan = planPiece(inches('22', '9'));
    expect(plan.plans.strip_2_5in.count).toBe(3);
    expect(plan.plans.square_5in.count).toBe(4);
  });

  it('counts the same whichever way round the piece is listed', () => {
    const a = planPiece(inches('18', '22'));
    const b = planPiece(inches('22', '18'));
    for (const cut of ['strip_2_5in', 'square_2_5in', 'square_5in', 'square_10in'] as const) {
      expect(b.plans[cut].count).toBe(a.plans[cut].count);
    }
  });
});

describe('cut plan: strips (design choice: along the longer side, at least 10 in)', () => {
  it('ignores strips shorter than 10 in', () => {
    expect(MIN_STRIP_LENGTH_MM).toBe(254);
    expect(planPiece(inches('9', '6')).plans.strip_2_5in.count).toBe(0);
    expect(planPiece(inches('9', '6')).plans.strip_2_5in.stripLengthMm).toBeNull();
    expect(planPiece(inches('10', '6')).plans.strip_2_5in.count).toBe(2);
  });

  it('draws strips across a wide piece and down a tall one', () => {
    const wide = planPiece(inches('22', '9')).plans.strip_2_5in.rects;
    expect(wide).toEqual([
      { x: 0, y: 0, w: 559, h: 63.5, cut: 'strip_2_5in' },
      { x: 0, y: 63.5, w: 559, h: 63.5, cut: 'strip_2_5in' },
      { x: 0, y: 127, w: 559, h: 63.5, cut: 'strip_2_5in' },
    ]);
    const tall = planPiece(inches('9', '22')).plans.strip_2_5in.rects;
    expect(tall[2]).toEqual({ x: 127, y: 0, w: 63.5, h: 559, cut: 'strip_2_5in' });
  });
});

describe('cut plan: drawing and suggestion', () => {
  it('returns one non-overlapping rectangle per cut, inside the piece', () => {
    const piece = inches('18', '22');
    const { rects } = planPiece(piece).plans.square_5in;
    expect(rects).toHaveLength(12);
    for (const r of rects) {
      expect(r.x + r.w).toBeLessThanOrEqual(piece.widthMm);
      expect(r.y + r.h).toBeLessThanOrEqual(piece.heightMm);
    }
    const keys = new Set(rects.map((r) => `${r.x},${r.y}`));
    expect(keys.size).toBe(12);
    expect(rects[11]).toEqual({ x: 254, y: 381, w: 127, h: 127, cut: 'square_5in' });
  });

  it('suggests the cut that uses most of the piece; ties go to the larger cut (design choice)', () => {
    expect(planPiece(inches('42', '36')).suggested).toBe('strip_2_5in'); // 1470 of 1512 in²
    expect(planPiece(inches('6', '6')).suggested).toBe('square_5in'); // 25 in² either way, one larger piece
    expect(planPiece(inches('7½', '7½')).suggested).toBe('square_2_5in'); // 9 × 6.25 = 56.25 > 25
    expect(planPiece(inches('2', '30')).suggested).toBeNull();
  });

  it('totals a bundle, multiplying by each piece count', () => {
    const plan = planBundle([inches('18', '22', 2), inches('22', '9', 3)]);
    expect(plan.totals).toEqual({
      strip_2_5in: 2 * 7 + 3 * 3,
      square_2_5in: 2 * 56 + 3 * 24,
      square_5in: 2 * 12 + 3 * 4,
      square_10in: 2 * 2 + 0,
    });
    expect(plan.stripTotalLengthMm).toBe(23 * 559);
  });

  it('refuses pieces with no size or no count', () => {
    expect(() => planPiece({ widthMm: 0, heightMm: 100, count: 1 })).toThrow(RangeError);
    expect(() => planPiece({ widthMm: 100, heightMm: 100, count: 0 })).toThrow(RangeError);
  });
});
