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

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

/** Wraps a message in the plain, readable layout every Scrap Relay e-mail shares. */
export function layout(opts: { guildName: string; subject: string; bodyHtml: SafeHtml; text: string }): RenderedEmail {
  const body = html`<!doctype html>
<html lang="en"><body style="margin:0;padding:24px;background:#f6f1e7;font-family:'Source Sans 3',Arial,sans-serif;font-size:17px;line-height:1.5;color:#23234a">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border-radius:8px;padding:24px">
<p style="margin:0 0 16px;font-weight:700;color:#8a2b2b">Scrap Relay · ${opts.guildName}</p>
${opts.bodyHtml}
<p style="margin:24px 0 0;font-size:14px;color:#55557a">You get this because you are a member of ${opts.guildName} on Scrap Relay.</p>
</div></body></html>`;
  return {
    subject: opts.subject,
    text: `${opts.text}\n\n— Scrap Relay · ${opts.guildName}\n`,
    html: body.value,
  };
}
