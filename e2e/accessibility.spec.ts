import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { jpegPhoto } from '../tests/support/photos.ts';
import { csrfHeaders, signedInPage, signIn } from './support/index.ts';

/**
 * Every page of the product through axe-core, against WCAG 2.0, 2.1 and 2.2 A and
 * AA: signed out, then each demo account's pages, with forms showing their errors
 * and a confirm dialog open. A serious or critical violation fails the page; the
 * milder ones are printed for the next person to look at.
 */

const GUS = 'gus@ferncombe-quilters.example';
const RUTH = 'ruth@ferncombe-quilters.example';
const NELL = 'nell@ferncombe-quilters.example';
const LENA = 'lena@ferncombe-quilters.example';
const TOMAS = 'tomas@ferncombe-quilters.example';
const ADA = 'ada@ferncombe-quilters.example';
/** The demo guild's listing that waits for the librarian (apps/api/src/db/demo-bundles.ts). */
const DEMO_IN_REVIEW = 'Orphan blocks and pre-joined binding';

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

type AxeResults = Awaited<ReturnType<AxeBuilder['analyze']>>;
type Violation = AxeResults['violations'][number];

const describeViolation = (violation: Violation) =>
  `${violation.impact ?? 'unknown'} ${violation.id}: ${violation.help} — ${violation.nodes
    .slice(0, 4)
    .map((node) => node.target.join(' '))
    .join(' | ')}${violation.nodes.length > 4 ? ` (+${violation.nodes.length - 4} more)` : ''}`;

/** Scans what is on screen now; fails (softly, so every page is still checked) on serious or critical findings. */
async function expectAccessible(page: Page, what: string): Promise<void> {
  const { violations } = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  const blocking = violations.filter((violation) => violation.impact === 'serious' || violation.impact === 'critical');
  for (const violation of violations.filter((v) => !blocking.includes(v))) {
    console.log(`[axe ${test.info().project.name}] ${what}: ${describeViolation(violation)}`);
  }
  expect.soft(blocking.map(describeViolation), `serious or critical accessibility violations on ${what}`).toEqual([]);
}

/** Waits until the page has its heading and nothing is still loading, so axe sees the finished page. */
async function settled(page: Page, heading: string | RegExp): Promise<void> {
  await expect(page.getByRole('heading', { level: 1, name: heading })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: /^(Loading|Opening|Checking)[^.]*…$/ })).toHaveCount(0);
  await expect(page.locator('[aria-busy="true"]')).toHaveCount(0);
}

async function check(page: Page, path: string, heading: string | RegExp, what = path): Promise<void> {
  await test.step(what, async () => {
    await page.goto(path);
    await settled(page, heading);
    await expectAccessible(page, what);
  });
}

/** On a phone the menu folds behind its button: unfold it and scan it too. */
async function checkPhoneMenu(page: Page, what: string): Promise<void> {
  const menuButton = page.getByRole('button', { name: 'Menu' });
  if (!(await menuButton.isVisible())) return;
  await test.step(`${what} with the menu open`, async () => {
    await menuButton.click();
    await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
    await expectAccessible(page, `${what} with the menu open`);
    await menuButton.click();
  });
}

async function getJson<T>(page: Page, path: string): Promise<T> {
  const response = await page.request.get(path);
  expect(response.ok(), `${path}: ${response.status()}`).toBe(true);
  return (await response.json()) as T;
}

interface ShelfCard {
  id: string;
  title: string;
  offer: string;
}

/** A bundle on the demo shelf that `sellerEmail`'s account did or did not list. */
async function shelfBundle(page: Page, offer: string, notTitle?: string): Promise<ShelfCard> {
  const shelf = await getJson<{ items: ShelfCard[] }>(page, `/api/bundles?offer=${offer}&pageSize=50`);
  const card = shelf.items.find((item) => item.title !== notTitle);
  if (!card) throw new Error(`No ${offer} bundle on the demo shelf.`);
  return card;
}

