import { disputeStage, type MeetingView, type OrderDisputeView, type OrderView, type RefundEffectView } from '@scrap-relay/shared';
import type { Meeting, Order, OrderDispute } from '../../db/models/index.ts';
import { can, type Actor } from '../../policies/index.ts';

export function presentMeeting(meeting: Meeting, viewer: Actor): MeetingView {
  return {
    id: meeting.id,
    startsAt: meeting.startsAt.toISOString(),
    place: meeting.place,
    notes: meeting.notes,
    abilities: { edit: can(viewer, 'meeting.manage') },
  };
}

const iso = (d: Date | null | undefined) => d?.toISOString() ?? null;

/** The bank's dispute of the payment: its stage and dates to the seller, everything to the treasurer, nothing to anyone else. */
function presentDispute(order: Order, viewer: Actor): OrderDisputeView | null {
  const dispute: OrderDispute | null | undefined = order.dispute;
  if (!dispute || !can(viewer, 'order.viewDispute', order)) return null;
  const details = can(viewer, 'order.viewDisputeDetails', order);
  return {
    stage: disputeStage(dispute.status),
    openedAt: dispute.openedAt.toISOString(),
    closedAt: iso(dispute.closedAt),
    status: details ? dispute.status : null,
    amountMinor: details ? dispute.amountMinor : null,
    reason: details ? dispute.reason : null,
    evidenceDueBy: details ? iso(dispute.evidenceDueBy) : null,
    feeMinor: details ? dispute.feeMinor : null,
  };
}

/** What the presenter needs besides the order, read for a whole list at once. */
export interface OrderExtras {
  /** Each bundle's first photo thumbnail, by bundle id. */
  thumbs?: Map<string, string | null>;
  /** By order id, for the orders the viewer may refund (ledger's refundEffects). */
  refundEffects?: Map<string, RefundEffectView>;
}

/** Chooses every field for this viewer: the address only when policy allows, e-mail only to the other party of a paid order. */
export function presentOrder(order: Order, viewer: Actor, { thumbs = new Map(), refundEffects = new Map() }: OrderExtras = {}): OrderView {
  const viewerIs = order.buyerId === viewer.id ? 'buyer' : order.sellerId === viewer.id ? 'seller' : 'officer';
  const paid = order.paidAt !== null;
  const seesMoneySplit = viewerIs !== 'buyer';
  return {
    id: order.id,
    reference: order.reference,
    state: order.state,
    fulfilment: order.fulfilment,
    viewerIs,
    buyer: { id: order.buyerId, name: order.buyer?.name ?? '', email: paid && viewerIs !== 'buyer' ? (order.buyer?.email ?? null) : null },
    seller: { id: order.sellerId, name: order.seller?.name ?? '', email: paid && viewerIs !== 'seller' ? (order.seller?.email ?? null) : null },
    meeting: order.meeting ? presentMeeting(order.meeting, viewer) : null,
    address: can(viewer, 'order.viewAddress', order) ? order.address : null,
    items: (order.items ?? []).map((i) => ({
      bundleId: i.bundleId,
      title: i.title,
      quantity: i.quantity,
      unitPriceMinor: i.unitPriceMinor,
      weightGrams: i.weightGrams,
      thumbUrl: thumbs.get(i.bundleId) ?? null,
    })),
    currency: order.currency,
    subtotalMinor: order.subtotalMinor,
    postageMinor: order.postageMinor,
    chargeMinor: order.chargeMinor,
    guildFeeMinor: seesMoneySplit ? order.guildFeeMinor : null,
    sellerCreditMinor: seesMoneySplit ? order.sellerCreditMinor : null,
    postageExplanation: order.postageQuote?.explanation ?? [],
    checkoutUrl: can(viewer, 'order.pay', order) ? order.checkoutUrl : null,
    holdExpiresAt: iso(order.holdExpiresAt),
    paidAt: iso(order.paidAt),
    postedAt: iso(order.postedAt),
    trackingNumber: order.trackingNumber,
    receivedAt: iso(order.receivedAt),
    handedOverAt: iso(order.handedOverAt),
    cancelledAt: iso(order.cancelledAt),
    cancelReason: order.cancelReason,
    refundedAt: iso(order.refundedAt),
    // The seller sees that a problem was reported and when, not what the buyer wrote: that is for the treasurer.
    problems: (order.problems ?? []).map((p) => ({
      id: p.id,
      message: viewerIs === 'seller' && !viewer.roles.includes('treasurer') ? null : p.message,
      createdAt: p.createdAt.toISOString(),
      resolvedAt: iso(p.resolvedAt),
    })),
    createdAt: order.createdAt.toISOString(),
    refundEffect: can(viewer, 'order.refund', order) ? (refundEffects.get(order.id) ?? null) : null,
    dispute: presentDispute(order, viewer),
    abilities: {
      pay: can(viewer, 'order.pay', order),
      markPosted: can(viewer, 'order.markPosted', order),
      markReceived: can(viewer, 'order.markReceived', order),
      cancel: can(viewer, 'order.cancel', order),
      refund: can(viewer, 'order.refund', order),
      reportProblem: can(viewer, 'order.reportProblem', order),
      viewAddress: can(viewer, 'order.viewAddress', order),
    },
  };
}
