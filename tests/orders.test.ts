import Stripe from 'stripe';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { Bundle, Guild, LedgerEntry, Meeting, Order, type Member } from '../apps/api/src/db/models/index.ts';
import { cancelUnpaid, releaseOverdueHolds, remindUnposted, runLateRefund } from '../apps/api/src/modules/orders/orders.service.ts';
import { LATE_REFUND_QUEUE } from '../apps/api/src/jobs/queue.ts';
import { processingCostEntries } from '@scrap-relay/shared';
import { appWith, Client, countRows, createMember, listenOnApiPort, signedInClient, startTestApi, type TestApi } from './support/api.ts';
import { completeListing, listAndSubmit } from './support/bundles.ts';
import { clearMail, listMail, waitForMail } from './support/services.ts';
import { payCheckout, refundedAmount, resendEvent, sessionIdFromUrl, stripeEvents, stripeSession } from './support/stripe-fake.ts';

let api: TestApi;
let stopListening: () => Promise<void>;
let seller: Member;
let sellerClient: Client;
let librarianClient: Client;
let buyer: Member;
let buyerClient: Client;
let treasurer: Member;
let treasurerClient: Client;

const address = { name: 'Pearl Dunmore', line1: '4 Weir Lane', town: 'Millbrook', postalCode: '97451', country: 'US' };

beforeAll(async () => {
  api = await startTestApi();
  stopListening = await listenOnApiPort(api);
  seller = await createMember({ name: 'Hetty Blanchard' });
  buyer = await createMember({ name: 'Pearl Dunmore' });
  sellerClient = await signedInClient(api.runtime.app, seller);
  buyerClient = await signedInClient(api.runtime.app, buyer);
  librarianClient = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian'] }));
  treasurer = await createMember({ roles: ['member', 'treasurer'] });
  treasurerClient = await signedInClient(api.runtime.app, treasurer);
});
afterAll(async () => {
  await stopListening();
  await api.close();
});
beforeEach(async () => {
  await clearMail();
});

async function shelved(overrides: Record<string, unknown> = {}, by = sellerClient): Promise<string> {
  const id = await listAndSubmit(by, overrides);
  const res = await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
  expect(res.status).toBe(200);
  return id;
}

/** The buyer orders the bundle by post and pays; the order once the payment's webhook has confirmed it. */
const paidByPost = (bundleId: string) => paidOrder(bundleId, { fulfilment: 'post', address });

/** The buyer orders the bundle as `how` says and pays; the order once the payment's webhook has confirmed it. */
async function paidOrder(bundleId: string, how: Record<string, unknown>): Promise<Order> {
  const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], ...how });
  expect(placed.status).toBe(201);
  await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl));
  return waitFor(async () => {
    const o = await Order.findByPk(placed.body.order.id);
    return o?.state === 'confirmed' ? o : null;
  });
}

/** One seller's row of the treasurer's balances page. */
async function balanceOf(sellerId: string) {
  const res = await treasurerClient.get('/api/seller-balances');
  expect(res.status).toBe(200);
  return res.body.items.find((b: { sellerId: string }) => b.sellerId === sellerId);
}

/** One handover's row on its meeting's sheet, as the librarian sees it. */
async function handoverRow(meetingId: string, id: string) {
  const sheet = await librarianClient.get(`/api/meetings/${meetingId}/handovers`);
  expect(sheet.status).toBe(200);
  return sheet.body.items.find((h: { id: string }) => h.id === id);
}

/** Cents as the test guild's USD e-mails and messages write them: 1810 → "$18.10". */
const dollars = (cents: number) => `$${(cents / 100).toFixed(2)}`;

async function ledgerTotal(where = ''): Promise<number> {
  const [rows] = await api.runtime.ctx.sequelize.query(`SELECT coalesce(sum(amount_minor), 0)::int AS total FROM ledger_entries ${where}`);
  return (rows as { total: number }[])[0]!.total;
}

async function waitFor<T>(check: () => Promise<T | undefined | null | false>, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > deadline) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('buying a sale bundle by post', () => {
  it('quotes postage, holds, takes the card payment, confirms by webhook, and goes through posted and received', async () => {
    const bundleId = await shelved({ title: 'Blue strips for binding', weightGrams: 454, priceMinor: 1200 });

    // Hand-worked with the guild's default table: 454 g + 25 g padded mailer = 479 g → the 2 lb local band, 680¢, plus 50¢ handling.
    const quote = await buyerClient.send('post', '/api/postage-quotes', { items: [{ bundleId, quantity: 1 }], destination: { country: 'US', postalCode: '97451' } });
    expect(quote.status).toBe(200);
    expect(quote.body).toMatchObject({ totalMinor: 730, currency: 'USD', zone: 'local' });
    expect(quote.body.parcels[0]).toMatchObject({ packageCode: 'padded_mailer', contentGrams: 454, billableGrams: 479, priceMinor: 680 });
    expect(quote.body.explanation.length).toBeGreaterThan(2);
    // The default table's rates are for US addresses: another country gets no quote and no order, naming the field.
    const abroad = await buyerClient.send('post', '/api/postage-quotes', { items: [{ bundleId, quantity: 1 }], destination: { country: 'ca', postalCode: 'K0A 1A0' } });
    expect(abroad.status).toBe(422);
    expect(abroad.body.error.fields['destination.country']).toContain('rates for US only, not CA');
    const abroadOrder = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address: { ...address, country: 'CA' } });
    expect(abroadOrder.status).toBe(422);
    expect(Object.keys(abroadOrder.body.error.fields)).toEqual(['address.country']);
    expect((await Bundle.findByPk(bundleId))!.state).toBe('on_shelf');

    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address, saveAddress: true });
    expect(placed.status).toBe(201);
    expect(placed.body.order).toMatchObject({ state: 'awaiting_payment', chargeMinor: 1930, postageMinor: 730, subtotalMinor: 1200 });
    expect(placed.body.checkoutUrl).toMatch(/\/pay\/cs_test_/);
    expect((await Bundle.findByPk(bundleId))!.state).toBe('held');

    const sellerView = await sellerClient.get(`/api/orders/${placed.body.order.id}`);
    expect(sellerView.body.order.address).toBeNull();

    const paid = await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl));
    expect(paid.body.payment_status).toBe('paid');
    const order = await waitFor(async () => {
      const o = await Order.findByPk(placed.body.order.id);
      return o?.state === 'confirmed' ? o : null;
    });
    expect((await Bundle.findByPk(bundleId))!.state).toBe('rehomed');

    // Money, hand-worked: guild fee 10 % of 1200 = 120; processing 2.9 % × 1930 + 30 = 85.97 → 86 (rounded half up); seller credit 1200 − 120 + 730 = 1810.
    expect(order).toMatchObject({ guildFeeMinor: 120, processingCostMinor: 86, sellerCreditMinor: 1810 });
    const entries = await LedgerEntry.findAll({ where: { orderId: order.id } });
    expect(entries.map((e) => [e.kind, e.account, e.amountMinor]).sort()).toEqual(
      [
        ['charge', 'buyer', -1930],
        ['guild_fee', 'guild', 120],
        ['processing_cost', 'guild', -86],
        ['processing_cost', 'processor', 86],
        ['seller_credit', `seller:${seller.id}`, 1810],
      ].sort(),
    );

    const sold = await waitForMail({ to: seller.email, subjectIncludes: 'Rehomed' });
    expect(sold.text).toContain('4 Weir Lane');
    expect(sold.text).toContain('Pearl Dunmore');
    await waitForMail({ to: buyer.email, subjectIncludes: 'is confirmed' });

    const slip = await sellerClient.get(`/api/orders/${order.id}/packing-slip`);
    expect(slip.status).toBe(200);
    expect(slip.body.order.address).toMatchObject({ line1: '4 Weir Lane' });
    expect(slip.body.qrSvg).toContain('<svg');
    expect((await buyerClient.get('/api/me/address')).body.address).toMatchObject({ postalCode: '97451' });

    expect((await buyerClient.send('post', `/api/orders/${order.id}/posted`, {})).status).toBe(403);
    const posted = await sellerClient.send('post', `/api/orders/${order.id}/posted`, { trackingNumber: 'TRK-1234' });
    expect(posted.body.order).toMatchObject({ state: 'posted', trackingNumber: 'TRK-1234' });
    expect((await waitForMail({ to: buyer.email, subjectIncludes: 'in the post' })).text).toContain('TRK-1234');

    const received = await buyerClient.send('post', `/api/orders/${order.id}/received`);
    expect(received.body.order.state).toBe('received');
    await waitForMail({ to: seller.email, subjectIncludes: 'arrived' });
  });

  it('leaves the order awaiting payment when the card is declined', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    const declined = await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl), '4000 0000 0000 0002');
    expect(declined.status).toBe(402);
    expect((await Order.findByPk(placed.body.order.id))!.state).toBe('awaiting_payment');
    expect((await Bundle.findByPk(bundleId))!.state).toBe('held');
  });

  it('gives a postage-only bundle away for the postage alone', async () => {
    const bundleId = await shelved({ offer: 'postage_only', priceMinor: null, meetingHandoverOk: false, weightGrams: 200 });
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    expect(placed.status).toBe(201);
    // 200 g + 15 g envelope = 215 g → the ½ lb local band, 450¢, plus 50¢ handling.
    expect(placed.body.order).toMatchObject({ subtotalMinor: 0, postageMinor: 500, chargeMinor: 500 });
    await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl));
    const order = await waitFor(async () => (await Order.findByPk(placed.body.order.id))?.state === 'confirmed');
    expect(order).toBe(true);
    const entries = await LedgerEntry.findAll({ where: { orderId: placed.body.order.id } });
    expect(entries.find((e) => e.kind === 'guild_fee')).toBeUndefined();
    expect(entries.find((e) => e.kind === 'seller_credit')!.amountMinor).toBe(500);
  });
});

