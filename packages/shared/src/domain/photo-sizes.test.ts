import { describe, expect, it } from 'vitest';
import { cardSrcSet } from './photo-sizes.ts';

describe('cardSrcSet', () => {
  it('offers the thumbnail and the medium size', () => {
    expect(cardSrcSet({ thumbUrl: '/t.webp', thumb2xUrl: '/m.webp' })).toBe('/t.webp 400w, /m.webp 800w');
  });

  it('offers no srcset without a medium size', () => {
    expect(cardSrcSet({ thumbUrl: '/t.webp', thumb2xUrl: null })).toBeUndefined();
  });
});
