import { html, layout, type RenderedEmail } from './render.ts';

interface Base {
  guildName: string;
  name: string;
  title: string;
  link: string;
}

const button = (link: string, label: string) =>
  html`<p><a href="${link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">${label}</a></p>`;

export function bundleApproved(p: Base): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `On the shelf: ${p.title}`,
    text: `Hello ${p.name},\n\nThe librarian approved "${p.title}" and it is on the guild's shelf now:\n${p.link}\n\nWe will e-mail you when someone takes it.`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The librarian approved <strong>${p.title}</strong> and it is on the guild’s shelf now.</p>${button(p.link, 'See it on the shelf')}<p>We will e-mail you when someone takes it.</p>`,
  });
}

/** A donation to the starter programme: it goes to a new quilter, not on sale, so the next step differs. */
export function starterBundleApproved(p: Base): RenderedEmail {
  const next = 'When a new quilter claims it, we will remind you before the meeting where it changes hands, or e-mail you to post it if it goes by post.';
  return layout({
    guildName: p.guildName,
    subject: `For a new quilter: ${p.title}`,
    text: `Hello ${p.name},

Thank you. The librarian approved "${p.title}" for the starter programme: it goes to a new quilter, whoever has waited longest first.
${p.link}

${next}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>Thank you. The librarian approved <strong>${p.title}</strong> for the starter programme: it goes to a new quilter, whoever has waited longest first.</p>${button(p.link, 'See your bundle')}<p>${next}</p>`,
  });
}

export function bundleReturned(p: Base & { notes: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `A note from the librarian about ${p.title}`,
    text: `Hello ${p.name},\n\nThe librarian sent "${p.title}" back with this note:\n\n${p.notes}\n\nYou can change the listing and send it for review again:\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The librarian sent <strong>${p.title}</strong> back with this note:</p>
<blockquote style="margin:0 0 16px;padding:12px 16px;border-left:4px solid #8a2b2b;background:#f6f1e7;white-space:pre-wrap">${p.notes}</blockquote>
<p>You can change the listing and send it for review again.</p>${button(p.link, 'Open my listing')}`,
  });
}

export function wishMatched(p: Base & { wishName: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `A bundle for your wish "${p.wishName}": ${p.title}`,
    text: `Hello ${p.name},\n\nA bundle that matches your wish "${p.wishName}" just went on the shelf: "${p.title}".\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>A bundle that matches your wish <strong>${p.wishName}</strong> just went on the shelf: <strong>${p.title}</strong>.</p>${button(p.link, 'Have a look')}`,
  });
}

export function bundleExpired(p: Base & { days: number }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Off the shelf after ${p.days} days: ${p.title}`,
    text: `Hello ${p.name},\n\n"${p.title}" has been on the shelf for ${p.days} days, the guild's limit, so it came off. You can put it back for another round:\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.title}</strong> has been on the shelf for ${p.days} days, the guild’s limit, so it came off. You can put it back for another round.</p>${button(p.link, 'Relist it')}`,
  });
}
