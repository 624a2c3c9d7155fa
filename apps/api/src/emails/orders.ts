import type { PostalAddress } from '@scrap-relay/shared';
import { html, layout, type RenderedEmail } from './render.ts';

interface Base {
  guildName: string;
  name: string;
  reference: string;
  titles: string[];
  link: string;
}

const list = (titles: string[]) => html`<ul>${titles.map((t) => html`<li>${t}</li>`)}</ul>`;
const button = (link: string, label: string) =>
  html`<p><a href="${link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">${label}</a></p>`;
const addressLines = (a: PostalAddress) => [a.name, a.line1, a.line2, `${a.town} ${a.region}`.trim(), a.postalCode, a.country].filter(Boolean);

/**
 * `paid` is what the buyer paid (null for a gift); `share` what the seller is owed from it, the price less the
 * guild's fee plus the postage, which the treasurer pays out (null when nothing is owed).
 */
export function orderSoldToSeller(
  p: Base & { buyerName: string; address: PostalAddress | null; meeting: string | null; paid: string | null; share: string | null; postageIncluded: boolean },
): RenderedEmail {
  const where = p.address
    ? `Please post it to:\n${addressLines(p.address).join('\n')}`
    : `Please bring it to the meeting: ${p.meeting ?? ''}`;
  const money = p.paid
    ? `${p.buyerName} paid ${p.paid}.${p.share ? ` Your share is ${p.share}${p.postageIncluded ? ', postage included' : ''}; the guild's treasurer pays it out once ${p.address ? 'you have marked the parcel posted' : 'it has been handed over at the meeting'}.` : ''}`
    : 'It is a gift: nothing was paid.';
  const label = p.address
    ? `Write ${p.reference} on the parcel, so it can be matched to the order.`
    : `Write ${p.reference} and ${p.buyerName}'s name on the bag, so it can be matched to the order at the meeting.`;
  const linkText = p.address ? 'Open the order and packing slip' : 'Open the order';
  const privacy = p.address ? 'Keep the address to yourself and use it only for this parcel.' : '';
  return layout({
    guildName: p.guildName,
    subject: `Rehomed: order ${p.reference} from ${p.buyerName}`,
    text: `Hello ${p.name},\n\n${p.buyerName} took:\n${p.titles.map((t) => `- ${t}`).join('\n')}\n\n${money}\n\n${where}\n\n${label}\n\n${p.address ? 'Packing slip and order' : 'The order'}: ${p.link}${privacy ? `\n\n${privacy}` : ''}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.buyerName}</strong> took:</p>${list(p.titles)}<p>${money}</p>
${p.address ? html`<p>Please post it to:</p><p style="white-space:pre-line;padding:12px 16px;background:#f6f1e7">${addressLines(p.address).join('\n')}</p>` : html`<p>Please bring it to the meeting: <strong>${p.meeting ?? ''}</strong></p>`}
<p>${label}</p>${button(p.link, linkText)}${privacy ? html`<p style="font-size:15px">${privacy}</p>` : ''}`,
  });
}

