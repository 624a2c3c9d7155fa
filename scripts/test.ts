/**
 * `npm test`: every check the project has, against real local services, ending
 * with one line `N passed, N failed` that CI reads.
 *
 *   npm test                                 typecheck, unit, integration, e2e
 *   npm test -- --only unit,integration      just those suites
 *   npm test -- --skip e2e                   everything but those suites
 *
 * Ports come from SR_PORT_BASE (default 4400), so it runs beside `npm start`.
 * Service logs and the raw test reports go to .local/logs/test-<base>/.
 */
import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { ensureChromium } from './lib/chromium.ts';
import { SetupError } from './lib/errors.ts';
import { describeError, onShutdown, runMain, shutdown } from './lib/lifecycle.ts';
import { colour, failure, formatDuration, heading, note, success, warning } from './lib/log.ts';
import { clearCaughtMail } from './lib/mailcatcher.ts';
import { bin, fromRoot, machineScratchDir, REPO_ROOT } from './lib/paths.ts';
import { portBaseFromEnv, portsFrom, type Ports } from './lib/ports.ts';
import { ensureDatabase, ensurePostgres, stopPostgres } from './lib/postgres.ts';
import { countPlaywright, countVitest, type SuiteCounts } from './lib/reports.ts';
import { runCommand } from './lib/run.ts';
import { startService, type ServiceOptions } from './lib/services.ts';
import {
  apiEnv,
  apiSpec,
  buildApi,
  buildWeb,
  maildevSpec,
  migrate,
  seedDemoGuild,
  stripeFakeSpec,
  testClientEnv,
  urlsFor,
} from './lib/stack.ts';
import { hasScript, workspaceDirs } from './lib/workspaces.ts';

const SUITES = ['typecheck', 'unit', 'integration', 'e2e'] as const;
type Suite = (typeof SUITES)[number];

const DATABASE = 'scrap_relay_test';

interface SuiteResult extends SuiteCounts {
  suite: Suite;
  durationMs: number;
}

function parseSuiteList(raw: string, option: string): Suite[] {
  const names = raw.split(',').map((name) => name.trim()).filter(Boolean);
  for (const name of names) {
    if (!(SUITES as readonly string[]).includes(name)) {
      throw new SetupError(`Unknown suite "${name}" in ${option}; the suites are ${SUITES.join(', ')}.`);
    }
  }
  return names as Suite[];
}

function selectedSuites(argv: string[]): { suites: Suite[]; files: string[] } {
  const { values } = parseArgs({
    args: argv,
    options: { only: { type: 'string' }, skip: { type: 'string' }, files: { type: 'string' }, help: { type: 'boolean', short: 'h' } },
  });
  if (values.help) {
    console.log(
      [
        'npm test [-- --only <suites>] [-- --skip <suites>] [-- --files <filters>]',
        `suites: ${SUITES.join(', ')} (comma-separated; default: all)`,
        'filters: comma-separated parts of test file paths for the vitest suites, e.g. --only integration --files web-app',
        'SR_PORT_BASE=<port> picks the port range (default 4400).',
      ].join('\n'),
    );
    process.exit(0);
  }
  const only = values.only === undefined ? [...SUITES] : parseSuiteList(values.only, '--only');
  const skip = values.skip === undefined ? [] : parseSuiteList(values.skip, '--skip');
  const files = (values.files ?? '').split(',').map((filter) => filter.trim()).filter(Boolean);
  return { suites: SUITES.filter((suite) => only.includes(suite) && !skip.includes(suite)), files };
}

/** Runs one suite, timing it; a suite that throws counts as one failure with the reason noted. */
async function runSuite(suite: Suite, title: string, body: () => Promise<SuiteCounts>): Promise<SuiteResult> {
  heading(title);
  const startedAt = Date.now();
  let counts: SuiteCounts;
  try {
    counts = await body();
  } catch (error) {
    failure(colour.red(describeError(error)));
    counts = { passed: 0, failed: 1, skipped: 0, notes: [`did not run: ${describeError(error).split('\n')[0]}`] };
  }
  const result = { suite, durationMs: Date.now() - startedAt, ...counts };
  const summary = `${suite}: ${result.passed} passed, ${result.failed} failed (${formatDuration(result.durationMs)})`;
  if (result.failed > 0) failure(summary);
  else success(summary);
  return result;
}

async function timedStep<T>(title: string, body: () => Promise<T>): Promise<T> {
  const startedAt = Date.now();
  const value = await body();
  note(`${title} ${colour.dim(`(${formatDuration(Date.now() - startedAt)})`)}`);
  return value;
}

