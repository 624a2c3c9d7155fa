import type { PayoutInput } from '@scrap-relay/shared';
import { html, layout, type RenderedEmail } from './render.ts';

const button = (link: string, label: string) =>
  html`<p><a href="${link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">${label}</a></p>`;

const METHOD_LABELS: Record<PayoutInput['method'], string> = { bank_transfer: 'by bank transfer', cheque: 'by cheque', cash: 'in cash', other: '' };

/**
 * The treasurer recorded a payout to a seller. Money e-mail: always sent. Amounts come formatted in the guild's
 * currency and the moment in the guild's time zone; `owedNow` is what the guild may still pay out after this payout,
 * null for nothing; `waiting` is credit for bags not yet posted or handed over, null for none.
 */
export function payoutRecorded(p: {
  guildName: string;
  name: string;
  amount: string;
  method: PayoutInput['method'];
  reference: string;
  recordedAt: string;
  owedNow: string | null;
  waiting: string | null;
  link: string;
}): RenderedEmail {
  const how = METHOD_LABELS[p.method] && ` ${METHOD_LABELS[p.method]}`;
  const reference = p.reference ? ` Reference: ${p.reference}.` : '';
  const owed = p.owedNow ? `After this payout the guild still owes you ${p.owedNow} for your sales.` : 'With this payout the guild has paid you everything your sales earned so far.';
  const waiting = p.waiting
    ? ` A further ${p.waiting} is for bags you have not posted or handed over yet; it can be paid once you mark them posted, or once they are handed over at a meeting.`
    : '';
  const balance = `${owed}${waiting} Your sales, and what each one earned you, are in your orders as a seller; the treasurer can go through your balance with you.`;
  return layout({
    guildName: p.guildName,
    subject: `The guild paid you ${p.amount}`,
    text: `Hello ${p.name},\n\nThe guild's treasurer recorded a payout of ${p.amount} to you${how} on ${p.recordedAt}.${reference}\n\n${balance}\n${p.link}\n\nIf the money has not reached you, please tell the treasurer.`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The guild’s treasurer recorded a payout of <strong>${p.amount}</strong> to you${how} on ${p.recordedAt}.${reference}</p><p>${balance}</p>${button(p.link, 'See my sales')}<p style="font-size:15px">If the money has not reached you, please tell the treasurer.</p>`,
  });
}
