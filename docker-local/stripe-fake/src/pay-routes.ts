/** `/pay/:sessionId`: the hosted payment page a Checkout Session's `url` points to. */
import express, { type Response, Router } from 'express';
import { findSession, paySession, successRedirect, type CardInput } from './checkout.ts';
import type { FakeContext } from './context.ts';
import { StripeFakeError } from './errors.ts';
import { FormParamsError, parseFormParams } from './form-params.ts';
import { EMPTY_FORM, renderMessagePage, renderPayPage, type PayField, type PayFormState } from './pay-page.ts';
import type { SessionRecord } from './store.ts';

type CardCheck = { ok: true; card: CardInput } | { ok: false; field: PayField; message: string };

/** Reads "MM / YY", "MM/YY", "MMYY" or "MM/YYYY". */
export function parseExpiry(text: string): { month: number; year: number } | null {
  const match = /^(\d{1,2})\s*\/?\s*(\d{2}|\d{4})$/.exec(text.trim());
  if (!match) return null;
  const month = Number(match[1]);
  const year = Number(match[2]) + ((match[2] ?? '').length === 2 ? 2000 : 0);
  if (month < 1 || month > 12) return null;
  return { month, year };
}

/** Checks the form as a card form would; which test card it is gets decided by paySession. */
export function checkCardForm(form: Record<string, string>, nowSeconds: number): CardCheck {
  const number = (form.card_number ?? '').replace(/[\s-]/g, '');
  if (number === '') return { ok: false, field: 'card_number', message: 'Enter a card number.' };
  if (!/^\d{12,19}$/.test(number)) return { ok: false, field: 'card_number', message: 'Your card number is incomplete or has characters other than digits.' };
  const expiry = parseExpiry(form.expiry ?? '');
  if (!expiry) return { ok: false, field: 'expiry', message: 'Enter the expiry date as MM / YY.' };
  const now = new Date(nowSeconds * 1000);
  const thisMonth = now.getUTCFullYear() * 12 + now.getUTCMonth();
  if (expiry.year * 12 + (expiry.month - 1) < thisMonth) {
    return { ok: false, field: 'expiry', message: "Your card's expiry date is in the past." };
  }
  if (!/^\d{3,4}$/.test((form.cvc ?? '').trim())) {
    return { ok: false, field: 'cvc', message: 'Enter the 3 or 4 digit security code (CVC).' };
  }
  return { ok: true, card: { number, expMonth: expiry.month, expYear: expiry.year } };
}

function sendPage(res: Response, status: number, html: string): void {
  res.status(status).set('Cache-Control', 'no-store').type('html').send(html);
}

function closedPage(res: Response, record: SessionRecord): void {
  const { session } = record;
  if (session.status === 'complete') {
    sendPage(
      res,
      409,
      renderMessagePage('This payment is already complete', 'Nothing more to pay: this checkout was paid earlier.', {
        href: successRedirect(session),
        text: 'Continue',
      }),
    );
    return;
  }
  sendPage(
    res,
    410,
    renderMessagePage(
      'This payment page has expired',
      'The time to pay ran out or the checkout was cancelled, so no payment can be made here. Start the checkout again from the site you came from.',
      session.cancel_url ? { href: session.cancel_url, text: 'Go back' } : undefined,
    ),
  );
}

function sessionOrNotFound(ctx: FakeContext, id: string, res: Response): SessionRecord | null {
  try {
    return findSession(ctx, id);
  } catch (error) {
    if (!(error instanceof StripeFakeError) || error.status !== 404) throw error;
    sendPage(res, 404, renderMessagePage('Payment page not found', 'There is no checkout with this address.'));
    return null;
  }
}

/** Top-level string fields of the posted form; nested or odd keys are ignored. */
function formFields(body: unknown): Record<string, string> {
  let parsed;
  try {
    parsed = parseFormParams(typeof body === 'string' ? body : '');
  } catch (error) {
    if (error instanceof FormParamsError) return {};
    throw error;
  }
  const out: Record<string, string> = {};
  for (const [key, value] of Object.entries(parsed)) if (typeof value === 'string') out[key] = value;
  return out;
}

export function payRouter(ctx: FakeContext): Router {
  const router = Router();

  router.get('/:sessionId', (req, res) => {
    const record = sessionOrNotFound(ctx, req.params.sessionId, res);
    if (!record) return;
    if (record.session.status !== 'open') return closedPage(res, record);
    sendPage(res, 200, renderPayPage(record, EMPTY_FORM));
  });

  router.post('/:sessionId', express.text({ type: 'application/x-www-form-urlencoded', limit: '16kb' }), async (req, res) => {
    const record = sessionOrNotFound(ctx, req.params.sessionId, res);
    if (!record) return;
    if (record.session.status !== 'open') return closedPage(res, record);

    const form = formFields(req.body);
    const values = { card_number: form.card_number ?? '', expiry: form.expiry ?? '' };
    const fail = (status: number, field: PayField | null, message: string): void => {
      const state: PayFormState = { values, error: { field, message } };
      sendPage(res, status, renderPayPage(record, state));
    };

    const check = checkCardForm(form, ctx.clock());
    if (!check.ok) return fail(400, check.field, check.message);
    const outcome = await paySession(ctx, record.session.id, check.card);
    switch (outcome.kind) {
      case 'paid':
        res.redirect(303, successRedirect(outcome.record.session));
        return;
      case 'declined':
        return fail(402, 'card_number', 'Your card was declined.');
      case 'not_a_test_card':
        return fail(400, 'card_number', 'Use a test card number: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.');
      case 'not_open':
        return closedPage(res, outcome.record);
    }
  });

  return router;
}
