import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { machineScratchDir } from '../scripts/lib/paths.ts';
import { createMember, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';

/**
 * PostgreSQL restarted under a running API: requests answer 503 while it is down and
 * succeed again afterwards, without restarting the API. Uses the test cluster that
 * `npm test` started (scripts/lib/postgres.ts keeps it under the machine scratch folder).
 */
let api: TestApi;
let client: Client;
const port = Number(new URL(process.env.DATABASE_URL ?? 'postgres://x@127.0.0.1:0/x').port);
const dataDir = path.join(machineScratchDir(), `pg-${port}`, 'data');
const asRoot = process.getuid?.() === 0;

function pgCtl(args: string[]) {
  const pgCtlPath = path.join(fs.readdirSync('/usr/lib/postgresql').sort().map((v) => `/usr/lib/postgresql/${v}/bin/pg_ctl`).pop()!);
  const [cmd, cmdArgs] = asRoot ? ['runuser', ['-u', 'postgres', '--', pgCtlPath, ...args]] : [pgCtlPath, args];
  execFileSync(cmd, cmdArgs as string[], { stdio: 'ignore' });
}

beforeAll(async () => {
  api = await startTestApi();
  client = await signedInClient(api.runtime.app, await createMember());
});
afterAll(async () => {
  await api.close();
});

describe.runIf(fs.existsSync(path.join(dataDir, 'PG_VERSION')))('PostgreSQL restarted while the API runs', () => {
  it('answers 503 while the database is down and recovers by itself when it is back', async () => {
    expect((await client.get('/api/bundles')).status).toBe(200);
    pgCtl(['stop', '-D', dataDir, '-m', 'fast', '-w']);
    try {
      const health = await client.get('/api/health');
      expect(health.status).toBe(503);
      expect(health.body.error.code).toBe('service_unavailable');
      const shelf = await client.get('/api/bundles');
      expect(shelf.status).toBe(503);
      expect(JSON.stringify(shelf.body)).not.toMatch(/ECONNREFUSED|sequelize|select/i);
    } finally {
      // restart reuses the options the server was started with (postmaster.opts)
      pgCtl(['restart', '-D', dataDir, '-m', 'fast', '-w']);
    }
    const statuses: number[] = [];
    for (let i = 0; i < 20; i++) {
      const res = await client.get('/api/bundles');
      statuses.push(res.status);
      if (res.status === 200) break;
      await new Promise((r) => setTimeout(r, 250));
    }
    expect(statuses.at(-1)).toBe(200);
    expect(statuses.filter((s) => s >= 500 && s !== 503)).toEqual([]);
  }, 60_000);
});
