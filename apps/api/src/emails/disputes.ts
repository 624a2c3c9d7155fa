/**
 * To the guild's treasurers, and to the order's seller, about a card payment the buyer's bank disputes. Money
 * e-mails: always sent. Amounts
 * come formatted in the order's currency, moments in the guild's time zone; names and titles are members' own
 * words and are escaped like everything else `html` interpolates.
 */
import type { Fulfilment } from '@scrap-relay/shared';
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
  p: DisputeMail & { buyerName: string; sellerName: string; titles: string[]; reason: string; dueBy: string | null; fulfilment: string; fee: string | null },
): RenderedEmail {
  const what = `The bank of ${p.buyerName}, who bought order ${p.reference} from ${p.sellerName}, has opened a dispute on the card payment: ${p.amount}.`;
  const due = p.dueBy ? `The bank wants the guild’s evidence by ${p.dueBy}.` : 'The bank has not asked the guild for evidence.';
  const meanwhile = [
    'While the bank decides, the card service may already hold the amount back from the guild’s balance, and the order cannot be refunded. Scrap Relay takes back the seller’s credit for this order only if the guild loses.',
    p.fee ? `The card service charged a dispute fee of ${p.fee}: it is in the ledger as the guild’s cost.` : '',
  ]
    .filter(Boolean)
    .join(' ');
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
export function disputeLost(p: DisputeMail & { sellerName: string; share: string | null; owing: string | null; notYetPosted: boolean; fee: DisputeFee }): RenderedEmail {
  const what = `The buyer’s bank decided the dispute on order ${p.reference} for the buyer: ${p.amount} went back to the buyer’s card through the card service.`;
  const ledger = [
    'Scrap Relay has written it in the ledger.',
    p.share ? `${p.sellerName}’s credit of ${p.share} for this order is taken back, and so is the guild’s fee on the order.` : 'No credit for this order was left to take back, so the guild bears it.',
    p.owing ? `${p.sellerName} had been paid out already and now owes the guild ${p.owing}.` : '',
    p.notYetPosted ? `The order is not marked as sent yet: please tell ${p.sellerName} whether to send it.` : '',
  ]
    .filter(Boolean)
    .join(' ');
  const fees = feeLine(p.fee, 'lost');
  return layout({
    guildName: p.guildName,
    subject: `The buyer’s bank took back the payment for order ${p.reference}`,
    text: `Hello ${p.name},\n\n${what}\n\n${ledger}\n${fees}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><p>${ledger}</p><p style="font-size:15px">${fees}</p>${button(p.link, 'Open the order')}`,
  });
}

/** The card service's dispute fee as the ledger holds it after this news: what stands, and what came back with it. */
export interface DisputeFee {
  standing: string | null;
  returned: string | null;
}

/** `lost`: the fee stays; after a win the card service may still give it back, in news of its own. */
function feeLine(fee: DisputeFee, outcome: 'lost' | 'won' | 'closed'): string {
  if (fee.returned) return `The card service gave back its dispute fee of ${fee.returned}; the ledger shows it returned.`;
  if (fee.standing && outcome === 'lost') return `The card service’s dispute fee of ${fee.standing} stays the guild’s cost, as the ledger shows.`;
  if (fee.standing) return `The card service’s dispute fee of ${fee.standing} is in the ledger as the guild’s cost; if the card service gives it back, the ledger will show that too.`;
  return 'The card service charged no fee for this dispute.';
}

/** The bank decided for the guild (`won`), or closed its questions without a dispute (`closed`): the money stays. */
export function disputeKept(p: DisputeMail & { how: 'won' | 'closed'; fee: DisputeFee }): RenderedEmail {
  const what =
    p.how === 'won'
      ? `The buyer’s bank decided the dispute on order ${p.reference} for the guild: the ${p.amount} stays with the guild.`
      : `The buyer’s bank closed its questions about the payment for order ${p.reference} without disputing it: the ${p.amount} stays with the guild.`;
  const after = `The seller’s credit and the guild’s fee for the order stand. If the card service held the amount back while the bank decided, it returns it; its dashboard shows when. ${feeLine(p.fee, p.how)}`;
  return layout({
    guildName: p.guildName,
    subject: p.how === 'won' ? `The guild won the dispute on order ${p.reference}` : `The bank closed its questions on order ${p.reference}`,
    text: `Hello ${p.name},\n\n${what}\n${after}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><p>${after}</p>${button(p.link, 'Open the order')}`,
  });
}

/**
 * What the seller hears at each step. `bag`: where the order's bundles are (gone to the buyer, still with the
 * seller, or nowhere because the order was cancelled or refunded); `fulfilment`: by post or at a meeting.
 */
export type SellerDisputeNews =
  | { stage: 'open'; bag: Bag; fulfilment: Fulfilment }
  | { stage: 'lost'; share: string | null; owing: string | null; bag: Bag; fulfilment: Fulfilment }
  | { stage: 'won' | 'closed'; bag: Bag };

type Bag = 'out' | 'waiting' | 'none';

/** What the seller should do with the bundles while the bank decides, or after it decided for the buyer. */
function bagLine(stage: 'open' | 'lost', bag: Bag, fulfilment: Fulfilment): string {
  if (bag === 'out') {
    if (stage === 'lost') return '';
    return fulfilment === 'post'
      ? 'Please keep your proof that the bundles went out (the tracking number or the post office’s receipt): the treasurer may ask you for it.'
      : 'The bundles were handed over at a guild meeting; the treasurer may ask you about the handover.';
  }
  if (bag === 'waiting') {
    const give = fulfilment === 'post' ? 'send them' : 'bring them to the meeting';
    return stage === 'open'
      ? `The bundles have not gone out yet: please keep them until the treasurer tells you whether to ${give}.`
      : `The bundles have not gone out: please do not ${give} until the treasurer tells you what to do.`;
  }
  return '';
}

/**
 * To the order's seller. They answer nothing themselves (the treasurer does, in the card service's dashboard), but
 * their credit depends on the outcome, the treasurer may need their proof of posting, and bundles not yet out
 * should wait for the treasurer's word. The bank's reasons and deadlines stay with the treasurers. For an order
 * already cancelled or refunded there is no credit and no bag: the seller only hears that nothing is asked of them.
 */
export function disputeForSeller(p: { guildName: string; name: string; reference: string; link: string; news: SellerDisputeNews }): RenderedEmail {
  const { news } = p;
  const settledAlready = 'The order was cancelled or refunded already, so nothing changes for you and nothing is asked of you.';
  let subject: string;
  let lines: string[];
  if (news.stage === 'open') {
    subject = `The buyer’s bank is questioning the payment for order ${p.reference}`;
    lines = [
      `The buyer’s bank has opened a dispute on the card payment for order ${p.reference}. The guild’s treasurer answers it with the card service.`,
      news.bag === 'none' ? settledAlready : bagLine('open', news.bag, news.fulfilment),
      news.bag === 'none' ? '' : 'Your credit for this order stays unless the bank decides for the buyer.',
    ];
  } else if (news.stage === 'lost') {
    subject = `The buyer’s bank took back the payment for order ${p.reference}`;
    lines = [
      `The buyer’s bank decided the dispute on order ${p.reference} for the buyer, and the payment went back to the buyer’s card.`,
      news.share ? `Your credit of ${news.share} for this order is taken back.` : news.bag === 'none' ? settledAlready : 'None of your credit for this order was left to take back.',
      news.owing ? `You had been paid out already, so you now owe the guild ${news.owing}; the treasurer will be in touch about settling it.` : '',
      bagLine('lost', news.bag, news.fulfilment),
    ];
  } else {
    subject = `The payment for order ${p.reference} stands`;
    lines = [
      news.stage === 'won'
        ? `The buyer’s bank decided the dispute on order ${p.reference} for the guild.`
        : `The buyer’s bank closed its questions about the payment for order ${p.reference} without disputing it.`,
      news.bag === 'none' ? 'Nothing changes for you.' : 'Your credit for this order stands; there is nothing for you to do.',
    ];
  }
  lines = lines.filter(Boolean);
  return layout({
    guildName: p.guildName,
    subject,
    text: `Hello ${p.name},\n\n${lines.join('\n\n')}\n\nThe order: ${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p>${lines.map((line) => html`<p>${line}</p>`)}${button(p.link, 'Open the order')}`,
  });
}
