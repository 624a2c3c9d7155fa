import { expect, test, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { latestMailTo, screenshot, signedInPage, submittedThroughApi } from './support/index.ts';

/**
 * The starter programme end to end: Nell, a new quilter, finds no starter bundle
 * free and joins the waiting list; Lena adds a meeting; Ruth donates a starter
 * bundle (through the API, as the listing form would); Lena approves it in the
 * review queue, which offers it to Nell by e-mail; Nell opens the offer from the
 * e-mail and accepts it for Lena's meeting; Lena opens that meeting's handover
 * sheet, prints it, and ticks the handover on a phone at the door.
 */

const NELL = { name: 'Nell Ashby', email: 'nell@ferncombe-quilters.example' };
const LENA = { name: 'Lena Marsh', email: 'lena@ferncombe-quilters.example' };
const RUTH = { name: 'Ruth Okafor', email: 'ruth@ferncombe-quilters.example' };
/** Demo accounts by first name, to withdraw free starter bundles their donors left on offer. */
const DEMO_EMAIL_BY_FIRST_NAME: Record<string, string> = {
  Ada: 'ada@ferncombe-quilters.example',
  Lena: LENA.email,
  Tomas: 'tomas@ferncombe-quilters.example',
  Ruth: RUTH.email,
  Gus: 'gus@ferncombe-quilters.example',
};

/** A word new each run, so this run's bundle and meeting are told apart from earlier ones. */
const runWord = () => `run${Date.now().toString(36)}`;

/** The CSRF token of a signed-in request context, for the API's writes. */
async function csrf(request: APIRequestContext): Promise<Record<string, string>> {
  const session = await request.get('/api/session');
  expect(session.ok()).toBe(true);
  return { 'X-CSRF-Token': ((await session.json()) as { csrfToken: string }).csrfToken };
}

async function openFromMenu(page: Page, label: string) {
  const menuButton = page.getByRole('button', { name: 'Menu' });
  if (await menuButton.isVisible()) await menuButton.click();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label, exact: true }).click();
}

interface StarterList {
  status: { eligibility: { eligible: boolean }; waitlist: unknown };
  items: { id: string; seller: { firstName: string } }[];
}

/**
 * Puts the guild where the journey starts: Nell eligible and not queued, nobody
 * ahead of her, and no starter bundle free (donors withdraw any left on offer).
 */
async function startWithNothingFree(browser: Browser, nell: Page, lena: Page) {
  const nellHeaders = await csrf(nell.request);
  let list = (await (await nell.request.get('/api/starter-bundles')).json()) as StarterList;
  expect(list.status.eligibility.eligible, 'Nell must be able to claim for this journey').toBe(true);
  if (list.status.waitlist) expect((await nell.request.delete('/api/waitlist/me', { headers: nellHeaders })).status()).toBe(204);

  for (const bundle of list.items) {
    const donorEmail = DEMO_EMAIL_BY_FIRST_NAME[bundle.seller.firstName];
    expect(donorEmail, `a free starter bundle from ${bundle.seller.firstName}, who is not a demo account`).toBeDefined();
    const donor = await signedInPage(browser, donorEmail!);
    const withdrawn = await donor.request.post(`/api/bundles/${bundle.id}/withdraw`, { headers: await csrf(donor.request) });
    expect(withdrawn.status(), await withdrawn.text()).toBe(200);
    await donor.context().close();
  }
  list = (await (await nell.request.get('/api/starter-bundles')).json()) as StarterList;
  expect(list.items).toEqual([]);

  const lenaHeaders = await csrf(lena.request);
  const queue = (await (await lena.request.get('/api/waitlist')).json()) as { items: { id: string }[] };
  for (const entry of queue.items) {
    const removed = await lena.request.delete(`/api/waitlist/${entry.id}`, { headers: lenaHeaders, data: { reason: 'Cleared before the waiting-list journey' } });
    expect(removed.status()).toBe(204);
  }
}

