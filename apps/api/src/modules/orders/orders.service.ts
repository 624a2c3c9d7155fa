import Stripe from 'stripe';
import { Op, QueryTypes, UniqueConstraintError, type CreationAttributes, type Transaction } from 'sequelize';
import {
  allowsFulfilment,
  formatMoney,
  ledgerEntriesForPaidOrder,
  minimumCardChargeMinor,
  orderMoney,
  processingCostEntries,
  reversalEntries,
  type LedgerEntry as DomainEntry,
  type OrderCreateInput,
} from '@scrap-relay/shared';
import { removeFromBasket } from '../basket/basket.service.ts';
import { Bundle, LedgerEntry, Meeting, Member, Order, OrderDispute, OrderItem, OrderProblem, StarterClaim, type Guild } from '../../db/models/index.ts';
import { eligibilityOf, ineligible, leaveWaitlistWithClaim, offerToNextInLine } from '../starter/starter.service.ts';
import { badRequest, conflict, forbidden, notFound, serviceUnavailable, unprocessable } from '../../errors/index.ts';
import {
  lateRefundFailed,
  latePaymentRefunding,
  orderCancelled,
  orderConfirmedToBuyer,
  orderPostedToBuyer,
  orderReceivedToSeller,
  orderRefunded,
  orderRefundedToSeller,
  orderSoldToSeller,
  orderTakenAsReceivedToBuyer,
  postReminderToSeller,
  problemReported,
  problemReportedToSeller,
} from '../../emails/orders.ts';
import { emailChoicesUrl, type RenderedEmail } from '../../emails/render.ts';
import { isUnreachable } from '../../integrations/payments.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import { takenBackBeforeSent } from '../../policies/order.policy.ts';
import type { AppContext } from '../../context.ts';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';
import { meetingLabel } from '../../emails/format.ts';
import { quoteOrThrow } from '../postage/postage.service.ts';
import { sellerBalanceSplits, writeLedger } from './ledger-writer.ts';
import { LATE_REFUND_QUEUE } from '../../jobs/queue.ts';
import { newOrderReference } from './order-reference.ts';

const MINUTE_MS = 60_000;
const DAY_MS = 24 * 60 * MINUTE_MS;
/** Stripe will not expire a Checkout Session sooner than 30 minutes after creating it. */
const MIN_CHECKOUT_LIFETIME_MS = 31 * MINUTE_MS;
export const AUTO_RECEIVED_AFTER_DAYS = 21;
/** A paid order still not posted this long after payment reminds its seller, once. */
export const POST_REMINDER_AFTER_DAYS = 5;

export const ORDER_INCLUDE = [
  { association: 'items' },
  { association: 'buyer' },
  { association: 'seller' },
  { association: 'meeting' },
  { association: 'problems' },
  { association: 'dispute' },
];

