import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_BASKET_LINES } from '@scrap-relay/shared';
import { BasketItem, type Member } from '../apps/api/src/db/models/index.ts';
import { Client, createMember, signedInClient, startTestApi, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';
import { payCheckout, sessionIdFromUrl } from './support/stripe-fake.ts';

let api: TestApi;
let buyer: Member;
let phone: Client;
let laptop: Client;
let seller: Client;
let librarian: Client;

beforeAll(async () => {
  api = await startTestApi();
  buyer = await createMember({ name: 'Perpetua Hem' });
  // The same member signed in on two devices: two sessions, one basket.
  phone = await signedInClient(api.runtime.app, buyer);
  laptop = await signedInClient(api.runtime.app, buyer);
  seller = await signedInClient(api.runtime.app, await createMember({ name: 'Wren Selvage' }));
  librarian = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian'] }));
});
afterAll(async () => {
  await api.close();
});

async function shelved(overrides: Record<string, unknown> = {}): Promise<string> {
  const id = await listAndSubmit(seller, overrides);
  expect((await librarian.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
  return id;
}

const lines = async (client: Client) => {
  const res = await client.get('/api/basket');
  expect(res.status).toBe(200);
  return (res.body.basket.items as { bundleId: string; quantity: number }[]).map((i) => [i.bundleId, i.quantity]);
};

const storedLines = async () =>
  (await BasketItem.findAll({ where: { memberId: buyer.id }, order: [['addedAt', 'ASC']] })).map((i) => [i.bundleId, i.quantity]);

describe('the basket', () => {
  it('follows the member from one device to another, and adding a bundle twice keeps one line with the larger quantity', async () => {
    const strips = await shelved({ title: 'Basket strips', quantity: 3 });
    const squares = await shelved({ title: 'Basket squares' });

    const added = await phone.send('post', '/api/basket/items', { bundleId: strips });
    expect(added.status).toBe(200);
    expect(added.body.basket.items).toMatchObject([{ bundleId: strips, quantity: 1 }]);
    expect((await phone.send('post', '/api/basket/items', { bundleId: squares, quantity: 1 })).status).toBe(200);
    // On the laptop, the phone's basket, oldest line first.
    expect(await lines(laptop)).toEqual([
      [strips, 1],
      [squares, 1],
    ]);

    // A reload of the add link adds nothing; asking for more raises the line, asking for fewer leaves it.
    await laptop.send('post', '/api/basket/items', { bundleId: strips, quantity: 1 });
    await laptop.send('post', '/api/basket/items', { bundleId: strips, quantity: 3 });
    await laptop.send('post', '/api/basket/items', { bundleId: strips, quantity: 2 });
    expect(await lines(phone)).toEqual([
      [strips, 3],
      [squares, 1],
    ]);

    const lowered = await phone.send('patch', `/api/basket/items/${strips}`, { quantity: 2 });
    expect(lowered.status).toBe(200);
    expect(lowered.body.basket.items[0]).toMatchObject({ bundleId: strips, quantity: 2 });

    const removed = await laptop.send('delete', `/api/basket/items/${squares}`);
    expect(removed.status).toBe(200);
    expect(removed.body.basket.items.map((i: { bundleId: string }) => i.bundleId)).toEqual([strips]);
    // Taking out what another device took out already is no error.
    expect((await phone.send('delete', `/api/basket/items/${squares}`)).status).toBe(200);
    expect(await storedLines()).toEqual([[strips, 2]]);
    await phone.send('delete', `/api/basket/items/${strips}`);
  });

  it('loses what is ordered, on every device, and keeps the rest', async () => {
    const ordered = await shelved({ title: 'Basket order' });
    const kept = await shelved({ title: 'Basket kept' });
    await phone.send('post', '/api/basket/items', { bundleId: ordered });
    await phone.send('post', '/api/basket/items', { bundleId: kept });

    const placed = await laptop.send('post', '/api/orders', {
      items: [{ bundleId: ordered, quantity: 1 }],
      fulfilment: 'post',
      address: { name: 'Perpetua Hem', line1: '3 Loom Lane', town: 'Ferncombe', postalCode: '97452', country: 'US' },
    });
    expect(placed.status).toBe(201);
    expect(await lines(phone)).toEqual([[kept, 1]]);
    // Paying changes nothing more in the basket.
    await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl));
    expect(await lines(laptop)).toEqual([[kept, 1]]);
    await phone.send('delete', `/api/basket/items/${kept}`);
  });

  it('refuses what can never be ordered from it with a clear 4xx naming the field, and writes nothing', async () => {
    const own = await listAndSubmit(phone, { title: 'My own strips' });
    const notYet = await listAndSubmit(seller, { title: 'Still in review' });
    const starter = await shelved({ title: 'Basket starter', offer: 'starter', priceMinor: null, meetingHandoverOk: false });
    const onShelf = await shelved({ title: 'Basket refusals' });
    await librarian.send('post', `/api/bundles/${own}/review`, { decision: 'approve' });

    const cases: Array<[string, unknown, number, string | null]> = [
      ['own bundle', { bundleId: own }, 403, null],
      ['in review', { bundleId: notYet }, 409, 'bundleId'],
      ['starter', { bundleId: starter }, 422, 'bundleId'],
      ['no such bundle', { bundleId: '00000000-0000-4000-8000-000000000000' }, 404, null],
      ['not an id', { bundleId: 'strips' }, 400, 'bundleId'],
      ['no id', {}, 400, 'bundleId'],
      ['zero copies', { bundleId: onShelf, quantity: 0 }, 400, 'quantity'],
      ['too many copies', { bundleId: onShelf, quantity: 51 }, 400, 'quantity'],
      ['copies as words', { bundleId: onShelf, quantity: 'two' }, 400, 'quantity'],
      ['unknown field', { bundleId: onShelf, note: 'hold it for me' }, 400, 'note'],
    ];
    for (const [label, body, status, field] of cases) {
      const res = await phone.send('post', '/api/basket/items', body);
      expect(res.status, label).toBe(status);
      if (field) expect(Object.keys(res.body.error.fields ?? {}), label).toContain(field);
    }
    expect(await storedLines()).toEqual([]);

    await phone.send('post', '/api/basket/items', { bundleId: onShelf });
    for (const quantity of [0, 51, 1.5, '3']) {
      const res = await phone.send('patch', `/api/basket/items/${onShelf}`, { quantity });
      expect(res.status, String(quantity)).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['quantity']);
    }
    expect((await phone.send('patch', `/api/basket/items/${notYet}`, { quantity: 2 })).status).toBe(404);
    expect((await phone.send('patch', '/api/basket/items/not-an-id', { quantity: 2 })).status).toBe(404);
    expect(await storedLines()).toEqual([[onShelf, 1]]);

    // Signed out: nobody's basket.
    const stranger = new Client(api.runtime.app);
    await stranger.refreshSession();
    expect((await stranger.get('/api/basket')).status).toBe(401);
    expect((await stranger.send('post', '/api/basket/items', { bundleId: onShelf })).status).toBe(401);
    await phone.send('delete', `/api/basket/items/${onShelf}`);
  });

  it(`holds at most ${MAX_BASKET_LINES} bundles, and still takes more copies of one already in it`, async () => {
    const first = await shelved({ title: 'Basket limit', quantity: 5 });
    const sequelize = api.runtime.ctx.sequelize;
    // Copies of the shelved bundle, made in SQL rather than through 60 listings and reviews.
    const [columns] = await sequelize.query(
      `SELECT string_agg(quote_ident(column_name), ', ') AS list FROM information_schema.columns
       WHERE table_name = 'bundles' AND table_schema = current_schema() AND is_generated = 'NEVER' AND column_name <> 'id'`,
    );
    const list = (columns as { list: string }[])[0]!.list;
    await sequelize.query(`INSERT INTO bundles (id, ${list}) SELECT gen_random_uuid(), ${list} FROM bundles, generate_series(1, $2) WHERE id = $1`, {
      bind: [first, MAX_BASKET_LINES],
    });
    const [copies] = await sequelize.query(`SELECT id FROM bundles WHERE title = 'Basket limit' AND id <> $1`, { bind: [first] });
    const ids = (copies as { id: string }[]).map((c) => c.id);
    await sequelize.query(`INSERT INTO basket_items (member_id, bundle_id, quantity) SELECT $1, unnest($2::uuid[]), 1`, {
      bind: [buyer.id, [first, ...ids.slice(0, MAX_BASKET_LINES - 1)]],
    });

    const full = await phone.send('post', '/api/basket/items', { bundleId: ids.at(-1) });
    expect(full.status).toBe(422);
    expect(full.body.error.fields).toEqual({ bundleId: 'The basket is full.' });
    expect((await storedLines()).length).toBe(MAX_BASKET_LINES);
    const more = await phone.send('post', '/api/basket/items', { bundleId: first, quantity: 4 });
    expect(more.status).toBe(200);
    expect(more.body.basket.items).toHaveLength(MAX_BASKET_LINES);
    await BasketItem.destroy({ where: { memberId: buyer.id } });
  });
});