test('signed-out pages, and the sign-in form with its errors', { tag: '@phone' }, async ({ page }) => {
  await check(page, paths.auth.signIn.getHref(), 'Sign in', 'sign in');
  await test.step('sign in submitted empty', async () => {
    await page.getByRole('button', { name: /^sign in$/i }).click();
    await expect(page.getByRole('textbox', { name: /e-?mail/i })).toHaveAttribute('aria-invalid', 'true');
    await expectAccessible(page, 'sign in submitted empty');
  });
  await check(page, paths.auth.join.getHref(), 'Join the exchange', 'join');
  await test.step('join submitted empty', async () => {
    await page.getByRole('button', { name: 'Join the exchange' }).click();
    await expect(page.locator('[aria-invalid="true"]').first()).toBeVisible();
    await expectAccessible(page, 'join submitted empty');
  });
  await check(page, paths.auth.forgotPassword.getHref(), 'Forgotten your password?', 'forgot password');
  await check(page, paths.auth.resetPassword.getHref('not-a-real-token'), /password/i, 'reset password with a dummy token');
  await check(page, paths.auth.verifyEmail.getHref('not-a-real-token'), /e-mail/i, 'verify e-mail with a dummy token');
  await check(page, '/no/such/page', 'Page not found', 'not found, signed out');
});

test('a member’s pages: shelf, bundles, listing, wishes, basket, orders, meetings, dashboard, profile', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(180_000);
  const gus = await signedInPage(browser, GUS);

  await check(gus, paths.app.home.getHref(), 'Welcome, Gus Pennyworth', 'home');
  await checkPhoneMenu(gus, 'home');
  await check(gus, paths.app.shelf.getHref(), 'The shelf', 'shelf');
  await check(gus, paths.app.shelf.getHref('offer=sale&sort=price_asc'), 'The shelf', 'shelf, filtered');

  const mine = await getJson<{ items: { id: string; title: string }[] }>(gus, '/api/bundles/mine');
  const ownTitle = mine.items[0]?.title;
  const someoneElses = await shelfBundle(gus, 'sale', ownTitle);
  await check(gus, paths.app.bundle.getHref(someoneElses.id), someoneElses.title, 'a bundle page');
  if (mine.items[0]) await check(gus, paths.app.bundle.getHref(mine.items[0].id), mine.items[0].title, 'a bundle page of my own');

  await check(gus, paths.app.newBundle.getHref(), 'List a bundle', 'list a bundle');
  await check(gus, paths.app.myBundles.getHref(), 'My bundles', 'my bundles');
  await check(gus, paths.app.wishes.getHref(), 'Wishes', 'wishes');
  await check(gus, paths.app.basket.getHref(), 'Your basket', 'empty basket');
  await test.step('basket with a bundle, checking out by post', async () => {
    await gus.goto(paths.app.basketAdd.getHref(someoneElses.id));
    await settled(gus, 'Your basket');
    await expect(gus.getByRole('status').filter({ hasText: 'is in your basket' })).toBeVisible();
    await expectAccessible(gus, 'basket with a bundle');
  });
  await check(gus, paths.app.address.getHref(), 'Your postal address', 'postal address');
  await check(gus, paths.app.orders.getHref(), 'Orders', 'orders I bought');
  await check(gus, paths.app.orders.getHref('seller'), 'Orders', 'orders I sold');
  await check(gus, paths.app.meetings.getHref(), 'Meetings', 'meetings');
  await check(gus, paths.app.dashboard.getHref(), 'Dashboard', 'dashboard');
  await test.step('dashboard with a chart shown as a table', async () => {
    const figure = gus.getByRole('figure').first();
    await figure.getByRole('button', { name: 'Show as table' }).click();
    await expect(figure.getByRole('table')).toBeVisible();
    await expectAccessible(gus, 'dashboard with a table');
  });
  await check(gus, paths.app.profile.getHref(), 'Your profile', 'profile');
  await check(gus, paths.app.account.getHref(), 'Your account', 'account');
  await check(gus, paths.app.members.getHref(), 'Not available for your account', 'an officer page, not available');
  await check(gus, '/no/such/page', 'Page not found', 'not found, signed in');
  await gus.context().close();
});