export async function findOrder(id: string, transaction?: Transaction, lock = false): Promise<Order> {
  const order = await Order.findByPk(id, { transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  if (!order) throw notFound('That order');
  return order;
}

/** The order locked, with the bank's dispute of its payment, for the rules that depend on one (refunding, cancelling, posting). */
async function findOrderWithDispute(id: string, transaction: Transaction): Promise<Order> {
  const order = await findOrder(id, transaction, true);
  order.dispute = await OrderDispute.findOne({ where: { orderId: id }, transaction });
  return order;
}

export async function viewableOrder(actor: Actor, id: string): Promise<Order> {
  const order = await Order.findByPk(id, { include: ORDER_INCLUDE });
  if (!order) throw notFound('That order');
  authorize(actor, 'order.view', order);
  return order;
}

/** The treasurer's list: orders with a reported problem (only the open ones, when asked). */
export async function ordersWithOpenProblems(actor: Actor, openOnly: boolean): Promise<Order[]> {
  authorize(actor, 'ledger.view');
  const [rows] = await Order.sequelize!.query(
    `SELECT DISTINCT order_id FROM order_problems ${openOnly ? 'WHERE resolved_at IS NULL' : ''}`,
  );
  const ids = (rows as { order_id: string }[]).map((r) => r.order_id);
  if (ids.length === 0) return [];
  return Order.findAll({ where: { id: ids }, include: ORDER_INCLUDE, order: [['createdAt', 'DESC']], limit: 200 });
}

export async function listOrders(actor: Actor, as: 'buyer' | 'seller'): Promise<Order[]> {
  return Order.findAll({
    where: as === 'buyer' ? { buyerId: actor.id } : { sellerId: actor.id },
    include: ORDER_INCLUDE,
    order: [['createdAt', 'DESC']],
    limit: 200,
  });
}

async function emailConfirmation(ctx: AppContext, guild: Guild, order: Order, transaction: Transaction) {
  const [items, buyer, seller, meeting] = await Promise.all([
    OrderItem.findAll({ where: { orderId: order.id }, transaction }),
    Member.findByPk(order.buyerId, { transaction }),
    Member.findByPk(order.sellerId, { transaction }),
    order.meetingId ? Meeting.findByPk(order.meetingId, { transaction }) : null,
  ]);
  const titles = items.map((i) => (i.quantity > 1 ? `${i.title} × ${i.quantity}` : i.title));
  const amount = order.chargeMinor > 0 ? formatMoney(order.chargeMinor, order.currency) : '';
  const link = `${ctx.config.appUrl}/orders/${order.id}`;
  const when = meeting ? meetingLabel(meeting, guildTimeZone(guild)) : null;
  const sold = orderSoldToSeller({
    guildName: guild.name,
    name: seller!.name,
    reference: order.reference,
    titles,
    link,
    buyerName: buyer!.name,
    address: order.address,
    meeting: when,
    paid: amount || null,
    share: order.sellerCreditMinor > 0 ? formatMoney(order.sellerCreditMinor, order.currency) : null,
    postageIncluded: order.postageMinor > 0,
  });
  await ctx.queue.enqueueEmail({ to: seller!.email, ...sold }, transaction);
  await ctx.queue.enqueueEmail(
    { to: buyer!.email, ...orderConfirmedToBuyer({ guildName: guild.name, name: buyer!.name, reference: order.reference, titles, link, amount, meeting: when }) },
    transaction,
  );
}

/** Bundles whose last unit is taken and paid for are rehomed; while a payment is pending they are held. */
async function settleBundleStates(bundleIds: string[], transaction: Transaction) {
  await Bundle.sequelize!.query(
    `UPDATE bundles b SET state = CASE
        WHEN EXISTS (SELECT 1 FROM order_items i JOIN orders o ON o.id = i.order_id
                     WHERE i.bundle_id = b.id AND o.state = 'awaiting_payment') THEN 'held'
        ELSE 'rehomed' END,
        updated_at = now()
     WHERE b.id = ANY($1::uuid[]) AND b.quantity_available = 0 AND b.state IN ('on_shelf', 'held')`,
    { bind: [bundleIds], transaction, type: QueryTypes.UPDATE },
  );
}

/**
 * Puts an order's units back: a held or rehomed bundle returns to the shelf; a withdrawn one
 * stays withdrawn. A posted starter claim is cancelled, and its bundle offered to the waiting list.
 */
async function releaseUnits(ctx: AppContext, order: Order, transaction: Transaction) {
  const items = await OrderItem.findAll({ where: { orderId: order.id }, transaction, order: [['bundleId', 'ASC']] });
  for (const item of items) {
    await Bundle.sequelize!.query(
      `UPDATE bundles SET quantity_available = least(quantity, quantity_available + $2),
              state = CASE WHEN state IN ('held', 'rehomed') THEN 'on_shelf' ELSE state END, updated_at = now()
       WHERE id = $1`,
      { bind: [item.bundleId, item.quantity], transaction, type: QueryTypes.UPDATE },
    );
  }
  const [cancelled] = await StarterClaim.update(
    { state: 'cancelled', cancelledAt: ctx.now(), cancelReason: order.cancelReason ?? 'Order cancelled.' },
    { where: { orderId: order.id, state: 'claimed' }, transaction },
  );
  if (cancelled > 0) for (const item of items) await offerToNextInLine(ctx, item.bundleId, transaction);
}

/**
 * A new quilter may have a starter bundle posted, paying the postage, where the guild allows
 * it: one starter bundle on its own, within the same eligibility and limits as a claim at a
 * meeting (the member's row is locked so the limit holds under concurrency).
 */
async function checkPostedStarterClaim(
  ctx: AppContext,
  guild: Guild,
  buyer: Member,
  lines: { bundle: Bundle; quantity: number }[],
  fulfilment: 'post' | 'meeting',
  transaction: Transaction,
) {
  if (lines.length !== 1 || lines[0]!.quantity !== 1) {
    throw unprocessable('A starter bundle is posted on its own, one at a time.', { items: 'One starter bundle per order.' });
  }
  if (fulfilment !== 'post' || !guild.settings.starterPostingAllowed) {
    throw unprocessable('Starter bundles are claimed on the starter page and handed over at a meeting.', { fulfilment: 'Claim it for a meeting instead.' });
  }
  await Member.findByPk(buyer.id, { transaction, lock: transaction.LOCK.UPDATE });
  const eligibility = await eligibilityOf(buyer, guild, ctx.now(), transaction);
  if (!eligibility.eligible) throw ineligible(eligibility);
}

/**
 * Holds the units in one transaction with row locks (bundles locked in id order, so two
 * buyers never deadlock and never take the same unit), prices the order, and — when
 * there is something to pay — opens a Checkout Session after the commit. If the payment
 * service cannot be reached the hold is released at once and the buyer gets a 503.
 */
export async function placeOrder(ctx: AppContext, buyer: Member, input: OrderCreateInput): Promise<Order> {
  const guild = await loadGuild();
  const now = ctx.now();
  if (input.fulfilment === 'meeting') {
    const meeting = await Meeting.findByPk(input.meetingId!);
    if (!meeting || meeting.startsAt <= now) throw badRequest('Choose a meeting that is still to come.', { meetingId: 'Not a coming meeting.' });
  }

  const order = await ctx.sequelize.transaction(async (transaction) => {
    const ids = input.items.map((i) => i.bundleId).sort();
    const bundles = await Bundle.findAll({ where: { id: ids }, transaction, lock: transaction.LOCK.UPDATE, order: [['id', 'ASC']] });
    const byId = new Map(bundles.map((b) => [b.id, b]));
    const lines = input.items.map((item) => {
      const bundle = byId.get(item.bundleId);
      if (!bundle) throw conflict('One of these bundles is no longer on the shelf.', { items: 'No longer available.' });
      return { bundle, quantity: item.quantity };
    });
    if (lines.some((l) => l.bundle.sellerId === buyer.id)) throw forbidden('You cannot take your own bundle.');
    const sellerId = lines[0]!.bundle.sellerId;
    if (lines.some((l) => l.bundle.sellerId !== sellerId)) {
      throw unprocessable('Bundles from different sellers check out as separate orders.', { items: 'All bundles in one order come from one seller.' });
    }
    const starter = lines.some((l) => l.bundle.offer === 'starter');
    if (starter) await checkPostedStarterClaim(ctx, guild, buyer, lines, input.fulfilment, transaction);
    for (const { bundle } of lines) {
      if (!allowsFulfilment(bundle, input.fulfilment)) {
        throw unprocessable(`“${bundle.title}” cannot be ${input.fulfilment === 'post' ? 'posted' : 'handed over at a meeting'}.`, {
          fulfilment: 'Not offered for this bundle.',
        });
      }
    }
    for (const { bundle, quantity } of lines) {
      if (bundle.state !== 'on_shelf' || bundle.quantityAvailable < quantity) {
        throw conflict(`“${bundle.title}” is no longer available${bundle.quantityAvailable > 0 ? ` in that quantity (${bundle.quantityAvailable} left)` : ''}.`, {
          items: 'No longer available.',
        });
      }
    }

    const quote =
      input.fulfilment === 'post'
        ? quoteOrThrow(guild, lines.map((l) => ({ ref: l.bundle.title, grams: l.bundle.weightGrams!, quantity: l.quantity, meetingHandover: allowsFulfilment(l.bundle, 'meeting') })), input.address!, 'address', buyer.units ?? guild.defaultUnits)
        : null;
    const money = orderMoney({
      lines: lines.map((l) => ({ priceMinor: l.bundle.offer === 'sale' ? l.bundle.priceMinor! : 0, quantity: l.quantity })),
      postageMinor: quote?.totalMinor ?? 0,
      guildFeeBasisPoints: guild.settings.guildFeeBasisPoints,
      processing: { percentBasisPoints: guild.settings.processingPercentBasisPoints, fixedMinor: guild.settings.processingFixedMinor },
    });
    const needsPayment = money.chargeMinor > 0;
    const minimum = minimumCardChargeMinor(guild.currency);
    if (needsPayment && money.chargeMinor < minimum) {
      const least = formatMoney(minimum, guild.currency);
      throw unprocessable(`Card payments start at ${least}, and this order comes to ${formatMoney(money.chargeMinor, guild.currency)}.`, {
        items: `Add another bundle from this seller to reach ${least}.`,
      });
    }

    for (const { bundle, quantity } of lines) {
      await bundle.update({ quantityAvailable: bundle.quantityAvailable - quantity }, { transaction });
    }
    const created = await createWithReference(ctx, transaction, {
      buyerId: buyer.id,
      sellerId,
      state: needsPayment ? 'awaiting_payment' : 'confirmed',
      fulfilment: input.fulfilment,
      meetingId: input.meetingId ?? null,
      address: input.address ?? null,
      currency: guild.currency,
      subtotalMinor: money.subtotalMinor,
      postageMinor: money.postageMinor,
      chargeMinor: money.chargeMinor,
      guildFeeMinor: money.guildFeeMinor,
      processingCostMinor: needsPayment ? money.processingCostMinor : 0,
      sellerCreditMinor: money.sellerCreditMinor,
      postageQuote: quote,
      holdExpiresAt: needsPayment ? new Date(now.getTime() + guild.settings.holdMinutes * MINUTE_MS) : null,
      paidAt: needsPayment ? null : now,
      // The clock the payment time was read from, so a free order's history never shows it confirmed before it was placed.
      createdAt: now,
    });
    await OrderItem.bulkCreate(
      lines.map((l) => ({
        orderId: created.id,
        bundleId: l.bundle.id,
        quantity: l.quantity,
        unitPriceMinor: l.bundle.offer === 'sale' ? l.bundle.priceMinor! : 0,
        title: l.bundle.title,
        weightGrams: l.bundle.weightGrams!,
      })),
      { transaction },
    );
    await settleBundleStates(ids, transaction);
    // What is ordered leaves the buyer's basket on every device, with the order.
    await removeFromBasket(buyer, ids, transaction);
    if (starter) {
      await StarterClaim.create({ bundleId: lines[0]!.bundle.id, memberId: buyer.id, meetingId: null, orderId: created.id, claimedAt: now }, { transaction });
      await leaveWaitlistWithClaim(ctx, buyer.id, transaction);
    }
    if (input.saveAddress && input.address) await buyer.update({ postalAddress: input.address }, { transaction });
    if (!needsPayment) await emailConfirmation(ctx, guild, created, transaction);
    return created;
  });

  if (order.state === 'awaiting_payment') await openCheckout(ctx, order);
  return order;
}

type NewOrder = Omit<CreationAttributes<Order>, 'reference'>;

/** References are random; on the rare clash the insert is retried inside a savepoint with a fresh one. */
async function createWithReference(ctx: AppContext, transaction: Transaction, values: NewOrder): Promise<Order> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await ctx.sequelize.transaction({ transaction }, (savepoint) => Order.create({ ...values, reference: newOrderReference() }, { transaction: savepoint }));
    } catch (err) {
      if (!(err instanceof UniqueConstraintError) || attempt >= 4) throw err;
    }
  }
}

