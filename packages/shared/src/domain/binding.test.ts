import { describe, expect, it } from 'vitest';
import { cutSizeForFinishedIn, halfSquareTriangleCutSizeIn, joinedBindingLengthIn, planBinding } from './binding.ts';
import { formatEighths } from './units.ts';

describe('binding (CHECKS.md, common practice; join geometry)', () => {
  it('54 × 60 quilt, allowance 10, usable 42: 238 in → 6 strips → 15 in → ½ yd', () => {
    const plan = planBinding({ quiltWidthIn: 54, quiltLengthIn: 60, allowanceIn: 10, usableWidthIn: 42 });
    expect(plan.lengthNeededIn).toBe(238);
    expect(plan.strips).toBe(6);
    expect(plan.fabricIn).toBe(15);
    expect(plan.fabricEighthsOfYard).toBe(4);
    expect(`${formatEighths(plan.fabricEighthsOfYard)} yd`).toBe('½ yd');
    expect(plan.extraStripForJoins).toBe(false);
  });

  it('a 45° join uses one strip width: joined length = n × usable − (n − 1) × width (geometry)', () => {
    expect(joinedBindingLengthIn(6, 42, 2.5)).toBe(239.5);
    expect(joinedBindingLengthIn(1, 42, 2.5)).toBe(42);
    expect(planBinding({ quiltWidthIn: 54, quiltLengthIn: 60 }).joinedLengthIn).toBe(239.5);
  });

  it('adds a strip when the joins eat the margin the formula leaves', () => {
    // 2 × (60 + 60) + 10 = 250 in; ceil(250 / 42) = 6, but 6 joined strips give only 239.5 in.
    const plan = planBinding({ quiltWidthIn: 60, quiltLengthIn: 60 });
    expect(plan.strips).toBe(7);
    expect(plan.extraStripForJoins).toBe(true);
    expect(plan.joinedLengthIn).toBe(279);
    expect(plan.fabricIn).toBe(17.5);
    expect(plan.fabricEighthsOfYard).toBe(4); // 17.5 in ≤ 18 in
  });

  it('takes 2¼-in strips and rounds fabric up to the next ⅛ yd', () => {
    const plan = planBinding({ quiltWidthIn: 40, quiltLengthIn: 40, stripWidthIn: 2.25 });
    expect(plan.lengthNeededIn).toBe(170);
    expect(plan.strips).toBe(5); // ceil(170 / 42)
    expect(plan.joinedLengthIn).toBe(201); // 5 × 42 − 4 × 2.25
    expect(plan.fabricIn).toBe(11.25);
    expect(plan.fabricEighthsOfYard).toBe(3); // 11.25 in ÷ 4.5 in = 2.5 → 3, i.e. ⅜ yd
  });

  it('refuses negative sizes and strips as wide as the fabric', () => {
    expect(() => planBinding({ quiltWidthIn: -1, quiltLengthIn: 10 })).toThrow(RangeError);
    expect(() => planBinding({ quiltWidthIn: 10, quiltLengthIn: 10, usableWidthIn: 2 })).toThrow(RangeError);
  });
});

describe('seam allowances (Combs, "Formulas for Quilters", 2002)', () => {
  it('cut = finished + ½ in: a finished 2-in strip is cut 2½ in', () => {
    expect(cutSizeForFinishedIn(2)).toBe(2.5);
  });

  it('half-square triangles: cut = finished + ⅞ in', () => {
    expect(halfSquareTriangleCutSizeIn(3)).toBe(3.875);
    expect(halfSquareTriangleCutSizeIn(2.5)).toBe(3.375);
  });
});
