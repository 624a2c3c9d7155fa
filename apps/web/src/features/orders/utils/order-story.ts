import { disputeReasonLabel, formatMoney, type OrderView } from '@scrap-relay/shared';

/** What happened to an order, in time order, and what happens next: pure, so the wording per state is tested. */

export interface TimelineEvent {
  key: string;
  at: string;
  title: string;
  detail?: string;
}

// Same-moment events keep the order things happen in (a free order is placed and confirmed at once). A moment is
// a whole second: the card service stamps a dispute in whole seconds, the guild's own records in milliseconds.
const RANK = ['placed', 'paid', 'posted', 'handed-over', 'received', 'problem', 'cancelled', 'refunded', 'dispute-opened', 'dispute-closed'];
const rankOf = (key: string) => RANK.indexOf(key.split(':')[0] ?? key);

export function orderTimeline(order: OrderView): TimelineEvent[] {
  const events: TimelineEvent[] = [{ key: 'placed', at: order.createdAt, title: 'Order placed' }];
  if (order.paidAt) {
    events.push(
      order.chargeMinor > 0
        ? { key: 'paid', at: order.paidAt, title: 'Paid', detail: `${formatMoney(order.chargeMinor, order.currency)} by card` }
        : { key: 'paid', at: order.paidAt, title: 'Confirmed', detail: 'Nothing to pay' },
    );
  }
  if (order.postedAt) {
    events.push({
      key: 'posted',
      at: order.postedAt,
      title: 'Posted',
      detail: order.trackingNumber ? `Tracking number ${order.trackingNumber}` : 'No tracking number given',
    });
  }
  if (order.handedOverAt) events.push({ key: 'handed-over', at: order.handedOverAt, title: 'Handed over at the meeting' });
  if (order.receivedAt) events.push({ key: 'received', at: order.receivedAt, title: 'Received' });
  for (const problem of order.problems) {
    events.push({
      key: `problem:${problem.id}`,
      at: problem.createdAt,
      title: problem.resolvedAt ? 'Problem reported (resolved)' : 'Problem reported',
      detail: problem.message ?? 'The buyer wrote to the guild’s treasurer.',
    });
  }
  if (order.cancelledAt) {
    events.push({ key: 'cancelled', at: order.cancelledAt, title: 'Cancelled', ...(order.cancelReason ? { detail: order.cancelReason } : {}) });
  }
  if (order.refundedAt) {
    events.push({ key: 'refunded', at: order.refundedAt, title: 'Refunded', detail: `${formatMoney(order.chargeMinor, order.currency)} back to the card` });
  }
  if (order.dispute) events.push(...disputeEvents(order, order.dispute));
  // Oldest first, and the order is always placed first: a free order's confirmation is stamped a moment
  // before the order row itself, so by the clock alone it would come first.
  const [placed, ...rest] = events;
  const second = (iso: string) => iso.slice(0, 19);
  return [placed!, ...rest.sort((a, b) => second(a.at).localeCompare(second(b.at)) || rankOf(a.key) - rankOf(b.key))];
}

const DISPUTE_ENDINGS = {
  won: 'The bank decided the dispute for the guild',
  lost: 'The bank decided the dispute for the buyer and took the payment back',
  closed: 'The bank closed its questions about the payment',
} as const;

/** A dispute's opening and its end; the amount and reason only for the treasurer, whose view carries them. */
function disputeEvents(order: OrderView, dispute: NonNullable<OrderView['dispute']>): TimelineEvent[] {
  const events: TimelineEvent[] = [
    {
      key: 'dispute-opened',
      at: dispute.openedAt,
      title: 'The buyer’s bank disputed the card payment',
      ...(dispute.amountMinor !== null && dispute.reason !== null
        ? { detail: `${formatMoney(dispute.amountMinor, order.currency)}: ${disputeReasonLabel(dispute.reason)}` }
        : {}),
    },
  ];
  if (dispute.closedAt && dispute.stage !== 'open') events.push({ key: 'dispute-closed', at: dispute.closedAt, title: DISPUTE_ENDINGS[dispute.stage] });
  return events;
}

/**
 * The label over the postal address on a posted order, in the tense of where the parcel is: it has not gone
 * while the order waits for payment or for the seller, it went once posted, and it never will once cancelled.
 */
export function postingAddressLabel(order: Pick<OrderView, 'state' | 'viewerIs' | 'postedAt'>): string {
  const toYou = order.viewerIs === 'buyer';
  if (order.postedAt) return toYou ? 'Posted to you at' : 'Posted to';
  switch (order.state) {
    case 'cancelled':
    case 'refunded':
      return toYou ? 'Was to be posted to you at' : 'Was to be posted to';
    case 'awaiting_payment':
    case 'confirmed':
      if (order.viewerIs === 'seller') return order.state === 'confirmed' ? 'Post to' : 'Will be posted to';
      return toYou ? 'Will be posted to you at' : 'Will be posted to';
    default:
      return toYou ? 'By post to you at' : 'By post to';
  }
}