async function openCheckout(ctx: AppContext, order: Order) {
  const items = await OrderItem.findAll({ where: { orderId: order.id } });
  const expiresAtMs = Math.max(order.holdExpiresAt!.getTime(), ctx.now().getTime() + MIN_CHECKOUT_LIFETIME_MS);
  try {
    const lineItems = items.map((i) => ({
      quantity: i.quantity,
      price_data: { currency: order.currency.toLowerCase(), unit_amount: i.unitPriceMinor, product_data: { name: i.title } },
    }));
    if (order.postageMinor > 0) {
      lineItems.push({ quantity: 1, price_data: { currency: order.currency.toLowerCase(), unit_amount: order.postageMinor, product_data: { name: 'Postage' } } });
    }
    const session = await ctx.stripe.checkout.sessions.create(
      {
        mode: 'payment',
        // Cards only: a method that settles days later would leave the bundles held with no answer.
        allowed_payment_method_types: ['card'],
        line_items: lineItems.filter((l) => l.price_data.unit_amount > 0),
        success_url: `${ctx.config.appUrl}/orders/${order.id}?paid={CHECKOUT_SESSION_ID}`,
        cancel_url: `${ctx.config.appUrl}/orders/${order.id}`,
        client_reference_id: order.id,
        expires_at: Math.ceil(expiresAtMs / 1000),
        metadata: { orderId: order.id, reference: order.reference },
        payment_intent_data: { metadata: { orderId: order.id, reference: order.reference } },
      },
      { idempotencyKey: `checkout-${order.id}` },
    );
    await order.update({ stripeSessionId: session.id, checkoutUrl: session.url });
  } catch (err) {
    ctx.logger.warn({ err, orderId: order.id }, 'could not open a checkout session; releasing the hold');
    await cancelUnpaid(ctx, order.id, 'The payment service could not be reached.', { tellBuyer: false });
    throw serviceUnavailable('The card payment service is not answering just now, so nothing was taken or held. Please try again in a few minutes.');
  }
}

