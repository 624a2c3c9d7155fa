import { html, layout, type EmailChoice, type RenderedEmail } from './render.ts';

interface Base {
  guildName: string;
  name: string;
  title: string;
  link: string;
}

/** E-mails a member may turn off carry the profile page where they do. */
interface Optional {
  choicesLink: string;
}

const days = (n: number) => `${n} day${n === 1 ? '' : 's'}`;

const button = (link: string, label: string) =>
  html`<p><a href="${link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">${label}</a></p>`;

export function bundleApproved(p: Base & Optional): RenderedEmail {
  return layout({
    guildName: p.guildName,
    choice: { kind: 'review', link: p.choicesLink },
    subject: `On the shelf: ${p.title}`,
    text: `Hello ${p.name},\n\nThe librarian approved "${p.title}" and it is on the guild's shelf now:\n${p.link}\n\nWe will e-mail you when someone takes it.`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The librarian approved <strong>${p.title}</strong> and it is on the guild’s shelf now.</p>${button(p.link, 'See it on the shelf')}<p>We will e-mail you when someone takes it.</p>`,
  });
}

/** A donation to the starter programme: it goes to a new quilter, not on sale, so the next step differs. */
export function starterBundleApproved(p: Base & Optional): RenderedEmail {
  const next = 'When a new quilter claims it, we will remind you before the meeting where it changes hands, or e-mail you to post it if it goes by post.';
  return layout({
    guildName: p.guildName,
    choice: { kind: 'review', link: p.choicesLink },
    subject: `For a new quilter: ${p.title}`,
    text: `Hello ${p.name},

Thank you. The librarian approved "${p.title}" for the starter programme: it goes to a new quilter, whoever has waited longest first.
${p.link}

${next}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>Thank you. The librarian approved <strong>${p.title}</strong> for the starter programme: it goes to a new quilter, whoever has waited longest first.</p>${button(p.link, 'See your bundle')}<p>${next}</p>`,
  });
}

export function bundleReturned(p: Base & Optional & { notes: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    choice: { kind: 'review', link: p.choicesLink },
    subject: `A note from the librarian about ${p.title}`,
    text: `Hello ${p.name},\n\nThe librarian sent "${p.title}" back with this note:\n\n${p.notes}\n\nYou can change the listing and send it for review again:\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The librarian sent <strong>${p.title}</strong> back with this note:</p>
<blockquote style="margin:0 0 16px;padding:12px 16px;border-left:4px solid #8a2b2b;background:#f6f1e7;white-space:pre-wrap">${p.notes}</blockquote>
<p>You can change the listing and send it for review again.</p>${button(p.link, 'Open my listing')}`,
  });
}

/** One e-mail per member per bundle, naming every wish of theirs it matches. */
export function wishMatched(p: Base & Optional & { wishNames: string[] }): RenderedEmail {
  const quoted = p.wishNames.map((w) => `"${w}"`);
  const which = quoted.length === 1 ? `your wish ${quoted[0]}` : `your wishes ${quoted.slice(0, -1).join(', ')} and ${quoted.at(-1)}`;
  const intro = p.wishNames.length === 1 ? 'A bundle that matches your wish' : `A bundle that matches ${p.wishNames.length} of your wishes`;
  return layout({
    guildName: p.guildName,
    choice: { kind: 'wishes', link: p.choicesLink },
    subject: `A bundle for ${which}: ${p.title}`,
    text: `Hello ${p.name},\n\n${intro} just went on the shelf: "${p.title}".\n${p.wishNames.map((w) => `- ${w}`).join('\n')}\n\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${intro} just went on the shelf: <strong>${p.title}</strong>.</p><ul>${p.wishNames.map((w) => html`<li>${w}</li>`)}</ul>${button(p.link, 'Have a look')}`,
  });
}

/**
 * A week or so before a bundle's time on the shelf ends. Always sent, like the e-mail when it comes off: it is about
 * the member's own bundle, and no e-mail choice on the profile page is about the shelf.
 */
export function bundleLeavingShelf(p: Base & { onShelfSince: string; comesOff: string; daysOnShelf: number }): RenderedEmail {
  const relist = 'If it is still there then, you can relist it from its page; a relisted bundle goes through the librarian’s review again before it goes back on the shelf.';
  return layout({
    guildName: p.guildName,
    subject: `Coming off the shelf soon: ${p.title}`,
    text: `Hello ${p.name},\n\n"${p.title}" has been on the guild's shelf for ${days(p.daysOnShelf)}, since ${p.onShelfSince}. Its time there ends on ${p.comesOff}, and then it comes off the shelf.\n\n${relist}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.title}</strong> has been on the guild’s shelf for ${days(p.daysOnShelf)}, since ${p.onShelfSince}. Its time there ends on <strong>${p.comesOff}</strong>, and then it comes off the shelf.</p><p>${relist}</p>${button(p.link, 'See my bundle')}`,
  });
}

/** The bundle's time on the shelf ended; how long it was there, and that relisting means review again. */
export function bundleExpired(p: Base & { onShelfSince: string; daysOnShelf: number }): RenderedEmail {
  const relist = 'If you would like to offer it again, relist it from its page. A relisted bundle goes through the librarian’s review again before it goes back on the shelf; you can change the listing first.';
  return layout({
    guildName: p.guildName,
    subject: `Off the shelf after ${days(p.daysOnShelf)}: ${p.title}`,
    text: `Hello ${p.name},\n\n"${p.title}" was on the guild's shelf for ${days(p.daysOnShelf)}, since ${p.onShelfSince}. Its time there is up, so it came off the shelf; it is still yours.\n\n${relist}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.title}</strong> was on the guild’s shelf for ${days(p.daysOnShelf)}, since ${p.onShelfSince}. Its time there is up, so it came off the shelf; it is still yours.</p><p>${relist}</p>${button(p.link, 'See my bundle')}`,
  });
}
