/**
 * The guild office's figures at scale: 100 000 bundles on the shelf and
 * 50 000 orders over 18 months with their ledger, the real API in its own
 * process, signed in as an invented treasurer (who sees the money figures),
 * GET /api/dashboard for the month, the year and all time, and GET
 * /api/reports/statement for the last complete month, at 10 connections.
 * Then every statement those routes send, timed alone, and PostgreSQL's plan
 * for the slowest.
 */
import { performance } from 'node:perf_hooks';
import pg from 'pg';
import { startService, type RunningService } from '../scripts/lib/services.ts';
import { apiSpec } from '../scripts/lib/stack.ts';
import { measureAccounted } from './lib/accounted-load.ts';
import type { BenchContext } from './lib/context.ts';
import { dashboardStatements, statementStatements, type OfficeStatement } from './lib/office-statements.ts';
import { BENCH_TREASURER, loadOrders } from './lib/orders-data.ts';
import { listeningPid, parentPid } from './lib/processes.ts';
import { BEHIND_TLS_PROXY, signIn } from './lib/session.ts';
import { loadShelf } from './lib/shelf-data.ts';
import { DEMO_GUILD } from '../apps/api/src/db/seed.ts';

const CONNECTIONS = 10;
const MEASURE_SECONDS = 8;
const TARGET_P95_MS = 100;
/** Each statement is run this many times alone (after one unmeasured run) and its median kept. */
const STATEMENT_RUNS = 5;
/** Requests sent one after another before the load, for the latency without a queue. */
const ALONE_RUNS = 3;

/** The last complete calendar month (UTC), as the statement page offers first. */
function lastCompleteMonth(now: Date): string {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1)).toISOString().slice(0, 7);
}

interface Endpoint {
  label: string;
  path: string;
  statements: (now: Date) => OfficeStatement[];
  /** A response that is not what a treasurer should see means the figures measure the wrong thing. */
  check: (body: unknown) => string | null;
}

function endpoints(month: string): Endpoint[] {
  const dashboard = (period: 'month' | 'year' | 'all'): Endpoint => ({
    label: `dashboard, period=${period}`,
    path: `/api/dashboard?period=${period}`,
    statements: (now) => dashboardStatements(`period=${period}`, now, DEMO_GUILD.timeZone),
    check: (body) => ((body as { figures?: { money?: unknown } }).figures?.money ? null : 'no money figures (not signed in as a treasurer?)'),
  });
  return [
    dashboard('month'),
    dashboard('year'),
    dashboard('all'),
    {
      label: `statement, month=${month}`,
      path: `/api/reports/statement?month=${month}`,
      statements: () => statementStatements(month, DEMO_GUILD.timeZone),
      check: (body) => {
        const statement = (body as { statement?: { closingBalances?: unknown[]; chargesMinor?: number } }).statement;
        return statement && (statement.chargesMinor ?? 0) > 0 ? null : 'a statement with no charges: the month holds no orders';
      },
    },
  ];
}