/**
 * Cancels an order still awaiting payment and puts its units back; does nothing if it has moved on. With
 * `tellBuyer`, the buyer is e-mailed why (a hold that ran out); without, they are already reading the answer.
 */
export async function cancelUnpaid(ctx: AppContext, orderId: string, reason: string, { tellBuyer = true } = {}): Promise<boolean> {
  const guild = tellBuyer ? await loadGuild() : null;
  return ctx.sequelize.transaction(async (transaction) => {
    const order = await findOrder(orderId, transaction, true);
    if (order.state !== 'awaiting_payment') return false;
    await order.update({ state: 'cancelled', cancelledAt: ctx.now(), cancelReason: reason, holdExpiresAt: null }, { transaction });
    await releaseUnits(ctx, order, transaction);
    if (guild) {
      await notifyParties(ctx, order, ['buyer'], transaction, (side, name, link, titles) =>
        orderCancelled({ guildName: guild.name, name, side, reference: order.reference, titles, link, refunded: null, reason }),
      );
    }
    return true;
  });
}

/** checkout.session.completed: the order is paid; rehome its bundles, write the ledger, tell both sides. */
export async function confirmPayment(ctx: AppContext, sessionId: string, paymentIntentId: string | null, transaction: Transaction): Promise<void> {
  const order = await Order.findOne({ where: { stripeSessionId: sessionId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!order) return;
  if (order.state !== 'awaiting_payment') {
    if (order.state === 'cancelled' && !order.paidAt && paymentIntentId) {
      await order.update({ stripePaymentIntentId: paymentIntentId, cancelReason: `${order.cancelReason ?? ''} Paid after the hold ended; refunded.`.trim() }, { transaction });
      // Queued with this event's record, so a card service that is down delays the refund, never loses it.
      await ctx.queue.enqueue(LATE_REFUND_QUEUE, { orderId: order.id }, transaction);
      const [guild, buyer] = await Promise.all([loadGuild(), Member.findByPk(order.buyerId, { transaction })]);
      const titles = (await OrderItem.findAll({ where: { orderId: order.id }, transaction })).map((i) => i.title);
      const mail = latePaymentRefunding({
        guildName: guild.name,
        name: buyer!.name,
        reference: order.reference,
        titles,
        link: `${ctx.config.appUrl}/orders/${order.id}`,
        paid: formatMoney(order.chargeMinor, order.currency),
      });
      await ctx.queue.enqueueEmail({ to: buyer!.email, ...mail }, transaction);
      return;
    }
    return;
  }
  const guild = await loadGuild();
  await order.update({ state: 'confirmed', paidAt: ctx.now(), stripePaymentIntentId: paymentIntentId, holdExpiresAt: null }, { transaction });
  const items = await OrderItem.findAll({ where: { orderId: order.id }, transaction });
  await settleBundleStates(items.map((i) => i.bundleId), transaction);
  const money = {
    subtotalMinor: order.subtotalMinor,
    postageMinor: order.postageMinor,
    chargeMinor: order.chargeMinor,
    guildFeeMinor: order.guildFeeMinor,
    processingCostMinor: order.processingCostMinor,
    sellerCreditMinor: order.sellerCreditMinor,
    guildNetMinor: order.guildFeeMinor - order.processingCostMinor,
  };
  await writeLedger(ledgerEntriesForPaidOrder({ sellerId: order.sellerId, money }), { orderId: order.id, currency: order.currency, at: ctx.now() }, transaction);
  await emailConfirmation(ctx, guild, order, transaction);
}

/**
 * Refunds an order's charge in full through the payment service; the idempotency key makes a retry safe. A charge
 * already refunded in full elsewhere (the service's own dashboard, or a retry after the service forgot the key)
 * counts as refunded. A service that cannot be reached is a 503 to try again; a refusal is a 409 with its reason.
 */
async function refundPayment(ctx: AppContext, order: Order) {
  const paymentIntent = order.stripePaymentIntentId;
  if (!paymentIntent) throw new Error(`order ${order.id} has no payment to refund`);
  try {
    await ctx.stripe.refunds.create({ payment_intent: paymentIntent, amount: order.chargeMinor, metadata: { orderId: order.id } }, { idempotencyKey: `refund-${order.id}` });
  } catch (err) {
    ctx.logger.warn({ err, orderId: order.id }, 'refund failed');
    if (isUnreachable(err)) {
      throw serviceUnavailable('The card payment service is not answering just now, so nothing was changed. Please try again in a few minutes.');
    }
    if (err instanceof Stripe.errors.StripeError && err.code === 'charge_already_refunded' && (await refundedSoFar(ctx, paymentIntent)) >= order.chargeMinor) return;
    const reason = err instanceof Stripe.errors.StripeError ? err.message : 'it gave no reason';
    throw conflict(
      `The card payment service refused the refund, so nothing was changed here. Look the payment up in the card service's own dashboard (order ${order.reference}); it may have been refunded or disputed there already. The service said: ${reason}`,
      { order: 'Not refunded.' },
    );
  }
}

async function refundedSoFar(ctx: AppContext, paymentIntent: string): Promise<number> {
  let total = 0;
  for await (const refund of ctx.stripe.refunds.list({ payment_intent: paymentIntent, limit: 100 })) {
    if (refund.status !== 'failed' && refund.status !== 'canceled') total += refund.amount;
  }
  return total;
}

/**
 * Refunds a payment that came in after its order was cancelled (a job of LATE_REFUND_QUEUE; it throws while the
 * card service cannot be reached, and the queue tries again). The processor keeps its fee, as on any refund,
 * so that cost goes on the ledger once, when the refund is done.
 */
export async function refundLatePayment(ctx: AppContext, orderId: string) {
  const order = await findOrder(orderId);
  if (order.refundedAt) return;
  await refundPayment(ctx, order);
  await ctx.sequelize.transaction(async (transaction) => {
    const locked = await findOrder(orderId, transaction, true);
    if (locked.refundedAt) return;
    await locked.update({ refundedAt: ctx.now() }, { transaction });
    const kept = processingCostEntries(locked.processingCostMinor);
    if (kept.length > 0) await writeLedger(kept, { orderId: locked.id, currency: locked.currency, at: ctx.now() }, transaction);
  });
}

/**
 * The job of LATE_REFUND_QUEUE. When its last retry fails too, every treasurer is told, so a buyer charged for a
 * cancelled order is never left waiting for a refund nobody is trying any more.
 */
export async function runLateRefund(ctx: AppContext, job: { data: { orderId: string }; retryCount: number; retryLimit: number }) {
  try {
    await refundLatePayment(ctx, job.data.orderId);
  } catch (err) {
    if (job.retryCount >= job.retryLimit) await tellTreasurersRefundFailed(ctx, job.data.orderId);
    throw err;
  }
}

async function tellTreasurersRefundFailed(ctx: AppContext, orderId: string) {
  const guild = await loadGuild();
  await ctx.sequelize.transaction(async (transaction) => {
    const order = await findOrder(orderId, transaction);
    const treasurers = await Member.findAll({ where: { active: true, roles: { [Op.contains]: ['treasurer' as const] } }, transaction });
    for (const treasurer of treasurers) {
      const mail = lateRefundFailed({
        guildName: guild.name,
        name: treasurer.name,
        reference: order.reference,
        titles: [],
        link: `${ctx.config.appUrl}/orders/${order.id}`,
        paid: formatMoney(order.chargeMinor, order.currency),
      });
      await ctx.queue.enqueueEmail({ to: treasurer.email, ...mail }, transaction);
    }
  });
}

/**
 * Undoes the order's money: every entry of the sale, not refunds already made, and not what a card dispute booked (a
 * refund is possible again only after a won dispute, whose fee stays the guild's cost, or comes back on its own).
 */
async function reverseLedger(ctx: AppContext, order: Order, transaction: Transaction) {
  const original = await LedgerEntry.findAll({ where: { orderId: order.id, kind: { [Op.notIn]: ['refund', 'dispute', 'dispute_fee'] } }, transaction });
  const reversals = reversalEntries(
    original.map((e) => ({ kind: e.kind, account: e.account as DomainEntry['account'], amountMinor: e.amountMinor })),
  );
  await writeLedger(reversals, { orderId: order.id, currency: order.currency, at: ctx.now() }, transaction);
}

type Side = 'buyer' | 'seller';

async function notifyParties(
  ctx: AppContext,
  order: Order,
  sides: readonly Side[],
  transaction: Transaction,
  render: (side: Side, name: string, link: string, titles: string[]) => RenderedEmail | Promise<RenderedEmail>,
) {
  const items = await OrderItem.findAll({ where: { orderId: order.id }, transaction });
  const titles = items.map((i) => (i.quantity > 1 ? `${i.title} × ${i.quantity}` : i.title));
  const link = `${ctx.config.appUrl}/orders/${order.id}`;
  for (const side of sides) {
    const person = (await Member.findByPk(side === 'buyer' ? order.buyerId : order.sellerId, { transaction }))!;
    await ctx.queue.enqueueEmail({ to: person.email, ...(await render(side, person.name, link, titles)) }, transaction);
  }
}

/**
 * Either side may cancel before posting. A paid order is refunded first, then its ledger reversed and its units
 * returned. The order stays locked from the check to the end, so marking it posted, a payment's webhook or the
 * hold's job wait for the cancellation instead of slipping in between a refund and the ledger.
 */
export async function cancelOrder(ctx: AppContext, actor: Actor, orderId: string, reason: string | undefined): Promise<Order> {
  const guild = await loadGuild();
  const { order, closePaymentPage } = await ctx.sequelize.transaction(async (transaction) => {
    const order = await findOrderWithDispute(orderId, transaction);
    authorize(actor, 'order.cancel', order);
    const unpaid = order.state === 'awaiting_payment';
    // After a lost dispute the money is back with the buyer and the ledger has taken the shares back: nothing to refund.
    const takenBack = takenBackBeforeSent(order);
    const paid = order.state === 'confirmed' && order.chargeMinor > 0 && !takenBack;
    // Keyed by the order: asked again after a failure further down, the payment is not refunded twice.
    if (paid) await refundPayment(ctx, order);
    const now = ctx.now();
    await order.update(
      { state: 'cancelled', cancelledAt: now, cancelReason: reason ?? null, holdExpiresAt: null, ...(paid && { refundedAt: now }) },
      { transaction },
    );
    if (paid) await reverseLedger(ctx, order, transaction);
    await releaseUnits(ctx, order, transaction);
    const refunded = paid ? formatMoney(order.chargeMinor, order.currency) : null;
    // The seller hears of an order only once it is confirmed, so only then of its cancellation.
    await notifyParties(ctx, order, unpaid ? ['buyer'] : ['buyer', 'seller'], transaction, (side, name, link, titles) =>
      orderCancelled({ guildName: guild.name, name, side, reference: order.reference, titles, link, refunded, takenBack, reason: reason ?? null, fulfilment: order.fulfilment }),
    );
    return { order, closePaymentPage: unpaid ? order.stripeSessionId : null };
  });
  // The payment page closes only once the order is cancelled: the stand-in, like Stripe, reports the expiry by
  // webhook at once, and that webhook finds the order cancelled and leaves it be (closed first, the webhook could
  // cancel the order before this did, and the member was refused with a 403). A payment made in between is
  // refunded when its webhook arrives (confirmPayment).
  if (closePaymentPage) {
    await ctx.stripe.checkout.sessions.expire(closePaymentPage).catch((err) => ctx.logger.info({ err }, 'session not expired'));
  }
  return order;
}

/** The treasurer refunds a paid order in full (for example after a reported problem); units already posted stay rehomed. */
export async function refundOrder(ctx: AppContext, actor: Actor, orderId: string): Promise<Order> {
  const guild = await loadGuild();
  // Locked from the check to the end, as in cancelOrder: the refund is asked for only while the order may be refunded.
  return ctx.sequelize.transaction(async (transaction) => {
    const order = await findOrderWithDispute(orderId, transaction);
    authorize(actor, 'order.refund', order);
    await refundPayment(ctx, order);
    const wasPosted = order.state !== 'confirmed';
    await order.update({ state: 'refunded', refundedAt: ctx.now() }, { transaction });
    await reverseLedger(ctx, order, transaction);
    if (!wasPosted) await releaseUnits(ctx, order, transaction);
    await OrderProblem.update({ resolvedAt: ctx.now() }, { where: { orderId, resolvedAt: null }, transaction });
    const refunded = formatMoney(order.chargeMinor, order.currency);
    const money = (minor: number) => (minor > 0 ? formatMoney(minor, order.currency) : null);
    await notifyParties(ctx, order, ['buyer', 'seller'], transaction, async (side, name, link, titles) => {
      const base = { guildName: guild.name, name, reference: order.reference, titles, link, refunded };
      if (side === 'buyer') return orderRefunded(base);
      // The seller owes the guild only when this refund took back a credit already payable (its bag had gone out)
      // and what is payable is now below zero: part of it was paid out. A credit still waiting cannot have been.
      const [split] = await sellerBalanceSplits(ctx.sequelize, [order.sellerId], transaction);
      const owing = wasPosted ? money(-(split?.payableMinor ?? 0)) : null;
      return orderRefundedToSeller({ ...base, share: money(order.sellerCreditMinor), owing, notYetPosted: !wasPosted });
    });
    return order;
  });
}

export async function markPosted(ctx: AppContext, actor: Actor, orderId: string, trackingNumber: string | undefined): Promise<Order> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const order = await findOrderWithDispute(orderId, transaction);
    authorize(actor, 'order.markPosted', order);
    await order.update({ state: 'posted', postedAt: ctx.now(), trackingNumber: trackingNumber || null }, { transaction });
    const buyer = (await Member.findByPk(order.buyerId, { transaction }))!;
    const items = await OrderItem.findAll({ where: { orderId }, transaction });
    const mail = orderPostedToBuyer({
      guildName: guild.name,
      name: buyer.name,
      reference: order.reference,
      titles: items.map((i) => i.title),
      link: `${ctx.config.appUrl}/orders/${order.id}`,
      trackingNumber: order.trackingNumber,
      choicesLink: emailChoicesUrl(ctx.config.appUrl),
    });
    await ctx.queue.enqueueEmail({ to: buyer.email, kind: 'posting', ...mail }, transaction);
    return order;
  });
}

