import express, { Router } from 'express';
import type Stripe from 'stripe';
import { QueryTypes } from 'sequelize';
import { badRequest } from '../../errors/index.ts';
import type { AppContext } from '../../context.ts';
import { cancelUnpaid, confirmPayment, paymentIntentIdOf } from '../orders/orders.service.ts';
import { recordDispute } from '../orders/disputes.service.ts';

/**
 * The payment service's events. The signature is checked on the raw body; each event id is
 * recorded in the same transaction as its effect, so a repeated delivery changes nothing.
 */
type DisputeEvent =
  | Stripe.ChargeDisputeCreatedEvent
  | Stripe.ChargeDisputeUpdatedEvent
  | Stripe.ChargeDisputeClosedEvent
  | Stripe.ChargeDisputeFundsWithdrawnEvent
  | Stripe.ChargeDisputeFundsReinstatedEvent;

const DISPUTE_EVENTS: ReadonlySet<string> = new Set<DisputeEvent['type']>([
  'charge.dispute.created',
  'charge.dispute.updated',
  'charge.dispute.closed',
  'charge.dispute.funds_withdrawn',
  'charge.dispute.funds_reinstated',
]);

/** Every piece of news about a dispute carries the whole Dispute object; `recordDispute` reads each the same way. */
const isDisputeEvent = (event: Stripe.Event): event is DisputeEvent => DISPUTE_EVENTS.has(event.type);

export function webhookRoutes(ctx: AppContext): Router {
  const router = Router();
  router.post('/stripe/webhook', express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    let event: Stripe.Event;
    try {
      event = ctx.stripe.webhooks.constructEvent(req.body as Buffer, req.get('stripe-signature') ?? '', ctx.config.stripe.webhookSecret);
    } catch {
      throw badRequest('The event signature does not verify.', { 'Stripe-Signature': 'Missing or wrong.' });
    }
    let followUp: (() => Promise<void>) | undefined;
    await ctx.sequelize.transaction(async (transaction) => {
      const recorded = await ctx.sequelize.query(`INSERT INTO stripe_events (id, type) VALUES ($1, $2) ON CONFLICT DO NOTHING RETURNING id`, {
        bind: [event.id, event.type],
        transaction,
        type: QueryTypes.SELECT,
      });
      if (recorded.length === 0) return;
      if (event.type === 'checkout.session.completed') {
        const session = event.data.object;
        if (session.payment_status !== 'paid') return;
        // A payment for an order already cancelled queues its refund in this transaction.
        await confirmPayment(ctx, session.id, paymentIntentIdOf(session), transaction);
      } else if (event.type === 'checkout.session.expired') {
        const orderId = event.data.object.metadata?.orderId;
        // Members read the reason on the order; the session's id stays in the log and the event record.
        if (orderId) followUp = async () => void (await cancelUnpaid(ctx, orderId, 'The payment page closed before a payment was made.'));
      } else if (isDisputeEvent(event)) {
        // The buyer's bank questions a payment: recorded on its order, the treasurers told, a lost one booked, the
        // money it moves (the amount and the card service's fee, withdrawn and reinstated) followed.
        await recordDispute(ctx, event.data.object, transaction);
      }
    });
    if (followUp) await followUp();
    res.json({ received: true });
  });
  return router;
}