describe('meeting handover', () => {
  it('confirms a free meeting bundle at once, with nothing to pay', async () => {
    const meeting = await Meeting.create({ startsAt: new Date(Date.now() + 7 * 86_400_000), place: 'Millbrook Hall', createdBy: null });
    const bundleId = await shelved({ offer: 'meeting', priceMinor: null, meetingHandoverOk: false });
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'meeting', meetingId: meeting.id });
    expect(placed.status).toBe(201);
    expect(placed.body).toMatchObject({ checkoutUrl: null, order: { state: 'confirmed', chargeMinor: 0, meeting: { place: 'Millbrook Hall' } } });
    expect((await Bundle.findByPk(bundleId))!.state).toBe('rehomed');
    const sold = await waitForMail({ to: seller.email, subjectIncludes: `Rehomed: order ${placed.body.order.reference}` });
    // A gift handed over in person: no money, no address, no parcel.
    expect(sold.text).toContain('It is a gift: nothing was paid.');
    expect(sold.text).toContain('Please bring it to the meeting');
    expect(sold.text).toContain(`Write ${placed.body.order.reference} and Pearl Dunmore's name on the bag`);
    expect(sold.text).not.toMatch(/address|parcel|packing slip/i);
  });

  it('refuses an order under the least card payment with a 422 naming the items, holding and writing nothing', async () => {
    const meeting = await Meeting.create({ startsAt: new Date(Date.now() + 7 * 86_400_000), place: 'Millbrook Hall', createdBy: null });
    const bundleId = await shelved({ priceMinor: 500, meetingHandoverOk: true });
    // Priced before the guild's minimum was enforced at review: 25 cents can never be paid by card.
    await Bundle.update({ priceMinor: 25 }, { where: { id: bundleId } });
    const before = await countRows(api.runtime.ctx.sequelize, ['orders', 'order_items', 'ledger_entries']);
    const res = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'meeting', meetingId: meeting.id });
    expect(res.status).toBe(422);
    // USD 0.50: Stripe's minimum charge amount (docs.stripe.com/currencies), from memory.
    expect(res.body.error.message).toBe('Card payments start at $0.50, and this order comes to $0.25.');
    expect(res.body.error.fields.items).toBe('Add another bundle from this seller to reach $0.50.');
    expect(await countRows(api.runtime.ctx.sequelize, ['orders', 'order_items', 'ledger_entries'])).toEqual(before);
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ state: 'on_shelf', quantityAvailable: 1 });
  });

  it('refuses a meeting in the past and a bundle that is not offered for meetings', async () => {
    const past = await Meeting.create({ startsAt: new Date(Date.now() - 86_400_000), place: 'Old hall', createdBy: null });
    const bundleId = await shelved({ offer: 'postage_only', priceMinor: null, meetingHandoverOk: false });
    const old = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'meeting', meetingId: past.id });
    expect(old.status).toBe(400);
    expect(old.body.error.fields.meetingId).toBeDefined();
    const future = await Meeting.create({ startsAt: new Date(Date.now() + 86_400_000), place: 'Hall', createdBy: null });
    const wrong = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'meeting', meetingId: future.id });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.fulfilment).toBeDefined();
  });
});

