import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { emptyBasketOf, screenshot, shelvedThroughApi, signedInPage } from './support/index.ts';

/**
 * A bag given away for the price of postage: Ruth offers it postage-only
 * (listed and approved through the API, as the listing form and review queue
 * would); Gus opens the add-to-basket link, sees that the bundle is free and
 * that only postage is charged, pays the postage alone on the payment
 * stand-in's page, and his order is confirmed; Ruth is credited exactly the
 * postage (the guild takes no fee on a gift), posts it, and Gus receives it.
 */

const RUTH = { name: 'Ruth Okafor', email: 'ruth@ferncombe-quilters.example' };
const GUS = { name: 'Gus Pennyworth', email: 'gus@ferncombe-quilters.example' };
const LENA = 'lena@ferncombe-quilters.example';

const gift = {
  description: 'A bag of light and medium 5-inch squares; free to a good home, postage only. Every pin taken out.',
  offer: 'postage_only',
  priceMinor: null,
  meetingHandoverOk: false,
  quantity: 1,
  weightGrams: 200,
  fibre: 'quilting_cotton',
  cutKinds: ['squares'],
  colourValue: 'light',
  colourFamily: 'neutral',
  prewashed: false,
  smokeFree: true,
  petFree: false,
  pieces: [],
};

test('Gus takes Ruth’s postage-only gift and pays only the postage', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(150_000);
  const title = `Light 5-inch squares, free for postage (${test.info().project.name} ${Date.now()})`;
  const bundleId = await shelvedThroughApi(browser, { sellerEmail: RUTH.email, librarianEmail: LENA, listing: { ...gift, title }, photoRgb: [225, 215, 195], photoName: 'light-squares.jpg' });

  await emptyBasketOf(browser, GUS.email);
  const gus = await signedInPage(browser, GUS.email);
  await gus.goto(paths.app.basketAdd.getHref(bundleId));
  await expect(gus).toHaveURL((url) => url.pathname === paths.app.basket.path);

  const order = gus.getByRole('region', { name: 'From Ruth' });
  await expect(order).toContainText('Free, buyer pays postage');
  // Posted only: no meeting choice is offered for a postage-only gift.
  await expect(order.getByLabel('Collect it at a guild meeting')).toHaveCount(0);
  await expect(order).toContainText('These go by post.');
  await order.getByLabel('Name on the parcel').fill(GUS.name);
  await order.getByLabel('Street address').fill('7 Tanners Row');
  await order.getByLabel('Town or city').fill('Ferncombe');
  await order.getByLabel('Postal code').fill('97451');

  // The guild's default table, worked by hand: 200 g + 15 g envelope = 215 g → the local ½ lb band, $4.50, plus $0.50 handling.
  const quote = order.getByRole('region', { name: 'Postage quote' });
  await expect(quote).toContainText('Envelope');
  await expect(quote).toContainText('$4.50');
  const totals = order.getByRole('definition');
  await expect(totals.filter({ hasText: 'Free' })).toBeVisible();
  await expect(totals.filter({ hasText: '$5.00' })).toHaveCount(2);
  await screenshot(gus, 'gift-basket-postage-only');

  await order.getByRole('button', { name: 'Pay $5.00 by card' }).click();
  await gus.waitForURL((url) => url.pathname.startsWith('/pay/'));
  await expect(gus.getByRole('button', { name: /^Pay / })).toContainText('5.00');
  await gus.getByLabel('Card number').fill('4242 4242 4242 4242');
  await gus.getByLabel('Expiry date (MM / YY)').fill(`11 / ${String((new Date().getFullYear() + 3) % 100).padStart(2, '0')}`);
  await gus.getByLabel('Security code (CVC)').fill('321');
  await gus.getByRole('button', { name: /^Pay / }).click();

  await gus.waitForURL((url) => url.pathname.startsWith('/orders/') && url.searchParams.has('paid'));
  const orderPath = new URL(gus.url()).pathname;
  await expect(gus.getByText('Payment received: your order is confirmed')).toBeVisible({ timeout: 20_000 });
  const money = gus.getByRole('region', { name: 'Money' });
  await expect(money).toContainText('Free');
  await expect(money).toContainText('$5.00');
  await screenshot(gus, 'gift-order-confirmed');

  // Ruth: credited the postage alone (no guild fee on a gift), posts it without a tracking number.
  const ruth = await signedInPage(browser, RUTH.email);
  await ruth.goto(paths.app.orders.getHref('seller'));
  const card = ruth.getByRole('listitem').filter({ hasText: title });
  await expect(card).toContainText('Your credit $5.00');
  await expect(card).toContainText('Paid: ready to post');
  await card.getByRole('link', { name: /^Order / }).click();
  await expect(ruth).toHaveURL((url) => url.pathname === orderPath);
  const ruthMoney = ruth.getByRole('region', { name: 'Money' });
  await expect(ruthMoney).toContainText('− $0.00');
  await expect(ruthMoney.getByRole('definition').filter({ hasText: '$5.00' })).toHaveCount(3);
  await ruth.getByRole('button', { name: 'Mark as posted' }).click();
  await expect(ruth.getByRole('region', { name: 'History' })).toContainText('No tracking number given');
  await screenshot(ruth, 'gift-order-posted');

  await gus.goto(orderPath);
  await gus.getByRole('button', { name: 'Mark as received' }).click();
  await gus.getByRole('dialog').getByRole('button', { name: 'Yes, mark it received' }).click();
  await expect(gus.getByText('Received. Enjoy your new fabric.')).toBeVisible();
  await gus.goto(paths.app.orders.getHref());
  await expect(gus.getByRole('listitem').filter({ hasText: title })).toContainText('Received');
  await screenshot(gus, 'gift-orders-list');
});
