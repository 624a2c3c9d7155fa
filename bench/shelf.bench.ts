/**
 * The shelf under load: 100 000 invented bundles on the shelf, the real API in
 * its own process, signed in as a member, GET /api/bundles for several filter
 * mixes at 20 connections. Each mix is compared with a bare Express route
 * serving a page of the same size, measured in the same run. A page asked for
 * again is served from its kept copy (apps/api/src/modules/bundles/shelf-pages.ts),
 * so the mixes then run again on an API with kept pages turned off, each followed by
 * PostgreSQL's plan for the statement that works a page out. The API's memory is
 * taken after the first round.
 *
 * The machine may be shared, so every run also says how much CPU the API and
 * PostgreSQL spent per response and how many cores other programs kept busy
 * meanwhile: latency moves with other load, CPU per response much less.
 */
import os from 'node:os';
import pg from 'pg';
import type { ShelfPage } from '@scrap-relay/shared';
import { apiSpec } from '../scripts/lib/stack.ts';
import { startService, type RunningService } from '../scripts/lib/services.ts';
import { startBareExpress } from './lib/bare-express-service.ts';
import type { BenchContext } from './lib/context.ts';
import { measureAccounted, type AccountedLoad } from './lib/accounted-load.ts';
import { listeningPid, parentPid, processMemory } from './lib/processes.ts';
import { BEHIND_TLS_PROXY, signIn } from './lib/session.ts';
import { BENCH_PASSWORD, benchSellerEmail, loadShelf } from './lib/shelf-data.ts';
import { shelfStatements, type Statement } from './lib/shelf-statements.ts';

const CONNECTIONS = 20;
const MEASURE_SECONDS = 10;
const WARMUP_SECONDS = 2;

/** The shelf's query strings: what members browse most, a narrow filter, a text search, and paging far back. */
const MIXES = [
  { label: 'newest, no filter, page 1', query: '' },
  { label: 'sale, batik, dark, cheapest first', query: 'offer=sale&fibre=batik&value=dark&sort=price_asc' },
  { label: 'text "strips", cut strips, ≤ 800 g', query: 'q=strips&cut=strips&maxGrams=800' },
  { label: 'newest, no filter, page 40', query: 'page=40' },
] as const;

/** The address a mix asks for. */
const mixPath = (mix: (typeof MIXES)[number]) => `/api/bundles${mix.query === '' ? '' : `?${mix.query}`}`;

/** One accounted run at this benchmark's load: warm-up, then the measured part. */
const accounted = (url: string, headers: Record<string, string>, serverPid: number, postmasterPid: number) =>
  measureAccounted(url, { connections: CONNECTIONS, durationSeconds: MEASURE_SECONDS, warmupSeconds: WARMUP_SECONDS, headers, serverPid, postmasterPid });

function printAccounted(ctx: BenchContext, label: string, run: AccountedLoad, bare?: AccountedLoad): void {
  const { http } = run;
  ctx.print(label, {
    'req/s': http.requestsPerSecond,
    'p50 ms': http.latencyP50Ms,
    'p95 ms': http.latencyP95Ms,
    'p99 ms': http.latencyP99Ms,
    ...(bare === undefined ? {} : { 'of bare': `${((100 * http.requestsPerSecond) / bare.http.requestsPerSecond).toFixed(1)} %` }),
    'errors+non-2xx': http.errors + http.non2xx,
  });
  ctx.print('    CPU per response, and other load meanwhile', {
    'server ms': run.serverCpuMs,
    'PostgreSQL ms': run.postgresCpuMs,
    'load generator ms': run.loadGeneratorCpuMs,
    'other programs, cores': run.otherCores,
  });
}

/** A benchmark that measured 401s or empty pages measured the wrong thing, so one request is checked first. */
async function firstPage(url: string, headers: Record<string, string>): Promise<ShelfPage> {
  const response = await fetch(url, { headers });
  if (response.status !== 200) throw new Error(`GET ${url} answered ${response.status}: ${(await response.text()).slice(0, 200)}`);
  const page = (await response.json()) as ShelfPage;
  if (!Array.isArray(page.items) || page.items.length === 0) throw new Error(`GET ${url} answered 200 with no bundles.`);
  return page;
}

async function expectSignedIn(apiUrl: string, headers: Record<string, string>): Promise<void> {
  const response = await fetch(`${apiUrl}/api/session`, { headers });
  const body = (await response.json()) as { user: unknown };
  if (response.status !== 200 || body.user === null) throw new Error(`GET /api/session answered ${response.status} without a signed-in member.`);
}

async function explain(client: pg.Client, statement: Statement): Promise<void> {
  const result = await client.query<{ 'QUERY PLAN': string }>(`EXPLAIN (ANALYZE, BUFFERS) ${statement.text}`, statement.values);
  const values = statement.values.length > 0 ? ` with ${JSON.stringify(statement.values)}` : '';
  console.log(`    EXPLAIN (ANALYZE, BUFFERS) of the ${statement.role} statement${values}:`);
  for (const row of result.rows) console.log(`      ${row['QUERY PLAN']}`);
}

