import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { screenshot, signIn } from './support/index.ts';

/**
 * Each demo account (from the demo guild seed) signs in and sees the menu its
 * abilities allow: officer pages only for the officers who run them. Entries
 * other features add later (shelf, ledger, …) are checked by their own journeys;
 * this one pins the foundation's pages.
 */

const PASSWORD = 'quilt-relay-demo';
const GUILD = 'Ferncombe Patchwork Guild';

interface DemoAccount {
  who: string;
  name: string;
  email: string;
  menu: string[];
  notInMenu: string[];
  roles: string;
  newQuilter: boolean;
}

const accounts: DemoAccount[] = [
  {
    who: 'admin',
    name: 'Ada Whitlock',
    email: 'ada@ferncombe-quilters.example',
    menu: ['Home', 'Members', 'Guild settings', 'Account'],
    notInMenu: [],
    roles: 'Member and Admin',
    newQuilter: false,
  },
  {
    // Librarians see the member list to flag new quilters; guild settings stay with admins.
    who: 'librarian',
    name: 'Lena Marsh',
    email: 'lena@ferncombe-quilters.example',
    menu: ['Home', 'Members', 'Account'],
    notInMenu: ['Guild settings'],
    roles: 'Member and Librarian',
    newQuilter: false,
  },
  {
    who: 'treasurer',
    name: 'Tomas Reyes',
    email: 'tomas@ferncombe-quilters.example',
    menu: ['Home', 'Account'],
    notInMenu: ['Members', 'Guild settings'],
    roles: 'Member and Treasurer',
    newQuilter: false,
  },
  {
    who: 'new quilter',
    name: 'Nell Ashby',
    email: 'nell@ferncombe-quilters.example',
    menu: ['Home', 'Account'],
    notInMenu: ['Members', 'Guild settings'],
    roles: 'Member',
    newQuilter: true,
  },
  {
    who: 'member',
    name: 'Ruth Okafor',
    email: 'ruth@ferncombe-quilters.example',
    menu: ['Home', 'Account'],
    notInMenu: ['Members', 'Guild settings'],
    roles: 'Member',
    newQuilter: false,
  },
  {
    who: 'member',
    name: 'Gus Pennyworth',
    email: 'gus@ferncombe-quilters.example',
    menu: ['Home', 'Account'],
    notInMenu: ['Members', 'Guild settings'],
    roles: 'Member',
    newQuilter: false,
  },
];

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
  test(`${account.who} ${account.name} signs in and sees the menu for their roles`, { tag: '@phone' }, async ({ page }) => {
    await signIn(page, account.email, PASSWORD);

    await expect(page).toHaveURL((url) => url.pathname === paths.app.home.path);
    await expect(page.getByRole('heading', { level: 1, name: `Welcome, ${account.name}` })).toBeVisible();
    await expect(page.getByRole('banner')).toContainText(GUILD);

    const details = page.getByRole('region', { name: 'Your details' });
    await expect(details).toContainText(account.roles);
    await expect(details).toContainText(account.newQuilter ? 'Yes: you may claim starter bundles' : 'No: starter bundles are kept for new quilters');
    await expect(page.getByRole('region', { name: 'Guild safety notes' })).toContainText('Remove every pin and needle');

    const nav = await mainMenu(page);
    await expect(nav.getByRole('link')).toHaveText(account.menu);
    for (const label of account.notInMenu) {
      await expect(nav.getByRole('link', { name: label, exact: true })).toHaveCount(0);
    }
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
