import Stripe from 'stripe';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { API_KEY, bundleCheckoutParams, payWithCard, startHarness, WEBHOOK_SECRET, type Harness } from './helpers.ts';

let h: Harness;
beforeEach(async () => {
  h = await startHarness();
});
afterEach(async () => {
  await h.close();
});

describe('checkout, payment and refunds through the Stripe SDK', () => {
  it('creates an open session with the hosted page URL and Stripe-shaped fields', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());

    expect(session.id).toMatch(/^cs_test_[A-Za-z0-9]{24}$/);
    expect(session).toMatchObject({
      object: 'checkout.session',
      livemode: false,
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: 1650,
      amount_subtotal: 1650,
      currency: 'usd',
      payment_intent: null,
      client_reference_id: 'ord_17',
      customer_email: 'wren.okafor@millbrook-quilters.test',
      metadata: { orderId: 'ord_17' },
      url: `${h.baseUrl}/pay/${session.id}`,
    });
    // Stripe's default lifetime is 24 hours.
    expect(session.expires_at - session.created).toBe(24 * 60 * 60);

    const retrieved = await h.stripe.checkout.sessions.retrieve(session.id);
    expect(retrieved).toEqual(session);

    const items = await h.stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data.map((item) => [item.description, item.quantity, item.amount_total])).toEqual([
      ['Batik 2½-inch strips, dark, 40 strips', 1, 1200],
      ['Postage: padded mailer', 1, 450],
    ]);
  });

  it('pays with 4242, signs checkout.session.completed for constructEvent, then refunds partly, fully, and no further', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());

    const payResponse = await payWithCard(h.baseUrl, session.id, '4242 4242 4242 4242');
    expect(payResponse.status).toBe(200);
    const paid = (await payResponse.json()) as Stripe.Checkout.Session;
    expect(paid).toMatchObject({ id: session.id, status: 'complete', payment_status: 'paid', url: null });
    expect(paid.payment_intent).toMatch(/^pi_test_/);

    // The first delivery happens before the pay call returns.
    const hook = h.receiver.received.find((r) => r.rawBody.includes('"checkout.session.completed"'));
    expect(hook).toBeDefined();
    const event = h.stripe.webhooks.constructEvent(hook!.rawBody, hook!.headers['stripe-signature'] as string, WEBHOOK_SECRET);
    expect(event.type).toBe('checkout.session.completed');
    expect(event.id).toMatch(/^evt_/);
    expect(event.livemode).toBe(false);
    // The version the SDK sent when it made the session.
    expect(event.api_version).toBe(Stripe.API_VERSION);
    const eventSession = event.data.object as Stripe.Checkout.Session;
    expect(eventSession).toMatchObject({
      id: session.id,
      status: 'complete',
      payment_status: 'paid',
      payment_intent: paid.payment_intent,
      metadata: { orderId: 'ord_17' },
      client_reference_id: 'ord_17',
    });
    // A wrong secret must not verify.
    expect(() =>
      h.stripe.webhooks.constructEvent(hook!.rawBody, hook!.headers['stripe-signature'] as string, 'whsec_someone_else'),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);

    const paymentIntent = await h.stripe.paymentIntents.retrieve(paid.payment_intent as string);
    expect(paymentIntent).toMatchObject({
      object: 'payment_intent',
      status: 'succeeded',
      amount: 1650,
      amount_received: 1650,
      currency: 'usd',
      metadata: { orderId: 'ord_17' },
    });
    expect(paymentIntent.latest_charge).toMatch(/^ch_test_/);

    const expanded = await h.stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent.latest_charge'] });
    const expandedIntent = expanded.payment_intent as Stripe.PaymentIntent;
    expect(expandedIntent.id).toBe(paymentIntent.id);
    expect((expandedIntent.latest_charge as Stripe.Charge).amount).toBe(1650);

    const partial = await h.stripe.refunds.create({
      payment_intent: paymentIntent.id,
      amount: 450,
      reason: 'requested_by_customer',
      metadata: { orderId: 'ord_17' },
    });
    expect(partial).toMatchObject({
      object: 'refund',
      amount: 450,
      status: 'succeeded',
      payment_intent: paymentIntent.id,
      charge: paymentIntent.latest_charge,
      reason: 'requested_by_customer',
      metadata: { orderId: 'ord_17' },
    });
    expect(partial.id).toMatch(/^re_test_/);

    const tooMuch = h.stripe.refunds.create({ payment_intent: paymentIntent.id, amount: 1201 });
    await expect(tooMuch).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      code: 'amount_too_large',
      param: 'amount',
      message: 'Refund amount ($12.01) is greater than unrefunded amount on charge ($12.00)',
    });

    // No amount: the rest of the charge.
    const rest = await h.stripe.refunds.create({ payment_intent: paymentIntent.id });
    expect(rest.amount).toBe(1200);

    const charge = await h.stripe.charges.retrieve(paymentIntent.latest_charge as string);
    expect(charge).toMatchObject({ amount: 1650, amount_refunded: 1650, refunded: true });

    await expect(h.stripe.refunds.create({ payment_intent: paymentIntent.id, amount: 1 })).rejects.toMatchObject({
      statusCode: 400,
      code: 'charge_already_refunded',
    });

    expect((await h.stripe.refunds.retrieve(partial.id)).amount).toBe(450);
    const listed = await h.stripe.refunds.list({ payment_intent: paymentIntent.id });
    expect(listed.data.map((refund) => refund.id)).toEqual([rest.id, partial.id]);

    await h.receiver.waitFor((r) => r.rawBody.includes('"charge.refunded"') && r.rawBody.includes('"amount_refunded": 1650'));
  });

  it('leaves the session open and unpaid when the card is declined, and sends nothing', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());

    const response = await payWithCard(h.baseUrl, session.id, '4000000000000002');
    expect(response.status).toBe(402);
    expect(await response.json()).toEqual({
      error: { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' },
    });

    const after = await h.stripe.checkout.sessions.retrieve(session.id);
    expect(after).toMatchObject({ status: 'open', payment_status: 'unpaid', payment_intent: null });
    expect(after.url).toBe(session.url);
    expect(h.receiver.received).toHaveLength(0);
    expect(h.fake.store.paymentIntents.size).toBe(0);

    // The payer can still pay afterwards.
    expect((await payWithCard(h.baseUrl, session.id, '4242424242424242')).status).toBe(200);
  });

  it('refuses numbers that are not test cards and a second payment of a paid session', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());

    const unknown = await payWithCard(h.baseUrl, session.id, '5555 5555 5555 4444');
    expect(unknown.status).toBe(400);
    expect(((await unknown.json()) as { error: { message: string } }).error.message).toMatch(/^Use a test card number/);

    expect((await payWithCard(h.baseUrl, session.id, '4242424242424242')).status).toBe(200);
    const again = await payWithCard(h.baseUrl, session.id, '4242424242424242');
    expect(again.status).toBe(400);
    expect(((await again.json()) as { error: { code: string } }).error.code).toBe('checkout_session_not_open');
    expect(h.fake.store.paymentIntents.size).toBe(1);
  });

  it('answers unknown ids with 404 resource_missing', async () => {
    await expect(h.stripe.checkout.sessions.retrieve('cs_test_nothing_here')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 404,
      code: 'resource_missing',
    });
    await expect(h.stripe.paymentIntents.retrieve('pi_test_nothing_here')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
    await expect(h.stripe.refunds.retrieve('re_test_nothing_here')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
    await expect(h.stripe.refunds.create({ payment_intent: 'pi_test_nothing_here' })).rejects.toMatchObject({
      statusCode: 404,
      code: 'resource_missing',
      param: 'payment_intent',
    });
  });

  it('validates session parameters the way Stripe does', async () => {
    const missingSuccessUrl = bundleCheckoutParams();
    delete missingSuccessUrl.success_url;
    await expect(h.stripe.checkout.sessions.create(missingSuccessUrl)).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      code: 'parameter_missing',
      param: 'success_url',
    });

    await expect(
      h.stripe.checkout.sessions.create(
        bundleCheckoutParams({ line_items: [{ price_data: { currency: 'usd', unit_amount: 500, product_data: { name: 'Fat quarter' } } }] }),
      ),
    ).rejects.toMatchObject({ code: 'parameter_missing', param: 'line_items[0][quantity]' });

    await expect(
      h.stripe.checkout.sessions.create(
        bundleCheckoutParams({ line_items: [{ price_data: { currency: 'usd', unit_amount: 20, product_data: { name: 'Selvages' } }, quantity: 1 }] }),
      ),
    ).rejects.toMatchObject({ code: 'amount_too_small' });

    // Stripe takes expires_at between 30 minutes and 24 hours ahead.
    const now = Math.floor(Date.now() / 1000);
    await expect(h.stripe.checkout.sessions.create(bundleCheckoutParams({ expires_at: now + 10 * 60 }))).rejects.toMatchObject({
      param: 'expires_at',
    });
    const thirtyMinutes = await h.stripe.checkout.sessions.create(bundleCheckoutParams({ expires_at: now + 30 * 60 }));
    expect(thirtyMinutes.expires_at).toBe(now + 30 * 60);

    // Cards are the only method the stand-in takes; asking for cards only is accepted.
    await expect(h.stripe.checkout.sessions.create(bundleCheckoutParams({ allowed_payment_method_types: ['us_bank_account'] }))).rejects.toMatchObject({
      code: 'parameter_invalid',
      param: 'allowed_payment_method_types',
    });
    const cardsOnly = await h.stripe.checkout.sessions.create(bundleCheckoutParams({ allowed_payment_method_types: ['card'], expires_at: now + 40 * 60 }));
    expect(cardsOnly.payment_method_types).toEqual(['card']);

    await expect(
      h.stripe.checkout.sessions.create({ ...bundleCheckoutParams(), shipping_address_collection: { allowed_countries: ['US'] } }),
    ).rejects.toMatchObject({ code: 'parameter_unknown', param: 'shipping_address_collection' });

    // Nothing half-made by the rejected requests.
    expect(h.fake.store.sessions.size).toBe(2);
  });

  it('uses the API key scheme Stripe uses: Bearer sk_test_… or 401', async () => {
    await expect(h.stripeWithKey('sk_live_not_here_thank_you').checkout.sessions.create(bundleCheckoutParams())).rejects.toMatchObject({
      type: 'StripeAuthenticationError',
      statusCode: 401,
    });

    const noKey = await fetch(`${h.baseUrl}/v1/checkout/sessions`, { method: 'POST', body: 'mode=payment' });
    expect(noKey.status).toBe(401);
    const body = (await noKey.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');
    expect(body.error.message).toMatch(/did not provide an API key/);

    const basic = await fetch(`${h.baseUrl}/v1/refunds`, { headers: { Authorization: `Basic ${Buffer.from(`${API_KEY}:`).toString('base64')}` } });
    expect(basic.status).toBe(200);
    expect(h.fake.store.sessions.size).toBe(0);
  });
});
