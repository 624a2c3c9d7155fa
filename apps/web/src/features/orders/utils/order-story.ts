import { formatMoney, type OrderView } from '@scrap-relay/shared';

/** What happened to an order, in time order, and what happens next: pure, so the wording per state is tested. */

export interface TimelineEvent {
  key: string;
  at: string;
  title: string;
  detail?: string;
}

// Same-moment events keep the order things happen in (a free order is placed and confirmed at once).
const RANK = ['placed', 'paid', 'posted', 'handed-over', 'received', 'problem', 'cancelled', 'refunded'];
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
      detail: problem.message,
    });
  }
  if (order.cancelledAt) {
    events.push({ key: 'cancelled', at: order.cancelledAt, title: 'Cancelled', ...(order.cancelReason ? { detail: order.cancelReason } : {}) });
  }
  if (order.refundedAt) {
    events.push({ key: 'refunded', at: order.refundedAt, title: 'Refunded', detail: `${formatMoney(order.chargeMinor, order.currency)} back to the card` });
  }
  return events.sort((a, b) => a.at.localeCompare(b.at) || rankOf(a.key) - rankOf(b.key));
}

/** One or two sentences for the top of the order page, from where the viewer stands. */
export function orderNextStep(order: OrderView): string {
  const buyer = order.viewerIs === 'buyer';
  const seller = order.viewerIs === 'seller';
  switch (order.state) {
    case 'awaiting_payment':
      return buyer
        ? 'Waiting for your card payment.'
        : `Waiting for ${order.buyer.name}’s card payment. Nothing to do yet.`;
    case 'confirmed':
      if (order.fulfilment === 'meeting') {
        return seller ? 'Confirmed. Bring the bundles to the meeting below, in a bag labelled with the order reference.' : 'Confirmed. Collect the bundles at the meeting below.';
      }
      return seller
        ? 'Paid. Pack the bundles, print the packing slip, post them to the address below, then mark the order posted.'
        : `Paid. ${order.seller.name} will post it to you.`;
    case 'posted':
      return buyer ? 'On its way. Mark it received when it arrives.' : `Posted. Waiting for ${order.buyer.name} to say it arrived.`;
    case 'received':
      return 'Received. Thank you for passing fabric on.';
    case 'handed_over':
      return 'Handed over at the meeting.';
    case 'cancelled':
      return order.refundedAt ? 'Cancelled, and the card payment was refunded in full.' : 'Cancelled. Nothing was charged.';
    case 'refunded':
      return 'Refunded in full to the card it was paid with.';
  }
}
