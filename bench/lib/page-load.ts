/**
 * Cold page loads in Debian's Chromium with a slow phone network and a slow
 * CPU emulated through the Chrome DevTools Protocol, reading Largest
 * Contentful Paint the way the page itself would (PerformanceObserver).
 */
import { performance } from 'node:perf_hooks';
import { chromium, type Browser, type BrowserContext, type CDPSession } from 'playwright-core';
import { CHROMIUM } from '../../scripts/lib/chromium.ts';

/** The launch arguments of playwright.config.ts: no sandbox as root, nothing that phones home during a measurement. */
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** The slow phone: 1.6 Mbps down, 750 kbps up, 150 ms latency, CPU 4× slower than this machine's (the target's conditions). */
export const THROTTLING = {
  downloadBytesPerSecond: 1_600_000 / 8,
  uploadBytesPerSecond: 750_000 / 8,
  latencyMs: 150,
  // SR_BENCH_CPU_SLOWDOWN=1 measures a device with a fast processor on the same slow connection.
  cpuSlowdown: Number(process.env.SR_BENCH_CPU_SLOWDOWN ?? 4),
} as const;

/** A phone-sized window, since the throttling describes a phone. */
/**
 * The load has settled when no request has been open for this long and the
 * app shows no "Loading…" line. Playwright's 'networkidle' (500 ms) is too
 * short: with the CPU slowed 4×, running the entry chunk takes longer than
 * that before the app asks for the route's chunk and its data.
 */
const QUIET_MS = 1_500;
const SETTLE_TIMEOUT_MS = 120_000;
/** The app's Loading component (apps/web/src/components/ui/loading.tsx) is a role="status" line that starts with "Loading". */
const SHOWS_LOADING = `[...document.querySelectorAll('[role="status"]')].some((el) => (el.textContent || '').trim().startsWith('Loading'))`;

const PHONE = { viewport: { width: 412, height: 823 }, deviceScaleFactor: 1.75, isMobile: true, hasTouch: true } as const;

export interface PageLoad {
  /** Where the browser ended up: a redirect to the sign-in page would mean the session was lost. */
  pathname: string;
  lcpMs: number;
  /** What the largest contentful paint painted: tag, and an image's file name or the start of its text. */
  lcpElement: string;
  firstContentfulPaintMs: number;
  /**
   * When the HTML had fully arrived. (Its first byte is no guide here: the
   * emulated latency holds back the body, not always the headers.)
   */
  htmlReceivedMs: number;
  domContentLoadedMs: number;
  loadEventMs: number;
  /** Every file and API call the page fetched, in the order they started: what the paint waited for. */
  resources: { path: string; startMs: number; endMs: number; transferredBytes: number }[];
  /** Main-thread tasks of 50 ms or more (the Long Tasks API), by start: what the paint waited for besides the network. */
  longTasks: { startMs: number; endMs: number }[];
  /** Every largest-contentful-paint candidate in order: when it painted, and for an image when its file had loaded. */
  paintCandidates: { startMs: number; loadMs: number; what: string }[];
  /** Bytes received for every response of the load, as transferred (compressed), headers included. */
  transferredBytes: number;
  responses: number;
}

/**
 * Runs inside the page after the load settles. LCP entries arrive in a
 * performance-timeline task even when buffered, so it waits a moment and
 * then also takes whatever is still queued. A string, because the bench
 * compiles without the DOM's types.
 */
const READ_PAINT_TIMINGS = `new Promise((resolve) => {
  const entries = [];
  const observer = new PerformanceObserver((list) => entries.push(...list.getEntries()));
  observer.observe({ type: 'largest-contentful-paint', buffered: true });
  setTimeout(() => {
    entries.push(...observer.takeRecords());
    observer.disconnect();
    const lcp = entries[entries.length - 1];
    const nav = performance.getEntriesByType('navigation')[0];
    const fcp = performance.getEntriesByName('first-contentful-paint')[0];
    const describe = (entry) => {
      const el = entry.element;
      if (entry.url) return (el ? el.tagName.toLowerCase() : 'removed element') + ' ' + entry.url.split('/').slice(-2).join('/');
      if (el) return el.tagName.toLowerCase() + ' "' + (el.textContent || '').trim().replace(/\\s+/g, ' ').slice(0, 40) + '"';
      return 'an element since removed';
    };
    const element = lcp ? describe(lcp) : 'none';
    resolve({
      pathname: location.pathname,
      lcpMs: lcp ? lcp.startTime : -1,
      lcpElement: element,
      firstContentfulPaintMs: fcp ? fcp.startTime : -1,
      htmlReceivedMs: nav ? nav.responseEnd : -1,
      domContentLoadedMs: nav ? nav.domContentLoadedEventEnd : -1,
      loadEventMs: nav ? nav.loadEventEnd : -1,
      paintCandidates: entries.map((e) => ({ startMs: e.startTime, loadMs: e.loadTime || 0, what: describe(e) })),
      longTasks: (window.__benchLongTasks || []).map((t) => ({ startMs: t.startTime, endMs: t.startTime + t.duration })),
      resources: performance.getEntriesByType('resource').map((r) => {
        const url = new URL(r.name);
        return { path: url.pathname + url.search, startMs: r.startTime, endMs: r.responseEnd, transferredBytes: r.transferSize };
      }),
    });
  }, 300);
})`;

