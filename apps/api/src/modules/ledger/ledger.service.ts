import { QueryTypes, type Sequelize } from 'sequelize';
import {
  CREDIT_WAITING_ORDER_STATES,
  formatMoney,
  payoutEntries,
  sellerAccount,
  type LedgerEntryView,
  type LedgerQuery,
  type OrderState,
  type PayoutInput,
  type RefundEffectView,
  type SellerBalanceView,
} from '@scrap-relay/shared';
import { Member, Payout, type Order } from '../../db/models/index.ts';
import { notFound, unprocessable } from '../../errors/index.ts';
import { authorize, can, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { payoutRecorded } from '../../emails/ledger.ts';
import { formatWhen } from '../../emails/format.ts';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';
import { lockSellerPayable, sellerBalanceSplits, writeLedger } from '../orders/ledger-writer.ts';

const ACCOUNT_LABELS: Record<string, string> = {
  buyer: 'Buyers (card payments)',
  guild: 'Guild funds',
  processor: 'Card processor',
  payouts: 'Paid out to sellers',
};

interface LedgerRow {
  id: string;
  transaction_id: string;
  created_at: Date;
  kind: string;
  reverses: string | null;
  account: string;
  amount_minor: number;
  currency: string;
  order_id: string | null;
  order_reference: string | null;
  payout_id: string | null;
  seller_name: string | null;
}

/**
 * The ledger's entries, newest first, and the guild's time zone they were chosen in. `from` and `to` are days on the
 * guild's calendar: a treasurer asking for 1 to 30 November means from midnight on 1 November to midnight at the
 * end of the 30th where the guild is, whatever zone the database session runs in. Each bound is that wall-clock
 * midnight read in the guild's zone (`AT TIME ZONE` on a timestamp without zone gives the instant), so summer
 * time on either day is the zone's own.
 */
export async function ledgerEntries(sequelize: Sequelize, actor: Actor, q: LedgerQuery): Promise<{ items: LedgerEntryView[]; timeZone: string }> {
  authorize(actor, 'ledger.view');
  const timeZone = guildTimeZone(await loadGuild());
  const where: string[] = [];
  const bind: unknown[] = [];
  let zone: string | undefined;
  const inGuildZone = (day: string) => `${day}::timestamp AT TIME ZONE ${(zone ??= `$${bind.push(timeZone)}::text`)}`;
  if (q.from) where.push(`e.created_at >= ${inGuildZone(`$${bind.push(q.from)}::date`)}`);
  if (q.to) where.push(`e.created_at < ${inGuildZone(`($${bind.push(q.to)}::date + 1)`)}`);
  if (q.kind) where.push(`e.kind = $${bind.push(q.kind)}`);
  const rows = await sequelize.query<LedgerRow>(
    `SELECT e.id, e.transaction_id, e.created_at, e.kind, e.reverses, e.account, e.amount_minor, e.currency,
            e.order_id, o.reference AS order_reference, e.payout_id, m.name AS seller_name
     FROM ledger_entries e
     LEFT JOIN orders o ON o.id = e.order_id
     LEFT JOIN members m ON m.id = (CASE WHEN e.account LIKE 'seller:%' THEN substring(e.account from 8)::uuid END)
     ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
     ORDER BY e.created_at DESC, e.id DESC
     LIMIT 5000`,
    { bind, type: QueryTypes.SELECT },
  );
  const items = rows.map((r) => ({
    id: String(r.id),
    transactionId: r.transaction_id,
    createdAt: new Date(r.created_at).toISOString(),
    kind: r.kind,
    reverses: r.reverses,
    account: r.account,
    accountLabel: r.seller_name ? `Seller: ${r.seller_name}` : (ACCOUNT_LABELS[r.account] ?? r.account),
    amountMinor: r.amount_minor,
    currency: r.currency,
    orderId: r.order_id,
    orderReference: r.order_reference,
    payoutId: r.payout_id,
  }));
  return { items, timeZone };
}

/** What the guild owes each seller, split into what may be paid out now and what waits for bags not yet sent. */
export async function sellerBalances(sequelize: Sequelize, actor: Actor): Promise<SellerBalanceView[]> {
  authorize(actor, 'ledger.view');
  const guild = await loadGuild();
  const splits = await sellerBalanceSplits(sequelize, null);
  return splits.map((b) => ({
    sellerId: b.sellerId,
    name: b.name,
    creditedMinor: b.creditedMinor,
    paidOutMinor: b.paidOutMinor,
    balanceMinor: b.payableMinor + b.waitingMinor,
    payableMinor: b.payableMinor,
    waitingMinor: b.waitingMinor,
    currency: guild.currency,
  }));
}

/**
 * For each order this viewer may refund: its seller's payable figure now and after the refund, and the order's
 * seller credit still standing (what a refund reverses), so the treasurer sees a refund that would leave a
 * paid-out seller owing the guild. Owing is measured against the payable figure, not the whole balance: a
 * seller owes only money paid out to them that no bag gone out stands behind any more. Credits still waiting do
 * not cover it (they may yet be refunded too); they pay it off once their bags go out, as later sales do. A refund
 * of an order whose bag has not gone out leaves the payable figure as it was: its credit was waiting, so none of
 * it can have been paid out. Two queries for any number of orders; an empty map when the viewer may refund none.
 */
export async function refundEffects(
  sequelize: Sequelize,
  actor: Actor,
  orders: readonly Order[],
): Promise<Map<string, RefundEffectView>> {
  const refundable = orders.filter((o) => can(actor, 'order.refund', o));
  if (refundable.length === 0) return new Map();
  const [splits, credits] = await Promise.all([
    sellerBalanceSplits(sequelize, [...new Set(refundable.map((o) => o.sellerId))]),
    sequelize.query<{ order_id: string; credit: number }>(
      `SELECT w.order_id, coalesce(sum(e.amount_minor), 0)::int AS credit
       FROM unnest($1::uuid[], $2::text[]) AS w(order_id, account)
       LEFT JOIN ledger_entries e ON e.order_id = w.order_id AND e.account = w.account
       GROUP BY w.order_id`,
      { bind: [refundable.map((o) => o.id), refundable.map((o) => sellerAccount(o.sellerId))], type: QueryTypes.SELECT },
    ),
  ]);
  const payable = new Map(splits.map((b) => [b.sellerId, b.payableMinor]));
  const credit = new Map(credits.map((r) => [r.order_id, r.credit]));
  return new Map(
    refundable.map((o) => {
      const now = payable.get(o.sellerId) ?? 0;
      const standing = credit.get(o.id) ?? 0;
      const waits = (CREDIT_WAITING_ORDER_STATES as readonly OrderState[]).includes(o.state);
      return [o.id, { sellerPayableMinor: now, sellerPayableAfterMinor: waits ? now : now - standing, sellerCreditMinor: standing }];
    }),
  );
}

/** The 422 for a payout above what is payable now: how much that is, and what waits and why. */
function payoutTooLarge(name: string, payable: number, waiting: number, currency: string) {
  const money = (minor: number) => formatMoney(minor, currency);
  const now =
    payable > 0
      ? `only ${money(payable)} can be paid to ${name} now`
      : payable < 0
        ? `nothing can be paid to ${name} now: a refund after a payout left them owing the guild ${money(-payable)}`
        : `nothing can be paid to ${name} now`;
  const waits =
    waiting > 0
      ? ` ${money(waiting)} more is waiting for bags not yet posted or handed over: it can be paid once the seller marks them posted or they are handed over at a meeting, because until then the order may still be cancelled and refunded.`
      : '';
  return unprocessable(`That is more than the guild can pay out: ${now}.${waits}`, {
    amountMinor: payable > 0 ? `More than the ${money(payable)} payable now.` : 'Nothing is payable now.',
  });
}

export async function recordPayout(ctx: AppContext, actor: Actor, input: PayoutInput): Promise<Payout> {
  authorize(actor, 'payout.record');
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const seller = await Member.findByPk(input.sellerId, { transaction });
    if (!seller) throw notFound('That seller');
    // Two treasurers cannot both pay out the same balance, nor a refund or an untick land between the check and the payout.
    await lockSellerPayable(ctx.sequelize, seller.id, transaction);
    const [split] = await sellerBalanceSplits(ctx.sequelize, [seller.id], transaction);
    const payable = split?.payableMinor ?? 0;
    const waiting = split?.waitingMinor ?? 0;
    if (input.amountMinor > payable) throw payoutTooLarge(seller.name, payable, waiting, guild.currency);
    const payout = await Payout.create(
      { sellerId: seller.id, amountMinor: input.amountMinor, currency: guild.currency, method: input.method, reference: input.reference, recordedBy: actor.id, createdAt: ctx.now() },
      { transaction },
    );
    await writeLedger(payoutEntries({ sellerId: seller.id, amountMinor: input.amountMinor }), { payoutId: payout.id, currency: guild.currency, at: ctx.now() }, transaction);
    // Money e-mail: always sent, and queued with the payout so it goes only if the payout is recorded.
    // A closed account has no address left to write to.
    if (seller.closedAt) return payout;
    const payableNow = payable - input.amountMinor;
    const mail = payoutRecorded({
      guildName: guild.name,
      name: seller.name,
      amount: formatMoney(input.amountMinor, guild.currency),
      method: input.method,
      reference: input.reference,
      recordedAt: formatWhen(payout.createdAt, guildTimeZone(guild)),
      owedNow: payableNow > 0 ? formatMoney(payableNow, guild.currency) : null,
      waiting: waiting > 0 ? formatMoney(waiting, guild.currency) : null,
      link: `${ctx.config.appUrl}/orders?as=seller`,
    });
    await ctx.queue.enqueueEmail({ to: seller.email, ...mail }, transaction);
    return payout;
  });
}
