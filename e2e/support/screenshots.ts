import path from 'node:path';
import { test, type Page } from '@playwright/test';

export const SCREENSHOT_DIR = path.resolve(import.meta.dirname, '..', 'output', 'screenshots');

/**
 * Saves a full-page screenshot as e2e/output/screenshots/<project>-<name>.png
 * (the project keeps desktop and phone shots apart) and returns its path.
 */
export async function screenshot(page: Page, name: string): Promise<string> {
  const safeName = name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '');
  const file = path.join(SCREENSHOT_DIR, `${test.info().project.name}-${safeName}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