export async function run(ctx: BenchContext): Promise<void> {
  const uploadDir = ctx.env.UPLOAD_DIR;
  if (uploadDir === undefined) throw new Error('The bench environment has no UPLOAD_DIR.');
  const load = await loadShelf(ctx.databaseUrl, uploadDir);
  ctx.print(load.loaded ? 'invented shelf loaded (set-based SQL, then VACUUM ANALYZE)' : 'invented shelf already in the database', {
    bundles: load.bundlesOnShelf,
    seconds: load.seconds,
  });
  const [one, five] = os.loadavg();
  ctx.print('machine load average before the runs', { '1 min': one ?? 0, '5 min': five ?? 0, cores: os.cpus().length });

  // Ports of this module's own servers: +6 as in http-baseline.bench.ts, +7 for an API that trusts the loopback proxy.
  const barePort = ctx.ports.base + 6;
  const apiPort = ctx.ports.base + 7;
  const apiUrl = `http://127.0.0.1:${apiPort}`;
  const services: RunningService[] = [];
  const db = new pg.Client({ connectionString: ctx.databaseUrl, application_name: 'scrap-relay-bench-explain' });
  await db.connect();
  try {
    const backend = await db.query<{ pid: number }>('SELECT pg_backend_pid() AS pid');
    const postmasterPid = parentPid(backend.rows[0]!.pid);

    const spec = apiSpec({ ...ctx.env, PORT: String(apiPort), TRUST_PROXY: 'loopback' });
    const api = await startService({ ...spec, name: 'api-shelf', description: 'API for the shelf benchmark' }, { logDir: ctx.logDir, echo: false });
    services.push(api);
    const apiPid = listeningPid(api.pid, apiPort);
    const booted = processMemory(apiPid);

    const cookie = await signIn(apiUrl, benchSellerEmail(1), BENCH_PASSWORD);
    const headers = { ...BEHIND_TLS_PROXY, cookie, accept: 'application/json' };
    await expectSignedIn(apiUrl, headers);

    const bare = await startBareExpress(ctx, barePort);
    services.push(bare);
    const bareRun = await accounted(`http://127.0.0.1:${barePort}/baseline/page`, {}, listeningPid(bare.pid, barePort), postmasterPid);
    await bare.stop();
    printAccounted(ctx, `bare Express: a page of 24 bundle-sized objects (${CONNECTIONS} connections, ${MEASURE_SECONDS} s)`, bareRun);

    const invalid: string[] = [];
    const measure = async (label: string, url: string, serverPid: number) => {
      const result = await accounted(url, headers, serverPid, postmasterPid);
      printAccounted(ctx, label, result, bareRun);
      const { errors, non2xx } = result.http;
      if (errors + non2xx > 0) invalid.push(`${label}: ${errors} errors, ${non2xx} non-2xx`);
    };

    // Session read and touch, member and guild loaded, no shelf query: the floor under any signed-in request.
    await measure('signed-in floor: GET /api/session', `${apiUrl}/api/session`, apiPid);

    // A page asked for again is served from its kept copy (shelf-pages.ts) until the shelf changes.
    for (const mix of MIXES) {
      const path = mixPath(mix);
      const page = await firstPage(`${apiUrl}${path}`, headers);
      console.log(`  ${mix.label}: GET ${path} (${page.totalCapped ? 'more than ' : ''}${page.total.toLocaleString('en')} bundles match)`);
      await measure(`  shelf: ${mix.label}`, `${apiUrl}${path}`, apiPid);
    }

    const after = processMemory(apiPid);
    ctx.print(`API process memory (pid ${apiPid}, MB)`, {
      'RSS after boot': booted.rssKb / 1024,
      'RSS after the runs': after.rssKb / 1024,
      'peak RSS': after.peakRssKb / 1024,
    });
    await api.stop();

    // The same mixes with every page worked out afresh: what a page costs the first time it is asked for, or
    // after each change to the shelf. The plans printed are of that statement.
    const freshSpec = apiSpec({ ...ctx.env, PORT: String(apiPort), TRUST_PROXY: 'loopback', SHELF_PAGES_KEPT: 'false' });
    const fresh = await startService({ ...freshSpec, name: 'api-shelf-fresh', description: 'API for the shelf benchmark, no kept pages' }, { logDir: ctx.logDir, echo: false });
    services.push(fresh);
    const freshPid = listeningPid(fresh.pid, apiPort);
    console.log('  every page worked out afresh (SHELF_PAGES_KEPT=false):');
    for (const mix of MIXES) {
      const path = mixPath(mix);
      await firstPage(`${apiUrl}${path}`, headers);
      await measure(`  shelf, worked out afresh: ${mix.label}`, `${apiUrl}${path}`, freshPid);
      for (const statement of await shelfStatements(mix.query)) await explain(db, statement);
    }
    if (invalid.length > 0) throw new Error(`Some responses failed, so their figures measure errors, not the shelf:\n  ${invalid.join('\n  ')}`);
  } finally {
    await db.end();
    for (const service of services.reverse()) await service.stop();
  }
}
