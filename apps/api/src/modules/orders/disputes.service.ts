import type Stripe from 'stripe';
import { Op, type Transaction } from 'sequelize';
import {
  BAG_OUT_ORDER_STATES,
  CREDIT_WAITING_ORDER_STATES,
  disputeFeeEntries,
  disputeLostEntries,
  disputeReasonLabel,
  disputeStage,
  formatMoney,
  isFinalDisputeStatus,
  isOvertakenDisputeStatus,
  type LedgerEntry as DomainEntry,
} from '@scrap-relay/shared';
import { LedgerEntry, Member, Order, OrderDispute, OrderItem, type Guild } from '../../db/models/index.ts';
import { disputeForSeller, disputeKept, disputeLost, disputeOpened, type DisputeFee, type SellerDisputeNews } from '../../emails/disputes.ts';
import { formatWhen } from '../../emails/format.ts';
import type { RenderedEmail } from '../../emails/render.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';
import { sellerBalanceSplits, writeLedger } from './ledger-writer.ts';
import { ORDER_INCLUDE } from './orders.service.ts';

/** The card service's dispute as the order keeps it. `due_by` 0 means the bank allows no answer. */
function disputeFields(dispute: Stripe.Dispute) {
  const dueBy = dispute.evidence_details?.due_by;
  return {
    status: dispute.status,
    reason: dispute.reason,
    amountMinor: dispute.amount,
    currency: dispute.currency.toUpperCase(),
    evidenceDueBy: dueBy ? new Date(dueBy * 1000) : null,
  };
}

const idOf = (value: string | { id: string } | null) => (typeof value === 'string' ? value : (value?.id ?? null));

/**
 * `charge.dispute.*` events: the dispute is recorded on the order whose payment it questions, in the transaction
 * that records the event. The card service's fee for the dispute is booked as it reports it (`bookDisputeFee`). The
 * first news of an open dispute tells every treasurer and the seller; its decision is told once: a lost one is booked
 * in the ledger (the seller's credit and the guild's fee for the order taken back), a won one leaves the order's
 * money as it was. A decided dispute is not reopened by news arriving late or twice, but the money the card service
 * moves after the decision (a fee given back with a win) is still booked. A dispute about a payment no order knows
 * is logged and left: the event is still acknowledged, so the card service stops sending it.
 */
