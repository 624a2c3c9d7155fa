import type { PhotoView } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import { photoSrcSet } from './photo-sources.ts';

const photo = (overrides: Partial<PhotoView>): PhotoView => ({
  id: 'p-1',
  url: '/uploads/p-1600.webp',
  thumbUrl: '/uploads/p-400.webp',
  mediumUrl: '/uploads/p-800.webp',
  width: 1600,
  height: 1067,
  averageHex: '#884422',
  ...overrides,
});

describe('photoSrcSet', () => {
  // Widths as sharp 0.35 wrote them for a 1600 × 1067 display size: 800 × 534, then 400 × 267 (checked by hand).
  it('lists each stored size with its width', () => {
    expect(photoSrcSet(photo({}))).toBe('/uploads/p-400.webp 400w, /uploads/p-800.webp 800w, /uploads/p-1600.webp 1600w');
  });

  it('uses the width of a portrait photo, not its long side', () => {
    expect(photoSrcSet(photo({ width: 1067, height: 1600 }))).toBe('/uploads/p-400.webp 267w, /uploads/p-800.webp 534w, /uploads/p-1600.webp 1067w');
  });

  it('leaves out the medium size of a photo stored before it existed', () => {
    expect(photoSrcSet(photo({ mediumUrl: null }))).toBe('/uploads/p-400.webp 400w, /uploads/p-1600.webp 1600w');
  });

  it('offers a small photo once, as its smallest file', () => {
    expect(photoSrcSet(photo({ width: 300, height: 200 }))).toBe('/uploads/p-400.webp 300w');
  });
});
