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
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
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
    async send({ kind: _kind, ...mail }) {
      await transport.sendMail({ from: smtp.from, ...mail });
    },
    close: () => transport.close(),
  };
}
