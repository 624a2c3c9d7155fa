import { describe, expect, it } from 'vitest';
import { disputeReasonLabel, disputeStage, disputeStatusLabel, disputeStatusRank, isFinalDisputeStatus, isOvertakenDisputeStatus } from './disputes.ts';
import { accountBalances, disputeFeeEntries, disputeLostEntries, isBalanced, ledgerEntriesForPaidOrder, orderMoney, reversalEntries } from './money.ts';

describe('dispute statuses in the order they follow, for news arriving out of order (design choice)', () => {
  it('ranks an answered dispute after one waiting for an answer, and every decision after both', () => {
    expect(isOvertakenDisputeStatus('needs_response', 'under_review')).toBe(true);
    expect(isOvertakenDisputeStatus('warning_under_review', 'needs_response')).toBe(true);
    for (const decided of ['won', 'lost', 'prevented']) expect(isOvertakenDisputeStatus('appeal_under_review', decided)).toBe(true);
  });

  it('lets a closed inquiry become a dispute, and never takes a status it does not know for overtaken news', () => {
    expect(isOvertakenDisputeStatus('needs_response', 'warning_closed')).toBe(false);
    expect(isFinalDisputeStatus('warning_closed')).toBe(false);
    expect(isFinalDisputeStatus('lost')).toBe(true);
    expect(disputeStatusRank('a_future_status')).toBeNull();
    expect(isOvertakenDisputeStatus('needs_response', 'a_future_status')).toBe(false);
    expect(isOvertakenDisputeStatus('a_future_status', 'under_review')).toBe(false);
  });
});

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

describe('the card processor’s dispute fee in the ledger (design choice: the guild bears it, at the figure the processor reports)', () => {
  // $15.00: Stripe's published dispute fee for a US card payment (from memory); any figure works the same way.
  const money = orderMoney({ lines: [{ priceMinor: 1200, quantity: 1 }], postageMinor: 650, guildFeeBasisPoints: 1000 });
  const paid = ledgerEntriesForPaidOrder({ sellerId: 'm-7', money });

  it('books the fee the processor charged when the dispute opened, borne by the guild', () => {
    const fee = disputeFeeEntries({ chargedMinor: 1500, orderEntries: paid });
    expect(fee).toEqual([
      { kind: 'dispute_fee', account: 'processor', amountMinor: 1500 },
      { kind: 'dispute_fee', account: 'guild', amountMinor: -1500 },
    ]);
    expect(isBalanced(fee)).toBe(true);
    // The seller's balance is untouched: no seller chose to incur it.
    expect(accountBalances([...paid, ...fee]).get('seller:m-7')).toBe(1730);
  });

  it('books nothing more when the same figure arrives again, and the difference when the processor gives the fee back', () => {
    const opened = [...paid, ...disputeFeeEntries({ chargedMinor: 1500, orderEntries: paid })];
    expect(disputeFeeEntries({ chargedMinor: 1500, orderEntries: opened })).toEqual([]);
    // Won, fee returned: the movements' fees now sum to 1500 − 1500 = 0.
    const returned = disputeFeeEntries({ chargedMinor: 0, orderEntries: opened });
    expect(returned).toEqual([
      { kind: 'dispute_fee', account: 'processor', amountMinor: -1500 },
      { kind: 'dispute_fee', account: 'guild', amountMinor: 1500 },
    ]);
    expect(accountBalances([...opened, ...returned]).get('guild')).toBe(accountBalances(paid).get('guild'));
  });

  it('books nothing for a processor that charges no fee, refuses a fractional figure, and is never reversed by a refund', () => {
    expect(disputeFeeEntries({ chargedMinor: 0, orderEntries: paid })).toEqual([]);
    expect(() => disputeFeeEntries({ chargedMinor: 15.5, orderEntries: paid })).toThrow(RangeError);
    expect(() => reversalEntries(disputeFeeEntries({ chargedMinor: 1500, orderEntries: paid }))).toThrow('not reversed by a refund');
  });
});
