import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { jpegPhoto } from '../tests/support/photos.ts';
import { latestMailTo, screenshot, signedInPage } from './support/index.ts';

/**
 * From review to the shelf to a wish: Ruth's two bundles wait for review (made
 * through the API, as the listing form would); Lena, the librarian, returns one
 * with notes and approves the other in the review queue; Gus filters the shelf,
 * finds the approved bundle, saves his filters as a wish and sees it listed.
 */

const RUTH = { name: 'Ruth Okafor', email: 'ruth@ferncombe-quilters.example' };
const LENA = 'lena@ferncombe-quilters.example';
const GUS = 'gus@ferncombe-quilters.example';

/** A word of letters only, new each run, so the shelf's text search finds this run's bundles and nothing else. */
function runWord(): string {
  const letters = 'abcdefghijklmnopqrstuvwxyz';
  let n = Date.now() * 100 + Math.floor(Math.random() * 100);
  let word = '';
  while (n > 0) {
    word += letters[n % 26];
    n = Math.floor(n / 26);
  }
  return `quokka${word}`;
}

const listing = {
  description: 'Leftovers from a mariner’s compass; every pin taken out.',
  meetingHandoverOk: false,
  quantity: 1,
  weightGrams: 340,
  fibre: 'batik',
  cutKinds: ['strips', 'squares'],
  colourValue: 'dark',
  colourFamily: 'cool',
  prewashed: true,
  smokeFree: true,
  petFree: false,
  pieces: [],
};

/** Lists a bundle with one photo and sends it for review, through the API with the page's own session cookie. */
async function submitBundle(page: Page, body: Record<string, unknown>): Promise<string> {
  const session = await page.request.get('/api/session');
  expect(session.ok()).toBe(true);
  const headers = { 'X-CSRF-Token': ((await session.json()) as { csrfToken: string }).csrfToken };

  const created = await page.request.post('/api/bundles', { headers, data: { ...listing, ...body } });
  expect(created.status(), await created.text()).toBe(201);
  const id = ((await created.json()) as { bundle: { id: string } }).bundle.id;

  const photo = await jpegPhoto({ rgb: [40, 50, 110] });
  const uploaded = await page.request.post(`/api/bundles/${id}/photos`, {
    headers,
    multipart: { photos: { name: 'batik-strips.jpg', mimeType: 'image/jpeg', buffer: photo } },
  });
  expect(uploaded.status(), await uploaded.text()).toBe(201);

  const submitted = await page.request.post(`/api/bundles/${id}/submit`, { headers });
  expect(submitted.status(), await submitted.text()).toBe(200);
  return id;
}

/** Opens a main-menu entry; on a phone the menu folds behind its button first. */
async function openFromMenu(page: Page, label: string) {
  const menuButton = page.getByRole('button', { name: 'Menu' });
  if (await menuButton.isVisible()) await menuButton.click();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label, exact: true }).click();
}