/** `automatic`: nobody marked it; it is taken as received AUTO_RECEIVED_AFTER_DAYS after posting, and the buyer is told too. */
async function markReceivedInTransaction(ctx: AppContext, order: Order, guild: Guild, transaction: Transaction, automatic = false) {
  await order.update({ state: 'received', receivedAt: ctx.now() }, { transaction });
  const afterDays = automatic ? AUTO_RECEIVED_AFTER_DAYS : null;
  const sides: Side[] = automatic ? ['seller', 'buyer'] : ['seller'];
  const items = await OrderItem.findAll({ where: { orderId: order.id }, transaction });
  for (const side of sides) {
    const person = (await Member.findByPk(side === 'buyer' ? order.buyerId : order.sellerId, { transaction }))!;
    const base = { guildName: guild.name, name: person.name, reference: order.reference, titles: items.map((i) => i.title), link: `${ctx.config.appUrl}/orders/${order.id}` };
    // The buyer's is always sent: it is their last word on reporting a problem.
    const mail =
      side === 'seller'
        ? { kind: 'posting' as const, ...orderReceivedToSeller({ ...base, afterDays, choicesLink: emailChoicesUrl(ctx.config.appUrl) }) }
        : orderTakenAsReceivedToBuyer({ ...base, afterDays: AUTO_RECEIVED_AFTER_DAYS });
    await ctx.queue.enqueueEmail({ to: person.email, ...mail }, transaction);
  }
}

