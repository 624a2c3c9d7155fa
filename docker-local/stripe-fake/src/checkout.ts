/**
 * Checkout Sessions: creation with Stripe's validation, expiry, and payment by
 * one of Stripe's published test card numbers.
 */
import type { FakeContext } from './context.ts';
import { invalidRequest, parameterInvalid, resourceMissing } from './errors.ts';
import { newId, randomToken } from './ids.ts';
import { isKnownCurrency, MAX_AMOUNT, minimumCharge, formatMoney } from './money.ts';
import type { ParamReader } from './params.ts';
import type { SessionRecord } from './store.ts';
import type { Charge, CheckoutSession, LineItem, PaymentIntent, RequestContext } from './types.ts';

/** Stripe's default lifetime of a Checkout Session. */
const DEFAULT_LIFETIME_SECONDS = 24 * 60 * 60;
/** Stripe accepts `expires_at` between 30 minutes and 24 hours after creation. */
const MIN_LIFETIME_SECONDS = 30 * 60;
/**
 * A caller computing "now + 30 min" a moment before we do would land a second
 * short; this much slack keeps such a request from failing at random.
 */
const CLOCK_SLACK_SECONDS = 30;
/** Stripe's limit on line items in a payment-mode session. */
const MAX_LINE_ITEMS = 100;

/** Stripe's published test card numbers (docs.stripe.com/testing). */
export const TEST_CARDS = {
  succeeds: '4242424242424242',
  declined: '4000000000000002',
} as const;

/** Events nobody's API call caused (time ran out, the bank acted) carry no request. */
export const SYSTEM_REQUEST: RequestContext = { requestId: null, idempotencyKey: null, apiVersion: null };

function isHttpUrl(value: string): boolean {
  try {
    const url = new URL(value);
    return url.protocol === 'http:' || url.protocol === 'https:';
  } catch {
    return false;
  }
}

function readUrl(params: ParamReader, key: string, required: boolean): string | undefined {
  const value = params.string(key, { required, maxLength: 5000 });
  if (value !== undefined && !isHttpUrl(value)) throw parameterInvalid(params.name(key), 'Not a valid URL', 'url_invalid');
  return value;
}

function readLineItems(params: ParamReader, created: number): LineItem[] {
  const items = params.list('line_items', { required: true }) ?? [];
  if (items.length === 0) throw parameterInvalid(params.name('line_items'), 'line_items must contain at least one item.');
  if (items.length > MAX_LINE_ITEMS) {
    throw parameterInvalid(params.name('line_items'), `line_items can contain at most ${MAX_LINE_ITEMS} items.`);
  }
  return items.map((item) => {
    if (item.string('price') !== undefined) {
      throw parameterInvalid(
        item.name('price'),
        'The local Stripe stand-in keeps no Price objects: pass price_data instead of price.',
      );
    }
    const priceData = item.hash('price_data', { required: true }) as ParamReader;
    const currency = priceData.string('currency', { required: true }).toLowerCase();
    if (!isKnownCurrency(currency)) throw parameterInvalid(priceData.name('currency'), `Invalid currency: ${currency}`);
    const unitAmount = priceData.integer('unit_amount', { required: true, min: 0, max: MAX_AMOUNT });
    const productData = priceData.hash('product_data', { required: true }) as ParamReader;
    const name = productData.string('name', { required: true, maxLength: 250 });
    productData.string('description', { maxLength: 500 });
    const quantity = item.integer('quantity', { required: true, min: 1, max: 999_999 });
    const subtotal = unitAmount * quantity;
    return {
      id: newId('li'),
      object: 'item',
      amount_discount: 0,
      amount_subtotal: subtotal,
      amount_tax: 0,
      amount_total: subtotal,
      currency,
      description: name,
      price: {
        id: newId('price'),
        object: 'price',
        active: false,
        created,
        currency,
        livemode: false,
        metadata: {},
        product: newId('prod'),
        type: 'one_time',
        unit_amount: unitAmount,
      },
      quantity,
    } satisfies LineItem;
  });
}

