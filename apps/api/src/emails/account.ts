import { html, layout, type RenderedEmail } from './render.ts';

interface Base {
  guildName: string;
  name: string;
}

export function verifyEmail(p: Base & { link: string }): RenderedEmail {
  const subject = `Welcome to ${p.guildName} on Scrap Relay: confirm your e-mail`;
  return layout({
    guildName: p.guildName,
    subject,
    text: `Hello ${p.name},\n\nWelcome to the guild's scrap exchange. Confirm your e-mail address to list and take bundles:\n${p.link}\n\nThe link works for 48 hours.`,
    bodyHtml: html`<p>Hello ${p.name},</p>
<p>Welcome to the guild’s scrap exchange. Confirm your e-mail address to list and take bundles:</p>
<p><a href="${p.link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">Confirm my e-mail</a></p>
<p style="font-size:15px">Or paste this link into your browser: ${p.link}<br>The link works for 48 hours.</p>`,
  });
}

export function passwordReset(p: Base & { link: string }): RenderedEmail {
  const subject = 'Reset your Scrap Relay password';
  return layout({
    guildName: p.guildName,
    subject,
    text: `Hello ${p.name},\n\nSomeone asked to reset the password of your account. If it was you, choose a new password here:\n${p.link}\n\nThe link works once, for one hour. If it was not you, ignore this e-mail; your password stays as it is.`,
    bodyHtml: html`<p>Hello ${p.name},</p>
<p>Someone asked to reset the password of your account. If it was you, choose a new password:</p>
<p><a href="${p.link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">Choose a new password</a></p>
<p style="font-size:15px">Or paste this link into your browser: ${p.link}<br>The link works once, for one hour. If it was not you, ignore this e-mail; your password stays as it is.</p>`,
  });
}