export async function markReceived(ctx: AppContext, actor: Actor, orderId: string): Promise<Order> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const order = await findOrder(orderId, transaction, true);
    authorize(actor, 'order.markReceived', order);
    await markReceivedInTransaction(ctx, order, guild, transaction);
    return order;
  });
}

/**
 * The buyer reports a problem: every treasurer is told what the buyer wrote, since refunds are theirs to decide; the
 * seller is told that there is a problem, not what the buyer wrote.
 */
export async function reportProblem(ctx: AppContext, actor: Actor, orderId: string, message: string): Promise<void> {
  const guild = await loadGuild();
  await ctx.sequelize.transaction(async (transaction) => {
    const order = await findOrder(orderId, transaction, true);
    authorize(actor, 'order.reportProblem', order);
    await OrderProblem.create({ orderId, reporterId: actor.id, message }, { transaction });
    const treasurers = await Member.findAll({ where: { active: true, roles: { [Op.contains]: ['treasurer' as const] } }, transaction });
    for (const treasurer of treasurers) {
      const mail = problemReported({ guildName: guild.name, name: treasurer.name, reference: order.reference, titles: [], link: `${ctx.config.appUrl}/orders/${order.id}`, message });
      await ctx.queue.enqueueEmail({ to: treasurer.email, ...mail }, transaction);
    }
    const [seller, buyer] = await Promise.all([Member.findByPk(order.sellerId, { transaction }), Member.findByPk(order.buyerId, { transaction })]);
    if (seller?.active) {
      const link = `${ctx.config.appUrl}/orders/${order.id}`;
      const mail = problemReportedToSeller({ guildName: guild.name, name: seller.name, reference: order.reference, link, buyerName: buyer?.name ?? 'The buyer' });
      await ctx.queue.enqueueEmail({ to: seller.email, ...mail }, transaction);
    }
  });
}

