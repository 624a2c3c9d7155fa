import { defineConfig } from 'vitest/config';

/**
 * Three projects; `npm test` runs unit + web as its unit step and integration
 * against the services it starts (see scripts/test.ts). A path filter works
 * across them: `npx vitest run packages/shared`, `npx vitest run docker-local/stripe-fake`.
 */
/** What a client gets while PostgreSQL restarts: its connection ended, then refused, then "starting up". */
const DATABASE_DOWN = new Set(['57P01', 'ECONNREFUSED', '57P03']);

export default defineConfig({
  test: {
    /*
     * tests/database-restart.test.ts restarts PostgreSQL on purpose: every connection ends with code 57P01, and
     * new ones are refused (ECONNREFUSED, then 57P03 while it starts) until it is back. pg-boss 10.4 marks a
     * finished job complete, or a failed one failed, without handling that call's promise (its src/manager.js), so
     * a job ending in that window leaves one unhandled rejection. The API logs it and carries on (server.ts), and
     * the job runs again once the database is back; only those errors, from pg-boss, are not counted against the run.
     */
    onUnhandledError(error) {
      const { code, stack } = error as { code?: unknown; stack?: unknown };
      if (DATABASE_DOWN.has(String(code)) && String(stack ?? '').includes('pg-boss')) return false;
    },
    projects: [
      {
        test: {
          name: 'unit',
          root: import.meta.dirname,
          environment: 'node',
          include: ['packages/**/src/**/*.test.ts', 'apps/api/src/**/*.unit.test.ts'],
        },
      },
      {
        // The web app's own Vite config brings its plugins and its test include (src/**/*.test.{ts,tsx}).
        extends: './apps/web/vite.config.ts',
        test: {
          name: 'web',
          environment: 'happy-dom',
        },
      },
      {
        test: {
          name: 'integration',
          root: import.meta.dirname,
          environment: 'node',
          include: ['tests/**/*.test.ts', 'docker-local/**/test/**/*.test.ts'],
          // One database, one mail catcher, one Stripe stand-in: files take turns.
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
