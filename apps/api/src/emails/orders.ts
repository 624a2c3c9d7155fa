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

export function orderSoldToSeller(p: Base & { buyerName: string; address: PostalAddress | null; meeting: string | null; amount: string }): RenderedEmail {
  const where = p.address
    ? `Please post it to:\n${addressLines(p.address).join('\n')}`
    : `Please bring it to the meeting: ${p.meeting ?? ''}`;
  return layout({
    guildName: p.guildName,
    subject: `Rehomed: order ${p.reference} from ${p.buyerName}`,
    text: `Hello ${p.name},\n\n${p.buyerName} took:\n${p.titles.map((t) => `- ${t}`).join('\n')}\n\nPaid: ${p.amount}.\n\n${where}\n\nPacking slip and order: ${p.link}\n\nKeep the address to yourself and use it only for this parcel.`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.buyerName}</strong> took:</p>${list(p.titles)}<p>Paid: ${p.amount}.</p>
${p.address ? html`<p>Please post it to:</p><p style="white-space:pre-line;padding:12px 16px;background:#f6f1e7">${addressLines(p.address).join('\n')}</p>` : html`<p>Please bring it to the meeting: <strong>${p.meeting ?? ''}</strong></p>`}
${button(p.link, 'Open the order and packing slip')}<p style="font-size:15px">Keep the address to yourself and use it only for this parcel.</p>`,
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

export function orderPostedToBuyer(p: Base & { trackingNumber: string | null }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Order ${p.reference} is in the post`,
    text: `Hello ${p.name},\n\nThe seller posted your order ${p.reference}.${p.trackingNumber ? ` Tracking number: ${p.trackingNumber}.` : ''}\nWhen it arrives, mark it received: ${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The seller posted your order <strong>${p.reference}</strong>.${p.trackingNumber ? html` Tracking number: <strong>${p.trackingNumber}</strong>.` : ''}</p><p>When it arrives, please mark it received.</p>${button(p.link, 'Mark it received')}`,
  });
}

export function orderReceivedToSeller(p: Base): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Order ${p.reference} arrived`,
    text: `Hello ${p.name},\n\nThe buyer marked order ${p.reference} as received. Thank you for passing your scraps on.\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The buyer marked order <strong>${p.reference}</strong> as received. Thank you for passing your scraps on.</p>${button(p.link, 'See the order')}`,
  });
}

export function orderCancelled(p: Base & { refunded: string | null; reason: string | null }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Order ${p.reference} was cancelled`,
    text: `Hello ${p.name},\n\nOrder ${p.reference} was cancelled.${p.reason ? ` Reason: ${p.reason}` : ''}${p.refunded ? `\nThe payment of ${p.refunded} is being refunded to the card.` : ''}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>Order <strong>${p.reference}</strong> was cancelled.${p.reason ? html` Reason: ${p.reason}` : ''}</p>${p.refunded ? html`<p>The payment of ${p.refunded} is being refunded to the card.</p>` : ''}${button(p.link, 'See the order')}`,
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

export function problemReported(p: Base & { message: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `A problem was reported on order ${p.reference}`,
    text: `Hello ${p.name},\n\nThe buyer of order ${p.reference} reported a problem:\n\n${p.message}\n\nThe order, and a refund if one is due: ${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The buyer of order <strong>${p.reference}</strong> reported a problem:</p>
<blockquote style="margin:0 0 16px;padding:12px 16px;border-left:4px solid #8a2b2b;background:#f6f1e7;white-space:pre-wrap">${p.message}</blockquote>${button(p.link, 'Open the order')}`,
  });
}