/** One check per TypeScript project: the root (scripts, tests, e2e, bench, migrations) and each workspace. */
async function typecheck(): Promise<SuiteCounts> {
  const projects = [
    { label: 'root', command: bin('tsc'), args: ['--noEmit', '-p', '.'] },
    ...workspaceDirs()
      .filter((dir) => hasScript(dir, 'typecheck'))
      .map((dir) => ({ label: dir, command: 'npm', args: ['run', '--silent', 'typecheck', '--workspace', dir] })),
  ];
  const counts: SuiteCounts = { passed: 0, failed: 0, skipped: 0, notes: [] };
  for (const project of projects) {
    const startedAt = Date.now();
    const result = await runCommand(project.command, project.args);
    const took = colour.dim(`(${formatDuration(Date.now() - startedAt)})`);
    if (result.code === 0) {
      counts.passed += 1;
      note(`${colour.green('✔')} ${project.label} ${took}`);
    } else {
      counts.failed += 1;
      counts.notes.push(`${project.label} has type errors`);
      note(`${colour.red('✘')} ${project.label} ${took}`);
    }
  }
  return counts;
}

/** Runs vitest projects; `files` are parts of test file paths (`--files`), none for every file. */
async function vitest(name: string, projects: string[], reportDir: string, env: NodeJS.ProcessEnv, files: string[]): Promise<SuiteCounts> {
  const reportFile = path.join(reportDir, `${name}.json`);
  fs.rmSync(reportFile, { force: true });
  const args = ['run', ...projects.flatMap((project) => ['--project', project]), ...files];
  // Until every suite has tests, an empty one is reported as "no test files found" rather than as a crash.
  args.push('--passWithNoTests', '--reporter=default', '--reporter=json', `--outputFile.json=${reportFile}`);
  const result = await runCommand(bin('vitest'), args, { env });
  return countVitest(reportFile, result.code);
}

function findJourneys(dir: string): string[] {
  const found: string[] = [];
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory() && entry.name !== 'support' && entry.name !== 'output') found.push(...findJourneys(full));
    else if (entry.isFile() && /\.(spec|test)\.tsx?$/.test(entry.name)) found.push(full);
  }
  return found;
}

interface Services {
  ports: Ports;
  serviceOptions: ServiceOptions;
  uploadRoot: string;
}

/** PostgreSQL and the mail catcher, shared by the integration and end-to-end suites. */
async function startSharedServices(ports: Ports, logDir: string): Promise<Services> {
  const postgres = await timedStep(`PostgreSQL on port ${ports.postgres}`, () => ensurePostgres({ port: ports.postgres, fast: true }));
  if (postgres.startedByUs) onShutdown('PostgreSQL', stopPostgres);
  const serviceOptions: ServiceOptions = {
    logDir,
    echo: false,
    onUnexpectedExit: (service, exit) =>
      warning(`${service.description} stopped during the tests (code ${exit.code ?? exit.signal}); see ${path.relative(REPO_ROOT, service.logFile)}`),
  };
  await timedStep(`mail catcher on ports ${ports.smtp} (SMTP) and ${ports.maildevWeb}`, () => startService(maildevSpec(ports), serviceOptions));
  fs.mkdirSync(machineScratchDir(), { recursive: true });
  const uploadRoot = fs.mkdtempSync(path.join(machineScratchDir(), 'uploads-'));
  onShutdown('the test upload folder', async () => fs.rmSync(uploadRoot, { recursive: true, force: true }));
  return { ports, serviceOptions, uploadRoot };
}

async function integration(services: Services, reportDir: string, files: string[]): Promise<SuiteCounts> {
  const { ports, serviceOptions } = services;
  const urls = urlsFor(ports);
  const databaseUrl = await timedStep(`fresh database ${DATABASE}`, () => ensureDatabase(DATABASE, { recreate: true }));
  const uploadDir = path.join(services.uploadRoot, 'integration');
  fs.mkdirSync(uploadDir);
  // Tests that need Stripe's webhooks listen with the app on PORT (the API's port).
  const env = {
    ...apiEnv({ ports, nodeEnv: 'test', databaseUrl, apiPort: ports.api, appUrl: urls.web, uploadDir }),
    ...testClientEnv(ports),
  };
  await timedStep('migrations', () => migrate(env));
  await clearCaughtMail(urls.maildev);
  const stripeFake = await timedStep(`Stripe stand-in on port ${ports.stripeFake}`, () =>
    startService(stripeFakeSpec(ports, `${urls.api}/api/stripe/webhook`), serviceOptions),
  );
  try {
    return await vitest('integration', ['integration'], reportDir, { ...process.env, ...env }, files);
  } finally {
    await stripeFake.stop();
  }
}

