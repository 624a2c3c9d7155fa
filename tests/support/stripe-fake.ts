import { serviceEnv } from './services.ts';

/** Test controls of the Stripe stand-in (docker-local/stripe-fake), for paying without a browser and replaying events. */
async function control<T>(method: 'GET' | 'POST', path: string, body?: unknown): Promise<{ status: number; body: T }> {
  const res = await fetch(`${serviceEnv().stripeFakeUrl}/_control${path}`, {
    method,
    headers: body ? { 'content-type': 'application/json' } : {},
    body: body ? JSON.stringify(body) : undefined,
  });
  return { status: res.status, body: (await res.json()) as T };
}

export const sessionIdFromUrl = (url: string) => url.split('/').pop()!;

export const payCheckout = (sessionId: string, card = '4242 4242 4242 4242', options: { withholdEvents?: boolean } = {}) =>
  control<{ status: string; payment_status: string; error?: { code: string } }>('POST', `/checkout/sessions/${sessionId}/pay`, { card, ...options });

export interface FakeEvent {
  id: string;
  type: string;
  object_id: string;
  state: string;
  attempts: { status: number | null; resend: boolean }[];
}

export const stripeEvents = async (type?: string) => (await control<{ data: FakeEvent[] }>('GET', `/events${type ? `?type=${type}` : ''}`)).body.data;
export const resendEvent = (id: string) => control<{ attempt: { status: number | null } }>('POST', `/events/${id}/resend`);

/**
 * The event of this type about this object once the API has accepted it (answered 2xx); the stand-in retries a
 * failed delivery, so this waits for that rather than for a time.
 */
export async function deliveredEvent(type: string, objectId: string, timeoutMs = 20_000): Promise<FakeEvent> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const event = (await stripeEvents(type)).find((e) => e.object_id === objectId);
    if (event?.state === 'delivered') return event;
    if (Date.now() > deadline) throw new Error(`${type} about ${objectId} was not delivered (state: ${event?.state ?? 'no such event'})`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

export interface FakeDispute {
  id: string;
  amount: number;
  status: string;
  reason: string;
  payment_intent: string;
  evidence_details: { due_by: number | null };
}

/**
 * The cardholder's bank opens a dispute on a paid session's payment (the whole of it unless `amount` is given);
 * `fee` is the card service's dispute fee in minor units (the stand-in's default when left out).
 */
export const openDispute = (sessionId: string, reason: string, amount?: number, fee?: number) =>
  control<FakeDispute>('POST', `/checkout/sessions/${sessionId}/dispute`, { reason, amount, fee });
/** The guild answers it (in Stripe, in the dashboard): the bank reviews it. */
export const answerDispute = (id: string) => control<FakeDispute>('POST', `/disputes/${id}/answer`, {});
/** `feeReturned`: a win gives the dispute fee back, as some processors do. */
export const closeDispute = (id: string, outcome: 'won' | 'lost', feeReturned?: boolean) =>
  control<FakeDispute>('POST', `/disputes/${id}/close`, { outcome, feeReturned });
export const stripeSession = (id: string) =>
  stripeGet<{ id: string; status: string; payment_status: string; payment_intent: string | null }>(`/checkout/sessions/${id}`);
async function stripeGet<T>(path: string): Promise<T> {
  const env = serviceEnv();
  const res = await fetch(`${env.stripeFakeUrl}/v1${path}`, { headers: { authorization: `Bearer ${env.stripe.secretKey}` } });
  return (await res.json()) as T;
}

/** How much of a payment the stand-in has refunded, in minor units. */
export async function refundedAmount(paymentIntentId: string): Promise<number> {
  const intent = await stripeGet<{ latest_charge: string }>(`/payment_intents/${paymentIntentId}`);
  const charge = await stripeGet<{ amount_refunded: number }>(`/charges/${intent.latest_charge}`);
  return charge.amount_refunded;
}