export interface SignedInBrowser {
  browser: Browser;
  context: BrowserContext;
  close(): Promise<void>;
}

/**
 * Launches Chromium and signs in through the API as the web app does
 * (GET /api/session for the CSRF token, POST /api/session), unthrottled.
 * The context's cookie jar keeps the session for every page opened later.
 */
export async function signedInBrowser(baseUrl: string, email: string, password: string): Promise<SignedInBrowser> {
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS });
  try {
    const context = await browser.newContext({ ...PHONE, baseURL: baseUrl });
    const first = await context.request.get('/api/session');
    if (first.status() !== 200) throw new Error(`GET /api/session answered ${first.status()}.`);
    const { csrfToken } = (await first.json()) as { csrfToken: string };
    const response = await context.request.post('/api/session', { headers: { 'x-csrf-token': csrfToken }, data: { email, password } });
    if (response.status() !== 200) throw new Error(`Signing in as ${email} answered ${response.status()}: ${await response.text()}`);
    const check = (await (await context.request.get('/api/session')).json()) as { user: unknown };
    if (check.user === null) throw new Error(`Signed in as ${email}, but the next GET /api/session has no member: the cookie did not stick.`);
    return { browser, context, close: () => browser.close() };
  } catch (error) {
    await browser.close();
    throw error;
  }
}

async function throttle(cdp: CDPSession): Promise<void> {
  await cdp.send('Network.emulateNetworkConditions', {
    offline: false,
    latency: THROTTLING.latencyMs,
    downloadThroughput: THROTTLING.downloadBytesPerSecond,
    uploadThroughput: THROTTLING.uploadBytesPerSecond,
  });
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: THROTTLING.cpuSlowdown });
}

/**
 * One cold load of `pathname` in a new tab: the browser's HTTP cache is
 * emptied first (cookies stay), then the page loads under throttling until
 * it has settled (QUIET_MS without a request, no "Loading…" line), and the
 * paint timings are read. With `throttled: false` it only warms the server.
 */
export async function coldLoad(context: BrowserContext, pathname: string, options: { throttled: boolean }): Promise<PageLoad> {
  const page = await context.newPage();
  try {
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.clearBrowserCache');
    if (options.throttled) await throttle(cdp);
    let transferredBytes = 0;
    let responses = 0;
    const open = new Set<string>();
    let lastActivity = performance.now();
    cdp.on('Network.requestWillBeSent', (event) => {
      open.add(event.requestId);
      lastActivity = performance.now();
    });
    cdp.on('Network.loadingFinished', (event) => {
      open.delete(event.requestId);
      lastActivity = performance.now();
      transferredBytes += event.encodedDataLength;
      responses += 1;
    });
    cdp.on('Network.loadingFailed', (event) => {
      open.delete(event.requestId);
      lastActivity = performance.now();
    });
    // Long tasks are not kept in the performance timeline: an observer from the page's start collects them.
    await page.addInitScript(`window.__benchLongTasks = [];
      new PerformanceObserver((list) => window.__benchLongTasks.push(...list.getEntries())).observe({ type: 'longtask' });`);
    const started = performance.now();
    await page.goto(pathname, { waitUntil: 'load', timeout: SETTLE_TIMEOUT_MS });
    for (;;) {
      await new Promise((resolve) => setTimeout(resolve, 100));
      const quiet = open.size === 0 && performance.now() - lastActivity >= QUIET_MS;
      if (quiet && !((await page.evaluate(SHOWS_LOADING)) as boolean)) break;
      if (performance.now() - started > SETTLE_TIMEOUT_MS) throw new Error(`${pathname} had not settled after ${SETTLE_TIMEOUT_MS / 1000} s.`);
    }
    const busyMs = lastActivity - started;
    const timings = (await page.evaluate(READ_PAINT_TIMINGS)) as Omit<PageLoad, 'transferredBytes' | 'responses'>;
    if (options.throttled) {
      // The bytes alone need this long at the emulated speed; a faster load means the throttling did not apply.
      const floorMs = (transferredBytes / THROTTLING.downloadBytesPerSecond) * 1000;
      if (busyMs < floorMs * 0.8) {
        throw new Error(`${transferredBytes} bytes arrived in ${Math.round(busyMs)} ms, faster than the emulated network allows: throttling did not apply.`);
      }
    }
    return { ...timings, transferredBytes, responses };
  } finally {
    await page.close();
  }
}
