import { randomInt } from 'node:crypto';
import sharp from 'sharp';
import { expect, test, type Browser, type BrowserContext, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { screenshot, signIn } from './support/index.ts';

/**
 * Listing a bundle from start to shelf: Ruth (member) lists a bag with a real
 * photo upload and submits it; Lena (librarian) approves it in the review
 * queue; Gus (member) finds it on the shelf with a filter and opens its page.
 */

const PASSWORD = 'quilt-relay-demo';
const RUTH = 'ruth@ferncombe-quilters.example';
const LENA = 'lena@ferncombe-quilters.example';
const GUS = 'gus@ferncombe-quilters.example';

/**
 * A phone-sized photo of dark blue fabric: grain added so the JPEG is a few
 * hundred kilobytes (enough for the upload to show progress on a slowed line)
 * while its average colour stays dark blue.
 */
async function fabricPhoto(): Promise<Buffer> {
  const [width, height] = [900, 600];
  const pixels = Buffer.alloc(width * height * 3);
  const base = [20, 40, 110];
  for (let i = 0; i < pixels.length; i++) pixels[i] = (base[i % 3] ?? 0) + randomInt(-16, 17);
  return sharp(pixels, { raw: { width, height, channels: 3 } }).jpeg({ quality: 90 }).toBuffer();
}

/** Another member on the same screen size, in a browser context of their own. */
async function memberContext(browser: Browser, page: Page): Promise<BrowserContext> {
  const phone = test.info().project.name === 'phone';
  return browser.newContext({ baseURL: new URL(page.url()).origin, viewport: page.viewportSize(), isMobile: phone, hasTouch: phone });
}

/** Opens a main-menu entry; on a phone the menu folds behind its button first. */
async function openFromMenu(page: Page, label: string) {
  const menuButton = page.getByRole('button', { name: 'Menu' });
  if (await menuButton.isVisible()) await menuButton.click();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label, exact: true }).click();
}

/** Letters only, new each run: the shelf's word search finds this run's bundle and nothing else. */
function runWord(): string {
  const letters = 'abcdefghijklmnopqrstuvwxyz';
  return `hedgerow${Array.from({ length: 8 }, () => letters[randomInt(letters.length)]).join('')}`;
}

