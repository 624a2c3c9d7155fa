import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createMember, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';

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
});