test('the listing form’s five steps for a draft, and its review step refusing an incomplete listing', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(120_000);
  // Tomas lists nothing in the other journeys, so his draft disturbs none of them.
  const tomas = await signedInPage(browser, TOMAS);
  const title = `Draft for the accessibility check ${Date.now()}`;
  const created = await tomas.request.post('/api/bundles', { headers: await csrfHeaders(tomas), data: { title, offer: 'sale' } });
  expect(created.status(), await created.text()).toBe(201);
  const id = ((await created.json()) as { bundle: { id: string } }).bundle.id;
  for (const step of ['photos', 'contents', 'weight', 'offer', 'review']) {
    await check(tomas, paths.app.editBundle.getHref(id, step), `Edit “${title}”`, `listing form, step ${step}`);
  }
  await test.step('listing form, submitted incomplete', async () => {
    await tomas.getByRole('button', { name: 'Submit for review' }).click();
    await expect(tomas.getByRole('alert').filter({ hasText: 'The listing is not complete yet.' })).toBeVisible();
    await expectAccessible(tomas, 'listing form, submitted incomplete');
  });
  await tomas.context().close();
});

test('a new quilter’s starter bundles', { tag: '@phone' }, async ({ browser }) => {
  const nell = await signedInPage(browser, NELL);
  await check(nell, paths.app.starter.getHref(), 'Starter bundles', 'starter bundles (new quilter)');
  await nell.context().close();
});

test('the librarian’s pages: review queue and review, starter programme, waiting list, meetings, report, members', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(120_000);
  const lena = await signedInPage(browser, LENA);
  await checkPhoneMenu(lena, 'home (librarian)');
  await check(lena, paths.app.review.getHref(), 'Review queue', 'review queue');

  const queue = await getJson<{ items: { id: string; title: string }[] }>(lena, '/api/review-queue');
  const inReview = queue.items.find((row) => row.title === DEMO_IN_REVIEW) ?? queue.items[0];
  expect(inReview, 'a bundle waiting for review in the demo guild').toBeDefined();
  await check(lena, paths.app.reviewBundle.getHref(inReview!.id), `Review: ${inReview!.title}`, 'review a bundle');

  await check(lena, paths.app.starter.getHref(), 'Starter bundles', 'starter bundles (librarian)');
  await check(lena, paths.app.waitlist.getHref(), 'Starter waiting list', 'waiting list');
  await check(lena, paths.app.meetings.getHref(), 'Meetings', 'meetings (librarian)');
  const meetings = await getJson<{ items: { id: string }[] }>(lena, '/api/meetings');
  expect(meetings.items.length, 'the demo guild has coming meetings').toBeGreaterThan(0);
  await check(lena, paths.app.handoverSheet.getHref(meetings.items[0]!.id), 'Handover sheet', 'a handover sheet');
  await check(lena, paths.app.librarianReport.getHref(), 'Librarian report', 'librarian report');
  await check(lena, paths.app.members.getHref(), 'Members', 'members (librarian)');
  await lena.context().close();
});

test('the treasurer’s pages: ledger, seller balances, statement, dashboard', { tag: '@phone' }, async ({ browser }) => {
  const tomas = await signedInPage(browser, TOMAS);
  await check(tomas, paths.app.ledger.getHref(), 'Ledger', 'ledger');
  await check(tomas, paths.app.sellerBalances.getHref(), 'Seller balances', 'seller balances');
  await check(tomas, paths.app.statement.getHref(), 'Month-end statement', 'statement');
  await check(tomas, paths.app.dashboard.getHref('period=all'), 'Dashboard', 'dashboard with money (treasurer)');
  await tomas.context().close();
});

