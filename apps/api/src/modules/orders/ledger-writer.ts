import { randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { BAG_OUT_ORDER_STATES, CREDIT_WAITING_ORDER_STATES, isBalanced, sellerAccount, type LedgerEntry as DomainEntry, type SellerBalanceView } from '@scrap-relay/shared';
import { LedgerEntry } from '../../db/models/index.ts';

/** Writes one balanced transaction of ledger entries; an unbalanced set is a bug, so it throws before writing. */
export async function writeLedger(
  entries: DomainEntry[],
  link: { orderId?: string; payoutId?: string; currency: string; at: Date },
  transaction: Transaction,
): Promise<void> {
  if (entries.length === 0) return;
  if (!isBalanced(entries)) throw new Error('refusing to write unbalanced ledger entries');
  const transactionId = randomUUID();
  await LedgerEntry.bulkCreate(
    entries.map((e) => ({
      transactionId,
      orderId: link.orderId ?? null,
      payoutId: link.payoutId ?? null,
      kind: e.kind,
      reverses: e.reverses ?? null,
      account: e.account,
      amountMinor: e.amountMinor,
      currency: link.currency,
      createdAt: link.at,
    })),
    { transaction },
  );
}

export type SellerBalanceSplit = Omit<SellerBalanceView, 'balanceMinor' | 'currency'>;

/**
 * Each seller's balance split by where the bags are, in one aggregate over ledger_entries joined to orders (null
 * `sellerIds`: every seller with an entry). A seller credit waits while its order is still `confirmed` (paid, bag
 * not yet posted or handed over), and so does anything that takes that credit back while the order stays there
 * (a lost card dispute). Everything else on the seller's account counts towards or against what is payable now:
 * credits of bags gone out, every refund and payout. A refund moves its order out of `confirmed` in the same
 * transaction, so a refunded or cancelled order's credit and its reversal both land in payable and cancel out:
 * such an order leaves nothing waiting.
 */
export async function sellerBalanceSplits(
  sequelize: Sequelize,
  sellerIds: readonly string[] | null,
  transaction?: Transaction,
): Promise<SellerBalanceSplit[]> {
  const bind: unknown[] = [CREDIT_WAITING_ORDER_STATES];
  const accounts = sellerIds === null ? `e.account LIKE 'seller:%'` : `e.account = ANY($${bind.push(sellerIds.map(sellerAccount))}::text[])`;
  const rows = await sequelize.query<{ seller_id: string; name: string; credited: number; paid_out: number; payable: number; waiting: number }>(
    `SELECT m.id AS seller_id, m.name,
            coalesce(sum(s.amount_minor) FILTER (WHERE s.kind <> 'payout'), 0)::int AS credited,
            coalesce(-sum(s.amount_minor) FILTER (WHERE s.kind = 'payout'), 0)::int AS paid_out,
            coalesce(sum(s.amount_minor) FILTER (WHERE NOT s.waits), 0)::int AS payable,
            coalesce(sum(s.amount_minor) FILTER (WHERE s.waits), 0)::int AS waiting
     FROM (
       SELECT substring(e.account from 8)::uuid AS seller_id, e.kind, e.amount_minor,
              ((e.kind = 'seller_credit' OR e.reverses = 'seller_credit') AND o.state = ANY($1::text[])) IS TRUE AS waits
       FROM ledger_entries e LEFT JOIN orders o ON o.id = e.order_id
       WHERE ${accounts}
     ) s
     JOIN members m ON m.id = s.seller_id
     GROUP BY m.id, m.name
     ORDER BY m.name`,
    { bind, transaction, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    sellerId: r.seller_id,
    name: r.name,
    creditedMinor: r.credited,
    paidOutMinor: r.paid_out,
    payableMinor: r.payable,
    waitingMinor: r.waiting,
  }));
}

/**
 * Holds still what a seller may be paid now, for a change that reads it and then acts on it (a payout, unticking a
 * handover). Payouts and unticks for one seller take turns (an advisory lock). A refund of a bag already out lowers
 * the payable figure too: the seller's bag-out orders are locked until the caller commits, so a refund in flight
 * (it holds its order FOR UPDATE) is counted before the check instead of landing after it. Take it before locking
 * any order of the seller, as every caller does, so no two callers wait for each other.
 */
export async function lockSellerPayable(sequelize: Sequelize, sellerId: string, transaction: Transaction): Promise<void> {
  await sequelize.query('SELECT pg_advisory_xact_lock(hashtext($1))', { bind: [`payout:${sellerId}`], transaction });
  await sequelize.query('SELECT id FROM orders WHERE seller_id = $1 AND state = ANY($2::text[]) ORDER BY id FOR SHARE', {
    bind: [sellerId, BAG_OUT_ORDER_STATES],
    transaction,
  });
}