/** Ruth's donation: a starter bundle with one photo, sent for review; returns its id. */
function donateStarterBundle(ruth: Page, title: string): Promise<string> {
  return submittedThroughApi(
    ruth,
    {
      title,
      description: 'Cotton squares and strips from a sampler; every pin taken out.',
      offer: 'starter',
      priceMinor: null,
      meetingHandoverOk: false,
      quantity: 1,
      weightGrams: 454,
      fibre: 'quilting_cotton',
      cutKinds: ['squares', 'strips'],
      colourValue: 'medium',
      colourFamily: 'warm',
      prewashed: true,
      smokeFree: true,
      petFree: true,
      pieces: [],
    },
    { name: 'starter-squares.jpg', rgb: [200, 120, 80] },
  );
}

/** A datetime-local value two weeks ahead at 7 pm, in this machine's (and so the browser's) time zone. */
function twoWeeksAheadAtSeven(): string {
  const d = new Date();
  d.setDate(d.getDate() + 14);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T19:00`;
}

test('a new quilter waits, is offered a donated starter bundle, accepts it, and the librarian ticks the handover', async ({ browser }) => {
  const word = runWord();
  const title = `Starter warm squares ${word}`;
  const place = `Ferncombe Village Hall, starter evening ${word}`;

  const nell = await signedInPage(browser, NELL.email);
  const lena = await signedInPage(browser, LENA.email);
  await startWithNothingFree(browser, nell, lena);

  // Nell finds nothing free and joins the waiting list.
  await openFromMenu(nell, 'Starter bundles');
  await expect(nell.getByRole('heading', { level: 1, name: 'Starter bundles' })).toBeVisible();
  await expect(nell.getByRole('region', { name: 'Your standing' })).toContainText('You may claim a starter bundle');
  await expect(nell.getByRole('region', { name: 'How the starter programme works' })).toContainText('one every 90 days');
  await nell.getByRole('button', { name: 'Join the waiting list' }).click();
  const place1 = nell.getByRole('region', { name: 'Your place on the waiting list' });
  await expect(place1).toContainText('You are next in line.');
  await expect(place1.getByRole('button', { name: 'Leave the waiting list' })).toBeVisible();
  await screenshot(nell, 'starter-waiting');

  // Lena sees Nell at the front of the queue, and adds the meeting the bundle will be collected at.
  await openFromMenu(lena, 'Waiting list');
  await expect(lena.getByRole('heading', { level: 1, name: 'Starter waiting list' })).toBeVisible();
  await expect(lena.getByRole('row').filter({ hasText: NELL.name })).toContainText('None yet');
  await openFromMenu(lena, 'Meetings');
  await lena.getByRole('button', { name: 'Add a meeting' }).click();
  const addMeeting = lena.getByRole('region', { name: 'Add a meeting' });
  await addMeeting.getByLabel('Date and start time').fill(twoWeeksAheadAtSeven());
  await addMeeting.getByLabel('Place').fill(place);
  await addMeeting.getByLabel('Notes (optional)').fill('Starter bundles are handed over at the side door.');
  await addMeeting.getByRole('button', { name: 'Add the meeting' }).click();
  await expect(lena.getByRole('status').filter({ hasText: `Meeting added:` })).toContainText(place);
  const meetingItem = lena.getByRole('listitem').filter({ hasText: place });
  await expect(meetingItem).toContainText('7:00 PM');

  // Ruth donates a starter bundle; Lena approves it in the review queue, which offers it to Nell.
  const ruth = await signedInPage(browser, RUTH.email);
  const bundleId = await donateStarterBundle(ruth, title);
  await lena.goto(paths.app.reviewBundle.getHref(bundleId));
  await expect(lena.getByRole('heading', { level: 1, name: `Review: ${title}` })).toBeVisible();
  await lena.getByRole('button', { name: 'Approve: offer it to new quilters' }).click();
  await expect(lena).toHaveURL((url) => url.pathname === paths.app.review.path);

  const offerMail = await latestMailTo(NELL.email, `A starter bundle is waiting for you: ${title}`);
  const offerLink = offerMail.text.match(/https?:\/\/\S+\/starter\/offers\/[0-9a-f-]{36}/)?.[0];
  expect(offerLink, offerMail.text).toBeDefined();
  const offerPath = new URL(offerLink!).pathname;

  // The starter page points Nell to the offer too; she opens it from the e-mail.
  await nell.reload();
  await expect(nell.getByRole('status').filter({ hasText: `A starter bundle is waiting for you: “${title}”` })).toBeVisible();
  await nell.goto(offerPath);
  await expect(nell.getByRole('heading', { level: 1, name: 'A starter bundle for you' })).toBeVisible();
  const offered = nell.getByRole('region', { name: title });
  await expect(offered.getByRole('img', { name: `Photo of the starter bundle “${title}”` })).toBeVisible();
  await expect(offered).toContainText('Squares (by size), Strips (by width)');
  await expect(offered).toContainText('5-inch squares');
  await expect(nell.getByText(/^Please answer by /)).toBeVisible();
  await screenshot(nell, 'starter-offer');

  const meetingChoice = nell.getByLabel('Collect it at');
  const meetingValue = await meetingChoice.locator('option', { hasText: place }).getAttribute('value');
  await meetingChoice.selectOption(meetingValue!);
  await nell.getByRole('button', { name: 'Accept this bundle' }).click();
  await expect(nell.getByRole('status').filter({ hasText: `“${title}” is yours` })).toContainText(place);
  await screenshot(nell, 'starter-offer-accepted');
  await latestMailTo(NELL.email, `Your starter bundle: ${title}`);

  await nell.goto(paths.app.starter.getHref());
  const claims = nell.getByRole('region', { name: 'Your starter bundles' });
  await expect(claims.getByRole('listitem').filter({ hasText: title })).toContainText('Waiting to be collected');
  await expect(claims.getByRole('listitem').filter({ hasText: title })).toContainText(place);
  await expect(nell.getByRole('region', { name: 'Your place on the waiting list' })).toHaveCount(0);

  // Lena opens the meeting's handover sheet and prints it.
  await lena.goto(paths.app.meetings.getHref());
  await lena.getByRole('listitem').filter({ hasText: place }).getByRole('link', { name: 'Handover sheet' }).click();
  await expect(lena.getByRole('heading', { level: 1, name: 'Handover sheet' })).toBeVisible();
  await expect(lena.getByText('0 of 1 handed over, 1 still to do.')).toBeVisible();
  const row = lena.getByRole('article', { name: new RegExp(`${RUTH.name} to ${NELL.name}`) });
  await expect(row).toContainText(title);
  await lena.emulateMedia({ media: 'print' });
  await expect(lena.getByRole('navigation', { name: 'Main' })).toBeHidden();
  await expect(lena.getByRole('heading', { name: `${RUTH.name} brings 1 handover` })).toBeVisible();
  await expect(lena.getByRole('img', { name: /^QR code for Starter / })).toBeVisible();
  await screenshot(lena, 'handover-sheet-print');
  await lena.emulateMedia({ media: 'screen' });

  // At the door, on a phone: one big tick, and the sheet says who ticked it.
  const door = await signedInPage(browser, LENA.email, { width: 390, height: 844 });
  await door.goto(lena.url());
  const atDoor = door.getByRole('article', { name: new RegExp(`${RUTH.name} to ${NELL.name}`) });
  const tick = atDoor.getByRole('button', { name: /^✓?\s*Handed over/ });
  const box = await tick.boundingBox();
  expect(box?.height ?? 0).toBeGreaterThanOrEqual(44);
  await tick.tap();
  await expect(atDoor.getByRole('status')).toContainText(`Handed over — ticked by ${LENA.name}`);
  await expect(atDoor.getByRole('button', { name: /Undo the tick/ })).toBeVisible();
  await expect(door.getByText('1 of 1 handed over — all done.')).toBeVisible();
  await screenshot(door, 'handover-sheet-ticked-phone');

  // Nell's page now shows the bundle as collected.
  await nell.reload();
  await expect(nell.getByRole('region', { name: 'Your starter bundles' }).getByRole('listitem').filter({ hasText: title })).toContainText('Collected');

  for (const page of [nell, lena, ruth, door]) await page.context().close();
});
