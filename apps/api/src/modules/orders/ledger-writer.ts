import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { isBalanced, sellerAccount, type LedgerEntry as DomainEntry } from '@scrap-relay/shared';
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

/** What the guild owes a seller now, in minor units: credits less refunds and payouts (below zero, the seller owes the guild). */
export async function sellerBalance(sellerId: string, transaction: Transaction): Promise<number> {
  const total: unknown = await LedgerEntry.sum('amountMinor', { where: { account: sellerAccount(sellerId) }, transaction });
  return Number(total ?? 0);
}
