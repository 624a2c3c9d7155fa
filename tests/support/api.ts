import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { pino } from 'pino';
import type { Role } from '@scrap-relay/shared';
import { loadConfig, type Config } from '../../apps/api/src/config/index.ts';
import { createRuntime, type Runtime } from '../../apps/api/src/runtime.ts';
import { createApp } from '../../apps/api/src/app.ts';
import type { AppContext } from '../../apps/api/src/context.ts';
import { hashPassword } from '../../apps/api/src/auth/passwords.ts';
import { DEFAULT_GUILD_SETTINGS, Guild, Member } from '../../apps/api/src/db/models/index.ts';

export const TEST_INVITE_CODE = 'TEST-GUILD-CODE';
export const TEST_PASSWORD = 'long-enough-password';

/** Real time plus a settable offset, so token lifetimes and windows are tested without waiting. */
export class TestClock {
  private offsetMs = 0;
  now = () => new Date(Date.now() + this.offsetMs);
  advance(ms: number) {
    this.offsetMs += ms;
  }
  reset() {
    this.offsetMs = 0;
  }
}

export interface TestApi {
  runtime: Runtime;
  config: Config;
  clock: TestClock;
  close(): Promise<void>;
}

/** Starts the real API runtime (PostgreSQL, pg-boss, SMTP to maildev) against the test database the test command made. */
export async function startTestApi(overrides: Partial<Record<string, string>> = {}): Promise<TestApi> {
  const config = loadConfig({ ...process.env, LOG_LEVEL: 'silent', SIGN_IN_LIMIT_PER_IP: '10000', ...overrides });
  const clock = new TestClock();
  const runtime = await createRuntime(config, { logger: pino({ level: 'silent' }), now: clock.now, pollingIntervalSeconds: 0.5 });
  await ensureGuild();
  return { runtime, config, clock, close: () => runtime.close() };
}

/** A second app on the same runtime with other settings (models are bound once per process, so no second runtime). */
export function appWith(api: TestApi, change: (config: Config) => Config, context: Partial<AppContext> = {}) {
  return createApp({ ...api.runtime.ctx, ...context, config: change(api.config) }, api.runtime.pool);
}

/** Serves the app on the API port the test command reserved, where the Stripe stand-in delivers its webhooks. */
export async function listenOnApiPort(api: TestApi): Promise<() => Promise<void>> {
  const server = api.runtime.app.listen(api.config.port, '127.0.0.1');
  await new Promise<void>((resolve, reject) => server.once('listening', resolve).once('error', reject));
  return () => new Promise<void>((resolve) => server.close(() => resolve()));
}

export async function ensureGuild(): Promise<Guild> {
  const [guild] = await Guild.findOrCreate({
    where: { id: 1 },
    defaults: {
      id: 1,
      name: 'Millbrook Scrap Circle',
      town: 'Millbrook',
      currency: 'USD',
      defaultUnits: 'imperial',
      settings: DEFAULT_GUILD_SETTINGS,
      inviteCode: TEST_INVITE_CODE,
    },
  });
  if (guild.inviteCode !== TEST_INVITE_CODE) await guild.update({ inviteCode: TEST_INVITE_CODE });
  return guild;
}

let counter = 0;
export const uniqueEmail = (label = 'member') => `${label}-${Date.now().toString(36)}-${(counter++).toString(36)}@millbrook.example`;

let passwordHashOnce: Promise<string> | undefined;

/** A member row made directly, verified unless told otherwise. */
export async function createMember(
  opts: { roles?: Role[]; verified?: boolean; active?: boolean; joinedAt?: Date; newQuilterFlag?: boolean; name?: string; email?: string } = {},
): Promise<Member> {
  passwordHashOnce ??= hashPassword(TEST_PASSWORD);
  return Member.create({
    name: opts.name ?? 'Test Member',
    email: opts.email ?? uniqueEmail(),
    passwordHash: await passwordHashOnce,
    roles: opts.roles ?? ['member'],
    active: opts.active ?? true,
    joinedAt: opts.joinedAt ?? new Date('2020-01-01T00:00:00Z'),
    newQuilterFlag: opts.newQuilterFlag ?? false,
    emailVerifiedAt: opts.verified === false ? null : new Date('2020-01-02T00:00:00Z'),
    units: null,
  });
}

/** A cookie-keeping client that fetches and sends the CSRF token like the web app does. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  csrfToken = '';

  constructor(app: Runtime['app']) {
    this.agent = request.agent(app);
  }

  async refreshSession() {
    const res = await this.agent.get('/api/session').expect(200);
    this.csrfToken = res.body.csrfToken;
    return res.body;
  }

  async signIn(email: string, password = TEST_PASSWORD) {
    await this.refreshSession();
    const res = await this.send('post', '/api/session', { email, password });
    if (res.status === 200) this.csrfToken = res.body.csrfToken;
    return res;
  }

  get(path: string) {
    return this.agent.get(path);
  }

  send(method: 'post' | 'put' | 'patch' | 'delete', path: string, body?: unknown) {
    const req = this.agent[method](path).set('X-CSRF-Token', this.csrfToken);
    return body === undefined ? req : req.send(body as object);
  }
}

export async function signedInClient(app: Runtime['app'], member: Member): Promise<Client> {
  const client = new Client(app);
  const res = await client.signIn(member.email);
  if (res.status !== 200) throw new Error(`sign-in failed for ${member.email}: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}

export async function countRows(sequelize: Sequelize, tables: string[]): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of tables) {
    const [rows] = await sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
    counts[table] = (rows as { n: number }[])[0]!.n;
  }
  return counts;
}