describe('no bundle is sold twice', () => {
  it('30 concurrent orders for a quantity-1 bundle: exactly one 201, the rest 409', async () => {
    const bundleId = await shelved();
    const buyers = await Promise.all(Array.from({ length: 30 }, () => createMember()));
    const clients = await Promise.all(buyers.map((b) => signedInClient(api.runtime.app, b)));
    const answers = await Promise.all(clients.map((c) => c.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address })));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(29);
    expect((await Bundle.findByPk(bundleId))!.quantityAvailable).toBe(0);
  }, 60_000);

  it('10 concurrent orders for a quantity-3 bundle: exactly three', async () => {
    const bundleId = await shelved({ quantity: 3, title: 'Three packs of 5-inch squares' });
    const clients = await Promise.all(Array.from({ length: 10 }, async () => signedInClient(api.runtime.app, await createMember())));
    const answers = await Promise.all(clients.map((c) => c.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address })));
    expect(answers.filter((a) => a.status === 201)).toHaveLength(3);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(7);
  }, 60_000);

  it('relists a bundle with only the packs not yet sold, and will not set the quantity below them', async () => {
    const bundleId = await shelved({ quantity: 3 });
    await paidByPost(bundleId);
    expect((await sellerClient.send('post', `/api/bundles/${bundleId}/withdraw`)).status).toBe(200);

    // A quantity of 1 is just the pack sold: valid, but it leaves nothing to offer.
    expect((await sellerClient.send('patch', `/api/bundles/${bundleId}`, { quantity: 1 })).status).toBe(200);
    const emptySubmit = await sellerClient.send('post', `/api/bundles/${bundleId}/submit`);
    expect(emptySubmit.status).toBe(422);
    expect(emptySubmit.body.error.fields.quantity).toMatch(/sold or held/);

    const restored = await sellerClient.send('patch', `/api/bundles/${bundleId}`, { quantity: 3 });
    expect(restored.status).toBe(200);
    expect((await sellerClient.send('post', `/api/bundles/${bundleId}/submit`)).status).toBe(200);
    expect((await librarianClient.send('post', `/api/bundles/${bundleId}/review`, { decision: 'approve' })).status).toBe(200);
    // Three packs listed, one sold before the relisting: two on the shelf, not three.
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ state: 'on_shelf', quantity: 3, quantityAvailable: 2 });
  });

  it('refuses a quantity below the packs already sold, naming the field, and changes nothing', async () => {
    const bundleId = await shelved({ quantity: 3 });
    await paidByPost(bundleId);
    await paidByPost(bundleId);
    expect((await sellerClient.send('post', `/api/bundles/${bundleId}/withdraw`)).status).toBe(200);
    const res = await sellerClient.send('patch', `/api/bundles/${bundleId}`, { quantity: 1, title: 'Changed title' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.quantity).toMatch(/2 of these packs are sold or held already/);
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ quantity: 3, quantityAvailable: 1, title: completeListing.title });
  });

  it('refuses buying your own bundle, and bundles of two sellers in one order', async () => {
    const own = await shelved();
    expect((await sellerClient.send('post', '/api/orders', { items: [{ bundleId: own, quantity: 1 }], fulfilment: 'post', address })).status).toBe(403);
    const otherSeller = await signedInClient(api.runtime.app, await createMember());
    const theirs = await shelved({}, otherSeller);
    const mixed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId: own, quantity: 1 }, { bundleId: theirs, quantity: 1 }], fulfilment: 'post', address });
    expect(mixed.status).toBe(422);
    expect((await Bundle.findByPk(own))!.quantityAvailable).toBe(1);
  });
});

describe('webhooks', () => {
  it('the same event delivered five times writes one set of ledger entries', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    const sessionId = sessionIdFromUrl(placed.body.checkoutUrl);
    await payCheckout(sessionId);
    await waitFor(async () => (await Order.findByPk(placed.body.order.id))?.state === 'confirmed');
    const event = (await stripeEvents('checkout.session.completed')).find((e) => e.object_id === sessionId)!;
    for (let i = 0; i < 4; i++) expect((await resendEvent(event.id)).status).toBe(200);
    expect(await LedgerEntry.count({ where: { orderId: placed.body.order.id } })).toBe(5);
  });

  it('refuses an event with a bad signature with 400 and writes nothing', async () => {
    const before = await countRows(api.runtime.ctx.sequelize, ['stripe_events', 'ledger_entries']);
    const payload = JSON.stringify({ id: 'evt_forged', type: 'checkout.session.completed', data: { object: {} } });
    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: 'whsec_not_the_secret' });
    const res = await new Client(api.runtime.app).agent.post('/api/stripe/webhook').set('Stripe-Signature', header).set('Content-Type', 'application/json').send(payload);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['Stripe-Signature']).toBeDefined();
    expect(await countRows(api.runtime.ctx.sequelize, ['stripe_events', 'ledger_entries'])).toEqual(before);
  });
});

describe('when payment does not happen', () => {
  it('answers 503 and releases the hold at once when the payment service cannot be reached', async () => {
    const bundleId = await shelved();
    const unreachable = new Stripe(api.config.stripe.secretKey, { host: '127.0.0.1', port: 9, protocol: 'http', maxNetworkRetries: 0, timeout: 2000 });
    const app = appWith(api, (c) => c, { stripe: unreachable });
    const client = await signedInClient(app, buyer);
    const res = await client.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('service_unavailable');
    const bundle = await Bundle.findByPk(bundleId);
    expect(bundle).toMatchObject({ state: 'on_shelf', quantityAvailable: 1 });
  });

  it('releases a hold past the guild’s limit by the scheduled job, and expires the payment page', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    api.clock.advance(31 * 60_000);
    try {
      expect(await releaseOverdueHolds(api.runtime.ctx)).toBeGreaterThanOrEqual(1);
    } finally {
      api.clock.reset();
    }
    expect((await Order.findByPk(placed.body.order.id))!.state).toBe('cancelled');
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ state: 'on_shelf', quantityAvailable: 1 });
    expect((await stripeSession(sessionIdFromUrl(placed.body.checkoutUrl))).status).toBe('expired');
    // The buyer is told; the seller never heard of the order, so is not.
    const mail = await waitForMail({ to: buyer.email, subjectIncludes: 'was cancelled' });
    expect(mail.text).toContain('Nothing was charged.');
    expect((await listMail()).some((m) => m.to.includes(seller.email.toLowerCase()) && m.subject.includes('was cancelled'))).toBe(false);
  });

  it('confirms an order paid in time whose payment event never arrived, when the hold runs out, instead of cancelling it', async () => {
    const bundleId = await shelved({ priceMinor: 2400 });
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    const paid = await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl), undefined, { withholdEvents: true });
    expect(paid.body).toMatchObject({ status: 'complete', payment_status: 'paid' });
    expect((await Order.findByPk(placed.body.order.id))!.state).toBe('awaiting_payment');

    api.clock.advance(31 * 60_000);
    try {
      await releaseOverdueHolds(api.runtime.ctx);
    } finally {
      api.clock.reset();
    }
    const order = (await Order.findByPk(placed.body.order.id))!;
    expect(order).toMatchObject({ state: 'confirmed', stripePaymentIntentId: expect.stringMatching(/^pi_/) });
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ state: 'rehomed', quantityAvailable: 0 });
    expect(await ledgerTotal(`WHERE order_id = '${order.id}' AND account = 'seller:${seller.id}'`)).toBe(order.sellerCreditMinor);
    const sold = await waitForMail({ to: seller.email, subjectIncludes: `Rehomed: order ${order.reference}` });
    expect(sold.text).toContain(`Your share is $${(order.sellerCreditMinor / 100).toFixed(2)}, postage included`);
    expect(sold.text).toContain(`Write ${order.reference} on the parcel`);
  });

  it('keeps a hold it cannot check with the payment service, and releases it on a later run', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    const unreachable = new Stripe(api.config.stripe.secretKey, { host: '127.0.0.1', port: 9, protocol: 'http', maxNetworkRetries: 0, timeout: 2000 });
    api.clock.advance(31 * 60_000);
    try {
      expect(await releaseOverdueHolds({ ...api.runtime.ctx, stripe: unreachable })).toBe(0);
      expect((await Order.findByPk(placed.body.order.id))!.state).toBe('awaiting_payment');
      expect(await releaseOverdueHolds(api.runtime.ctx)).toBeGreaterThanOrEqual(1);
    } finally {
      api.clock.reset();
    }
    expect((await Order.findByPk(placed.body.order.id))!.state).toBe('cancelled');
  });
});

