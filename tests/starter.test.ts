import { Op } from 'sequelize';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { Bundle, DEFAULT_GUILD_SETTINGS, Guild, Meeting, Order, StarterClaim, WaitlistEntry, WaitlistOffer, type Member } from '../apps/api/src/db/models/index.ts';
import { lapseOffers, offerToNextInLine, placeUnplacedClaims, remindOpenOffers } from '../apps/api/src/modules/starter/starter.service.ts';
import { sendMeetingReminders } from '../apps/api/src/modules/handovers/handovers.service.ts';
import { formatWhen, meetingLabel } from '../apps/api/src/emails/format.ts';
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
    // Ben is told that not answering took him off the list, and how to join again.
    const lapsedMail = await waitForMail({ to: ben.email, subjectIncludes: 'offer has ended' });
    expect(lapsedMail.text).toContain('Starter bag of batik');
    expect(lapsedMail.text).toContain('you have left the starter-bundle waiting list');
    expect(lapsedMail.text).toContain('Join the list again from the starter page');
    expect(lapsedMail.text).toContain(`${api.config.appUrl}/starter`);
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
    const removedMail = await waitForMail({ to: two.email, subjectIncludes: 'no longer on the starter-bundle waiting list' });
    expect(removedMail.text).toContain('The librarian has taken you off the starter-bundle waiting list');
    expect(removedMail.text).toContain('Reason: Moved away from the guild');
    // Leaving of one's own accord needs no e-mail.
    expect((await listMail()).some((m) => m.to.includes(one.email))).toBe(false);
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