type HoldOutcome = 'released' | 'confirmed' | 'kept';

/**
 * Scheduled: holds past the guild's limit end. The job asks the payment service about each one before
 * cancelling it: a page paid in time confirms its order here, so a payment whose event never arrived is
 * not left waiting; a service that cannot be asked leaves the hold for the next run; an open page is
 * closed first, so no payment can land after the cancellation. One order failing does not stop the rest.
 */
export async function releaseOverdueHolds(ctx: AppContext): Promise<number> {
  const overdue = await Order.findAll({
    where: { state: 'awaiting_payment', holdExpiresAt: { [Op.lte]: ctx.now() } },
    order: [['holdExpiresAt', 'ASC']],
    limit: 200,
  });
  let released = 0;
  for (const order of overdue) {
    try {
      if ((await endHold(ctx, order)) === 'released') released++;
    } catch (err) {
      ctx.logger.warn({ err, orderId: order.id }, 'could not end an overdue hold; trying again on the next run');
    }
  }
  return released;
}

async function endHold(ctx: AppContext, order: Order): Promise<HoldOutcome> {
  if (order.stripeSessionId) {
    const sessionId = order.stripeSessionId;
    const ask = () => ctx.stripe.checkout.sessions.retrieve(sessionId);
    let session = await ask();
    if (session.status === 'open') {
      // Paid in the moment between asking and closing: closing fails, and the next question says so.
      session = await ctx.stripe.checkout.sessions.expire(sessionId).catch(ask);
    }
    if (session.status === 'complete') {
      if (session.payment_status !== 'paid') return 'kept';
      await ctx.sequelize.transaction((transaction) => confirmPayment(ctx, session.id, paymentIntentIdOf(session), transaction));
      return 'confirmed';
    }
    if (session.status !== 'expired') return 'kept';
  }
  if (await cancelUnpaid(ctx, order.id, 'Payment was not completed in time.')) return 'released';
  // Closing the page sends its expiry webhook, which may have cancelled the order a moment before: released all the same.
  return (await Order.findByPk(order.id))?.state === 'cancelled' ? 'released' : 'kept';
}