describe('reminding the seller to post', () => {
  it('reminds the seller of a paid order not marked posted after five days, once, however many runs there are', async () => {
    const waiting = await paidByPost(await shelved({ title: 'Waiting to be posted' }));
    const posted = await paidByPost(await shelved({ title: 'Posted in time' }));
    expect((await sellerClient.send('post', `/api/orders/${posted.id}/posted`, {})).status).toBe(200);

    api.clock.advance(4 * 24 * 60 * 60_000);
    try {
      await remindUnposted(api.runtime.ctx);
      expect((await Order.findByPk(waiting.id))!.postReminderSentAt).toBeNull();
      api.clock.advance(24 * 60 * 60_000 + 60_000);
      await Promise.all([remindUnposted(api.runtime.ctx), remindUnposted(api.runtime.ctx)]);
    } finally {
      api.clock.reset();
    }
    expect((await Order.findByPk(waiting.id))!.postReminderSentAt).not.toBeNull();
    expect((await Order.findByPk(posted.id))!.postReminderSentAt).toBeNull();
    const reminder = await waitForMail({ to: seller.email, subjectIncludes: `order ${waiting.reference} is waiting to be posted` });
    expect(reminder.text).toContain('Pearl Dunmore paid for order');
    expect(reminder.text).toContain('cancel the order: the buyer is refunded');
    const subjects = (await listMail()).map((m) => m.subject);
    expect(subjects.filter((subject) => subject.includes(waiting.reference) && subject.startsWith('Reminder'))).toHaveLength(1);
    expect(subjects.some((subject) => subject.includes(posted.reference) && subject.startsWith('Reminder'))).toBe(false);
  });
});