/** E-mail jobs queued for one address whose subject contains `subject`, read from the job queue's table. */
async function queuedMail(to: string, subject: string): Promise<number> {
  const [rows] = await api.runtime.ctx.sequelize.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'email-send' AND data->>'to' = $1 AND data->>'subject' LIKE $2`, {
    bind: [to, `%${subject}%`],
  });
  return (rows as { n: number }[])[0]!.n;
}

/** Takes every starter bundle off the shelf, puts the members on the waiting list in this order, then brings the given bundles back without offering them. */
async function queueUpWith(bundleIds: string[], members: Member[]) {
  await Bundle.update({ state: 'withdrawn' }, { where: { offer: 'starter', state: ['on_shelf', 'held'] } });
  for (const m of members) expect((await (await signedInClient(api.runtime.app, m)).send('post', '/api/waitlist', {})).status).toBe(201);
  if (bundleIds.length) await Bundle.update({ state: 'on_shelf' }, { where: { id: bundleIds } });
}

/** The zone the guild's e-mails give times in. */
const guildZone = async () => (await Guild.findByPk(1))!.settings.timeZone ?? 'UTC';

describe('waiting-list offers under concurrency', () => {
  it('two bundles offered at the same moment go to the first two people in line, not past the list', async () => {
    const one = await donated({ title: 'Starter pair, first' });
    const two = await donated({ title: 'Starter pair, second' });
    const [ann, bob, cyd] = [await newQuilter('Ann First'), await newQuilter('Bob Second'), await newQuilter('Cyd Third')];
    await queueUpWith([one, two], [ann, bob, cyd]);

    // The first offer's transaction is still open (it holds Ann's place) when the second one runs and commits.
    const { sequelize } = api.runtime.ctx;
    const first = await sequelize.transaction();
    const second = await sequelize.transaction();
    try {
      const toFirst = await offerToNextInLine(api.runtime.ctx, one, first);
      const toSecond = await offerToNextInLine(api.runtime.ctx, two, second);
      await second.commit();
      await first.commit();
      expect(toFirst).not.toBeNull();
      expect(toSecond).not.toBeNull();
    } catch (err) {
      await Promise.allSettled([first.rollback(), second.rollback()]);
      throw err;
    }
    const offers = await WaitlistOffer.findAll({ where: { bundleId: [one, two], status: 'open' } });
    const entryOf = async (bundleId: string) => (await WaitlistEntry.findByPk(offers.find((o) => o.bundleId === bundleId)!.entryId))!.memberId;
    expect(await entryOf(one)).toBe(ann.id);
    expect(await entryOf(two)).toBe(bob.id);
    expect((await Bundle.findAll({ where: { id: [one, two] } })).map((b) => b.state)).toEqual(['held', 'held']);
    expect((await WaitlistEntry.findOne({ where: { memberId: cyd.id } }))!.status).toBe('waiting');
    expect((await waitForMail({ to: bob.email, subjectIncludes: 'starter bundle is waiting' })).text).toContain('Starter pair, second');
    for (const offer of offers) await WaitlistOffer.update({ status: 'withdrawn' }, { where: { id: offer.id } });
  });
});

describe('telling members about their place on the waiting list', () => {
  it('sends the offer even to a member who turned starter e-mails off, with the deadline and what not answering means', async () => {
    const id = await donated({ title: 'Starter bag for a quiet inbox' });
    const quiet = await newQuilter('Quinn Quiet');
    await quiet.update({ emailPreferences: { starter: false } });
    await queueUpWith([], [quiet]);
    await Bundle.update({ state: 'on_shelf' }, { where: { id } });
    await api.runtime.ctx.sequelize.transaction((t) => offerToNextInLine(api.runtime.ctx, id, t));
    const offer = (await WaitlistOffer.findOne({ where: { bundleId: id, status: 'open' } }))!;
    const mail = await waitForMail({ to: quiet.email, subjectIncludes: 'starter bundle is waiting' });
    expect(mail.text).toContain(formatWhen(offer.expiresAt, await guildZone()));
    expect(mail.text).toContain('you leave the waiting list');
    expect(mail.text).toContain('join the list again');
    await WaitlistOffer.update({ status: 'withdrawn' }, { where: { id: offer.id } });
  });

  it('reminds once when half the time to answer has gone, even with two runs at once', async () => {
    const id = await donated({ title: 'Starter bag to be reminded of' });
    const slow = await newQuilter('Sol Slow');
    await queueUpWith([id], [slow]);
    await api.runtime.ctx.sequelize.transaction((t) => offerToNextInLine(api.runtime.ctx, id, t));
    const offer = (await WaitlistOffer.findOne({ where: { bundleId: id, status: 'open' } }))!;
    // Before half the time to answer has gone, nothing goes.
    await remindOpenOffers(api.runtime.ctx);
    expect(await queuedMail(slow.email, 'Still held for you')).toBe(0);
    api.clock.advance((offer.expiresAt.getTime() - offer.offeredAt.getTime()) / 2 + 3600 * 1000);
    try {
      await Promise.all([remindOpenOffers(api.runtime.ctx), remindOpenOffers(api.runtime.ctx)]);
      await remindOpenOffers(api.runtime.ctx);
    } finally {
      api.clock.reset();
    }
    expect(await queuedMail(slow.email, 'Still held for you')).toBe(1);
    const [rows] = await api.runtime.ctx.sequelize.query(`SELECT reminder_sent_at FROM waitlist_offers WHERE id = $1`, { bind: [offer.id] });
    expect((rows as { reminder_sent_at: Date | null }[])[0]!.reminder_sent_at).not.toBeNull();
    const mail = await waitForMail({ to: slow.email, subjectIncludes: 'Still held for you' });
    expect(mail.text).toContain('Starter bag to be reminded of');
    expect(mail.text).toContain(formatWhen(offer.expiresAt, await guildZone()));
    expect(mail.text).toContain('you leave the waiting list');
    await WaitlistOffer.update({ status: 'withdrawn' }, { where: { id: offer.id } });
  });

  it('tells a member taken off the list because they are no longer a new quilter, and offers the bundle to the next', async () => {
    const id = await donated({ title: 'Starter bag past the window' });
    const [late, next] = [await newQuilter('Lou Late'), await newQuilter('Nia Next')];
    await queueUpWith([], [late, next]);
    // Lou has been with the guild past the newcomer window (guild default 12 months) by the time a bundle is free.
    await late.update({ joinedAt: new Date('2015-01-01T00:00:00Z') });
    await Bundle.update({ state: 'on_shelf' }, { where: { id } });
    await api.runtime.ctx.sequelize.transaction((t) => offerToNextInLine(api.runtime.ctx, id, t));
    const entry = (await WaitlistEntry.findOne({ where: { memberId: late.id } }))!;
    expect(entry.status).toBe('removed');
    expect(entry.removedReason).toContain('first 12 months');
    const mail = await waitForMail({ to: late.email, subjectIncludes: 'no longer on the starter-bundle waiting list' });
    expect(mail.text).toContain('You have been taken off the starter-bundle waiting list');
    expect(mail.text).toContain('first 12 months');
    await waitForMail({ to: next.email, subjectIncludes: 'starter bundle is waiting' });
    await WaitlistOffer.update({ status: 'withdrawn' }, { where: { bundleId: id, status: 'open' } });
  });
});

describe('a starter claim made while no meeting is set', () => {
  it('goes to the meeting the librarian sets next, both people are told, and it is on that handover sheet', async () => {
    const id = await donated({ title: 'Starter bag waiting for a meeting' });
    const nia = await newQuilter('Nia Nomeeting');
    const client = await signedInClient(api.runtime.app, nia);
    // No meeting to come: the guild's coming meetings are set aside for this test and put back after it.
    const coming = await Meeting.findAll({ where: { startsAt: { [Op.gt]: new Date() } } });
    await Meeting.update({ startsAt: new Date('2000-01-01T18:00:00Z') }, { where: { id: coming.map((m) => m.id) } });
    let meetingId = '';
    try {
      const claim = await client.send('post', `/api/starter-bundles/${id}/claims`, {});
      expect(claim.status).toBe(201);
      expect(claim.body.claim.meetingId).toBeNull();
      const claimedMail = await waitForMail({ to: nia.email, subjectIncludes: 'Your starter bundle' });
      expect(claimedMail.text).toContain('No guild meeting is set yet');
      expect(claimedMail.text).toContain('we will e-mail you the date and place');
      expect(claimedMail.text).not.toContain('The librarian will tell you');

      const startsAt = new Date(Date.now() + 12 * DAY);
      const created = await librarianClient.send('post', '/api/meetings', { startsAt: startsAt.toISOString(), place: 'Millbrook Hall, garden room' });
      expect(created.status).toBe(201);
      meetingId = created.body.meeting.id;
      expect((await StarterClaim.findByPk(claim.body.claim.id))!.meetingId).toBe(meetingId);
      const label = meetingLabel({ startsAt, place: 'Millbrook Hall, garden room' }, await guildZone());
      const toNia = await waitForMail({ to: nia.email, subjectIncludes: 'Starter bundle handover' });
      expect(toNia.text).toContain(`Collect your starter bundle "Starter bag waiting for a meeting" at the meeting: ${label}.`);
      const toDonor = await waitForMail({ to: donor.email, subjectIncludes: 'Starter bundle handover' });
      expect(toDonor.text).toContain('Please bring it.');
      expect(toDonor.text).toContain(label);
      const sheet = await librarianClient.get(`/api/meetings/${meetingId}/handovers`);
      expect(sheet.body.items.find((h: { id: string }) => h.id === claim.body.claim.id)).toMatchObject({ kind: 'starter', collector: { name: 'Nia Nomeeting' }, giver: { name: 'Dora Pike' } });
      expect((await client.get('/api/starter-bundles')).body.status.claims[0].meeting).toMatchObject({ id: meetingId, place: 'Millbrook Hall, garden room' });
    } finally {
      for (const m of coming) await Meeting.update({ startsAt: m.startsAt }, { where: { id: m.id } });
    }
  });

  it('the scheduled run places a claim that missed the meeting being created, once, however many processes run it', async () => {
    const id = await donated({ title: 'Starter bag that slipped through' });
    const sid = await newQuilter('Sid Slipped');
    const claim = await (await signedInClient(api.runtime.app, sid)).send('post', `/api/starter-bundles/${id}/claims`, {});
    expect(claim.status).toBe(201);
    // As if the claim committed just as a meeting was being created, and saw none.
    await StarterClaim.update({ meetingId: null }, { where: { id: claim.body.claim.id } });
    const placed = await Promise.all([placeUnplacedClaims(api.runtime.ctx), placeUnplacedClaims(api.runtime.ctx)]);
    expect(placed[0]! + placed[1]!).toBeLessThanOrEqual(1);
    const next = (await Meeting.findOne({ where: { startsAt: { [Op.gt]: new Date() } }, order: [['startsAt', 'ASC']] }))!;
    expect((await StarterClaim.findByPk(claim.body.claim.id))!.meetingId).toBe(next.id);
    expect(await placeUnplacedClaims(api.runtime.ctx)).toBe(0);
    expect(await queuedMail(sid.email, 'Starter bundle handover')).toBe(1);
    expect((await waitForMail({ to: sid.email, subjectIncludes: 'Starter bundle handover' })).text).toContain(next.place);
  });
});
