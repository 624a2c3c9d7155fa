import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { emptyBasketOf, screenshot, signIn } from './support/index.ts';

/**
 * Each demo account (from the demo guild seed) signs in and sees the menu its
 * abilities allow, in its sections: the exchange for every member (starter
 * bundles only for new quilters and librarians), the guild office for the
 * officer pages each role runs, and the member's own pages.
 */

const PASSWORD = 'quilt-relay-demo';
const GUILD = 'Ferncombe Patchwork Guild';

type MenuSection = 'Exchange' | 'Guild office' | 'You';

interface DemoAccount {
  who: string;
  name: string;
  email: string;
  /** Every section the menu shows, with its links in order; a section left out must not appear. */
  menu: Partial<Record<MenuSection, string[]>>;
  notInMenu: string[];
  roles: string;
  newQuilter: boolean;
}

/** Every verified member: list, buy, wish, meet (abilities listBundles and buy; the rest are open to all). */
const EXCHANGE = ['Home', 'Shelf', 'Wishes', 'List a bundle', 'My bundles', 'Basket', 'Orders', 'Meetings', 'Dashboard'];
/** The same with "Starter bundles" after Orders (claimStarter or runStarterProgramme). */
const EXCHANGE_WITH_STARTER = [...EXCHANGE.slice(0, 7), 'Starter bundles', ...EXCHANGE.slice(7)];
const YOU = ['Profile', 'Account'];
const LIBRARIAN_PAGES = ['Review queue', 'Waiting list', 'Librarian report'];
const TREASURER_PAGES = ['Statement', 'Ledger', 'Seller balances'];
const ADMIN_PAGES = ['Guild settings', 'Postage table'];

const accounts: DemoAccount[] = [
  {
    // manageMembers and manageSettings; not a librarian or treasurer.
    who: 'admin',
    name: 'Ada Whitlock',
    email: 'ada@ferncombe-quilters.example',
    menu: { Exchange: EXCHANGE, 'Guild office': ['Members', ...ADMIN_PAGES], You: YOU },
    notInMenu: ['Starter bundles', ...LIBRARIAN_PAGES, ...TREASURER_PAGES],
    roles: 'Member and Admin',
    newQuilter: false,
  },
  {
    // reviewBundles, runStarterProgramme, and manageMembers (librarians see the member list to flag new quilters).
    who: 'librarian',
    name: 'Lena Marsh',
    email: 'lena@ferncombe-quilters.example',
    menu: { Exchange: EXCHANGE_WITH_STARTER, 'Guild office': [...LIBRARIAN_PAGES, 'Members'], You: YOU },
    notInMenu: [...TREASURER_PAGES, ...ADMIN_PAGES],
    roles: 'Member and Librarian',
    newQuilter: false,
  },
  {
    // viewLedger only.
    who: 'treasurer',
    name: 'Tomas Reyes',
    email: 'tomas@ferncombe-quilters.example',
    menu: { Exchange: EXCHANGE, 'Guild office': TREASURER_PAGES, You: YOU },
    notInMenu: ['Starter bundles', ...LIBRARIAN_PAGES, 'Members', ...ADMIN_PAGES],
    roles: 'Member and Treasurer',
    newQuilter: false,
  },
  {
    // claimStarter: joined within the guild's newcomer window.
    who: 'new quilter',
    name: 'Nell Ashby',
    email: 'nell@ferncombe-quilters.example',
    menu: { Exchange: EXCHANGE_WITH_STARTER, You: YOU },
    notInMenu: [...LIBRARIAN_PAGES, ...TREASURER_PAGES, 'Members', ...ADMIN_PAGES],
    roles: 'Member',
    newQuilter: true,
  },
  {
    who: 'member',
    name: 'Ruth Okafor',
    email: 'ruth@ferncombe-quilters.example',
    menu: { Exchange: EXCHANGE, You: YOU },
    notInMenu: ['Starter bundles', ...LIBRARIAN_PAGES, ...TREASURER_PAGES, 'Members', ...ADMIN_PAGES],
    roles: 'Member',
    newQuilter: false,
  },
  {
    who: 'member',
    name: 'Gus Pennyworth',
    email: 'gus@ferncombe-quilters.example',
    menu: { Exchange: EXCHANGE, You: YOU },
    notInMenu: ['Starter bundles', ...LIBRARIAN_PAGES, ...TREASURER_PAGES, 'Members', ...ADMIN_PAGES],
    roles: 'Member',
    newQuilter: false,
  },
];

