import { processingCost } from '@scrap-relay/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Meeting, Order, type Member } from '../apps/api/src/db/models/index.ts';
import { createMember, listenOnApiPort, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';
import { payCheckout, sessionIdFromUrl } from './support/stripe-fake.ts';

let api: TestApi;
let stopListening: () => Promise<void>;
let seller: Member;
let sellerClient: Client;
let buyerClient: Client;
let librarianClient: Client;
let treasurerClient: Client;
let memberClient: Client;

const address = { name: 'Pearl Dunmore', line1: '4 Weir Lane', town: 'Millbrook', postalCode: '97451', country: 'US' };
const today = () => new Date().toISOString().slice(0, 10);
const thisMonth = () => new Date().toISOString().slice(0, 7);

beforeAll(async () => {
  api = await startTestApi();
  stopListening = await listenOnApiPort(api);
  seller = await createMember({ name: 'Hetty Blanchard' });
  sellerClient = await signedInClient(api.runtime.app, seller);
  buyerClient = await signedInClient(api.runtime.app, await createMember({ name: 'Pearl Dunmore' }));
  librarianClient = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian'] }));
  treasurerClient = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'treasurer'] }));
  memberClient = await signedInClient(api.runtime.app, await createMember());
});
afterAll(async () => {
  await stopListening();
  await api.close();
});

async function shelved(overrides: Record<string, unknown>) {
  const id = await listAndSubmit(sellerClient, overrides);
  await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
  return id;
}

async function paidOrder(bundleId: string) {
  const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
  expect(placed.status).toBe(201);
  await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl));
  for (let i = 0; i < 100 && (await Order.findByPk(placed.body.order.id))!.state !== 'confirmed'; i++) await new Promise((r) => setTimeout(r, 100));
  return placed.body.order.id as string;
}

const todayFigures = async (client = treasurerClient) => (await client.get(`/api/dashboard?period=custom&from=${today()}&to=${today()}`)).body.figures;
const statement = async () => (await treasurerClient.get(`/api/reports/statement?month=${thisMonth()}`)).body.statement;

