import { html, layout, type RenderedEmail } from './render.ts';

/**
 * A meeting where the member hands over or collects something has a new date, time or place.
 * `before` and `after` are meeting labels in the guild's time zone.
 */
export function meetingChanged(p: { guildName: string; name: string; before: string; after: string; bring: string[]; collect: string[]; link: string }): RenderedEmail {
  const lines = [
    ...(p.bring.length ? ['Please bring:', ...p.bring.map((t) => `- ${t}`)] : []),
    ...(p.collect.length ? ['You will collect:', ...p.collect.map((t) => `- ${t}`)] : []),
  ];
  return layout({
    guildName: p.guildName,
    subject: `Meeting changed: now ${p.after}`,
    text: `Hello ${p.name},\n\nThe guild meeting where you have a handover has changed.\n\nWas: ${p.before}\nNow: ${p.after}\n\n${lines.join('\n')}\n\nIf you cannot come at the new time, please tell the librarian.\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The guild meeting where you have a handover has changed.</p>
<p>Was: <s>${p.before}</s><br>Now: <strong>${p.after}</strong></p>
${p.bring.length ? html`<p>Please bring:</p><ul>${p.bring.map((t) => html`<li>${t}</li>`)}</ul>` : ''}
${p.collect.length ? html`<p>You will collect:</p><ul>${p.collect.map((t) => html`<li>${t}</li>`)}</ul>` : ''}<p>If you cannot come at the new time, please tell the librarian.</p>
<p><a href="${p.link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">Open Scrap Relay</a></p>`,
  });
}
