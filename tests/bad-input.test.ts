import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Member } from '../apps/api/src/db/models/index.ts';
import { Client, countRows, createMember, signedInClient, startTestApi, type TestApi } from './support/api.ts';

/** Every route that takes input, fed what it should refuse: a 4xx that names the field, never a 500, nothing written. */
let api: TestApi;
let admin: Member;
let adminClient: Client;
let target: Member;
const TABLES = ['members', 'member_tokens', 'guild'];

beforeAll(async () => {
  api = await startTestApi();
  admin = await createMember({ roles: ['member', 'admin'] });
  target = await createMember();
  adminClient = await signedInClient(api.runtime.app, admin);
});
afterAll(async () => {
  await api.close();
});

type Method = 'post' | 'put' | 'patch';
const routes: { method: Method; path: () => string; field: string }[] = [
  { method: 'post', path: () => '/api/session', field: 'email' },
  { method: 'post', path: () => '/api/members', field: 'inviteCode' },
  { method: 'post', path: () => '/api/email-verifications', field: 'token' },
  { method: 'post', path: () => '/api/password-resets', field: 'email' },
  { method: 'post', path: () => '/api/password-resets/complete', field: 'token' },
  { method: 'patch', path: () => `/api/members/${target.id}`, field: 'roles' },
  { method: 'put', path: () => '/api/guild/settings', field: 'name' },
];

const wrongTypes: Record<string, unknown> = {
  '/api/session': { email: 42, password: ['x'] },
  '/api/members': { inviteCode: 7, name: null, email: true, password: 12345678901 },
  '/api/email-verifications': { token: 123 },
  '/api/password-resets': { email: { nested: true } },
  '/api/password-resets/complete': { token: false, password: 1 },
  members: { roles: 'admin', active: 'yes' },
  '/api/guild/settings': { name: 3, currency: 1, holdMinutes: 'thirty' },
};
const keyFor = (path: string) => (path.startsWith('/api/members/') ? 'members' : path);

describe.each(routes)('$method $field route', ({ method, path, field }) => {
  async function expectNothingWritten(run: () => Promise<{ status: number; body: { error?: { code: string; fields?: Record<string, string> } } }>) {
    const before = await countRows(api.runtime.ctx.sequelize, TABLES);
    const res = await run();
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(res.body.error?.code).toBeTruthy();
    expect(await countRows(api.runtime.ctx.sequelize, TABLES)).toEqual(before);
    return res;
  }

  it('malformed JSON → 400 invalid_json', async () => {
    const res = await expectNothingWritten(() =>
      adminClient.agent[method](path()).set('X-CSRF-Token', adminClient.csrfToken).set('Content-Type', 'application/json').send('{"email": '),
    );
    expect(res.status).toBe(400);
    expect(res.body.error?.code).toBe('invalid_json');
  });

  it('wrong types → 400 naming the fields', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), wrongTypes[keyFor(path())]));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error?.fields ?? {}).length).toBeGreaterThan(0);
  });

  it('missing fields → 400 naming the field', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), {}));
    expect(res.status).toBe(400);
    expect(res.body.error?.fields?.[field] ?? res.body.error?.fields?.body).toBeDefined();
  });

  it('unknown fields → 400 naming the unknown field', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), { [field]: 'x', surprise: 1 }));
    expect(res.status).toBe(400);
    expect(res.body.error?.fields?.surprise).toBe('Unknown field.');
  });

  it('a 2 MB body → 413', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), { [field]: 'x'.repeat(2 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body.error?.code).toBe('payload_too_large');
  });

  it('an array where an object belongs → 400', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), [1, 2, 3]));
    expect(res.status).toBe(400);
  });
});

describe('routes that do not exist', () => {
  it('answers JSON 404', async () => {
    const res = await adminClient.get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