describe('cancelling, refunds and the treasurer', () => {
  it('cancels an unpaid order for the buyer before closing its payment page, whose expiry webhook then changes nothing', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    const sessionId = sessionIdFromUrl(placed.body.checkoutUrl);
    const cancelled = await buyerClient.send('post', `/api/orders/${placed.body.order.id}/cancel`, { reason: 'Ordered twice' });
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.order).toMatchObject({ state: 'cancelled' });
    expect((await stripeSession(sessionId)).status).toBe('expired');

    // The stand-in reports the expiry by webhook; once the API has taken it, the buyer's cancellation stands
    // as it was (before, that webhook could cancel the order first and the buyer got a 403).
    await waitFor(async () => (await stripeEvents('checkout.session.expired')).some((e) => e.object_id === sessionId && e.state === 'delivered'));
    expect(await Order.findByPk(placed.body.order.id)).toMatchObject({ state: 'cancelled', cancelReason: 'Ordered twice' });
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ state: 'on_shelf', quantityAvailable: 1 });
    await waitForMail({ to: buyer.email, subjectIncludes: 'was cancelled' });
  });

  it('refunds a payment made after its order was cancelled, by a queued job, and books the processor’s fee once', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    const orderId: string = placed.body.order.id;
    // The hold ran out but the payment page stayed open (closing it had failed), and the buyer paid on it.
    expect(await cancelUnpaid(api.runtime.ctx, orderId, 'The hold ran out.')).toBe(true);
    await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl));

    const order = await waitFor(async () => {
      const o = await Order.findByPk(orderId);
      return o?.refundedAt ? o : null;
    });
    expect(order.state).toBe('cancelled');
    expect(order.cancelReason).toContain('Paid after the hold ended; refunded.');
    expect(await refundedAmount(order.stripePaymentIntentId!)).toBe(order.chargeMinor);
    // The refund went through the job queue, recorded with the payment's event, not as a call after it.
    const [jobs] = await api.runtime.ctx.sequelize.query(`SELECT state FROM pgboss.job WHERE name = $1 AND data->>'orderId' = $2`, {
      bind: [LATE_REFUND_QUEUE, orderId],
    });
    expect(jobs).toEqual([{ state: 'completed' }]);
    // Only the fee the processor keeps stands on the ledger (from memory, as for any refund), and once.
    expect(order.processingCostMinor).toBeGreaterThan(0);
    const entries = await LedgerEntry.findAll({ where: { orderId }, attributes: ['kind', 'account', 'amountMinor'], raw: true });
    expect(entries).toEqual(expect.arrayContaining(processingCostEntries(order.processingCostMinor)));
    expect(entries).toHaveLength(2);
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ state: 'on_shelf', quantityAvailable: 1 });
    const told = await waitForMail({ to: buyer.email, subjectIncludes: 'is being refunded' });
    expect(told.text).toContain('came in after the order had already been cancelled');
  });

  it('tells the treasurers when the last try to refund a late payment fails, and refunds it once the service answers', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    const orderId: string = placed.body.order.id;
    const sessionId = sessionIdFromUrl(placed.body.checkoutUrl);
    expect(await cancelUnpaid(api.runtime.ctx, orderId, 'The hold ran out.')).toBe(true);
    await payCheckout(sessionId, undefined, { withholdEvents: true });
    await Order.update({ stripePaymentIntentId: (await stripeSession(sessionId)).payment_intent }, { where: { id: orderId } });

    const unreachable = new Stripe(api.config.stripe.secretKey, { host: '127.0.0.1', port: 9, protocol: 'http', maxNetworkRetries: 0, timeout: 2000 });
    const job = { data: { orderId }, retryCount: 3, retryLimit: 12 };
    await expect(runLateRefund({ ...api.runtime.ctx, stripe: unreachable }, job)).rejects.toThrow();
    await expect(runLateRefund({ ...api.runtime.ctx, stripe: unreachable }, { ...job, retryCount: 12 })).rejects.toThrow();
    const told = await waitForMail({ to: treasurer.email, subjectIncludes: 'needs you' });
    expect(told.text).toContain('refund it in the card payment service’s own dashboard');
    expect((await listMail()).filter((m) => m.subject.includes('needs you') && m.to.includes(treasurer.email.toLowerCase()))).toHaveLength(1);

    await runLateRefund(api.runtime.ctx, { ...job, retryCount: 0 });
    const order = (await Order.findByPk(orderId))!;
    expect(order.refundedAt).not.toBeNull();
    expect(await refundedAmount(order.stripePaymentIntentId!)).toBe(order.chargeMinor);
  });

  it('takes a charge already refunded in full elsewhere as refunded, and answers 409 with the reason for any other refusal', async () => {
    const bundleId = await shelved();
    const order = await paidByPost(bundleId);
    // Refunded on the payment service's own side (as from its dashboard), under another key.
    await api.runtime.ctx.stripe.refunds.create({ payment_intent: order.stripePaymentIntentId! });
    const cancelled = await sellerClient.send('post', `/api/orders/${order.id}/cancel`, { reason: 'Refunded by hand' });
    expect(cancelled.status).toBe(200);
    expect(await refundedAmount(order.stripePaymentIntentId!)).toBe(order.chargeMinor);
    expect(await ledgerTotal(`WHERE order_id = '${order.id}' AND account = 'seller:${seller.id}'`)).toBe(0);

    const other = await paidByPost(await shelved());
    // A partial refund on the service's side: the rest cannot be refunded in full, and the order stays as it was.
    await api.runtime.ctx.stripe.refunds.create({ payment_intent: other.stripePaymentIntentId!, amount: 100 });
    const refused = await treasurerClient.send('post', `/api/orders/${other.id}/refund`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/refused the refund/);
    expect(await Order.findByPk(other.id)).toMatchObject({ state: 'confirmed', refundedAt: null });
  });

  it('cancels a paid order before posting: refunded through the stand-in, ledger reversed, bundle back on the shelf', async () => {
    const bundleId = await shelved();
    const order = await paidByPost(bundleId);
    const cancelled = await sellerClient.send('post', `/api/orders/${order.id}/cancel`, { reason: 'Found a moth hole' });
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.order).toMatchObject({ state: 'cancelled', refundedAt: expect.any(String) });
    expect(await refundedAmount(order.stripePaymentIntentId!)).toBe(order.chargeMinor);
    expect(await Bundle.findByPk(bundleId)).toMatchObject({ state: 'on_shelf', quantityAvailable: 1 });
    // The processor keeps its fee on a refund (from memory; a guild setting to revisit), so only that pair stands.
    expect(await ledgerTotal(`WHERE order_id = '${order.id}' AND kind <> 'processing_cost'`)).toBe(0);
    expect(await ledgerTotal(`WHERE order_id = '${order.id}' AND account = 'seller:${seller.id}'`)).toBe(0);
    // Each side reads what it means for them.
    expect((await waitForMail({ to: buyer.email, subjectIncludes: 'was cancelled' })).text).toMatch(/Your payment of \$[\d.]+ is being refunded to your card/);
    expect((await waitForMail({ to: seller.email, subjectIncludes: 'was cancelled' })).text).toContain('Please do not post it.');
  });

  it('cancels or posts an order asked for both at once, never refunding one that was posted', async () => {
    const bundleId = await shelved();
    const order = await paidByPost(bundleId);
    const [cancelled, posted] = await Promise.all([
      sellerClient.send('post', `/api/orders/${order.id}/cancel`, { reason: 'Sold at the meeting instead' }),
      sellerClient.send('post', `/api/orders/${order.id}/posted`, {}),
    ]);
    const after = (await Order.findByPk(order.id))!;
    const refunded = await refundedAmount(order.stripePaymentIntentId!);
    if (after.state === 'cancelled') {
      expect([cancelled.status, posted.status]).toEqual([200, 403]);
      expect(refunded).toBe(order.chargeMinor);
      expect(await ledgerTotal(`WHERE order_id = '${order.id}' AND account = 'seller:${seller.id}'`)).toBe(0);
    } else {
      expect(after.state).toBe('posted');
      expect([cancelled.status, posted.status]).toEqual([403, 200]);
      expect(refunded).toBe(0);
    }
  });

  it('lets the treasurer refund a posted order after a reported problem, see balances, record a payout and export CSV', async () => {
    const kept = await shelved({ priceMinor: 1500 });
    const keptOrder = await buyerClient.send('post', '/api/orders', { items: [{ bundleId: kept, quantity: 1 }], fulfilment: 'post', address });
    await payCheckout(sessionIdFromUrl(keptOrder.body.checkoutUrl));
    await waitFor(async () => (await Order.findByPk(keptOrder.body.order.id))?.state === 'confirmed');
    // Posted, so its credit may be paid out below.
    expect((await sellerClient.send('post', `/api/orders/${keptOrder.body.order.id}/posted`, {})).status).toBe(200);

    const bundleId = await shelved({ priceMinor: 2000 });
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    await payCheckout(sessionIdFromUrl(placed.body.checkoutUrl));
    const orderId = placed.body.order.id;
    await waitFor(async () => (await Order.findByPk(orderId))?.state === 'confirmed');
    await sellerClient.send('post', `/api/orders/${orderId}/posted`, {});
    const reported = await buyerClient.send('post', `/api/orders/${orderId}/problems`, { message: 'The bag arrived soaked.' });
    expect(reported.status).toBe(201);
    const problems = await treasurerClient.get('/api/orders?as=treasurer&problems=open');
    expect(problems.body.items.map((o: { id: string }) => o.id)).toContain(orderId);
    expect((await buyerClient.get('/api/orders?as=treasurer')).status).toBe(403);
    // The treasurer handles the problem without the buyer's home address: only the buyer and the paid seller see it.
    const treasurerView = await treasurerClient.get(`/api/orders/${orderId}`);
    expect(treasurerView.status).toBe(200);
    expect(treasurerView.body.order.address).toBeNull();
    expect((await treasurerClient.get(`/api/orders/${orderId}/packing-slip`)).status).toBe(403);
    expect((await waitForMail({ to: treasurer.email, subjectIncludes: 'A problem was reported' })).text).toContain('The bag arrived soaked.');
    // The seller learns there is a problem, not what the buyer wrote: that is for the treasurer.
    const toSeller = await waitForMail({ to: seller.email, subjectIncludes: 'The buyer reported a problem' });
    expect(toSeller.text).toContain('who bought order');
    expect(toSeller.text).toContain('The guild’s treasurer is looking into it');
    expect(toSeller.text).not.toContain('soaked');
    const sellerView = (await sellerClient.get(`/api/orders/${orderId}`)).body.order;
    expect(sellerView.problems).toEqual([{ id: expect.any(String), message: null, createdAt: expect.any(String), resolvedAt: null }]);
    expect(treasurerView.body.order.problems[0].message).toBe('The bag arrived soaked.');
    expect((await sellerClient.send('post', `/api/orders/${orderId}/refund`)).status).toBe(403);
    const refunded = await treasurerClient.send('post', `/api/orders/${orderId}/refund`);
    expect(refunded.body.order).toMatchObject({ state: 'refunded' });
    await waitForMail({ to: buyer.email, subjectIncludes: 'Refund for order' });
    expect((await waitForMail({ to: seller.email, subjectIncludes: 'was refunded' })).text).toContain('is taken off what the guild owes you');
    const afterRefund = await treasurerClient.get('/api/orders?as=treasurer&problems=open');
    expect(afterRefund.body.items.map((o: { id: string }) => o.id)).not.toContain(orderId);

    const balances = await treasurerClient.get('/api/seller-balances');
    const mine = balances.body.items.find((b: { sellerId: string }) => b.sellerId === seller.id);
    expect(mine.balanceMinor).toBe(await ledgerTotal(`WHERE account = 'seller:${seller.id}'`));
    expect(mine.payableMinor + mine.waitingMinor).toBe(mine.balanceMinor);
    expect(mine.payableMinor).toBeGreaterThanOrEqual(500);

    const tooMuch = await treasurerClient.send('post', '/api/payouts', { sellerId: seller.id, amountMinor: mine.payableMinor + 1, method: 'bank_transfer' });
    expect(tooMuch.status).toBe(422);
    expect(tooMuch.body.error.fields.amountMinor).toBeDefined();
    const payout = await treasurerClient.send('post', '/api/payouts', { sellerId: seller.id, amountMinor: 500, method: 'bank_transfer', reference: 'Nov transfer' });
    expect(payout.status).toBe(201);
    const after = await balanceOf(seller.id);
    expect(after).toMatchObject({
      balanceMinor: mine.balanceMinor - 500,
      paidOutMinor: mine.paidOutMinor + 500,
      payableMinor: mine.payableMinor - 500,
      waitingMinor: mine.waitingMinor,
    });

    const ledger = await treasurerClient.get('/api/ledger?kind=payout');
    expect(ledger.body.items.every((e: { kind: string }) => e.kind === 'payout')).toBe(true);
    const csv = await treasurerClient.get('/api/ledger.csv');
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text.split('\n')[0]).toBe('time_in_UTC,transaction,kind,reverses,account,amount_in_currency_units,currency,order,payout');
    expect((await buyerClient.get('/api/ledger')).status).toBe(403);
  });

  it('tells the treasurer when a refund would leave a seller who has been paid out owing the guild, and nobody else', async () => {
    const paidOut = await createMember({ name: 'Wren Ashdown' });
    const paidOutClient = await signedInClient(api.runtime.app, paidOut);
    const order = await paidByPost(await shelved({ priceMinor: 900 }, paidOutClient));
    const credit = order.sellerCreditMinor!;
    expect(credit).toBeGreaterThan(0);
    expect((await paidOutClient.send('post', `/api/orders/${order.id}/posted`, {})).status).toBe(200);

    const before = (await treasurerClient.get(`/api/orders/${order.id}`)).body.order;
    expect(before.abilities.refund).toBe(true);
    expect(before.refundEffect).toEqual({ sellerPayableMinor: credit, sellerPayableAfterMinor: 0, sellerCreditMinor: credit });

    const payout = await treasurerClient.send('post', '/api/payouts', { sellerId: paidOut.id, amountMinor: credit, method: 'bank_transfer' });
    expect(payout.status).toBe(201);
    const afterPayout = (await treasurerClient.get(`/api/orders/${order.id}`)).body.order;
    expect(afterPayout.refundEffect).toEqual({ sellerPayableMinor: 0, sellerPayableAfterMinor: -credit, sellerCreditMinor: credit });
    expect(afterPayout.refundEffect.sellerPayableMinor).toBe(await ledgerTotal(`WHERE account = 'seller:${paidOut.id}'`));

    // The buyer and the seller see the order without it; so does anyone after the refund.
    expect((await buyerClient.get(`/api/orders/${order.id}`)).body.order.refundEffect).toBeNull();
    expect((await paidOutClient.get(`/api/orders/${order.id}`)).body.order.refundEffect).toBeNull();
    const refunded = await treasurerClient.send('post', `/api/orders/${order.id}/refund`);
    expect(refunded.body.order).toMatchObject({ state: 'refunded', refundEffect: null });

    expect(await balanceOf(paidOut.id)).toMatchObject({ balanceMinor: -credit, payableMinor: -credit, waitingMinor: 0 });
    expect(await ledgerTotal(`WHERE account = 'seller:${paidOut.id}'`)).toBe(-credit);
    expect((await waitForMail({ to: paidOut.email, subjectIncludes: 'was refunded' })).text).toContain(`so you now owe the guild ${dollars(credit)}`);
  });

  it('keeps a paid order’s credit waiting until its bag is posted, and refuses a payout above what is payable, writing nothing', async () => {
    const maker = await createMember({ name: 'Maud Penrose' });
    const makerClient = await signedInClient(api.runtime.app, maker);
    const order = await paidByPost(await shelved({ priceMinor: 1100 }, makerClient));
    const credit = order.sellerCreditMinor;
    expect(credit).toBeGreaterThan(0);
    expect(await balanceOf(maker.id)).toMatchObject({ creditedMinor: credit, paidOutMinor: 0, balanceMinor: credit, payableMinor: 0, waitingMinor: credit });

    const tables = ['payouts', 'ledger_entries'];
    const before = await countRows(api.runtime.ctx.sequelize, tables);
    const early = await treasurerClient.send('post', '/api/payouts', { sellerId: maker.id, amountMinor: credit, method: 'cash' });
    expect(early.status).toBe(422);
    expect(early.body.error.fields.amountMinor).toBe('Nothing is payable now.');
    expect(early.body.error.message).toContain(`nothing can be paid to Maud Penrose now. ${dollars(credit)} more is waiting for bags not yet posted or handed over`);
    expect(await countRows(api.runtime.ctx.sequelize, tables)).toEqual(before);

    expect((await makerClient.send('post', `/api/orders/${order.id}/posted`, {})).status).toBe(200);
    expect(await balanceOf(maker.id)).toMatchObject({ balanceMinor: credit, payableMinor: credit, waitingMinor: 0 });
    const over = await treasurerClient.send('post', '/api/payouts', { sellerId: maker.id, amountMinor: credit + 1, method: 'cash' });
    expect(over.status).toBe(422);
    expect(over.body.error.fields.amountMinor).toBe(`More than the ${dollars(credit)} payable now.`);
    expect(await countRows(api.runtime.ctx.sequelize, tables)).toEqual(before);

    const paid = await treasurerClient.send('post', '/api/payouts', { sellerId: maker.id, amountMinor: credit, method: 'cash' });
    expect(paid.status).toBe(201);
    expect(await balanceOf(maker.id)).toMatchObject({ paidOutMinor: credit, balanceMinor: 0, payableMinor: 0, waitingMinor: 0 });
  });

  it('makes a meeting sale’s credit payable once the bag is ticked off as handed over', async () => {
    const giver = await createMember({ name: 'Nell Carrow' });
    const giverClient = await signedInClient(api.runtime.app, giver);
    const meeting = await Meeting.create({ startsAt: new Date(Date.now() + 7 * 86_400_000), place: 'Millbrook Hall', createdBy: null });
    const bundleId = await shelved({ priceMinor: 800, meetingHandoverOk: true }, giverClient);
    const order = await paidOrder(bundleId, { fulfilment: 'meeting', meetingId: meeting.id });
    expect(await balanceOf(giver.id)).toMatchObject({ payableMinor: 0, waitingMinor: order.sellerCreditMinor });

    expect((await librarianClient.send('post', `/api/handovers/${order.id}/done`)).status).toBe(204);
    expect(await balanceOf(giver.id)).toMatchObject({ payableMinor: order.sellerCreditMinor, waitingMinor: 0 });
  });

  it('lets the librarian untick a handover ticked by mistake, a payout since included while it leaves the seller owing nothing', async () => {
    const giver = await createMember({ name: 'Tamsin Rowe' });
    const giverClient = await signedInClient(api.runtime.app, giver);
    const meeting = await Meeting.create({ startsAt: new Date(Date.now() + 7 * 86_400_000), place: 'Millbrook Hall', createdBy: null });
    // A bag already posted, whose credit is payable whatever happens at the meeting.
    const posted = await paidByPost(await shelved({ priceMinor: 1000 }, giverClient));
    expect((await giverClient.send('post', `/api/orders/${posted.id}/posted`, {})).status).toBe(200);
    const order = await paidOrder(await shelved({ priceMinor: 800, meetingHandoverOk: true }, giverClient), { fulfilment: 'meeting', meetingId: meeting.id });
    expect((await librarianClient.send('post', `/api/handovers/${order.id}/done`)).status).toBe(204);
    // Paid out after the tick, but only what the posted bag earned: the meeting sale's credit is still there.
    expect((await treasurerClient.send('post', '/api/payouts', { sellerId: giver.id, amountMinor: posted.sellerCreditMinor, method: 'cash' })).status).toBe(201);
    expect(await balanceOf(giver.id)).toMatchObject({ payableMinor: order.sellerCreditMinor, waitingMinor: 0 });
    expect(await handoverRow(meeting.id, order.id)).toMatchObject({ done: true, abilities: { markDone: false, undo: true }, undoNote: null });

    expect((await librarianClient.send('delete', `/api/handovers/${order.id}/done`)).status).toBe(204);
    const unticked = (await Order.findByPk(order.id))!;
    expect([unticked.state, unticked.handedOverAt, unticked.handedOverBy]).toEqual(['confirmed', null, null]);
    // Back to waiting: the bag has not changed hands, so its credit cannot be paid out yet, and nothing is owed.
    expect(await balanceOf(giver.id)).toMatchObject({ payableMinor: 0, waitingMinor: order.sellerCreditMinor });
    expect(await handoverRow(meeting.id, order.id)).toMatchObject({ done: false, abilities: { markDone: true, undo: false, cancel: true } });
    // Only a ticked handover can be unticked.
    const again = await librarianClient.send('delete', `/api/handovers/${order.id}/done`);
    expect(again.status).toBe(409);
    expect(again.body.error.fields).toEqual({ id: 'Not ticked.' });
  });

  it('refuses to untick a handover when a payout since the tick would leave the seller owing the guild, sends the librarian to the treasurer, and writes nothing', async () => {
    const giver = await createMember({ name: 'Ebba Quance' });
    const giverClient = await signedInClient(api.runtime.app, giver);
    const meeting = await Meeting.create({ startsAt: new Date(Date.now() + 7 * 86_400_000), place: 'Millbrook Hall', createdBy: null });
    const order = await paidOrder(await shelved({ priceMinor: 900, meetingHandoverOk: true }, giverClient), { fulfilment: 'meeting', meetingId: meeting.id });
    const credit = order.sellerCreditMinor;
    expect((await librarianClient.send('post', `/api/handovers/${order.id}/done`)).status).toBe(204);
    const ticked = (await Order.findByPk(order.id))!;
    expect((await treasurerClient.send('post', '/api/payouts', { sellerId: giver.id, amountMinor: credit, method: 'cash' })).status).toBe(201);

    const message =
      `This tick can no longer be undone here: Ebba Quance was paid out after the handover was ticked, and unticking it would leave them owing the guild ${dollars(credit)}. ` +
      'If it was ticked by mistake, please ask the treasurer to put it right.';
    // The sheet offers no untick, and says why and whom to ask.
    expect(await handoverRow(meeting.id, order.id)).toMatchObject({ done: true, abilities: { markDone: false, undo: false }, undoNote: message });

    const tables = ['orders', 'ledger_entries', 'payouts', 'order_items'];
    const before = await countRows(api.runtime.ctx.sequelize, tables);
    const refused = await librarianClient.send('delete', `/api/handovers/${order.id}/done`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toEqual({ code: 'conflict', message, fields: { id: 'Paid out since the tick: ask the treasurer.' } });
    expect(await countRows(api.runtime.ctx.sequelize, tables)).toEqual(before);
    const after = (await Order.findByPk(order.id))!;
    expect([after.state, after.handedOverAt, after.handedOverBy, after.updatedAt]).toEqual([ticked.state, ticked.handedOverAt, ticked.handedOverBy, ticked.updatedAt]);
    expect(await balanceOf(giver.id)).toMatchObject({ paidOutMinor: credit, payableMinor: 0, waitingMinor: 0 });
  });

  it('keeps the untick open until midnight at the end of the meeting’s day in the guild’s time zone', async () => {
    const giver = await createMember({ name: 'Lowenna Trist' });
    const giverClient = await signedInClient(api.runtime.app, giver);
    // 03:00 UTC a week on is the evening before in Los Angeles (UTC−8 in winter, UTC−7 in summer; IANA tz database),
    // whose day then ends at 08:00 or 07:00 UTC: three hours after the start is still that evening there, six is not,
    // though both are on the same UTC day.
    const week = new Date(Date.now() + 7 * 86_400_000);
    const startsAt = new Date(Date.UTC(week.getUTCFullYear(), week.getUTCMonth(), week.getUTCDate(), 3));
    const meeting = await Meeting.create({ startsAt, place: 'Millbrook Hall', createdBy: null });
    const order = await paidOrder(await shelved({ priceMinor: 700, meetingHandoverOk: true }, giverClient), { fulfilment: 'meeting', meetingId: meeting.id });
    expect((await librarianClient.send('post', `/api/handovers/${order.id}/done`)).status).toBe(204);
    const guild = (await Guild.findByPk(1))!;
    const settings = guild.settings;
    await guild.update({ settings: { ...settings, timeZone: 'America/Los_Angeles' } });
    const setClock = (at: number) => api.clock.advance(at - api.clock.now().getTime());
    try {
      setClock(startsAt.getTime() + 6 * 60 * 60_000);
      expect(await handoverRow(meeting.id, order.id)).toMatchObject({ done: true, abilities: { undo: false } });
      const late = await librarianClient.send('delete', `/api/handovers/${order.id}/done`);
      expect(late.status).toBe(409);
      expect(late.body.error.fields).toEqual({ id: 'Too late to undo.' });

      setClock(startsAt.getTime() + 3 * 60 * 60_000);
      expect(await handoverRow(meeting.id, order.id)).toMatchObject({ done: true, abilities: { undo: true } });
      expect((await librarianClient.send('delete', `/api/handovers/${order.id}/done`)).status).toBe(204);
      expect((await Order.findByPk(order.id))!.state).toBe('confirmed');
    } finally {
      api.clock.reset();
      await guild.update({ settings });
    }
  });

  it('leaves nothing waiting for an order refunded before posting, and counts only what was paid out when telling who owes', async () => {
    const quilter = await createMember({ name: 'Ada Trelawny' });
    const quilterClient = await signedInClient(api.runtime.app, quilter);
    // One bag posted and its credit paid out; a second sale paid but not yet posted.
    const sent = await paidByPost(await shelved({ priceMinor: 1000 }, quilterClient));
    expect((await quilterClient.send('post', `/api/orders/${sent.id}/posted`, {})).status).toBe(200);
    expect((await treasurerClient.send('post', '/api/payouts', { sellerId: quilter.id, amountMinor: sent.sellerCreditMinor, method: 'cheque' })).status).toBe(201);
    const unsent = await paidByPost(await shelved({ priceMinor: 1300 }, quilterClient));
    expect(await balanceOf(quilter.id)).toMatchObject({ payableMinor: 0, waitingMinor: unsent.sellerCreditMinor });

    // Refunding the bag not yet sent takes back only waiting credit: nothing that was paid out, so nobody owes.
    const unsentView = (await treasurerClient.get(`/api/orders/${unsent.id}`)).body.order;
    expect(unsentView.refundEffect).toEqual({ sellerPayableMinor: 0, sellerPayableAfterMinor: 0, sellerCreditMinor: unsent.sellerCreditMinor });
    await clearMail();
    expect((await treasurerClient.send('post', `/api/orders/${unsent.id}/refund`)).status).toBe(200);
    expect(await balanceOf(quilter.id)).toMatchObject({ balanceMinor: 0, payableMinor: 0, waitingMinor: 0 });
    const told = await waitForMail({ to: quilter.email, subjectIncludes: 'was refunded' });
    expect(told.text).toContain('Please do not post it');
    expect(told.text).not.toContain('owe the guild');

    // Another sale waits; refunding the bag already sent takes back money paid out. The waiting credit does not
    // cover it (that order may be refunded too): the seller owes the paid-out credit until later bags go out.
    const waiting = await paidByPost(await shelved({ priceMinor: 1500 }, quilterClient));
    const sentView = (await treasurerClient.get(`/api/orders/${sent.id}`)).body.order;
    expect(sentView.refundEffect).toEqual({ sellerPayableMinor: 0, sellerPayableAfterMinor: -sent.sellerCreditMinor, sellerCreditMinor: sent.sellerCreditMinor });
    await clearMail();
    expect((await treasurerClient.send('post', `/api/orders/${sent.id}/refund`)).status).toBe(200);
    expect(await balanceOf(quilter.id)).toMatchObject({
      balanceMinor: waiting.sellerCreditMinor - sent.sellerCreditMinor,
      payableMinor: -sent.sellerCreditMinor,
      waitingMinor: waiting.sellerCreditMinor,
    });
    expect((await waitForMail({ to: quilter.email, subjectIncludes: 'was refunded' })).text).toContain(`so you now owe the guild ${dollars(sent.sellerCreditMinor)}`);
  });

  it('keeps the ledger balanced after everything above', async () => {
    expect(await ledgerTotal()).toBe(0);
    const [rows] = await api.runtime.ctx.sequelize.query(`SELECT transaction_id FROM ledger_entries GROUP BY transaction_id HAVING sum(amount_minor) <> 0`);
    expect(rows).toEqual([]);
  });
});

