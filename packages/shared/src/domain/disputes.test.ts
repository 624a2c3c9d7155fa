import { describe, expect, it } from 'vitest';
import { disputeReasonLabel, disputeStage, disputeStatusLabel } from './disputes.ts';
import { accountBalances, disputeLostEntries, isBalanced, ledgerEntriesForPaidOrder, orderMoney, reversalEntries } from './money.ts';

describe('dispute stages (statuses as Stripe’s Dispute object lists them)', () => {
  it('reads the decided statuses, and everything else as still open', () => {
    expect(disputeStage('won')).toBe('won');
    expect(disputeStage('lost')).toBe('lost');
    expect(disputeStage('warning_closed')).toBe('closed');
    expect(disputeStage('prevented')).toBe('closed');
    for (const status of ['needs_response', 'under_review', 'warning_needs_response', 'warning_under_review', 'appeal_needs_response', 'appeal_under_review']) {
      expect(disputeStage(status)).toBe('open');
    }
    // A status the card service adds later is treated as open: nothing is booked until it says won or lost.
    expect(disputeStage('some_future_status')).toBe('open');
  });

  it('words statuses and reasons for the treasurer, and shows an unknown one as it came', () => {
    expect(disputeStatusLabel('needs_response')).toBe('Waiting for the guild’s answer');
    expect(disputeReasonLabel('product_not_received')).toBe('The buyer says the order never arrived');
    expect(disputeReasonLabel('a_new_reason')).toBe('a_new_reason');
  });
});

describe('a lost dispute in the ledger (design choice: mirrors a refund, the money leaving through the card processor)', () => {
  // $12.00 bundle + $6.50 postage, 10 % guild fee: charge 1850, seller credit 1730, fee 120, processing 84.
  const money = orderMoney({ lines: [{ priceMinor: 1200, quantity: 1 }], postageMinor: 650, guildFeeBasisPoints: 1000 });
  const paid = ledgerEntriesForPaidOrder({ sellerId: 'm-7', money });

  it('takes back the seller’s credit and the guild’s fee, and shows the whole payment gone through the processor', () => {
    const lost = disputeLostEntries({ sellerId: 'm-7', amountMinor: 1850, orderEntries: paid });
    expect(lost).toEqual([
      { kind: 'dispute', account: 'processor', amountMinor: 1850 },
      { kind: 'dispute', account: 'seller:m-7', amountMinor: -1730, reverses: 'seller_credit' },
      { kind: 'dispute', account: 'guild', amountMinor: -120, reverses: 'guild_fee' },
    ]);
    expect(isBalanced(lost)).toBe(true);
    const after = accountBalances([...paid, ...lost]);
    expect(after.get('seller:m-7')).toBe(0);
    // The guild is left bearing the processing fee, as after a refund.
    expect(after.get('guild')).toBe(-84);
    expect(after.get('processor')).toBe(1850 + 84);
  });

  it('takes back shares in proportion for a dispute over part of the payment, rounding half up', () => {
    // 1000 of 1850 disputed: seller 1730 × 1000 ÷ 1850 = 935.14 → 935; the guild's fee gives the rest, 65.
    const lost = disputeLostEntries({ sellerId: 'm-7', amountMinor: 1000, orderEntries: paid });
    expect(lost).toEqual([
      { kind: 'dispute', account: 'processor', amountMinor: 1000 },
      { kind: 'dispute', account: 'seller:m-7', amountMinor: -935, reverses: 'seller_credit' },
      { kind: 'dispute', account: 'guild', amountMinor: -65, reverses: 'guild_fee' },
    ]);
    expect(isBalanced(lost)).toBe(true);
  });

  it('leaves the guild to bear a payment taken back after the order was refunded already', () => {
    const refunded = [...paid, ...reversalEntries(paid)];
    const lost = disputeLostEntries({ sellerId: 'm-7', amountMinor: 1850, orderEntries: refunded });
    expect(lost).toEqual([
      { kind: 'dispute', account: 'processor', amountMinor: 1850 },
      { kind: 'dispute', account: 'guild', amountMinor: -1850 },
    ]);
    expect(accountBalances([...refunded, ...lost]).get('seller:m-7')).toBe(0);
  });

  it('refuses a zero or fractional amount, and is never reversed by a refund', () => {
    expect(() => disputeLostEntries({ sellerId: 'm-7', amountMinor: 0, orderEntries: paid })).toThrow(RangeError);
    expect(() => disputeLostEntries({ sellerId: 'm-7', amountMinor: 18.5, orderEntries: paid })).toThrow(RangeError);
    const lost = disputeLostEntries({ sellerId: 'm-7', amountMinor: 1850, orderEntries: paid });
    expect(() => reversalEntries(lost)).toThrow('not reversed by a refund');
  });
});
