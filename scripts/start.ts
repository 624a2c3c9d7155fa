/**
 * `npm start`: the whole app on this machine, with the demo guild loaded.
 * PostgreSQL (a cluster of the project's own), migrations, demo data, the mail
 * catcher, the Stripe stand-in, the API and the Vite dev server, in that order;
 * Ctrl-C stops all of them again.
 */
import path from 'node:path';
import { onShutdown, runMain } from './lib/lifecycle.ts';
import { acquireRunLock } from './lib/lock.ts';
import { colour, failure, formatDuration, heading, note } from './lib/log.ts';
import { fromRoot, REPO_ROOT } from './lib/paths.ts';
import { portBaseFromEnv, portsFrom } from './lib/ports.ts';
import { ensureDatabase, ensurePostgres, stopPostgres } from './lib/postgres.ts';
import { describeExit, startService, type RunningService, type ServiceExit } from './lib/services.ts';
import { apiEnv, apiSpec, maildevSpec, migrate, seedDemoGuild, stripeFakeSpec, urlsFor, webDevSpec } from './lib/stack.ts';

const DATABASE = 'scrap_relay';

function table(rows: readonly (readonly string[])[]): string[] {
  const widths = rows[0]!.map((_, column) => Math.max(...rows.map((row) => row[column]!.length)));
  return rows.map((row) => row.map((cell, column) => cell.padEnd(widths[column]!)).join('   ').trimEnd());
}

async function main(): Promise<number> {
  const startedAt = Date.now();
  const ports = portsFrom(portBaseFromEnv(4300));
  const urls = urlsFor(ports);
  const releaseLock = acquireRunLock(`start-${ports.base}`, urls.web, 'scripts/start.ts');
  onShutdown('the run lock', async () => releaseLock());

  heading(`Starting Scrap Relay on ports ${ports.base}–${ports.postgres}`);
  const postgres = await ensurePostgres({ port: ports.postgres, fast: false });
  if (postgres.startedByUs) onShutdown('PostgreSQL', stopPostgres);
  note(postgres.startedByUs ? `PostgreSQL started on port ${ports.postgres}` : `PostgreSQL was already running on port ${ports.postgres}; using it`);

  const databaseUrl = await ensureDatabase(DATABASE, { recreate: false });
  const env = apiEnv({
    ports,
    nodeEnv: 'development',
    databaseUrl,
    apiPort: ports.api,
    appUrl: urls.web,
    uploadDir: fromRoot('.local', 'uploads'),
  });
  await migrate(env);
  note('database migrated');
  await seedDemoGuild(env);
  note('demo guild loaded');

  let serviceDied: (exit: { service: RunningService; exit: ServiceExit }) => void = () => undefined;
  const died = new Promise<{ service: RunningService; exit: ServiceExit }>((resolve) => (serviceDied = resolve));
  const serviceOptions = {
    logDir: fromRoot('.local', 'logs', `start-${ports.base}`),
    echo: true,
    onUnexpectedExit: (service: RunningService, exit: ServiceExit) => serviceDied({ service, exit }),
  };
  await startService(maildevSpec(ports), serviceOptions);
  await startService(stripeFakeSpec(ports, `${urls.api}/api/stripe/webhook`), serviceOptions);
  await startService(apiSpec(env), serviceOptions);
  await startService(webDevSpec(ports), serviceOptions);

  // Imported only now: the seed module belongs to the API and may read its environment when loaded.
  Object.assign(process.env, env);
  const { DEMO_ACCOUNTS } = await import('../apps/api/src/db/seed.ts');

  const lines = [
    '',
    colour.bold(colour.green(`Scrap Relay is running (ready in ${formatDuration(Date.now() - startedAt)}).`)),
    '',
    ...table([
      ['App', colour.bold(urls.web)],
      ['Mail catcher', `${urls.maildev}   every e-mail the app sends lands here`],
      ['API', urls.api],
      ['Stripe stand-in', urls.stripeFake],
      ['PostgreSQL', databaseUrl],
      ['Logs', `${path.relative(REPO_ROOT, serviceOptions.logDir)}/`],
    ]).map((line) => `  ${line}`),
    '',
    'Demo sign-ins:',
    ...table([['role', 'name', 'e-mail', 'password'], ...DEMO_ACCOUNTS.map((a) => [a.role, a.name, a.email, a.password])]).map(
      (line, index) => `  ${index === 0 ? colour.dim(line) : line}`,
    ),
    '',
    colour.bold(
      postgres.startedByUs
        ? 'Ctrl-C stops everything: web app, API, Stripe stand-in, mail catcher and PostgreSQL.'
        : 'Ctrl-C stops everything it started: web app, API, Stripe stand-in and mail catcher (PostgreSQL was already running and stays up).',
    ),
    '',
  ];
  console.log(lines.join('\n'));

  const { service, exit } = await died;
  failure(`${service.description} ${describeExit(exit)}; stopping everything.`);
  console.log(`Last lines of its log (${path.relative(REPO_ROOT, service.logFile)}):\n${service.recentOutput()}`);
  return 1;
}

void runMain(main);