async function endToEnd(services: Services, reportDir: string): Promise<SuiteCounts> {
  const journeys = findJourneys(fromRoot('e2e'));
  if (journeys.length === 0) return { passed: 0, failed: 0, skipped: 0, notes: ['no journeys in e2e/ yet'] };

  const { ports, serviceOptions } = services;
  const urls = urlsFor(ports);
  await timedStep('Chromium', ensureChromium);
  const webDist = await timedStep('vite build of apps/web', () => buildWeb(ports));
  // The journeys run against the API's production build, so a change that breaks the build fails here.
  const apiBuild = await timedStep('production build of apps/api', () => buildApi(ports));
  const databaseUrl = await timedStep(`fresh database ${DATABASE}`, () => ensureDatabase(DATABASE, { recreate: true }));
  const uploadDir = path.join(services.uploadRoot, 'e2e');
  fs.mkdirSync(uploadDir);
  // The API serves the built app on the web port, so the browser sees one origin, as in production.
  const env = {
    ...apiEnv({ ports, nodeEnv: 'test', databaseUrl, apiPort: ports.web, appUrl: urls.web, uploadDir, webDist }),
    ...testClientEnv(ports),
    E2E_BASE_URL: urls.web,
  };
  await timedStep('migrations', () => migrate(env));
  await timedStep('demo guild', () => seedDemoGuild(env));
  await clearCaughtMail(urls.maildev);
  const stripeFake = await timedStep(`Stripe stand-in on port ${ports.stripeFake}`, () =>
    startService(stripeFakeSpec(ports, `${urls.web}/api/stripe/webhook`), serviceOptions),
  );
  try {
    const api = await timedStep(`API serving the built app on port ${ports.web}`, () => startService(apiSpec(env, { compiled: apiBuild }), serviceOptions));
    try {
      const reportFile = path.join(reportDir, 'e2e.json');
      fs.rmSync(reportFile, { force: true });
      const result = await runCommand(process.execPath, [fromRoot('node_modules', '@playwright', 'test', 'cli.js'), 'test', '--reporter=list,json'], {
        env: { ...process.env, ...env, PLAYWRIGHT_JSON_OUTPUT_NAME: reportFile },
      });
      return countPlaywright(reportFile, result.code);
    } finally {
      await api.stop();
    }
  } finally {
    await stripeFake.stop();
  }
}

async function main(): Promise<number> {
  const { suites, files } = selectedSuites(process.argv.slice(2));
  const ports = portsFrom(portBaseFromEnv(4400));
  const logDir = fromRoot('.local', 'logs', `test-${ports.base}`);
  fs.mkdirSync(logDir, { recursive: true });
  const startedAt = Date.now();
  const results: SuiteResult[] = [];
  const wants = (suite: Suite) => suites.includes(suite);

  if (wants('typecheck')) results.push(await runSuite('typecheck', 'Typecheck (one check per TypeScript project)', typecheck));
  if (wants('unit')) {
    results.push(await runSuite('unit', 'Unit tests (vitest projects unit and web)', () => vitest('unit', ['unit', 'web'], logDir, process.env, files)));
  }

  if (wants('integration') || wants('e2e')) {
    heading(`Local services (ports ${ports.base}–${ports.postgres}; logs in ${path.relative(REPO_ROOT, logDir)}/)`);
    let services: Services | undefined;
    let setupError: unknown;
    try {
      services = await startSharedServices(ports, logDir);
    } catch (error) {
      setupError = error;
      failure(colour.red(describeError(error)));
    }
    for (const suite of ['integration', 'e2e'] as const) {
      if (!wants(suite)) continue;
      const title = suite === 'integration' ? 'Integration tests (vitest project integration)' : 'End-to-end journeys (Playwright, Chromium)';
      results.push(
        await runSuite(suite, title, () => {
          if (services === undefined) throw new SetupError(`local services did not start: ${describeError(setupError).split('\n')[0]}`);
          return suite === 'integration' ? integration(services, logDir, files) : endToEnd(services, logDir);
        }),
      );
    }
  }

  heading('Stopping the local services');
  const stopStartedAt = Date.now();
  await shutdown();
  note(`stopped ${colour.dim(`(${formatDuration(Date.now() - stopStartedAt)})`)}`);

  const total = results.reduce(
    (sum, result) => ({ passed: sum.passed + result.passed, failed: sum.failed + result.failed, skipped: sum.skipped + result.skipped }),
    { passed: 0, failed: 0, skipped: 0 },
  );
  heading(`Summary (${formatDuration(Date.now() - startedAt)}; reports and logs in ${path.relative(REPO_ROOT, logDir)}/)`);
  for (const result of results) {
    const counts = `${result.passed} passed, ${result.failed} failed${result.skipped > 0 ? `, ${result.skipped} skipped` : ''}`;
    const mark = result.failed > 0 ? colour.red('✘') : colour.green('✔');
    note(`${mark} ${result.suite.padEnd(12)} ${counts.padEnd(34)} ${colour.dim(formatDuration(result.durationMs))}`);
    for (const text of result.notes) note(`    ${colour.dim(text)}`);
  }
  const skippedSuites = SUITES.filter((suite) => !wants(suite));
  if (skippedSuites.length > 0) note(colour.yellow(`not run (by option): ${skippedSuites.join(', ')}`));
  console.log(`${total.passed} passed, ${total.failed} failed${total.skipped > 0 ? `, ${total.skipped} skipped` : ''}`);
  return total.failed > 0 ? 1 : 0;
}

void runMain(async () => {
  try {
    return await main();
  } catch (error) {
    // Even a run that could not start ends with the line CI reads, and never as a success.
    failure(colour.red(describeError(error)));
    await shutdown();
    console.log('0 passed, 1 failed');
    return 1;
  }
});
