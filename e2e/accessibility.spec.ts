import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { csrfHeaders, emptyBasketOf, latestMailTo, shelvedThroughApi, signedInPage, signIn, submittedThroughApi } from './support/index.ts';

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
/** Demo accounts by first name, to withdraw free starter bundles their donors left on offer. */
const DEMO_EMAIL_BY_FIRST_NAME: Record<string, string> = { Gus: GUS, Ruth: RUTH, Nell: NELL, Lena: LENA, Tomas: TOMAS, Ada: ADA };
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
  await emptyBasketOf(browser, GUS);
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
  const bundleId = await submittedThroughApi(
    ruth,
    {
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
    { name: 'scraps.jpg', rgb: [150, 90, 120] },
  );

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

/** A complete listing for the journeys below to send through the API. */
const scrapListing = (title: string, offer: 'sale' | 'starter') => ({
  title,
  description: 'Cotton scraps, pressed, every pin taken out.',
  offer,
  priceMinor: offer === 'sale' ? 900 : null,
  meetingHandoverOk: false,
  quantity: 1,
  weightGrams: 400,
  fibre: 'quilting_cotton',
  cutKinds: ['squares'],
  colourValue: 'medium',
  colourFamily: 'warm',
  prewashed: true,
  smokeFree: true,
  petFree: true,
  pieces: [],
});

// Desktop only: it empties the waiting list and takes back free starter bundles, which one run is enough of.
test('the starter offer a new quilter opens from the e-mail, before and after passing it on', async ({ browser }) => {
  test.setTimeout(120_000);
  const nell = await signedInPage(browser, NELL);
  const lena = await signedInPage(browser, LENA);
  const ruth = await signedInPage(browser, RUTH);
  const nellHeaders = await csrfHeaders(nell);

  // Nell can only wait while no starter bundle is free: donors take back any left on offer, as the waiting-list journey does.
  const list = await getJson<{ status: { eligibility: { eligible: boolean }; waitlist: unknown }; items: { id: string; seller: { firstName: string } }[] }>(
    nell,
    '/api/starter-bundles',
  );
  expect(list.status.eligibility.eligible, 'Nell may claim a starter bundle').toBe(true);
  for (const bundle of list.items) {
    const donor = await signedInPage(browser, DEMO_EMAIL_BY_FIRST_NAME[bundle.seller.firstName]!);
    expect((await donor.request.post(`/api/bundles/${bundle.id}/withdraw`, { headers: await csrfHeaders(donor) })).status()).toBe(200);
    await donor.context().close();
  }
  // Nobody ahead of her, so the offer is hers.
  const lenaHeaders = await csrfHeaders(lena);
  for (const entry of (await getJson<{ items: { id: string }[] }>(lena, '/api/waitlist')).items) {
    const removed = await lena.request.delete(`/api/waitlist/${entry.id}`, { headers: lenaHeaders, data: { reason: 'Cleared before the accessibility check' } });
    expect(removed.status()).toBe(204);
  }
  expect((await nell.request.post('/api/waitlist', { headers: nellHeaders })).status()).toBe(201);
  expect((await getJson<{ status: { waitlist: unknown } }>(nell, '/api/starter-bundles')).status.waitlist, 'Nell is on the waiting list').toBeTruthy();

  // Ruth donates a starter bundle; the librarian's approval offers it to the first in line.
  const title = `Starter squares for the accessibility check ${Date.now()}`;
  const bundleId = await submittedThroughApi(ruth, scrapListing(title, 'starter'));
  const approved = await lena.request.post(`/api/bundles/${bundleId}/review`, { headers: lenaHeaders, data: { decision: 'approve' } });
  expect(approved.status(), await approved.text()).toBe(200);
  const mail = await latestMailTo(NELL, `A starter bundle is waiting for you: ${title}`);
  const link = mail.text.match(/https?:\/\/\S+\/starter\/offers\/[0-9a-f-]{36}/)?.[0];
  expect(link, mail.text).toBeDefined();

  await check(nell, new URL(link!).pathname, 'A starter bundle for you', 'a starter offer from the e-mail');
  await test.step('the starter offer, passed on', async () => {
    await nell.getByRole('button', { name: 'Pass it on' }).click();
    const confirm = nell.getByRole('dialog', { name: 'Pass this bundle on?' });
    await expect(confirm).toBeVisible();
    await expectAccessible(nell, 'passing on a starter offer, confirm dialog');
    await confirm.getByRole('button', { name: 'Pass it on' }).click();
    await expect(nell.getByText('Passed on', { exact: true })).toBeVisible();
    await expectAccessible(nell, 'a starter offer passed on');
  });

  // Back as it was: the donated bundle is taken back, Nell is off the waiting list.
  expect((await ruth.request.post(`/api/bundles/${bundleId}/withdraw`, { headers: await csrfHeaders(ruth) })).status()).toBe(200);
  const after = await getJson<{ status: { waitlist: unknown } }>(nell, '/api/starter-bundles');
  if (after.status.waitlist) expect((await nell.request.delete('/api/waitlist/me', { headers: nellHeaders })).status()).toBe(204);
  for (const page of [nell, lena, ruth]) await page.context().close();
});

test('the packing slip of a posted order', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(120_000);
  const title = `Posted scraps for the accessibility check (${test.info().project.name} ${Date.now()})`;
  const bundleId = await shelvedThroughApi(browser, {
    sellerEmail: RUTH,
    librarianEmail: LENA,
    listing: scrapListing(title, 'sale'),
    photoRgb: [90, 110, 160],
    photoName: 'posted-scraps.jpg',
  });

  // Gus orders it by post and pays on the stand-in without a browser; the webhook confirms the order.
  const gus = await signedInPage(browser, GUS);
  const placed = await gus.request.post('/api/orders', {
    headers: await csrfHeaders(gus),
    data: {
      items: [{ bundleId, quantity: 1 }],
      fulfilment: 'post',
      address: { name: 'Gus Pennyworth', line1: '7 Tanners Row', town: 'Ferncombe', postalCode: '97451', country: 'US' },
    },
  });
  expect(placed.status(), await placed.text()).toBe(201);
  const { order, checkoutUrl } = (await placed.json()) as { order: { id: string; reference: string }; checkoutUrl: string };
  const stripeFake = process.env.STRIPE_FAKE_URL;
  expect(stripeFake, 'STRIPE_FAKE_URL (set by npm test)').toBeDefined();
  const paid = await gus.request.post(`${stripeFake}/_control/checkout/sessions/${checkoutUrl.split('/').pop()}/pay`, { data: { card: '4242 4242 4242 4242' } });
  expect(paid.status(), await paid.text()).toBe(200);
  await expect.poll(async () => (await getJson<{ order: { state: string } }>(gus, `/api/orders/${order.id}`)).order.state, { timeout: 20_000 }).toBe('confirmed');

  const ruth = await signedInPage(browser, RUTH);
  const posted = await ruth.request.post(`/api/orders/${order.id}/posted`, { headers: await csrfHeaders(ruth), data: { trackingNumber: 'FERN-A11Y-01' } });
  expect(posted.status(), await posted.text()).toBe(200);

  await check(ruth, paths.app.packingSlip.getHref(order.id), 'Packing slip', 'packing slip of a posted order');
  await test.step('packing slip of a posted order, as printed', async () => {
    await ruth.emulateMedia({ media: 'print' });
    await expectAccessible(ruth, 'packing slip of a posted order, as printed');
    await ruth.emulateMedia({ media: 'screen' });
  });
  for (const page of [gus, ruth]) await page.context().close();
});

test('the edit page of a bundle the librarian returned with notes', { tag: '@phone' }, async ({ browser }) => {
  test.setTimeout(120_000);
  // Tomas lists nothing in the other journeys, so his returned bundle disturbs none of them.
  const tomas = await signedInPage(browser, TOMAS);
  const title = `Returned scraps for the accessibility check (${test.info().project.name} ${Date.now()})`;
  const id = await submittedThroughApi(tomas, scrapListing(title, 'sale'));
  const lena = await signedInPage(browser, LENA);
  const notes = 'Please add a photo in daylight and say whether a pet lives in the home.';
  const returned = await lena.request.post(`/api/bundles/${id}/review`, { headers: await csrfHeaders(lena), data: { decision: 'return', notes } });
  expect(returned.status(), await returned.text()).toBe(200);
  await lena.context().close();

  for (const step of ['photos', 'review']) {
    await check(tomas, paths.app.editBundle.getHref(id, step), `Edit “${title}”`, `returned bundle, edit step ${step}`);
    await expect(tomas.getByText(notes)).toBeVisible();
  }
  await check(tomas, paths.app.bundle.getHref(id), title, 'returned bundle, its page');
  await tomas.context().close();
});
