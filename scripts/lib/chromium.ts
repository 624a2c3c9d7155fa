import fs from 'node:fs';
import { SetupError } from './errors.ts';
import { note } from './log.ts';
import { runCommand, tail } from './run.ts';

/** playwright.config.ts launches this browser; Playwright's own download is not available here. */
export const CHROMIUM = '/usr/bin/chromium';

export async function ensureChromium(): Promise<void> {
  if (fs.existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) {
    throw new SetupError(`End-to-end tests need Debian's Chromium at ${CHROMIUM}. Install it, then run this again:\n    sudo apt-get install chromium`);
  }
  note('Chromium is not installed; installing it with apt-get (once)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update'], ['install', '-y', 'chromium']]) {
    const result = await runCommand('apt-get', args, { env, capture: true });
    if (result.code !== 0) throw new SetupError(`apt-get ${args.join(' ')} failed:\n${tail(result.stdout + result.stderr)}`);
  }
  if (!fs.existsSync(CHROMIUM)) throw new SetupError(`apt-get installed chromium, but ${CHROMIUM} is still missing.`);
}
