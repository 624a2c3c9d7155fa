import { inchesToMm, planBundle, planPiece } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import { longLength } from '../../../utils/yield-text.ts';
import { cutTotals, describeCuts, pieceSize } from './cut-plan-text.ts';

// Pieces are stored in whole millimetres, as the listing form saves them.
const inches = (width: number, height: number, count = 1) => ({ widthMm: Math.round(inchesToMm(width)), heightMm: Math.round(inchesToMm(height)), count });

describe('cut plans in words (yields: CHECKS.md standard cuts, common practice: floor(a/s) × floor(b/s))', () => {
  it('says what a yard (36 × 42 in usable) cuts into', () => {
    const { plans } = planPiece(inches(36, 42));
    expect(describeCuts(plans.strip_2_5in, 'imperial')).toBe('14 strips of 2½ in × 42 in');
    expect(describeCuts(plans.square_5in, 'imperial')).toBe('56 squares of 5 in');
    expect(describeCuts(plans.square_10in, 'imperial')).toBe('12 squares of 10 in');
    expect(describeCuts(plans.square_2_5in, 'imperial')).toBe('224 squares of 2½ in');
  });

  it('says what a fat quarter (18 × 22 in) cuts into', () => {
    const { plans } = planPiece(inches(18, 22));
    expect(describeCuts(plans.strip_2_5in, 'imperial')).toBe('7 strips of 2½ in × 22 in');
    expect(describeCuts(plans.square_5in, 'imperial')).toBe('12 squares of 5 in');
    expect(describeCuts(plans.square_10in, 'imperial')).toBe('2 squares of 10 in');
  });

  it('says so when a piece is too small for a cut, and uses centimetres for metric members', () => {
    const { plans } = planPiece(inches(9, 9));
    expect(describeCuts(plans.square_10in, 'imperial')).toBe('no 10-inch squares');
    expect(describeCuts(planPiece(inches(18, 22)).plans.strip_2_5in, 'metric')).toBe('7 strips of 6.4 cm × 55.9 cm');
    expect(pieceSize(inches(18, 22), 'imperial')).toBe('18 × 22 in');
    expect(pieceSize(inches(18, 22), 'metric')).toBe('45.7 × 55.9 cm');
  });

  it('totals every piece times its count, with the strips’ length in yards', () => {
    const plan = planBundle([inches(36, 42), inches(18, 22, 2)]);
    const totals = Object.fromEntries(cutTotals(plan, 'imperial').map((line) => [line.cut, line]));
    expect(totals.strip_2_5in).toMatchObject({ count: 14 + 2 * 7, label: '2½-inch strips' });
    expect(totals.square_5in?.count).toBe(56 + 2 * 12);
    // 14 × 1067 mm + 14 × 559 mm = 22 764 mm = 24.9 yd (1 yd = 914.4 mm).
    expect(totals.strip_2_5in?.detail).toBe('24.9 yd in all');
    expect(longLength(22_764, 'metric')).toBe('22.8 m');
  });
});
