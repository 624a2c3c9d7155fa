import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Guild, Member } from '../apps/api/src/db/models/index.ts';
import { loadGuild } from '../apps/api/src/modules/guild/guild.service.ts';
import { Client, createMember, signedInClient, startTestApi, TEST_INVITE_CODE, TEST_PASSWORD, uniqueEmail, type TestApi } from './support/api.ts';

let api: TestApi;
let admin: Member;
let adminClient: Client;
beforeAll(async () => {
  api = await startTestApi();
  admin = await createMember({ roles: ['member', 'admin'], name: 'Admin Person' });
  adminClient = await signedInClient(api.runtime.app, admin);
});
afterAll(async () => {
  await Guild.update({ inviteCode: TEST_INVITE_CODE }, { where: { id: 1 } });
  await api.close();
});

const validSettings = {
  name: 'Millbrook Scrap Circle',
  town: 'Millbrook',
  currency: 'USD',
  defaultUnits: 'metric',
  newcomerWindowMonths: 12,
  shelfLimitDays: 90,
  holdMinutes: 30,
  guildFeeBasisPoints: 1000,
  processingPercentBasisPoints: 290,
  processingFixedMinor: 30,
  starterLimitPerWindow: 1,
  starterWindowDays: 90,
  starterOfferHours: 72,
  starterPostingAllowed: false,
};

