/**
 * Disputes: the cardholder's bank questions a paid charge. Tests open, answer and decide them through
 * `/_control` (in Stripe the bank does the first and last, and the merchant answers in the dashboard);
 * the SDK reads them with `GET /v1/disputes/:id`, and each step sends its `charge.dispute.*` event.
 */
import { eventContext, findSession, SYSTEM_REQUEST } from './checkout.ts';
import type { FakeContext } from './context.ts';
import { invalidRequest, parameterInvalid, resourceMissing } from './errors.ts';
import { newId } from './ids.ts';
import { formatMoney } from './money.ts';
import type { BalanceTransaction, Charge, Dispute, DisputeReason, RequestContext } from './types.ts';

const DAY_SECONDS = 24 * 60 * 60;
/**
 * Days the bank gives the merchant to answer. The real window depends on the card network (commonly one to three
 * weeks; from memory); Stripe's sample Dispute sets `due_by` to the last second of a UTC day, and so does this.
 */
const EVIDENCE_WINDOW_DAYS = 7;
/**
 * The card service's fee for a dispute, in the charge's minor units, when a test does not name one: 15.00, Stripe's
 * published fee for a US card dispute (from memory; processors and countries differ, so tests may set their own).
 */
export const DEFAULT_DISPUTE_FEE = 1500;

/** One movement of the merchant's balance caused by a dispute; `fee` is charged on top of `amount`. */
function balanceMovement(ctx: FakeContext, dispute: Dispute, amount: number, fee: number): BalanceTransaction {
  const created = ctx.clock();
  return {
    id: newId('txn_test'),
    object: 'balance_transaction',
    amount,
    available_on: created,
    created,
    currency: dispute.currency,
    description: amount < 0 ? `Chargeback withdrawal for ${dispute.charge}` : `Chargeback reversal for ${dispute.charge}`,
    fee,
    fee_details: fee === 0 ? [] : [{ amount: fee, application: null, currency: dispute.currency, description: 'Dispute fee', type: 'stripe_fee' }],
    net: amount - fee,
    reporting_category: amount < 0 ? 'dispute' : 'dispute_reversal',
    source: dispute.id,
    status: 'available',
    type: 'adjustment',
  };
}

export function findDispute(ctx: FakeContext, id: string): Dispute {
  const dispute = ctx.store.disputes.get(id);
  if (!dispute) throw resourceMissing('dispute', id, 'dispute');
  return dispute;
}

/** Events about a dispute carry the Stripe-Version of the session whose payment it questions. */
function disputeEvents(ctx: FakeContext, dispute: Dispute): RequestContext {
  const record = [...ctx.store.sessions.values()].find((r) => r.session.payment_intent === dispute.payment_intent);
  return record ? eventContext(record, SYSTEM_REQUEST) : SYSTEM_REQUEST;
}

/**
 * The bank opens a dispute on a paid session's charge: by default for the whole payment. The amount leaves the
 * merchant's balance at once, with the dispute fee (`fee`, default `DEFAULT_DISPUTE_FEE`), as one movement.
 */
export async function openDispute(ctx: FakeContext, sessionId: string, input: { reason: DisputeReason; amount?: number; fee?: number }): Promise<Dispute> {
  const { session } = findSession(ctx, sessionId, 'id');
  if (session.payment_status !== 'paid' || session.payment_intent === null) {
    throw invalidRequest(`Checkout Session ${session.id} has no payment to dispute (status: ${session.status}).`, 'checkout_session_not_paid');
  }
  const paymentIntent = ctx.store.paymentIntents.get(session.payment_intent)!;
  const charge = ctx.store.charges.get(paymentIntent.latest_charge) as Charge;
  const existing = ctx.store.disputeForCharge(charge.id);
  if (existing) throw invalidRequest(`Charge ${charge.id} already has a dispute (${existing.id}).`, 'charge_already_disputed');
  const amount = input.amount ?? charge.amount;
  if (!Number.isSafeInteger(amount) || amount < 1 || amount > charge.amount) {
    throw parameterInvalid('amount', `A dispute's amount is between 1 and the charge's ${formatMoney(charge.amount, charge.currency)}, in minor units.`);
  }
  const fee = input.fee ?? DEFAULT_DISPUTE_FEE;
  if (!Number.isSafeInteger(fee) || fee < 0) throw parameterInvalid('fee', 'A dispute fee is a whole number of minor units, 0 or more.');
  const created = ctx.clock();
  const dueDay = Math.floor((created + EVIDENCE_WINDOW_DAYS * DAY_SECONDS) / DAY_SECONDS);
  const dispute: Dispute = {
    id: newId('dp_test'),
    object: 'dispute',
    amount,
    balance_transactions: [],
    charge: charge.id,
    created,
    currency: charge.currency,
    evidence_details: { due_by: (dueDay + 1) * DAY_SECONDS - 1, has_evidence: false, past_due: false, submission_count: 0 },
    // A full dispute has already taken the money; refunding it as well is refused (see refunds.ts).
    is_charge_refundable: false,
    livemode: false,
    metadata: {},
    payment_intent: paymentIntent.id,
    reason: input.reason,
    status: 'needs_response',
  };
  dispute.balance_transactions.push(balanceMovement(ctx, dispute, -amount, fee));
  ctx.store.disputes.set(dispute.id, dispute);
  charge.disputed = true;
  const events = disputeEvents(ctx, dispute);
  await ctx.webhooks.emit('charge.dispute.created', dispute, events);
  await ctx.webhooks.emit('charge.dispute.funds_withdrawn', dispute, events);
  return dispute;
}

function checkOpen(dispute: Dispute): void {
  if (dispute.status === 'won' || dispute.status === 'lost') {
    throw invalidRequest(`Dispute ${dispute.id} is already closed (status: ${dispute.status}).`, 'dispute_already_closed');
  }
}

/** The merchant sends its evidence (in Stripe, from the dashboard): the bank now reviews it. */
export async function answerDispute(ctx: FakeContext, id: string): Promise<Dispute> {
  const dispute = findDispute(ctx, id);
  checkOpen(dispute);
  if (dispute.status !== 'needs_response') throw invalidRequest(`Dispute ${dispute.id} has been answered already.`, 'dispute_already_answered');
  const { evidence_details: details } = dispute;
  details.has_evidence = true;
  details.submission_count += 1;
  details.past_due = details.due_by !== null && ctx.clock() > details.due_by;
  dispute.status = 'under_review';
  await ctx.webhooks.emit('charge.dispute.updated', dispute, disputeEvents(ctx, dispute));
  return dispute;
}

/**
 * The bank decides: `won` gives the amount back to the merchant, `lost` leaves it with the cardholder. Whether the
 * dispute fee comes back with a win depends on the processor and the country; `feeReturned` says it does. As with
 * Stripe, the money given back is its own event after the decision (`charge.dispute.funds_reinstated`), so the
 * decision's event lists only the withdrawal.
 */
export async function closeDispute(ctx: FakeContext, id: string, outcome: 'won' | 'lost', feeReturned = false): Promise<Dispute> {
  const dispute = findDispute(ctx, id);
  checkOpen(dispute);
  dispute.status = outcome;
  const events = disputeEvents(ctx, dispute);
  await ctx.webhooks.emit('charge.dispute.closed', dispute, events);
  if (outcome === 'won') {
    const withdrawn = dispute.balance_transactions[0]!;
    dispute.balance_transactions.push(balanceMovement(ctx, dispute, -withdrawn.amount, feeReturned ? -withdrawn.fee : 0));
    await ctx.webhooks.emit('charge.dispute.funds_reinstated', dispute, events);
  }
  return dispute;
}
