import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { Member, MemberToken } from '../apps/api/src/db/models/index.ts';
import { ACCOUNT_MAIL_LIMITS } from '../apps/api/src/modules/members/members.routes.ts';
import { appWith, Client, countRows, createMember, signedInClient, startTestApi, TEST_INVITE_CODE, TEST_PASSWORD, uniqueEmail, type TestApi } from './support/api.ts';
import { clearMail, waitForMail } from './support/services.ts';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await api.close();
});
beforeEach(async () => {
  await clearMail();
});

const linkToken = (text: string, path: string) => {
  const match = text.match(new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${path} link in: ${text}`);
  return match[1]!;
};

const sessionCookie = (res: { headers: Record<string, unknown> }) =>
  ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('sr.sid='))?.split(';')[0];

describe('joining the guild', () => {
  it('joins with the invite code, confirms the e-mail from the message in the mail catcher, then signs in', async () => {
    const email = uniqueEmail('joiner');
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    const joined = await client.send('post', '/api/members', { inviteCode: TEST_INVITE_CODE, name: 'Mabel Quire', email, password: TEST_PASSWORD });
    expect(joined.status).toBe(201);
    expect(joined.body.user).toMatchObject({ email, name: 'Mabel Quire', emailVerified: false, roles: ['member'] });
    expect(joined.body.user.abilities.listBundles).toBe(false);
    client.csrfToken = joined.body.csrfToken;

    const mail = await waitForMail({ to: email, subjectIncludes: 'confirm your e-mail' });
    const token = linkToken(mail.text, '/verify-email');
    const verified = await client.send('post', '/api/email-verifications', { token });
    expect(verified.status).toBe(200);
    expect(verified.body.user.emailVerified).toBe(true);

    const fresh = new Client(api.runtime.app);
    const signIn = await fresh.signIn(email);
    expect(signIn.status).toBe(200);
    expect(signIn.body.user).toMatchObject({ email, emailVerified: true, newQuilter: true });
    expect(signIn.body.user.abilities.listBundles).toBe(true);

    const again = await client.send('post', '/api/email-verifications', { token });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
  });

  it('refuses a wrong invite code and writes nothing', async () => {
    const before = await countRows(api.runtime.ctx.sequelize, ['members', 'member_tokens']);
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    const res = await client.send('post', '/api/members', { inviteCode: 'NOT-THE-CODE', name: 'Ivy', email: uniqueEmail(), password: TEST_PASSWORD });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_invite_code', fields: { inviteCode: expect.any(String) } });
    expect(await countRows(api.runtime.ctx.sequelize, ['members', 'member_tokens'])).toEqual(before);
  });

  it('answers 409 for an e-mail address that already has an account, whatever its case', async () => {
    const existing = await createMember();
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    const res = await client.send('post', '/api/members', {
      inviteCode: TEST_INVITE_CODE,
      name: 'Twin',
      email: existing.email.toUpperCase(),
      password: TEST_PASSWORD,
    });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'email_taken', fields: { email: expect.any(String) } });
  });

  it('asks for at least 10 characters of password', async () => {
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    const res = await client.send('post', '/api/members', { inviteCode: TEST_INVITE_CODE, name: 'Short', email: uniqueEmail(), password: 'nine-char' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/10 characters/);
  });
});

describe('signing in and out', () => {
  it('gives the same answer for an unknown e-mail and a wrong password', async () => {
    const member = await createMember();
    const wrong = await new Client(api.runtime.app).signIn(member.email, 'not-the-password');
    const unknown = await new Client(api.runtime.app).signIn(uniqueEmail('nobody'), 'not-the-password');
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('invalid_credentials');
  });

  it('issues a new session id at sign-in', async () => {
    const member = await createMember();
    const client = new Client(api.runtime.app);
    const before = sessionCookie(await client.agent.get('/api/session'));
    const signIn = await client.signIn(member.email);
    const after = sessionCookie(signIn);
    expect(before).toBeDefined();
    expect(after).toBeDefined();
    expect(after).not.toEqual(before);
  });

  it('tells every member the guild’s time zone and the countries it posts to, which every screen needs', async () => {
    const session = await (await signedInClient(api.runtime.app, await createMember())).get('/api/session');
    expect(session.body.guild).toMatchObject({ timeZone: expect.any(String), postageCountries: expect.any(Array) });
    expect(() => new Intl.DateTimeFormat('en-US', { timeZone: session.body.guild.timeZone })).not.toThrow();
  });

  it('sends the cookie httpOnly and SameSite=Lax', async () => {
    const res = await new Client(api.runtime.app).agent.get('/api/session');
    const raw = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('sr.sid='))!;
    expect(raw).toMatch(/HttpOnly/i);
    expect(raw).toMatch(/SameSite=Lax/i);
  });

  it('signs out by destroying the session row', async () => {
    const member = await createMember();
    const client = await signedInClient(api.runtime.app, member);
    const [before] = await api.runtime.ctx.sequelize.query(`SELECT count(*)::int AS n FROM session WHERE sess->'passport'->>'user' = $1`, { bind: [member.id] });
    expect((before as { n: number }[])[0]!.n).toBe(1);
    expect((await client.send('delete', '/api/session')).status).toBe(204);
    const [after] = await api.runtime.ctx.sequelize.query(`SELECT count(*)::int AS n FROM session WHERE sess->'passport'->>'user' = $1`, { bind: [member.id] });
    expect((after as { n: number }[])[0]!.n).toBe(0);
    const session = await client.get('/api/session');
    expect(session.body.user).toBeNull();
  });

  it('refuses a switched-off account even with the right password', async () => {
    const member = await createMember({ active: false });
    const res = await new Client(api.runtime.app).signIn(member.email);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('account_inactive');
  });

  it('limits failed sign-ins per account with a clear 429', async () => {
    const member = await createMember();
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    for (let i = 0; i < 5; i++) {
      const res = await client.send('post', '/api/session', { email: member.email, password: 'wrong-password-here' });
      expect(res.status).toBe(401);
    }
    const limited = await client.send('post', '/api/session', { email: member.email, password: TEST_PASSWORD });
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    expect(limited.body.error.message).toMatch(/wait \d+ minutes/);
  });
});

describe('limits per address', () => {
  const clearIpHits = () => api.runtime.ctx.sequelize.query(`DELETE FROM rate_limit_hits WHERE key LIKE 'sign-in-ip:%'`);
  beforeAll(clearIpHits);
  afterAll(clearIpHits);

  it('limits failed sign-ins from one address across accounts', async () => {
    const strictApp = appWith(api, (c) => ({ ...c, signInLimits: { ...c.signInLimits, perIp: 3, perAccount: 100 } }));
    const client = new Client(strictApp);
    await client.refreshSession();
    for (let i = 0; i < 3; i++) {
      expect((await client.send('post', '/api/session', { email: uniqueEmail(), password: 'wrong-password-here' })).status).toBe(401);
    }
    expect((await client.send('post', '/api/session', { email: uniqueEmail(), password: 'wrong-password-here' })).status).toBe(429);
  });
});

describe('CSRF protection', () => {
  it('refuses a state-changing request without the token', async () => {
    const member = await createMember();
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    const res = await client.agent.post('/api/session').send({ email: member.email, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatchObject({ code: 'csrf_invalid', fields: { 'X-CSRF-Token': expect.any(String) } });
  });

  it('refuses a wrong token', async () => {
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    client.csrfToken = 'x'.repeat(43);
    const res = await client.send('post', '/api/password-resets', { email: uniqueEmail() });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
  });
});

describe('password reset', () => {
  it('works once with the e-mailed link, signs the member out elsewhere, then the link is spent', async () => {
    const member = await createMember();
    const elsewhere = await signedInClient(api.runtime.app, member);
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    expect((await client.send('post', '/api/password-resets', { email: member.email })).status).toBe(202);
    const mail = await waitForMail({ to: member.email, subjectIncludes: 'Reset your' });
    const token = linkToken(mail.text, '/reset-password');

    const newPassword = 'a-brand-new-password';
    expect((await client.send('post', '/api/password-resets/complete', { token, password: newPassword })).status).toBe(204);
    expect((await new Client(api.runtime.app).signIn(member.email, newPassword)).status).toBe(200);
    expect((await new Client(api.runtime.app).signIn(member.email, TEST_PASSWORD)).status).toBe(401);
    expect((await elsewhere.get('/api/session')).body.user).toBeNull();

    const reuse = await client.send('post', '/api/password-resets/complete', { token, password: 'yet-another-password' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.code).toBe('invalid_token');
  });

  it('stores only a hash of the token and refuses it after one hour', async () => {
    const member = await createMember();
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    await client.send('post', '/api/password-resets', { email: member.email });
    const token = linkToken((await waitForMail({ to: member.email, subjectIncludes: 'Reset your' })).text, '/reset-password');
    const stored = await MemberToken.findAll({ where: { memberId: member.id } });
    expect(stored.map((t) => t.tokenHash)).not.toContain(token);

    api.clock.advance(60 * 60 * 1000 + 1000);
    try {
      const res = await client.send('post', '/api/password-resets/complete', { token, password: 'a-brand-new-password' });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('invalid_token');
    } finally {
      api.clock.reset();
    }
    const unchanged = await Member.findByPk(member.id);
    expect(unchanged!.passwordHash).toBe(member.passwordHash);
  });

  it('answers the same for an unknown address and sends nothing', async () => {
    const client = new Client(api.runtime.app);
    await client.refreshSession();
    const before = await countRows(api.runtime.ctx.sequelize, ['member_tokens']);
    expect((await client.send('post', '/api/password-resets', { email: uniqueEmail('stranger') })).status).toBe(202);
    expect(await countRows(api.runtime.ctx.sequelize, ['member_tokens'])).toEqual(before);
  });
});

describe('limits on password-reset and verification e-mails', () => {
  // Behind a trusted proxy, so each test asks from its own documentation address (RFC 5737 TEST-NET-3)
  // and its counts stay apart from every other test's.
  const proxiedApp = () => appWith(api, (c) => ({ ...c, trustProxy: 'loopback' }));
  let nextHost = 1;
  const networkAddress = () => `203.0.113.${nextHost++}`;
  const { perAddress, perIp } = ACCOUNT_MAIL_LIMITS;

  const queuedMailTo = async (email: string) => {
    const [rows] = await api.runtime.ctx.sequelize.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'email-send' AND data->>'to' = $1`, {
      bind: [email],
    });
    return (rows as { n: number }[])[0]!.n;
  };
  const tokensOf = (member: Member, purpose: string) => MemberToken.count({ where: { memberId: member.id, purpose } });
  const askReset = (client: Client, ip: string, email: string) =>
    client.send('post', '/api/password-resets', { email }).set('X-Forwarded-For', ip);
  // The minutes left can differ by one between two answers; the rest of the answer may not.
  const withoutNumbers = (body: { error: { message: string } }) => ({ ...body, error: { ...body.error, message: body.error.message.replace(/\d+/g, 'N') } });

  it('sends a member at most the limit of reset e-mails an hour, then answers 429 exactly as for an address with no account', async () => {
    const member = await createMember();
    const stranger = uniqueEmail('stranger');
    const client = new Client(proxiedApp());
    await client.refreshSession();
    const ip = networkAddress();

    for (let i = 0; i < perAddress; i++) {
      expect((await askReset(client, ip, member.email)).status).toBe(202);
      expect((await askReset(client, ip, stranger)).status).toBe(202);
    }
    // The address is counted as the form normalises it: upper case is the same inbox.
    const memberLimited = await askReset(client, ip, member.email.toUpperCase());
    const strangerLimited = await askReset(client, ip, stranger);
    expect(memberLimited.status).toBe(429);
    expect(strangerLimited.status).toBe(429);
    expect(memberLimited.body.error.code).toBe('rate_limited');
    expect(memberLimited.body.error.message).toMatch(/Please wait \d+ minutes? before asking again/);
    expect(withoutNumbers(memberLimited.body)).toEqual(withoutNumbers(strangerLimited.body));
    expect(memberLimited.headers['retry-after']).toBeDefined();

    // Three links and three e-mails, not four; nothing for the address without an account.
    expect(await tokensOf(member, 'password_reset')).toBe(perAddress);
    expect(await queuedMailTo(member.email)).toBe(perAddress);
    expect(await queuedMailTo(stranger)).toBe(0);
    const mail = await waitForMail({ to: member.email, subjectIncludes: 'Reset your' });
    expect(mail.text).toContain('/reset-password?token=');

    // Another network address does not lift the limit on the inbox.
    const elsewhere = await askReset(client, networkAddress(), member.email);
    expect(elsewhere.status).toBe(429);
    expect(await tokensOf(member, 'password_reset')).toBe(perAddress);
  });

  it('limits one network address across many e-mail addresses', async () => {
    const client = new Client(proxiedApp());
    await client.refreshSession();
    const ip = networkAddress();
    for (let i = 0; i < perIp; i++) expect((await askReset(client, ip, uniqueEmail('sprayed'))).status).toBe(202);
    const member = await createMember();
    const limited = await askReset(client, ip, member.email);
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    expect(await tokensOf(member, 'password_reset')).toBe(0);
    // The member, asking from their own network, still gets their link.
    expect((await askReset(client, networkAddress(), member.email)).status).toBe(202);
    expect(await tokensOf(member, 'password_reset')).toBe(1);
    await waitForMail({ to: member.email, subjectIncludes: 'Reset your' });
  });

  it('limits new verification links for a signed-in member', async () => {
    const member = await createMember({ verified: false });
    const app = proxiedApp();
    const client = await signedInClient(app, member);
    const ip = networkAddress();
    const resend = () => client.send('post', '/api/email-verifications/resend').set('X-Forwarded-For', ip);
    for (let i = 0; i < perAddress; i++) expect((await resend()).status).toBe(202);
    const limited = await resend();
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    expect(await tokensOf(member, 'email_verification')).toBe(perAddress);
    expect(await queuedMailTo(member.email)).toBe(perAddress);
    await waitForMail({ to: member.email, subjectIncludes: 'confirm your e-mail' });
  });
});
