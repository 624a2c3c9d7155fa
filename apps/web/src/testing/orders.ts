import type { OrderView } from '@scrap-relay/shared';

/** An order by post, awaiting payment, as its buyer sees it (invented people); `overrides` move it along. */
export function makeOrderView(overrides: Partial<OrderView> = {}): OrderView {
  return {
    id: 'o-1',
    reference: 'SR-7QK2',
    state: 'awaiting_payment',
    fulfilment: 'post',
    viewerIs: 'buyer',
    buyer: { id: 'b-1', name: 'Maud Tilling', email: null },
    seller: { id: 's-1', name: 'Orla Vance', email: null },
    meeting: null,
    address: null,
    items: [{ bundleId: 'x', title: 'Dark 5-inch squares', quantity: 1, unitPriceMinor: 1200, weightGrams: 454, thumbUrl: null }],
    currency: 'USD',
    subtotalMinor: 1200,
    postageMinor: 730,
    chargeMinor: 1930,
    guildFeeMinor: null,
    sellerCreditMinor: null,
    postageExplanation: [],
    checkoutUrl: null,
    holdExpiresAt: null,
    paidAt: null,
    postedAt: null,
    trackingNumber: null,
    receivedAt: null,
    handedOverAt: null,
    cancelledAt: null,
    cancelReason: null,
    refundedAt: null,
    problems: [],
    createdAt: '2026-11-02T10:00:00.000Z',
    refundEffect: null,
    abilities: { pay: false, markPosted: false, markReceived: false, cancel: false, refund: false, reportProblem: false, viewAddress: false },
    ...overrides,
  };
}
