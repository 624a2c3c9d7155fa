import type { LedgerEntryKind, PayoutInput } from '@scrap-relay/shared';

export const LEDGER_KIND_LABELS: Readonly<Record<LedgerEntryKind, string>> = {
  charge: 'Card payment',
  guild_fee: 'Guild fee',
  seller_credit: 'Seller credit',
  processing_cost: 'Card processing cost',
  refund: 'Refund',
  payout: 'Payout',
  dispute: 'Dispute lost',
  dispute_fee: 'Dispute fee',
};

export const PAYOUT_METHOD_LABELS: Readonly<Record<PayoutInput['method'], string>> = {
  bank_transfer: 'Bank transfer',
  cheque: 'Cheque',
  cash: 'Cash',
  other: 'Other',
};

export const isLedgerKind = (value: string): value is LedgerEntryKind => Object.hasOwn(LEDGER_KIND_LABELS, value);

/** "Refund of a guild fee" or "Seller credit taken back (dispute lost)" for a reversing entry; the plain label otherwise. */
export function ledgerKindText(kind: string, reverses: string | null): string {
  const label = isLedgerKind(kind) ? LEDGER_KIND_LABELS[kind] : kind;
  if (!reverses) return label;
  if (kind === 'dispute') return `${isLedgerKind(reverses) ? LEDGER_KIND_LABELS[reverses] : reverses} taken back (dispute lost)`;
  const reversed = isLedgerKind(reverses) ? LEDGER_KIND_LABELS[reverses].toLowerCase() : reverses;
  return `${label} of a ${reversed}`;
}

/**
 * What an entry's sign means for its account, in the treasurer's words. Each transaction's entries add up to
 * zero, so money a buyer pays in is a minus on the buyers' account and a plus on the accounts it is shared
 * among; a bare "−$27.90" beside "Card payment" reads as money lost, so every amount carries its direction.
 */
export function ledgerDirection(account: string, amountMinor: number, kind?: string): string {
  const plus = amountMinor >= 0;
  if (account === 'processor' && kind === 'dispute') return plus ? 'taken back through the card processor' : 'returned by the card processor';
  if (account === 'buyer') return plus ? 'paid back to the buyer' : 'received from the buyer';
  if (account === 'guild') return plus ? 'to the guild' : 'from the guild';
  if (account === 'processor') return plus ? 'kept by the card processor' : 'returned by the card processor';
  if (account === 'payouts') return plus ? 'paid out' : 'payout undone';
  if (account.startsWith('seller:')) return plus ? 'owed to the seller' : 'no longer owed to the seller';
  return plus ? 'in' : 'out';
}
