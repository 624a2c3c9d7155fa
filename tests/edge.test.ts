import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Writable } from 'node:stream';
import { pino } from 'pino';
import { appWith, createMember, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';

let api: TestApi;
let client: Client;
beforeAll(async () => {
  api = await startTestApi();
  client = await signedInClient(api.runtime.app, await createMember());
});
afterAll(async () => {
  await api.close();
});

describe('the hardened edge', () => {
  it('sends a Content Security Policy without inline scripts, and nosniff', async () => {
    const res = await client.get('/api/session');
    const csp = res.headers['content-security-policy'] as string;
    const scriptSrc = csp.split(';').find((d) => d.trim().startsWith('script-src'))!;
    expect(scriptSrc).toContain("'self'");
    expect(scriptSrc).not.toContain('unsafe-inline');
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('compresses JSON answers for clients that accept it', async () => {
    const res = await client.get('/api/bundles?pageSize=60').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    if (Number(res.headers['content-length'] ?? 2000) > 1024 || res.headers['transfer-encoding']) {
      expect(res.headers['content-encoding']).toBe('gzip');
    }
  });

  it('never shows internals in an error answer', async () => {
    const res = await client.get('/api/bundles/not-a-uuid');
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toMatch(/stack|at \/|sequelize|SELECT/i);
    expect(res.headers['x-request-id']).toBeTruthy();
  });

  it('logs each request without its cookies or the secret of an e-mailed link', async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk: Buffer, _encoding, done) {
        lines.push(...chunk.toString('utf8').split('\n').filter(Boolean));
        done();
      },
    });
    const logged = appWith(api, (config) => config, { logger: pino({ level: 'info' }, sink) });
    const member = await signedInClient(logged, await createMember());
    await member.get('/api/session').expect(200);
    await member.get('/api/bundles?q=strips&token=not-for-logs');

    const entries = lines.map((line) => JSON.parse(line) as { req?: { method: string; url: string }; res?: { statusCode: number } });
    const completed = entries.filter((entry) => entry.req && entry.res);
    expect(completed.map((entry) => `${entry.req!.method} ${entry.req!.url} ${entry.res!.statusCode}`)).toEqual(
      expect.arrayContaining(['GET /api/session 200', 'POST /api/session 200']),
    );
    expect(completed.map((entry) => entry.req!.url)).toContain('/api/bundles?q=strips&token=[redacted]');
    const text = lines.join('\n');
    expect(text).not.toMatch(/sr\.sid|cookie|set-cookie|x-csrf-token/i);
    expect(text).not.toContain('not-for-logs');
    expect(text).not.toContain(member.csrfToken);
  });
});