const SECTIONS: MenuSection[] = ['Exchange', 'Guild office', 'You'];

/** The main menu, opened first on a phone where it folds behind the Menu button. */
async function mainMenu(page: Page) {
  const menuButton = page.getByRole('button', { name: 'Menu' });
  if (await menuButton.isVisible()) {
    await menuButton.click();
    await expect(menuButton).toHaveAttribute('aria-expanded', 'true');
  }
  const nav = page.getByRole('navigation', { name: 'Main' });
  await expect(nav).toBeVisible();
  return nav;
}

for (const account of accounts) {
  test(`${account.who} ${account.name} signs in and sees the menu for their roles`, { tag: '@phone' }, async ({ page, browser }) => {
    // An empty basket, so the menu's Basket carries no count from an earlier journey.
    await emptyBasketOf(browser, account.email);
    await signIn(page, account.email, PASSWORD);

    await expect(page).toHaveURL((url) => url.pathname === paths.app.home.path);
    await expect(page.getByRole('heading', { level: 1, name: `Welcome, ${account.name}` })).toBeVisible();
    await expect(page.getByRole('banner')).toContainText(GUILD);

    const details = page.getByRole('region', { name: 'Your details' });
    await expect(details).toContainText(account.roles);
    await expect(details).toContainText(account.newQuilter ? 'Yes: you may claim starter bundles' : 'No: starter bundles are kept for new quilters');
    await expect(page.getByRole('region', { name: 'Guild safety notes' })).toContainText('Remove every pin and needle');

    const nav = await mainMenu(page);
    for (const section of SECTIONS) {
      const list = nav.getByRole('list', { name: section, exact: true });
      const links = account.menu[section];
      if (links === undefined) {
        await expect(list).toHaveCount(0);
        continue;
      }
      await expect(nav.getByText(section, { exact: true })).toBeVisible();
      await expect(list.getByRole('link')).toHaveText(links);
    }
    await expect(nav.getByRole('link')).toHaveCount(Object.values(account.menu).flat().length);
    for (const label of account.notInMenu) {
      await expect(nav.getByRole('link', { name: label, exact: true })).toHaveCount(0);
    }
    // The page being shown is marked in the menu, and only that one.
    await expect(nav.locator('[aria-current="page"]')).toHaveText(['Home']);
    await screenshot(page, `home-${account.who}-${account.name}`);
  });
}

test('an officer page asked for while signed out opens after signing in', { tag: '@phone' }, async ({ page }) => {
  await page.goto(paths.app.members.getHref());
  await expect(page).toHaveURL((url) => url.pathname === paths.auth.signIn.path && url.searchParams.get('redirectTo') === paths.app.members.path);

  await page.getByRole('textbox', { name: /e-?mail/i }).fill('lena@ferncombe-quilters.example');
  await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
  await page.getByRole('button', { name: /^sign in$/i }).click();

  await expect(page).toHaveURL((url) => url.pathname === paths.app.members.path);
  await expect(page.getByRole('heading', { level: 1, name: 'Members' })).toBeVisible();
  await expect(page.getByText(/^Showing 1–\d+ of \d+ members$/)).toBeVisible();
  await screenshot(page, 'members-librarian');
});

test('a member who opens an admin page is told it is not for their account', async ({ page }) => {
  await signIn(page, 'ruth@ferncombe-quilters.example', PASSWORD);
  await page.goto(paths.app.guildSettings.getHref());
  await expect(page.getByRole('heading', { level: 1, name: 'Not available for your account' })).toBeVisible();
  await screenshot(page, 'not-available-member');
});

test('a wrong e-mail or password is refused with a general message', async ({ page }) => {
  await page.goto(paths.auth.signIn.getHref());
  // An address with no account: failed attempts count against an account, and the demo accounts must stay usable.
  await page.getByRole('textbox', { name: /e-?mail/i }).fill('nobody@ferncombe-quilters.example');
  await page.getByLabel('Password', { exact: true }).fill('not-the-password');
  await page.getByRole('button', { name: /^sign in$/i }).click();
  await expect(page.getByRole('alert')).toContainText(/not right/i);
  await expect(page).toHaveURL((url) => url.pathname === paths.auth.signIn.path);
  await screenshot(page, 'sign-in-refused');
});