test('the admin’s pages: members with a confirm dialog, guild settings with an error, postage table', { tag: '@phone' }, async ({ browser }) => {
  const ada = await signedInPage(browser, ADA);
  await check(ada, paths.app.members.getHref(), 'Members', 'members (admin)');
  await test.step('deactivate dialog open, then cancelled', async () => {
    const row = ada.getByRole('row').filter({ hasText: 'Ruth Okafor' });
    await row.getByRole('button', { name: 'Deactivate' }).click();
    const dialog = ada.getByRole('dialog', { name: 'Deactivate Ruth Okafor’s account?' });
    await expect(dialog).toBeVisible();
    await expectAccessible(ada, 'deactivate dialog');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await expect(dialog).toBeHidden();
    await expect(row).toContainText('Active');
  });

  await check(ada, paths.app.guildSettings.getHref(), 'Guild settings', 'guild settings');
  await test.step('guild settings with a bad value', async () => {
    const days = ada.getByLabel('Days a bundle stays on the shelf');
    await days.fill('-3');
    await ada.getByRole('button', { name: 'Save settings' }).click();
    await expect(days).toHaveAttribute('aria-invalid', 'true');
    await expectAccessible(ada, 'guild settings with an error');
  });
  await check(ada, paths.app.postageTable.getHref(), 'Postage table', 'postage table');
  await ada.context().close();
});

test('an order’s pages for buyer and giver, its handover sheet row and the check-off page', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(120_000);
  // Ruth gives a bundle at a meeting and Gus claims it: an order with nothing to pay, on a handover sheet.
  const title = `Scrap bag for the accessibility check (${test.info().project.name} ${Date.now()})`;
  const ruth = await signedInPage(browser, RUTH);
  const ruthHeaders = await csrfHeaders(ruth);
  const created = await ruth.request.post('/api/bundles', {
    headers: ruthHeaders,
    data: {
      title,
      description: 'Mixed cotton scraps, pressed, every pin taken out.',
      offer: 'meeting',
      priceMinor: null,
      meetingHandoverOk: false,
      quantity: 1,
      weightGrams: 300,
      fibre: 'quilting_cotton',
      cutKinds: ['improv'],
      colourValue: 'mixed',
      colourFamily: 'multi',
      prewashed: true,
      smokeFree: true,
      petFree: true,
      pieces: [],
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  const bundleId = ((await created.json()) as { bundle: { id: string } }).bundle.id;
  const uploaded = await ruth.request.post(`/api/bundles/${bundleId}/photos`, {
    headers: ruthHeaders,
    multipart: { photos: { name: 'scraps.jpg', mimeType: 'image/jpeg', buffer: await jpegPhoto({ rgb: [150, 90, 120] }) } },
  });
  expect(uploaded.status(), await uploaded.text()).toBe(201);
  expect((await ruth.request.post(`/api/bundles/${bundleId}/submit`, { headers: ruthHeaders })).status()).toBe(200);

  const lena = await signedInPage(browser, LENA);
  const approved = await lena.request.post(`/api/bundles/${bundleId}/review`, { headers: await csrfHeaders(lena), data: { decision: 'approve' } });
  expect(approved.status(), await approved.text()).toBe(200);

  // The demo guild's later meeting, so the journeys that count handovers on their own meetings are not disturbed.
  const gus = await signedInPage(browser, GUS);
  const meetings = await getJson<{ items: { id: string }[] }>(gus, '/api/meetings');
  const meeting = meetings.items.at(-1)!;
  const placed = await gus.request.post('/api/orders', {
    headers: await csrfHeaders(gus),
    data: { items: [{ bundleId, quantity: 1 }], fulfilment: 'meeting', meetingId: meeting.id },
  });
  expect(placed.status(), await placed.text()).toBe(201);
  const order = ((await placed.json()) as { order: { id: string; reference: string } }).order;

  await check(gus, paths.app.order.getHref(order.id), `Order ${order.reference}`, 'an order (buyer)');
  await check(ruth, paths.app.order.getHref(order.id), `Order ${order.reference}`, 'an order (giver)');
  await check(ruth, paths.app.orders.getHref('seller'), 'Orders', 'orders I gave, with one');

  await check(lena, paths.app.handoverSheet.getHref(meeting.id), 'Handover sheet', 'a handover sheet with a handover');
  const sheet = await getJson<{ items: { id: string; reference: string }[] }>(lena, `/api/meetings/${meeting.id}/handovers`);
  const handover = sheet.items.find((row) => row.reference === order.reference);
  expect(handover, 'the order is on the meeting’s handover sheet').toBeDefined();
  await check(lena, paths.app.handoverCheckOff.getHref(handover!.id), 'Check off a handover', 'check off a handover');

  for (const page of [ruth, lena, gus]) await page.context().close();
});