describe('the dashboard and the month-end statement', () => {
  it('count a known history exactly, by hand-worked figures, and the CSV agrees with the page', async () => {
    const before = await todayFigures();
    const statementBefore = await statement();

    // 1. A sale with postage: 1200 + 730 postage (454 g in a padded mailer, local band, plus handling); guild fee 120.
    const sale = await shelved({ title: 'Dashboard sale', priceMinor: 1200, weightGrams: 454 });
    await paidOrder(sale);
    // 2. A free meeting handover of 300 g.
    const meeting = await Meeting.create({ startsAt: new Date(Date.now() + 5 * 86_400_000), place: 'Hall', createdBy: null });
    const gift = await shelved({ title: 'Dashboard gift', offer: 'meeting', priceMinor: null, meetingHandoverOk: false, weightGrams: 300 });
    expect((await buyerClient.send('post', '/api/orders', { items: [{ bundleId: gift, quantity: 1 }], fulfilment: 'meeting', meetingId: meeting.id })).status).toBe(201);
    // 3. A sale of 2000 + 730 postage, paid and then cancelled by the seller: refunded, so not rehomed.
    const refunded = await shelved({ title: 'Dashboard refund', priceMinor: 2000, weightGrams: 454 });
    const refundedOrder = await paidOrder(refunded);
    expect((await sellerClient.send('post', `/api/orders/${refundedOrder}/cancel`, { reason: 'Changed my mind' })).status).toBe(200);
    // 4. A starter claim of 454 g by a new quilter.
    const starter = await shelved({ title: 'Dashboard starter', offer: 'starter', priceMinor: null, meetingHandoverOk: false, weightGrams: 454 });
    const newcomer = await signedInClient(api.runtime.app, await createMember({ joinedAt: new Date(Date.now() - 10 * 86_400_000) }));
    expect((await newcomer.send('post', `/api/starter-bundles/${starter}/claims`, {})).status).toBe(201);
    // 5. A payout of 500 to the seller.
    expect((await treasurerClient.send('post', '/api/payouts', { sellerId: seller.id, amountMinor: 500, method: 'cash' })).status).toBe(201);

    const after = await todayFigures();
    const units = (f: typeof after, offer: string) => f.bundlesRehomedByOffer.find((r: { offer: string }) => r.offer === offer)?.units ?? 0;
    expect(after.weightRehomedGrams - before.weightRehomedGrams).toBe(454 + 300 + 454);
    expect(units(after, 'sale') - units(before, 'sale')).toBe(1);
    expect(units(after, 'meeting') - units(before, 'meeting')).toBe(1);
    expect(units(after, 'starter') - units(before, 'starter')).toBe(1);
    expect(after.newQuiltersServed - before.newQuiltersServed).toBe(1);
    // Fees: 120 kept, 200 charged and reversed by the refund. The card costs of both charges stay with the guild
    // (the processor keeps its fee on a refund; from memory), and funds raised is the fees less them.
    expect(after.money.guildFeesMinor - before.money.guildFeesMinor).toBe(120);
    // The guild's default card rate (2.9 % + 30¢) on the two charges of 1930 and 2730.
    expect(after.money.processingCostMinor - before.money.processingCostMinor).toBe(processingCost(1930) + processingCost(2730));
    expect(after.money.fundsRaisedMinor).toBe(after.money.guildFeesMinor - after.money.processingCostMinor);
    // Seller credits: 1200 − 120 + 730 = 1810 kept; the refunded order's 2000 − 200 + 730 = 2530 came and went.
    expect(after.money.sellerCreditsMinor - before.money.sellerCreditsMinor).toBe(1810);
    expect(after.money.payoutsMinor - before.money.payoutsMinor).toBe(500);
    expect(after.money.refundsMinor - before.money.refundsMinor).toBe(2730);
    expect(after.money.postagePaidMinor - before.money.postagePaidMinor).toBe(730);

    const csv = (await treasurerClient.get(`/api/dashboard.csv?period=custom&from=${today()}&to=${today()}`)).text;
    const csvValue = (name: string) => csv.split('\n').find((line) => line.startsWith(`${name},`))?.split(',')[1];
    expect(Number(csvValue('weight_rehomed_grams'))).toBe(after.weightRehomedGrams);
    expect(Number(csvValue('funds_raised_minor'))).toBe(after.money.fundsRaisedMinor);
    expect(Number(csvValue('processing_cost_minor'))).toBe(after.money.processingCostMinor);

    const s = await statement();
    expect(s.chargesMinor - statementBefore.chargesMinor).toBe(1930 + 2730);
    expect(s.refundsMinor - statementBefore.refundsMinor).toBe(2730);
    expect(s.guildFeesMinor - statementBefore.guildFeesMinor).toBe(120);
    expect(s.payoutsMinor - statementBefore.payoutsMinor).toBe(500);
    const hetty = s.closingBalances.find((b: { sellerId: string }) => b.sellerId === seller.id);
    expect(hetty.balanceMinor).toBe(1810 - 500);
  });

  it('ties the statement’s totals to the ledger', async () => {
    const s = await statement();
    const [rows] = await api.runtime.ctx.sequelize.query(
      `SELECT coalesce(-sum(amount_minor) FILTER (WHERE kind = 'charge'), 0)::int AS charges,
              coalesce(sum(amount_minor) FILTER (WHERE account = 'payouts'), 0)::int AS payouts,
              coalesce(sum(amount_minor) FILTER (WHERE account LIKE 'seller:%'), 0)::int AS owed
       FROM ledger_entries WHERE to_char(created_at AT TIME ZONE 'UTC', 'YYYY-MM') = $1`,
      { bind: [thisMonth()] },
    );
    const ledger = (rows as { charges: number; payouts: number }[])[0]!;
    expect(s.chargesMinor).toBe(ledger.charges);
    expect(s.payoutsMinor).toBe(ledger.payouts);
    const [all] = await api.runtime.ctx.sequelize.query(`SELECT coalesce(sum(amount_minor), 0)::int AS owed FROM ledger_entries WHERE account LIKE 'seller:%'`);
    expect(s.closingBalancesTotalMinor).toBe((all as { owed: number }[])[0]!.owed);
    const csv = (await treasurerClient.get(`/api/reports/statement.csv?month=${thisMonth()}`)).text;
    expect(csv).toContain(`charges,,${s.chargesMinor}`);
  });

  it('shows members the figures without money, and keeps the statement to officers', async () => {
    const figures = await todayFigures(memberClient);
    expect(figures.money).toBeNull();
    expect(figures.weightRehomedGrams).toBeGreaterThan(0);
    expect((await memberClient.get(`/api/reports/statement?month=${thisMonth()}`)).status).toBe(403);
    expect((await memberClient.get('/api/dashboard?period=custom&from=2026-12-01')).status).toBe(400);
  });

  it('gives the librarian review, starter and handover activity', async () => {
    const res = await librarianClient.get('/api/reports/librarian?period=all');
    expect(res.status).toBe(200);
    expect(res.body.report.review.approved).toBeGreaterThanOrEqual(4);
    expect(res.body.report.starter.claims).toBeGreaterThanOrEqual(1);
  });
});

describe('the member’s own profile', () => {
  it('edits name, units and e-mail choices, shows history, and exports the member’s data', async () => {
    const patched = await sellerClient.send('patch', '/api/me', { name: 'Hetty B.', units: 'metric', emailPreferences: { wishes: false } });
    expect(patched.status).toBe(200);
    expect(patched.body.profile).toMatchObject({ name: 'Hetty B.', units: 'metric', emailPreferences: { wishes: false } });
    expect((await sellerClient.send('patch', '/api/me', { emailPreferences: { money: false } })).status).toBe(400);
    const history = await sellerClient.get('/api/me/history');
    expect(history.body.history.bundlesRehomed).toBeGreaterThanOrEqual(3);
    const data = await sellerClient.get('/api/me/export');
    expect(data.headers['content-disposition']).toMatch(/attachment/);
    expect(data.body.profile.email).toBe(seller.email);
    expect(data.body.ordersAsSeller.every((o: { address: unknown }) => o.address === null)).toBe(true);
  });

  it('closes an account: personal data goes, money records stay', async () => {
    const leaver = await createMember({ name: 'Lena Leaving' });
    const client = await signedInClient(api.runtime.app, leaver);
    expect((await client.send('post', '/api/me/close', { password: 'wrong-password-here' })).status).toBe(401);
    expect((await client.send('post', '/api/me/close', { password: 'long-enough-password' })).status).toBe(204);
    const [rows] = await api.runtime.ctx.sequelize.query(`SELECT name, email, active, closed_at FROM members WHERE id = $1`, { bind: [leaver.id] });
    expect((rows as { name: string; email: string; active: boolean }[])[0]).toMatchObject({ name: 'Former member', active: false });
    expect((rows as { email: string }[])[0]!.email).not.toContain('millbrook');
  });
});
