import fs from 'node:fs';
import path from 'node:path';
import { SetupError } from './errors.ts';
import { bin, fromRoot, machineScratchDir } from './paths.ts';
import type { Ports } from './ports.ts';
import { runCommand, tail } from './run.ts';
import type { ServiceSpec } from './services.ts';

/**
 * Fixed values for local runs only. Production sets its own; none of these is
 * a secret because nothing outside 127.0.0.1 ever sees them.
 */
export const LOCAL_SESSION_SECRET = 'scrap-relay-local-session-secret-not-for-production';
export const LOCAL_STRIPE_SECRET_KEY = 'sk_test_scrap_relay_local';
export const LOCAL_STRIPE_WEBHOOK_SECRET = 'whsec_scrap_relay_local';
export const LOCAL_MAIL_FROM = 'Scrap Relay <relay@scrap-relay.test>';

export const API_ENTRY = 'apps/api/src/server.ts';
export const MIGRATE_ENTRY = 'apps/api/src/db/migrate.ts';
export const SEED_ENTRY = 'apps/api/src/db/seed.ts';
export const STRIPE_FAKE_ENTRY = 'docker-local/stripe-fake/src/main.ts';
export const WEB_DIR = fromRoot('apps', 'web');

const loopback = (port: number) => `http://127.0.0.1:${port}`;

export function urlsFor(ports: Ports) {
  return {
    web: loopback(ports.web),
    api: loopback(ports.api),
    maildev: loopback(ports.maildevWeb),
    stripeFake: loopback(ports.stripeFake),
  };
}

export interface ApiEnvOptions {
  ports: Ports;
  nodeEnv: 'development' | 'test' | 'production';
  databaseUrl: string;
  /** The port the API listens on: +1 normally, +0 when it serves the built web app. */
  apiPort: number;
  appUrl: string;
  uploadDir: string;
  webDist?: string;
}

/** The environment of docs/LOCAL-SERVICES.md, pointed at the local stand-ins. */
export function apiEnv(options: ApiEnvOptions): Record<string, string> {
  const env: Record<string, string> = {
    NODE_ENV: options.nodeEnv,
    PORT: String(options.apiPort),
    APP_URL: options.appUrl,
    DATABASE_URL: options.databaseUrl,
    SESSION_SECRET: LOCAL_SESSION_SECRET,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(options.ports.smtp),
    MAIL_FROM: LOCAL_MAIL_FROM,
    STRIPE_SECRET_KEY: LOCAL_STRIPE_SECRET_KEY,
    STRIPE_WEBHOOK_SECRET: LOCAL_STRIPE_WEBHOOK_SECRET,
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(options.ports.stripeFake),
    STRIPE_API_PROTOCOL: 'http',
    UPLOAD_DIR: options.uploadDir,
  };
  if (options.webDist !== undefined) env.WEB_DIST = options.webDist;
  return env;
}

/** What integration and end-to-end tests read on top of the API's environment. */
export function testClientEnv(ports: Ports): Record<string, string> {
  const urls = urlsFor(ports);
  return { MAILDEV_URL: urls.maildev, STRIPE_FAKE_URL: urls.stripeFake, SR_PORT_BASE: String(ports.base) };
}

function requireEntry(relativePath: string, owner: string): void {
  if (!fs.existsSync(fromRoot(relativePath))) {
    throw new SetupError(`${relativePath} does not exist yet (${owner}); this step cannot run without it.`);
  }
}

export function maildevSpec(ports: Ports): ServiceSpec {
  return {
    name: 'mail',
    description: 'maildev mail catcher',
    command: bin('maildev'),
    args: ['--ip', '127.0.0.1', '--smtp', String(ports.smtp), '--web-ip', '127.0.0.1', '--web', String(ports.maildevWeb)],
    env: process.env,
    ports: [
      { port: ports.smtp, role: 'SMTP' },
      { port: ports.maildevWeb, role: 'web UI and REST API' },
    ],
    readyUrl: `${loopback(ports.maildevWeb)}/api/healthz`,
  };
}

export function stripeFakeSpec(ports: Ports, webhookUrl: string): ServiceSpec {
  requireEntry(STRIPE_FAKE_ENTRY, 'the Stripe stand-in');
  return {
    name: 'stripe',
    description: 'Stripe stand-in',
    command: bin('tsx'),
    args: [STRIPE_FAKE_ENTRY],
    env: {
      ...process.env,
      STRIPE_FAKE_PORT: String(ports.stripeFake),
      STRIPE_FAKE_PUBLIC_URL: loopback(ports.stripeFake),
      STRIPE_FAKE_WEBHOOK_URL: webhookUrl,
      STRIPE_WEBHOOK_SECRET: LOCAL_STRIPE_WEBHOOK_SECRET,
    },
    ports: [{ port: ports.stripeFake, role: 'HTTP' }],
    readyUrl: `${loopback(ports.stripeFake)}/_control/health`,
  };
}

/** Node flags of the production API, as README's "Running it for a real guild" gives them: a heap at most 1.6 × what is live. */
export const PRODUCTION_NODE_FLAGS = ['--heap-growing-percent=60'];

