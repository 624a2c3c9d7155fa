import { expect, test, type Browser, type Locator, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { jpegPhoto } from '../tests/support/photos.ts';
import { signIn } from './support/index.ts';

/**
 * Everything works by keyboard alone, and shows where the keyboard is: the skip
 * link, the listing form's first steps, and checkout up to the pay button. Every
 * Tab stop must show a focus ring (an outline or box-shadow under :focus-visible).
 * Then two checks for older eyes and fingers: text at 200 % keeps the shelf free of
 * sideways scrolling, and on a phone the menu's links and the main buttons are at
 * least 44 × 44 px (WCAG 2.2, 2.5.5 target size, enhanced).
 */

const PASSWORD = 'quilt-relay-demo';
/** Lists nothing and buys nothing in the other journeys, so his draft and basket disturb none of them. */
const TOMAS = 'tomas@ferncombe-quilters.example';
const MIN_TARGET_PX = 44;
/** The phone project's screen (playwright.config.ts). */
const PHONE = { width: 390, height: 844 };

/**
 * The few browser objects these checks read inside the page. The test project is
 * compiled without the DOM library, so page callbacks reach them through
 * `globalThis` with these types (the casts vanish when the callback is sent).
 */
interface PageElement {
  tagName: string;
  id: string;
  tabIndex: number;
  className: unknown;
  textContent: string | null;
  labels?: ArrayLike<{ textContent: string | null }> | null;
  style: { fontSize: string };
  getAttribute(name: string): string | null;
  matches(selector: string): boolean;
  contains(other: PageElement | null): boolean;
  getBoundingClientRect(): { width: number; height: number; right: number };
}
interface PageWindow {
  document: {
    activeElement: PageElement | null;
    body: PageElement;
    documentElement: PageElement & { scrollWidth: number; clientWidth: number };
    querySelector(selector: string): PageElement | null;
    querySelectorAll(selector: string): ArrayLike<PageElement>;
  };
  getComputedStyle(element: PageElement): { outlineStyle: string; outlineWidth: string; boxShadow: string; fontSize: string };
}

interface FocusState {
  description: string;
  /** In the Tab order; headings and <main> take focus only when the app moves it there (tabindex -1) and need no ring. */
  tabbable: boolean;
  focusVisible: boolean;
  ring: boolean;
  onScreen: boolean;
}

/** What has focus now, and whether a person can see that it has. */
function focusState(page: Page): Promise<FocusState | null> {
  return page.evaluate(() => {
    const { document, getComputedStyle } = globalThis as unknown as PageWindow;
    const element = document.activeElement;
    if (!element || element === document.body) return null;
    const style = getComputedStyle(element);
    const outline = style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0;
    const shadow = style.boxShadow !== 'none' && style.boxShadow !== '';
    const box = element.getBoundingClientRect();
    const name = element.getAttribute('aria-label') ?? element.labels?.[0]?.textContent ?? element.textContent ?? '';
    return {
      description: `<${element.tagName.toLowerCase()}${element.id ? `#${element.id}` : ''}> ${name.trim().replace(/\s+/g, ' ').slice(0, 60)}`,
      tabbable: element.tabIndex >= 0,
      focusVisible: element.matches(':focus-visible'),
      ring: outline || shadow,
      onScreen: box.width > 1 && box.height > 1,
    };
  });
}

async function expectVisibleFocus(page: Page): Promise<FocusState> {
  const state = await focusState(page);
  expect(state, 'something has keyboard focus').not.toBeNull();
  if (state!.tabbable) expect(state!.focusVisible && state!.ring && state!.onScreen, `focus ring shown on ${state!.description}`).toBe(true);
  return state!;
}

const isFocused = (target: Locator) => target.evaluate((element) => element === (globalThis as unknown as PageWindow).document.activeElement);

/** Presses Tab (checking the ring at every stop) until `target` has focus. */
async function tabTo(page: Page, target: Locator, maxPresses = 60): Promise<void> {
  await expect(target).toBeVisible();
  const passed: string[] = [];
  for (let presses = 0; presses < maxPresses; presses += 1) {
    await page.keyboard.press('Tab');
    passed.push((await expectVisibleFocus(page)).description);
    if (await isFocused(target)) return;
  }
  throw new Error(`Tab never reached the target; passed:\n${passed.join('\n')}`);
}

/** Types into the focused field, replacing what was there, as a person selecting it all would. */
async function typeReplacing(page: Page, text: string): Promise<void> {
  await page.keyboard.press('ControlOrMeta+A');
  await page.keyboard.type(text);
}

/** Checks that only make sense on a small touch screen open their own, whichever project runs them. */
async function phonePage(browser: Browser): Promise<Page> {
  const context = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true, baseURL: test.info().project.use.baseURL });
  return context.newPage();
}

