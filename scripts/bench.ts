/**
 * `npm run bench`: sets up the local services like `npm test` does (own
 * database scrap_relay_bench, migrated, demo guild loaded), then runs every
 * bench/*.bench.ts module in file-name order and prints what it measures.
 * It reports figures and never judges them.
 *
 *   npm run bench                  every module
 *   npm run bench -- domain        modules whose file name contains "domain"
 *
 * Ports come from SR_PORT_BASE (default 4900); logs go to .local/logs/bench-<base>/.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { formatFigures, type BenchContext, type BenchModule } from '../bench/lib/context.ts';
import { SetupError } from './lib/errors.ts';
import { describeError, onShutdown, runMain } from './lib/lifecycle.ts';
import { colour, failure, formatDuration, heading, note, success } from './lib/log.ts';
import { fromRoot, machineScratchDir } from './lib/paths.ts';
import { portBaseFromEnv, portsFrom } from './lib/ports.ts';
import { ensureDatabase, ensurePostgres, stopPostgres } from './lib/postgres.ts';
import { startService, type ServiceOptions } from './lib/services.ts';
import { apiEnv, buildApi, maildevSpec, migrate, seedDemoGuild, stripeFakeSpec, testClientEnv, urlsFor } from './lib/stack.ts';

const DATABASE = 'scrap_relay_bench';

async function main(): Promise<number> {
  const filters = process.argv.slice(2).filter((arg) => !arg.startsWith('-'));
  const benchDir = fromRoot('bench');
  const modules = fs
    .readdirSync(benchDir)
    .filter((file) => file.endsWith('.bench.ts'))
    .filter((file) => filters.length === 0 || filters.some((filter) => file.includes(filter)))
    .sort();
  if (modules.length === 0) throw new SetupError(`No bench/*.bench.ts module matches ${filters.join(', ') || 'anything'}.`);

  const ports = portsFrom(portBaseFromEnv(4900));
  const urls = urlsFor(ports);
  const logDir = fromRoot('.local', 'logs', `bench-${ports.base}`);
  heading(`Local services (ports ${ports.base}–${ports.postgres}; logs in .local/logs/bench-${ports.base}/)`);
  // Durable settings (fsync on), unlike the test cluster: database figures should resemble a real server's.
  const postgres = await ensurePostgres({ port: ports.postgres, fast: false });
  if (postgres.startedByUs) onShutdown('PostgreSQL', stopPostgres);
  const databaseUrl = await ensureDatabase(DATABASE, { recreate: true });
  fs.mkdirSync(machineScratchDir(), { recursive: true });
  const uploadDir = fs.mkdtempSync(path.join(machineScratchDir(), 'bench-uploads-'));
  onShutdown('the bench upload folder', async () => fs.rmSync(uploadDir, { recursive: true, force: true }));
  const env = {
    ...apiEnv({ ports, nodeEnv: 'production', databaseUrl, apiPort: ports.api, appUrl: urls.web, uploadDir }),
    ...testClientEnv(ports),
  };
  await migrate(env);
  await seedDemoGuild(env);
  // Every module measures the API as production runs it: the build of apps/api/build.ts under plain Node.
  process.env.SR_API_BUILD = await buildApi(ports);
  const serviceOptions: ServiceOptions = { logDir, echo: false };
  await startService(maildevSpec(ports), serviceOptions);
  await startService(stripeFakeSpec(ports, `${urls.api}/api/stripe/webhook`), serviceOptions);
  note(`PostgreSQL ${ports.postgres}, maildev ${ports.maildevWeb}, Stripe stand-in ${ports.stripeFake}; database ${DATABASE} migrated, demo guild loaded; API built (production build under plain Node)`);

  const context: BenchContext = {
    ports,
    env,
    databaseUrl,
    urls,
    logDir,
    print: (label, figures) => console.log(formatFigures(label, figures)),
  };

  heading(`Machine: ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'unknown CPU'}, Node ${process.versions.node}`);
  let crashed = 0;
  for (const file of modules) {
    heading(file);
    const startedAt = Date.now();
    try {
      const module = (await import(pathToFileURL(path.join(benchDir, file)).href)) as Partial<BenchModule>;
      if (typeof module.run !== 'function') throw new SetupError(`${file} does not export \`async function run(ctx)\`.`);
      await module.run(context);
      success(colour.dim(`${file} (${formatDuration(Date.now() - startedAt)})`));
    } catch (error) {
      crashed += 1;
      failure(`${file} did not finish: ${describeError(error)}`);
    }
  }
  return crashed > 0 ? 1 : 0;
}

void runMain(main);
