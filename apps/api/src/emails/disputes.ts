/**
 * To the guild's treasurers, about a card payment the buyer's bank disputes. Money e-mails: always sent. Amounts
 * come formatted in the order's currency, moments in the guild's time zone; names and titles are members' own
 * words and are escaped like everything else `html` interpolates.
 */
import { button, html, layout, type RenderedEmail } from './render.ts';

interface DisputeMail {
  guildName: string;
  /** The treasurer's name. */
  name: string;
  reference: string;
  link: string;
  /** What the bank took or may take back. */
  amount: string;
}

const ANSWER_WHERE =
  'The guild answers a dispute in the card service’s own dashboard, not in Scrap Relay: the evidence goes there (a tracking number, the listing, messages with the buyer).';
const LAW = 'How disputes run is set by the card networks’ rules and local law; the card service’s dashboard has the details of this one.';

/** A dispute opened: what, why, by when, where the guild answers, and what the order shows as evidence. */
export function disputeOpened(
  p: DisputeMail & { buyerName: string; sellerName: string; titles: string[]; reason: string; dueBy: string | null; fulfilment: string },
): RenderedEmail {
  const what = `The bank of ${p.buyerName}, who bought order ${p.reference} from ${p.sellerName}, has opened a dispute on the card payment: ${p.amount}.`;
  const due = p.dueBy ? `The bank wants the guild’s evidence by ${p.dueBy}.` : 'The bank has not asked the guild for evidence.';
  const meanwhile =
    'While the bank decides, the card service may already hold the amount back from the guild’s balance, and the order cannot be refunded. Scrap Relay changes the ledger only once the bank decides: if the guild loses, the seller’s credit for this order is taken back.';
  return layout({
    guildName: p.guildName,
    subject: `The buyer’s bank is disputing the payment for order ${p.reference}`,
    text: `Hello ${p.name},\n\n${what}\n${p.titles.map((t) => `- ${t}`).join('\n')}\n\nReason the bank gave: ${p.reason}.\n${due}\n${p.fulfilment}\n\n${ANSWER_WHERE}\n\n${meanwhile}\n${LAW}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><ul>${p.titles.map((t) => html`<li>${t}</li>`)}</ul>
<p>Reason the bank gave: <strong>${p.reason}</strong>.<br>${p.dueBy ? html`The bank wants the guild’s evidence by <strong>${p.dueBy}</strong>.` : due}<br>${p.fulfilment}</p>
<p><strong>${ANSWER_WHERE}</strong></p><p>${meanwhile}</p><p style="font-size:15px">${LAW}</p>${button(p.link, 'Open the order')}`,
  });
}

/**
 * The bank decided for the buyer. `share`: the seller's credit taken back (null when none stood); `owing`: what the
 * seller owes the guild after it, when their sales had been paid out already (null when nothing is owed);
 * `notYetPosted`: the order had not gone out, so the seller needs telling whether to send it.
 */
export function disputeLost(p: DisputeMail & { sellerName: string; share: string | null; owing: string | null; notYetPosted: boolean }): RenderedEmail {
  const what = `The buyer’s bank decided the dispute on order ${p.reference} for the buyer: ${p.amount} went back to the buyer’s card through the card service.`;
  const ledger = [
    'Scrap Relay has written it in the ledger.',
    p.share ? `${p.sellerName}’s credit of ${p.share} for this order is taken back, and the guild’s fee on it with it.` : 'No credit for this order was left to take back, so the guild bears it.',
    p.owing ? `${p.sellerName} had been paid out already and now owes the guild ${p.owing}.` : '',
    p.notYetPosted ? `The order is not marked as sent yet: please tell ${p.sellerName} whether to send it.` : '',
  ]
    .filter(Boolean)
    .join(' ');
  const fees = 'Any fee the card service charged for the dispute is in its dashboard, not in Scrap Relay’s ledger.';
  return layout({
    guildName: p.guildName,
    subject: `The buyer’s bank took back the payment for order ${p.reference}`,
    text: `Hello ${p.name},\n\n${what}\n\n${ledger}\n${fees}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><p>${ledger}</p><p style="font-size:15px">${fees}</p>${button(p.link, 'Open the order')}`,
  });
}

/** The bank decided for the guild (`won`), or closed its questions without a dispute (`closed`): the money stays. */
export function disputeKept(p: DisputeMail & { how: 'won' | 'closed' }): RenderedEmail {
  const what =
    p.how === 'won'
      ? `The buyer’s bank decided the dispute on order ${p.reference} for the guild: the ${p.amount} stays with the guild.`
      : `The buyer’s bank closed its questions about the payment for order ${p.reference} without disputing it: the ${p.amount} stays with the guild.`;
  const after = 'Nothing changes in the ledger. If the card service held the amount back while the bank decided, it returns it; its dashboard shows when.';
  return layout({
    guildName: p.guildName,
    subject: p.how === 'won' ? `The guild won the dispute on order ${p.reference}` : `The bank closed its questions on order ${p.reference}`,
    text: `Hello ${p.name},\n\n${what}\n${after}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><p>${after}</p>${button(p.link, 'Open the order')}`,
  });
}
