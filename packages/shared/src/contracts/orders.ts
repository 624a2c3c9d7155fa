import type { DisputeStage, OrderState, PostageQuote } from '../domain/index.ts';
import type { PostalAddress } from '../schemas/orders.ts';

export interface MeetingView {
  id: string;
  startsAt: string;
  place: string;
  notes: string;
  abilities: { edit: boolean };
}

export interface OrderItemView {
  bundleId: string;
  title: string;
  quantity: number;
  unitPriceMinor: number;
  weightGrams: number;
  thumbUrl: string | null;
}

export interface OrderAbilities {
  pay: boolean;
  markPosted: boolean;
  markReceived: boolean;
  cancel: boolean;
  refund: boolean;
  reportProblem: boolean;
  viewAddress: boolean;
}

export interface OrderView {
  id: string;
  reference: string;
  state: OrderState;
  fulfilment: 'post' | 'meeting';
  viewerIs: 'buyer' | 'seller' | 'officer';
  buyer: { id: string; name: string; email: string | null };
  seller: { id: string; name: string; email: string | null };
  meeting: MeetingView | null;
  /** Only for the seller of a paid order, the buyer, and the treasurer. */
  address: PostalAddress | null;
  items: OrderItemView[];
  currency: string;
  subtotalMinor: number;
  postageMinor: number;
  chargeMinor: number;
  guildFeeMinor: number | null;
  sellerCreditMinor: number | null;
  postageExplanation: string[];
  checkoutUrl: string | null;
  holdExpiresAt: string | null;
  paidAt: string | null;
  postedAt: string | null;
  trackingNumber: string | null;
  receivedAt: string | null;
  handedOverAt: string | null;
  cancelledAt: string | null;
  cancelReason: string | null;
  refundedAt: string | null;
  /** Problems the buyer reported; `message` is null for the seller, who sees only that one was reported and when. */
  problems: { id: string; message: string | null; createdAt: string; resolvedAt: string | null }[];
  createdAt: string;
  /** Only for a viewer who may refund the order (abilities.refund): what a refund would take back from the seller. */
  refundEffect: RefundEffectView | null;
  /** The cardholder's bank questioning the payment: for the treasurer in full, for the seller its stage and dates; null otherwise. */
  dispute: OrderDisputeView | null;
  abilities: OrderAbilities;
}

/** The signed-in member's basket, on the server so it follows them from device to device; oldest line first. */
export interface BasketView {
  items: { bundleId: string; quantity: number; addedAt: string }[];
}

export interface OrderDisputeView {
  stage: DisputeStage;
  openedAt: string;
  closedAt: string | null;
  /** The rest only for the treasurer (null for the seller). The card service's status (`needs_response`, `under_review`, `won`, `lost`, …). */
  status: string | null;
  /** What the bank took or may take back, in minor units of the order's currency. */
  amountMinor: number | null;
  /** The card service's reason code (`product_not_received`, …). */
  reason: string | null;
  /** The date by which the bank wants the guild's evidence, when it asked for any. */
  evidenceDueBy: string | null;
  /** The card service's fee for the dispute, the guild's cost, as the ledger holds it (0 when none stands). */
  feeMinor: number | null;
}

/**
 * The seller's side of a refund, from the ledger, in minor units of the order's currency. A seller owes the guild
 * only money they were paid out and no longer have bags behind: when their payable figure is below zero.
 */
export interface RefundEffectView {
  /** What the guild may pay the seller now (SellerBalanceView.payableMinor); below zero, what the seller owes the guild. */
  sellerPayableMinor: number;
  /**
   * The same after this refund: lower by the order's credit when its bag had gone out; unchanged when it had not,
   * since that credit was still waiting and could not have been paid out.
   */
  sellerPayableAfterMinor: number;
  /** This order's credit to the seller still standing: what the refund reverses. */
  sellerCreditMinor: number;
}

export interface PostageQuoteView extends PostageQuote {
  currency: string;
}

export interface LedgerEntryView {
  id: string;
  transactionId: string;
  createdAt: string;
  kind: string;
  reverses: string | null;
  account: string;
  accountLabel: string;
  amountMinor: number;
  currency: string;
  orderId: string | null;
  orderReference: string | null;
  payoutId: string | null;
}

/** What the guild owes one seller, from the ledger, in minor units. */
export interface SellerBalanceView {
  sellerId: string;
  name: string;
  /** Their credits less refunds. */
  creditedMinor: number;
  paidOutMinor: number;
  /** Credited less paid out: payableMinor + waitingMinor. */
  balanceMinor: number;
  /**
   * What the treasurer may pay out now: credits of orders whose bag has gone out (posted, received, handed over),
   * less every refund and payout. Below zero, the seller owes the guild (a refund came after a payout).
   */
  payableMinor: number;
  /** Credits of paid orders whose bag has not been posted or handed over yet: payable once it goes out. */
  waitingMinor: number;
  currency: string;
}

/** One thing to change hands at a meeting: a meeting order, or a starter claim. */
export interface HandoverView {
  id: string;
  kind: 'order' | 'starter';
  reference: string;
  giver: { id: string; name: string };
  collector: { id: string; name: string };
  items: { title: string; quantity: number; thumbUrl: string | null }[];
  done: boolean;
  doneAt: string | null;
  doneBy: string | null;
  checkOffUrl: string;
  qrSvg: string;
  abilities: { markDone: boolean; undo: boolean; cancel: boolean };
  /** Why a tick can no longer be undone at the door though it is the meeting's day (the seller was paid out since), and whom to ask; else null. */
  undoNote: string | null;
}

export interface WaitlistRow {
  id: string;
  position: number;
  memberId: string;
  name: string;
  status: string;
  joinedAt: string;
  waitingDays: number;
  offer: { id: string; bundleTitle: string; expiresAt: string } | null;
}
