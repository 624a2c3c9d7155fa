/**
 * The web app as a phone on a slow connection gets it. First the page
 * weight: the production build's JavaScript a signed-in member must fetch
 * before the shelf can render, gzipped and brotli-compressed, every lazy
 * route's own weight, and the stylesheets. Then Largest Contentful Paint of
 * the shelf in Chromium, served by the API from the built files as in
 * production, over an emulated slow network with a 4× slower CPU, from a
 * cold HTTP cache each time.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../apps/api/src/db/seed.ts';
import { ensureChromium } from '../scripts/lib/chromium.ts';
import { machineScratchDir } from '../scripts/lib/paths.ts';
import { ensureDatabase } from '../scripts/lib/postgres.ts';
import { startService } from '../scripts/lib/services.ts';
import { apiSpec, migrate, seedDemoGuild } from '../scripts/lib/stack.ts';
import { SHELF_ROUTE_MODULE } from '../apps/api/src/middleware/web-app.ts';
import type { BenchContext } from './lib/context.ts';
import { coldLoad, signedInBrowser, THROTTLING, type PageLoad } from './lib/page-load.ts';
import { buildWebWithManifest, cssFiles, filesOf, routeModules, staticClosure, weigh, weighFiles, type WebBuild } from './lib/web-build.ts';

const HOME_ROUTE = 'src/app/routes/app/home.tsx';
const ROUTES_PREFIX = 'src/app/routes/';
/** Targets, printed beside the figures (kB: 1 000 bytes, as Vite prints). */
const INITIAL_JS_TARGET_KB = 150;
const LCP_TARGET_MS = 2_000;
const RUNS = 5;
/** The demo guild's member who browses the shelf. */
const SHOPPER_EMAIL = 'gus@ferncombe-quilters.example';
/** A database of its own with only the demo guild, so the page shows the same shelf whichever modules ran before. */
const DATABASE = 'scrap_relay_bench_web';

const kB = (bytes: number) => bytes / 1000;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
}

function printPageWeight(ctx: BenchContext, build: WebBuild, pages: { path: string; route: string }[]): void {
  const { manifest, entryKey, outDir } = build;
  const entryClosure = staticClosure(manifest, [entryKey]);
  const entry = weighFiles(outDir, filesOf(manifest, entryClosure));
  ctx.print(`entry chunk and its static imports (${entryClosure.size} files), kB`, { raw: kB(entry.raw), gzip: kB(entry.gzip), brotli: kB(entry.brotli) });
  for (const page of pages) {
    const closure = staticClosure(manifest, [entryKey, page.route]);
    const weight = weighFiles(outDir, filesOf(manifest, closure));
    ctx.print(`initial JS for ${page.path} (${closure.size} files), kB`, {
      raw: kB(weight.raw),
      gzip: kB(weight.gzip),
      brotli: kB(weight.brotli),
      'target gzip': INITIAL_JS_TARGET_KB,
    });
  }

  console.log('  lazy route modules: own chunk, and with the static imports the entry does not already bring (kB)');
  for (const key of routeModules(manifest)) {
    const own = weigh(fs.readFileSync(path.join(outDir, manifest[key]!.file)));
    const extra = [...staticClosure(manifest, [key])].filter((chunk) => !entryClosure.has(chunk));
    const added = weighFiles(outDir, filesOf(manifest, extra));
    ctx.print(`    ${key.slice(ROUTES_PREFIX.length)}`, { raw: kB(own.raw), gzip: kB(own.gzip), 'added raw': kB(added.raw), 'added gzip': kB(added.gzip) });
  }

  const css = cssFiles(outDir);
  const allCss = weighFiles(outDir, css);
  ctx.print(`CSS, every stylesheet (${css.length} files), kB`, { raw: kB(allCss.raw), gzip: kB(allCss.gzip), brotli: kB(allCss.brotli) });
}

function printLoad(ctx: BenchContext, label: string, load: PageLoad): void {
  ctx.print(label, {
    'LCP ms': load.lcpMs,
    'FCP ms': load.firstContentfulPaintMs,
    'HTML received ms': load.htmlReceivedMs,
    'DCL ms': load.domContentLoadedMs,
    'load ms': load.loadEventMs,
    'transferred kB': kB(load.transferredBytes),
    responses: load.responses,
  });
  console.log(`      largest paint: ${load.lcpElement}`);
}

