import { describe, expect, it } from 'vitest';
import { makeBundleView } from '../../../testing/fixtures.ts';
import type { BasketLine } from './basket-lines.ts';
import { basketCharges } from './charges.ts';

const line = (overrides: Parameters<typeof makeBundleView>[0]): BasketLine => {
  const bundle = makeBundleView(overrides);
  return { bundleId: bundle.id, quantity: 1, bundle };
};

describe('what a basket can cost', () => {
  it('costs nothing, and posts nothing, when every bundle is free at a meeting', () => {
    expect(basketCharges([line({ offer: 'meeting', priceMinor: null })])).toEqual({ mayCharge: false, mayPost: false });
  });

  it('charges postage for a bundle given for postage', () => {
    expect(basketCharges([line({ offer: 'postage_only', priceMinor: null })])).toEqual({ mayCharge: true, mayPost: true });
  });

  it('charges the price of a bundle for sale, even collected at a meeting', () => {
    expect(basketCharges([line({ offer: 'sale', priceMinor: 1200, meetingHandoverOk: true })])).toEqual({ mayCharge: true, mayPost: true });
  });

  it('follows the bundle that costs something in a mixed basket', () => {
    expect(basketCharges([line({ offer: 'meeting', priceMinor: null }), line({ id: 'b-2', offer: 'postage_only', priceMinor: null })]).mayCharge).toBe(true);
  });
});
