import { expect, type Page } from '@playwright/test';
import { paths } from '../../apps/web/src/config/paths.ts';

/**
 * Signs in through the sign-in page as a person would, and waits until the
 * app has moved on from it. Expects the form's accessible names "E-mail",
 * "Password" and the button "Sign in".
 */
export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(paths.auth.signIn.getHref());
  await page.getByRole('textbox', { name: /e-?mail/i }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: /^sign in$/i }).click();
  await expect(page).not.toHaveURL((url) => url.pathname === paths.auth.signIn.path);
}
