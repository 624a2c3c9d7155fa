import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { emptyBasketOf, screenshot, shelvedThroughApi, signedInPage } from './support/index.ts';

/**
 * A sale by post from start to finish: Ruth's bundle is listed and approved
 * (through the API, as the listing form and review queue would); Gus adds it
 * from its bundle page, checks out by post with his address, sees the postage
 * quote, pays on the payment stand-in's page and comes back to a confirmed
 * order; Ruth prints the packing slip and marks it posted with a tracking
 * number; Gus marks it received; Tomas, the treasurer, finds the order's
 * entries in the ledger and records a payout to Ruth.
 */

const RUTH = { name: 'Ruth Okafor', email: 'ruth@ferncombe-quilters.example' };
const GUS = { name: 'Gus Pennyworth', email: 'gus@ferncombe-quilters.example' };
const LENA = 'lena@ferncombe-quilters.example';
const TOMAS = 'tomas@ferncombe-quilters.example';

const listing = {
  description: 'Width-of-fabric 2½-inch strips in greens, pressed; every pin taken out.',
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
  petFree: true,
  pieces: [],
};

/** Opens a main-menu entry; on a phone the menu folds behind its button first. */
async function openFromMenu(page: Page, label: string | RegExp) {
  const menuButton = page.getByRole('button', { name: 'Menu' });
  if (await menuButton.isVisible()) await menuButton.click();
  await page
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name: label, ...(typeof label === 'string' ? { exact: true } : {}) })
    .click();
}

