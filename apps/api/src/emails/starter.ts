import { html, layout, type RenderedEmail } from './render.ts';

const button = (link: string, label: string) =>
  html`<p><a href="${link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">${label}</a></p>`;

export function starterOffered(p: { guildName: string; name: string; title: string; link: string; deadline: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `A starter bundle is waiting for you: ${p.title}`,
    text: `Hello ${p.name},\n\nYou are next on the starter-bundle waiting list, and "${p.title}" is yours if you want it. Accept or pass it on before ${p.deadline}:\n${p.link}\n\nIf you do not answer by then, it goes to the next new quilter.`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>You are next on the starter-bundle waiting list, and <strong>${p.title}</strong> is yours if you want it.</p><p>Please accept it or pass it on before <strong>${p.deadline}</strong>.</p>${button(p.link, 'Accept or pass it on')}<p style="font-size:15px">If you do not answer by then, it goes to the next new quilter.</p>`,
  });
}

export function starterClaimed(p: { guildName: string; name: string; title: string; link: string; meeting: string | null }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Your starter bundle: ${p.title}`,
    text: `Hello ${p.name},\n\n"${p.title}" is yours. ${p.meeting ? `Collect it at the meeting: ${p.meeting}.` : 'The librarian will tell you which meeting to collect it at.'}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.title}</strong> is yours.</p><p>${p.meeting ? html`Collect it at the meeting: <strong>${p.meeting}</strong>.` : 'The librarian will tell you which meeting to collect it at.'}</p>${button(p.link, 'See my starter bundle')}`,
  });
}

export function meetingReminder(p: { guildName: string; name: string; meeting: string; bring: string[]; collect: string[]; link: string }): RenderedEmail {
  const lines = [
    ...(p.bring.length ? ['Please bring:', ...p.bring.map((t) => `- ${t}`)] : []),
    ...(p.collect.length ? ['You will collect:', ...p.collect.map((t) => `- ${t}`)] : []),
  ];
  return layout({
    guildName: p.guildName,
    subject: `Reminder for the meeting on ${p.meeting}`,
    text: `Hello ${p.name},\n\nThe guild meets on ${p.meeting}.\n\n${lines.join('\n')}\n\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The guild meets on <strong>${p.meeting}</strong>.</p>
${p.bring.length ? html`<p>Please bring:</p><ul>${p.bring.map((t) => html`<li>${t}</li>`)}</ul>` : ''}
${p.collect.length ? html`<p>You will collect:</p><ul>${p.collect.map((t) => html`<li>${t}</li>`)}</ul>` : ''}${button(p.link, 'Open Scrap Relay')}`,
  });
}

export function handoverMoved(p: { guildName: string; name: string; titles: string[]; meeting: string; link: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Handover moved to ${p.meeting}`,
    text: `Hello ${p.name},\n\nThese did not change hands at the last meeting and are moved to ${p.meeting}:\n${p.titles.map((t) => `- ${t}`).join('\n')}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>These did not change hands at the last meeting and are moved to <strong>${p.meeting}</strong>:</p><ul>${p.titles.map((t) => html`<li>${t}</li>`)}</ul>${button(p.link, 'Open Scrap Relay')}`,
  });
}
