/**
 * Everything the stand-in knows, kept in memory: a restart (or /_control/reset)
 * forgets every session, payment and event.
 */
import type { Charge, CheckoutSession, Dispute, EventLogEntry, LineItem, Metadata, PaymentIntent, Refund } from './types.ts';

export interface SessionRecord {
  session: CheckoutSession;
  lineItems: LineItem[];
  /** What Stripe copies onto the PaymentIntent once the session is paid. */
  paymentIntentData: { metadata: Metadata; description: string | null; receiptEmail: string | null };
  /** Stripe-Version of the request that made the session; events about it carry it. */
  apiVersion: string | null;
}

export interface SavedResponse {
  /** Method, path and canonical parameters of the first request with this key. */
  fingerprint: string;
  status: number;
  body: unknown;
}

export class FakeStore {
  readonly sessions = new Map<string, SessionRecord>();
  readonly paymentIntents = new Map<string, PaymentIntent>();
  readonly charges = new Map<string, Charge>();
  readonly refunds = new Map<string, Refund>();
  readonly disputes = new Map<string, Dispute>();
  /** Insertion order is creation order; the control endpoint lists them that way. */
  readonly events = new Map<string, EventLogEntry>();
  /** Keyed by API key and Idempotency-Key, as Stripe scopes keys per account. */
  readonly idempotency = new Map<string, SavedResponse>();

  reset(): void {
    this.sessions.clear();
    this.paymentIntents.clear();
    this.charges.clear();
    this.refunds.clear();
    this.disputes.clear();
    this.events.clear();
    this.idempotency.clear();
  }

  refundsForCharge(chargeId: string): Refund[] {
    return [...this.refunds.values()].filter((refund) => refund.charge === chargeId);
  }

  /** A charge has at most one dispute, as with Stripe. */
  disputeForCharge(chargeId: string): Dispute | undefined {
    return [...this.disputes.values()].find((dispute) => dispute.charge === chargeId);
  }
}
