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

export type StripeObject = CheckoutSession | PaymentIntent | Charge | Refund;

export type RefundList = List<Refund>;

export type EventType =
  | 'checkout.session.completed'
  | 'checkout.session.expired'
  | 'payment_intent.succeeded'
  | 'charge.refunded'
  | 'refund.created';

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