async function settled(page: Page, heading: string | RegExp): Promise<void> {
  await expect(page.getByRole('heading', { level: 1, name: heading })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: /^Loading[^.]*…$/ })).toHaveCount(0);
}

test('the skip link is the first Tab stop and moves the keyboard past the menu', { tag: '@phone' }, async ({ page }) => {
  await signIn(page, TOMAS, PASSWORD);
  await page.goto(paths.app.shelf.getHref());
  await settled(page, 'The shelf');

  await page.keyboard.press('Tab');
  const skip = page.getByRole('link', { name: 'Skip to main content' });
  await expect(skip).toBeFocused();
  await expectVisibleFocus(page);
  const box = await skip.boundingBox();
  expect(box && box.width >= MIN_TARGET_PX && box.height >= MIN_TARGET_PX, 'the skip link is shown when focused').toBe(true);

  await page.keyboard.press('Enter');
  await expect(page.locator('main')).toBeFocused();
  await page.keyboard.press('Tab');
  await expectVisibleFocus(page);
  const inPage = await page.evaluate(() => {
    const { document } = globalThis as unknown as PageWindow;
    return document.querySelector('main')!.contains(document.activeElement);
  });
  expect(inPage, 'the next Tab stop is in the page, not the menu').toBe(true);
});

test('the phone menu opens, is walked and closes by keyboard', async ({ browser }) => {
  const page = await phonePage(browser);
  await signIn(page, TOMAS, PASSWORD);
  // A fresh page, so the keyboard starts at the top.
  await page.goto(paths.app.home.getHref());
  await settled(page, 'Welcome, Tomas Reyes');
  const menuButton = page.getByRole('button', { name: 'Menu' });
  await tabTo(page, menuButton);
  await page.keyboard.press('Enter');
  await expect(menuButton).toHaveAttribute('aria-expanded', 'true');
  const nav = page.getByRole('navigation', { name: 'Main' });
  await tabTo(page, nav.getByRole('link', { name: 'Ledger', exact: true }));
  await page.keyboard.press('Escape');
  await expect(menuButton).toHaveAttribute('aria-expanded', 'false');
  await expect(menuButton).toBeFocused();
  await expect(nav).toBeHidden();

  await page.keyboard.press('Enter');
  await tabTo(page, nav.getByRole('link', { name: 'Ledger', exact: true }));
  await page.keyboard.press('Enter');
  await settled(page, 'Ledger');
  await expect(nav).toBeHidden();
  // Folded away again, and marking where the member now is (found by attribute, as the folded menu is hidden).
  await expect(page.locator('nav[aria-label="Main"] a[aria-current="page"]')).toHaveText(['Ledger']);
  await page.context().close();
});