/**
 * The API as a service: from its TypeScript source through tsx, or, given `compiled` (from `buildApi`),
 * the production build under plain Node with PRODUCTION_NODE_FLAGS (also when SR_API_BUILD names one, as
 * `npm run bench` does for every module). SR_API_CPU_PROFILE=<folder> makes the API write a V8 CPU profile
 * there when it stops (open it in Chrome's DevTools); SR_API_NODE_FLAGS passes more flags to Node
 * (for example `--trace-gc`) when trying out the production build.
 */
export function apiSpec(env: Record<string, string>, options: { compiled?: string } = {}): ServiceSpec {
  requireEntry(API_ENTRY, 'the API');
  const port = Number(env.PORT);
  const compiled = options.compiled ?? process.env.SR_API_BUILD;
  const profile = process.env.SR_API_CPU_PROFILE ? ['--cpu-prof', '--cpu-prof-dir', process.env.SR_API_CPU_PROFILE] : [];
  const flags = compiled === undefined ? [] : [...PRODUCTION_NODE_FLAGS, ...(process.env.SR_API_NODE_FLAGS ?? '').split(/\s+/).filter(Boolean)];
  const source = env.WEB_DIST === undefined ? 'API' : 'API (serving the built web app)';
  return {
    name: 'api',
    description: compiled === undefined ? source : `${source}, production build`,
    command: compiled === undefined ? bin('tsx') : process.execPath,
    args: [...profile, ...flags, compiled ?? API_ENTRY],
    env: { ...process.env, ...env },
    ports: [{ port, role: 'HTTP' }],
    readyUrl: `${loopback(port)}/api/health`,
  };
}

export function webDevSpec(ports: Ports): ServiceSpec {
  return {
    name: 'web',
    description: 'web app (Vite dev server)',
    command: bin('vite'),
    // Vite allows one dev server per project; our own lock is per port range, so
    // `npm start` on another SR_PORT_BASE (another developer on this checkout) may run beside it.
    args: ['--port', String(ports.web), '--strictPort', '--host', '127.0.0.1', '--bypass-lock'],
    cwd: WEB_DIR,
    // The web app's vite.config.ts proxies /api to this port.
    env: { ...process.env, SR_API_PORT: String(ports.api), NODE_ENV: 'development' },
    ports: [{ port: ports.web, role: 'HTTP' }],
    readyUrl: `${loopback(ports.web)}/`,
  };
}

async function runEntry(entry: string, args: string[], env: Record<string, string>, what: string): Promise<void> {
  requireEntry(entry, 'the API');
  const result = await runCommand(bin('tsx'), [entry, ...args], { env: { ...process.env, ...env }, capture: true });
  if (result.code !== 0) {
    throw new SetupError(`${what} failed (exit ${result.code}):\n${tail(result.stdout + result.stderr, 30)}`);
  }
}

export function migrate(env: Record<string, string>): Promise<void> {
  return runEntry(MIGRATE_ENTRY, ['up'], env, 'Migrating the database');
}

export function seedDemoGuild(env: Record<string, string>): Promise<void> {
  return runEntry(SEED_ENTRY, [], env, 'Loading the demo guild');
}

/**
 * Builds the API for production (apps/api/build.ts) into this port range's own folder under .local/, so runs
 * on other port ranges never replace it under a running server. Inside the checkout, so the packages it
 * leaves out resolve from node_modules. Returns the file to run with node.
 */
export async function buildApi(ports: Ports): Promise<string> {
  const outFile = fromRoot('.local', 'builds', `api-${ports.base}`, 'server.js');
  const result = await runCommand(bin('tsx'), [fromRoot('apps', 'api', 'build.ts'), outFile], { capture: true });
  if (result.code !== 0) throw new SetupError(`Building the API failed (exit ${result.code}):\n${tail(result.stdout + result.stderr, 30)}`);
  return outFile;
}

/**
 * Builds apps/web for the API to serve in end-to-end tests, into a folder of
 * this port range's own rather than apps/web/dist: a run on another port range
 * in the same checkout would otherwise empty the folder under a running test.
 * It lives in the scratch folder, not in .local/, because Express's sendFile
 * refuses any path with a dot-folder in it. Returns the folder.
 */
export async function buildWeb(ports: Ports): Promise<string> {
  const outDir = path.join(machineScratchDir(), `web-dist-${ports.base}`);
  const env: NodeJS.ProcessEnv = { ...process.env, SR_API_PORT: String(ports.api) };
  // A production build must not inherit NODE_ENV=test or development from a parent.
  delete env.NODE_ENV;
  // --bypass-lock: Vite allows one build per project at a time; builds for different port ranges have separate output folders.
  const result = await runCommand(bin('vite'), ['build', '--outDir', outDir, '--emptyOutDir', '--bypass-lock'], { cwd: WEB_DIR, env, capture: true });
  if (result.code !== 0) throw new SetupError(`vite build of apps/web failed (exit ${result.code}):\n${tail(result.stdout + result.stderr, 30)}`);
  if (!fs.existsSync(path.join(outDir, 'index.html'))) {
    throw new SetupError(`vite build finished but ${outDir}/index.html is missing.`);
  }
  return outDir;
}