async function measureLcp(ctx: BenchContext, build: WebBuild, pathname: string): Promise<void> {
  await ensureChromium();
  const port = ctx.ports.base + 8;
  const baseUrl = `http://127.0.0.1:${port}`;
  const databaseUrl = await ensureDatabase(DATABASE, { recreate: true });
  fs.mkdirSync(machineScratchDir(), { recursive: true });
  const uploadDir = fs.mkdtempSync(path.join(machineScratchDir(), 'bench-web-uploads-'));
  // NODE_ENV=development: a production API marks the session cookie Secure and asks browsers to upgrade to https, neither of which works over plain http on loopback.
  const env = { ...ctx.env, NODE_ENV: 'development', PORT: String(port), APP_URL: baseUrl, DATABASE_URL: databaseUrl, UPLOAD_DIR: uploadDir, WEB_DIST: build.outDir };
  try {
    await migrate(env);
    await seedDemoGuild(env);
    const db = new pg.Client({ connectionString: databaseUrl });
    await db.connect();
    const onShelf = (await db.query<{ n: number }>(`SELECT count(*)::int AS n FROM bundles WHERE state = 'on_shelf'`)).rows[0]!.n;
    await db.end();
    if (!DEMO_ACCOUNTS.some((account) => account.email === SHOPPER_EMAIL)) throw new Error(`${SHOPPER_EMAIL} is no longer a demo account.`);

    const api = await startService({ ...apiSpec(env), name: 'api-web', description: 'API serving the built web app for the page-load benchmark' }, { logDir: ctx.logDir, echo: false });
    try {
      const browser = await signedInBrowser(baseUrl, SHOPPER_EMAIL, DEMO_PASSWORD);
      try {
        console.log(
          `  ${pathname}, signed in as ${SHOPPER_EMAIL}; demo guild only (${onShelf} bundles on the shelf); API on ${baseUrl} with NODE_ENV=development so the session cookie works over http; ` +
            `phone viewport 412 × 823; ${THROTTLING.downloadBytesPerSecond * 0.008} kbps down, ${THROTTLING.uploadBytesPerSecond * 0.008} kbps up, ${THROTTLING.latencyMs} ms latency, CPU ${THROTTLING.cpuSlowdown}× slower`,
        );
        const warm = await coldLoad(browser.context, pathname, { throttled: false });
        if (warm.pathname !== pathname) throw new Error(`Loading ${pathname} ended on ${warm.pathname}: the session did not hold.`);
        printLoad(ctx, 'unthrottled warm-up load (not counted)', warm);

        const [before] = os.loadavg();
        const loads: PageLoad[] = [];
        for (let run = 1; run <= RUNS; run += 1) {
          const load = await coldLoad(browser.context, pathname, { throttled: true });
          if (load.pathname !== pathname) throw new Error(`Run ${run} ended on ${load.pathname}, not ${pathname}.`);
          if (load.lcpMs < 0) throw new Error(`Run ${run} reported no largest-contentful-paint entry.`);
          printLoad(ctx, `run ${run}: cold cache, throttled`, load);
          loads.push(load);
        }
        const [after] = os.loadavg();
        const byLcp = [...loads].sort((a, b) => a.lcpMs - b.lcpMs);
        const middle = byLcp[Math.floor(byLcp.length / 2)]!;
        console.log(`  what the median run (LCP ${Math.round(middle.lcpMs)} ms, FCP ${Math.round(middle.firstContentfulPaintMs)} ms) fetched, and its long tasks, ms from navigation start:`);
        console.log(`    ${'0'.padStart(6)} → ${Math.round(middle.htmlReceivedMs).toString().padStart(5)}  ${pathname} (the HTML)`);
        const lines = [
          ...middle.resources.map((resource) => ({
            ...resource,
            what: `${resource.path}${resource.transferredBytes > 0 ? `, ${kB(resource.transferredBytes).toFixed(1)} kB` : ''}`,
          })),
          ...middle.longTasks.map((task) => ({ ...task, what: `(main thread busy ${Math.round(task.endMs - task.startMs)} ms)` })),
          ...middle.paintCandidates.map((paint) => ({
            startMs: paint.startMs,
            endMs: paint.startMs,
            what: `(largest paint so far: ${paint.what}${paint.loadMs > 0 ? `, its file loaded at ${Math.round(paint.loadMs)} ms` : ''})`,
          })),
        ];
        for (const line of lines.sort((a, b) => a.startMs - b.startMs)) {
          console.log(`    ${Math.round(line.startMs).toString().padStart(6)} → ${Math.round(line.endMs).toString().padStart(5)}  ${line.what}`);
        }
        ctx.print(`Largest Contentful Paint of ${pathname}, ${RUNS} cold loads`, {
          'median ms': median(loads.map((load) => load.lcpMs)),
          'min ms': Math.min(...loads.map((load) => load.lcpMs)),
          'max ms': Math.max(...loads.map((load) => load.lcpMs)),
          'target ms': LCP_TARGET_MS,
          'load average before': before ?? 0,
          after: after ?? 0,
        });
      } finally {
        await browser.close();
      }
    } finally {
      await api.stop();
    }
  } finally {
    fs.rmSync(uploadDir, { recursive: true, force: true });
  }
}

export async function run(ctx: BenchContext): Promise<void> {
  const build = await buildWebWithManifest(ctx.ports);
  const hasShelf = build.manifest[SHELF_ROUTE_MODULE] !== undefined;
  if (!hasShelf) console.log(`  The build has no shelf route (${SHELF_ROUTE_MODULE}) yet: measuring the home page / instead.`);
  const pages = [{ path: '/', route: HOME_ROUTE }, ...(hasShelf ? [{ path: '/shelf', route: SHELF_ROUTE_MODULE }] : [])];
  printPageWeight(ctx, build, pages);
  await measureLcp(ctx, build, hasShelf ? '/shelf' : '/');
}