/** Sequential requests, each timed end to end: the latency with no queue in front of it. */
async function timeAlone(url: string, headers: Record<string, string>): Promise<number> {
  const times: number[] = [];
  for (let run = 0; run < ALONE_RUNS; run += 1) {
    const started = performance.now();
    const response = await fetch(url, { headers });
    await response.arrayBuffer();
    if (response.status !== 200) throw new Error(`GET ${url} answered ${response.status}.`);
    times.push(performance.now() - started);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

/** Waits until the API has no statement running (its connections name themselves scrap-relay-api). */
async function waitForIdleApi(client: pg.Client): Promise<void> {
  const deadline = Date.now() + 180_000;
  for (;;) {
    const { rows } = await client.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND application_name = 'scrap-relay-api' AND state = 'active'`,
    );
    if (rows[0]!.n === 0) return;
    if (Date.now() > deadline) throw new Error('The API was still running statements 3 minutes after the load stopped.');
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

interface Timed {
  endpoint: string;
  statement: OfficeStatement;
  medianMs: number;
}

/**
 * Median time of a statement run alone, after one unmeasured run: sent unnamed (parsed, analysed
 * and planned at every run) or, as the API sends it, by its name (prepared once on this connection).
 */
async function timeStatement(client: pg.Client, statement: OfficeStatement, named: boolean): Promise<number> {
  const send = () => (named ? client.query({ name: statement.name, text: statement.text, values: statement.values }) : client.query(statement.text, statement.values));
  await send();
  const times: number[] = [];
  for (let run = 0; run < STATEMENT_RUNS; run += 1) {
    const started = performance.now();
    await send();
    times.push(performance.now() - started);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

/** PostgreSQL's own planning and execution times of the statement (EXPLAIN ANALYZE, SUMMARY), median of the runs. */
async function planAndRun(client: pg.Client, statement: OfficeStatement): Promise<{ planningMs: number; executionMs: number }> {
  const planning: number[] = [];
  const execution: number[] = [];
  for (let run = 0; run < STATEMENT_RUNS; run += 1) {
    const { rows } = await client.query<{ 'QUERY PLAN': [{ 'Planning Time': number; 'Execution Time': number }] }>(
      `EXPLAIN (ANALYZE, SUMMARY, FORMAT JSON) ${statement.text}`,
      statement.values,
    );
    planning.push(rows[0]!['QUERY PLAN'][0]['Planning Time']);
    execution.push(rows[0]!['QUERY PLAN'][0]['Execution Time']);
  }
  const median = (values: number[]) => values.sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
  return { planningMs: median(planning), executionMs: median(execution) };
}

async function periodSizes(client: pg.Client, month: string): Promise<Record<string, number>> {
  const { rows } = await client.query<Record<string, number>>(
    `SELECT count(*) FILTER (WHERE paid_at >= date_trunc('month', now()))::int AS "paid this month",
            count(*) FILTER (WHERE paid_at >= date_trunc('year', now()))::int AS "paid this year",
            count(*) FILTER (WHERE paid_at IS NOT NULL)::int AS "paid, all time",
            (SELECT count(*) FROM ledger_entries WHERE created_at >= $1::date AND created_at < $1::date + interval '1 month')::int AS "ledger entries in ${month}"
     FROM orders`,
    [`${month}-01`],
  );
  return rows[0]!;
}

export async function run(ctx: BenchContext): Promise<void> {
  const uploadDir = ctx.env.UPLOAD_DIR;
  if (uploadDir === undefined) throw new Error('The bench environment has no UPLOAD_DIR.');
  const shelf = await loadShelf(ctx.databaseUrl, uploadDir);
  ctx.print(shelf.loaded ? 'invented shelf loaded (set-based SQL, then VACUUM ANALYZE)' : 'invented shelf already in the database', {
    bundles: shelf.bundlesOnShelf,
    seconds: shelf.seconds,
  });
  const orders = await loadOrders(ctx.databaseUrl);
  ctx.print(orders.loaded ? 'invented orders loaded and checked against money.ts' : 'invented orders already in the database', {
    orders: orders.orders,
    'order lines': orders.orderItems,
    'ledger entries': orders.ledgerEntries,
    payouts: orders.payouts,
    refunded: orders.refundedOrPaidThenCancelled,
    seconds: orders.seconds,
  });

  const now = new Date();
  const month = lastCompleteMonth(now);
  const db = new pg.Client({ connectionString: ctx.databaseUrl, application_name: 'scrap-relay-bench-office' });
  await db.connect();
  const services: RunningService[] = [];
  try {
    ctx.print('what the periods hold', await periodSizes(db, month));
    const backend = await db.query<{ pid: number }>('SELECT pg_backend_pid() AS pid');
    const postmasterPid = parentPid(backend.rows[0]!.pid);

    // +9: this module's own API (the shelf module uses +6 and +7, the page-load module +8).
    const apiPort = ctx.ports.base + 9;
    const apiUrl = `http://127.0.0.1:${apiPort}`;
    const spec = apiSpec({ ...ctx.env, PORT: String(apiPort), TRUST_PROXY: 'loopback' });
    const api = await startService({ ...spec, name: 'api-office', description: 'API for the dashboard benchmark' }, { logDir: ctx.logDir, echo: false });
    services.push(api);
    const apiPid = listeningPid(api.pid, apiPort);
    const cookie = await signIn(apiUrl, BENCH_TREASURER.email, BENCH_TREASURER.password);
    const headers = { ...BEHIND_TLS_PROXY, cookie, accept: 'application/json' };

    const list = endpoints(month);
    const invalid: string[] = [];
    for (const endpoint of list) {
      console.log(`  GET ${endpoint.path}`);
      const response = await fetch(`${apiUrl}${endpoint.path}`, { headers });
      if (response.status !== 200) throw new Error(`GET ${endpoint.path} answered ${response.status}: ${(await response.text()).slice(0, 200)}`);
      const problem = endpoint.check(await response.json());
      if (problem !== null) throw new Error(`GET ${endpoint.path}: ${problem}.`);
      ctx.print(`  one request at a time, median of ${ALONE_RUNS}`, { ms: await timeAlone(`${apiUrl}${endpoint.path}`, headers) });
      const run = await measureAccounted(`${apiUrl}${endpoint.path}`, {
        connections: CONNECTIONS,
        durationSeconds: MEASURE_SECONDS,
        // The requests just sent one at a time warmed the API up; a timed warm-up under load would only leave a queue behind.
        warmupSeconds: 0,
        headers,
        serverPid: apiPid,
        postmasterPid,
      });
      const label = `  ${CONNECTIONS} connections, ${MEASURE_SECONDS} s`;
      if (run.http.responses === 0) {
        ctx.print(label, { responses: 0, 'req/s': 0, 'p95 ms': `over ${MEASURE_SECONDS * 1000} (none completed)`, 'target p95 ms': TARGET_P95_MS });
      } else {
        ctx.print(label, {
          responses: run.http.responses,
          'req/s': run.http.requestsPerSecond,
          'p50 ms': run.http.latencyP50Ms,
          'p95 ms': run.http.latencyP95Ms,
          'p99 ms': run.http.latencyP99Ms,
          'target p95 ms': TARGET_P95_MS,
          'errors+non-2xx': run.http.errors + run.http.non2xx,
        });
        ctx.print('    CPU per response, and other load meanwhile', {
          'server ms': run.serverCpuMs,
          'PostgreSQL ms': run.postgresCpuMs,
          'load generator ms': run.loadGeneratorCpuMs,
          'other programs, cores': run.otherCores,
        });
      }
      // Requests still queued when the load stopped would otherwise run into the next measurement.
      await waitForIdleApi(db);
      if (run.http.errors + run.http.non2xx > 0) invalid.push(`${endpoint.path}: ${run.http.errors} errors, ${run.http.non2xx} non-2xx`);
    }
    await api.stop();
    services.pop();

    // With the API stopped, each statement runs alone: its own cost, not its share of a queue.
    const timed: Timed[] = [];
    for (const endpoint of list) {
      console.log(`  statements of ${endpoint.label}, each alone, median of ${STATEMENT_RUNS} (ms): by name as the API sends it, unnamed, and EXPLAIN ANALYZE's planning + execution:`);
      for (const statement of endpoint.statements(now)) {
        const medianMs = await timeStatement(db, statement, true);
        const unnamedMs = await timeStatement(db, statement, false);
        const { planningMs, executionMs } = await planAndRun(db, statement);
        timed.push({ endpoint: endpoint.label, statement, medianMs });
        console.log(
          `    ${medianMs.toFixed(1).padStart(8)}  (unnamed ${unnamedMs.toFixed(1)}, planning ${planningMs.toFixed(2)} + execution ${executionMs.toFixed(2)})  ${statement.label}`,
        );
      }
      const total = timed.filter((t) => t.endpoint === endpoint.label).reduce((sum, t) => sum + t.medianMs, 0);
      console.log(`    ${total.toFixed(1).padStart(8)}  all of them, one after another`);
    }
    const slowest = timed.reduce((worst, t) => (t.medianMs > worst.medianMs ? t : worst));
    const plan = await db.query<{ 'QUERY PLAN': string }>(`EXPLAIN (ANALYZE, BUFFERS, SUMMARY) ${slowest.statement.text}`, slowest.statement.values);
    console.log(`  EXPLAIN (ANALYZE, BUFFERS, SUMMARY) of the slowest statement (${slowest.endpoint}, ${slowest.medianMs.toFixed(1)} ms) with ${JSON.stringify(slowest.statement.values)}:`);
    for (const row of plan.rows) console.log(`    ${row['QUERY PLAN']}`);
    if (invalid.length > 0) throw new Error(`Some responses failed, so their figures measure errors:\n  ${invalid.join('\n  ')}`);
  } finally {
    for (const service of services.reverse()) await service.stop();
    await db.end();
  }
}
