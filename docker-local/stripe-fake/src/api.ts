/**
 * The `/v1` API the Stripe SDK calls: authentication, form parameters,
 * idempotent replays and the endpoints our API uses.
 */
import express, { type Request, type RequestHandler, type Response, Router } from 'express';
import { createCheckoutSession, expireCheckoutSession, findSession } from './checkout.ts';
import { findDispute } from './disputes.ts';
import type { FakeContext } from './context.ts';
import { authenticationFailed, resourceMissing, StripeFakeError } from './errors.ts';
import { checkExpand, lineItemList, present } from './expand.ts';
import { canonicalParams, FormParamsError, parseFormParams, type ParamMap } from './form-params.ts';
import { newId } from './ids.ts';
import { ParamReader } from './params.ts';
import { createRefund } from './refunds.ts';
import type { LineItemList, RefundList, RequestContext, StripeEvent, StripeObject } from './types.ts';

/** Stripe's limit on the Idempotency-Key header. */
const MAX_IDEMPOTENCY_KEY_LENGTH = 255;

interface ApiCall {
  params: ParamReader;
  /** The `:id` path segment, '' on routes without one. */
  id: string;
  request: RequestContext;
}

/** Each handler runs synchronously, so a replayed key can never race its first run. */
type Handler = (call: ApiCall) => StripeObject | LineItemList | RefundList | StripeEvent;

function maskKey(key: string): string {
  return key.length <= 12 ? key : `${key.slice(0, 8)}${'*'.repeat(Math.max(4, key.length - 12))}${key.slice(-4)}`;
}

/** Accepts `Bearer sk_test_…` and Basic auth with the key as user name, as Stripe does. */
function apiKeyFrom(req: Request): string {
  const header = req.get('Authorization');
  if (!header) {
    throw authenticationFailed(
      "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
    );
  }
  const [scheme, credential = ''] = header.trim().split(/\s+/, 2);
  let key = '';
  if (scheme?.toLowerCase() === 'bearer') key = credential;
  if (scheme?.toLowerCase() === 'basic') key = Buffer.from(credential, 'base64').toString('utf8').split(':')[0] ?? '';
  if (!/^sk_test_[A-Za-z0-9_]+$/.test(key)) {
    throw authenticationFailed(
      key === ''
        ? 'Invalid API Key provided: the Authorization header must be "Bearer sk_test_…".'
        : `Invalid API Key provided: ${maskKey(key)} (the local Stripe stand-in accepts test secret keys, sk_test_…)`,
    );
  }
  return key;
}

function rawParams(req: Request): string {
  if (req.method === 'GET' || req.method === 'DELETE') {
    const query = req.originalUrl.indexOf('?');
    return query === -1 ? '' : req.originalUrl.slice(query + 1);
  }
  return typeof req.body === 'string' ? req.body : '';
}

function sendError(res: Response, error: StripeFakeError): void {
  res.status(error.status).json(error.toBody());
}

