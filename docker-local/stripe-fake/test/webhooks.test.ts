import Stripe from 'stripe';
import { afterEach, describe, expect, it } from 'vitest';
import { signatureHeader } from '../src/index.ts';
import { bundleCheckoutParams, payWithCard, startHarness, WEBHOOK_SECRET, type Harness } from './helpers.ts';

interface ControlEvent {
  id: string;
  type: string;
  state: string;
  object_id: string;
  attempts: { attempt: number; status: number | null; error: string | null; resend: boolean }[];
}

let h: Harness | undefined;
afterEach(async () => {
  await h?.close();
  h = undefined;
});

async function controlEvents(baseUrl: string, type?: string): Promise<ControlEvent[]> {
  const response = await fetch(`${baseUrl}/_control/events${type ? `?type=${type}` : ''}`);
  return ((await response.json()) as { data: ControlEvent[] }).data;
}

async function waitForState(baseUrl: string, id: string, state: string): Promise<ControlEvent> {
  const deadline = Date.now() + 3000;
  for (;;) {
    const event = (await controlEvents(baseUrl)).find((e) => e.id === id);
    if (event?.state === state) return event;
    if (Date.now() > deadline) throw new Error(`event ${id} never reached ${state} (is ${event?.state})`);
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

describe('webhook signing and delivery', () => {
  it('signs exactly as Stripe documents: t=<unix>,v1=<hex HMAC-SHA256 of "t.payload">', () => {
    const payload = '{"id":"evt_1","object":"event"}';
    const header = signatureHeader(payload, WEBHOOK_SECRET, 1_700_000_000);
    const stripe = new Stripe('sk_test_x');
    // The SDK's own helper builds the header from the same inputs.
    expect(header).toBe(stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp: 1_700_000_000 }));
  });

  it('retries a failed delivery in the background until the endpoint accepts it', async () => {
    h = await startHarness();
    h.receiver.failNext(2, 'checkout.session.completed');
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    expect((await payWithCard(h.baseUrl, session.id, '4242424242424242')).status).toBe(200);

    const [completed] = await controlEvents(h.baseUrl, 'checkout.session.completed');
    expect(completed?.object_id).toBe(session.id);
    const delivered = await waitForState(h.baseUrl, completed!.id, 'delivered');
    expect(delivered.attempts.map((a) => a.status)).toEqual([500, 500, 200]);

    const hook = await h.receiver.waitFor((r) => r.rawBody.includes(completed!.id));
    expect(h.stripe.webhooks.constructEvent(hook.rawBody, hook.headers['stripe-signature'] as string, WEBHOOK_SECRET).id).toBe(completed!.id);
  });

  it('gives up after the configured retries and marks the event failed', async () => {
    h = await startHarness();
    h.receiver.failNext(10, 'checkout.session.completed');
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    await payWithCard(h.baseUrl, session.id, '4242424242424242');

    const [completed] = await controlEvents(h.baseUrl, 'checkout.session.completed');
    const failed = await waitForState(h.baseUrl, completed!.id, 'failed');
    // One attempt plus the two retries the harness configures.
    expect(failed.attempts.map((a) => a.error)).toEqual(['HTTP 500', 'HTTP 500', 'HTTP 500']);
  });

  it('does not hold up the payer when the endpoint is down', async () => {
    h = await startHarness({ webhookUrl: 'http://127.0.0.1:9/unreachable', webhookRetryDelaysMs: [] });
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    const started = Date.now();
    expect((await payWithCard(h.baseUrl, session.id, '4242424242424242')).status).toBe(200);
    expect(Date.now() - started).toBeLessThan(1500);
    const [completed] = await controlEvents(h.baseUrl, 'checkout.session.completed');
    expect(completed?.state).toBe('failed');
    expect(completed?.attempts[0]?.status).toBeNull();
  });

  it('resends an event with the same id and body but a fresh, valid signature', async () => {
    h = await startHarness();
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    await payWithCard(h.baseUrl, session.id, '4242424242424242');
    const [completed] = await controlEvents(h.baseUrl, 'checkout.session.completed');
    const original = await h.receiver.waitFor((r) => r.rawBody.includes(completed!.id));

    // Let the clock pass a whole second so the fresh signature differs.
    await new Promise((resolve) => setTimeout(resolve, 1100));
    const resend = await fetch(`${h.baseUrl}/_control/events/${completed!.id}/resend`, { method: 'POST' });
    expect(resend.status).toBe(200);
    expect(((await resend.json()) as { attempt: { status: number; resend: boolean } }).attempt).toMatchObject({ status: 200, resend: true });

    const copies = h.receiver.received.filter((r) => r.rawBody.includes(completed!.id));
    expect(copies).toHaveLength(2);
    const replay = copies[1]!;
    expect(replay.rawBody).toBe(original.rawBody);
    expect(replay.headers['stripe-signature']).not.toBe(original.headers['stripe-signature']);
    const event = h.stripe.webhooks.constructEvent(replay.rawBody, replay.headers['stripe-signature'] as string, WEBHOOK_SECRET);
    expect(event.id).toBe(completed!.id);
  });

  it('logs events without sending them when no webhook URL is set', async () => {
    h = await startHarness({ webhookUrl: undefined });
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    await payWithCard(h.baseUrl, session.id, '4242424242424242');
    const events = await controlEvents(h.baseUrl);
    expect(events.map((e) => [e.type, e.state])).toEqual([
      ['checkout.session.completed', 'no_endpoint'],
      ['payment_intent.succeeded', 'no_endpoint'],
    ]);
    expect(h.receiver.received).toHaveLength(0);
    const resend = await fetch(`${h.baseUrl}/_control/events/${events[0]!.id}/resend`, { method: 'POST' });
    expect(resend.status).toBe(400);
  });

  it('serves a logged event through GET /v1/events/:id, as Stripe does', async () => {
    h = await startHarness();
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    await payWithCard(h.baseUrl, session.id, '4242424242424242');
    const [completed] = await controlEvents(h.baseUrl, 'checkout.session.completed');
    const event = await h.stripe.events.retrieve(completed!.id);
    expect(event).toMatchObject({ id: completed!.id, type: 'checkout.session.completed', data: { object: { id: session.id } } });
  });

  it('forgets everything on reset', async () => {
    h = await startHarness();
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    await payWithCard(h.baseUrl, session.id, '4242424242424242');
    expect((await fetch(`${h.baseUrl}/_control/reset`, { method: 'POST' })).status).toBe(200);
    expect(await controlEvents(h.baseUrl)).toEqual([]);
    await expect(h.stripe.checkout.sessions.retrieve(session.id)).rejects.toMatchObject({ statusCode: 404 });
    const health = (await (await fetch(`${h.baseUrl}/_control/health`)).json()) as Record<string, unknown>;
    expect(health).toMatchObject({ ok: true, checkout_sessions: 0, events: 0, webhook_url: h.receiver.url });
  });
});
