import type { OrderView } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import { makeOrderView } from '../../../testing/orders.ts';
import { orderNextStep, orderTimeline, postingAddressLabel } from './order-story.ts';

const base = makeOrderView();

describe('order timeline', () => {
  it('lists what happened in time order, with the tracking number and money', () => {
    const order: OrderView = {
      ...base,
      state: 'received',
      paidAt: '2026-11-02T10:05:00.000Z',
      postedAt: '2026-11-03T09:00:00.000Z',
      trackingNumber: 'FERN-2231',
      receivedAt: '2026-11-06T16:00:00.000Z',
    };
    expect(orderTimeline(order).map((e) => [e.title, e.detail])).toEqual([
      ['Order placed', undefined],
      ['Paid', '$19.30 by card'],
      ['Posted', 'Tracking number FERN-2231'],
      ['Received', undefined],
    ]);
  });

  it('calls a free order confirmed, not paid, even when placed and confirmed in the same moment', () => {
    const at = '2026-11-02T10:00:00.000Z';
    const order: OrderView = { ...base, state: 'confirmed', fulfilment: 'meeting', chargeMinor: 0, subtotalMinor: 0, postageMinor: 0, paidAt: at, createdAt: at };
    expect(orderTimeline(order).map((e) => e.title)).toEqual(['Order placed', 'Confirmed']);
  });

  it('puts the order first even when its free confirmation was stamped a moment before the order itself', () => {
    const order: OrderView = {
      ...base,
      state: 'confirmed',
      fulfilment: 'meeting',
      chargeMinor: 0,
      subtotalMinor: 0,
      postageMinor: 0,
      paidAt: '2026-12-02T18:24:09.118Z',
      createdAt: '2026-12-02T18:24:09.121Z',
    };
    expect(orderTimeline(order).map((e) => e.title)).toEqual(['Order placed', 'Confirmed']);
  });

  it('shows a reported problem and the refund that followed it', () => {
    const order: OrderView = {
      ...base,
      state: 'refunded',
      paidAt: '2026-11-02T10:05:00.000Z',
      postedAt: '2026-11-03T09:00:00.000Z',
      problems: [{ id: 'p-1', message: 'The bag arrived soaked.', createdAt: '2026-11-05T12:00:00.000Z', resolvedAt: '2026-11-06T08:00:00.000Z' }],
      refundedAt: '2026-11-06T08:00:00.000Z',
    };
    const events = orderTimeline(order);
    expect(events.map((e) => e.title)).toEqual(['Order placed', 'Paid', 'Posted', 'Problem reported (resolved)', 'Refunded']);
    expect(events.at(-1)?.detail).toBe('$19.30 back to the card');
  });

  it('gives the cancellation reason', () => {
    const order: OrderView = { ...base, state: 'cancelled', cancelledAt: '2026-11-02T11:00:00.000Z', cancelReason: 'Found a moth hole' };
    expect(orderTimeline(order).at(-1)).toMatchObject({ title: 'Cancelled', detail: 'Found a moth hole' });
  });
});

describe('what happens next', () => {
  it('tells the seller of a paid posted order to pack and post it, and the buyer to wait', () => {
    const paid: OrderView = { ...base, state: 'confirmed', paidAt: '2026-11-02T10:05:00.000Z' };
    expect(orderNextStep({ ...paid, viewerIs: 'seller' })).toMatch(/^Paid\. Pack the bundles/);
    expect(orderNextStep(paid)).toBe('Paid. Orla Vance will post it to you.');
  });

  it('asks the buyer to mark a posted order received', () => {
    expect(orderNextStep({ ...base, state: 'posted' })).toBe('On its way. Mark it received when it arrives.');
    expect(orderNextStep({ ...base, state: 'posted', viewerIs: 'seller' })).toBe('Posted. Waiting for Maud Tilling to say it arrived.');
  });

  it('thanks the seller for a received order, and wishes the buyer joy of the fabric instead', () => {
    const received: OrderView = { ...base, state: 'received', receivedAt: '2026-11-06T16:00:00.000Z' };
    expect(orderNextStep({ ...received, viewerIs: 'seller' })).toBe('Received by Maud Tilling. Thank you for passing fabric on.');
    expect(orderNextStep(received)).toBe('Received. Enjoy your new fabric.');
    expect(orderNextStep({ ...received, viewerIs: 'officer' })).toBe('Received by Maud Tilling.');
  });

  it('words a meeting handover for each side, thanking only the giver', () => {
    const handedOver: OrderView = { ...base, state: 'handed_over', fulfilment: 'meeting', handedOverAt: '2026-11-10T19:30:00.000Z' };
    expect(orderNextStep({ ...handedOver, viewerIs: 'seller' })).toBe('Handed over to Maud Tilling at the meeting. Thank you for passing fabric on.');
    expect(orderNextStep(handedOver)).toBe('Collected at the meeting. Enjoy your new fabric.');
    expect(orderNextStep({ ...handedOver, viewerIs: 'officer' })).toBe('Handed over to Maud Tilling at the meeting.');
  });

  it('tells an officer looking in who does what next, never “you”', () => {
    const officer = (order: Partial<OrderView>) => orderNextStep({ ...base, viewerIs: 'officer', ...order });
    expect(officer({})).toBe('Waiting for Maud Tilling’s card payment.');
    expect(officer({ state: 'confirmed' })).toBe('Paid. Waiting for Orla Vance to post it.');
    expect(officer({ state: 'confirmed', fulfilment: 'meeting' })).toBe('Confirmed. Orla Vance hands the bundles to Maud Tilling at the meeting below.');
    expect(officer({ state: 'posted' })).toBe('Posted. Waiting for Maud Tilling to say it arrived.');
  });

  it('says whether a cancelled order was refunded', () => {
    expect(orderNextStep({ ...base, state: 'cancelled' })).toBe('Cancelled. Nothing was charged.');
    expect(orderNextStep({ ...base, state: 'cancelled', refundedAt: '2026-11-02T11:00:00.000Z' })).toMatch(/refunded in full/);
  });
});

