/**
 * Builds the Stripe stand-in as an express app (no listen): Stripe's `/v1`
 * API for the SDK, the hosted payment page under `/pay`, and `/_control` for
 * tests. main.ts listens; tests mount it on an ephemeral port.
 */
import express, { type ErrorRequestHandler, type Express } from 'express';
import { apiRouter } from './api.ts';
import { sweepExpiredSessions } from './checkout.ts';
import type { FakeContext } from './context.ts';
import { controlRouter } from './control-routes.ts';
import { StripeFakeError } from './errors.ts';
import { payRouter } from './pay-routes.ts';
import { FakeStore } from './store.ts';
import { WebhookDispatcher } from './webhooks.ts';

export interface StripeFakeOptions {
  /** Base URL payers reach this server on; sessions' `url` is `${publicUrl}/pay/${id}`. */
  publicUrl: string;
  /** Where events are POSTed; without it events are only logged. */
  webhookUrl?: string;
  /** Endpoint secret (`whsec_…`) events are signed with. */
  webhookSecret: string;
  /** The stand-in's clock for object times and expiry; tests move it. */
  now?: () => Date;
  /** Longest wait for one webhook attempt (default 3000 ms). */
  webhookTimeoutMs?: number;
  /** Pauses before retrying a failed delivery (default 1 s, 5 s, 15 s). */
  webhookRetryDelaysMs?: readonly number[];
  /** How often open sessions past `expires_at` are expired (default 2000 ms; 0 turns the sweep off). */
  sweepIntervalMs?: number;
  /** Where failed deliveries are reported (default: stderr). */
  log?: (line: string) => void;
}

export interface StripeFake {
  app: Express;
  store: FakeStore;
  /** Expires open sessions whose time is up, now; returns how many. */
  sweepExpired(): number;
  /** Forgets every object and event and cancels pending retries. */
  reset(): void;
  /** Stops the sweep and webhook retries; call when the server closes. */
  close(): void;
}

export function createStripeFake(options: StripeFakeOptions): StripeFake {
  const now = options.now ?? (() => new Date());
  const clock = (): number => Math.floor(now().getTime() / 1000);
  const log = options.log ?? ((line: string) => console.error(`[stripe-fake] ${line}`));
  const store = new FakeStore();
  const webhooks = new WebhookDispatcher(store, {
    url: options.webhookUrl,
    secret: options.webhookSecret,
    timeoutMs: options.webhookTimeoutMs ?? 3000,
    retryDelaysMs: options.webhookRetryDelaysMs ?? [1000, 5000, 15000],
    clock,
    log,
  });
  const ctx: FakeContext = { store, webhooks, clock, publicUrl: options.publicUrl.replace(/\/+$/, '') };

  const reset = (): void => {
    webhooks.cancelPending();
    store.reset();
  };

  const app = express();
  app.disable('x-powered-by');
  app.use('/v1', apiRouter(ctx));
  app.use('/pay', payRouter(ctx));
  app.use('/_control', controlRouter(ctx, reset));
  app.get('/', (_req, res) => {
    res.type('text').send('Local Stripe stand-in for Scrap Relay. API under /v1, payment pages under /pay, test controls under /_control.\n');
  });

  const handleError: ErrorRequestHandler = (error: unknown, _req, res, _next) => {
    if (error instanceof StripeFakeError) {
      res.status(error.status).json(error.toBody());
      return;
    }
    // body-parser errors carry the status to answer with (413, 400, 415).
    const status = (error as { status?: unknown }).status;
    if (typeof status === 'number' && status >= 400 && status < 500) {
      res.status(status).json({ error: { type: 'invalid_request_error', message: (error as Error).message } });
      return;
    }
    log(`internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
    res.status(500).json({ error: { type: 'api_error', message: 'The local Stripe stand-in hit an internal error.' } });
  };
  app.use(handleError);

  const sweepIntervalMs = options.sweepIntervalMs ?? 2000;
  const sweep = sweepIntervalMs > 0 ? setInterval(() => sweepExpiredSessions(ctx), sweepIntervalMs) : null;
  sweep?.unref();

  return {
    app,
    store,
    sweepExpired: () => sweepExpiredSessions(ctx),
    reset,
    close: () => {
      if (sweep) clearInterval(sweep);
      webhooks.close();
    },
  };
}