describe('who may use the admin routes', () => {
  it('refuses an ordinary member with 403 on every admin route', async () => {
    const member = await createMember();
    const client = await signedInClient(api.runtime.app, member);
    const target = await createMember();
    const answers = await Promise.all([
      client.get('/api/members'),
      client.send('patch', `/api/members/${target.id}`, { roles: ['member', 'admin'] }),
      client.get('/api/guild/settings'),
      client.send('put', '/api/guild/settings', validSettings),
      client.get('/api/guild/invite-code'),
      client.send('post', '/api/guild/invite-code/rotate'),
    ]);
    for (const res of answers) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect((await Member.findByPk(target.id))!.roles).toEqual(['member']);
  });

  it('asks a signed-out visitor to sign in', async () => {
    const res = await new Client(api.runtime.app).get('/api/members');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('lets a librarian see members and set the new-quilter flag, but not change roles', async () => {
    const librarian = await createMember({ roles: ['member', 'librarian'] });
    const client = await signedInClient(api.runtime.app, librarian);
    const target = await createMember({ joinedAt: new Date('2015-03-01T00:00:00Z') });
    const list = await client.get('/api/members');
    expect(list.status).toBe(200);
    const row = list.body.items.find((m: { id: string }) => m.id === target.id);
    expect(row).toMatchObject({ newQuilter: false, abilities: { changeRoles: false, deactivate: false, flagNewQuilter: true } });

    const flagged = await client.send('patch', `/api/members/${target.id}`, { newQuilterFlag: true });
    expect(flagged.status).toBe(200);
    expect(flagged.body.member).toMatchObject({ newQuilterFlag: true, newQuilter: true });
    expect((await client.send('patch', `/api/members/${target.id}`, { roles: ['member', 'treasurer'] })).status).toBe(403);
  });
});

describe('members and roles', () => {
  it('gives and takes roles, and the member sees the new abilities', async () => {
    const target = await createMember();
    const res = await adminClient.send('patch', `/api/members/${target.id}`, { roles: ['member', 'treasurer', 'librarian'] });
    expect(res.status).toBe(200);
    expect(res.body.member.roles.sort()).toEqual(['librarian', 'member', 'treasurer']);
    const theirs = await signedInClient(api.runtime.app, target);
    const session = await theirs.get('/api/session');
    expect(session.body.user.abilities).toMatchObject({ viewLedger: true, reviewBundles: true, manageMembers: true, manageSettings: false });
  });

  it('keeps the member role on every account', async () => {
    const target = await createMember();
    const res = await adminClient.send('patch', `/api/members/${target.id}`, { roles: ['treasurer'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.roles).toBeDefined();
  });

  it('switches an account off, which ends its sessions, and back on', async () => {
    const target = await createMember();
    const theirs = await signedInClient(api.runtime.app, target);
    const off = await adminClient.send('patch', `/api/members/${target.id}`, { active: false });
    expect(off.status).toBe(200);
    expect(off.body.member.active).toBe(false);
    expect((await theirs.get('/api/session')).body.user).toBeNull();
    expect((await new Client(api.runtime.app).signIn(target.email)).status).toBe(403);
    expect((await adminClient.send('patch', `/api/members/${target.id}`, { active: true })).status).toBe(200);
    expect((await new Client(api.runtime.app).signIn(target.email)).status).toBe(200);
  });

  it('does not let an admin switch off their own account or drop their own admin role', async () => {
    expect((await adminClient.send('patch', `/api/members/${admin.id}`, { active: false })).status).toBe(403);
    expect((await adminClient.send('patch', `/api/members/${admin.id}`, { roles: ['member'] })).status).toBe(403);
    expect((await Member.findByPk(admin.id))!.roles).toContain('admin');
  });

  it('answers 404 for a member that does not exist', async () => {
    const res = await adminClient.send('patch', '/api/members/00000000-0000-4000-8000-000000000000', { active: false });
    expect(res.status).toBe(404);
    expect((await adminClient.send('patch', '/api/members/not-a-uuid', { active: false })).status).toBe(404);
  });
});

describe('guild settings and the invite code', () => {
  it('saves valid settings and shows them in the session', async () => {
    const res = await adminClient.send('put', '/api/guild/settings', { ...validSettings, newcomerWindowMonths: 6 });
    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject({ newcomerWindowMonths: 6, defaultUnits: 'metric' });
    expect((await adminClient.get('/api/session')).body.guild).toMatchObject({ name: 'Millbrook Scrap Circle', defaultUnits: 'metric' });
    await adminClient.send('put', '/api/guild/settings', validSettings);
  });

  it('reads the guild by its prepared statement exactly as the model finder does', async () => {
    const [prepared, found] = await Promise.all([loadGuild(), Guild.findByPk(1)]);
    expect(prepared.toJSON()).toEqual(found!.toJSON());
    expect(prepared.isNewRecord).toBe(false);
    expect(prepared.changed()).toBe(false);
  });

  it('refuses a bad document naming the field, and changes nothing', async () => {
    const before = (await Guild.findByPk(1))!.toJSON();
    const res = await adminClient.send('put', '/api/guild/settings', { ...validSettings, currency: 'XYZ', holdMinutes: 1.5 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['currency', 'holdMinutes']);
    expect((await Guild.findByPk(1))!.toJSON()).toEqual(before);
  });

  it('keeps the guild’s time zone, refusing one no clock knows, and a document without it means UTC', async () => {
    const saved = await adminClient.send('put', '/api/guild/settings', { ...validSettings, timeZone: 'America/Los_Angeles' });
    expect(saved.status).toBe(200);
    expect(saved.body.settings.timeZone).toBe('America/Los_Angeles');
    const wrong = await adminClient.send('put', '/api/guild/settings', { ...validSettings, timeZone: 'Atlantis/Lost_City' });
    expect(wrong.status).toBe(400);
    expect(Object.keys(wrong.body.error.fields)).toEqual(['timeZone']);
    expect((await adminClient.get('/api/guild/settings')).body.settings.timeZone).toBe('America/Los_Angeles');
    expect((await adminClient.send('put', '/api/guild/settings', validSettings)).body.settings.timeZone).toBe('UTC');
  });

  it('keeps the currency once amounts are held in it: 1500 cents never become 1500 of another currency', async () => {
    const seller = await signedInClient(api.runtime.app, await createMember({ name: 'Priced Draft' }));
    expect((await seller.send('post', '/api/bundles', { title: 'Priced draft', offer: 'sale', priceMinor: 1500 })).status).toBe(201);
    const before = (await Guild.findByPk(1))!.toJSON();
    const res = await adminClient.send('put', '/api/guild/settings', { ...validSettings, currency: before.currency === 'USD' ? 'CAD' : 'USD' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.currency).toContain(`kept in ${before.currency}`);
    expect((await Guild.findByPk(1))!.toJSON()).toEqual(before);
  });

  it('rotates the invite code: the old one stops working for joining', async () => {
    const res = await adminClient.send('post', '/api/guild/invite-code/rotate');
    expect(res.status).toBe(200);
    expect(res.body.inviteCode).toMatch(/^[A-Z2-9]{4}-[A-Z2-9]{4}$/);
    expect((await adminClient.get('/api/guild/invite-code')).body.inviteCode).toBe(res.body.inviteCode);
    const joiner = new Client(api.runtime.app);
    await joiner.refreshSession();
    const old = await joiner.send('post', '/api/members', { inviteCode: TEST_INVITE_CODE, name: 'Late', email: uniqueEmail(), password: TEST_PASSWORD });
    expect(old.status).toBe(400);
    const fresh = await joiner.send('post', '/api/members', { inviteCode: res.body.inviteCode.toLowerCase(), name: 'On time', email: uniqueEmail(), password: TEST_PASSWORD });
    expect(fresh.status).toBe(201);
    await Guild.update({ inviteCode: TEST_INVITE_CODE }, { where: { id: 1 } });
  });
});