/**
 * While the buyer's bank questions the payment, or after it took the payment back, the seller and the treasurer
 * (the only ones shown the dispute) read that first: bundles not yet out wait for the treasurer's word.
 */
function disputeNextStep(order: OrderView): string | null {
  const stage = order.dispute?.stage;
  if (stage !== 'open' && stage !== 'lost') return null;
  if (order.refundedAt) {
    // Refunded before the bank acted: the buyer was paid back twice, and the guild bears it.
    if (stage === 'open') return null;
    return order.viewerIs === 'seller'
      ? 'The order was refunded before the buyer’s bank took the payment back: nothing changes for you.'
      : 'The buyer’s bank took back a payment the guild had already refunded: the guild bears it.';
  }
  const waiting = order.state === 'confirmed';
  const give = order.fulfilment === 'post' ? 'send them' : 'bring them to the meeting';
  if (stage === 'open') {
    if (!waiting) return null;
    return order.viewerIs === 'seller'
      ? `The buyer’s bank is questioning the payment. Keep the bundles until the treasurer tells you whether to ${give}.`
      : `The buyer’s bank is questioning the payment. ${order.seller.name} keeps the bundles until you say whether to ${give}.`;
  }
  if (waiting) {
    return order.viewerIs === 'seller'
      ? `The buyer’s bank took the payment back. Keep the bundles until the treasurer tells you what to do with them.`
      : `The buyer’s bank took the payment back. ${order.seller.name} keeps the bundles until you say what to do with them; cancelling the order puts them back on the shelf.`;
  }
  if (order.state === 'cancelled') return 'Cancelled after the buyer’s bank took the payment back. The bundles are back on the shelf.';
  return order.viewerIs === 'seller'
    ? 'The buyer’s bank took the payment back after the bundles went out, and your credit for this order with it.'
    : 'The buyer’s bank took the payment back after the bundles went out.';
}

/**
 * One or two sentences for the top of the order page, from where the viewer stands:
 * the buyer, the seller (who is thanked for passing fabric on), or an officer looking in.
 */
export function orderNextStep(order: OrderView): string {
  const { viewerIs, buyer, seller } = order;
  const disputed = disputeNextStep(order);
  if (disputed) return disputed;
  switch (order.state) {
    case 'awaiting_payment':
      if (viewerIs === 'buyer') return 'Waiting for your card payment.';
      return viewerIs === 'seller' ? `Waiting for ${buyer.name}’s card payment. Nothing to do yet.` : `Waiting for ${buyer.name}’s card payment.`;
    case 'confirmed':
      if (order.fulfilment === 'meeting') {
        if (viewerIs === 'seller') return 'Confirmed. Bring the bundles to the meeting below, in a bag labelled with the order reference.';
        return viewerIs === 'buyer' ? 'Confirmed. Collect the bundles at the meeting below.' : `Confirmed. ${seller.name} hands the bundles to ${buyer.name} at the meeting below.`;
      }
      if (viewerIs === 'seller') return 'Paid. Pack the bundles, print the packing slip, post them to the address below, then mark the order posted.';
      return viewerIs === 'buyer' ? `Paid. ${seller.name} will post it to you.` : `Paid. Waiting for ${seller.name} to post it.`;
    case 'posted':
      return viewerIs === 'buyer' ? 'On its way. Mark it received when it arrives.' : `Posted. Waiting for ${buyer.name} to say it arrived.`;
    case 'received':
      if (viewerIs === 'seller') return `Received by ${buyer.name}. Thank you for passing fabric on.`;
      return viewerIs === 'buyer' ? 'Received. Enjoy your new fabric.' : `Received by ${buyer.name}.`;
    case 'handed_over':
      if (viewerIs === 'seller') return `Handed over to ${buyer.name} at the meeting. Thank you for passing fabric on.`;
      return viewerIs === 'buyer' ? 'Collected at the meeting. Enjoy your new fabric.' : `Handed over to ${buyer.name} at the meeting.`;
    case 'cancelled':
      if (order.refundedAt) return 'Cancelled, and the card payment was refunded in full.';
      // Paid, never refunded by the guild: the buyer's bank returned the payment in a dispute.
      if (order.paidAt && order.chargeMinor > 0) {
        return viewerIs === 'buyer' ? 'Cancelled. Your bank has returned the payment to your card.' : 'Cancelled. The buyer’s bank returned the payment.';
      }
      return 'Cancelled. Nothing was charged.';
    case 'refunded':
      return 'Refunded in full to the card it was paid with.';
  }
}
