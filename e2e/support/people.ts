import { expect, test, type Browser, type Page } from '@playwright/test';
import { jpegPhoto } from '../../tests/support/photos.ts';
import { signIn } from './auth.ts';

/** The demo guild's password (apps/api/src/db/seed.ts). */
export const DEMO_PASSWORD = 'quilt-relay-demo';

/**
 * A page of its own (own cookies) signed in as one member; the project's screen size and
 * base address carry over unless a screen is given (then a touch phone of that size).
 */
export async function signedInPage(browser: Browser, email: string, screen?: { width: number; height: number }): Promise<Page> {
  const { viewport, isMobile, hasTouch, baseURL } = test.info().project.use;
  const context = await browser.newContext(screen ? { viewport: screen, isMobile: true, hasTouch: true, baseURL } : { viewport, isMobile, hasTouch, baseURL });
  const page = await context.newPage();
  await signIn(page, email, DEMO_PASSWORD);
  return page;
}

/**
 * Empties a member's basket through the API, from a browser context of its own that is closed again. The basket
 * is kept on the server and follows the member everywhere, so a journey that reads it starts from an empty one
 * rather than from whatever an earlier journey (or the other screen size's run of this one) left in it.
 */
export async function emptyBasketOf(browser: Browser, email: string): Promise<void> {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  try {
    const { request } = context;
    const before = await request.get('/api/session');
    const signedIn = await request.post('/api/session', {
      headers: { 'X-CSRF-Token': ((await before.json()) as { csrfToken: string }).csrfToken },
      data: { email, password: DEMO_PASSWORD },
    });
    expect(signedIn.status(), await signedIn.text()).toBe(200);
    const headers = { 'X-CSRF-Token': ((await signedIn.json()) as { csrfToken: string }).csrfToken };
    const basket = await request.get('/api/basket');
    for (const item of ((await basket.json()) as { basket: { items: { bundleId: string }[] } }).basket.items) {
      expect((await request.delete(`/api/basket/items/${item.bundleId}`, { headers })).status()).toBe(200);
    }
  } finally {
    await context.close();
  }
}

/** The CSRF header for API calls made from a signed-in page, as the web app sends it. */
export async function csrfHeaders(page: Page): Promise<Record<string, string>> {
  const session = await page.request.get('/api/session');
  expect(session.ok()).toBe(true);
  return { 'X-CSRF-Token': ((await session.json()) as { csrfToken: string }).csrfToken };
}

/** A bundle listed with one photo and sent for review through the API, as the listing form would; returns its id. */
export async function submittedThroughApi(
  seller: Page,
  listing: Record<string, unknown>,
  photo: { name: string; rgb: [number, number, number] } = { name: 'scraps.jpg', rgb: [180, 110, 90] },
): Promise<string> {
  const headers = await csrfHeaders(seller);
  const created = await seller.request.post('/api/bundles', { headers, data: listing });
  expect(created.status(), await created.text()).toBe(201);
  const id = ((await created.json()) as { bundle: { id: string } }).bundle.id;
  const uploaded = await seller.request.post(`/api/bundles/${id}/photos`, {
    headers,
    multipart: { photos: { name: photo.name, mimeType: 'image/jpeg', buffer: await jpegPhoto({ rgb: photo.rgb }) } },
  });
  expect(uploaded.status(), await uploaded.text()).toBe(201);
  const submitted = await seller.request.post(`/api/bundles/${id}/submit`, { headers });
  expect(submitted.status(), await submitted.text()).toBe(200);
  return id;
}

/**
 * A bundle put on the shelf through the API, as the listing form and the review queue
 * would: the seller lists it with one photo and submits it, the librarian approves it.
 */
export async function shelvedThroughApi(
  browser: Browser,
  opts: { sellerEmail: string; librarianEmail: string; listing: Record<string, unknown>; photoRgb: [number, number, number]; photoName: string },
): Promise<string> {
  const seller = await signedInPage(browser, opts.sellerEmail);
  const id = await submittedThroughApi(seller, opts.listing, { name: opts.photoName, rgb: opts.photoRgb });
  await seller.context().close();

  const librarian = await signedInPage(browser, opts.librarianEmail);
  const approved = await librarian.request.post(`/api/bundles/${id}/review`, { headers: await csrfHeaders(librarian), data: { decision: 'approve' } });
  expect(approved.status(), await approved.text()).toBe(200);
  await librarian.context().close();
  return id;
}