test('a bundle is started by keyboard alone: a photo, its contents, its weight and its offer', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, TOMAS, PASSWORD);
  await page.goto(paths.app.newBundle.getHref());
  await settled(page, 'List a bundle');

  // Photos: the button opens the system's file picker, which the test answers.
  const chooser = page.waitForEvent('filechooser');
  // The button, not the hidden file input it opens (which shares its name and stays out of the Tab order).
  await tabTo(page, page.locator('button', { hasText: 'Choose photos' }));
  await page.keyboard.press('Enter');
  await (await chooser).setFiles({ name: 'scraps.jpg', mimeType: 'image/jpeg', buffer: await jpegPhoto({ rgb: [40, 70, 130] }) });
  await expect(page).toHaveURL((url) => /^\/my-bundles\/[^/]+\/edit$/.test(url.pathname) && url.searchParams.get('step') === 'photos');
  const bundleId = new URL(page.url()).pathname.split('/')[2]!;
  await expect(page.getByRole('region', { name: 'Your photos' }).getByRole('img')).toHaveCount(1);

  await tabTo(page, page.getByRole('button', { name: /^Next: Contents/ }));
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL((url) => url.searchParams.get('step') === 'contents');

  const title = `Blue strips listed by keyboard ${Date.now()}`;
  await tabTo(page, page.getByLabel('Title'));
  await typeReplacing(page, title);
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('Description (optional)')).toBeFocused();
  await page.keyboard.type('Width-of-fabric strips, pressed, every pin taken out.');
  await tabTo(page, page.getByRole('checkbox', { name: 'Strips (by width)' }));
  await page.keyboard.press('Space');
  await expect(page.getByRole('checkbox', { name: 'Strips (by width)' })).toBeChecked();
  await tabTo(page, page.getByLabel('Fibre'));
  await page.keyboard.type('Quilting');
  await expect(page.getByLabel('Fibre')).toHaveValue('quilting_cotton');
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('Colour value')).toBeFocused();
  await page.keyboard.type('Dark');
  await expect(page.getByLabel('Colour value')).toHaveValue('dark');
  await tabTo(page, page.getByRole('checkbox', { name: 'Smoke-free home' }));
  await page.keyboard.press('Space');
  await expect(page.getByRole('checkbox', { name: 'Smoke-free home' })).toBeChecked();

  await tabTo(page, page.getByRole('button', { name: /^Next: Weight/ }));
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL((url) => url.searchParams.get('step') === 'weight');
  await tabTo(page, page.getByLabel('Weight of one pack'));
  await page.keyboard.type('1 lb');
  await expect(page.getByText('Reads as 454 g')).toBeVisible();

  await tabTo(page, page.getByRole('button', { name: /^Next: Offer/ }));
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL((url) => url.searchParams.get('step') === 'offer');
  // Tab enters the group on its first choice; Space chooses it and the arrow keys move the choice.
  const sale = page.getByRole('radio', { name: /^For sale/ });
  const postageOnly = page.getByRole('radio', { name: /^Free, buyer pays postage/ });
  await tabTo(page, sale);
  await page.keyboard.press('Space');
  await expect(sale).toBeChecked();
  await page.keyboard.press('ArrowDown');
  await expect(postageOnly).toBeChecked();
  await expect(page.getByLabel(/^Price for one pack/)).toHaveCount(0);
  await page.keyboard.press('ArrowUp');
  await expect(sale).toBeChecked();
  await expect(sale).toBeFocused();
  await tabTo(page, page.getByLabel(/^Price for one pack/));
  await page.keyboard.type('6.00');
  await tabTo(page, page.getByRole('button', { name: 'Save draft' }));
  await page.keyboard.press('Enter');

  // What was typed reached the draft.
  await expect
    .poll(async () => {
      const response = await page.request.get(`/api/bundles/${bundleId}`);
      return ((await response.json()) as { bundle: Record<string, unknown> }).bundle;
    })
    .toMatchObject({ title, cutKinds: ['strips'], fibre: 'quilting_cotton', disclosures: { smokeFree: true }, weightGrams: 454, offer: 'sale', priceMinor: 600 });
  await expect(page.getByText(/^Draft saved at /)).toBeVisible();
});

test('checkout by keyboard: how it travels, the address, then the pay button', { tag: '@phone' }, async ({ page }) => {
  test.setTimeout(90_000);
  await signIn(page, TOMAS, PASSWORD);
  const shelf = (await (await page.request.get('/api/bundles?offer=sale&pageSize=60')).json()) as {
    items: { id: string; title: string; meetingHandoverOk: boolean; quantityAvailable: number }[];
  };
  const bundle = shelf.items.find((item) => item.meetingHandoverOk && item.quantityAvailable > 0);
  expect(bundle, 'a sale bundle on the demo shelf that may also be collected at a meeting').toBeDefined();

  await page.goto(paths.app.basketAdd.getHref(bundle!.id));
  await settled(page, 'Your basket');
  await expect(page.getByRole('status').filter({ hasText: `“${bundle!.title}” is in your basket` })).toBeVisible();

  const byPost = page.getByRole('radio', { name: 'Post it to me' });
  const atMeeting = page.getByRole('radio', { name: 'Collect it at a guild meeting' });
  const checked = (await byPost.isChecked()) ? byPost : atMeeting;
  await tabTo(page, checked);
  // Arrow keys switch how it travels; each choice brings its own fields.
  if (checked === byPost) await page.keyboard.press('ArrowDown');
  await expect(atMeeting).toBeChecked();
  await expect(page.getByRole('group', { name: 'Which meeting' })).toBeVisible();
  await page.keyboard.press('ArrowUp');
  await expect(byPost).toBeChecked();
  await expect(byPost).toBeFocused();
  await expect(page.getByRole('group', { name: 'Where to post it' })).toBeVisible();

  const address: [string, string][] = [
    ['Name on the parcel', 'Tomas Reyes'],
    ['Street address', '12 Weir Lane'],
    ['Town or city', 'Ferncombe'],
    ['Postal code', '97451'],
  ];
  for (const [label, value] of address) {
    await tabTo(page, page.getByLabel(label, { exact: true }));
    await typeReplacing(page, value);
  }
  const saveAddress = page.getByRole('checkbox', { name: 'Save this address for next time' });
  await tabTo(page, saveAddress);
  if (await saveAddress.isChecked()) await page.keyboard.press('Space');
  await expect(saveAddress).not.toBeChecked();

  // The pay button is offered only against a current postage quote; then Tab reaches it.
  const pay = page.getByRole('button', { name: /^Pay \$\d+\.\d\d by card$/ });
  await expect(pay).toBeEnabled();
  await tabTo(page, pay);
  await expect(pay).toBeFocused();
});

