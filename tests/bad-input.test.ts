import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Member } from '../apps/api/src/db/models/index.ts';
import { Client, countRows, createMember, signedInClient, startTestApi, type TestApi } from './support/api.ts';

/** Every route that takes input, fed what it should refuse: a 4xx that names the field, never a 500, nothing written. */
let api: TestApi;
let admin: Member;
let adminClient: Client;
let target: Member;
const TABLES = ['members', 'member_tokens', 'guild', 'bundles', 'bundle_photos', 'orders', 'wishes', 'meetings', 'payouts', 'ledger_entries', 'waitlist_entries', 'starter_claims', 'order_problems', 'basket_items'];

beforeAll(async () => {
  api = await startTestApi();
  admin = await createMember({ roles: ['member', 'admin', 'librarian', 'treasurer'] });
  target = await createMember();
  adminClient = await signedInClient(api.runtime.app, admin);
});
afterAll(async () => {
  await api.close();
});

type Method = 'post' | 'put' | 'patch' | 'delete';
const someId = '00000000-0000-4000-8000-000000000000';
interface Route {
  method: Method;
  path: () => string;
  /** A required field, named in the answer when the body is empty; undefined when every field is optional. */
  field?: string;
  wrong: Record<string, unknown>;
}

const routes: Route[] = [
  { method: 'post', path: () => '/api/session', field: 'email', wrong: { email: 42, password: ['x'] } },
  { method: 'post', path: () => '/api/members', field: 'inviteCode', wrong: { inviteCode: 7, name: null, email: true, password: 12345678901 } },
  { method: 'post', path: () => '/api/email-verifications', field: 'token', wrong: { token: 123 } },
  { method: 'post', path: () => '/api/password-resets', field: 'email', wrong: { email: { nested: true } } },
  { method: 'post', path: () => '/api/password-resets/complete', field: 'token', wrong: { token: false, password: 1 } },
  { method: 'patch', path: () => `/api/members/${target.id}`, wrong: { roles: 'admin', active: 'yes' } },
  { method: 'put', path: () => '/api/guild/settings', field: 'name', wrong: { name: 3, currency: 1, holdMinutes: 'thirty' } },
  { method: 'put', path: () => '/api/guild/postage', field: 'dimensional', wrong: { dimensional: 'heavy', zones: 3 } },
  { method: 'post', path: () => '/api/bundles', wrong: { title: 5, weightGrams: 'heavy', quantity: -3 } },
  { method: 'patch', path: () => `/api/bundles/${someId}`, wrong: { priceMinor: '12.00', fibre: 'spider_silk' } },
  { method: 'put', path: () => `/api/bundles/${someId}/photos/order`, field: 'photoIds', wrong: { photoIds: 'first' } },
  { method: 'post', path: () => `/api/bundles/${someId}/review`, field: 'decision', wrong: { decision: 'maybe', notes: 7 } },
  { method: 'post', path: () => '/api/estimates/yield', field: 'weightGrams', wrong: { weightGrams: 1e12, fibre: 'silk' } },
  { method: 'post', path: () => '/api/wishes', field: 'name', wrong: { name: 1, filters: 'all' } },
  { method: 'post', path: () => '/api/basket/items', field: 'bundleId', wrong: { bundleId: 7, quantity: 'lots' } },
  { method: 'patch', path: () => `/api/basket/items/${someId}`, field: 'quantity', wrong: { quantity: -1 } },
  { method: 'post', path: () => '/api/postage-quotes', field: 'items', wrong: { items: 'all', destination: 5 } },
  { method: 'post', path: () => '/api/orders', field: 'items', wrong: { items: [{ bundleId: 'x', quantity: 1e9 }], fulfilment: 'drone' } },
  { method: 'post', path: () => `/api/orders/${someId}/posted`, wrong: { trackingNumber: 5 } },
  { method: 'post', path: () => `/api/orders/${someId}/cancel`, wrong: { reason: ['x'] } },
  { method: 'post', path: () => `/api/orders/${someId}/problems`, field: 'message', wrong: { message: 5 } },
  { method: 'post', path: () => '/api/payouts', field: 'sellerId', wrong: { sellerId: 'me', amountMinor: -5, method: 'gold' } },
  { method: 'post', path: () => '/api/meetings', field: 'startsAt', wrong: { startsAt: 'next Tuesday', place: 4 } },
  { method: 'patch', path: () => `/api/meetings/${someId}`, wrong: { startsAt: 'soon' } },
  { method: 'post', path: () => `/api/meetings/${someId}/handovers/move`, field: 'toMeetingId', wrong: { toMeetingId: 12 } },
  { method: 'patch', path: () => '/api/me', wrong: { units: 'cubits', emailPreferences: { money: false } } },
  { method: 'put', path: () => '/api/me/address', field: 'line1', wrong: { name: 1, line1: 2, country: 'Atlantis' } },
  { method: 'post', path: () => '/api/me/close', field: 'password', wrong: { password: 5 } },
  { method: 'post', path: () => `/api/starter-bundles/${someId}/claims`, wrong: { meetingId: 5 } },
  { method: 'post', path: () => '/api/waitlist', wrong: { surprise: true } },
  { method: 'delete', path: () => `/api/waitlist/${someId}`, field: 'reason', wrong: { reason: 5 } },
  { method: 'post', path: () => `/api/waitlist/offers/${someId}/accept`, wrong: { meetingId: 'tomorrow' } },
];

describe.each(routes)('$method $path', ({ method, path, field, wrong }) => {
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
    const res = await expectNothingWritten(() => adminClient.send(method, path(), wrong));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error?.fields ?? {}).length).toBeGreaterThan(0);
  });

  it.runIf(field !== undefined)('missing fields → 400 naming the field', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), {}));
    expect(res.status).toBe(400);
    expect(res.body.error?.fields?.[field!]).toBeDefined();
  });

  it('unknown fields → 400 naming the unknown field', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), { ...(field && { [field]: 'x' }), surprise: 1 }));
    expect(res.status).toBe(400);
    expect(res.body.error?.fields?.surprise).toBe('Unknown field.');
  });

  it('a 2 MB body → 413', async () => {
    const res = await expectNothingWritten(() => adminClient.send(method, path(), { [field ?? 'notes']: 'x'.repeat(2 * 1024 * 1024) }));
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