test('Ruth lists a bundle with a photo, Lena approves it, Gus finds it on the shelf with a filter', { tag: '@phone' }, async ({ page, browser }) => {
  // Three people, a slowed upload and a review: more than the default minute.
  test.setTimeout(150_000);
  // Each run (and each screen size) lists its own bundle, found again by a word of its own.
  const marker = runWord();
  const title = `Indigo ${marker} strips and fat quarters`;

  await test.step('Ruth starts a listing and adds photos, with an upload progress bar per photo', async () => {
    await signIn(page, RUTH, PASSWORD);
    await openFromMenu(page, 'List a bundle');
    await expect(page.getByRole('heading', { level: 1, name: 'List a bundle' })).toBeVisible();
    await expect(page.getByRole('heading', { level: 2, name: /Photos/ })).toBeVisible();

    // A slowed line, so the progress bar is seen moving rather than already full.
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 120 * 1024 });
    await page.getByLabel('Choose photos').setInputFiles([
      { name: 'whole-bag.jpg', mimeType: 'image/jpeg', buffer: await fabricPhoto() },
      { name: 'shopping-list.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('eggs, thread, a new rotary blade') },
    ]);

    // The first photo starts the draft, which now has an address of its own.
    await expect(page).toHaveURL((url) => /^\/my-bundles\/[0-9a-f-]{36}\/edit$/.test(url.pathname));
    const bar = page.getByRole('progressbar', { name: 'Upload of whole-bag.jpg' });
    await expect(bar).toHaveAttribute('aria-valuetext', /^Uploading: \d+ %$/);
    await expect(bar).toHaveAttribute('aria-valuetext', 'Uploaded: 100 %', { timeout: 30_000 });
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    // The API looks inside the file: a text file named .jpg is refused with its own message.
    await expect(page.getByRole('alert').filter({ hasText: 'That file is not a photo we can read' })).toBeVisible();
    await expect(page.getByRole('img', { name: 'Photo 1 of 1 (cover)' })).toBeVisible();
    await screenshot(page, 'listing-photos');
  });

  await test.step('Ruth describes the contents; the colour is suggested from the photo', async () => {
    await page.getByRole('button', { name: /Next: Contents/ }).click();
    await expect(page.getByRole('heading', { level: 2, name: /Contents/ })).toBeFocused();
    await page.getByLabel('Title').fill(title);
    await page.getByLabel('Strips (by width)').check();
    await page.getByLabel('Fat quarters').check();
    await page.getByLabel('Fibre', { exact: true }).selectOption({ label: 'Quilting cotton' });
    await expect(page.getByText(/Suggested from your photos: dark, cool/)).toBeVisible();
    await expect(page.getByLabel('Colour value')).toHaveValue('dark');
    await expect(page.getByLabel('Colour family')).toHaveValue('cool');
    await page.getByLabel('Smoke-free home').check();
    await expect(page.getByRole('region', { name: 'Before you bag it up' })).toContainText('Remove every pin and needle');
    await screenshot(page, 'listing-contents');
  });

  await test.step('Ruth weighs it in pounds and ounces and lists two fat quarters; the yield and cut plan follow', async () => {
    await page.getByRole('button', { name: /Next: Weight and pieces/ }).click();
    await page.getByLabel('Weight of one pack').fill('1 lb 4 oz');
    // 1.25 lb × 453.59237 g = 566.99 g (NIST SP 811).
    await expect(page.getByText('Reads as 567 g (1 lb 4 oz).')).toBeVisible();
    await expect(page.getByRole('region', { name: 'Yield estimate' })).toBeVisible();

    await page.getByRole('button', { name: 'Add a row of pieces' }).click();
    await page.getByLabel('Width (in)').fill('18');
    await page.getByLabel('Height (in)').fill('22');
    await page.getByLabel('How many').fill('2');
    // A fat quarter, 18 × 22 in, gives 7 strips of 2½ × 22 in (CHECKS.md, common practice).
    const plan = page.getByRole('region', { name: 'Cut plan' });
    await expect(plan).toContainText('7 strips of 2½ in × 22 in from each of the 2');
    await plan.getByLabel('5-inch squares').check();
    await expect(plan).toContainText('12 squares of 5 in from each of the 2');
    await screenshot(page, 'listing-weight');
  });

  await test.step('Ruth offers it for sale, reads it through and submits it', async () => {
    await page.getByRole('button', { name: /Next: Offer and price/ }).click();
    await page.getByLabel(/^For sale/).check();
    await page.getByLabel('Price for one pack (USD)').fill('12.50');
    await expect(page.getByText('Buyers see $12.50 plus postage.')).toBeVisible();
    await page.getByLabel('May also hand over at a meeting').check();

    await page.getByRole('button', { name: /Next: Review and submit/ }).click();
    await expect(page.getByText('Everything the librarian needs is here')).toBeVisible();
    const contents = page.getByRole('region', { name: 'Contents' });
    await expect(contents).toContainText(title);
    await expect(contents).toContainText('Dark, Cool');
    await expect(page.getByRole('region', { name: 'Weight and pieces' })).toContainText('1 lb 4 oz');
    await expect(page.getByRole('region', { name: 'Offer and price' })).toContainText('$12.50');
    await screenshot(page, 'listing-review');

    await page.getByRole('button', { name: 'Submit for review' }).click();
    await expect(page).toHaveURL((url) => /^\/bundles\/[0-9a-f-]{36}$/.test(url.pathname));
    await expect(page.getByText('Sent to the librarian for review')).toBeVisible();
    await expect(page.getByText('Waiting for review')).toBeVisible();
  });
  const bundleId = new URL(page.url()).pathname.split('/').at(-1) ?? '';

  await test.step('Lena finds it in the review queue and approves it', async () => {
    const lena = await memberContext(browser, page);
    const lenaPage = await lena.newPage();
    await signIn(lenaPage, LENA, PASSWORD);
    await openFromMenu(lenaPage, 'Review queue');
    await lenaPage.getByLabel('Seller').selectOption({ label: 'Ruth Okafor' });
    await lenaPage.getByRole('link', { name: title }).click();
    await expect(lenaPage.getByRole('heading', { level: 1, name: `Review: ${title}` })).toBeVisible();
    await lenaPage.getByRole('button', { name: 'Approve: put it on the shelf' }).click();
    await expect(lenaPage.getByRole('status').filter({ hasText: `Approved “${title}”` })).toBeVisible();
    await lena.close();
  });

  await test.step('Ruth sees it on the shelf in My bundles', async () => {
    await openFromMenu(page, 'My bundles');
    const row = page.getByRole('row').filter({ hasText: title });
    await expect(row).toContainText('On the shelf');
    await expect(row.getByRole('img', { name: `Cover photo of ${title}` })).toBeVisible();
    await screenshot(page, 'my-bundles');
  });

  await test.step('Gus filters the shelf by cut and fibre, finds it, and opens its page', async () => {
    const gus = await memberContext(browser, page);
    const gusPage = await gus.newPage();
    await signIn(gusPage, GUS, PASSWORD);

    await openFromMenu(gusPage, 'Shelf');
    await expect(gusPage.getByRole('heading', { level: 1, name: 'The shelf' })).toBeVisible();
    // On a phone the filters fold behind a button.
    const filtersToggle = gusPage.getByRole('button', { name: /^Filters/ });
    if (await filtersToggle.isVisible()) await filtersToggle.click();
    const filters = gusPage.getByRole('search', { name: 'Filter the shelf' });
    await filters.getByLabel('Words in the title or description').fill(marker);
    await filters.getByLabel('Cut').selectOption({ label: 'Fat quarters' });
    await filters.getByLabel('Fibre').selectOption({ label: 'Quilting cotton' });
    await filters.getByRole('button', { name: 'Show bundles' }).click();
    await expect(gusPage).toHaveURL((url) => url.pathname === paths.app.shelf.path && url.searchParams.get('cut') === 'fat_quarters');
    await expect(gusPage.getByRole('status').filter({ hasText: 'Showing 1–1 of 1 bundle' })).toBeVisible();
    await gusPage.getByRole('link', { name: title }).click();

    await expect(gusPage).toHaveURL((url) => url.pathname === paths.app.bundle.getHref(bundleId));
    await expect(gusPage.getByRole('heading', { level: 1, name: title })).toBeVisible();
    await expect(gusPage.getByRole('img', { name: `${title}: photo 1 of 1` })).toBeVisible();
    await expect(gusPage.getByText('Listed by Ruth')).toBeVisible();
    await expect(gusPage.getByText('Smoke-free home', { exact: true })).toBeVisible();
    await expect(gusPage.getByText('Pets live in the home (think of allergies)')).toBeVisible();
    await expect(gusPage.getByRole('region', { name: 'Cut plan' })).toContainText('Piece 1: 18 × 22 in, 2 of them');
    await expect(gusPage.getByRole('link', { name: 'Add to basket' })).toHaveAttribute('href', `/basket/add/${bundleId}`);
    await screenshot(gusPage, 'bundle-page-buyer');
    await gus.close();
  });
});
