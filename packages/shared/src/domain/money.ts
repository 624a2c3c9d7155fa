/**
 * Money: integer minor units (cents) throughout.
 *
 * The one rounding rule: a computed amount is rounded half up to a whole minor unit
 * (64.5¢ → 65¢). For a negative amount the magnitude is rounded the same way and the sign
 * put back (−64.5¢ → −65¢), so a reversal is always the exact negative of the original.
 * Each fee is rounded once, on the order's total, never per line.
 *
 * Ledger: simple double entry. Every transaction's entries sum to zero. Accounts:
 *   buyer       money paid in by buyers (negative: it left them)
 *   seller:<id> what the guild owes that seller (positive: owed)
 *   guild       the guild's own income
 *   processor   what the card processor took
 *   payouts     money the treasurer has paid out to sellers
 */

/** numerator ÷ denominator for integers, rounded by the rule above. */
export function divideRoundHalfUp(numerator: number, denominator: number): number {
  if (!Number.isSafeInteger(numerator) || !Number.isSafeInteger(denominator) || denominator <= 0) {
    throw new RangeError(`Bad division ${numerator} / ${denominator}`);
  }
  const magnitude = Math.floor((2 * Math.abs(numerator) + denominator) / (2 * denominator));
  return numerator < 0 ? -magnitude : magnitude;
}

const BASIS_POINTS = 10_000;

function assertMinor(name: string, value: number): void {
  if (!Number.isSafeInteger(value)) throw new RangeError(`${name} must be whole minor units, got ${value}`);
}

/** The guild's fee on a sale price, in basis points (1000 = 10 %). */
export function guildFee(priceMinor: number, basisPoints: number): number {
  assertMinor('priceMinor', priceMinor);
  assertMinor('basisPoints', basisPoints);
  return divideRoundHalfUp(priceMinor * basisPoints, BASIS_POINTS);
}

/** Card processing defaults: 2.9 % + 30¢ (processor's published US price list, 2026). */
export const DEFAULT_PROCESSING = { percentBasisPoints: 290, fixedMinor: 30 } as const;

export interface ProcessingRate {
  percentBasisPoints: number;
  fixedMinor: number;
}

/**
 * Estimated processor fee on one card charge: percent + fixed, rounded once.
 * Nothing is charged on a zero charge (no card payment happens), so the cost is 0.
 */
export function processingCost(
  chargeMinor: number,
  percentBasisPoints: number = DEFAULT_PROCESSING.percentBasisPoints,
  fixedMinor: number = DEFAULT_PROCESSING.fixedMinor,
): number {
  assertMinor('chargeMinor', chargeMinor);
  assertMinor('fixedMinor', fixedMinor);
  if (chargeMinor === 0) return 0;
  return divideRoundHalfUp(chargeMinor * percentBasisPoints + fixedMinor * BASIS_POINTS, BASIS_POINTS);
}

export interface OrderMoneyInput {
  lines: ReadonlyArray<{ priceMinor: number; quantity: number }>;
  postageMinor: number;
  guildFeeBasisPoints: number;
  processing?: ProcessingRate;
}

export interface OrderMoney {
  subtotalMinor: number;
  postageMinor: number;
  /** What the buyer pays: subtotal + postage. */
  chargeMinor: number;
  /** Fee on the sale price only, never on postage. */
  guildFeeMinor: number;
  processingCostMinor: number;
  /** Owed to the seller: subtotal − guild fee + postage (they pay the carrier). */
  sellerCreditMinor: number;
  /** Guild fee less processing cost; negative when processing costs more than the fee. */
  guildNetMinor: number;
}

/** All the money of one order. The guild absorbs the processing cost. */
export function orderMoney(input: OrderMoneyInput): OrderMoney {
  const processing = input.processing ?? DEFAULT_PROCESSING;
  let subtotalMinor = 0;
  for (const line of input.lines) {
    assertMinor('priceMinor', line.priceMinor);
    if (line.priceMinor < 0 || !Number.isInteger(line.quantity) || line.quantity < 1) {
      throw new RangeError(`Bad order line ${JSON.stringify(line)}`);
    }
    subtotalMinor += line.priceMinor * line.quantity;
  }
  assertMinor('postageMinor', input.postageMinor);
  if (input.postageMinor < 0) throw new RangeError('Postage cannot be negative');
  const chargeMinor = subtotalMinor + input.postageMinor;
  const guildFeeMinor = guildFee(subtotalMinor, input.guildFeeBasisPoints);
  const processingCostMinor = processingCost(chargeMinor, processing.percentBasisPoints, processing.fixedMinor);
  return {
    subtotalMinor,
    postageMinor: input.postageMinor,
    chargeMinor,
    guildFeeMinor,
    processingCostMinor,
    sellerCreditMinor: subtotalMinor - guildFeeMinor + input.postageMinor,
    guildNetMinor: guildFeeMinor - processingCostMinor,
  };
}