describe('the label over the postal address', () => {
  const posted = (order: Partial<OrderView>) => postingAddressLabel({ ...base, ...order });

  it('never says the parcel went before it did', () => {
    expect(posted({ state: 'awaiting_payment' })).toBe('Will be posted to you at');
    expect(posted({ state: 'confirmed', paidAt: '2026-11-02T10:05:00.000Z' })).toBe('Will be posted to you at');
    expect(posted({ state: 'confirmed', viewerIs: 'seller' })).toBe('Post to');
    expect(posted({ state: 'confirmed', viewerIs: 'officer' })).toBe('Will be posted to');
  });

  it('says it was posted once it was', () => {
    expect(posted({ state: 'posted', postedAt: '2026-11-03T09:00:00.000Z' })).toBe('Posted to you at');
    expect(posted({ state: 'received', postedAt: '2026-11-03T09:00:00.000Z', viewerIs: 'seller' })).toBe('Posted to');
    expect(posted({ state: 'refunded', postedAt: '2026-11-03T09:00:00.000Z' })).toBe('Posted to you at');
  });

  it('says it was only ever meant to go when the order ended first', () => {
    expect(posted({ state: 'cancelled', cancelledAt: '2026-11-02T11:00:00.000Z' })).toBe('Was to be posted to you at');
    expect(posted({ state: 'cancelled', viewerIs: 'seller' })).toBe('Was to be posted to');
    expect(posted({ state: 'refunded', refundedAt: '2026-11-02T11:00:00.000Z', viewerIs: 'officer' })).toBe('Was to be posted to');
  });
});

describe('a disputed payment in the timeline', () => {
  const paid: OrderView = { ...base, state: 'posted', viewerIs: 'officer', paidAt: '2026-11-02T10:05:00.250Z', postedAt: '2026-11-03T09:00:00.000Z' };

  it('tells the treasurer when the bank opened it, for how much and why, and how it ended', () => {
    const order: OrderView = {
      ...paid,
      dispute: {
        stage: 'lost',
        status: 'lost',
        amountMinor: 1930,
        reason: 'product_unacceptable',
        openedAt: '2026-11-20T17:00:00.000Z',
        evidenceDueBy: null,
        feeMinor: 1500,
        closedAt: '2026-12-10T18:00:00.000Z',
      },
    };
    expect(orderTimeline(order).map((e) => [e.title, e.detail])).toEqual([
      ['Order placed', undefined],
      ['Paid', '$19.30 by card'],
      ['Posted', 'No tracking number given'],
      ['The buyer’s bank disputed the card payment', '$19.30: The buyer says the bundles were not as described'],
      ['The bank decided the dispute for the buyer and took the payment back', undefined],
    ]);
  });

  it('gives the seller the opening without the bank’s details, after the payment even within the same second', () => {
    // The card service stamps whole seconds: 10:05:00 is the same moment as the payment at 10:05:00.250.
    const order: OrderView = {
      ...paid,
      viewerIs: 'seller',
      postedAt: null,
      dispute: { stage: 'open', status: null, amountMinor: null, reason: null, evidenceDueBy: null, feeMinor: null, openedAt: '2026-11-02T10:05:00.000Z', closedAt: null },
    };
    expect(orderTimeline(order).map((e) => [e.title, e.detail])).toEqual([
      ['Order placed', undefined],
      ['Paid', '$19.30 by card'],
      ['The buyer’s bank disputed the card payment', undefined],
    ]);
  });
});

describe('what happens next, once the buyer’s bank has acted', () => {
  const lost = { stage: 'lost', status: null, amountMinor: null, reason: null, evidenceDueBy: null, feeMinor: null, openedAt: '2026-11-20T17:00:00.000Z', closedAt: '2026-12-10T18:00:00.000Z' } as const;

  it('tells the buyer of a cancelled order that their bank returned the payment, not that nothing was charged', () => {
    const cancelled = makeOrderView({ state: 'cancelled', viewerIs: 'buyer', paidAt: '2026-11-02T10:05:00.000Z', refundedAt: null, dispute: null });
    expect(orderNextStep(cancelled)).toBe('Cancelled. Your bank has returned the payment to your card.');
    expect(orderNextStep({ ...cancelled, paidAt: null })).toBe('Cancelled. Nothing was charged.');
  });

  it('keeps unsent bundles with the seller until the treasurer says, and says who bears a payment refunded twice', () => {
    const waiting = makeOrderView({ state: 'confirmed', viewerIs: 'seller', paidAt: '2026-11-02T10:05:00.000Z', dispute: lost });
    expect(orderNextStep(waiting)).toBe('The buyer’s bank took the payment back. Keep the bundles until the treasurer tells you what to do with them.');
    const refundedFirst = makeOrderView({ state: 'refunded', viewerIs: 'officer', paidAt: '2026-11-02T10:05:00.000Z', refundedAt: '2026-11-05T10:00:00.000Z', dispute: lost });
    expect(orderNextStep(refundedFirst)).toBe('The buyer’s bank took back a payment the guild had already refunded: the guild bears it.');
  });
});
