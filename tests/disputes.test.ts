import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { Bundle, Guild, LedgerEntry, Order, OrderDispute, OrderItem, type Member } from '../apps/api/src/db/models/index.ts';
import { guildTimeZone } from '../apps/api/src/modules/guild/guild.service.ts';
import { countRows, createMember, listenOnApiPort, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';
import { clearMail, waitForMail } from './support/services.ts';
import {
  answerDispute,
  closeDispute,
  deliveredEvent,
  openDispute,
  payCheckout,
  resendEvent,
  sessionIdFromUrl,
  stripeEvents,
} from './support/stripe-fake.ts';

let api: TestApi;
let stopListening: () => Promise<void>;
let seller: Member;
let sellerClient: Client;
let buyerClient: Client;
let librarianClient: Client;
let treasurer: Member;
let otherTreasurer: Member;
let treasurerClient: Client;

const address = { name: 'Nell Marchbank', line1: '12 Tenter Row', town: 'Ferncombe', postalCode: '97452', country: 'US' };
const thisMonth = () => new Date().toISOString().slice(0, 7);

/*
 * Every order here is one bundle of $12.00 and 454 g, posted to a US address. Hand-worked in orders.test.ts with
 * the guild's default postage table: postage $7.30, charge $19.30, guild fee 10 % = $1.20, seller credit
 * $12.00 − $1.20 + $7.30 = $18.10, processing 2.9 % × $19.30 + 30¢ = 85.97¢ → 86¢ (rounded half up).
 */
const CHARGE = 1930;
const FEE = 120;
const CREDIT = 1810;
const PROCESSING = 86;
/** The stand-in's dispute fee when none is named: $15.00, Stripe's published US dispute fee (from memory). */
const DISPUTE_FEE = 1500;
const feeEntries = (amount: number): [string, string, number, string | null][] => [
  ['dispute_fee', 'processor', amount, null],
  ['dispute_fee', 'guild', -amount, null],
];

beforeAll(async () => {
  api = await startTestApi();
  stopListening = await listenOnApiPort(api);
  seller = await createMember({ name: 'Hester Quill' });
  sellerClient = await signedInClient(api.runtime.app, seller);
  buyerClient = await signedInClient(api.runtime.app, await createMember({ name: 'Nell Marchbank' }));
  librarianClient = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian'] }));
  treasurer = await createMember({ name: 'Tamsin Ledgerwood', roles: ['member', 'treasurer'] });
  otherTreasurer = await createMember({ name: 'Bram Tally', roles: ['member', 'treasurer'] });
  treasurerClient = await signedInClient(api.runtime.app, treasurer);
});
afterAll(async () => {
  await stopListening();
  await api.close();
});
beforeEach(async () => {
  await clearMail();
});

/** A paid order by post, confirmed by its webhook; `title` is the seller's own words. */
async function paidOrder(title = 'Dark batik 2½-inch strips'): Promise<{ order: Order; sessionId: string }> {
  const bundleId = await listAndSubmit(sellerClient, { title, priceMinor: 1200, weightGrams: 454 });
  expect((await librarianClient.send('post', `/api/bundles/${bundleId}/review`, { decision: 'approve' })).status).toBe(200);
  const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
  expect(placed.status).toBe(201);
  const sessionId = sessionIdFromUrl(placed.body.checkoutUrl);
  expect((await payCheckout(sessionId)).body.payment_status).toBe('paid');
  await deliveredEvent('checkout.session.completed', sessionId);
  const order = (await Order.findByPk(placed.body.order.id))!;
  expect(order).toMatchObject({ state: 'confirmed', chargeMinor: CHARGE, guildFeeMinor: FEE, sellerCreditMinor: CREDIT, processingCostMinor: PROCESSING });
  return { order, sessionId };
}

/** The bank opens a dispute; returns its id once the API has accepted the event. */
async function disputed(sessionId: string, reason = 'product_not_received'): Promise<string> {
  const opened = await openDispute(sessionId, reason);
  expect(opened.status).toBe(200);
  await deliveredEvent('charge.dispute.created', opened.body.id);
  return opened.body.id;
}

/** The bank decides; for a win, the money given back follows in its own event, as with Stripe. */
async function decided(disputeId: string, outcome: 'won' | 'lost', feeReturned?: boolean) {
  expect((await closeDispute(disputeId, outcome, feeReturned)).status).toBe(200);
  const closed = await deliveredEvent('charge.dispute.closed', disputeId);
  if (outcome === 'won') await deliveredEvent('charge.dispute.funds_reinstated', disputeId);
  return closed;
}

async function sql<T>(query: string, bind: unknown[] = []): Promise<T[]> {
  const [rows] = await api.runtime.ctx.sequelize.query(query, { bind });
  return rows as T[];
}

/** E-mails queued to `to` whose subject contains `subject`: committed with the change, so counted without waiting for delivery. */
async function queuedMail(to: string, subject: string): Promise<number> {
  const [row] = await sql<{ n: number }>(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'email-send' AND data->>'to' = $1 AND data->>'subject' LIKE $2`, [
    to,
    `%${subject}%`,
  ]);
  return row!.n;
}

async function orderEntries(orderId: string): Promise<[string, string, number, string | null][]> {
  const entries = await LedgerEntry.findAll({ where: { orderId }, order: [['id', 'ASC']] });
  return entries.map((e) => [e.kind, e.account, e.amountMinor, e.reverses]);
}

const statement = async () => (await treasurerClient.get(`/api/reports/statement?month=${thisMonth()}`)).body.statement;

describe('a buyer’s bank disputes a card payment', () => {
  it('is recorded on the order, shown to the treasurer in full and to the seller in a line, and e-mailed to every treasurer', async () => {
    const { order, sessionId } = await paidOrder('Dark & light <fat quarters>');
    expect((await sellerClient.send('post', `/api/orders/${order.id}/posted`, { trackingNumber: 'FERN-4410' })).status).toBe(200);
    const ledgerBefore = await orderEntries(order.id);

    const disputeId = await disputed(sessionId);
    const row = (await OrderDispute.findOne({ where: { orderId: order.id } }))!;
    const atBank = await api.runtime.ctx.stripe.disputes.retrieve(disputeId);
    expect(row).toMatchObject({ stripeDisputeId: disputeId, status: 'needs_response', reason: 'product_not_received', amountMinor: CHARGE, currency: 'USD', closedAt: null });
    expect(row.evidenceDueBy?.getTime()).toBe(atBank.evidence_details.due_by! * 1000);

    const mail = await waitForMail({ to: treasurer.email, subjectIncludes: `disputing the payment for order ${order.reference}` });
    expect(mail.text).toContain('$19.30');
    expect(mail.text).toContain('The buyer says the order never arrived');
    const zone = guildTimeZone((await Guild.findByPk(1))!);
    expect(mail.text).toContain(`evidence by ${new Intl.DateTimeFormat('en-US', { timeZone: zone, dateStyle: 'full' }).format(row.evidenceDueBy!)}`);
    expect(mail.text).toContain('tracking number FERN-4410');
    expect(mail.text).toContain('in the card service’s own dashboard, not in Scrap Relay');
    expect(mail.text).toContain('The card service charged a dispute fee of $15.00: it is in the ledger as the guild’s cost.');
    // The card service's fee came with the dispute: booked at once, the guild's cost, the seller's credit untouched.
    expect(await orderEntries(order.id)).toEqual([...ledgerBefore, ...feeEntries(DISPUTE_FEE)]);
    // The seller's title is theirs: escaped in the HTML, never markup.
    expect(mail.html).toContain('Dark &amp; light &lt;fat quarters&gt;');
    expect(mail.html).not.toContain('<fat quarters>');
    await waitForMail({ to: otherTreasurer.email, subjectIncludes: `disputing the payment for order ${order.reference}` });
    // The seller hears too: not the bank's reasons, but to keep the proof of posting.
    const toSeller = await waitForMail({ to: seller.email, subjectIncludes: `questioning the payment for order ${order.reference}` });
    expect(toSeller.text).toContain('keep your proof that the bundles went out');
    expect(toSeller.text).not.toContain('never arrived');

    const forTreasurer = (await treasurerClient.get(`/api/orders/${order.id}`)).body.order;
    expect(forTreasurer.dispute).toEqual({
      stage: 'open',
      status: 'needs_response',
      amountMinor: CHARGE,
      reason: 'product_not_received',
      openedAt: row.openedAt.toISOString(),
      evidenceDueBy: row.evidenceDueBy!.toISOString(),
      feeMinor: DISPUTE_FEE,
      closedAt: null,
    });
    expect(forTreasurer.abilities.refund).toBe(false);
    const forSeller = (await sellerClient.get(`/api/orders/${order.id}`)).body.order;
    expect(forSeller.dispute).toEqual({ stage: 'open', status: null, amountMinor: null, reason: null, evidenceDueBy: null, feeMinor: null, openedAt: row.openedAt.toISOString(), closedAt: null });
    expect((await buyerClient.get(`/api/orders/${order.id}`)).body.order.dispute).toBeNull();

    const open = await treasurerClient.get('/api/orders?as=treasurer&disputes=open');
    expect(open.status).toBe(200);
    expect(open.body.items.map((o: { id: string }) => o.id)).toContain(order.id);
    expect((await buyerClient.get('/api/orders?as=treasurer&disputes=open')).status).toBe(403);

    // While the bank decides, the card service refuses a refund, and so does the guild's own rule: nothing changes.
    const refund = await treasurerClient.send('post', `/api/orders/${order.id}/refund`);
    expect(refund.status).toBe(403);
    expect(await orderEntries(order.id)).toEqual([...ledgerBefore, ...feeEntries(DISPUTE_FEE)]);
    expect((await Order.findByPk(order.id))!.state).toBe('posted');
  });

  it('changes nothing when the same event arrives twice', async () => {
    const { order, sessionId } = await paidOrder();
    const disputeId = await disputed(sessionId, 'duplicate');
    const created = (await stripeEvents('charge.dispute.created')).find((e) => e.object_id === disputeId)!;
    const subject = `disputing the payment for order ${order.reference}`;
    expect(await queuedMail(treasurer.email, subject)).toBe(1);

    const again = await resendEvent(created.id);
    expect(again.body.attempt.status).toBe(200);
    expect(await OrderDispute.count({ where: { orderId: order.id } })).toBe(1);
    expect(await queuedMail(treasurer.email, subject)).toBe(1);
    expect(await queuedMail(seller.email, `questioning the payment for order ${order.reference}`)).toBe(1);
    expect((await orderEntries(order.id)).filter(([kind]) => kind === 'dispute_fee')).toEqual(feeEntries(DISPUTE_FEE));
    expect(await sql(`SELECT id FROM stripe_events WHERE id = $1`, [created.id])).toHaveLength(1);
  });

  it('refuses a list of disputes that is not the treasurer’s open ones, naming the field', async () => {
    const forBuyer = await treasurerClient.get('/api/orders?as=buyer&disputes=open');
    expect(forBuyer.status).toBe(400);
    expect(Object.keys(forBuyer.body.error.fields)).toEqual(['disputes']);
    const closed = await treasurerClient.get('/api/orders?as=treasurer&disputes=closed');
    expect(closed.status).toBe(400);
    expect(closed.body.error.fields.disputes).toBe('Use disputes=open.');
  });
});

describe('the bank decides', () => {
  it('for the buyer: the ledger takes back the seller’s credit and the guild’s fee, the money leaves through the card processor, and the treasurers hear', async () => {
    const { order, sessionId } = await paidOrder();
    expect((await sellerClient.send('post', `/api/orders/${order.id}/posted`, {})).status).toBe(200);
    const statementBefore = await statement();
    const disputeId = await disputed(sessionId, 'product_unacceptable');

    // Answered in the card service's dashboard: the status follows, nothing else happens.
    expect((await answerDispute(disputeId)).status).toBe(200);
    await deliveredEvent('charge.dispute.updated', disputeId);
    expect((await OrderDispute.findOne({ where: { orderId: order.id } }))!.status).toBe('under_review');
    expect((await orderEntries(order.id)).some(([kind]) => kind === 'dispute')).toBe(false);
    // News overtaken by later news (the opening, delivered again after the answer) does not take the status back.
    await deliveredEvent('charge.dispute.funds_withdrawn', disputeId);
    const opening = (await stripeEvents('charge.dispute.created')).find((e) => e.object_id === disputeId)!;
    expect((await resendEvent(opening.id)).body.attempt.status).toBe(200);
    expect((await OrderDispute.findOne({ where: { orderId: order.id } }))!.status).toBe('under_review');

    const closed = await decided(disputeId, 'lost');
    const entries = await orderEntries(order.id);
    const lost = entries.filter(([kind]) => kind === 'dispute');
    const sellerAccount = `seller:${seller.id}`;
    expect(lost.sort()).toEqual(
      [
        ['dispute', 'guild', -FEE, 'guild_fee'],
        ['dispute', 'processor', CHARGE, null],
        ['dispute', sellerAccount, -CREDIT, 'seller_credit'],
      ].sort(),
    );
    const [transaction] = await sql<{ n: number; total: number }>(
      `SELECT count(DISTINCT transaction_id)::int AS n, sum(amount_minor)::int AS total FROM ledger_entries WHERE order_id = $1 AND kind = 'dispute'`,
      [order.id],
    );
    expect(transaction).toEqual({ n: 1, total: 0 });
    const balance = (account: string) => entries.filter(([, a]) => a === account).reduce((sum, [, , amount]) => sum + amount, 0);
    expect(balance(sellerAccount)).toBe(0);
    expect(balance('processor')).toBe(PROCESSING + CHARGE + DISPUTE_FEE);
    expect(balance('guild')).toBe(-PROCESSING - DISPUTE_FEE);
    // The fee was booked when the dispute opened, once.
    expect(entries.filter(([kind]) => kind === 'dispute_fee')).toEqual(feeEntries(DISPUTE_FEE));

    const row = (await OrderDispute.findOne({ where: { orderId: order.id } }))!;
    expect(row.status).toBe('lost');
    expect(row.closedAt).not.toBeNull();
    const mail = await waitForMail({ to: treasurer.email, subjectIncludes: `took back the payment for order ${order.reference}` });
    expect(mail.text).toContain('$19.30 went back to the buyer’s card');
    expect(mail.text).toContain('Hester Quill’s credit of $18.10 for this order is taken back');
    expect(mail.text).toContain('dispute fee of $15.00 stays the guild’s cost');
    const toSeller = await waitForMail({ to: seller.email, subjectIncludes: `took back the payment for order ${order.reference}` });
    expect(toSeller.text).toContain('Your credit of $18.10 for this order is taken back.');
    expect(toSeller.text).not.toContain('owe the guild');

    const view = (await treasurerClient.get(`/api/orders/${order.id}`)).body.order;
    expect(view.dispute).toMatchObject({ stage: 'lost', status: 'lost', closedAt: row.closedAt!.toISOString() });
    expect(view.abilities).toMatchObject({ refund: false, cancel: false });
    expect((await treasurerClient.get('/api/orders?as=treasurer&disputes=open')).body.items.map((o: { id: string }) => o.id)).not.toContain(order.id);

    // The month's statement shows the money taken back on its own line, not as a card processing cost.
    const statementAfter = await statement();
    expect(statementAfter.disputesLostMinor - statementBefore.disputesLostMinor).toBe(CHARGE);
    expect(statementAfter.disputeFeesMinor - statementBefore.disputeFeesMinor).toBe(DISPUTE_FEE);
    expect(statementAfter.processingCostMinor).toBe(statementBefore.processingCostMinor);
    expect(statementAfter.guildFeesMinor - statementBefore.guildFeesMinor).toBe(-FEE);
    const csv = (await treasurerClient.get(`/api/reports/statement.csv?month=${thisMonth()}`)).text.trim().split('\n');
    // The test guild's USD has two decimals: 1930 cents is written 19.30.
    expect(csv).toContain(`disputes_lost,,${(statementAfter.disputesLostMinor / 100).toFixed(2)},USD`);
    expect(csv).toContain(`dispute_fees,,${(statementAfter.disputeFeesMinor / 100).toFixed(2)},USD`);

    // The same decision delivered again, or the opening arriving late, changes nothing.
    expect((await resendEvent(closed.id)).body.attempt.status).toBe(200);
    const created = (await stripeEvents('charge.dispute.created')).find((e) => e.object_id === disputeId)!;
    expect((await resendEvent(created.id)).body.attempt.status).toBe(200);
    expect(await orderEntries(order.id)).toEqual(entries);
    expect((await OrderDispute.findOne({ where: { orderId: order.id } }))!.status).toBe('lost');
    expect(await queuedMail(treasurer.email, `took back the payment for order ${order.reference}`)).toBe(1);
    expect(await queuedMail(treasurer.email, `disputing the payment for order ${order.reference}`)).toBe(1);
  });

  it('tells the treasurers what a seller already paid out for the bag now owes the guild, and adds nothing for a bag that had not gone out', async () => {
    const payable = async () =>
      ((await treasurerClient.get('/api/seller-balances')).body.items as { sellerId: string; payableMinor: number }[]).find((b) => b.sellerId === seller.id)
        ?.payableMinor ?? 0;

    // Posted, and everything payable paid out: the bank taking the payment back leaves the seller owing this credit.
    const sent = await paidOrder('Sent and paid out before the bank decided');
    expect((await sellerClient.send('post', `/api/orders/${sent.order.id}/posted`, {})).status).toBe(200);
    const owed = await payable();
    expect(owed).toBeGreaterThanOrEqual(CREDIT);
    expect((await treasurerClient.send('post', '/api/payouts', { sellerId: seller.id, amountMinor: owed, method: 'bank_transfer' })).status).toBe(201);
    await decided(await disputed(sent.sessionId), 'lost');
    const owing = await waitForMail({ to: treasurer.email, subjectIncludes: `took back the payment for order ${sent.order.reference}` });
    expect(owing.text).toContain('Hester Quill had been paid out already and now owes the guild $18.10.');
    const sellerOwing = await waitForMail({ to: seller.email, subjectIncludes: `took back the payment for order ${sent.order.reference}` });
    expect(sellerOwing.text).toContain('You had been paid out already, so you now owe the guild $18.10');
    expect(await payable()).toBe(-CREDIT);

    // Not yet posted: its credit was never payable, so taking it back leaves what is payable, and the debt, as they were.
    const unsent = await paidOrder('Still with the seller when the bank decided');
    await decided(await disputed(unsent.sessionId), 'lost');
    const same = await waitForMail({ to: treasurer.email, subjectIncludes: `took back the payment for order ${unsent.order.reference}` });
    expect(same.text).toContain('now owes the guild $18.10.');
    const unsentMail = await waitForMail({ to: seller.email, subjectIncludes: `took back the payment for order ${unsent.order.reference}` });
    expect(unsentMail.text).toContain('The bundles have not gone out: please do not send them until the treasurer tells you what to do.');
    expect(await payable()).toBe(-CREDIT);
  });

  it('for the guild: nothing changes in the ledger, the treasurers hear the money stays, and a refund is possible again', async () => {
    const { order, sessionId } = await paidOrder();
    const disputeId = await disputed(sessionId, 'fraudulent');
    const before = await orderEntries(order.id);

    await decided(disputeId, 'won');
    expect(await orderEntries(order.id)).toEqual(before);
    const row = (await OrderDispute.findOne({ where: { orderId: order.id } }))!;
    expect(row.status).toBe('won');
    expect(row.closedAt).not.toBeNull();
    const mail = await waitForMail({ to: treasurer.email, subjectIncludes: `won the dispute on order ${order.reference}` });
    expect(mail.text).toContain('the $19.30 stays with the guild');
    expect(mail.text).toContain('The seller’s credit and the guild’s fee for the order stand.');
    expect(mail.text).toContain('dispute fee of $15.00 is in the ledger as the guild’s cost; if the card service gives it back');
    const toSeller = await waitForMail({ to: seller.email, subjectIncludes: `The payment for order ${order.reference} stands` });
    expect(toSeller.text).toContain('Your credit for this order stands');

    const view = (await treasurerClient.get(`/api/orders/${order.id}`)).body.order;
    expect(view.dispute).toMatchObject({ stage: 'won', status: 'won' });
    expect(view.abilities.refund).toBe(true);
    expect((await sellerClient.get(`/api/orders/${order.id}`)).body.order.dispute).toMatchObject({ stage: 'won', status: null });

    // A refund after the win undoes the sale and leaves the card service's dispute fee with the guild.
    const refunded = await treasurerClient.send('post', `/api/orders/${order.id}/refund`);
    expect(refunded.status).toBe(200);
    expect(refunded.body.order.state).toBe('refunded');
    const after = await orderEntries(order.id);
    expect(after.filter(([kind]) => kind === 'dispute_fee')).toEqual(feeEntries(DISPUTE_FEE));
    expect(after.filter(([kind]) => kind === 'refund').map(([, , , reverses]) => reverses).sort()).toEqual(['charge', 'guild_fee', 'seller_credit']);
  });
});

describe('after the bank took back the payment for bundles that never went out', () => {
  it('lets the treasurer cancel the order, refunding nothing more, and puts the bundles back on the shelf', async () => {
    const { order, sessionId } = await paidOrder('Held back when the bank decided');
    await decided(await disputed(sessionId), 'lost');
    const [item] = await OrderItem.findAll({ where: { orderId: order.id } });
    expect((await Bundle.findByPk(item!.bundleId))!.state).toBe('rehomed');
    const entries = await orderEntries(order.id);

    // The seller waits for the treasurer's word, and the buyer's bank has the money: neither cancels, nor is it posted.
    expect((await sellerClient.send('post', `/api/orders/${order.id}/posted`, {})).status).toBe(403);
    expect((await sellerClient.send('post', `/api/orders/${order.id}/cancel`, {})).status).toBe(403);
    expect((await buyerClient.send('post', `/api/orders/${order.id}/cancel`, {})).status).toBe(403);
    expect((await treasurerClient.get(`/api/orders/${order.id}`)).body.order.abilities).toMatchObject({ cancel: true, refund: false });

    const cancelled = await treasurerClient.send('post', `/api/orders/${order.id}/cancel`, { reason: 'The buyer’s bank took the payment back.' });
    expect(cancelled.status).toBe(200);
    const after = (await Order.findByPk(order.id))!;
    expect(after).toMatchObject({ state: 'cancelled', refundedAt: null });
    // The dispute already took the shares back: no refund, and no entry at all.
    expect(await orderEntries(order.id)).toEqual(entries);
    expect(await api.runtime.ctx.stripe.refunds.list({ payment_intent: after.stripePaymentIntentId! }).then((r) => r.data)).toEqual([]);
    expect((await Bundle.findByPk(item!.bundleId))!.state).toBe('on_shelf');
    const toBuyer = await waitForMail({ to: (await buyerClient.get('/api/session')).body.user.email, subjectIncludes: `Order ${order.reference} was cancelled` });
    expect(toBuyer.text).toContain('Your bank has already returned the payment to your card, so nothing more is refunded.');
    const toSeller = await waitForMail({ to: seller.email, subjectIncludes: `Order ${order.reference} was cancelled` });
    expect(toSeller.text).toContain('The buyer’s bank took the payment back, so nothing is owed to you for it.');
  });
});

describe('after the bank took back part of the payment for bundles that never went out', () => {
  it('leaves the rest for the treasurer to settle by hand: no cancel that would refund nothing', async () => {
    const { order, sessionId } = await paidOrder('Half taken back');
    const opened = await openDispute(sessionId, 'product_unacceptable', 1000);
    await deliveredEvent('charge.dispute.created', opened.body.id);
    await decided(opened.body.id, 'lost');
    const view = (await treasurerClient.get(`/api/orders/${order.id}`)).body.order;
    expect(view.abilities).toMatchObject({ cancel: false, refund: false });
    expect((await treasurerClient.send('post', `/api/orders/${order.id}/cancel`, {})).status).toBe(403);
    expect((await Order.findByPk(order.id))!.state).toBe('confirmed');
  });
});

describe('the card service’s dispute fee', () => {
  it('is booked at the figure the card service reports, and given back in the ledger when a win gives it back', async () => {
    const { order, sessionId } = await paidOrder();
    const statementBefore = await statement();
    const opened = await openDispute(sessionId, 'fraudulent', undefined, 2000);
    await deliveredEvent('charge.dispute.created', opened.body.id);
    expect((await orderEntries(order.id)).filter(([kind]) => kind === 'dispute_fee')).toEqual(feeEntries(2000));

    // The decision comes first; the fee comes back with the money, in news of its own after it.
    await decided(opened.body.id, 'won', true);
    expect((await orderEntries(order.id)).filter(([kind]) => kind === 'dispute_fee')).toEqual([...feeEntries(2000), ...feeEntries(-2000)]);
    const mail = await waitForMail({ to: treasurer.email, subjectIncludes: `won the dispute on order ${order.reference}` });
    expect(mail.text).toContain('dispute fee of $20.00 is in the ledger as the guild’s cost; if the card service gives it back, the ledger will show that too.');
    expect((await statement()).disputeFeesMinor).toBe(statementBefore.disputeFeesMinor);
    expect((await OrderDispute.findOne({ where: { orderId: order.id } }))!.feeMinor).toBe(0);

    // A snapshot from before the win, delivered late, takes nothing back out.
    const closedEvent = (await stripeEvents('charge.dispute.closed')).find((e) => e.object_id === opened.body.id)!;
    expect((await resendEvent(closedEvent.id)).body.attempt.status).toBe(200);
    expect((await orderEntries(order.id)).filter(([kind]) => kind === 'dispute_fee')).toEqual([...feeEntries(2000), ...feeEntries(-2000)]);
  });

  it('books nothing when the card service charges no fee', async () => {
    const { order, sessionId } = await paidOrder();
    const opened = await openDispute(sessionId, 'general', undefined, 0);
    await deliveredEvent('charge.dispute.created', opened.body.id);
    await decided(opened.body.id, 'lost');
    expect((await orderEntries(order.id)).some(([kind]) => kind === 'dispute_fee')).toBe(false);
    const mail = await waitForMail({ to: treasurer.email, subjectIncludes: `took back the payment for order ${order.reference}` });
    expect(mail.text).toContain('The card service charged no fee for this dispute.');
  });
});

describe('a dispute about a payment no order knows', () => {
  it('is acknowledged with a 2xx and writes nothing', async () => {
    // A payment made straight through the card service, outside any order.
    const session = await api.runtime.ctx.stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 2500, product_data: { name: 'Raffle ticket' } } }],
      success_url: 'http://127.0.0.1/elsewhere',
    });
    await payCheckout(session.id);
    await deliveredEvent('checkout.session.completed', session.id);
    const tables = ['order_disputes', 'ledger_entries', 'orders'];
    const before = await countRows(api.runtime.ctx.sequelize, tables);
    const mailBefore = [await queuedMail(treasurer.email, 'disputing the payment'), await queuedMail(treasurer.email, 'took back the payment')];

    const opened = await openDispute(session.id, 'general');
    const created = await deliveredEvent('charge.dispute.created', opened.body.id);
    expect(created.attempts.at(-1)?.status).toBe(200);
    const closed = await decided(opened.body.id, 'lost');
    expect(closed.attempts.at(-1)?.status).toBe(200);

    expect(await countRows(api.runtime.ctx.sequelize, tables)).toEqual(before);
    expect([await queuedMail(treasurer.email, 'disputing the payment'), await queuedMail(treasurer.email, 'took back the payment')]).toEqual(mailBefore);
  });
});
