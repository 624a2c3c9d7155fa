import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from './support/net.ts';
import { Bundle } from '../apps/api/src/db/models/index.ts';
import { createMember, signedInClient, startTestApi, TEST_PASSWORD, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';

/**
 * How a guild that outgrows one process runs Scrap Relay: several API processes on one
 * database. Sessions, holds and scheduled jobs live in PostgreSQL, so any process serves
 * any request and each unit is still sold once.
 */
let api: TestApi;
const processes: ChildProcess[] = [];
let urls: string[] = [];

async function startApiProcess(port: number) {
  const root = path.resolve(import.meta.dirname, '..');
  const child = spawn(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/server.ts'], {
    cwd: root,
    env: { ...process.env, PORT: String(port), LOG_LEVEL: 'silent', SIGN_IN_LIMIT_PER_IP: '10000' },
    stdio: 'ignore',
  });
  processes.push(child);
  const url = `http://127.0.0.1:${port}`;
  for (let i = 0; i < 150; i++) {
    if (await fetch(`${url}/api/health`).then((r) => r.ok).catch(() => false)) return url;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`API process on ${port} did not start`);
}

/** A minimal browser: keeps the session cookie and the CSRF token, against one base URL at a time. */
class Browser {
  cookie = '';
  csrf = '';
  async call(url: string, method: string, pathname: string, body?: unknown) {
    const res = await fetch(`${url}${pathname}`, {
      method,
      headers: { cookie: this.cookie, 'content-type': 'application/json', 'x-csrf-token': this.csrf },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const set = res.headers.get('set-cookie');
    if (set) this.cookie = set.split(';')[0]!;
    const json: any = res.status === 204 ? null : await res.json();
    if (json?.csrfToken) this.csrf = json.csrfToken;
    return { status: res.status, body: json };
  }
  async signIn(url: string, email: string) {
    await this.call(url, 'GET', '/api/session');
    return this.call(url, 'POST', '/api/session', { email, password: TEST_PASSWORD });
  }
}

beforeAll(async () => {
  api = await startTestApi();
  urls = await Promise.all([startApiProcess(await freePort()), startApiProcess(await freePort())]);
}, 90_000);
afterAll(async () => {
  for (const child of processes) child.kill('SIGTERM');
  await api.close();
});

describe('two API processes on one database', () => {
  it('a session made on one works on the other', async () => {
    const member = await createMember({ name: 'Two Doors' });
    const browser = new Browser();
    expect((await browser.signIn(urls[0]!, member.email)).status).toBe(200);
    const there = await browser.call(urls[1]!, 'GET', '/api/session');
    expect(there.body.user).toMatchObject({ email: member.email });
    const wish = await browser.call(urls[1]!, 'POST', '/api/wishes', { name: 'Anything batik', filters: { fibre: 'batik' } });
    expect(wish.status).toBe(201);
  });

  it('sells a quantity-1 bundle once when 20 buyers order through both processes at once', async () => {
    const seller = await signedInClient(api.runtime.app, await createMember());
    const librarian = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian'] }));
    const bundleId = await listAndSubmit(seller);
    await librarian.send('post', `/api/bundles/${bundleId}/review`, { decision: 'approve' });

    const buyers = await Promise.all(
      Array.from({ length: 20 }, async (_, i) => {
        const browser = new Browser();
        const member = await createMember();
        expect((await browser.signIn(urls[i % 2]!, member.email)).status).toBe(200);
        return { browser, url: urls[i % 2]! };
      }),
    );
    const address = { name: 'Buyer', line1: '1 Mill Row', town: 'Millbrook', postalCode: '97451', country: 'US' };
    const answers = await Promise.all(
      buyers.map(({ browser, url }) => browser.call(url, 'POST', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address })),
    );
    expect(answers.filter((a) => a.status === 201)).toHaveLength(1);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(19);
    expect((await Bundle.findByPk(bundleId))!.quantityAvailable).toBe(0);
  }, 60_000);

  it('keeps one schedule per job, and a queued job is done by one process only', async () => {
    const [schedules] = await api.runtime.ctx.sequelize.query(`SELECT name, count(*)::int AS n FROM pgboss.schedule GROUP BY name`);
    expect((schedules as { n: number }[]).every((s) => s.n === 1)).toBe(true);
    expect((schedules as { name: string }[]).map((s) => s.name)).toEqual(expect.arrayContaining(['bundles-expire', 'orders-release-holds']));

    const jobId = await api.runtime.ctx.queue.boss.send('bundles-expire', {});
    let state = '';
    for (let i = 0; i < 100 && state !== 'completed'; i++) {
      await new Promise((r) => setTimeout(r, 200));
      const [rows] = await api.runtime.ctx.sequelize.query(`SELECT state FROM pgboss.job WHERE id = $1`, { bind: [jobId] });
      state = (rows as { state: string }[])[0]?.state ?? '';
    }
    expect(state).toBe('completed');
    const [runs] = await api.runtime.ctx.sequelize.query(`SELECT retry_count FROM pgboss.job WHERE id = $1`, { bind: [jobId] });
    expect((runs as { retry_count: number }[])[0]!.retry_count).toBe(0);
  }, 40_000);
});
