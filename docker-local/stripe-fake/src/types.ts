/**
 * The Stripe API objects this stand-in serves, limited to the fields the SDK
 * and our API read. Amounts are integer minor units, times are Unix seconds,
 * as in Stripe's API.
 */

export type Metadata = Record<string, string>;

export interface Price {
  id: string;
  object: 'price';
  active: boolean;
  created: number;
  currency: string;
  livemode: false;
  metadata: Metadata;
  product: string;
  type: 'one_time';
  unit_amount: number;
}

export interface LineItem {
  id: string;
  object: 'item';
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  price: Price;
  quantity: number;
}

export interface List<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

export type LineItemList = List<LineItem>;

export type CheckoutSessionStatus = 'open' | 'complete' | 'expired';

export interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: null;
  customer_details: { email: string | null; name: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  locale: string | null;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: ['card'];
  payment_status: 'unpaid' | 'paid';
  status: CheckoutSessionStatus;
  submit_type: string | null;
  success_url: string;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  /** Present only while the session is open, as with Stripe's hosted page. */
  url: string | null;
}

export interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_capturable: number;
  amount_received: number;
  capture_method: 'automatic_async';
  client_secret: string;
  confirmation_method: 'automatic';
  created: number;
  currency: string;
  customer: null;
  description: string | null;
  latest_charge: string;
  livemode: false;
  metadata: Metadata;
  payment_method: string;
  payment_method_types: ['card'];
  receipt_email: string | null;
  status: 'succeeded';
}

export interface Charge {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  captured: true;
  created: number;
  currency: string;
  description: string | null;
  livemode: false;
  metadata: Metadata;
  paid: true;
  payment_intent: string;
  payment_method: string;
  payment_method_details: {
    type: 'card';
    card: { brand: 'visa'; last4: string; exp_month: number; exp_year: number; funding: 'credit'; country: 'US' };
  };
  receipt_email: string | null;
  refunded: boolean;
  /** True once the cardholder's bank has opened a dispute on it. */
  disputed: boolean;
  status: 'succeeded';
}

export type RefundReason = 'duplicate' | 'fraudulent' | 'requested_by_customer';

export interface Refund {
  id: string;
  object: 'refund';
  amount: number;
  balance_transaction: null;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: RefundReason | null;
  receipt_number: null;
  status: 'succeeded';
}

/**
 * The dispute statuses the stand-in produces: a full dispute (not an inquiry), answered or not, then decided.
 * Stripe has more (`warning_*` for inquiries, `appeal_*`, `prevented`); our API must accept those too.
 */
export type DisputeStatus = 'needs_response' | 'under_review' | 'won' | 'lost';

/** Stripe's documented values of a dispute's `reason` (the Dispute object's reference). */
export const DISPUTE_REASONS = [
  'bank_cannot_process',
  'check_returned',
  'credit_not_processed',
  'customer_initiated',
  'debit_not_authorized',
  'duplicate',
  'fraudulent',
  'general',
  'incorrect_account_details',
  'insufficient_funds',
  'noncompliant',
  'product_not_received',
  'product_unacceptable',
  'subscription_canceled',
  'unrecognized',
] as const;
export type DisputeReason = (typeof DISPUTE_REASONS)[number];

export interface Dispute {
  id: string;
  object: 'dispute';
  amount: number;
  /** The money the dispute moved: withdrawn when it opens (with the dispute fee), reinstated if the merchant wins. */
  balance_transactions: BalanceTransaction[];
  charge: string;
  created: number;
  currency: string;
  evidence_details: { due_by: number | null; has_evidence: boolean; past_due: boolean; submission_count: number };
  is_charge_refundable: boolean;
  livemode: false;
  metadata: Metadata;
  payment_intent: string;
  reason: DisputeReason;
  status: DisputeStatus;
}

/**
 * A movement of the merchant's balance, as a dispute lists them (Stripe's BalanceTransaction object, the fields a
 * dispute's movements carry). `amount` is signed (negative leaves the balance), `fee` is what the card service
 * charged on top, and `net` = `amount` − `fee`.
 */
export interface BalanceTransaction {
  id: string;
  object: 'balance_transaction';
  amount: number;
  available_on: number;
  created: number;
  currency: string;
  description: string;
  fee: number;
  fee_details: { amount: number; application: null; currency: string; description: string; type: 'stripe_fee' }[];
  net: number;
  reporting_category: 'dispute' | 'dispute_reversal';
  source: string;
  status: 'available';
  type: 'adjustment';
}

export type StripeObject = CheckoutSession | PaymentIntent | Charge | Refund | Dispute;

export type RefundList = List<Refund>;

export type EventType =
  | 'checkout.session.completed'
  | 'checkout.session.expired'
  | 'payment_intent.succeeded'
  | 'charge.refunded'
  | 'refund.created'
  | 'charge.dispute.created'
  | 'charge.dispute.updated'
  | 'charge.dispute.closed'
  | 'charge.dispute.funds_withdrawn'
  | 'charge.dispute.funds_reinstated';

export interface StripeEvent {
  id: string;
  object: 'event';
  api_version: string | null;
  created: number;
  data: { object: StripeObject };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: EventType;
}

export interface DeliveryAttempt {
  attempt: number;
  /** ISO time the attempt started. */
  at: string;
  /** HTTP status from the webhook endpoint, null when no response arrived. */
  status: number | null;
  error: string | null;
  durationMs: number;
  /** True for attempts made through the resend control endpoint. */
  resend: boolean;
}

/** `withheld`: a test asked for the event to be logged but not sent, as if every delivery had been lost. */
export type DeliveryState = 'pending' | 'delivered' | 'failed' | 'no_endpoint' | 'withheld';

export interface EventLogEntry {
  event: StripeEvent;
  state: DeliveryState;
  attempts: DeliveryAttempt[];
}

/** Origin of an API call, copied onto the events it causes (as Stripe does). */
export interface RequestContext {
  requestId: string | null;
  idempotencyKey: string | null;
  apiVersion: string | null;
}
