import { defineConfig } from 'vitest/config';

/**
 * Three projects; `npm test` runs unit + web as its unit step and integration
 * against the services it starts (see scripts/test.ts). A path filter works
 * across them: `npx vitest run packages/shared`, `npx vitest run docker-local/stripe-fake`.
 */
export default defineConfig({
  test: {
    /*
     * tests/database-restart.test.ts restarts PostgreSQL on purpose, which ends every connection with code 57P01.
     * pg-boss 10.4 marks a finished job complete without handling that call's promise (its src/manager.js), so a
     * job finishing at that moment leaves one unhandled rejection. The API logs it and carries on (server.ts), and
     * the job runs again once it is back; only that error, from pg-boss, is not counted against the run.
     */
    onUnhandledError(error) {
      const { code, stack } = error as { code?: unknown; stack?: unknown };
      if (code === '57P01' && String(stack ?? '').includes('pg-boss')) return false;
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
