import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { checkCardForm, parseExpiry } from '../src/pay-routes.ts';
import { bundleCheckoutParams, startHarness, type Harness } from './helpers.ts';

let h: Harness;
beforeEach(async () => {
  h = await startHarness();
});
afterEach(async () => {
  await h.close();
});

function submit(url: string, fields: Record<string, string>): Promise<Response> {
  return fetch(url, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(fields).toString(),
    redirect: 'manual',
  });
}

describe('hosted payment page', () => {
  it('shows the amount, the line items, labelled card fields and the cancel link', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    const response = await fetch(session.url!);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^text\/html/);
    const html = await response.text();

    expect(html).toContain('<html lang="en">');
    expect(html).toContain('Test payment page — no real money.');
    expect(html).toContain('<h1>Pay $16.50</h1>');
    expect(html).toContain('Batik 2½-inch strips, dark, 40 strips');
    expect(html).toContain('Postage: padded mailer');
    expect(html).toContain('$4.50');
    expect(html).toMatch(/<label for="card-number">Card number<\/label>\s*<input id="card-number" name="card_number"/);
    expect(html).toMatch(/<label for="card-expiry">[^<]+<\/label>\s*<input id="card-expiry" name="expiry"/);
    expect(html).toMatch(/<label for="card-cvc">[^<]+<\/label>\s*<input id="card-cvc" name="cvc"/);
    expect(html).toContain('<button type="submit">Pay $16.50</button>');
    expect(html).toContain('href="http://127.0.0.1:4300/orders/ord_17"');
  });

  it('escapes text from the session', async () => {
    const session = await h.stripe.checkout.sessions.create(
      bundleCheckoutParams({
        line_items: [{ price_data: { currency: 'usd', unit_amount: 900, product_data: { name: '<script>alert(1)</script> scraps' } }, quantity: 2 }],
      }),
    );
    const html = await (await fetch(session.url!)).text();
    expect(html).not.toContain('<script>alert(1)</script>');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt; scraps');
  });

  it('pays with 4242 and redirects (303) to success_url with the session id filled in', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    const response = await submit(session.url!, { card_number: '4242 4242 4242 4242', expiry: '12 / 34', cvc: '123' });

    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe(`http://127.0.0.1:4300/orders/ord_17/paid?session=${session.id}`);
    // The webhook was attempted before the redirect went out.
    expect(h.receiver.received.some((r) => r.rawBody.includes('"checkout.session.completed"'))).toBe(true);
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).payment_status).toBe('paid');

    const revisit = await fetch(session.url!);
    expect(revisit.status).toBe(409);
    expect(await revisit.text()).toContain('This payment is already complete');
  });

  it('shows "Your card was declined." for 4000 0000 0000 0002 and keeps the session open', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    const response = await submit(session.url!, { card_number: '4000 0000 0000 0002', expiry: '12/34', cvc: '123' });

    expect(response.status).toBe(402);
    const html = await response.text();
    expect(html).toContain('<p class="error" id="pay-error" role="alert">Your card was declined.</p>');
    expect(html).toContain('aria-invalid="true" aria-describedby="card-hint pay-error"');
    expect(html).toContain('value="4000 0000 0000 0002"');
    expect(await h.stripe.checkout.sessions.retrieve(session.id)).toMatchObject({ status: 'open', payment_status: 'unpaid' });
  });

  it('asks for a test card number when given any other number', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    const response = await submit(session.url!, { card_number: '4111 1111 1111 1111', expiry: '12/34', cvc: '123' });
    expect(response.status).toBe(400);
    expect(await response.text()).toContain('Use a test card number');
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
  });

  it('points at the field to fix when expiry or CVC is missing', async () => {
    const session = await h.stripe.checkout.sessions.create(bundleCheckoutParams());
    const noExpiry = await (await submit(session.url!, { card_number: '4242424242424242', expiry: '', cvc: '123' })).text();
    expect(noExpiry).toContain('Enter the expiry date as MM / YY.');
    expect(noExpiry).toMatch(/id="card-expiry"[^>]*aria-invalid="true"/);
    const noCvc = await (await submit(session.url!, { card_number: '4242424242424242', expiry: '12/34', cvc: '' })).text();
    expect(noCvc).toContain('Enter the 3 or 4 digit security code (CVC).');
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
  });

  it('answers an unknown session with a 404 page', async () => {
    const response = await fetch(`${h.baseUrl}/pay/cs_test_unknown`);
    expect(response.status).toBe(404);
    expect(await response.text()).toContain('Payment page not found');
  });
});

describe('card form checks', () => {
  // 2026-12-01 on the stand-in's clock.
  const now = Date.UTC(2026, 11, 1) / 1000;

  it('reads expiry dates in the usual spellings', () => {
    expect(parseExpiry('12 / 34')).toEqual({ month: 12, year: 2034 });
    expect(parseExpiry('1/27')).toEqual({ month: 1, year: 2027 });
    expect(parseExpiry('0529')).toEqual({ month: 5, year: 2029 });
    expect(parseExpiry('07/2031')).toEqual({ month: 7, year: 2031 });
    expect(parseExpiry('13/30')).toBeNull();
    expect(parseExpiry('soon')).toBeNull();
  });

  it('accepts the current month and refuses an earlier one', () => {
    const base = { card_number: '4242 4242 4242 4242', cvc: '123' };
    expect(checkCardForm({ ...base, expiry: '12/26' }, now)).toMatchObject({ ok: true, card: { expMonth: 12, expYear: 2026 } });
    expect(checkCardForm({ ...base, expiry: '11/26' }, now)).toMatchObject({ ok: false, field: 'expiry' });
  });

  it('ignores spaces and dashes in the card number', () => {
    expect(checkCardForm({ card_number: '4242-4242 4242-4242', expiry: '12/30', cvc: '1234' }, now)).toMatchObject({
      ok: true,
      card: { number: '4242424242424242' },
    });
  });
});