export function orderConfirmedToBuyer(p: Base & { amount: string; meeting: string | null }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Order ${p.reference} is confirmed`,
    text: `Hello ${p.name},\n\nYour order ${p.reference} is confirmed${p.amount ? ` (paid ${p.amount})` : ''}:\n${p.titles.map((t) => `- ${t}`).join('\n')}\n\n${p.meeting ? `Collect it at the meeting: ${p.meeting}.` : 'The seller will post it and let you know.'}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>Your order <strong>${p.reference}</strong> is confirmed${p.amount ? html` (paid ${p.amount})` : ''}:</p>${list(p.titles)}
<p>${p.meeting ? html`Collect it at the meeting: <strong>${p.meeting}</strong>.` : 'The seller will post it and let you know.'}</p>${button(p.link, 'See the order')}`,
  });
}

export function orderPostedToBuyer(p: Base & { trackingNumber: string | null; choicesLink: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    choice: { kind: 'posting', link: p.choicesLink },
    subject: `Order ${p.reference} is in the post`,
    text: `Hello ${p.name},\n\nThe seller posted your order ${p.reference}.${p.trackingNumber ? ` Tracking number: ${p.trackingNumber}.` : ''}\nWhen it arrives, mark it received: ${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The seller posted your order <strong>${p.reference}</strong>.${p.trackingNumber ? html` Tracking number: <strong>${p.trackingNumber}</strong>.` : ''}</p><p>When it arrives, please mark it received.</p>${button(p.link, 'Mark it received')}`,
  });
}

/** `afterDays`: nobody marked it, and it was taken as received that many days after posting. */
export function orderReceivedToSeller(p: Base & { afterDays: number | null; choicesLink: string }): RenderedEmail {
  const how = p.afterDays
    ? `Order ${p.reference} was posted ${p.afterDays} days ago and the buyer has not reported a problem, so it now counts as received.`
    : `The buyer marked order ${p.reference} as received.`;
  return layout({
    guildName: p.guildName,
    choice: { kind: 'posting', link: p.choicesLink },
    subject: `Order ${p.reference} arrived`,
    text: `Hello ${p.name},\n\n${how} Thank you for passing your scraps on.\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${how} Thank you for passing your scraps on.</p>${button(p.link, 'See the order')}`,
  });
}

export function orderTakenAsReceivedToBuyer(p: Base & { afterDays: number }): RenderedEmail {
  const what = `Order ${p.reference} was posted ${p.afterDays} days ago, so it now counts as received.`;
  const ask = 'If it has not arrived, or something is wrong with it, report a problem on the order and the guild’s treasurer will look into it.';
  return layout({
    guildName: p.guildName,
    subject: `Order ${p.reference} now counts as received`,
    text: `Hello ${p.name},\n\n${what}\n\n${ask}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><p>${ask}</p>${button(p.link, 'See the order')}`,
  });
}

/** Each side is told what the cancellation means for them: the buyer's money, the seller's bundles. */
/** `takenBack`: cancelled after the buyer's bank took the payment back in a dispute, so nothing more is refunded. */
export function orderCancelled(
  p: Base & { side: 'buyer' | 'seller'; refunded: string | null; takenBack?: boolean; reason: string | null; fulfilment?: 'post' | 'meeting' },
): RenderedEmail {
  const owed = p.refunded
    ? `The buyer's payment of ${p.refunded} is being refunded, so nothing is owed to you for it. `
    : p.takenBack
      ? 'The buyer’s bank took the payment back, so nothing is owed to you for it. '
      : '';
  const after =
    p.side === 'buyer'
      ? p.refunded
        ? `Your payment of ${p.refunded} is being refunded to your card; card refunds can take a few days to show.`
        : p.takenBack
          ? 'Your bank has already returned the payment to your card, so nothing more is refunded.'
          : 'Nothing was charged.'
      : `${owed}${p.fulfilment === 'meeting' ? 'Please do not bring it to the meeting.' : 'Please do not post it.'} The bundles are back on the shelf, unless you had withdrawn them.`;
  return layout({
    guildName: p.guildName,
    subject: `Order ${p.reference} was cancelled`,
    text: `Hello ${p.name},\n\nOrder ${p.reference} was cancelled:\n${p.titles.map((t) => `- ${t}`).join('\n')}\n${p.reason ? `\nReason: ${p.reason}\n` : ''}\n${after}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>Order <strong>${p.reference}</strong> was cancelled:</p>${list(p.titles)}${p.reason ? html`<p>Reason: ${p.reason}</p>` : ''}<p>${after}</p>${button(p.link, 'See the order')}`,
  });
}

export function orderRefunded(p: Base & { refunded: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Refund for order ${p.reference}`,
    text: `Hello ${p.name},\n\nThe guild's treasurer refunded ${p.refunded} for order ${p.reference}. Card refunds can take a few days to show.\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The guild’s treasurer refunded <strong>${p.refunded}</strong> for order <strong>${p.reference}</strong>. Card refunds can take a few days to show.</p>${button(p.link, 'See the order')}`,
  });
}

/**
 * `share`: this order's amount the guild owed the seller, now taken back (null for a gift); `owing`: what the
 * seller owes the guild after it, when earlier payouts had already paid it out (null when nothing is owed).
 */
