import { QueryTypes, type Sequelize } from 'sequelize';
import {
  formatMoney,
  payoutEntries,
  sellerAccount,
  type LedgerEntryView,
  type LedgerQuery,
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
import { writeLedger } from '../orders/ledger-writer.ts';

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

export async function ledgerEntries(sequelize: Sequelize, actor: Actor, q: LedgerQuery): Promise<LedgerEntryView[]> {
  authorize(actor, 'ledger.view');
  const where: string[] = [];
  const bind: unknown[] = [];
  if (q.from) where.push(`e.created_at >= $${bind.push(q.from)}::date`);
  if (q.to) where.push(`e.created_at < $${bind.push(q.to)}::date + 1`);
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
  return rows.map((r) => ({
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
}

/** What the guild owes each seller: credits (net of refunds) less payouts, by SQL aggregate. */
export async function sellerBalances(sequelize: Sequelize, actor: Actor): Promise<SellerBalanceView[]> {
  authorize(actor, 'ledger.view');
  const guild = await loadGuild();
  const rows = await sequelize.query<{ seller_id: string; name: string; credited: number; paid_out: number }>(
    `SELECT m.id AS seller_id, m.name,
            coalesce(sum(e.amount_minor) FILTER (WHERE e.kind <> 'payout'), 0)::int AS credited,
            coalesce(-sum(e.amount_minor) FILTER (WHERE e.kind = 'payout'), 0)::int AS paid_out
     FROM ledger_entries e JOIN members m ON m.id = (CASE WHEN e.account LIKE 'seller:%' THEN substring(e.account from 8)::uuid END)
     WHERE e.account LIKE 'seller:%'
     GROUP BY m.id, m.name
     ORDER BY m.name`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    sellerId: r.seller_id,
    name: r.name,
    creditedMinor: r.credited,
    paidOutMinor: r.paid_out,
    balanceMinor: r.credited - r.paid_out,
    currency: guild.currency,
  }));
}

/**
 * For each order this viewer may refund: its seller's balance now and the order's seller credit still standing
 * (what a refund reverses), so the treasurer sees a refund that would leave a paid-out seller owing the guild.
 * One query for any number of orders; an empty map when the viewer may refund none of them.
 */
export async function refundEffects(
  sequelize: Sequelize,
  actor: Actor,
  orders: readonly Order[],
): Promise<Map<string, RefundEffectView>> {
  const refundable = orders.filter((o) => can(actor, 'order.refund', o));
  if (refundable.length === 0) return new Map();
  const rows = await sequelize.query<{ order_id: string; balance: number; credit: number }>(
    `SELECT w.order_id,
            coalesce(sum(e.amount_minor), 0)::int AS balance,
            coalesce(sum(e.amount_minor) FILTER (WHERE e.order_id = w.order_id), 0)::int AS credit
     FROM unnest($1::uuid[], $2::text[]) AS w(order_id, account)
     LEFT JOIN ledger_entries e ON e.account = w.account
     GROUP BY w.order_id`,
    { bind: [refundable.map((o) => o.id), refundable.map((o) => sellerAccount(o.sellerId))], type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.order_id, { sellerBalanceMinor: r.balance, sellerCreditMinor: r.credit }]));
}

export async function recordPayout(ctx: AppContext, actor: Actor, input: PayoutInput): Promise<Payout> {
  authorize(actor, 'payout.record');
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const seller = await Member.findByPk(input.sellerId, { transaction });
    if (!seller) throw notFound('That seller');
    // Serialise payouts per seller so two treasurers cannot both pay out the same balance.
    await ctx.sequelize.query('SELECT pg_advisory_xact_lock(hashtext($1))', { bind: [`payout:${seller.id}`], transaction });
    const [row] = await ctx.sequelize.query<{ balance: number }>(
      `SELECT coalesce(sum(amount_minor), 0)::int AS balance FROM ledger_entries WHERE account = $1`,
      { bind: [`seller:${seller.id}`], transaction, type: QueryTypes.SELECT },
    );
    const balance = row?.balance ?? 0;
    if (input.amountMinor > balance) {
      const owed = formatMoney(Math.max(balance, 0), guild.currency);
      throw unprocessable(`That is more than the guild owes ${seller.name} (${owed}).`, { amountMinor: `More than the ${owed} owed.` });
    }
    const payout = await Payout.create(
      { sellerId: seller.id, amountMinor: input.amountMinor, currency: guild.currency, method: input.method, reference: input.reference, recordedBy: actor.id, createdAt: ctx.now() },
      { transaction },
    );
    await writeLedger(payoutEntries({ sellerId: seller.id, amountMinor: input.amountMinor }), { payoutId: payout.id, currency: guild.currency, at: ctx.now() }, transaction);
    // Money e-mail: always sent, and queued with the payout so it goes only if the payout is recorded.
    // A closed account has no address left to write to.
    if (seller.closedAt) return payout;
    const owedNow = balance - input.amountMinor;
    const mail = payoutRecorded({
      guildName: guild.name,
      name: seller.name,
      amount: formatMoney(input.amountMinor, guild.currency),
      method: input.method,
      reference: input.reference,
      recordedAt: formatWhen(payout.createdAt, guildTimeZone(guild)),
      owedNow: owedNow > 0 ? formatMoney(owedNow, guild.currency) : null,
      link: `${ctx.config.appUrl}/orders?as=seller`,
    });
    await ctx.queue.enqueueEmail({ to: seller.email, ...mail }, transaction);
    return payout;
  });
}
