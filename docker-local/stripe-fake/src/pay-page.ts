/**
 * HTML of the hosted payment page. Plain, server-rendered and usable with a
 * keyboard and a screen reader; it is the stand-in's page, not our product's.
 */
import { TEST_CARDS } from './checkout.ts';
import { formatMoney } from './money.ts';
import type { SessionRecord } from './store.ts';

export type PayField = 'card_number' | 'expiry' | 'cvc';

export interface PayFormState {
  values: { card_number: string; expiry: string };
  error: { field: PayField | null; message: string } | null;
}

export const EMPTY_FORM: PayFormState = { values: { card_number: '', expiry: '' }, error: null };

export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

const STYLE = `
  :root { color-scheme: light; }
  * { box-sizing: border-box; }
  body { margin: 0; font: 16px/1.5 system-ui, -apple-system, "Segoe UI", sans-serif; color: #1b1b1b; background: #f4f4f1; }
  main { max-width: 32rem; margin: 2rem auto; padding: 1.5rem; background: #fff; border: 1px solid #c9c9c2; border-radius: 8px; }
  .notice { margin: 0 0 1.25rem; padding: 0.75rem 1rem; background: #fff4d6; border: 2px dashed #8a6100; border-radius: 6px; }
  h1 { font-size: 1.5rem; margin: 0 0 1rem; }
  table { width: 100%; border-collapse: collapse; margin-bottom: 1.25rem; }
  caption { text-align: left; font-weight: 600; padding-bottom: 0.25rem; }
  th, td { text-align: left; padding: 0.4rem 0.25rem; border-bottom: 1px solid #deded8; }
  td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
  tfoot th, tfoot td { font-weight: 700; border-bottom: none; }
  .field { margin-bottom: 1rem; }
  .pair { display: flex; gap: 1rem; }
  .pair .field { flex: 1; }
  label { display: block; font-weight: 600; margin-bottom: 0.25rem; }
  input { width: 100%; padding: 0.6rem; font: inherit; border: 1px solid #6b6b66; border-radius: 4px; }
  input[aria-invalid="true"] { border: 2px solid #a4161a; }
  input:focus, button:focus, a:focus { outline: 3px solid #1f5fbf; outline-offset: 2px; }
  .hint { margin: 0.25rem 0 0; font-size: 0.9rem; color: #4a4a45; }
  .error { margin: 0 0 1rem; padding: 0.75rem 1rem; background: #fde8e8; border-left: 4px solid #a4161a; color: #6b0d10; font-weight: 600; }
  button { width: 100%; padding: 0.75rem; font: inherit; font-weight: 700; color: #fff; background: #1f4e8c; border: none; border-radius: 4px; cursor: pointer; }
  button:hover { background: #173c6b; }
  .cancel { display: inline-block; margin-top: 1rem; color: #1f4e8c; }
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
<p class="notice" role="note"><strong>Test payment page — no real money.</strong> This page belongs to the local Stripe stand-in; no card is charged.</p>
${body}
</main>
</body>
</html>
`;
}

function fieldAttributes(state: PayFormState, field: PayField, hintId: string | null): string {
  const invalid = state.error?.field === field;
  const describedBy = [hintId, invalid ? 'pay-error' : null].filter((id) => id !== null).join(' ');
  return `${invalid ? ' aria-invalid="true"' : ''}${describedBy ? ` aria-describedby="${describedBy}"` : ''}`;
}

export function renderPayPage(record: SessionRecord, state: PayFormState): string {
  const { session, lineItems } = record;
  const total = formatMoney(session.amount_total, session.currency);
  const rows = lineItems
    .map(
      (item) => `<tr><td>${escapeHtml(item.description)}</td><td class="num">${item.quantity}</td><td class="num">${escapeHtml(
        formatMoney(item.amount_total, item.currency),
      )}</td></tr>`,
    )
    .join('\n');
  const error = state.error ? `<p class="error" id="pay-error" role="alert">${escapeHtml(state.error.message)}</p>` : '';
  const cancel = session.cancel_url
    ? `<a class="cancel" href="${escapeHtml(session.cancel_url)}">Cancel and go back</a>`
    : '';
  const body = `<h1>Pay ${escapeHtml(total)}</h1>
<table>
<caption>What you are paying for</caption>
<thead><tr><th scope="col">Item</th><th scope="col" class="num">Quantity</th><th scope="col" class="num">Amount</th></tr></thead>
<tbody>
${rows}
</tbody>
<tfoot><tr><th scope="row" colspan="2">Total</th><td class="num">${escapeHtml(total)}</td></tr></tfoot>
</table>
${error}
<form method="post" novalidate>
<div class="field">
<label for="card-number">Card number</label>
<input id="card-number" name="card_number" inputmode="numeric" autocomplete="cc-number" required value="${escapeHtml(state.values.card_number)}"${fieldAttributes(state, 'card_number', 'card-hint')}>
<p class="hint" id="card-hint">Test cards: ${groupDigits(TEST_CARDS.succeeds)} pays; ${groupDigits(TEST_CARDS.declined)} is declined.</p>
</div>
<div class="pair">
<div class="field">
<label for="card-expiry">Expiry date (MM / YY)</label>
<input id="card-expiry" name="expiry" inputmode="numeric" autocomplete="cc-exp" placeholder="MM / YY" required value="${escapeHtml(state.values.expiry)}"${fieldAttributes(state, 'expiry', null)}>
</div>
<div class="field">
<label for="card-cvc">Security code (CVC)</label>
<input id="card-cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" maxlength="4" required${fieldAttributes(state, 'cvc', null)}>
</div>
</div>
<button type="submit">Pay ${escapeHtml(total)}</button>
</form>
${cancel}`;
  return layout(`Test payment: ${total}`, body);
}

export function renderMessagePage(title: string, message: string, link?: { href: string; text: string }): string {
  const linkHtml = link ? `<p><a class="cancel" href="${escapeHtml(link.href)}">${escapeHtml(link.text)}</a></p>` : '';
  return layout(title, `<h1>${escapeHtml(title)}</h1>\n<p>${escapeHtml(message)}</p>\n${linkHtml}`);
}

function groupDigits(number: string): string {
  return number.replace(/(\d{4})(?=\d)/g, '$1 ');
}
