import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { isBalanced, type LedgerEntry as DomainEntry } from '@scrap-relay/shared';
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
