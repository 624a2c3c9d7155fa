import Stripe from 'stripe';
import { afterEach, describe, expect, it } from 'vitest';
import { bundleCheckoutParams, payWithCard, startHarness, WEBHOOK_SECRET, type Harness } from './helpers.ts';

let h: Harness | undefined;
afterEach(async () => {
  await h?.close();
  h = undefined;
});

async function control(path: string, body: unknown = {}): Promise<{ status: number; body: Record<string, unknown> & { error?: { code?: string; param?: string } } }> {
  const response = await fetch(`${h!.baseUrl}/_control${path}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(body),
  });
  return { status: response.status, body: (await response.json()) as Record<string, unknown> };
}

async function paidSession(): Promise<Stripe.Checkout.Session> {
  const session = await h!.stripe.checkout.sessions.create(bundleCheckoutParams());
  expect((await payWithCard(h!.baseUrl, session.id, '4242424242424242')).status).toBe(200);
  return h!.stripe.checkout.sessions.retrieve(session.id);
}

/** The delivered event of this type about this dispute, checked with the SDK's own signature check. */
async function deliveredEvent(type: string, disputeId: string): Promise<Stripe.Event> {
  const hook = await h!.receiver.waitFor((r) => r.rawBody.includes(`"type": "${type}"`) && r.rawBody.includes(disputeId));
  return h!.stripe.webhooks.constructEvent(hook.rawBody, hook.headers['stripe-signature'] as string, WEBHOOK_SECRET);
}

describe('disputes: the bank questions a paid charge', () => {
  it('opens a dispute for the whole payment, serves it through the SDK and sends a signed charge.dispute.created', async () => {
    // 15:30 UTC on 4 December 2026; the bank's deadline is the last second of the UTC day a week later.
    h = await startHarness({ now: () => new Date('2026-12-04T15:30:00Z') });
    const session = await paidSession();

    const opened = await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'product_not_received' });
    expect(opened.status).toBe(200);
    const disputeId = opened.body.id as string;
    expect(disputeId).toMatch(/^dp_test_/);

    const dispute = await h.stripe.disputes.retrieve(disputeId);
    expect(dispute).toMatchObject({
      object: 'dispute',
      amount: 1650,
      currency: 'usd',
      payment_intent: session.payment_intent,
      reason: 'product_not_received',
      status: 'needs_response',
      is_charge_refundable: false,
      evidence_details: { due_by: Date.UTC(2026, 11, 11, 23, 59, 59) / 1000, has_evidence: false, past_due: false, submission_count: 0 },
    });
    const charge = await h.stripe.charges.retrieve(dispute.charge as string);
    expect(charge).toMatchObject({ disputed: true, payment_intent: session.payment_intent, amount: 1650 });
    const expanded = await h.stripe.disputes.retrieve(disputeId, { expand: ['charge'] });
    expect((expanded.charge as Stripe.Charge).id).toBe(charge.id);

    const event = await deliveredEvent('charge.dispute.created', disputeId);
    expect(event.type).toBe('charge.dispute.created');
    expect(event.data.object).toMatchObject({ id: disputeId, object: 'dispute', status: 'needs_response', amount: 1650 });
    // Events about the payment carry the Stripe-Version its session was made with, as the payment's own events do.
    const completed = await h.receiver.waitFor((r) => r.rawBody.includes('"checkout.session.completed"'));
    expect(event.api_version).toBe((JSON.parse(completed.rawBody) as Stripe.Event).api_version);
    expect(event.api_version).not.toBeNull();
  });

  it('takes a smaller amount when asked, and sends charge.dispute.updated when answered and charge.dispute.closed when decided', async () => {
    h = await startHarness();
    const session = await paidSession();
    const opened = await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'product_unacceptable', amount: 1200 });
    const disputeId = opened.body.id as string;
    expect(opened.body).toMatchObject({ amount: 1200, status: 'needs_response' });

    const answered = await control(`/disputes/${disputeId}/answer`);
    expect(answered.body).toMatchObject({ status: 'under_review', evidence_details: { has_evidence: true, submission_count: 1, past_due: false } });
    expect((await deliveredEvent('charge.dispute.updated', disputeId)).data.object).toMatchObject({ status: 'under_review' });
    expect((await control(`/disputes/${disputeId}/answer`)).body.error?.code).toBe('dispute_already_answered');

    const lost = await control(`/disputes/${disputeId}/close`, { outcome: 'lost' });
    expect(lost.body).toMatchObject({ status: 'lost' });
    expect((await deliveredEvent('charge.dispute.closed', disputeId)).data.object).toMatchObject({ id: disputeId, status: 'lost', amount: 1200 });
    expect((await h.stripe.disputes.retrieve(disputeId)).status).toBe('lost');

    const again = await control(`/disputes/${disputeId}/close`, { outcome: 'won' });
    expect(again).toMatchObject({ status: 400, body: { error: { code: 'dispute_already_closed' } } });
    expect(h.receiver.received.filter((r) => r.rawBody.includes('"charge.dispute.closed"'))).toHaveLength(1);
  });

  it('lists the money it moved: the amount and the dispute fee withdrawn on opening, the amount given back on a win, the fee too when asked', async () => {
    h = await startHarness({ now: () => new Date('2026-12-04T15:30:00Z') });
    const session = await paidSession();
    const opened = await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'fraudulent' });
    const disputeId = opened.body.id as string;
    // No fee named: the default, 15.00 (Stripe's US dispute fee, from memory).
    const withdrawal = {
      object: 'balance_transaction',
      amount: -1650,
      fee: 1500,
      net: -3150,
      currency: 'usd',
      reporting_category: 'dispute',
      type: 'adjustment',
      source: disputeId,
      fee_details: [{ amount: 1500, currency: 'usd', type: 'stripe_fee', description: 'Dispute fee' }],
    };
    expect((await h.stripe.disputes.retrieve(disputeId)).balance_transactions).toMatchObject([withdrawal]);
    expect((await deliveredEvent('charge.dispute.created', disputeId)).data.object).toMatchObject({ balance_transactions: [withdrawal] });

    expect((await deliveredEvent('charge.dispute.funds_withdrawn', disputeId)).data.object).toMatchObject({ balance_transactions: [withdrawal] });

    // The decision comes first with only the withdrawal; the money given back is its own event after it, as with Stripe.
    await control(`/disputes/${disputeId}/close`, { outcome: 'won' });
    const reinstated = { amount: 1650, fee: 0, net: 1650, reporting_category: 'dispute_reversal', fee_details: [] };
    expect((await deliveredEvent('charge.dispute.closed', disputeId)).data.object).toMatchObject({ status: 'won', balance_transactions: [withdrawal] });
    expect((await deliveredEvent('charge.dispute.funds_reinstated', disputeId)).data.object).toMatchObject({ balance_transactions: [withdrawal, reinstated] });

    // A processor that gives the fee back with a win: the reinstatement's fee is negative.
    const second = await paidSession();
    const secondId = (await control(`/checkout/sessions/${second.id}/dispute`, { reason: 'general', fee: 2000 })).body.id as string;
    const won = await control(`/disputes/${secondId}/close`, { outcome: 'won', feeReturned: true });
    expect(won.body.balance_transactions).toMatchObject([{ amount: -1650, fee: 2000 }, { amount: 1650, fee: -2000, net: 3650 }]);

    // A lost dispute keeps only the withdrawal; a fee that is no whole number, or a feeReturned that is no boolean, is refused.
    const third = await paidSession();
    const thirdId = (await control(`/checkout/sessions/${third.id}/dispute`, { reason: 'general', fee: 0 })).body.id as string;
    expect((await control(`/disputes/${thirdId}/close`, { outcome: 'lost' })).body.balance_transactions).toMatchObject([{ amount: -1650, fee: 0, fee_details: [] }]);
    const fourth = await paidSession();
    expect(await control(`/checkout/sessions/${fourth.id}/dispute`, { reason: 'general', fee: 12.5 })).toMatchObject({ status: 400, body: { error: { param: 'fee' } } });
    expect(await control(`/checkout/sessions/${fourth.id}/dispute`, { reason: 'general', fee: '1500' })).toMatchObject({ status: 400, body: { error: { param: 'fee' } } });
    const fourthId = (await control(`/checkout/sessions/${fourth.id}/dispute`, { reason: 'general' })).body.id as string;
    expect(await control(`/disputes/${fourthId}/close`, { outcome: 'won', feeReturned: 'yes' })).toMatchObject({ status: 400, body: { error: { param: 'feeReturned' } } });
  });

  it('refuses to refund a charge under dispute or lost to one, and refunds again once the dispute is won', async () => {
    h = await startHarness();
    const session = await paidSession();
    const paymentIntent = session.payment_intent as string;
    const disputeId = (await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'fraudulent' })).body.id as string;

    await expect(h.stripe.refunds.create({ payment_intent: paymentIntent })).rejects.toMatchObject({ type: 'StripeInvalidRequestError', code: 'charge_disputed' });
    expect(h.fake.store.refunds.size).toBe(0);

    await control(`/disputes/${disputeId}/close`, { outcome: 'won' });
    expect((await deliveredEvent('charge.dispute.closed', disputeId)).data.object).toMatchObject({ status: 'won' });
    expect((await h.stripe.refunds.create({ payment_intent: paymentIntent })).amount).toBe(1650);
  });

  it('refuses a dispute on an unpaid session, a second one on the same charge, an unknown reason and an amount above the charge', async () => {
    h = await startHarness();
    const unpaid = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    expect((await control(`/checkout/sessions/${unpaid.id}/dispute`, { reason: 'general' })).body.error?.code).toBe('checkout_session_not_paid');

    const session = await paidSession();
    const badReason = await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'changed_my_mind' });
    expect(badReason).toMatchObject({ status: 400, body: { error: { param: 'reason' } } });
    const tooMuch = await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'general', amount: 1651 });
    expect(tooMuch).toMatchObject({ status: 400, body: { error: { param: 'amount' } } });
    expect(h.fake.store.disputes.size).toBe(0);

    await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'duplicate' });
    expect((await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'duplicate' })).body.error?.code).toBe('charge_already_disputed');
    expect(h.fake.store.disputes.size).toBe(1);
    const unknown = await control('/disputes/dp_test_nothing_here/close', { outcome: 'lost' });
    expect(unknown).toMatchObject({ status: 404, body: { error: { code: 'resource_missing' } } });
    await expect(h.stripe.disputes.retrieve('dp_test_nothing_here')).rejects.toMatchObject({ statusCode: 404 });
  });

  it('forgets disputes on reset', async () => {
    h = await startHarness();
    const session = await paidSession();
    const disputeId = (await control(`/checkout/sessions/${session.id}/dispute`, { reason: 'general' })).body.id as string;
    await control('/reset');
    await expect(h.stripe.disputes.retrieve(disputeId)).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });
});
