import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { shelfQuerySchema } from '@scrap-relay/shared';
import { Bundle, BundlePhoto } from '../apps/api/src/db/models/index.ts';
import { keepShelfPage, pruneShelfPages, shelfPageKey } from '../apps/api/src/modules/bundles/shelf-pages.ts';
import { SHELF_RUN, shelfStatement } from '../apps/api/src/modules/bundles/shelf.query.ts';
import { Client, createMember, signedInClient, startTestApi, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';

// Pages of the shelf kept in PostgreSQL (apps/api/src/modules/bundles/shelf-pages.ts): a kept page is served
// again only while no change to the shelf has committed that its snapshot did not see.

let api: TestApi;
let sequelize: Sequelize;
let seller: Client;
let librarian: Client;
let buyer: Client;

beforeAll(async () => {
  api = await startTestApi();
  sequelize = api.runtime.ctx.sequelize;
  seller = await signedInClient(api.runtime.app, await createMember({ name: 'Maud Ashcombe' }));
  librarian = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian'], name: 'Osric Penhale' }));
  buyer = await signedInClient(api.runtime.app, await createMember({ name: 'Winnie Tregear' }));
});
afterAll(async () => {
  await api.close();
});

/** Lists a bundle with the word in its title and puts it on the shelf; returns its id. */
async function onShelf(title: string, more: Record<string, unknown> = {}): Promise<string> {
  const id = await listAndSubmit(seller, { title, ...more });
  expect((await librarian.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
  return id;
}

const search = async (word: string) => {
  const res = await buyer.get(`/api/bundles?q=${word}`);
  expect(res.status).toBe(200);
  return res;
};
const titles = async (word: string) => ((await search(word)).body.items as { title: string }[]).map((b) => b.title).sort();
const keyOf = (query: Record<string, string>) => shelfPageKey(shelfQuerySchema.parse(query), api.runtime.ctx.storage);
const select = <Row extends object>(sql: string, bind: unknown[] = []) => sequelize.query<Row>(sql, { bind, type: QueryTypes.SELECT });
const keptPages = async () => (await select<{ n: number }>('SELECT count(*)::int AS n FROM shelf_pages'))[0]!.n;

describe('kept shelf pages', () => {
  it('serves a kept page again with its ETag, and a 304 to a browser that has it', async () => {
    await onShelf('Tartan offcuts, heathermoor');
    const first = await search('heathermoor');
    expect(first.body.items).toHaveLength(1);
    expect(first.headers.etag).toMatch(/^W\/"/);

    // Marking the kept copy shows the next answer comes from it, not from the bundles.
    await sequelize.query(`UPDATE shelf_pages SET body = replace(body, 'Tartan', 'Kept') WHERE key = $1`, { bind: [keyOf({ q: 'heathermoor' })] });
    expect(await titles('heathermoor')).toEqual(['Kept offcuts, heathermoor']);

    const again = await buyer.get('/api/bundles?q=heathermoor').set('If-None-Match', first.headers.etag!);
    expect(again.status).toBe(304);
  });

  it('keeps a page without text (a prepared statement) and works it out again when a bundle comes on the shelf', async () => {
    // A weight no other test lists, so the page holds only this test's bundles.
    const weighed = '/api/bundles?minGrams=7777&maxGrams=7777';
    await onShelf('Flannel squares, first of two', { weightGrams: 7777 });
    const before = await buyer.get(weighed);
    expect(before.body.items.map((b: { title: string }) => b.title)).toEqual(['Flannel squares, first of two']);
    expect(await select('SELECT 1 FROM shelf_pages WHERE key = $1', [keyOf({ minGrams: '7777', maxGrams: '7777' })])).toHaveLength(1);

    await onShelf('Flannel squares, second of two', { weightGrams: 7777 });
    const after = await buyer.get(weighed);
    expect(after.body.items.map((b: { title: string }) => b.title).sort()).toEqual(['Flannel squares, first of two', 'Flannel squares, second of two']);
    expect(after.headers.etag).not.toBe(before.headers.etag);
  });

  it('is worked out again after a bundle changes on the shelf, loses a photo or leaves it, but not for a note the shelf never shows', async () => {
    const first = await onShelf('Corduroy ends, larkspire');
    const second = await onShelf('Velvet ends, larkspire');
    expect(await titles('larkspire')).toEqual(['Corduroy ends, larkspire', 'Velvet ends, larkspire']);

    await Bundle.update({ title: 'Needlecord ends, larkspire' }, { where: { id: first } });
    expect(await titles('larkspire')).toEqual(['Needlecord ends, larkspire', 'Velvet ends, larkspire']);

    // The card's photo is the bundle's first photo.
    const thumbOf = async () => (await search('larkspire')).body.items.find((b: { id: string }) => b.id === second).thumbUrl;
    const before = await thumbOf();
    await BundlePhoto.destroy({ where: { bundleId: second } });
    expect(await thumbOf()).not.toBe(before);

    // When the seller was warned of the bundle's end on the shelf is not on the shelf: the kept page stays.
    const changes = async () => (await select<{ n: number }>('SELECT count(*)::int AS n FROM shelf_changes'))[0]!.n;
    const changesBefore = await changes();
    await sequelize.query(`UPDATE bundles SET expiry_warned_for = expires_at, updated_at = now() WHERE id = $1`, { bind: [first] });
    expect(await changes()).toBe(changesBefore);

    expect((await seller.send('post', `/api/bundles/${second}/withdraw`)).status).toBe(200);
    expect(await titles('larkspire')).toEqual(['Needlecord ends, larkspire']);
  });

  it('is not kept as current when a change it did not see commits later, in whichever order changes commit', async () => {
    const older = await onShelf('Linen mix, quillbeck');
    const newer = await onShelf('Linen strips, quillbeck');

    // Two changes under way while a member reads the shelf; the one begun last commits first.
    const first = await sequelize.transaction();
    await Bundle.update({ title: 'Linen mix, quillbeck, retitled' }, { where: { id: older }, transaction: first });
    const second = await sequelize.transaction();
    await Bundle.update({ title: 'Linen strips, quillbeck, retitled' }, { where: { id: newer }, transaction: second });

    expect(await titles('quillbeck')).toEqual(['Linen mix, quillbeck', 'Linen strips, quillbeck']);
    await second.commit();
    expect(await titles('quillbeck')).toEqual(['Linen mix, quillbeck', 'Linen strips, quillbeck, retitled']);
    await first.commit();
    expect(await titles('quillbeck')).toEqual(['Linen mix, quillbeck, retitled', 'Linen strips, quillbeck, retitled']);
  });

  it('counts only pages read since the last crash of the database', async () => {
    await onShelf('Seersucker strips, dunwold');
    await search('dunwold');
    const key = keyOf({ q: 'dunwold' });
    expect(await select('SELECT 1 FROM shelf_pages WHERE key = $1', [key])).toHaveLength(1);
    await sequelize.query(`UPDATE shelf_pages SET body = replace(body, 'Seersucker', 'Stale') WHERE key = $1`, { bind: [key] });
    const [read] = await select<{ snapshot: string; run: string }>(`SELECT pg_current_snapshot()::text AS snapshot, (${SHELF_RUN}) AS run`);

    // A crash empties the unlogged tables: the changes, the kept pages and the run's mark. Here only the mark goes,
    // so the page kept before it is still there and must not be served.
    await sequelize.query('DELETE FROM shelf_run');
    expect(await titles('dunwold')).toEqual(['Seersucker strips, dunwold']);
    // That request found no mark and laid a new one; it kept nothing.
    const [mark] = await select<{ run: string | null }>(`SELECT (${SHELF_RUN}) AS run`);
    expect(mark!.run).not.toBeNull();
    expect(mark!.run).not.toBe(read!.run);

    // A page read before the crash and arriving after it is not kept; the next one read is.
    await sequelize.query('DELETE FROM shelf_pages WHERE key = $1', { bind: [key] });
    await keepShelfPage(sequelize, key, { snapshot: read!.snapshot, run: read!.run, madeAt: new Date() }, { body: '{"items":[]}', etag: null });
    expect(await select('SELECT 1 FROM shelf_pages WHERE key = $1', [key])).toEqual([]);
    expect(await titles('dunwold')).toEqual(['Seersucker strips, dunwold']);
    expect(await select('SELECT 1 FROM shelf_pages WHERE key = $1', [key])).toHaveLength(1);
  });

  it('forgets old pages and the changes no kept page needs, and refuses a page read before the floor', async () => {
    await onShelf('Wool felt, brackenhurst');
    await search('brackenhurst');
    const [read] = await select<{ snapshot: string; run: string; xmin: string }>(
      `SELECT pg_current_snapshot()::text AS snapshot, (${SHELF_RUN}) AS run, pg_snapshot_xmin(pg_current_snapshot())::text AS xmin`,
    );
    await Bundle.update({ title: 'Wool felt squares, brackenhurst' }, { where: { title: 'Wool felt, brackenhurst' } });

    // Every page kept so far made ten minutes ago: the prune clears them all and the floor comes up past the read
    // above (a transaction of the test's own background jobs may hold it back a while, so it is run until it has).
    await sequelize.query(`UPDATE shelf_pages SET made_at = now() - interval '10 minutes'`);
    expect(await pruneShelfPages(sequelize)).toBeGreaterThanOrEqual(1);
    const floorPassed = async () =>
      (await select<{ passed: boolean }>('SELECT xid > $1::xid8 AS passed FROM shelf_pages_floor', [read!.xmin]))[0]!.passed;
    for (let tries = 0; tries < 100 && !(await floorPassed()); tries += 1) {
      await new Promise((resolve) => setTimeout(resolve, 100));
      await pruneShelfPages(sequelize);
    }
    expect(await floorPassed()).toBe(true);
    expect(await keptPages()).toBe(0);
    // The change above is below the floor now, so it is gone from shelf_changes.
    expect(await select('SELECT 1 FROM shelf_changes WHERE xid >= $1::xid8', [read!.xmin])).toEqual([]);

    // A page read before that change and arriving after the prune: shelf_changes no longer says what it missed,
    // so it must not be kept.
    const key = keyOf({ q: 'brackenhurst' });
    await keepShelfPage(sequelize, key, { snapshot: read!.snapshot, run: read!.run, madeAt: new Date() }, { body: '{"items":[]}', etag: null });
    expect(await keptPages()).toBe(0);
    expect(await titles('brackenhurst')).toEqual(['Wool felt squares, brackenhurst']);
    expect(await keptPages()).toBe(1);
  });

  it('reads only the tables whose triggers record changes to the shelf', async () => {
    // A page showing something from another table would be kept past changes to it: give that table a trigger.
    // (A heuristic: it sees the tables these filter sets read, not those read inside a function.)
    const queries = [{}, { page: '3' }, { q: 'strips', cut: 'strips', size: 'strip_2_5' }, { offer: 'sale', sort: 'price_asc', maxPriceMinor: '900' }];
    for (const query of queries) {
      const { text, values } = shelfStatement(shelfQuerySchema.parse(query));
      const [row] = await select<{ 'QUERY PLAN': unknown }>(`EXPLAIN (VERBOSE, FORMAT JSON) ${text}`, values);
      const relations = new Set(JSON.stringify(row!['QUERY PLAN']).match(/"Relation Name":"[a-z_]+"/g));
      // shelf_run holds the run's mark, not anything shown.
      expect([...relations].sort()).toEqual(['"Relation Name":"bundle_photos"', '"Relation Name":"bundles"', '"Relation Name":"shelf_run"']);
    }
  });
});
