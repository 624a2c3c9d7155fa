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

/** The CSRF header for API calls made from a signed-in page, as the web app sends it. */
export async function csrfHeaders(page: Page): Promise<Record<string, string>> {
  const session = await page.request.get('/api/session');
  expect(session.ok()).toBe(true);
  return { 'X-CSRF-Token': ((await session.json()) as { csrfToken: string }).csrfToken };
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
  const headers = await csrfHeaders(seller);
  const created = await seller.request.post('/api/bundles', { headers, data: opts.listing });
  expect(created.status(), await created.text()).toBe(201);
  const id = ((await created.json()) as { bundle: { id: string } }).bundle.id;
  const uploaded = await seller.request.post(`/api/bundles/${id}/photos`, {
    headers,
    multipart: { photos: { name: opts.photoName, mimeType: 'image/jpeg', buffer: await jpegPhoto({ rgb: opts.photoRgb }) } },
  });
  expect(uploaded.status(), await uploaded.text()).toBe(201);
  expect((await seller.request.post(`/api/bundles/${id}/submit`, { headers })).status()).toBe(200);
  await seller.context().close();

  const librarian = await signedInPage(browser, opts.librarianEmail);
  const approved = await librarian.request.post(`/api/bundles/${id}/review`, { headers: await csrfHeaders(librarian), data: { decision: 'approve' } });
  expect(approved.status(), await approved.text()).toBe(200);
  await librarian.context().close();
  return id;
}
