import fs from 'node:fs';
import { SetupError } from './errors.ts';
import { note } from './log.ts';
import { aptInstall } from './apt.ts';

/** playwright.config.ts launches this browser; Playwright's own download is not available here. */
export const CHROMIUM = '/usr/bin/chromium';

export async function ensureChromium(): Promise<void> {
  if (fs.existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) {
    throw new SetupError(`End-to-end tests need Debian's Chromium at ${CHROMIUM}. Install it, then run this again:\n    sudo apt-get install chromium`);
  }
  note('Chromium is not installed; installing it with apt-get (once)…');
  await aptInstall('chromium');
  if (!fs.existsSync(CHROMIUM)) throw new SetupError(`apt-get installed chromium, but ${CHROMIUM} is still missing.`);
}
