import { expect, test, type Page } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths.ts';
import { screenshot, signIn } from './support/index.ts';

/**
 * The treasurer's view of what the exchange has done: Tomas opens the dashboard,
 * looks at all time, checks that every chart can be read as a table, downloads
 * nothing but sees the CSV link carries the same period, then opens the month-end
 * statement and prints it. Runs at desktop and phone widths.
 */

const TOMAS = { name: 'Tomas Reyes', email: 'tomas@ferncombe-quilters.example' };
const PASSWORD = 'quilt-relay-demo';
const CHARTS = ['Weight rehomed per month', 'Time to review a listing', 'On the shelf by colour value', 'On the shelf by cut'];

async function openFromMenu(page: Page, label: string) {
  const menuButton = page.getByRole('button', { name: 'Menu' });
  if (await menuButton.isVisible()) await menuButton.click();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label, exact: true }).click();
}

test('the treasurer reads the dashboard, every chart as a table too, and the month-end statement', { tag: '@phone' }, async ({ page }) => {
  await signIn(page, TOMAS.email, PASSWORD);

  await openFromMenu(page, 'Dashboard');
  await expect(page.getByRole('heading', { level: 1, name: 'Dashboard' })).toBeVisible();
  await page.getByLabel('Period').selectOption({ label: 'All time' });
  await expect(page).toHaveURL((url) => url.pathname === paths.app.dashboard.path && url.searchParams.get('period') === 'all');

  const figures = page.getByRole('region', { name: 'All time' });
  for (const term of ['Weight rehomed', 'Bundles rehomed', 'New quilters served', 'Waiting for review', 'Median review time', 'Bundles expired']) {
    await expect(figures.getByText(term, { exact: true })).toBeVisible();
  }
  // The treasurer sees the money; members do not (the API leaves it out for them).
  for (const term of ['Funds raised', 'Guild fees', 'Card costs', 'Credited to sellers', 'Paid out to sellers', 'Postage paid by buyers', 'Refunds']) {
    await expect(figures.getByText(term, { exact: true })).toBeVisible();
  }
  await expect(figures.getByText(/^\$\d/).first()).toBeVisible();
  await expect(page.getByRole('link', { name: 'Download CSV' })).toHaveAttribute('href', '/api/dashboard.csv?period=all');

  // Every chart is a captioned figure with a spoken summary, drawn by the lazily loaded chart module.
  const figureOf = (title: string) => page.getByRole('figure', { name: title });
  for (const title of CHARTS) {
    await expect(figureOf(title).getByRole('img', { name: new RegExp(`^${title}\\. `) })).toBeVisible();
    await expect(figureOf(title).locator('svg.recharts-surface').first()).toBeVisible();
  }
  await screenshot(page, 'dashboard-charts');

  // ... and each has its table alternative, with the same numbers in words and figures.
  for (const title of CHARTS) {
    const figure = figureOf(title);
    await figure.getByRole('button', { name: 'Show as table' }).click();
    const table = figure.getByRole('table');
    await expect(table).toBeVisible();
    await expect(table.getByRole('row').nth(1)).toBeVisible();
    await expect(figure.getByRole('button', { name: 'Show as chart' })).toHaveAttribute('aria-pressed', 'true');
  }
  await expect(figureOf('Weight rehomed per month').getByRole('columnheader', { name: 'Starter bundle' })).toBeVisible();
  await expect(figureOf('Weight rehomed per month').getByRole('row')).toHaveCount(13);
  await screenshot(page, 'dashboard-tables');
  for (const title of CHARTS) await figureOf(title).getByRole('button', { name: 'Show as chart' }).click();

  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden();
  // On paper the charts stay and the screen switches go.
  for (const title of CHARTS) {
    await expect(figureOf(title).locator('svg.recharts-surface').first()).toBeVisible();
    await expect(figureOf(title).locator('button')).toBeHidden();
  }
  await screenshot(page, 'dashboard-print');
  await page.emulateMedia({ media: 'screen' });

  // The month-end statement for this month (the ledger's months are UTC).
  await openFromMenu(page, 'Statement');
  const month = new Date().toISOString().slice(0, 7);
  const monthName = new Intl.DateTimeFormat('en', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${month}-01T00:00:00Z`));
  await expect(page.getByRole('heading', { level: 1, name: 'Month-end statement' })).toBeVisible();
  const statement = page.getByRole('region', { name: `Statement for ${monthName}` });
  for (const line of ['Card payments received', 'Refunds to buyers', 'Guild fees kept', 'Card processing cost', 'Credited to sellers', 'Paid out to sellers']) {
    await expect(statement.getByRole('rowheader', { name: new RegExp(`^${line}`) })).toBeVisible();
  }
  await expect(page.getByRole('region', { name: `What the guild owes sellers at the end of ${monthName}` })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Download CSV' })).toHaveAttribute('href', `/api/reports/statement.csv?month=${month}`);
  const csv = await page.request.get(`/api/reports/statement.csv?month=${month}`);
  expect(csv.ok()).toBe(true);
  expect(await csv.text()).toContain('closing_balances_total');
  await screenshot(page, 'statement');
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden();
  await screenshot(page, 'statement-print');
});
