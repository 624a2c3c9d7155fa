import { html, layout, type RenderedEmail } from './render.ts';

const button = (link: string, label: string) =>
  html`<p><a href="${link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">${label}</a></p>`;

export function starterOffered(p: { guildName: string; name: string; title: string; link: string; deadline: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `A starter bundle is waiting for you: ${p.title}`,
    text: `Hello ${p.name},\n\nYou are next on the starter-bundle waiting list, and "${p.title}" is held for you. Accept it or pass it on before ${p.deadline}:\n${p.link}\n\nIf you do not answer by then, it goes to the next new quilter and you leave the waiting list. You can join the list again from the starter page, at the back of the queue.`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>You are next on the starter-bundle waiting list, and <strong>${p.title}</strong> is held for you.</p><p>Please accept it or pass it on before <strong>${p.deadline}</strong>.</p>${button(p.link, 'Accept or pass it on')}<p style="font-size:15px">If you do not answer by then, it goes to the next new quilter and you leave the waiting list. You can join the list again from the starter page, at the back of the queue.</p>`,
  });
}

export function starterOfferReminder(p: { guildName: string; name: string; title: string; link: string; deadline: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Still held for you until ${p.deadline}: ${p.title}`,
    text: `Hello ${p.name},\n\n"${p.title}" is still held for you. Accept it or pass it on before ${p.deadline}:\n${p.link}\n\nIf you do not answer by then, it goes to the next new quilter and you leave the waiting list.`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.title}</strong> is still held for you. Please accept it or pass it on before <strong>${p.deadline}</strong>.</p>${button(p.link, 'Accept or pass it on')}<p style="font-size:15px">If you do not answer by then, it goes to the next new quilter and you leave the waiting list.</p>`,
  });
}

export function starterOfferLapsed(p: { guildName: string; name: string; title: string; link: string }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: 'Your starter-bundle offer has ended',
    text: `Hello ${p.name},\n\nWe held "${p.title}" for you, but the time to answer has passed, so it went to the next new quilter and you have left the starter-bundle waiting list.\n\nStill want a starter bundle? Join the list again from the starter page (you join at the back), or claim one there if one is free:\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>We held <strong>${p.title}</strong> for you, but the time to answer has passed, so it went to the next new quilter and you have left the starter-bundle waiting list.</p><p>Still want a starter bundle? Join the list again from the starter page (you join at the back), or claim one there if one is free.</p>${button(p.link, 'Open the starter page')}`,
  });
}

export function starterWaitlistRemoved(p: { guildName: string; name: string; reason: string; link: string; byLibrarian: boolean }): RenderedEmail {
  const who = p.byLibrarian ? 'The librarian has taken you off' : 'You have been taken off';
  const after = p.byLibrarian
    ? 'If you think this is a mistake, please talk to the librarian.'
    : 'You can join the list again from the starter page once you may claim again. If you think this is a mistake, please talk to the librarian.';
  return layout({
    guildName: p.guildName,
    subject: 'You are no longer on the starter-bundle waiting list',
    text: `Hello ${p.name},\n\n${who} the starter-bundle waiting list.\n\nReason: ${p.reason}\n\n${after}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>${who} the starter-bundle waiting list.</p><p>Reason: <strong>${p.reason}</strong></p><p>${after}</p>${button(p.link, 'Open the starter page')}`,
  });
}

const NO_MEETING_YET = 'No guild meeting is set yet. It is held for you, and we will e-mail you the date and place as soon as the guild sets its next meeting.';

export function starterClaimed(p: { guildName: string; name: string; title: string; link: string; meeting: string | null }): RenderedEmail {
  return layout({
    guildName: p.guildName,
    subject: `Your starter bundle: ${p.title}`,
    text: `Hello ${p.name},\n\n"${p.title}" is yours. ${p.meeting ? `Collect it at the meeting: ${p.meeting}.` : NO_MEETING_YET}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p><strong>${p.title}</strong> is yours.</p><p>${p.meeting ? html`Collect it at the meeting: <strong>${p.meeting}</strong>.` : NO_MEETING_YET}</p>${button(p.link, 'See my starter bundle')}`,
  });
}

/** A claim made while no meeting was set now has one: the new quilter collects, the donor brings. */
export function starterMeetingSet(p: { guildName: string; name: string; title: string; meeting: string; role: 'collect' | 'bring'; link: string }): RenderedEmail {
  const line = p.role === 'collect' ? `Collect your starter bundle "${p.title}" at the meeting: ${p.meeting}.` : `A new quilter collects "${p.title}", which you gave to the starter programme, at the meeting: ${p.meeting}. Please bring it.`;
  return layout({
    guildName: p.guildName,
    subject: `Starter bundle handover: ${p.meeting}`,
    text: `Hello ${p.name},\n\nThe guild has set its next meeting. ${line}\n${p.link}`,
    bodyHtml: html`<p>Hello ${p.name},</p><p>The guild has set its next meeting.</p><p>${line}</p>${button(p.link, 'Open Scrap Relay')}`,
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