/* ---------- ledger ---------- */

export const LEDGER_ENTRY_KINDS = ['charge', 'guild_fee', 'seller_credit', 'processing_cost', 'refund', 'payout', 'dispute', 'dispute_fee'] as const;
export type LedgerEntryKind = (typeof LEDGER_ENTRY_KINDS)[number];

export type LedgerAccount = 'buyer' | 'guild' | 'processor' | 'payouts' | `seller:${string}`;

export interface LedgerEntry {
  kind: LedgerEntryKind;
  account: LedgerAccount;
  /** Signed: positive adds to the account's balance, negative takes from it. */
  amountMinor: number;
  /** On refund and dispute entries, the kind of entry reversed. */
  reverses?: Exclude<LedgerEntryKind, 'refund' | 'payout' | 'dispute' | 'dispute_fee'>;
}

export const sellerAccount = (sellerId: string): LedgerAccount => `seller:${sellerId}`;

/**
 * The entries of one paid order, one transaction. Zero amounts are left out (a
 * postage-only order has no guild fee entry; a free order has no entries at all).
 *   charge           buyer −charge
 *   seller_credit    seller:<id> +credit
 *   guild_fee        guild +fee
 *   processing_cost  processor +cost, guild −cost
 */
export function ledgerEntriesForPaidOrder({ sellerId, money }: { sellerId: string; money: OrderMoney }): LedgerEntry[] {
  const entries: LedgerEntry[] = [
    { kind: 'charge', account: 'buyer', amountMinor: -money.chargeMinor },
    { kind: 'seller_credit', account: sellerAccount(sellerId), amountMinor: money.sellerCreditMinor },
    { kind: 'guild_fee', account: 'guild', amountMinor: money.guildFeeMinor },
    ...processingCostEntries(money.processingCostMinor),
  ];
  const kept = entries.filter((e) => e.amountMinor !== 0);
  if (!isBalanced(kept)) throw new Error('Order money does not balance: charge ≠ seller credit + guild fee');
  return kept;
}

/**
 * The card processor's fee, borne by the guild: on every paid order, and alone for a payment that came in
 * after its order was cancelled and was refunded (the processor keeps its fee on a refund; from memory).
 * Nothing for a fee of 0.
 */
export function processingCostEntries(processingCostMinor: number): LedgerEntry[] {
  assertMinor('processingCostMinor', processingCostMinor);
  if (processingCostMinor === 0) return [];
  return [
    { kind: 'processing_cost', account: 'processor', amountMinor: processingCostMinor },
    { kind: 'processing_cost', account: 'guild', amountMinor: -processingCostMinor },
  ];
}

export interface ReversalOptions {
  /**
   * Leave the processing cost standing, as card processors commonly keep their fee on a
   * refund (from memory; check the guild's processor). True by default. The remaining
   * entries still balance because the processing-cost pair nets to zero on its own.
   */
  keepProcessingCost?: boolean;
}

/** Refund entries that undo the given ones: every amount negated, kind `refund`. */
export function reversalEntries(entries: readonly LedgerEntry[], options: ReversalOptions = {}): LedgerEntry[] {
  const keepProcessingCost = options.keepProcessingCost ?? true;
  return entries
    .filter((e) => !(keepProcessingCost && e.kind === 'processing_cost'))
    .map((e) => {
      if (e.kind === 'refund' || e.kind === 'payout' || e.kind === 'dispute' || e.kind === 'dispute_fee') throw new Error(`A ${e.kind} entry is not reversed by a refund`);
      return { kind: 'refund', account: e.account, amountMinor: -e.amountMinor, reverses: e.kind };
    });
}

/**
 * A dispute the guild lost: the cardholder's bank took `amountMinor` back through the card processor. Mirrors a
 * refund for the order's shares, kind `dispute`:
 *   processor        +amount (the money left the guild's card account)
 *   seller:<id>      −the seller's credit for the order still standing (reverses seller_credit)
 *   guild            −the guild fee still standing (reverses guild_fee)
 *   guild            −whatever is left, borne by the guild (for example when the order had been refunded already)
 * Of a dispute for part of the payment, each share is taken back in proportion (credit × amount ÷ charge, by the
 * one rounding rule); the guild's fee absorbs the rounding. The processor's fee for the payment stays, as on a refund.
 */
