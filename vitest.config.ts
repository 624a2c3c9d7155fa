import { defineConfig } from 'vitest/config';

/**
 * Three projects; `npm test` runs unit + web as its unit step and integration
 * against the services it starts (see scripts/test.ts). A path filter works
 * across them: `npx vitest run packages/shared`, `npx vitest run docker-local/stripe-fake`.
 */
export default defineConfig({
  test: {
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