/** The payment a completed checkout page made, as its id. */
export function paymentIntentIdOf(session: Stripe.Checkout.Session): string | null {
  return typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
}

/** Scheduled: the seller of a paid order to be posted and not yet marked posted after a few days is reminded once. */
export async function remindUnposted(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  const cutoff = new Date(ctx.now().getTime() - POST_REMINDER_AFTER_DAYS * DAY_MS);
  const due = await Order.findAll({
    where: { state: 'confirmed', fulfilment: 'post', postReminderSentAt: null, paidAt: { [Op.lte]: cutoff } },
    order: [['paidAt', 'ASC']],
    limit: 200,
  });
  let reminded = 0;
  for (const candidate of due) {
    try {
      await ctx.sequelize.transaction(async (transaction) => {
        const order = await findOrder(candidate.id, transaction, true);
        if (order.state !== 'confirmed' || order.postReminderSentAt) return;
        await order.update({ postReminderSentAt: ctx.now() }, { transaction });
        const [seller, buyer, items] = await Promise.all([
          Member.findByPk(order.sellerId, { transaction }),
          Member.findByPk(order.buyerId, { transaction }),
          OrderItem.findAll({ where: { orderId: order.id }, transaction }),
        ]);
        const mail = postReminderToSeller({
          guildName: guild.name,
          name: seller!.name,
          reference: order.reference,
          titles: items.map((i) => i.title),
          link: `${ctx.config.appUrl}/orders/${order.id}`,
          buyerName: buyer!.name,
          days: POST_REMINDER_AFTER_DAYS,
        });
        await ctx.queue.enqueueEmail({ to: seller!.email, ...mail }, transaction);
        reminded++;
      });
    } catch (err) {
      ctx.logger.warn({ err, orderId: candidate.id }, 'could not remind a seller to post; trying again on the next run');
    }
  }
  return reminded;
}

/** Scheduled: posted orders nobody marked are taken as received after 21 days. */
export async function autoReceive(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  const cutoff = new Date(ctx.now().getTime() - AUTO_RECEIVED_AFTER_DAYS * DAY_MS);
  const due = await Order.findAll({ where: { state: 'posted', postedAt: { [Op.lte]: cutoff } }, order: [['postedAt', 'ASC']], limit: 500 });
  let received = 0;
  for (const stale of due) {
    try {
      await ctx.sequelize.transaction(async (transaction) => {
        const order = await findOrder(stale.id, transaction, true);
        if (order.state !== 'posted') return;
        await markReceivedInTransaction(ctx, order, guild, transaction, true);
        received++;
      });
    } catch (err) {
      ctx.logger.warn({ err, orderId: stale.id }, 'could not take a posted order as received; trying again on the next run');
    }
  }
  return received;
}
