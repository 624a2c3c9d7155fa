import { disputeStage, type OrderState } from '@scrap-relay/shared';
import type { Actor } from './index.ts';

/** `dispute`: the bank's dispute of the payment, when the record was read with it (refunding and cancelling need it). */
type OrderRecord = {
  buyerId: string;
  sellerId: string;
  state: OrderState;
  fulfilment: 'post' | 'meeting';
  chargeMinor: number;
  dispute?: { status: string; amountMinor?: number } | null;
};

const isBuyer = (a: Actor, o?: OrderRecord) => o !== undefined && o.buyerId === a.id;
const isSeller = (a: Actor, o?: OrderRecord) => o !== undefined && o.sellerId === a.id;
const isTreasurer = (a: Actor) => a.roles.includes('treasurer');
const isMeetingKeeper = (a: Actor) => a.roles.includes('admin') || a.roles.includes('librarian');
const PAID: OrderState[] = ['confirmed', 'posted', 'received', 'handed_over'];
/** While a bank disputes the payment, or once it has taken it back, the card service refuses a refund. */
const paymentDisputed = (o?: OrderRecord) => o?.dispute != null && ['open', 'lost'].includes(disputeStage(o.dispute.status));
/**
 * The bank took the whole payment back before the bundles went out: there is nothing to refund, and the order waits
 * on the treasurer. (After a dispute over part of the payment, the rest is still the guild's to settle by hand.)
 */
export const takenBackBeforeSent = (o?: OrderRecord) =>
  o?.dispute != null && disputeStage(o.dispute.status) === 'lost' && o.state === 'confirmed' && (o.dispute.amountMinor ?? 0) >= o.chargeMinor;

export const orderPolicy = {
  'order.view': (a: Actor, o?: OrderRecord) => isBuyer(a, o) || isSeller(a, o) || isTreasurer(a),
  'order.pay': (a: Actor, o?: OrderRecord) => isBuyer(a, o) && o!.state === 'awaiting_payment',
  /**
   * The address is the buyer's own, and reaches the seller only while the order is paid (or confirmed free) and
   * not cancelled or refunded. Officers never see it: the treasurer refunds and pays out without it.
   */
  'order.viewAddress': (a: Actor, o?: OrderRecord) => isBuyer(a, o) || (isSeller(a, o) && PAID.includes(o!.state)),
  // Not once the buyer's bank has taken the whole payment back: the treasurer decides what happens to the bundles.
  'order.markPosted': (a: Actor, o?: OrderRecord) => isSeller(a, o) && o!.fulfilment === 'post' && o!.state === 'confirmed' && !takenBackBeforeSent(o),
  'order.markReceived': (a: Actor, o?: OrderRecord) => isBuyer(a, o) && o!.state === 'posted',
  'order.cancel': (a: Actor, o?: OrderRecord) =>
    // The treasurer closes an order whose payment the buyer's bank took back before the bundles went out.
    (isTreasurer(a) && takenBackBeforeSent(o)) ||
    (!paymentDisputed(o) &&
      (((isBuyer(a, o) || isSeller(a, o)) && (o!.state === 'awaiting_payment' || o!.state === 'confirmed')) ||
        // The librarian cancels a meeting handover that did not happen.
        (isMeetingKeeper(a) && o !== undefined && o.fulfilment === 'meeting' && o.state === 'confirmed'))),
  'order.reportProblem': (a: Actor, o?: OrderRecord) => isBuyer(a, o) && (o!.state === 'posted' || o!.state === 'received'),
  'order.refund': (a: Actor, o?: OrderRecord) => isTreasurer(a) && o !== undefined && o.chargeMinor > 0 && PAID.includes(o.state) && !paymentDisputed(o),
  /** That the buyer's bank disputes the payment, and how it ended: the seller, whose credit it concerns, and the treasurer. */
  'order.viewDispute': (a: Actor, o?: OrderRecord) => isSeller(a, o) || isTreasurer(a),
  /** Its amount, reason and deadline: the treasurer, who answers it. */
  'order.viewDisputeDetails': (a: Actor, _o?: OrderRecord) => isTreasurer(a),
  'ledger.view': (a: Actor, _o?: undefined) => isTreasurer(a),
  'payout.record': (a: Actor, _o?: undefined) => isTreasurer(a),
  'postage.manage': (a: Actor, _o?: undefined) => a.roles.includes('admin'),
  'meeting.manage': (a: Actor, _o?: undefined) => isMeetingKeeper(a),
};