export function createCheckoutSession(ctx: FakeContext, params: ParamReader, request: RequestContext): SessionRecord {
  const created = ctx.clock();
  const mode = params.string('mode', { required: true });
  if (mode !== 'payment') {
    throw parameterInvalid(params.name('mode'), `The local Stripe stand-in supports only mode=payment, not ${mode}.`);
  }
  params.enumValue('ui_mode', ['hosted']);
  // The stand-in takes cards only, so the one list of methods it accepts is cards alone.
  const allowed = params.stringList('allowed_payment_method_types');
  if (allowed.some((m) => m !== 'card')) {
    throw parameterInvalid(params.name('allowed_payment_method_types'), 'The local Stripe stand-in takes cards only: allowed_payment_method_types may hold just "card".');
  }
  const successUrl = readUrl(params, 'success_url', true) as string;
  const cancelUrl = readUrl(params, 'cancel_url', false) ?? null;
  const clientReferenceId = params.string('client_reference_id', { maxLength: 200 }) ?? null;
  const customerEmail = params.string('customer_email', { maxLength: 800 }) ?? null;
  if (customerEmail !== null && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(customerEmail)) {
    throw parameterInvalid(params.name('customer_email'), `Invalid email address: ${customerEmail}`, 'email_invalid');
  }
  const metadata = params.metadata('metadata');
  const locale = params.string('locale', { maxLength: 10 }) ?? null;
  const submitType = params.enumValue('submit_type', ['auto', 'book', 'donate', 'pay']) ?? null;
  const paymentIntentData = params.hash('payment_intent_data');
  const piMetadata = paymentIntentData?.metadata('metadata') ?? {};
  const piDescription = paymentIntentData?.string('description', { maxLength: 1000 }) ?? null;
  const piReceiptEmail = paymentIntentData?.string('receipt_email', { maxLength: 800 }) ?? null;

  const expiresAt = params.integer('expires_at') ?? created + DEFAULT_LIFETIME_SECONDS;
  if (expiresAt < created + MIN_LIFETIME_SECONDS - CLOCK_SLACK_SECONDS) {
    throw parameterInvalid(params.name('expires_at'), 'The `expires_at` timestamp must be at least 30 minutes from Checkout Session creation.');
  }
  if (expiresAt > created + DEFAULT_LIFETIME_SECONDS) {
    throw parameterInvalid(params.name('expires_at'), 'The `expires_at` timestamp must be less than 24 hours from Checkout Session creation.');
  }

  const lineItems = readLineItems(params, created);
  const currency = lineItems[0]?.currency as string;
  if (lineItems.some((item) => item.currency !== currency)) {
    throw parameterInvalid(params.name('line_items'), 'All line items in a Checkout Session must use the same currency.');
  }
  const amountTotal = lineItems.reduce((sum, item) => sum + item.amount_total, 0);
  if (amountTotal > MAX_AMOUNT) {
    throw parameterInvalid(params.name('line_items'), `The total amount must be at most ${formatMoney(MAX_AMOUNT, currency)}.`, 'amount_too_large');
  }
  const minimum = minimumCharge(currency);
  if (amountTotal < minimum) {
    throw parameterInvalid(
      params.name('line_items'),
      `The Checkout Session's total amount due must add up to at least ${formatMoney(minimum, currency)} ${currency}`,
      'amount_too_small',
    );
  }

  params.done();
  const id = newId('cs_test');
  const session: CheckoutSession = {
    id,
    object: 'checkout.session',
    amount_subtotal: amountTotal,
    amount_total: amountTotal,
    cancel_url: cancelUrl,
    client_reference_id: clientReferenceId,
    created,
    currency,
    customer: null,
    customer_details: null,
    customer_email: customerEmail,
    expires_at: expiresAt,
    livemode: false,
    locale,
    metadata,
    mode: 'payment',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    submit_type: submitType,
    success_url: successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: `${ctx.publicUrl}/pay/${id}`,
  };
  const record: SessionRecord = {
    session,
    lineItems,
    paymentIntentData: { metadata: piMetadata, description: piDescription, receiptEmail: piReceiptEmail },
    apiVersion: request.apiVersion,
  };
  ctx.store.sessions.set(id, record);
  return record;
}

/** Events about a session's payment carry the Stripe-Version the session was made with. */
export function eventContext(record: SessionRecord, request: RequestContext): RequestContext {
  return { ...request, apiVersion: request.apiVersion ?? record.apiVersion };
}

function markExpired(ctx: FakeContext, record: SessionRecord, request: RequestContext): void {
  record.session.status = 'expired';
  record.session.url = null;
  void ctx.webhooks.emit('checkout.session.expired', record.session, eventContext(record, request));
}

/** Sessions past `expires_at` expire the moment anyone looks at them. */
export function findSession(ctx: FakeContext, id: string, param = 'session'): SessionRecord {
  const record = ctx.store.sessions.get(id);
  if (!record) throw resourceMissing('checkout.session', id, param);
  if (record.session.status === 'open' && ctx.clock() >= record.session.expires_at) {
    markExpired(ctx, record, SYSTEM_REQUEST);
  }
  return record;
}