export async function recordDispute(ctx: AppContext, dispute: Stripe.Dispute, transaction: Transaction): Promise<void> {
  const paymentIntentId = idOf(dispute.payment_intent);
  // The order's row is locked first, as everything that changes its money does.
  const order = paymentIntentId ? await Order.findOne({ where: { stripePaymentIntentId: paymentIntentId }, transaction, lock: transaction.LOCK.UPDATE }) : null;
  if (!order) {
    ctx.logger.warn({ disputeId: dispute.id, paymentIntentId, chargeId: idOf(dispute.charge) }, 'a dispute about a payment no order knows; nothing recorded');
    return;
  }
  const existing = await OrderDispute.findOne({ where: { orderId: order.id }, transaction });
  if (existing && existing.stripeDisputeId !== dispute.id) {
    // The card service allows one dispute per payment; a second id means the data is not what this code expects.
    ctx.logger.error({ orderId: order.id, recorded: existing.stripeDisputeId, disputeId: dispute.id }, 'a second dispute on one order; nothing recorded');
    return;
  }
  if (existing && isFinalDisputeStatus(existing.status)) {
    await bookDisputeFee(ctx, order, existing, dispute, transaction);
    return;
  }
  if (existing && isOvertakenDisputeStatus(dispute.status, existing.status)) {
    // News overtaken by later news (a snapshot taken before the guild answered): its money still counts.
    await bookDisputeFee(ctx, order, existing, dispute, transaction);
    return;
  }

  const stage = disputeStage(dispute.status);
  const before = existing ? disputeStage(existing.status) : null;
  const fields = { ...disputeFields(dispute), closedAt: stage === 'open' ? null : ctx.now() };
  const record = existing
    ? await existing.update(fields, { transaction })
    : await OrderDispute.create({ orderId: order.id, stripeDisputeId: dispute.id, openedAt: new Date(dispute.created * 1000), ...fields }, { transaction });
  const fee = await bookDisputeFee(ctx, order, record, dispute, transaction);

  const guild = await loadGuild();
  const mail = { guildName: guild.name, reference: order.reference, link: `${ctx.config.appUrl}/orders/${order.id}`, amount: formatMoney(record.amountMinor, order.currency) };
  const seller = (await Member.findByPk(order.sellerId, { transaction }))!;
  const bag = bagOf(order);
  const tellSeller = (news: SellerDisputeNews) =>
    ctx.queue.enqueueEmail({ to: seller.email, ...disputeForSeller({ guildName: guild.name, name: seller.name, reference: order.reference, link: mail.link, news }) }, transaction);
  const money = (minor: number) => (minor > 0 ? formatMoney(minor, order.currency) : null);
  if (stage === 'open') {
    // Told once, when it opens; again only when a closed inquiry becomes a dispute.
    if (before !== null && before !== 'closed') return;
    await tellTreasurers(ctx, transaction, await openedMail(guild, order, record, seller, money(fee.standingMinor), transaction, mail));
    await tellSeller({ stage: 'open', bag, fulfilment: order.fulfilment });
    return;
  }
  const feeNews: DisputeFee = { standing: money(fee.standingMinor), returned: money(-fee.bookedMinor) };
  if (stage === 'lost') {
    const share = await bookLostDispute(ctx, order, record.amountMinor, transaction);
    // As with a refund, the seller owes only what was paid out with no delivered bag behind it any more: credit
    // still waiting for a bag to go out may be taken back too, so it does not cover the debt.
    const [split] = await sellerBalanceSplits(ctx.sequelize, [order.sellerId], transaction);
    const owing = money(-(split?.payableMinor ?? 0));
    await tellTreasurers(ctx, transaction, (name) =>
      disputeLost({ ...mail, name, sellerName: seller.name, share: money(share), owing, notYetPosted: bag === 'waiting', fee: feeNews }),
    );
    await tellSeller({ stage: 'lost', share: money(share), owing, bag, fulfilment: order.fulfilment });
    return;
  }
  await tellTreasurers(ctx, transaction, (name) => disputeKept({ ...mail, name, how: stage, fee: feeNews }));
  await tellSeller({ stage, bag });
}

/** Where the order's bundles are: gone to the buyer, still with the seller, or nowhere (cancelled or refunded). */
function bagOf(order: Order): SellerDisputeNews['bag'] {
  if ((BAG_OUT_ORDER_STATES as readonly string[]).includes(order.state)) return 'out';
  if ((CREDIT_WAITING_ORDER_STATES as readonly string[]).includes(order.state)) return 'waiting';
  return 'none';
}

/**
 * Books the card service's fee for the dispute as its balance movements report it: charged when the money is
 * withdrawn, negative if a win gives it back. Movements are kept on the dispute by id, so news arriving late or out
 * of order adds what it brings and never takes out what an earlier piece of news reported; the ledger gets the
 * difference between their fees' sum and what is booked already. Returns the fee standing after this news and what
 * this news booked (negative: given back). A movement in another currency than the order's is not the guild's to
 * book here and is logged for the treasurer to look at.
 */
async function bookDisputeFee(
  ctx: AppContext,
  order: Order,
  record: OrderDispute,
  dispute: Stripe.Dispute,
  transaction: Transaction,
): Promise<{ standingMinor: number; bookedMinor: number }> {
  const movements = (dispute.balance_transactions ?? []).filter((m) => typeof m === 'object' && m !== null);
  const ours = movements.filter((m) => m.currency.toUpperCase() === order.currency);
  if (ours.length < movements.length) {
    ctx.logger.error({ orderId: order.id, disputeId: dispute.id, currencies: movements.map((m) => m.currency) }, 'a dispute fee in another currency than the order’s; not booked');
  }
  await record.update({ feeMovements: { ...record.feeMovements, ...Object.fromEntries(ours.map((m) => [m.id, m.fee])) } }, { transaction });
  const chargedMinor = record.feeMinor;
  const standing = await LedgerEntry.findAll({ where: { orderId: order.id, kind: 'dispute_fee' }, transaction });
  const entries = disputeFeeEntries({ chargedMinor, orderEntries: standing.map((e) => ({ kind: e.kind, account: e.account as DomainEntry['account'], amountMinor: e.amountMinor })) });
  await writeLedger(entries, { orderId: order.id, currency: order.currency, at: ctx.now() }, transaction);
  return { standingMinor: chargedMinor, bookedMinor: entries.find((e) => e.account === 'processor')?.amountMinor ?? 0 };
}

