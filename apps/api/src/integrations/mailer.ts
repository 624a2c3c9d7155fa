import type { OptionalEmailKind } from '@scrap-relay/shared';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config/index.ts';

export interface OutgoingMail {
  to: string;
  /** Set for kinds a member may turn off; money and account mail leave it unset and always go. */
  kind?: OptionalEmailKind;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  /**
   * Sends one e-mail. `id` (the queued job's) makes its Message-ID, so a mail sent twice, because the queue could
   * not record the first sending, reaches the recipient's mail system as the same message, which most drop.
   */
  send(mail: OutgoingMail, id?: string): Promise<void>;
  close(): void;
}

/** `<id@domain>` with the domain of the sender's address (RFC 5322 section 3.6.4); a made-up one when it has none. */
export function messageIdFor(id: string, from: string): string {
  const domain = /@([A-Za-z0-9.-]+)/.exec(from)?.[1] ?? 'scrap-relay.invalid';
  return `<${id}@${domain}>`;
}

export function createMailer(smtp: Config['smtp']): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    ignoreTLS: !smtp.secure && smtp.host === '127.0.0.1',
    auth: smtp.user ? { user: smtp.user, pass: smtp.password ?? '' } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
  });
  return {
    async send({ kind: _kind, ...mail }, id) {
      await transport.sendMail({ from: smtp.from, ...mail, ...(id ? { messageId: messageIdFor(id, smtp.from) } : {}) });
    },
    close: () => transport.close(),
  };
}