describe('bad order input', () => {
  it.each([
    ['no items', { items: [], fulfilment: 'post', address }, 'items'],
    ['a negative quantity', { items: [{ bundleId: '00000000-0000-4000-8000-000000000000', quantity: -1 }], fulfilment: 'post', address }, 'items.0.quantity'],
    ['a huge quantity', { items: [{ bundleId: '00000000-0000-4000-8000-000000000000', quantity: 1e9 }], fulfilment: 'post', address }, 'items.0.quantity'],
    ['post without an address', { items: [{ bundleId: '00000000-0000-4000-8000-000000000000', quantity: 1 }], fulfilment: 'post' }, 'address'],
    ['an unknown fulfilment', { items: [{ bundleId: '00000000-0000-4000-8000-000000000000', quantity: 1 }], fulfilment: 'drone' }, 'fulfilment'],
    ['a bad country', { items: [{ bundleId: '00000000-0000-4000-8000-000000000000', quantity: 1 }], fulfilment: 'post', address: { ...address, country: 'Narnia' } }, 'address.country'],
    ['two letters that are no country', { items: [{ bundleId: '00000000-0000-4000-8000-000000000000', quantity: 1 }], fulfilment: 'post', address: { ...address, country: 'UK' } }, 'address.country'],
  ])('refuses %s with 400 naming the field', async (_label, body, field) => {
    const before = await countRows(api.runtime.ctx.sequelize, ['orders', 'order_items']);
    const res = await buyerClient.send('post', '/api/orders', body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toBeDefined();
    expect(await countRows(api.runtime.ctx.sequelize, ['orders', 'order_items'])).toEqual(before);
  });

  it('answers 409 for a bundle that does not exist', async () => {
    const res = await buyerClient.send('post', '/api/orders', { items: [{ bundleId: '00000000-0000-4000-8000-000000000000', quantity: 1 }], fulfilment: 'post', address });
    expect(res.status).toBe(409);
  });

  it('refuses a postage table with a band in an unknown zone, naming the field', async () => {
    const admin = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'admin'] }));
    const current = (await admin.get('/api/guild/postage')).body.postage;
    const res = await admin.send('put', '/api/guild/postage', { ...current, bands: [{ zone: 'moon', maxGrams: 100, priceMinor: 100 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['bands.0.zone']).toMatch(/moon/);
    // Countries are two-letter codes, each once; nothing is saved when one is wrong.
    const badCountries = await admin.send('put', '/api/guild/postage', { ...current, countries: ['US', 'USA', 'US'] });
    expect(badCountries.status).toBe(400);
    expect(Object.keys(badCountries.body.error.fields)).toEqual(expect.arrayContaining(['countries.1']));
    expect((await admin.get('/api/guild/postage')).body.postage).toEqual(current);
  });
});

describe('the order’s life', () => {
  it('refuses, before writing, any move of state the shared state machine does not list', async () => {
    const bundleId = await shelved();
    const placed = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
    expect((await buyerClient.send('post', `/api/orders/${placed.body.order.id}/cancel`, { reason: 'Changed my mind' })).status).toBe(200);
    const order = (await Order.findByPk(placed.body.order.id))!;
    // ORDER_TRANSITIONS in packages/shared/src/domain/fibres.ts: a cancelled order goes nowhere.
    await expect(order.update({ state: 'confirmed' })).rejects.toThrow('may not move from cancelled to confirmed');
    expect((await Order.findByPk(order.id))!.state).toBe('cancelled');
  });
});