test('a librarian returns one bundle and approves another; a member finds it on the shelf and wishes for more', { tag: '@phone' }, async ({ browser }) => {
  // Three people, three sign-ins and two photo uploads: more than the default minute.
  test.setTimeout(120_000);
  const word = runWord();
  const toReturn = `Dusk batik offcuts ${word}`;
  const toApprove = `Midnight batik strips ${word}`;

  const ruth = await signedInPage(browser, RUTH.email);
  const returnId = await submitBundle(ruth, { title: toReturn, offer: 'postage_only', priceMinor: null });
  const approveId = await submitBundle(ruth, { title: toApprove, offer: 'sale', priceMinor: 850 });

  // Lena opens the queue from the menu and narrows it to Ruth's bundles.
  const lena = await signedInPage(browser, LENA);
  await openFromMenu(lena, 'Review queue');
  await expect(lena).toHaveURL((url) => url.pathname === paths.app.review.path);
  await expect(lena.getByRole('heading', { level: 1, name: 'Review queue' })).toBeVisible();
  await lena.getByLabel('Seller').selectOption({ label: RUTH.name });
  await expect(lena.getByRole('link', { name: toReturn })).toBeVisible();
  await expect(lena.getByRole('link', { name: toApprove })).toBeVisible();
  await expect(lena.getByRole('row').filter({ hasText: toApprove })).toContainText('$8.50');
  await expect(lena.getByRole('row').filter({ hasText: toReturn })).toContainText('Pets live in the home');
  await screenshot(lena, 'review-queue');

  // Return needs notes: refused without, sent with.
  await lena.getByRole('link', { name: toReturn }).click();
  await expect(lena).toHaveURL((url) => url.pathname === paths.app.reviewBundle.getHref(returnId));
  await expect(lena.getByRole('heading', { level: 1, name: `Review: ${toReturn}` })).toBeVisible();
  await expect(lena.getByRole('img', { name: `Photo 1 of 1: ${toReturn}` })).toBeVisible();
  await expect(lena.getByRole('region', { name: 'Contents' })).toContainText('Batik');
  await expect(lena.getByRole('region', { name: 'Yield estimate' })).toContainText('5-inch squares');
  await lena.getByRole('button', { name: 'Return with notes' }).click();
  await expect(lena.getByText('Tell the member what to change.')).toBeVisible();
  await screenshot(lena, 'review-return-needs-notes');
  const notes = 'Please add a photo of the whole bag, laid flat.';
  await lena.getByLabel('Notes for the member').fill(notes);
  await lena.getByRole('button', { name: 'Return with notes' }).click();
  await expect(lena).toHaveURL((url) => url.pathname === paths.app.review.path);
  await expect(lena.getByRole('status').filter({ hasText: `Returned “${toReturn}” with your notes` })).toBeVisible();
  await expect(lena.getByRole('link', { name: toReturn })).toHaveCount(0);
  const returnedMail = await latestMailTo(RUTH.email, 'A note from the librarian');
  expect(returnedMail.text).toContain(notes);

  await lena.getByRole('link', { name: toApprove }).click();
  await expect(lena.getByRole('heading', { level: 1, name: `Review: ${toApprove}` })).toBeVisible();
  await screenshot(lena, 'review-bundle');
  await lena.getByRole('button', { name: 'Approve: put it on the shelf' }).click();
  await expect(lena).toHaveURL((url) => url.pathname === paths.app.review.path);
  await expect(lena.getByRole('status').filter({ hasText: `Approved “${toApprove}”` })).toBeVisible();
  await expect(lena.getByRole('link', { name: toApprove })).toHaveCount(0);
  await screenshot(lena, 'review-queue-after-approval');

  // Gus filters the shelf; the filters land in the address.
  const gus = await signedInPage(browser, GUS);
  await openFromMenu(gus, 'Shelf');
  await expect(gus.getByRole('heading', { level: 1, name: 'The shelf' })).toBeVisible();
  const filtersToggle = gus.getByRole('button', { name: /^Filters/ });
  if (await filtersToggle.isVisible()) await filtersToggle.click();
  const filters = gus.getByRole('search', { name: 'Filter the shelf' });
  await filters.getByLabel('Words in the title or description').fill(word);
  await filters.getByLabel('Fibre').selectOption({ label: 'Batik' });
  await filters.getByRole('button', { name: 'Show bundles' }).click();
  await expect(gus).toHaveURL((url) => url.pathname === paths.app.shelf.path && url.searchParams.get('fibre') === 'batik' && url.searchParams.get('q') === word);
  const card = gus.getByRole('listitem').filter({ has: gus.getByRole('link', { name: toApprove }) });
  await expect(card).toContainText('$8.50');
  await expect(card).toContainText('five-inch squares');
  await expect(card.getByRole('img', { name: `Photo: ${toApprove}` })).toBeVisible();
  await expect(card.getByRole('link', { name: toApprove })).toHaveAttribute('href', paths.app.bundle.getHref(approveId));
  await expect(gus.getByRole('link', { name: toReturn })).toHaveCount(0);
  await expect(gus.getByRole('status').filter({ hasText: 'Showing 1–1 of 1 bundle' })).toBeVisible();
  await screenshot(gus, 'shelf-filtered');

  // The back button steps back to the unfiltered shelf, and forward again.
  await gus.goBack();
  await expect(gus).toHaveURL((url) => url.pathname === paths.app.shelf.path && url.search === '');
  await gus.goForward();
  await expect(gus.getByRole('link', { name: toApprove })).toBeVisible();

  // Save the filters as a wish (on a phone it sits with the folded filters) and find it, in words, on the wishes page.
  if (await filtersToggle.isVisible()) await filtersToggle.click();
  await gus.getByRole('button', { name: 'Save these filters as a wish' }).click();
  const wishName = `Dark batik ${word}`;
  await gus.getByLabel('Name this wish').fill(wishName);
  await gus.getByRole('button', { name: 'Save wish' }).click();
  await expect(gus.getByRole('status').filter({ hasText: `Wish saved: “${wishName}”` })).toBeVisible();
  await gus.getByRole('link', { name: 'See your wishes' }).click();
  await expect(gus.getByRole('heading', { level: 1, name: 'Wishes' })).toBeVisible();
  const wish = gus.getByRole('listitem').filter({ has: gus.getByRole('heading', { name: wishName }) });
  await expect(wish).toContainText(`Batik, matching “${word}”`);
  await expect(gus.getByText('one e-mail for that wish')).toBeVisible();
  await screenshot(gus, 'wishes');

  // "Show on the shelf" opens the same search.
  await wish.getByRole('link', { name: /Show on the shelf/ }).click();
  await expect(gus).toHaveURL((url) => url.pathname === paths.app.shelf.path && url.searchParams.get('fibre') === 'batik' && url.searchParams.get('q') === word);
  await expect(gus.getByRole('link', { name: toApprove })).toBeVisible();

  // Deleting asks first; the demo account is left with the wishes it had.
  await gus.goBack();
  await wish.getByRole('button', { name: /Delete/ }).click();
  const confirm = gus.getByRole('dialog', { name: `Delete the wish “${wishName}”?` });
  await expect(confirm).toBeVisible();
  await confirm.getByRole('button', { name: 'Delete wish' }).click();
  await expect(gus.getByRole('status').filter({ hasText: `Deleted the wish “${wishName}”.` })).toBeVisible();
  await expect(gus.getByRole('heading', { name: wishName })).toHaveCount(0);

  for (const page of [ruth, lena, gus]) await page.context().close();
});