test('Gus buys Ruth’s bundle by post, Ruth posts it, Gus receives it, Tomas pays Ruth out', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(180_000);
  const title = `Green strips for a scrappy border (${test.info().project.name} ${Date.now()})`;
  const bundleId = await shelvedThroughApi(browser, { sellerEmail: RUTH.email, librarianEmail: LENA, listing: { ...listing, title }, photoRgb: [60, 120, 70], photoName: 'green-strips.jpg' });

  // Gus: from the bundle page to the basket, which he starts empty.
  await emptyBasketOf(browser, GUS.email);
  const gus = await signedInPage(browser, GUS.email);
  await gus.goto(paths.app.bundle.getHref(bundleId));
  await gus.getByRole('link', { name: 'Add to basket' }).click();
  await expect(gus).toHaveURL((url) => url.pathname === paths.app.basket.path);
  await expect(gus.getByRole('status').filter({ hasText: `“${title}” is in your basket` })).toBeVisible();
  // The menu's basket count (folded away behind the Menu button on a phone, so found by its address).
  await expect(gus.locator(`nav[aria-label="Main"] a[href="${paths.app.basket.getHref()}"]`)).toContainText('1 bundle');
  // On a phone the closed Menu button carries the count too, named in full for a screen reader.
  const menuButton = gus.getByRole('button', { name: 'Menu' });
  if (await menuButton.isVisible()) {
    await expect(menuButton).toHaveAccessibleName(/^Menu\s*1\s+bundle in your basket$/);
    await screenshot(gus, 'basket-count-on-menu-button');
  }

  const order = gus.getByRole('region', { name: 'From Ruth' });
  await expect(order.getByRole('link', { name: title })).toBeVisible();
  await order.getByLabel('Post it to me').check();
  await order.getByLabel('Name on the parcel').fill(GUS.name);
  await order.getByLabel('Street address').fill('7 Tanners Row');
  await order.getByLabel('Town or city').fill('Ferncombe');
  await order.getByLabel('Postal code').fill('97451');
  // The demo guild posts within the US only, so the country is fixed text, not a box to fill.
  await expect(order.getByText('The guild posts within United States only.')).toBeVisible();

  // The guild's default table, worked by hand: 454 g + 25 g padded mailer = 479 g → the local 2 lb band, $6.80, plus $0.50 handling.
  const quote = order.getByRole('region', { name: 'Postage quote' });
  await expect(quote).toContainText('Padded mailer');
  await expect(quote).toContainText('$6.80');
  await quote.getByText('How the postage was worked out').click();
  await expect(quote).toContainText('is in zone local');
  await expect(order.getByRole('definition').filter({ hasText: '$19.30' })).toBeVisible();
  await expect(gus.getByRole('complementary', { name: 'Before you pay' })).toContainText('Fees and refunds follow the guild’s own rules and local law');
  await screenshot(gus, 'basket-postage-quote');

  await order.getByRole('button', { name: 'Pay $19.30 by card' }).click();

  // The payment stand-in's page (another site), paid with the test card that succeeds.
  await gus.waitForURL((url) => url.pathname.startsWith('/pay/'));
  await gus.getByLabel('Card number').fill('4242 4242 4242 4242');
  await gus.getByLabel('Expiry date (MM / YY)').fill(`12 / ${String((new Date().getFullYear() + 2) % 100).padStart(2, '0')}`);
  await gus.getByLabel('Security code (CVC)').fill('123');
  await gus.getByRole('button', { name: /^Pay / }).click();

  await gus.waitForURL((url) => url.pathname.startsWith('/orders/') && url.searchParams.has('paid'));
  const orderUrl = new URL(gus.url());
  const orderPath = orderUrl.pathname;
  await expect(gus.getByText('Payment received: your order is confirmed')).toBeVisible({ timeout: 20_000 });
  await expect(gus.getByText('Paid. Ruth Okafor will post it to you.')).toBeVisible();
  const reference = (await gus.getByRole('heading', { level: 1 }).textContent())?.replace('Order ', '').trim() ?? '';
  expect(reference).not.toBe('');
  await screenshot(gus, 'order-confirmed-buyer');

  // Ruth: her sold orders, the packing slip in print, then posting with a tracking number.
  const ruth = await signedInPage(browser, RUTH.email);
  await openFromMenu(ruth, /^Orders$/);
  await ruth.getByRole('link', { name: 'I gave or sold' }).click();
  await ruth.getByRole('link', { name: `Order ${reference}` }).click();
  await expect(ruth).toHaveURL((url) => url.pathname === orderPath);
  await expect(ruth.getByText('7 Tanners Row')).toBeVisible();
  await expect(ruth.getByRole('region', { name: 'Money' })).toContainText('$18.10');
  await ruth.getByRole('link', { name: 'Print the packing slip' }).click();
  await expect(ruth.getByRole('heading', { level: 1, name: 'Packing slip' })).toBeVisible();
  await expect(ruth.getByRole('img', { name: `QR code of the order reference ${reference}` })).toBeVisible();
  await ruth.emulateMedia({ media: 'print' });
  await expect(ruth.getByRole('button', { name: 'Print the packing slip' })).toBeHidden();
  await expect(ruth.getByRole('navigation', { name: 'Main' })).toBeHidden();
  await screenshot(ruth, 'packing-slip-print');
  await ruth.emulateMedia({ media: 'screen' });
  await ruth.getByRole('link', { name: `← Back to order ${reference}` }).click();

  await ruth.getByLabel('Tracking number (optional)').fill('FERN-4471-22');
  await ruth.getByRole('button', { name: 'Mark as posted' }).click();
  await expect(ruth.getByText(`Posted. Waiting for ${GUS.name} to say it arrived.`)).toBeVisible();
  await expect(ruth.getByRole('region', { name: 'History' })).toContainText('Tracking number FERN-4471-22');
  await screenshot(ruth, 'order-posted-seller');

  // Gus: it arrived.
  await gus.goto(orderPath);
  await expect(gus.getByRole('region', { name: 'By post' })).toContainText('FERN-4471-22');
  await gus.getByRole('button', { name: 'Mark as received' }).click();
  await gus.getByRole('dialog').getByRole('button', { name: 'Yes, mark it received' }).click();
  await expect(gus.getByText('Received. Enjoy your new fabric.')).toBeVisible();
  await screenshot(gus, 'order-received-buyer');

  // Tomas: the order's entries in the ledger (card payment $19.30 in, Ruth credited $18.10), then a payout to Ruth.
  const tomas = await signedInPage(browser, TOMAS);
  await openFromMenu(tomas, 'Ledger');
  await tomas.getByLabel('Search by account, order or transaction').fill(reference);
  await expect(tomas.getByText(/^Showing 1–\d+ of \d+ entries$/)).toBeVisible();
  const ledger = tomas.getByRole('table', { name: 'Ledger entries' });
  await expect(ledger).toContainText('Card payment');
  await expect(ledger).toContainText('-$19.30');
  await expect(ledger).toContainText(`Seller: ${RUTH.name}`);
  await expect(ledger).toContainText('$18.10');
  await expect(tomas.getByRole('link', { name: 'Download these entries (CSV)' })).toHaveAttribute('href', '/api/ledger.csv');
  await screenshot(tomas, 'ledger-treasurer');

  await openFromMenu(tomas, 'Seller balances');
  const balances = tomas.getByRole('table', { name: 'Seller balances' });
  await balances.getByRole('button', { name: `Record a payout to ${RUTH.name}` }).click();
  const payout = tomas.getByRole('region', { name: 'Record a payout' });
  await payout.getByLabel('Amount paid (USD)').fill('10.00');
  await payout.getByLabel('How it was paid').selectOption('cheque');
  await payout.getByLabel('Reference (optional)').fill(`Cheque ${reference}`);
  await payout.getByRole('button', { name: 'Record the payout' }).click();
  await expect(payout.getByText(`Payout of $10.00 to ${RUTH.name} recorded`)).toBeVisible();
  await screenshot(tomas, 'seller-balances-payout');

  await openFromMenu(tomas, 'Ledger');
  await tomas.getByLabel('Kind').selectOption('payout');
  await expect(tomas).toHaveURL((url) => url.searchParams.get('kind') === 'payout');
  await expect(tomas.getByRole('table', { name: 'Ledger entries' })).toContainText(`Seller: ${RUTH.name}`);
  await expect(tomas.getByRole('link', { name: 'Download these entries (CSV)' })).toHaveAttribute('href', '/api/ledger.csv?kind=payout');
});
