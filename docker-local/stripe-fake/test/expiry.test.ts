import { afterEach, describe, expect, it } from 'vitest';
import { WEBHOOK_SECRET, bundleCheckoutParams, payWithCard, startHarness, type Harness } from './helpers.ts';

let h: Harness | undefined;
afterEach(async () => {
  await h?.close();
  h = undefined;
});

function expiredHooks(harness: Harness, sessionId: string) {
  return harness.receiver.received
    .map((r) => harness.stripe.webhooks.constructEvent(r.rawBody, r.headers['stripe-signature'] as string, WEBHOOK_SECRET))
    .filter((event) => event.type === 'checkout.session.expired' && (event.data.object as { id: string }).id === sessionId);
}

describe('session expiry', () => {
  it('expires an open session on request and sends checkout.session.expired', async () => {
    h = await startHarness();
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());

    const expired = await h.stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ id: session.id, status: 'expired', payment_status: 'unpaid', url: null });

    const harness = h;
    await h.receiver.waitFor((r) => r.rawBody.includes('"checkout.session.expired"'));
    const [event] = expiredHooks(harness, session.id);
    expect(event?.data.object).toMatchObject({ status: 'expired', metadata: { orderId: 'ord_17' } });

    // Only open sessions expire, as with Stripe.
    await expect(h.stripe.checkout.sessions.expire(session.id)).rejects.toMatchObject({ statusCode: 400 });
    const payAfter = await payWithCard(h.baseUrl, session.id, '4242424242424242');
    expect(payAfter.status).toBe(400);
  });

  it('refuses to expire a paid session', async () => {
    h = await startHarness();
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    await payWithCard(h.baseUrl, session.id, '4242424242424242');
    await expect(h.stripe.checkout.sessions.expire(session.id)).rejects.toMatchObject({ statusCode: 400 });
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe('complete');
  });

  it('expires a session past expires_at when it is read, once', async () => {
    let now = new Date('2026-12-01T10:00:00Z');
    h = await startHarness({ now: () => now, sweepIntervalMs: 0 });
    const created = Math.floor(now.getTime() / 1000);
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams({ expires_at: created + 31 * 60 }));

    now = new Date((created + 30 * 60) * 1000);
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');

    now = new Date((created + 31 * 60) * 1000);
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe('expired');
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe('expired');

    const harness = h;
    await h.receiver.waitFor((r) => r.rawBody.includes('"checkout.session.expired"'));
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(expiredHooks(harness, session.id)).toHaveLength(1);
  });

  it('expires due sessions in the periodic sweep without anyone asking', async () => {
    let now = new Date('2026-12-01T10:00:00Z');
    h = await startHarness({ now: () => now, sweepIntervalMs: 20 });
    const created = Math.floor(now.getTime() / 1000);
    const due = await h.stripe.checkout.sessions.create(bundleCheckoutParams({ expires_at: created + 31 * 60 }));
    const later = await h.stripe.checkout.sessions.create(bundleCheckoutParams({ expires_at: created + 60 * 60 }));

    now = new Date((created + 45 * 60) * 1000);
    await h.receiver.waitFor((r) => r.rawBody.includes('"checkout.session.expired"'));

    expect(h.fake.store.sessions.get(due.id)?.session.status).toBe('expired');
    expect(h.fake.store.sessions.get(later.id)?.session.status).toBe('open');
  });

  it('shows an expired message on the payment page after expiry', async () => {
    h = await startHarness();
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    await h.stripe.checkout.sessions.expire(session.id);
    const page = await fetch(`${h.baseUrl}/pay/${session.id}`);
    expect(page.status).toBe(410);
    expect(await page.text()).toContain('This payment page has expired');
  });
});
