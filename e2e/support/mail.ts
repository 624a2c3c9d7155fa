import { MailCatcher, type CaughtMail } from '../../tests/support/services.ts';

let catcher: MailCatcher | undefined;

function mailCatcher(): MailCatcher {
  const url = process.env.MAILDEV_URL;
  if (!url) throw new Error('MAILDEV_URL is not set: run the journeys with `npm test -- --only e2e`.');
  return (catcher ??= new MailCatcher(url.replace(/\/$/, '')));
}

/** The newest e-mail to `address` with `subjectIncludes` in its subject (any case), waiting for it to arrive. */
export function latestMailTo(address: string, subjectIncludes: string, timeoutMs = 15_000): Promise<CaughtMail> {
  return mailCatcher().waitFor({ to: address, subjectIncludes, timeoutMs });
}

/** The first link in a message's text that goes to `pathname` (for "confirm your e-mail"-style links). */
export function linkIn(mail: CaughtMail, pathname: string): string {
  const link = mail.text.match(/https?:\/\/[^\s<>"]+/g)?.find((candidate) => new URL(candidate).pathname === pathname);
  if (link === undefined) throw new Error(`No link to ${pathname} in the e-mail "${mail.subject}":\n${mail.text}`);
  return link;
}

export type { CaughtMail };