export function disputeLostEntries({ sellerId, amountMinor, orderEntries }: { sellerId: string; amountMinor: number; orderEntries: readonly LedgerEntry[] }): LedgerEntry[] {
  assertMinor('amountMinor', amountMinor);
  if (amountMinor <= 0) throw new RangeError('A lost dispute takes back a positive amount');
  const seller = sellerAccount(sellerId);
  let chargeMinor = 0;
  let creditMinor = 0;
  let feeMinor = 0;
  for (const e of orderEntries) {
    if (e.kind === 'charge') chargeMinor -= e.amountMinor;
    if (e.account === seller && (e.kind === 'seller_credit' || e.reverses === 'seller_credit')) creditMinor += e.amountMinor;
    if (e.account === 'guild' && (e.kind === 'guild_fee' || e.reverses === 'guild_fee')) feeMinor += e.amountMinor;
  }
  const part = (standing: number) => (chargeMinor > 0 && standing > 0 ? Math.min(standing, divideRoundHalfUp(standing * Math.min(amountMinor, chargeMinor), chargeMinor)) : 0);
  const sellerShare = Math.min(part(creditMinor), amountMinor);
  const feeShare = Math.min(Math.max(feeMinor, 0), amountMinor - sellerShare);
  const entries: LedgerEntry[] = [
    { kind: 'dispute', account: 'processor', amountMinor },
    { kind: 'dispute', account: seller, amountMinor: -sellerShare, reverses: 'seller_credit' },
    { kind: 'dispute', account: 'guild', amountMinor: -feeShare, reverses: 'guild_fee' },
    { kind: 'dispute', account: 'guild', amountMinor: -(amountMinor - sellerShare - feeShare) },
  ];
  return entries.filter((e) => e.amountMinor !== 0);
}

/**
 * The card processor's fee for handling a dispute, borne by the guild whatever the bank decides (design choice: the
 * fee is the guild's cost of taking card payments, like the processing cost, and no seller chose to incur it).
 * The processor reports what it charged on the dispute's balance movements, and a processor that gives the fee
 * back with a won dispute reports a negative fee then; so the ledger follows the processor's figure: the entries
 * book the difference between `chargedMinor` (the sum of the movements' fees) and the dispute fees already in
 * `orderEntries`, nothing when they agree, which also makes news that arrives twice book once.
 *   processor  +difference
 *   guild      −difference
 */
export function disputeFeeEntries({ chargedMinor, orderEntries }: { chargedMinor: number; orderEntries: readonly LedgerEntry[] }): LedgerEntry[] {
  if (!Number.isSafeInteger(chargedMinor)) throw new RangeError(`chargedMinor must be whole minor units, got ${chargedMinor}`);
  const bookedMinor = orderEntries.filter((e) => e.kind === 'dispute_fee' && e.account === 'processor').reduce((sum, e) => sum + e.amountMinor, 0);
  const differenceMinor = chargedMinor - bookedMinor;
  if (differenceMinor === 0) return [];
  return [
    { kind: 'dispute_fee', account: 'processor', amountMinor: differenceMinor },
    { kind: 'dispute_fee', account: 'guild', amountMinor: -differenceMinor },
  ];
}

/** A payout the treasurer made to a seller: the guild owes them that much less. */
export function payoutEntries({ sellerId, amountMinor }: { sellerId: string; amountMinor: number }): LedgerEntry[] {
  assertMinor('amountMinor', amountMinor);
  if (amountMinor <= 0) throw new RangeError('A payout must be positive');
  return [
    { kind: 'payout', account: sellerAccount(sellerId), amountMinor: -amountMinor },
    { kind: 'payout', account: 'payouts', amountMinor },
  ];
}

/** Whether the entries sum to zero and every amount is whole minor units. */
export function isBalanced(entries: readonly LedgerEntry[]): boolean {
  let sum = 0;
  for (const e of entries) {
    if (!Number.isSafeInteger(e.amountMinor)) return false;
    sum += e.amountMinor;
  }
  return sum === 0;
}

/** Balance per account over any set of entries. */
export function accountBalances(entries: readonly LedgerEntry[]): Map<LedgerAccount, number> {
  const balances = new Map<LedgerAccount, number>();
  for (const e of entries) balances.set(e.account, (balances.get(e.account) ?? 0) + e.amountMinor);
  return balances;
}

/**
 * The smallest card payment the payment service takes, in minor units, per currency (upper-case code). From
 * memory of Stripe's "Minimum and maximum charge amounts" table (docs.stripe.com/currencies); a currency not
 * listed has no minimum here. An order under it can never be paid, so it is refused before anything is held.
 */
const MINIMUM_CARD_CHARGE_MINOR: Readonly<Record<string, number>> = {
  USD: 50,
  EUR: 50,
  GBP: 30,
  CAD: 50,
  AUD: 50,
  NZD: 50,
  CHF: 50,
  JPY: 50,
  SEK: 300,
  NOK: 300,
  DKK: 250,
};

export function minimumCardChargeMinor(currency: string): number {
  return MINIMUM_CARD_CHARGE_MINOR[currency.toUpperCase()] ?? 0;
}
