import type { LedgerEntryKind, PayoutInput } from '@scrap-relay/shared';

export const LEDGER_KIND_LABELS: Readonly<Record<LedgerEntryKind, string>> = {
  charge: 'Card payment',
  guild_fee: 'Guild fee',
  seller_credit: 'Seller credit',
  processing_cost: 'Card processing cost',
  refund: 'Refund',
  payout: 'Payout',
};

export const PAYOUT_METHOD_LABELS: Readonly<Record<PayoutInput['method'], string>> = {
  bank_transfer: 'Bank transfer',
  cheque: 'Cheque',
  cash: 'Cash',
  other: 'Other',
};

export const isLedgerKind = (value: string): value is LedgerEntryKind => Object.hasOwn(LEDGER_KIND_LABELS, value);

/** "Refund of a guild fee" for a reversing entry; the plain label otherwise. */
export function ledgerKindText(kind: string, reverses: string | null): string {
  const label = isLedgerKind(kind) ? LEDGER_KIND_LABELS[kind] : kind;
  if (!reverses) return label;
  const reversed = isLedgerKind(reverses) ? LEDGER_KIND_LABELS[reverses].toLowerCase() : reverses;
  return `${label} of a ${reversed}`;
}
