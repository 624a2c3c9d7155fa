/**
 * Test harness: the stand-in on an ephemeral port, a webhook receiver on
 * another, and the real Stripe SDK pointed at the stand-in.
 */
import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { createStripeFake, type StripeFake, type StripeFakeOptions } from '../src/index.ts';

export const WEBHOOK_SECRET = 'whsec_test_millbrook_quilters_local';
export const API_KEY = 'sk_test_millbrook_quilters_local';

export interface ReceivedWebhook {
  headers: IncomingHttpHeaders;
  rawBody: string;
}

export interface WebhookReceiver {
  url: string;
  received: ReceivedWebhook[];
  /** Answer this many requests (of one event type, if given) with 500 before accepting. */
  failNext(count: number, eventType?: string): void;
  waitFor(predicate: (hook: ReceivedWebhook) => boolean, timeoutMs?: number): Promise<ReceivedWebhook>;
  close(): Promise<void>;
}

function listen(server: Server): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve((server.address() as AddressInfo).port));
  });
}

function closeServer(server: Server): Promise<void> {
  return new Promise((resolve) => {
    server.close(() => resolve());
    server.closeAllConnections();
  });
}

export async function startWebhookReceiver(): Promise<WebhookReceiver> {
  const received: ReceivedWebhook[] = [];
  let failuresLeft = 0;
  let failOnly: string | undefined;
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const body = Buffer.concat(chunks).toString('utf8');
      if (failuresLeft > 0 && (failOnly === undefined || body.includes(`"type": "${failOnly}"`))) {
        failuresLeft -= 1;
        res.writeHead(500).end('receiver told to fail');
        return;
      }
      received.push({ headers: req.headers, rawBody: body });
      res.writeHead(200, { 'Content-Type': 'application/json' }).end('{"received":true}');
    });
  });
  const port = await listen(server);
  return {
    url: `http://127.0.0.1:${port}/api/stripe/webhook`,
    received,
    failNext(count, eventType) {
      failuresLeft = count;
      failOnly = eventType;
    },
    async waitFor(predicate, timeoutMs = 3000) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const hit = received.find(predicate);
        if (hit) return hit;
        if (Date.now() > deadline) throw new Error(`no matching webhook within ${timeoutMs} ms (got ${received.length})`);
        await new Promise((resolve) => setTimeout(resolve, 20));
      }
    },
    close: () => closeServer(server),
  };
}

export interface Harness {
  baseUrl: string;
  fake: StripeFake;
  stripe: Stripe;
  receiver: WebhookReceiver;
  /** Same SDK settings as `stripe`, other key. */
  stripeWithKey(key: string): Stripe;
  close(): Promise<void>;
}

export async function startHarness(options: Partial<StripeFakeOptions> = {}): Promise<Harness> {
  const receiver = await startWebhookReceiver();
  // Listen first: the public URL must name the port before the fake is built.
  const server = createServer();
  const port = await listen(server);
  const baseUrl = `http://127.0.0.1:${port}`;
  const fake = createStripeFake({
    publicUrl: baseUrl,
    webhookUrl: receiver.url,
    webhookSecret: WEBHOOK_SECRET,
    webhookRetryDelaysMs: [50, 100],
    webhookTimeoutMs: 1000,
    log: () => undefined,
    ...options,
  });
  server.on('request', fake.app);
  const stripeWithKey = (key: string): Stripe =>
    new Stripe(key, { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0 });
  return {
    baseUrl,
    fake,
    stripe: stripeWithKey(API_KEY),
    receiver,
    stripeWithKey,
    async close() {
      fake.close();
      await closeServer(server);
      await receiver.close();
    },
  };
}

/** Session parameters as our API sends them: one bundle, postage as a second line. */
export function bundleCheckoutParams(overrides: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams {
  return {
    mode: 'payment',
    line_items: [
      {
        price_data: { currency: 'usd', unit_amount: 1200, product_data: { name: 'Batik 2½-inch strips, dark, 40 strips' } },
        quantity: 1,
      },
      {
        price_data: { currency: 'usd', unit_amount: 450, product_data: { name: 'Postage: padded mailer' } },
        quantity: 1,
      },
    ],
    success_url: 'http://127.0.0.1:4300/orders/ord_17/paid?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:4300/orders/ord_17',
    client_reference_id: 'ord_17',
    customer_email: 'wren.okafor@millbrook-quilters.test',
    metadata: { orderId: 'ord_17' },
    payment_intent_data: { metadata: { orderId: 'ord_17' } },
    ...overrides,
  };
}

export async function payWithCard(baseUrl: string, sessionId: string, card: string): Promise<Response> {
  return fetch(`${baseUrl}/_control/checkout/sessions/${sessionId}/pay`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ card }),
  });
}
