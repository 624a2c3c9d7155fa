import { defineConfig } from '@playwright/test';

/**
 * End-to-end journeys (e2e/*.spec.ts) against the built app that `npm test`
 * serves from the API (E2E_BASE_URL). Two projects: `desktop` runs every
 * journey at 1280×800; `phone` (390×844, touch) runs only the tests tagged
 * `@phone`, e.g. `test('claims a starter bundle', { tag: '@phone' }, …)`, so a
 * journey opts into the small screen instead of doubling every run.
 */
const baseURL = process.env.E2E_BASE_URL;
if (!baseURL) {
  throw new Error('E2E_BASE_URL is not set: run the journeys with `npm test -- --only e2e`, which starts the app and its services.');
}

export default defineConfig({
  testDir: 'e2e',
  testIgnore: ['support/**', 'output/**'],
  // Playwright empties this folder when a run starts, so each port range (each concurrent `npm test`) has its own.
  outputDir: `e2e/output/test-results-${new URL(baseURL).port}`,
  // One app, one database: journeys take turns.
  workers: 1,
  fullyParallel: false,
  retries: 0,
  forbidOnly: Boolean(process.env.CI),
  timeout: 60_000,
  expect: { timeout: 10_000 },
  use: {
    baseURL,
    browserName: 'chromium',
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
    launchOptions: {
      // Debian's Chromium; Playwright's own browser download is not available on these machines.
      executablePath: '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
  projects: [
    { name: 'desktop', use: { viewport: { width: 1280, height: 800 } } },
    { name: 'phone', grep: /@phone/, use: { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true } },
  ],
});
