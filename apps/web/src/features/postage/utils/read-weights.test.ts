import { describe, expect, it } from 'vitest';
import { readWeights } from './read-weights.ts';

describe('weights typed into "try a quote"', () => {
  it('reads one weight per line in either system (1 lb = 453.59237 g, 1 oz = 28.349523125 g: NIST SP 811)', () => {
    expect(readWeights('1 lb\n12 oz\n\n350 g', 'imperial')).toEqual({ grams: [454, 340, 350], unreadable: [] });
  });

  it('takes a bare number in the admin’s small unit', () => {
    expect(readWeights('8', 'imperial').grams).toEqual([227]);
    expect(readWeights('450', 'metric').grams).toEqual([450]);
  });

  it('names the lines it cannot read, and refuses nothing-weights', () => {
    expect(readWeights('1 lb\nheavy\n0 g', 'imperial')).toEqual({ grams: [454], unreadable: [2, 3] });
  });
});