export function orderRefundedToSeller(p: Base & { refunded: string; share: string | null; owing: string | null; notYetPosted: boolean }): RenderedEmail {
  const money = [
    p.notYetPosted ? 'Please do not post it; the bundles are back on the shelf, unless you had withdrawn them.' : '',
    p.share ? `Your share of ${p.share} for it is taken off what the guild owes you.` : '',
    p.owing ? `It had already been paid out to you, so you now owe the guild ${p.owing}; the treasurer will be in touch.` : '',
  ]
    .filter(Boolean)
    .join(' ');
  return layout({
    guildName: p.guildName,
    subject: `Order ${p.reference} was refunded`,
    text: `Hello ${p.name},\n\nThe guild's treasurer refunded the buyer's ${p.refunded} for order ${p.reference}.\n${money ? `${money}\n` : ''}${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The guild’s treasurer refunded the buyer’s <strong>${p.refunded}</strong> for order <strong>${p.reference}</strong>.</p>${money ? html`<p>${money}</p>` : ''}${button(p.link, 'See the order')}`,
  });
}

/** A payment that arrived after its order had been cancelled is refunded in full. */
export function latePaymentRefunding(p: Base & { paid: string }): RenderedEmail {
  const what = `Your payment of ${p.paid} for order ${p.reference} came in after the order had already been cancelled (the bundles were held only for a limited time). It is being refunded to your card in full; card refunds can take a few days to show.`;
  return layout({
    guildName: p.guildName,
    subject: `Your payment for order ${p.reference} is being refunded`,
    text: `Hello ${p.name},\n\n${what}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p>${button(p.link, 'See the order')}`,
  });
}

export function problemReported(p: Base & { message: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `A problem was reported on order ${p.reference}`,
    text: `Hello ${p.name},\n\nThe buyer of order ${p.reference} reported a problem:\n\n${p.message}\n\nThe order, and a refund if one is due: ${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The buyer of order <strong>${p.reference}</strong> reported a problem:</p>
<blockquote style="margin:0 0 16px;padding:12px 16px;border-left:4px solid #8a2b2b;background:#f6f1e7;white-space:pre-wrap">${p.message}</blockquote>${button(p.link, 'Open the order')}`,
  });
}

/**
 * To the seller: the buyer reported a problem with the order. What the buyer wrote stays with the treasurer, who
 * decides about refunds; the seller learns that there is something to look into, and what may be asked of them.
 */
export function problemReportedToSeller(p: Omit<Base, 'titles'> & { buyerName: string }): RenderedEmail {
  const what = `${p.buyerName}, who bought order ${p.reference}, reported a problem. The guild’s treasurer is looking into it and may ask you for the tracking number or how the bundles were packed.`;
  const ask = 'Please leave it to the treasurer to contact the buyer about it.';
  return layout({
    guildName: p.guildName,
    subject: `The buyer reported a problem with order ${p.reference}`,
    text: `Hello ${p.name},\n\n${what}\n\n${ask}\n\nThe order: ${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><p>${ask}</p>${button(p.link, 'Open the order')}`,
  });
}

/** To treasurers: the automatic refund of a late payment failed on every try. */
export function lateRefundFailed(p: Base & { paid: string }): RenderedEmail {
  const what = `A payment of ${p.paid} for order ${p.reference} came in after the order had been cancelled. Scrap Relay tried to refund it for several hours, and the card payment service refused or did not answer every time, so the buyer has not been refunded yet.`;
  const ask = 'Please refund it in the card payment service’s own dashboard, and let the buyer know.';
  return layout({
    guildName: p.guildName,
    subject: `A refund for order ${p.reference} needs you`,
    text: `Hello ${p.name},\n\n${what}\n\n${ask}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p><p>${ask}</p>${button(p.link, 'Open the order')}`,
  });
}

export function postReminderToSeller(p: Base & { buyerName: string; days: number }): RenderedEmail {
  const what = `${p.buyerName} paid for order ${p.reference} ${p.days} days ago, and it is not marked posted yet.`;
  const ask =
    'If it is in the post, mark it posted so the buyer knows. If you cannot send it after all, cancel the order: the buyer is refunded and the bundles go back on the shelf.';
  return layout({
    guildName: p.guildName,
    subject: `Reminder: order ${p.reference} is waiting to be posted`,
    text: `Hello ${p.name},\n\n${what}\n${p.titles.map((t) => `- ${t}`).join('\n')}\n\n${ask}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${what}</p>${list(p.titles)}<p>${ask}</p>${button(p.link, 'Open the order and packing slip')}`,
  });
}