export function expireCheckoutSession(ctx: FakeContext, id: string, request: RequestContext): SessionRecord {
  const record = findSession(ctx, id);
  if (record.session.status !== 'open') {
    throw invalidRequest(
      `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${record.session.status}".`,
    );
  }
  markExpired(ctx, record, request);
  return record;
}

/** Expires every open session whose time is up; returns how many. */
export function sweepExpiredSessions(ctx: FakeContext): number {
  let expired = 0;
  const now = ctx.clock();
  for (const record of ctx.store.sessions.values()) {
    if (record.session.status === 'open' && now >= record.session.expires_at) {
      markExpired(ctx, record, SYSTEM_REQUEST);
      expired += 1;
    }
  }
  return expired;
}

export interface CardInput {
  number: string;
  expMonth: number;
  expYear: number;
  /** Tests only (the control endpoint): log the payment's events without sending them, as if their delivery had failed for good. */
  withholdEvents?: boolean;
}

export type PaymentOutcome =
  | { kind: 'paid'; record: SessionRecord }
  | { kind: 'declined'; record: SessionRecord }
  | { kind: 'not_a_test_card'; record: SessionRecord }
  | { kind: 'not_open'; record: SessionRecord };

export function normaliseCardNumber(input: string): string {
  return input.replace(/[\s-]/g, '');
}

/**
 * Pays an open session. On success the session completes, a PaymentIntent and
 * its Charge appear, and `checkout.session.completed` gets its first delivery
 * attempt before this settles, so the payer lands on success_url after our API
 * has (usually) heard about the payment — as with Stripe's hosted page.
 */
export async function paySession(ctx: FakeContext, id: string, card: CardInput): Promise<PaymentOutcome> {
  const record = findSession(ctx, id);
  if (record.session.status !== 'open') return { kind: 'not_open', record };
  const number = normaliseCardNumber(card.number);
  if (number === TEST_CARDS.declined) return { kind: 'declined', record };
  if (number !== TEST_CARDS.succeeds) return { kind: 'not_a_test_card', record };

  const now = ctx.clock();
  const session = record.session;
  const paymentIntentId = newId('pi_test');
  const chargeId = newId('ch_test');
  const paymentMethodId = newId('pm_test');
  const receiptEmail = record.paymentIntentData.receiptEmail ?? session.customer_email;
  const charge: Charge = {
    id: chargeId,
    object: 'charge',
    amount: session.amount_total,
    amount_captured: session.amount_total,
    amount_refunded: 0,
    captured: true,
    created: now,
    currency: session.currency,
    description: record.paymentIntentData.description,
    livemode: false,
    metadata: { ...record.paymentIntentData.metadata },
    paid: true,
    payment_intent: paymentIntentId,
    payment_method: paymentMethodId,
    payment_method_details: {
      type: 'card',
      card: { brand: 'visa', last4: number.slice(-4), exp_month: card.expMonth, exp_year: card.expYear, funding: 'credit', country: 'US' },
    },
    receipt_email: receiptEmail,
    refunded: false,
    disputed: false,
    status: 'succeeded',
  };
  const paymentIntent: PaymentIntent = {
    id: paymentIntentId,
    object: 'payment_intent',
    amount: session.amount_total,
    amount_capturable: 0,
    amount_received: session.amount_total,
    capture_method: 'automatic_async',
    client_secret: `${paymentIntentId}_secret_${randomToken()}`,
    confirmation_method: 'automatic',
    created: now,
    currency: session.currency,
    customer: null,
    description: record.paymentIntentData.description,
    latest_charge: chargeId,
    livemode: false,
    metadata: { ...record.paymentIntentData.metadata },
    payment_method: paymentMethodId,
    payment_method_types: ['card'],
    receipt_email: receiptEmail,
    status: 'succeeded',
  };
  ctx.store.charges.set(chargeId, charge);
  ctx.store.paymentIntents.set(paymentIntentId, paymentIntent);
  session.status = 'complete';
  session.payment_status = 'paid';
  session.payment_intent = paymentIntentId;
  session.customer_details = { email: session.customer_email, name: null };
  session.url = null;

  const events = eventContext(record, SYSTEM_REQUEST);
  const withhold = card.withholdEvents === true;
  await ctx.webhooks.emit('checkout.session.completed', session, events, { withhold });
  void ctx.webhooks.emit('payment_intent.succeeded', paymentIntent, events, { withhold });
  return { kind: 'paid', record };
}

/** Stripe's success_url template: `{CHECKOUT_SESSION_ID}` becomes the session id. */
export function successRedirect(session: CheckoutSession): string {
  return session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id);
}
