import type { OrderState, PostageQuote } from '../domain/index.ts';
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
  problems: { id: string; message: string; createdAt: string; resolvedAt: string | null }[];
  createdAt: string;
  /** Only for a viewer who may refund the order (abilities.refund): what a refund would take back from the seller. */
  refundEffect: RefundEffectView | null;
  abilities: OrderAbilities;
}

/** The seller's side of a refund, from the ledger, in minor units of the order's currency. */
export interface RefundEffectView {
  /** What the guild owes the seller now: credits less refunds and payouts (below zero, the seller owes the guild). */
  sellerBalanceMinor: number;
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

export interface SellerBalanceView {
  sellerId: string;
  name: string;
  creditedMinor: number;
  paidOutMinor: number;
  balanceMinor: number;
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