/** Writes the lost dispute's entries; returns the seller's credit it took back. */
async function bookLostDispute(ctx: AppContext, order: Order, amountMinor: number, transaction: Transaction): Promise<number> {
  const standing = await LedgerEntry.findAll({ where: { orderId: order.id }, transaction });
  const entries = disputeLostEntries({
    sellerId: order.sellerId,
    amountMinor,
    orderEntries: standing.map((e) => ({
      kind: e.kind,
      account: e.account as DomainEntry['account'],
      amountMinor: e.amountMinor,
      ...(e.reverses ? { reverses: e.reverses as DomainEntry['reverses'] } : {}),
    })),
  });
  await writeLedger(entries, { orderId: order.id, currency: order.currency, at: ctx.now() }, transaction);
  return -entries.filter((e) => e.reverses === 'seller_credit').reduce((sum, e) => sum + e.amountMinor, 0);
}

async function openedMail(
  guild: Guild,
  order: Order,
  record: OrderDispute,
  seller: Member,
  fee: string | null,
  transaction: Transaction,
  mail: { guildName: string; reference: string; link: string; amount: string },
): Promise<(name: string) => RenderedEmail> {
  const timeZone = guildTimeZone(guild);
  const [buyer, items] = await Promise.all([Member.findByPk(order.buyerId, { transaction }), OrderItem.findAll({ where: { orderId: order.id }, transaction })]);
  const details = {
    ...mail,
    fee,
    buyerName: buyer!.name,
    sellerName: seller.name,
    titles: items.map((i) => (i.quantity > 1 ? `${i.title} × ${i.quantity}` : i.title)),
    reason: disputeReasonLabel(record.reason),
    dueBy: record.evidenceDueBy ? formatWhen(record.evidenceDueBy, timeZone) : null,
    fulfilment: fulfilmentLine(order, timeZone),
  };
  return (name) => disputeOpened({ ...details, name });
}

/** What the order says about the bag changing hands: the evidence the bank usually asks for. */
function fulfilmentLine(order: Order, timeZone: string): string {
  if (order.handedOverAt) return `It was handed over at a guild meeting on ${formatWhen(order.handedOverAt, timeZone)}.`;
  if (order.postedAt) {
    const tracking = order.trackingNumber ? `, tracking number ${order.trackingNumber}` : ', without a tracking number';
    const received = order.receivedAt ? ` It is marked received since ${formatWhen(order.receivedAt, timeZone)}.` : '';
    return `The seller marked it posted on ${formatWhen(order.postedAt, timeZone)}${tracking}.${received}`;
  }
  if (order.state === 'confirmed') {
    return order.fulfilment === 'post'
      ? 'The bundles have not gone out: the seller has been asked to keep them until you say whether to send them.'
      : 'The bundles have not been handed over: the seller has been asked to keep them until you say whether to bring them to the meeting.';
  }
  return `The order is ${order.state.replace('_', ' ')}.`;
}

/** Every active treasurer, each in their own name; queued in the caller's transaction, so mail goes only if the record commits. */
async function tellTreasurers(ctx: AppContext, transaction: Transaction, render: (name: string) => RenderedEmail): Promise<void> {
  const treasurers = await Member.findAll({ where: { active: true, roles: { [Op.contains]: ['treasurer' as const] } }, transaction });
  for (const treasurer of treasurers) await ctx.queue.enqueueEmail({ to: treasurer.email, ...render(treasurer.name) }, transaction);
}

/** The treasurer's list: orders whose payment a bank is disputing now, the nearest deadline for evidence first. */
export async function ordersWithOpenDisputes(actor: Actor): Promise<Order[]> {
  authorize(actor, 'ledger.view');
  const open = await OrderDispute.findAll({ where: { closedAt: null }, attributes: ['orderId'], limit: 200 });
  if (open.length === 0) return [];
  const orders = await Order.findAll({ where: { id: open.map((d) => d.orderId) }, include: ORDER_INCLUDE });
  const due = (o: Order) => o.dispute?.evidenceDueBy?.getTime() ?? Number.POSITIVE_INFINITY;
  return orders.sort((a, b) => due(a) - due(b));
}
