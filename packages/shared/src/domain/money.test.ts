import { describe, expect, it } from 'vitest';
import {
  DEFAULT_PROCESSING,
  type LedgerEntry,
  accountBalances,
  disputeLostEntries,
  divideRoundHalfUp,
  guildFee,
  isBalanced,
  ledgerEntriesForPaidOrder,
  orderMoney,
  payoutEntries,
  processingCost,
  processingCostEntries,
  reversalEntries,
} from './money.ts';

describe('rounding rule (design choice: half up, negatives mirror positives)', () => {
  it('rounds halves up and everything else to the nearest', () => {
    expect(divideRoundHalfUp(645, 10)).toBe(65);
    expect(divideRoundHalfUp(644, 10)).toBe(64);
    expect(divideRoundHalfUp(5, 10)).toBe(1);
    expect(divideRoundHalfUp(4, 10)).toBe(0);
    expect(divideRoundHalfUp(0, 10)).toBe(0);
  });

  it('rounds a negative amount as the negative of its magnitude', () => {
    expect(divideRoundHalfUp(-645, 10)).toBe(-65);
    expect(divideRoundHalfUp(-644, 10)).toBe(-64);
  });

  it('refuses fractions and a non-positive divisor', () => {
    expect(() => divideRoundHalfUp(1.5, 10)).toThrow(RangeError);
    expect(() => divideRoundHalfUp(10, 0)).toThrow(RangeError);
  });
});

describe('fees', () => {
  it('takes the guild fee in basis points of the sale price (PRODUCT.md default 10 %)', () => {
    expect(guildFee(1200, 1000)).toBe(120);
    expect(guildFee(1205, 1000)).toBe(121); // 120.5 → half up
    expect(guildFee(1204, 1000)).toBe(120);
    expect(guildFee(0, 1000)).toBe(0);
  });

  it('2.9 % + 30¢: $12.00 → 64.8¢ → 65¢, net $11.35 (processor published US price list, 2026)', () => {
    expect(DEFAULT_PROCESSING).toEqual({ percentBasisPoints: 290, fixedMinor: 30 });
    expect(processingCost(1200)).toBe(65);
    expect(1200 - processingCost(1200)).toBe(1135);
    expect(processingCost(1200, 290, 30)).toBe(65);
  });

  it('charges no processing cost when there is no card charge', () => {
    expect(processingCost(0)).toBe(0);
  });
});

describe('orderMoney', () => {
  it('splits one sale between seller, guild and processor', () => {
    const money = orderMoney({
      lines: [
        { priceMinor: 800, quantity: 1 },
        { priceMinor: 200, quantity: 2 },
      ],
      postageMinor: 650,
      guildFeeBasisPoints: 1000,
    });
    expect(money).toEqual({
      subtotalMinor: 1200,
      postageMinor: 650,
      chargeMinor: 1850,
      guildFeeMinor: 120, // on the price only
      processingCostMinor: 84, // 1850 × 2.9 % + 30 = 83.65
      sellerCreditMinor: 1730, // 1200 − 120 + 650
      guildNetMinor: 36,
    });
  });

  it('lets the guild net go negative on a postage-only order', () => {
    const money = orderMoney({ lines: [{ priceMinor: 0, quantity: 1 }], postageMinor: 500, guildFeeBasisPoints: 1000 });
    expect(money.guildFeeMinor).toBe(0);
    expect(money.processingCostMinor).toBe(45); // 14.5 + 30 = 44.5 → 45
    expect(money.sellerCreditMinor).toBe(500);
    expect(money.guildNetMinor).toBe(-45);
  });

  it('takes another processing rate', () => {
    const money = orderMoney({
      lines: [{ priceMinor: 1000, quantity: 1 }],
      postageMinor: 0,
      guildFeeBasisPoints: 500,
      processing: { percentBasisPoints: 150, fixedMinor: 20 },
    });
    expect(money.processingCostMinor).toBe(35);
    expect(money.guildFeeMinor).toBe(50);
  });

  it('refuses fractional prices and empty quantities', () => {
    expect(() => orderMoney({ lines: [{ priceMinor: 10.5, quantity: 1 }], postageMinor: 0, guildFeeBasisPoints: 0 })).toThrow(RangeError);
    expect(() => orderMoney({ lines: [{ priceMinor: 100, quantity: 0 }], postageMinor: 0, guildFeeBasisPoints: 0 })).toThrow(RangeError);
    expect(() => orderMoney({ lines: [], postageMinor: -1, guildFeeBasisPoints: 0 })).toThrow(RangeError);
  });
});

