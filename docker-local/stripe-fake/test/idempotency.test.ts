import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { API_KEY, bundleCheckoutParams, startHarness, type Harness } from './helpers.ts';

let h: Harness;
beforeEach(async () => {
  h = await startHarness();
});
afterEach(async () => {
  await h.close();
});

function postForm(key: string, body: string, headers: Record<string, string> = {}): Promise<Response> {
  return fetch(`${h.baseUrl}/v1/refunds`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${API_KEY}`, 'Content-Type': 'application/x-www-form-urlencoded', 'Idempotency-Key': key, ...headers },
    body,
  });
}

describe('Idempotency-Key, as Stripe documents it', () => {
  it('replays the first response for the same key and parameters, creating one session', async () => {
    const first = await h.stripe.checkout.sessions.create(bundleCheckoutParams(), { idempotencyKey: 'order-ord_17-checkout-1' });
    const second = await h.stripe.checkout.sessions.create(bundleCheckoutParams(), { idempotencyKey: 'order-ord_17-checkout-1' });

    expect(second.id).toBe(first.id);
    expect(second.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(h.fake.store.sessions.size).toBe(1);
  });

  it('rejects the same key with different parameters as an idempotency_error', async () => {
    await h.stripe.checkout.sessions.create(bundleCheckoutParams(), { idempotencyKey: 'order-ord_18-checkout-1' });
    const changed = h.stripe.checkout.sessions.create(bundleCheckoutParams({ client_reference_id: 'ord_19' }), {
      idempotencyKey: 'order-ord_18-checkout-1',
    });

    await expect(changed).rejects.toMatchObject({ type: 'StripeIdempotencyError', statusCode: 400 });
    expect(h.fake.store.sessions.size).toBe(1);
  });

  it('treats a key used on another endpoint as different parameters', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams(), { idempotencyKey: 'shared-key' });
    await expect(h.stripe.checkout.sessions.expire(session.id, {}, { idempotencyKey: 'shared-key' })).rejects.toMatchObject({
      type: 'StripeIdempotencyError',
    });
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
  });

  it('replays a saved error with its status, but saves nothing for a request that failed validation', async () => {
    // Missing resource: the endpoint ran, so the 404 is saved and replayed.
    const first = await postForm('refund-missing', 'payment_intent=pi_test_gone');
    const again = await postForm('refund-missing', 'payment_intent=pi_test_gone');
    expect([first.status, again.status]).toEqual([404, 404]);
    expect(again.headers.get('idempotent-replayed')).toBe('true');
    expect(await again.json()).toEqual(await first.json());

    // Invalid parameters: nothing saved, so a corrected request may reuse the key.
    const invalid = await postForm('refund-fixed-later', 'payment_intent=pi_test_gone&amount=lots');
    expect(invalid.status).toBe(400);
    const corrected = await postForm('refund-fixed-later', 'payment_intent=pi_test_gone&amount=100');
    expect(corrected.status).toBe(404);
    expect(corrected.headers.get('idempotent-replayed')).toBeNull();
  });

  it('scopes keys to the API key, as Stripe scopes them to the account', async () => {
    await h.stripe.checkout.sessions.create(bundleCheckoutParams(), { idempotencyKey: 'per-account' });
    await h.stripeWithKey('sk_test_another_guild').checkout.sessions.create(bundleCheckoutParams(), { idempotencyKey: 'per-account' });
    expect(h.fake.store.sessions.size).toBe(2);
  });
});