// Desktop only (not tagged @phone): the desktop project's window is 1280 px wide.
test('text at 200 % keeps the shelf readable without sideways scrolling at 1280 px', async ({ page }) => {
  expect(page.viewportSize()?.width).toBe(1280);
  await signIn(page, TOMAS, PASSWORD);
  await page.goto(paths.app.shelf.getHref());
  await settled(page, 'The shelf');
  await expect(page.getByRole('status').filter({ hasText: /^Showing \d+–\d+ of \d+ bundles?$/ })).toBeVisible();

  // Twice the browser's default text size (the app's own base is 112.5 %, 18 px); everything sized in rem follows.
  await page.evaluate(() => {
    (globalThis as unknown as PageWindow).document.documentElement.style.fontSize = '200%';
  });
  await expect
    .poll(() =>
      page.evaluate(() => {
        const { document, getComputedStyle } = globalThis as unknown as PageWindow;
        return parseFloat(getComputedStyle(document.documentElement).fontSize);
      }),
    )
    .toBe(32);
  const overflow = await page.evaluate(() => {
    const { document } = globalThis as unknown as PageWindow;
    const { scrollWidth, clientWidth } = document.documentElement;
    return {
      scrollWidth,
      clientWidth,
      wide: Array.from(document.querySelectorAll('main *'))
        .filter((element) => element.getBoundingClientRect().right > clientWidth + 1)
        .slice(0, 5)
        .map((element) => `${element.tagName.toLowerCase()}.${String(element.className)}`.slice(0, 100)),
    };
  });
  expect(overflow.wide, 'nothing in the page reaches past the right edge').toEqual([]);
  expect(overflow.scrollWidth).toBeLessThanOrEqual(overflow.clientWidth);

  // Still usable: the heading, a filter and a bundle are on the page and the filters still work.
  await expect(page.getByRole('heading', { level: 1, name: 'The shelf' })).toBeVisible();
  await page.getByLabel('Offer', { exact: true }).selectOption('sale');
  await page.getByRole('button', { name: 'Show bundles' }).click();
  await expect(page).toHaveURL((url) => url.searchParams.get('offer') === 'sale');
  await expect(page.getByRole('status').filter({ hasText: /^Showing \d+–\d+ of \d+ bundles?$/ })).toBeVisible();
});

test('on a phone the menu’s links and the main buttons are at least 44 × 44 px', async ({ browser }) => {
  const page = await phonePage(browser);
  await signIn(page, TOMAS, PASSWORD);

  const tooSmall = async (targets: Locator) => {
    const small: string[] = [];
    for (const target of await targets.all()) {
      const box = await target.boundingBox();
      if (!box || box.width < MIN_TARGET_PX || box.height < MIN_TARGET_PX) {
        small.push(`${(await target.textContent())?.trim()}: ${box ? `${Math.round(box.width)} × ${Math.round(box.height)}` : 'not shown'}`);
      }
    }
    return small;
  };

  const menuButton = page.getByRole('button', { name: 'Menu' });
  expect(await tooSmall(menuButton)).toEqual([]);
  await menuButton.click();
  const links = page.getByRole('navigation', { name: 'Main' }).getByRole('link');
  expect(await links.count()).toBeGreaterThan(10);
  expect(await tooSmall(links), 'menu links').toEqual([]);
  await menuButton.click();

  await page.goto(paths.app.shelf.getHref());
  await settled(page, 'The shelf');
  expect(await tooSmall(page.locator('main button:visible')), 'buttons on the shelf').toEqual([]);

  await page.goto(paths.app.newBundle.getHref());
  await settled(page, 'List a bundle');
  expect(await tooSmall(page.locator('main button:visible')), 'buttons on the listing form').toEqual([]);

  await page.goto(paths.app.account.getHref());
  await settled(page, 'Your account');
  expect(await tooSmall(page.locator('main button:visible')), 'buttons on the account page').toEqual([]);
  await page.context().close();
});