describe('ledger (design choice: double entry, each transaction sums to zero)', () => {
  const money = orderMoney({ lines: [{ priceMinor: 1200, quantity: 1 }], postageMinor: 650, guildFeeBasisPoints: 1000 });

  it('records a paid order as charge, seller credit, guild fee and processing cost', () => {
    const entries = ledgerEntriesForPaidOrder({ sellerId: 'm-7', money });
    expect(entries).toEqual([
      { kind: 'charge', account: 'buyer', amountMinor: -1850 },
      { kind: 'seller_credit', account: 'seller:m-7', amountMinor: 1730 },
      { kind: 'guild_fee', account: 'guild', amountMinor: 120 },
      { kind: 'processing_cost', account: 'processor', amountMinor: 84 },
      { kind: 'processing_cost', account: 'guild', amountMinor: -84 },
    ]);
    expect(isBalanced(entries)).toBe(true);
    expect(accountBalances(entries).get('guild')).toBe(money.guildNetMinor);
  });

  it('leaves out zero entries, so a free order has none', () => {
    const free = orderMoney({ lines: [{ priceMinor: 0, quantity: 1 }], postageMinor: 0, guildFeeBasisPoints: 1000 });
    expect(ledgerEntriesForPaidOrder({ sellerId: 'm-1', money: free })).toEqual([]);
  });

  it('reverses a refund, keeping the processor fee by default', () => {
    const entries = ledgerEntriesForPaidOrder({ sellerId: 'm-7', money });
    const refund = reversalEntries(entries);
    expect(refund).toEqual([
      { kind: 'refund', account: 'buyer', amountMinor: 1850, reverses: 'charge' },
      { kind: 'refund', account: 'seller:m-7', amountMinor: -1730, reverses: 'seller_credit' },
      { kind: 'refund', account: 'guild', amountMinor: -120, reverses: 'guild_fee' },
    ]);
    expect(isBalanced(refund)).toBe(true);
    const after = accountBalances([...entries, ...refund]);
    expect(after.get('buyer')).toBe(0);
    expect(after.get('seller:m-7')).toBe(0);
    expect(after.get('guild')).toBe(-84); // the guild bears the kept fee
  });

  it('reverses everything when the processor returns its fee', () => {
    const entries = ledgerEntriesForPaidOrder({ sellerId: 'm-7', money });
    const all = [...entries, ...reversalEntries(entries, { keepProcessingCost: false })];
    for (const balance of accountBalances(all).values()) expect(balance).toBe(0);
  });

  it('books only the kept processor fee for a late payment that was refunded, and the same pair as a paid order', () => {
    const kept = processingCostEntries(84);
    expect(kept).toEqual([
      { kind: 'processing_cost', account: 'processor', amountMinor: 84 },
      { kind: 'processing_cost', account: 'guild', amountMinor: -84 },
    ]);
    expect(isBalanced(kept)).toBe(true);
    expect(ledgerEntriesForPaidOrder({ sellerId: 'm-7', money }).filter((e) => e.kind === 'processing_cost')).toEqual(kept);
    expect(processingCostEntries(0)).toEqual([]);
    expect(() => processingCostEntries(8.4)).toThrow(RangeError);
  });

  it('records a payout against the seller balance', () => {
    const entries = [...ledgerEntriesForPaidOrder({ sellerId: 'm-7', money }), ...payoutEntries({ sellerId: 'm-7', amountMinor: 1730 })];
    expect(isBalanced(entries)).toBe(true);
    expect(accountBalances(entries).get('seller:m-7')).toBe(0);
    expect(() => payoutEntries({ sellerId: 'm-7', amountMinor: 0 })).toThrow(RangeError);
  });

  it('detects unbalanced or fractional entries', () => {
    const bad: LedgerEntry[] = [
      { kind: 'charge', account: 'buyer', amountMinor: -100 },
      { kind: 'seller_credit', account: 'seller:x', amountMinor: 99 },
    ];
    expect(isBalanced(bad)).toBe(false);
    expect(isBalanced([{ kind: 'charge', account: 'buyer', amountMinor: 0.5 }, { kind: 'guild_fee', account: 'guild', amountMinor: -0.5 }])).toBe(false);
  });

  it('always balances over many generated orders (seeded property loop)', () => {
    // mulberry32: a tiny seeded PRNG so the run is repeatable.
    let seed = 0x5eed;
    const random = () => {
      seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const int = (max: number) => Math.floor(random() * (max + 1));

    for (let i = 0; i < 2000; i++) {
      const lines = Array.from({ length: 1 + int(4) }, () => ({ priceMinor: int(20_000), quantity: 1 + int(5) }));
      const m = orderMoney({
        lines,
        postageMinor: int(3_000),
        guildFeeBasisPoints: int(5_000),
        processing: { percentBasisPoints: int(2_000), fixedMinor: int(100) },
      });
      expect(m.sellerCreditMinor + m.guildFeeMinor).toBe(m.chargeMinor);
      expect(m.guildFeeMinor + m.sellerCreditMinor - m.postageMinor).toBe(m.subtotalMinor);
      const entries = ledgerEntriesForPaidOrder({ sellerId: `s${i}`, money: m });
      expect(isBalanced(entries)).toBe(true);
      for (const keepProcessingCost of [true, false]) {
        const refund = reversalEntries(entries, { keepProcessingCost });
        expect(isBalanced(refund)).toBe(true);
        expect(isBalanced([...entries, ...refund])).toBe(true);
      }
      if (m.chargeMinor > 0) {
        // A lost dispute over any part of the payment balances and never takes back more than the seller was credited.
        const amountMinor = 1 + int(m.chargeMinor - 1);
        const lost = disputeLostEntries({ sellerId: `s${i}`, amountMinor, orderEntries: entries });
        expect(isBalanced(lost)).toBe(true);
        expect(accountBalances([...entries, ...lost]).get(`seller:s${i}`) ?? 0).toBeGreaterThanOrEqual(0);
        expect(accountBalances(lost).get('processor')).toBe(amountMinor);
      }
    }
  });
});
