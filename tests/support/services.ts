/**
 * What integration tests know about the local services `npm test` starts:
 * the environment it exports (read and checked here), and a client for the
 * mail catcher's REST API so tests can assert on the e-mail that went out.
 */

export interface ServiceEnv {
  databaseUrl: string;
  /** maildev's web UI and REST API. */
  maildevUrl: string;
  stripeFakeUrl: string;
  /** The web app's public base URL, as the API puts it in e-mail links. */
  appUrl: string;
  /** The port reserved for the API; a test that must receive the Stripe stand-in's webhooks listens here. */
  apiPort: number;
  smtp: { host: string; port: number };
  stripe: { secretKey: string; webhookSecret: string; host: string; port: number; protocol: 'http' | 'https' };
  uploadDir: string;
  sessionSecret: string;
}

const REQUIRED = [
  'DATABASE_URL',
  'MAILDEV_URL',
  'STRIPE_FAKE_URL',
  'APP_URL',
  'PORT',
  'SMTP_HOST',
  'SMTP_PORT',
  'STRIPE_SECRET_KEY',
  'STRIPE_WEBHOOK_SECRET',
  'STRIPE_API_HOST',
  'STRIPE_API_PORT',
  'STRIPE_API_PROTOCOL',
  'UPLOAD_DIR',
  'SESSION_SECRET',
] as const;

let cached: ServiceEnv | undefined;

/** The services' environment; throws, naming what is missing, when the tests were not started by `npm test`. */
export function serviceEnv(): ServiceEnv {
  if (cached !== undefined) return cached;
  const env = process.env;
  const missing = REQUIRED.filter((key) => !env[key]);
  if (missing.length > 0) {
    throw new Error(
      `Integration tests need the local services that \`npm test\` starts (missing: ${missing.join(', ')}).\n` +
        'Run them with `npm test -- --only integration` instead of calling vitest directly.',
    );
  }
  const value = (key: (typeof REQUIRED)[number]) => env[key]!;
  const port = (key: (typeof REQUIRED)[number]) => {
    const parsed = Number(value(key));
    if (!Number.isInteger(parsed) || parsed <= 0) throw new Error(`${key} must be a port number (got "${value(key)}")`);
    return parsed;
  };
  const protocol = value('STRIPE_API_PROTOCOL');
  if (protocol !== 'http' && protocol !== 'https') throw new Error(`STRIPE_API_PROTOCOL must be http or https (got "${protocol}")`);
  cached = {
    databaseUrl: value('DATABASE_URL'),
    maildevUrl: value('MAILDEV_URL').replace(/\/$/, ''),
    stripeFakeUrl: value('STRIPE_FAKE_URL').replace(/\/$/, ''),
    appUrl: value('APP_URL').replace(/\/$/, ''),
    apiPort: port('PORT'),
    smtp: { host: value('SMTP_HOST'), port: port('SMTP_PORT') },
    stripe: {
      secretKey: value('STRIPE_SECRET_KEY'),
      webhookSecret: value('STRIPE_WEBHOOK_SECRET'),
      host: value('STRIPE_API_HOST'),
      port: port('STRIPE_API_PORT'),
      protocol,
    },
    uploadDir: value('UPLOAD_DIR'),
    sessionSecret: value('SESSION_SECRET'),
  };
  return cached;
}

/** One message as the mail catcher received it. */
export interface CaughtMail {
  id: string;
  subject: string;
  /** Lower-cased recipient addresses (To and Cc). */
  to: string[];
  from: string[];
  text: string;
  html: string;
  receivedAt: Date;
}

interface MaildevAddress {
  address: string;
  name?: string;
}

interface MaildevEmail {
  id: string;
  subject?: string;
  time: string;
  to?: MaildevAddress[];
  cc?: MaildevAddress[];
  from?: MaildevAddress[];
  text?: string;
  html?: string;
}

function toCaughtMail(email: MaildevEmail): CaughtMail {
  const addresses = (list: MaildevAddress[] | undefined) => (list ?? []).map((entry) => entry.address.toLowerCase());
  return {
    id: email.id,
    subject: email.subject ?? '',
    to: [...addresses(email.to), ...addresses(email.cc)],
    from: addresses(email.from),
    text: email.text ?? '',
    html: email.html ?? '',
    receivedAt: new Date(email.time),
  };
}

/** A client for maildev's REST API; the functions below use the one `npm test` started. */
export class MailCatcher {
  constructor(readonly baseUrl: string) {}

  private async request(method: 'GET' | 'DELETE', path: string): Promise<unknown> {
    const response = await fetch(`${this.baseUrl}${path}`, { method });
    if (!response.ok) throw new Error(`mail catcher: ${method} ${path} answered ${response.status}`);
    return response.json();
  }

  /** Every message caught so far, oldest first. */
  async list(): Promise<CaughtMail[]> {
    const emails = (await this.request('GET', '/api/email')) as MaildevEmail[];
    return emails.map(toCaughtMail).sort((a, b) => a.receivedAt.getTime() - b.receivedAt.getTime());
  }

  async get(id: string): Promise<CaughtMail> {
    return toCaughtMail((await this.request('GET', `/api/email/${encodeURIComponent(id)}`)) as MaildevEmail);
  }

  async clear(): Promise<void> {
    await this.request('DELETE', '/api/email/all');
  }

  /**
   * Polls until a message to `to` (any case) whose subject contains
   * `subjectIncludes` (any case) arrives, and returns the newest such message.
   * Mail goes out from a job queue after the request, hence the wait.
   */
  async waitFor(options: { to: string; subjectIncludes?: string; timeoutMs?: number }): Promise<CaughtMail> {
    const to = options.to.toLowerCase();
    const subject = options.subjectIncludes?.toLowerCase();
    const timeoutMs = options.timeoutMs ?? 10_000;
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const all = await this.list();
      const matching = all.filter((mail) => mail.to.includes(to) && (subject === undefined || mail.subject.toLowerCase().includes(subject)));
      const newest = matching.at(-1);
      if (newest !== undefined) return this.get(newest.id);
      if (Date.now() > deadline) {
        const seen = all.map((mail) => `  to ${mail.to.join(', ')}: "${mail.subject}"`).join('\n') || '  (none)';
        throw new Error(
          `No e-mail to ${options.to}${subject === undefined ? '' : ` with "${options.subjectIncludes}" in the subject`} within ${timeoutMs} ms. Caught so far:\n${seen}`,
        );
      }
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }
}

let catcher: MailCatcher | undefined;
const mailCatcher = () => (catcher ??= new MailCatcher(serviceEnv().maildevUrl));

export const listMail = (): Promise<CaughtMail[]> => mailCatcher().list();
export const clearMail = (): Promise<void> => mailCatcher().clear();
export const waitForMail = (options: { to: string; subjectIncludes?: string; timeoutMs?: number }): Promise<CaughtMail> =>
  mailCatcher().waitFor(options);
