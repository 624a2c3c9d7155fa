import { expect } from 'vitest';
import type { Client } from './api.ts';
import { jpegPhoto } from './photos.ts';

export const completeListing = {
  title: 'Bag of blue 2½-inch strips',
  description: 'Cotton strips left from a sampler; all prewashed.',
  offer: 'sale',
  priceMinor: 1200,
  meetingHandoverOk: true,
  quantity: 1,
  weightGrams: 454,
  fibre: 'quilting_cotton',
  cutKinds: ['strips'],
  colourValue: 'medium',
  colourFamily: 'cool',
  prewashed: true,
  smokeFree: true,
  petFree: false,
  pieces: [{ widthMm: 914, heightMm: 1067, count: 1 }],
};

/** Lists a complete bundle with one photo and sends it for review; returns its id. */
export async function listAndSubmit(seller: Client, overrides: Record<string, unknown> = {}): Promise<string> {
  const created = await seller.send('post', '/api/bundles', { ...completeListing, ...overrides });
  expect(created.status).toBe(201);
  const id = created.body.bundle.id as string;
  const upload = await seller.agent
    .post(`/api/bundles/${id}/photos`)
    .set('X-CSRF-Token', seller.csrfToken)
    .attach('photos', await jpegPhoto(), { filename: 'scraps.jpg', contentType: 'image/jpeg' });
  expect(upload.status).toBe(201);
  const submitted = await seller.send('post', `/api/bundles/${id}/submit`);
  expect(submitted.status).toBe(200);
  return id;
}