export function apiRouter(ctx: FakeContext): Router {
  const router = Router();
  const { store } = ctx;

  router.use((req, res, next) => {
    res.set('Request-Id', newId('req'));
    try {
      res.locals.apiKey = apiKeyFrom(req);
      next();
    } catch (error) {
      if (error instanceof StripeFakeError) sendError(res, error);
      else next(error);
    }
  });
  router.use(express.text({ type: () => true, limit: '1mb' }));

  function endpoint(kind: string, handler: Handler): RequestHandler {
    return (req, res) => {
      const requestId = res.get('Request-Id') ?? null;
      let params: ParamMap;
      try {
        params = parseFormParams(rawParams(req));
      } catch (error) {
        if (!(error instanceof FormParamsError)) throw error;
        sendError(res, new StripeFakeError(400, 'invalid_request_error', error.message, 'parameter_invalid', error.param ?? undefined));
        return;
      }

      const idempotencyKey = req.method === 'POST' ? (req.get('Idempotency-Key') ?? null) : null;
      const storeKey = `${res.locals.apiKey as string}\n${idempotencyKey ?? ''}`;
      const fingerprint = `${req.method} ${req.path} ${canonicalParams(params)}`;
      if (idempotencyKey !== null) {
        if (idempotencyKey.length > MAX_IDEMPOTENCY_KEY_LENGTH) {
          sendError(res, new StripeFakeError(400, 'invalid_request_error', `Idempotency-Key must be at most ${MAX_IDEMPOTENCY_KEY_LENGTH} characters long.`));
          return;
        }
        const saved = store.idempotency.get(storeKey);
        if (saved && saved.fingerprint === fingerprint) {
          res.set('Idempotent-Replayed', 'true').status(saved.status).json(saved.body);
          return;
        }
        if (saved) {
          sendError(
            res,
            new StripeFakeError(
              400,
              'idempotency_error',
              `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
            ),
          );
          return;
        }
      }

      const reader = new ParamReader(params);
      let status = 200;
      let body: unknown;
      let save = true;
      try {
        const expand = reader.stringList('expand');
        checkExpand(kind, expand);
        const object = handler({
          params: reader,
          id: typeof req.params.id === 'string' ? req.params.id : '',
          request: { requestId, idempotencyKey, apiVersion: req.get('Stripe-Version') ?? null },
        });
        body = present(ctx, object, expand);
      } catch (error) {
        if (!(error instanceof StripeFakeError)) throw error;
        status = error.status;
        body = error.toBody();
        save = !error.beforeExecution;
      }
      if (idempotencyKey !== null && save) store.idempotency.set(storeKey, { fingerprint, status, body });
      res.status(status).json(body);
    };
  }

  router.post(
    '/checkout/sessions',
    endpoint('checkout.session', ({ params, request }) => createCheckoutSession(ctx, params, request).session),
  );
  router.get(
    '/checkout/sessions/:id',
    endpoint('checkout.session', ({ params, id }) => {
      params.done();
      return findSession(ctx, id, 'id').session;
    }),
  );
  router.post(
    '/checkout/sessions/:id/expire',
    endpoint('checkout.session', ({ params, id, request }) => {
      params.done();
      return expireCheckoutSession(ctx, id, request).session;
    }),
  );
  router.get(
    '/checkout/sessions/:id/line_items',
    endpoint('list', ({ params, id }) => {
      const limit = params.integer('limit', { min: 1, max: 100 }) ?? 10;
      params.done();
      findSession(ctx, id, 'id');
      return lineItemList(ctx, id, limit);
    }),
  );
  router.get(
    '/payment_intents/:id',
    endpoint('payment_intent', ({ params, id }) => {
      params.done();
      const paymentIntent = store.paymentIntents.get(id);
      if (!paymentIntent) throw resourceMissing('payment_intent', id, 'intent');
      return paymentIntent;
    }),
  );
  router.get(
    '/charges/:id',
    endpoint('charge', ({ params, id }) => {
      params.done();
      const charge = store.charges.get(id);
      if (!charge) throw resourceMissing('charge', id);
      return charge;
    }),
  );
  router.post('/refunds', endpoint('refund', ({ params, request }) => createRefund(ctx, params, request)));
  router.get(
    '/refunds/:id',
    endpoint('refund', ({ params, id }) => {
      params.done();
      const refund = store.refunds.get(id);
      if (!refund) throw resourceMissing('refund', id);
      return refund;
    }),
  );
  router.get(
    '/refunds',
    endpoint('list', ({ params }) => {
      const paymentIntent = params.string('payment_intent');
      const charge = params.string('charge');
      const limit = params.integer('limit', { min: 1, max: 100 }) ?? 10;
      params.done();
      // Stripe lists newest first.
      const matching = [...store.refunds.values()]
        .filter((refund) => (paymentIntent === undefined || refund.payment_intent === paymentIntent) && (charge === undefined || refund.charge === charge))
        .reverse();
      const list: RefundList = { object: 'list', data: matching.slice(0, limit), has_more: matching.length > limit, url: '/v1/refunds' };
      return list;
    }),
  );
  router.get(
    '/disputes/:id',
    endpoint('dispute', ({ params, id }) => {
      params.done();
      return findDispute(ctx, id);
    }),
  );
  router.get(
    '/events/:id',
    endpoint('event', ({ params, id }) => {
      params.done();
      const entry = store.events.get(id);
      if (!entry) throw resourceMissing('event', id);
      return entry.event;
    }),
  );

  router.use((req, res) => {
    sendError(
      res,
      new StripeFakeError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.baseUrl}${req.path}). The local Stripe stand-in serves only the endpoints listed in docker-local/README.md.`),
    );
  });
  return router;
}
