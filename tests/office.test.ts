import { processingCost } from '@scrap-relay/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { Bundle, Guild, Meeting, Member, Order, Payout } from '../apps/api/src/db/models/index.ts';
import { expireBundles, SHELF_WARNING_DAYS, warnBundlesLeavingShelf } from '../apps/api/src/jobs/scheduled.ts';
import { createMember, listenOnApiPort, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';
import { serviceEnv, waitForMail } from './support/services.ts';
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

/** Cents as the CSV exports write them for the test guild's USD (two decimals): 5170 → "51.70", -5 → "-0.05". */
const csvDollars = (minor: number) => `${minor < 0 ? '-' : ''}${Math.floor(Math.abs(minor) / 100)}.${String(Math.abs(minor) % 100).padStart(2, '0')}`;

const todayFigures = async (client = treasurerClient) => (await client.get(`/api/dashboard?period=custom&from=${today()}&to=${today()}`)).body.figures;
const statement = async () => (await treasurerClient.get(`/api/reports/statement?month=${thisMonth()}`)).body.statement;

describe('the dashboard and the month-end statement', () => {
  it('count a known history exactly, by hand-worked figures, and the CSV agrees with the page', async () => {
    const before = await todayFigures();
    const statementBefore = await statement();

    // 1. A sale with postage: 1200 + 730 postage (454 g in a padded mailer, local band, plus handling); guild fee 120.
    const sale = await shelved({ title: 'Dashboard sale', priceMinor: 1200, weightGrams: 454 });
    const saleOrder = await paidOrder(sale);
    // Posted, so its credit may be paid out in step 5.
    expect((await sellerClient.send('post', `/api/orders/${saleOrder}/posted`, {})).status).toBe(200);
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
    expect(after.money.fundsRaisedMinor).toBe(after.money.guildFeesMinor - after.money.processingCostMinor - after.money.disputeFeesMinor);
    // Seller credits: 1200 − 120 + 730 = 1810 kept; the refunded order's 2000 − 200 + 730 = 2530 came and went.
    expect(after.money.sellerCreditsMinor - before.money.sellerCreditsMinor).toBe(1810);
    expect(after.money.payoutsMinor - before.money.payoutsMinor).toBe(500);
    expect(after.money.refundsMinor - before.money.refundsMinor).toBe(2730);
    expect(after.money.postagePaidMinor - before.money.postagePaidMinor).toBe(730);

    const csv = (await treasurerClient.get(`/api/dashboard.csv?period=custom&from=${today()}&to=${today()}`)).text;
    const csvValue = (name: string) => csv.split('\n').find((line) => line.startsWith(`${name},`))?.split(',')[1];
    expect(Number(csvValue('weight_rehomed_grams'))).toBe(after.weightRehomedGrams);
    // Money as dollars and cents (the test guild's USD has two decimals), never as a count of cents a spreadsheet misreads.
    expect(csvValue('funds_raised_in_currency_units')).toBe(csvDollars(after.money.fundsRaisedMinor));
    expect(csvValue('processing_cost_in_currency_units')).toBe(csvDollars(after.money.processingCostMinor));
    expect(csvValue('currency')).toBe('USD');
    expect(csv).not.toContain('_minor');

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
    const lines = csv.trim().split('\n');
    expect(lines[0]).toBe('line,seller,amount_in_currency_units,currency');
    // 5170 cents is written 51.70: the header says the amounts are in the currency's units.
    expect(lines).toContain(`charges,,${csvDollars(s.chargesMinor)},USD`);
    expect(lines).toContain(`closing_balances_total,,${csvDollars(s.closingBalancesTotalMinor)},USD`);
  });

  it('exports the ledger in dollars and cents with the currency, and gives each entry the order it belongs to', async () => {
    // A sale of 1250 plus postage: the buyers' line is minus the whole charge, the guild's fee (10 %) is 1.25.
    const id = await shelved({ title: 'Ledger CSV sale', priceMinor: 1250, weightGrams: 454 });
    const orderId = await paidOrder(id);
    const order = (await Order.findByPk(orderId))!;

    const json = await treasurerClient.get('/api/ledger?kind=charge');
    const charge = json.body.items.find((e: { orderReference: string | null }) => e.orderReference === order.reference);
    expect(charge).toMatchObject({ orderId, account: 'buyer', amountMinor: -order.chargeMinor, currency: 'USD' });

    const csv = await treasurerClient.get('/api/ledger.csv');
    const lines = csv.text.trim().split('\n');
    expect(lines[0]).toBe('time_in_UTC,transaction,kind,reverses,account,amount_in_currency_units,currency,order,payout');
    const ofOrder = lines.filter((line) => line.includes(`,${order.reference},`)).map((line) => line.split(','));
    expect(ofOrder.find((cells) => cells[2] === 'charge')?.slice(5, 8)).toEqual([csvDollars(-order.chargeMinor), 'USD', order.reference]);
    expect(ofOrder.find((cells) => cells[2] === 'guild_fee')?.slice(5, 7)).toEqual(['1.25', 'USD']);
    expect(csv.text).not.toContain(`,${-order.chargeMinor},`);
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

describe('the office’s days and months are the guild’s', () => {
  /** The guild's settings with another time zone, saved as an admin saves them (which rebuilds the tallies). */
  async function saveGuildZone(admin: Client, timeZone: string) {
    const current = (await admin.get('/api/guild/settings')).body.settings;
    const res = await admin.send('put', '/api/guild/settings', { ...current, timeZone });
    expect(res.status).toBe(200);
    expect(res.body.settings.timeZone).toBe(timeZone);
  }
  const statementOf = async (month: string) => (await treasurerClient.get(`/api/reports/statement?month=${month}`)).body.statement;
  /** Card payments the ledger shows for 1–30 November 2025 (its days are the guild's). */
  async function ledgerCardPaymentsInNovember(): Promise<number> {
    const res = await treasurerClient.get('/api/ledger?from=2025-11-01&to=2025-11-30&kind=charge');
    expect(res.status).toBe(200);
    return res.body.items.reduce((sum: number, e: { amountMinor: number }) => sum - e.amountMinor, 0);
  }
  const tallyDifferences = async () =>
    api.runtime.ctx.sequelize.query(
      `WITH kept AS (SELECT grain, day, figure, key, sum(amount)::bigint AS amount FROM office_tallies GROUP BY 1, 2, 3, 4 HAVING sum(amount) <> 0)
       (SELECT * FROM kept EXCEPT SELECT * FROM office_tallies_expected()) UNION ALL (SELECT * FROM office_tallies_expected() EXCEPT SELECT * FROM kept)`,
      { type: QueryTypes.SELECT },
    );

  it('count a payment at 23:30 on 30 November in Los Angeles in November, as the ledger does, and move it when the zone changes', async () => {
    const admin = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'admin'] }));
    const original = (await admin.get('/api/guild/settings')).body.settings.timeZone as string;
    await saveGuildZone(admin, 'America/Los_Angeles');
    try {
      const novemberBefore = await statementOf('2025-11');
      const decemberBefore = await statementOf('2025-12');
      const novemberDays = async () => (await treasurerClient.get('/api/dashboard?period=custom&from=2025-11-01&to=2025-11-30')).body.figures;
      const daysBefore = await novemberDays();
      // 1930 = 1200 + 730 postage, as in the known history above.
      const order = await paidOrder(await shelved({ title: 'Last-evening sale', priceMinor: 1200, weightGrams: 454 }));
      // Paid at 23:30 on 30 November in Los Angeles, which is 07:30 UTC on 1 December (Pacific Standard Time is
      // UTC−8 from 2 November 2025, when summer time ended: the US rule of the first Sunday in November, from memory).
      const paidAt = '2025-12-01T07:30:00Z';
      await api.runtime.ctx.sequelize.query(`UPDATE orders SET paid_at = $1 WHERE id = $2`, { bind: [paidAt, order] });
      await api.runtime.ctx.sequelize.query(`UPDATE ledger_entries SET created_at = $1 WHERE order_id = $2`, { bind: [paidAt, order] });

      const november = await statementOf('2025-11');
      expect(november.chargesMinor - novemberBefore.chargesMinor).toBe(1930);
      expect((await statementOf('2025-12')).chargesMinor).toBe(decemberBefore.chargesMinor);
      // The ledger filtered to 1–30 November and November's statement add up the same card payments.
      expect(await ledgerCardPaymentsInNovember()).toBe(november.chargesMinor);
      // The dashboard's custom days are the guild's too: 1 November begins at 07:00 UTC (still summer time, UTC−7).
      const days = await novemberDays();
      expect(days.period).toMatchObject({ from: '2025-11-01T07:00:00.000Z', to: '2025-12-01T08:00:00.000Z' });
      expect(days.money.postagePaidMinor - daysBefore.money.postagePaidMinor).toBe(730);
      expect(days.weightRehomedGrams - daysBefore.weightRehomedGrams).toBe(454);
      expect(await tallyDifferences()).toEqual([]);

      // On UTC the same payment falls on 1 December: the tallies are rebuilt with the setting, so it moves month.
      await saveGuildZone(admin, 'UTC');
      expect((await statementOf('2025-11')).chargesMinor).toBe(novemberBefore.chargesMinor);
      expect((await statementOf('2025-12')).chargesMinor - decemberBefore.chargesMinor).toBe(1930);
      expect(await ledgerCardPaymentsInNovember()).toBe((await statementOf('2025-11')).chargesMinor);
      expect(await tallyDifferences()).toEqual([]);

      await saveGuildZone(admin, 'America/Los_Angeles');
      expect((await statementOf('2025-11')).chargesMinor).toBe(november.chargesMinor);
      expect(await tallyDifferences()).toEqual([]);
    } finally {
      await saveGuildZone(admin, original);
    }
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

/** E-mail jobs queued for one address, with the kind each was filed under (pg-boss keeps them in its job table). */
async function queuedMail(email: string, subjectIncludes: string) {
  const [rows] = await api.runtime.ctx.sequelize.query(
    `SELECT data->>'subject' AS subject, data->>'kind' AS kind FROM pgboss.job WHERE name = 'email-send' AND data->>'to' = $1 AND data->>'subject' LIKE $2`,
    { bind: [email, `%${subjectIncludes}%`] },
  );
  return rows as { subject: string; kind: string | null }[];
}
const oneLine = (text: string) => text.replace(/\s+/g, ' ');
const dollars = (cents: number) => `$${(cents / 100).toFixed(2)}`;

describe('the payout e-mail', () => {
  it('tells the seller the amount, the moment in the guild’s time zone, what the guild still owes and what waits for bags not yet sent, queued with the payout', async () => {
    const payee = await createMember({ name: 'Orla Penhallow' });
    const payeeClient = await signedInClient(api.runtime.app, payee);
    const id = await listAndSubmit(payeeClient, { title: 'Payout sale', priceMinor: 1200, weightGrams: 454 });
    await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    const orderId = await paidOrder(id);
    // Posted, so its whole credit may be paid out.
    expect((await payeeClient.send('post', `/api/orders/${orderId}/posted`, {})).status).toBe(200);
    // A second sale, paid but not posted yet: its credit waits, is not offered for payout, and the e-mail says so.
    const unposted = await listAndSubmit(payeeClient, { title: 'Payout sale not yet posted', priceMinor: 900, weightGrams: 454 });
    await librarianClient.send('post', `/api/bundles/${unposted}/review`, { decision: 'approve' });
    const waiting = (await Order.findByPk(await paidOrder(unposted)))!.sellerCreditMinor;
    const balances = await treasurerClient.get('/api/seller-balances');
    const row = balances.body.items.find((b: { sellerId: string }) => b.sellerId === payee.id);
    expect(row.waitingMinor).toBe(waiting);
    const owed = row.payableMinor as number;
    expect(owed).toBeGreaterThan(250);

    // India keeps UTC+05:30 all year (IANA time zone database), so the local time is the UTC time plus 5 h 30 min.
    const guild = (await Guild.findByPk(1))!;
    const settings = guild.settings;
    await guild.update({ settings: { ...settings, timeZone: 'Asia/Kolkata' } });
    try {
      const tooMuch = await treasurerClient.send('post', '/api/payouts', { sellerId: payee.id, amountMinor: owed + 1, method: 'cash' });
      expect(tooMuch.status).toBe(422);
      expect(await queuedMail(payee.email, 'The guild paid you')).toHaveLength(0);

      const paid = await treasurerClient.send('post', '/api/payouts', { sellerId: payee.id, amountMinor: owed - 250, method: 'bank_transfer', reference: 'FPG <0042>' });
      expect(paid.status).toBe(201);
      const payout = (await Payout.findByPk(paid.body.payout.id))!;
      expect(payout.amountMinor).toBe(owed - 250);

      const mail = await waitForMail({ to: payee.email, subjectIncludes: `The guild paid you ${dollars(owed - 250)}` });
      const local = new Date(payout.createdAt.getTime() + 330 * 60_000);
      const months = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
      const hour = local.getUTCHours() % 12 || 12;
      const when = `${months[local.getUTCMonth()]} ${local.getUTCDate()}, ${local.getUTCFullYear()} at ${hour}:${String(local.getUTCMinutes()).padStart(2, '0')} ${local.getUTCHours() < 12 ? 'AM' : 'PM'} GMT+5:30`;
      const text = oneLine(mail.text);
      expect(text).toContain(`a payout of ${dollars(owed - 250)} to you by bank transfer on`);
      expect(text).toContain(when);
      expect(text).toContain('Reference: FPG <0042>.');
      expect(text).toContain('still owes you $2.50 for your sales');
      expect(text).toContain(`A further ${dollars(waiting)} is for bags you have not posted or handed over yet`);
      expect(text).toContain(`${serviceEnv().appUrl}/orders?as=seller`);
      expect(mail.html).toContain('FPG &lt;0042&gt;');
      expect(mail.html).not.toContain('<0042>');
      // Money e-mail: always sent, so it names no e-mail choice to untick.
      expect(mail.text).not.toContain('E-mails you receive');
      expect((await queuedMail(payee.email, 'The guild paid you'))[0]!.kind).toBeNull();

      expect((await treasurerClient.send('post', '/api/payouts', { sellerId: payee.id, amountMinor: 250, method: 'cash' })).status).toBe(201);
      const last = await waitForMail({ to: payee.email, subjectIncludes: 'The guild paid you $2.50' });
      expect(oneLine(last.text)).toContain('to you in cash on');
      expect(oneLine(last.text)).toContain('paid you everything your sales earned so far');
    } finally {
      await guild.update({ settings });
    }
  });
});

describe('wish e-mails', () => {
  it('refuses a second wish with the same filters, naming them and the wish that has them, and writes nothing', async () => {
    const wisher = await createMember({ name: 'Ivo Penhale' });
    const wisherClient = await signedInClient(api.runtime.app, wisher);
    expect((await wisherClient.send('post', '/api/wishes', { name: 'Dark batik', filters: { fibre: 'batik', value: 'dark' } })).status).toBe(201);

    // The same filters in another order and under another name are still the same wish.
    const twin = await wisherClient.send('post', '/api/wishes', { name: 'Batik again', filters: { value: 'dark', fibre: 'batik', q: '' } });
    expect(twin.status).toBe(409);
    expect(twin.body.error.code).toBe('conflict');
    expect(twin.body.error.message).toBe('You already have a wish for these filters (Batik, dark): “Dark batik”.');
    expect(twin.body.error.fields).toEqual({ filters: 'Already saved as your wish “Dark batik”.' });
    const [rows] = await api.runtime.ctx.sequelize.query('SELECT name FROM wishes WHERE member_id = $1', { bind: [wisher.id] });
    expect(rows).toEqual([{ name: 'Dark batik' }]);

    // One filter more is another wish; another member may wish for the very same.
    expect((await wisherClient.send('post', '/api/wishes', { name: 'Dark batik strips', filters: { fibre: 'batik', value: 'dark', cut: 'strips' } })).status).toBe(201);
    expect((await memberClient.send('post', '/api/wishes', { name: 'Dark batik', filters: { fibre: 'batik', value: 'dark' } })).status).toBe(201);
  });

  it('sends a member one e-mail naming every wish a newly approved bundle matches, with the profile link at the end', async () => {
    const wisher = await createMember({ name: 'Wren Tolley' });
    const wisherClient = await signedInClient(api.runtime.app, wisher);
    for (const wish of [
      { name: 'Any strips', filters: { cut: 'strips' } },
      { name: 'Cool colours', filters: { family: 'cool' } },
      { name: 'Flannel only', filters: { fibre: 'flannel' } },
    ]) {
      expect((await wisherClient.send('post', '/api/wishes', wish)).status).toBe(201);
    }
    // Member-written text stays escaped in the HTML body.
    const id = await listAndSubmit(sellerClient, { title: 'Strips <b>and</b> more', cutKinds: ['strips'], colourFamily: 'cool', fibre: 'quilting_cotton' });
    expect((await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);

    const [notified] = await api.runtime.ctx.sequelize.query(
      `SELECT w.name FROM wish_notifications n JOIN wishes w ON w.id = n.wish_id WHERE n.bundle_id = $1 AND w.member_id = $2 ORDER BY w.name`,
      { bind: [id, wisher.id] },
    );
    expect((notified as { name: string }[]).map((r) => r.name)).toEqual(['Any strips', 'Cool colours']);
    const queued = await queuedMail(wisher.email, 'A bundle for');
    expect(queued).toEqual([{ subject: 'A bundle for your wishes "Any strips" and "Cool colours": Strips <b>and</b> more', kind: 'wishes' }]);

    const mail = await waitForMail({ to: wisher.email, subjectIncludes: 'A bundle for your wishes' });
    expect(mail.text).toContain('A bundle that matches 2 of your wishes just went on the shelf');
    expect(oneLine(mail.text)).toContain('- Any strips - Cool colours');
    expect(mail.text).not.toContain('Flannel only');
    expect(mail.html).toContain('Strips &lt;b&gt;and&lt;/b&gt; more');
    expect(mail.html).not.toContain('<b>and</b>');

    const profile = `${serviceEnv().appUrl}/profile`;
    expect(mail.text.trimEnd().endsWith(profile)).toBe(true);
    expect(oneLine(mail.text)).toContain('“A new bundle matches one of my wishes” is ticked under “E-mails you receive” on your profile');
    expect(mail.html).toContain(`<a href="${profile}"`);
    expect(mail.html.indexOf(`href="${profile}"`)).toBeGreaterThan(mail.html.indexOf('Have a look'));
  });

  it('puts the profile link under the librarian’s e-mails too', async () => {
    const id = await listAndSubmit(sellerClient, { title: 'Returned for a footer' });
    await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'return', notes: 'Please add a photo of the <selvage>.' });
    const mail = await waitForMail({ to: seller.email, subjectIncludes: 'A note from the librarian about Returned for a footer' });
    expect(mail.text.trimEnd().endsWith(`${serviceEnv().appUrl}/profile`)).toBe(true);
    expect(oneLine(mail.text)).toContain('“The librarian approved or returned my listing” is ticked');
    expect(mail.html).toContain('&lt;selvage&gt;');
  });
});

// Last in the file: the clock moves months ahead and every bundle still on the shelf comes off.
describe('a bundle’s time on the shelf ending', () => {
  const DAY = 24 * 60 * 60 * 1000;
  const setClock = (at: number) => api.clock.advance(at - api.clock.now().getTime());

  it('warns the seller once a week before, then says how long it was there and that relisting means review again', async () => {
    const owner = await createMember({ name: 'Bryony Askew' });
    // Neither e-mail is one a member can turn off: no choice on the profile is about the shelf.
    await owner.update({ emailPreferences: { review: false, wishes: false } });
    const ownerClient = await signedInClient(api.runtime.app, owner);
    const id = await listAndSubmit(ownerClient, { title: 'Shelf-worn fat quarters' });
    await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    const shelved = (await Bundle.findByPk(id))!;
    const expiresAt = shelved.expiresAt!.getTime();
    const onShelfAt = shelved.onShelfAt!.getTime();
    const warnedFor = async () => {
      const [rows] = await api.runtime.ctx.sequelize.query(`SELECT expiry_warned_for FROM bundles WHERE id = $1`, { bind: [id] });
      return (rows as { expiry_warned_for: Date | null }[])[0]!.expiry_warned_for;
    };

    try {
      // A day before the warning is due: nothing yet.
      setClock(expiresAt - (SHELF_WARNING_DAYS + 1) * DAY);
      await warnBundlesLeavingShelf(api.runtime.ctx);
      expect(await warnedFor()).toBeNull();

      // Within the week: two processes running the job at once warn once between them.
      setClock(expiresAt - (SHELF_WARNING_DAYS - 1) * DAY);
      await Promise.all([warnBundlesLeavingShelf(api.runtime.ctx), warnBundlesLeavingShelf(api.runtime.ctx)]);
      await warnBundlesLeavingShelf(api.runtime.ctx);
      expect((await warnedFor())!.getTime()).toBe(expiresAt);
      expect(await queuedMail(owner.email, 'Coming off the shelf soon')).toEqual([{ subject: 'Coming off the shelf soon: Shelf-worn fat quarters', kind: null }]);
      const daysSoFar = Math.floor((expiresAt - (SHELF_WARNING_DAYS - 1) * DAY - onShelfAt) / DAY);
      const warning = oneLine((await waitForMail({ to: owner.email, subjectIncludes: 'Coming off the shelf soon' })).text);
      expect(warning).toContain(`has been on the guild's shelf for ${daysSoFar} days`);
      expect(warning).toContain('goes through the librarian’s review again');
      expect(warning).toContain(`${serviceEnv().appUrl}/bundles/${id}`);
      expect(warning).not.toContain('E-mails you receive');

      // An hour past its end: off the shelf, and the e-mail gives the time it was there, not the guild's setting.
      setClock(expiresAt + 60 * 60 * 1000);
      await expireBundles(api.runtime.ctx);
      expect((await Bundle.findByPk(id))!.state).toBe('expired');
      const daysOn = Math.floor((expiresAt + 60 * 60 * 1000 - onShelfAt) / DAY);
      expect(await queuedMail(owner.email, 'Off the shelf')).toEqual([{ subject: `Off the shelf after ${daysOn} days: Shelf-worn fat quarters`, kind: null }]);
      const expired = oneLine((await waitForMail({ to: owner.email, subjectIncludes: 'Off the shelf after' })).text);
      expect(expired).toContain(`was on the guild's shelf for ${daysOn} days, since`);
      expect(expired).toContain('A relisted bundle goes through the librarian’s review again before it goes back on the shelf');
      expect(expired).toContain(`${serviceEnv().appUrl}/bundles/${id}`);

      // Relisted and approved again: a new time on the shelf, so a new warning when it nears its new end.
      expect((await ownerClient.send('post', `/api/bundles/${id}/submit`)).status).toBe(200);
      await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
      const nextEnd = (await Bundle.findByPk(id))!.expiresAt!.getTime();
      expect(nextEnd).toBeGreaterThan(expiresAt);
      setClock(nextEnd - (SHELF_WARNING_DAYS - 1) * DAY);
      await warnBundlesLeavingShelf(api.runtime.ctx);
      expect((await warnedFor())!.getTime()).toBe(nextEnd);
      expect(await queuedMail(owner.email, 'Coming off the shelf soon')).toHaveLength(2);
    } finally {
      api.clock.reset();
    }
  });
});
