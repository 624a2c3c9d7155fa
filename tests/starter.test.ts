import { Op } from 'sequelize';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { Bundle, DEFAULT_GUILD_SETTINGS, Guild, Meeting, Order, StarterClaim, WaitlistEntry, type Member } from '../apps/api/src/db/models/index.ts';
import { lapseOffers } from '../apps/api/src/modules/starter/starter.service.ts';
import { sendMeetingReminders } from '../apps/api/src/modules/handovers/handovers.service.ts';
import { formatWhen } from '../apps/api/src/emails/format.ts';
import { createMember, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';
import { clearMail, listMail, waitForMail } from './support/services.ts';

let api: TestApi;
let librarian: Member;
let librarianClient: Client;
let donorClient: Client;
let donor: Member;
let meeting: Meeting;

const DAY = 86_400_000;
const newQuilter = (name = 'New Quilter') => createMember({ name, joinedAt: new Date(Date.now() - 30 * DAY) });

beforeAll(async () => {
  api = await startTestApi();
  librarian = await createMember({ roles: ['member', 'librarian'], name: 'Ivo Lumb' });
  librarianClient = await signedInClient(api.runtime.app, librarian);
  donor = await createMember({ name: 'Dora Pike' });
  donorClient = await signedInClient(api.runtime.app, donor);
  meeting = await Meeting.create({ startsAt: new Date(Date.now() + 10 * DAY), place: 'Millbrook Hall', createdBy: null });
});
afterAll(async () => {
  await api.close();
});
beforeEach(async () => {
  await clearMail();
  // Tests here each make their own queue; earlier entries would stand in front of them.
  await WaitlistEntry.update({ status: 'left' }, { where: { status: ['waiting', 'offered'] } });
});

const starterListing = { offer: 'starter', priceMinor: null, meetingHandoverOk: false, title: 'Starter bag: cotton squares and strips' };

/** A donated starter bundle, approved by the librarian. */
async function donated(overrides: Record<string, unknown> = {}) {
  const id = await listAndSubmit(donorClient, { ...starterListing, ...overrides });
  expect((await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
  return id;
}

describe('claiming starter bundles', () => {
  it('a new quilter claims one, and the librarian sees it on the meeting’s handover sheet', async () => {
    const id = await donated();
    // The donor hears it is for a new quilter, not that it is on sale on the shelf.
    const thanks = await waitForMail({ to: donor.email, subjectIncludes: 'For a new quilter' });
    expect(thanks.text).toContain('starter programme');
    expect(thanks.text).not.toContain('on the guild\'s shelf');
    const nell = await newQuilter('Nell Tester');
    const client = await signedInClient(api.runtime.app, nell);
    const list = await client.get('/api/starter-bundles');
    expect(list.status).toBe(200);
    expect(list.body.status.eligibility.eligible).toBe(true);
    expect(list.body.items.map((b: { id: string }) => b.id)).toContain(id);
    expect(list.body.items.find((b: { id: string }) => b.id === id).abilities.claim).toBe(true);

    const claim = await client.send('post', `/api/starter-bundles/${id}/claims`, { meetingId: meeting.id });
    expect(claim.status).toBe(201);
    expect((await Bundle.findByPk(id))!.state).toBe('rehomed');
    await waitForMail({ to: nell.email, subjectIncludes: 'Your starter bundle' });

    const sheet = await librarianClient.get(`/api/meetings/${meeting.id}/handovers`);
    expect(sheet.status).toBe(200);
    const row = sheet.body.items.find((h: { id: string }) => h.id === claim.body.claim.id);
    expect((await librarianClient.get(`/api/handovers/${claim.body.claim.id}`)).body).toEqual({ meetingId: meeting.id });
    expect(row).toMatchObject({ kind: 'starter', collector: { name: 'Nell Tester' }, giver: { name: 'Dora Pike' }, done: false });
    expect(row.qrSvg).toContain('<svg');

    expect((await librarianClient.send('post', `/api/handovers/${row.id}/done`)).status).toBe(204);
    const ticked = (await librarianClient.get(`/api/meetings/${meeting.id}/handovers`)).body.items.find((h: { id: string }) => h.id === row.id);
    expect(ticked).toMatchObject({ done: true, doneBy: 'Ivo Lumb' });
    expect((await librarianClient.send('delete', `/api/handovers/${row.id}/done`)).status).toBe(204);
    expect((await StarterClaim.findByPk(row.id))!.state).toBe('claimed');
  });

  it('refuses a member without the new-quilter flag with 403', async () => {
    const id = await donated();
    const old = await createMember({ joinedAt: new Date('2015-01-01T00:00:00Z') });
    const res = await (await signedInClient(api.runtime.app, old)).send('post', `/api/starter-bundles/${id}/claims`, {});
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/new quilters/);
  });

  it('refuses a second claim inside the window with 403 and the date they may claim again', async () => {
    const first = await donated();
    const second = await donated();
    const client = await signedInClient(api.runtime.app, await newQuilter());
    expect((await client.send('post', `/api/starter-bundles/${first}/claims`, {})).status).toBe(201);
    const again = await client.send('post', `/api/starter-bundles/${second}/claims`, {});
    expect(again.status).toBe(403);
    // Design choice, guild default: one starter bundle per new quilter per 90 days.
    const expected = new Date(Date.now() + 90 * DAY).toISOString().slice(0, 10);
    expect(again.body.error.fields.nextEligibleAt).toBe(expected);
    expect(again.body.error.message).toContain(expected);
  });

  it('20 concurrent claims on one starter bundle: exactly one', async () => {
    const id = await donated();
    const clients = await Promise.all(Array.from({ length: 20 }, async () => signedInClient(api.runtime.app, await newQuilter())));
    const answers = await Promise.all(clients.map((c) => c.send('post', `/api/starter-bundles/${id}/claims`, {})));
    expect(answers.filter((a) => a.status === 201)).toHaveLength(1);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(19);
    expect(await StarterClaim.count({ where: { bundleId: id } })).toBe(1);
  }, 60_000);

  it('keeps starter bundles off the ordinary shelf and out of checkout', async () => {
    const id = await donated();
    const buyer = await signedInClient(api.runtime.app, await createMember());
    const shelf = await buyer.get('/api/bundles?pageSize=60');
    expect(shelf.body.items.map((b: { id: string }) => b.id)).not.toContain(id);
    const order = await buyer.send('post', '/api/orders', { items: [{ bundleId: id, quantity: 1 }], fulfilment: 'meeting', meetingId: meeting.id });
    expect(order.status).toBe(422);
  });
});

describe('the waiting list', () => {
  it('offers in order; decline and lapse pass to the next; the librarian sees the queue', async () => {
    const [ada, ben, cal] = [await newQuilter('Ada Queue'), await newQuilter('Ben Queue'), await newQuilter('Cal Queue')];
    const clients = [await signedInClient(api.runtime.app, ada), await signedInClient(api.runtime.app, ben), await signedInClient(api.runtime.app, cal)];
    // Nothing free right now, so they queue in this order.
    await Bundle.update({ state: 'withdrawn' }, { where: { offer: 'starter', state: 'on_shelf' } });
    for (const c of clients) expect((await c.send('post', '/api/waitlist', {})).status).toBe(201);
    expect((await clients[0]!.send('post', '/api/waitlist', {})).status).toBe(409);

    const queue = await librarianClient.get('/api/waitlist');
    expect(queue.body.items.map((e: { name: string }) => e.name)).toEqual(['Ada Queue', 'Ben Queue', 'Cal Queue']);

    const id = await donated({ title: 'Starter bag of batik' });
    expect((await Bundle.findByPk(id))!.state).toBe('held');
    const toAda = await waitForMail({ to: ada.email, subjectIncludes: 'starter bundle is waiting' });
    const adaOffer = toAda.text.match(/\/starter\/offers\/([0-9a-f-]{36})/)![1]!;
    expect((await clients[1]!.send('post', `/api/waitlist/offers/${adaOffer}/accept`, {})).status).toBe(404);
    expect((await clients[0]!.send('post', `/api/waitlist/offers/${adaOffer}/decline`)).status).toBe(204);

    const toBen = await waitForMail({ to: ben.email, subjectIncludes: 'starter bundle is waiting' });
    expect(toBen.text).toContain('Starter bag of batik');
    api.clock.advance(73 * 3600 * 1000);
    try {
      expect(await lapseOffers(api.runtime.ctx)).toBe(1);
    } finally {
      api.clock.reset();
    }
    const toCal = await waitForMail({ to: cal.email, subjectIncludes: 'starter bundle is waiting' });
    const calOffer = toCal.text.match(/\/starter\/offers\/([0-9a-f-]{36})/)![1]!;
    const accepted = await clients[2]!.send('post', `/api/waitlist/offers/${calOffer}/accept`, { meetingId: meeting.id });
    expect(accepted.status).toBe(201);
    expect((await Bundle.findByPk(id))!.state).toBe('rehomed');
    expect((await librarianClient.get('/api/waitlist')).body.items).toEqual([]);
    const entries = await WaitlistEntry.findAll({ where: { memberId: [ada.id, ben.id, cal.id] }, order: [['joinedAt', 'ASC']] });
    expect(entries.map((e) => e.status)).toEqual(['declined', 'lapsed', 'claimed']);
  });

  it('passes on the bundle held for a member who claims another one first, so nobody gets two past the limit', async () => {
    await Bundle.update({ state: 'withdrawn' }, { where: { offer: 'starter', state: ['on_shelf', 'held'] } });
    const ada = await newQuilter('Ada Twice');
    const client = await signedInClient(api.runtime.app, ada);
    expect((await client.send('post', '/api/waitlist', {})).status).toBe(201);
    const held = await donated({ title: 'Starter bag held for Ada' });
    expect((await Bundle.findByPk(held))!.state).toBe('held');
    const toAda = await waitForMail({ to: ada.email, subjectIncludes: 'starter bundle is waiting' });
    const offerId = toAda.text.match(/\/starter\/offers\/([0-9a-f-]{36})/)![1]!;

    // Nobody else waits, so a second donation goes on the shelf, and Ada claims it there.
    const other = await donated({ title: 'Starter bag on the shelf' });
    expect((await client.send('post', `/api/starter-bundles/${other}/claims`, { meetingId: meeting.id })).status).toBe(201);
    // The first bundle's offer ended with that claim and the bundle is free for the next new quilter.
    expect((await Bundle.findByPk(held))!.state).toBe('on_shelf');
    const late = await client.send('post', `/api/waitlist/offers/${offerId}/accept`, { meetingId: meeting.id });
    expect(late.status).toBe(409);
    expect(await StarterClaim.count({ where: { memberId: ada.id } })).toBe(1);
    expect((await WaitlistEntry.findOne({ where: { memberId: ada.id } }))!.status).toBe('claimed');
  });

  it('lets a member leave and the librarian remove someone with a reason', async () => {
    await Bundle.update({ state: 'withdrawn' }, { where: { offer: 'starter', state: 'on_shelf' } });
    const [one, two] = [await newQuilter('Leaving Soon'), await newQuilter('Removed Person')];
    const c1 = await signedInClient(api.runtime.app, one);
    const c2 = await signedInClient(api.runtime.app, two);
    await c1.send('post', '/api/waitlist', {});
    await c2.send('post', '/api/waitlist', {});
    expect((await c1.send('delete', '/api/waitlist/me')).status).toBe(204);
    const entry = (await librarianClient.get('/api/waitlist')).body.items.find((e: { name: string }) => e.name === 'Removed Person');
    expect((await librarianClient.send('delete', `/api/waitlist/${entry.id}`, {})).status).toBe(400);
    expect((await librarianClient.send('delete', `/api/waitlist/${entry.id}`, { reason: 'Moved away from the guild' })).status).toBe(204);
    expect((await WaitlistEntry.findByPk(entry.id))!.removedReason).toBe('Moved away from the guild');
    expect((await c2.send('delete', `/api/waitlist/${entry.id}`, { reason: 'not allowed' })).status).toBe(404);
  });
});

describe('meeting reminders and moving handovers', () => {
  it('e-mails only the people with something to bring or collect, once, with the time where the guild meets', async () => {
    const soon = await Meeting.create({ startsAt: new Date(Date.now() + 36 * 3600 * 1000), place: 'Church room', createdBy: null });
    const guild = (await Guild.findByPk(1))!;
    await guild.update({ settings: { ...guild.settings, timeZone: 'Pacific/Auckland' } });
    const id = await donated({ title: 'Starter reds' });
    const collector = await newQuilter('Cora Collector');
    const bystander = await createMember({ name: 'Bea Bystander' });
    expect((await (await signedInClient(api.runtime.app, collector)).send('post', `/api/starter-bundles/${id}/claims`, { meetingId: soon.id })).status).toBe(201);
    await clearMail();
    // Other tests' meetings are not part of this check.
    await Meeting.update({ reminderSentAt: new Date() }, { where: { id: { [Op.ne]: soon.id }, reminderSentAt: null } });
    expect(await sendMeetingReminders(api.runtime.ctx)).toBe(2);
    const toCollector = await waitForMail({ to: collector.email, subjectIncludes: 'Reminder for the meeting' });
    expect(toCollector.text).toContain('You will collect:');
    // In the guild's own zone, as the meeting is announced there, not in UTC.
    expect(toCollector.text).toContain(`${formatWhen(soon.startsAt, 'Pacific/Auckland')}, Church room`);
    expect(toCollector.text).toMatch(/GMT\+1[23]/);
    await guild.update({ settings: { ...guild.settings, timeZone: 'UTC' } });
    const toDonor = await waitForMail({ to: donor.email, subjectIncludes: 'Reminder for the meeting' });
    expect(toDonor.text).toContain('Please bring:');
    expect((await listMail()).some((m) => m.to.includes(bystander.email))).toBe(false);
    expect(await sendMeetingReminders(api.runtime.ctx)).toBe(0);
  });

  it('moves what was not handed over to the next meeting and tells both people', async () => {
    const past = await Meeting.create({ startsAt: new Date(Date.now() + 3600 * 1000), place: 'Old hall', createdBy: null });
    const next = await Meeting.create({ startsAt: new Date(Date.now() + 30 * DAY), place: 'New hall', createdBy: null });
    const id = await donated({ title: 'Starter neutrals' });
    const collector = await newQuilter('Moe Mover');
    const claim = await (await signedInClient(api.runtime.app, collector)).send('post', `/api/starter-bundles/${id}/claims`, { meetingId: past.id });
    await clearMail();
    const moved = await librarianClient.send('post', `/api/meetings/${past.id}/handovers/move`, { toMeetingId: next.id });
    expect(moved.body.moved).toBe(1);
    expect((await StarterClaim.findByPk(claim.body.claim.id))!.meetingId).toBe(next.id);
    await waitForMail({ to: collector.email, subjectIncludes: 'Handover moved' });
    expect((await Order.count({ where: { meetingId: past.id } }))).toBe(0);
  });

  it('does not let an ordinary member open the sheet or tick', async () => {
    const member = await signedInClient(api.runtime.app, await createMember());
    expect((await member.get(`/api/meetings/${meeting.id}/handovers`)).status).toBe(403);
  });
});

describe('posting a starter bundle where the guild allows it', () => {
  const address = { name: 'Posy Newcomer', line1: '2 Lane End', town: 'Millbrook', postalCode: '97451', country: 'US' };

  it('is refused while the guild hands starter bundles over at meetings only', async () => {
    const id = await donated({ title: 'Starter to post, not allowed' });
    const client = await signedInClient(api.runtime.app, await newQuilter());
    const res = await client.send('post', '/api/orders', { items: [{ bundleId: id, quantity: 1 }], fulfilment: 'post', address });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.fulfilment).toBeDefined();
  });

  it('lets an eligible new quilter pay the postage only; cancelling ends the claim and frees the bundle', async () => {
    await Guild.update({ settings: { ...DEFAULT_GUILD_SETTINGS, starterPostingAllowed: true } }, { where: { id: 1 } });
    try {
      const id = await donated({ title: 'Starter to post', weightGrams: 200 });
      const posy = await newQuilter('Posy Newcomer');
      const client = await signedInClient(api.runtime.app, posy);
      const placed = await client.send('post', '/api/orders', { items: [{ bundleId: id, quantity: 1 }], fulfilment: 'post', address });
      expect(placed.status).toBe(201);
      // 200 g + 15 g envelope → the ½ lb local band 450¢ + 50¢ handling (the guild's default table); nothing for the bundle itself.
      expect(placed.body.order).toMatchObject({ subtotalMinor: 0, postageMinor: 500, chargeMinor: 500, state: 'awaiting_payment' });
      expect(await StarterClaim.count({ where: { memberId: posy.id, state: 'claimed' } })).toBe(1);
      // The claim goes by post, so the meeting's handover sheet cannot cancel it; its order can.
      const posted = (await StarterClaim.findOne({ where: { memberId: posy.id, state: 'claimed' } }))!;
      const fromSheet = await librarianClient.send('post', `/api/handovers/${posted.id}/cancel`, {});
      expect(fromSheet.status).toBe(409);
      expect(fromSheet.body.error.fields.id).toBe('Sent by post.');
      expect((await Bundle.findByPk(id))!.quantityAvailable).toBe(0);

      const other = await donated({ title: 'Second starter' });
      const again = await client.send('post', `/api/starter-bundles/${other}/claims`, {});
      expect(again.status).toBe(403);

      expect((await client.send('post', `/api/orders/${placed.body.order.id}/cancel`, {})).status).toBe(200);
      expect(await StarterClaim.count({ where: { memberId: posy.id, state: 'claimed' } })).toBe(0);
      expect((await Bundle.findByPk(id))!.state).toBe('on_shelf');
      expect((await client.send('post', `/api/starter-bundles/${other}/claims`, {})).status).toBe(201);
    } finally {
      await Guild.update({ settings: DEFAULT_GUILD_SETTINGS }, { where: { id: 1 } });
    }
  });
});
