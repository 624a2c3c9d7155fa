/**
 * `/_control`: endpoints for our tests, not part of Stripe's API. They read the
 * event log, replay events, pay without a browser, act as the cardholder's bank
 * in a dispute, and wipe the stand-in.
 */
import express, { Router } from 'express';
import { findSession, paySession } from './checkout.ts';
import type { FakeContext } from './context.ts';
import { answerDispute, closeDispute, openDispute } from './disputes.ts';
import { cardDeclined, invalidRequest, resourceMissing, StripeFakeError } from './errors.ts';
import { DISPUTE_REASONS, type DisputeReason, type EventLogEntry } from './types.ts';

function summary(entry: EventLogEntry) {
  return {
    id: entry.event.id,
    type: entry.event.type,
    created: entry.event.created,
    object_id: entry.event.data.object.id,
    state: entry.state,
    attempts: entry.attempts,
    event: entry.event,
  };
}

function jsonBody(body: unknown): Record<string, unknown> {
  return typeof body === 'object' && body !== null ? (body as Record<string, unknown>) : {};
}

function findEntry(ctx: FakeContext, id: string): EventLogEntry {
  const entry = ctx.store.events.get(id);
  if (!entry) throw resourceMissing('event', id);
  return entry;
}

export function controlRouter(ctx: FakeContext, onReset: () => void): Router {
  const router = Router();
  router.use(express.json({ limit: '64kb' }));

  router.get('/health', (_req, res) => {
    res.json({
      ok: true,
      webhook_url: ctx.webhooks.endpoint ?? null,
      checkout_sessions: ctx.store.sessions.size,
      events: ctx.store.events.size,
    });
  });

  router.get('/events', (req, res) => {
    const type = typeof req.query.type === 'string' ? req.query.type : undefined;
    const entries = [...ctx.store.events.values()].filter((entry) => type === undefined || entry.event.type === type);
    res.json({ data: entries.map(summary) });
  });

  router.get('/events/:id', (req, res) => {
    res.json(summary(findEntry(ctx, req.params.id)));
  });

  router.post('/events/:id/resend', async (req, res) => {
    const entry = findEntry(ctx, req.params.id);
    const attempt = await ctx.webhooks.resend(entry);
    if (!attempt) throw invalidRequest('No webhook URL is configured (STRIPE_FAKE_WEBHOOK_URL), so nothing can be resent.', 'webhook_url_missing');
    res.json({ ...summary(entry), attempt });
  });

  router.post('/checkout/sessions/:id/pay', async (req, res) => {
    const { card, withholdEvents } = jsonBody(req.body);
    if (typeof card !== 'string' || card.trim() === '') {
      throw invalidRequest('Send a JSON body { "card": "4242 4242 4242 4242" }.', 'parameter_missing', 'card');
    }
    // The expiry only decorates the charge here; a date safely in the future.
    const expYear = new Date(ctx.clock() * 1000).getUTCFullYear() + 3;
    const outcome = await paySession(ctx, findSession(ctx, req.params.id, 'id').session.id, { number: card, expMonth: 12, expYear, withholdEvents: withholdEvents === true });
    switch (outcome.kind) {
      case 'paid':
        res.json(outcome.record.session);
        return;
      case 'declined':
        throw cardDeclined();
      case 'not_a_test_card':
        throw invalidRequest(
          'Use a test card number: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.',
          'not_a_test_card',
          'card',
        );
      case 'not_open':
        throw invalidRequest(
          `This Checkout Session is no longer open (status: ${outcome.record.session.status}).`,
          'checkout_session_not_open',
        );
    }
  });

  router.post('/checkout/sessions/:id/dispute', async (req, res) => {
    const { reason, amount, fee } = jsonBody(req.body);
    if (typeof reason !== 'string' || !(DISPUTE_REASONS as readonly string[]).includes(reason)) {
      throw invalidRequest(
        `Send a JSON body { "reason": "product_not_received" } with one of Stripe's dispute reasons: ${DISPUTE_REASONS.join(', ')}.`,
        'parameter_invalid',
        'reason',
      );
    }
    if (amount !== undefined && typeof amount !== 'number') throw invalidRequest('amount is a whole number of minor units.', 'parameter_invalid', 'amount');
    if (fee !== undefined && typeof fee !== 'number') throw invalidRequest('fee is a whole number of minor units.', 'parameter_invalid', 'fee');
    res.json(await openDispute(ctx, req.params.id, { reason: reason as DisputeReason, amount, fee }));
  });

  router.post('/disputes/:id/answer', async (req, res) => {
    res.json(await answerDispute(ctx, req.params.id));
  });

  router.post('/disputes/:id/close', async (req, res) => {
    const { outcome, feeReturned } = jsonBody(req.body);
    if (outcome !== 'won' && outcome !== 'lost') {
      throw invalidRequest('Send a JSON body { "outcome": "won" } or { "outcome": "lost" }.', 'parameter_invalid', 'outcome');
    }
    if (feeReturned !== undefined && typeof feeReturned !== 'boolean') throw invalidRequest('feeReturned is true or false.', 'parameter_invalid', 'feeReturned');
    res.json(await closeDispute(ctx, req.params.id, outcome, feeReturned));
  });

  router.post('/reset', (_req, res) => {
    onReset();
    res.json({ ok: true });
  });

  router.use((req, _res) => {
    throw new StripeFakeError(404, 'invalid_request_error', `Unknown control endpoint (${req.method}: ${req.baseUrl}${req.path}).`);
  });
  return router;
}
