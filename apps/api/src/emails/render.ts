import { EMAIL_KIND_LABELS, type OptionalEmailKind } from '@scrap-relay/shared';

/** Escapes member-written text for HTML e-mail bodies. */
export function escapeHtml(value: unknown): string {
  return String(value)
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

class SafeHtml {
  constructor(readonly value: string) {}
  toString() {
    return this.value;
  }
}

/** Tagged template: every interpolation is escaped unless it is already SafeHtml (a nested `html` result). */
export function html(strings: TemplateStringsArray, ...values: unknown[]): SafeHtml {
  let out = strings[0] ?? '';
  values.forEach((v, i) => {
    const rendered = Array.isArray(v)
      ? v.map((x) => (x instanceof SafeHtml ? x.value : escapeHtml(x))).join('')
      : v instanceof SafeHtml
        ? v.value
        : escapeHtml(v ?? '');
    out += rendered + (strings[i + 1] ?? '');
  });
  return new SafeHtml(out);
}

/** The call to action every e-mail ends its message with. */
export const button = (link: string, label: string) =>
  html`<p><a href="${link}" style="display:inline-block;padding:12px 20px;background:#23234a;color:#ffffff;border-radius:6px;text-decoration:none">${label}</a></p>`;

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

/** The web app's profile page (`paths.app.profile` in apps/web/src/config/paths.ts), where members choose which e-mails they get. */
export const emailChoicesUrl = (appUrl: string) => `${appUrl}/profile`;

/** For an e-mail a member may turn off: which kind it is, and the profile page where it is turned off. */
export interface EmailChoice {
  kind: OptionalEmailKind;
  link: string;
}

/**
 * Wraps a message in the plain, readable layout every Scrap Relay e-mail shares. An e-mail a member may turn off
 * ends with the choice that sends it and a link to the profile page where they change it.
 */
export function layout(opts: { guildName: string; subject: string; bodyHtml: SafeHtml; text: string; choice?: EmailChoice }): RenderedEmail {
  const choice = opts.choice ? { label: EMAIL_KIND_LABELS[opts.choice.kind], link: opts.choice.link } : null;
  const body = html`<!doctype html>
<html lang="en"><body style="margin:0;padding:24px;background:#f6f1e7;font-family:'Source Sans 3',Arial,sans-serif;font-size:17px;line-height:1.5;color:#23234a">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border-radius:8px;padding:24px">
<p style="margin:0 0 16px;font-weight:700;color:#8a2b2b">Scrap Relay · ${opts.guildName}</p>
${opts.bodyHtml}
<p style="margin:24px 0 0;font-size:14px;color:#55557a">You get this because you are a member of ${opts.guildName} on Scrap Relay.</p>
${choice ? html`<p style="margin:8px 0 0;font-size:14px;color:#55557a">This one comes because “${choice.label}” is ticked under “E-mails you receive” on your profile. To stop e-mails like it, untick that box: <a href="${choice.link}" style="color:#23234a">change my e-mail choices</a></p>` : ''}
</div></body></html>`;
  const footer = choice
    ? `\nThis one comes because “${choice.label}” is ticked under “E-mails you receive” on your profile. To stop e-mails like it, untick that box:\n${choice.link}`
    : '';
  return {
    subject: opts.subject,
    text: `${opts.text}\n\n— Scrap Relay · ${opts.guildName}${footer}\n`,
    html: body.value,
  };
}
