/** Refunds against the charge of a paid PaymentIntent, partial or full. */
import type { FakeContext } from './context.ts';
import { invalidRequest, parameterInvalid, resourceMissing, StripeFakeError } from './errors.ts';
import { newId } from './ids.ts';
import { formatMoney } from './money.ts';
import type { ParamReader } from './params.ts';
import type { Charge, Refund, RefundReason, RequestContext } from './types.ts';

const REASONS: readonly RefundReason[] = ['duplicate', 'fraudulent', 'requested_by_customer'];

function chargeFor(ctx: FakeContext, paymentIntentId: string | undefined, chargeId: string | undefined): Charge {
  if (paymentIntentId !== undefined) {
    const paymentIntent = ctx.store.paymentIntents.get(paymentIntentId);
    if (!paymentIntent) throw resourceMissing('payment_intent', paymentIntentId, 'payment_intent');
    if (chargeId !== undefined && chargeId !== paymentIntent.latest_charge) {
      throw parameterInvalid('charge', `Charge ${chargeId} does not belong to PaymentIntent ${paymentIntentId}.`);
    }
    return ctx.store.charges.get(paymentIntent.latest_charge) as Charge;
  }
  const charge = ctx.store.charges.get(chargeId as string);
  if (!charge) throw resourceMissing('charge', chargeId as string, 'charge');
  return charge;
}

export function createRefund(ctx: FakeContext, params: ParamReader, request: RequestContext): Refund {
  const paymentIntentId = params.string('payment_intent');
  const chargeId = params.string('charge');
  if (paymentIntentId === undefined && chargeId === undefined) {
    throw new StripeFakeError(
      400,
      'invalid_request_error',
      'One of the following params should be provided for this request: payment_intent or charge.',
      'parameter_missing',
      undefined,
      undefined,
      true,
    );
  }
  const requested = params.integer('amount', { min: 1 });
  const reason = params.enumValue('reason', REASONS) ?? null;
  const metadata = params.metadata('metadata');
  params.done();
  const charge = chargeFor(ctx, paymentIntentId, chargeId);
  const dispute = ctx.store.disputeForCharge(charge.id);
  if (dispute && !dispute.is_charge_refundable && dispute.status !== 'won') {
    // Stripe's wording and code for a refund of a charged-back payment, from memory.
    throw invalidRequest(`Charge ${charge.id} has been charged back; cannot issue a refund.`, 'charge_disputed');
  }

  const remaining = charge.amount - charge.amount_refunded;
  if (remaining === 0) {
    throw invalidRequest(`Charge ${charge.id} has already been refunded.`, 'charge_already_refunded');
  }
  const amount = requested ?? remaining;
  if (amount > remaining) {
    throw invalidRequest(
      `Refund amount (${formatMoney(amount, charge.currency)}) is greater than unrefunded amount on charge (${formatMoney(remaining, charge.currency)})`,
      'amount_too_large',
      'amount',
    );
  }

  const refund: Refund = {
    id: newId('re_test'),
    object: 'refund',
    amount,
    balance_transaction: null,
    charge: charge.id,
    created: ctx.clock(),
    currency: charge.currency,
    metadata,
    payment_intent: charge.payment_intent,
    reason,
    receipt_number: null,
    status: 'succeeded',
  };
  ctx.store.refunds.set(refund.id, refund);
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount;

  void ctx.webhooks.emit('refund.created', refund, request);
  void ctx.webhooks.emit('charge.refunded', charge, request);
  return refund;
}
