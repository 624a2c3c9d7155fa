import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { Guild, Meeting, WaitlistEntry, type Member } from '../apps/api/src/db/models/index.ts';
import { meetingLabel } from '../apps/api/src/emails/format.ts';
import { sendMeetingReminders } from '../apps/api/src/modules/handovers/handovers.service.ts';
import { createMember, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';
import { clearMail, listMail, waitForMail } from './support/services.ts';

let api: TestApi;
let librarianClient: Client;
let seller: Member;
let sellerClient: Client;
let buyer: Member;
let buyerClient: Client;
let donor: Member;
let donorClient: Client;

const DAY = 86_400_000;
const ZONE = 'Pacific/Auckland';

beforeAll(async () => {
  api = await startTestApi();
  librarianClient = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian'], name: 'Lise Keeper' }));
  seller = await createMember({ name: 'Sal Giver' });
  sellerClient = await signedInClient(api.runtime.app, seller);
  buyer = await createMember({ name: 'Bo Taker' });
  buyerClient = await signedInClient(api.runtime.app, buyer);
  donor = await createMember({ name: 'Dee Donor' });
  donorClient = await signedInClient(api.runtime.app, donor);
  // Times in these e-mails are in the guild's own zone, not the server's.
  const guild = (await Guild.findByPk(1))!;
  await guild.update({ settings: { ...guild.settings, timeZone: ZONE } });
});
afterAll(async () => {
  const guild = (await Guild.findByPk(1))!;
  await guild.update({ settings: { ...guild.settings, timeZone: 'UTC' } });
  await api.close();
});
beforeEach(async () => {
  await clearMail();
  // A starter bundle approved here must stay free to claim, not go to someone another file left waiting.
  await WaitlistEntry.update({ status: 'left' }, { where: { status: ['waiting', 'offered'] } });
});

/** "Meeting changed" e-mails queued for one address. */
async function queuedChangeMail(to: string): Promise<number> {
  const [rows] = await api.runtime.ctx.sequelize.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'email-send' AND data->>'to' = $1 AND data->>'subject' LIKE 'Meeting changed%'`, { bind: [to] });
  return (rows as { n: number }[])[0]!.n;
}

/** A bundle listed by `client` and approved by the librarian. */
async function approved(client: Client, overrides: Record<string, unknown>) {
  const id = await listAndSubmit(client, overrides);
  expect((await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
  return id;
}

/** A meeting with a free meeting order (Sal gives, Bo takes) and a starter claim (Dee gave, the new quilter collects). */
async function meetingWithHandovers(place: string) {
  const startsAt = new Date(Date.now() + 10 * DAY);
  const created = await librarianClient.send('post', '/api/meetings', { startsAt: startsAt.toISOString(), place });
  expect(created.status).toBe(201);
  const meetingId = created.body.meeting.id as string;
  const freebie = await approved(sellerClient, { offer: 'meeting', priceMinor: null, meetingHandoverOk: false, title: 'Bag of flannel offcuts' });
  const order = await buyerClient.send('post', '/api/orders', { items: [{ bundleId: freebie, quantity: 1 }], fulfilment: 'meeting', meetingId });
  expect(order.body.order.state).toBe('confirmed');
  const starter = await approved(donorClient, { offer: 'starter', priceMinor: null, meetingHandoverOk: false, title: 'Starter bag of batik squares' });
  const newcomer = await createMember({ name: 'Nico Newcomer', joinedAt: new Date(Date.now() - 30 * DAY) });
  const claim = await (await signedInClient(api.runtime.app, newcomer)).send('post', `/api/starter-bundles/${starter}/claims`, { meetingId });
  expect(claim.status).toBe(201);
  return { meetingId, startsAt, newcomer };
}

describe('changing a meeting where members have handovers', () => {
  it('tells everyone who brings or collects there what changed, in the guild’s time zone, and reminds again for the new date', async () => {
    const { meetingId, startsAt, newcomer } = await meetingWithHandovers('Millbrook Hall');
    const bystander = await createMember({ name: 'Bea Bystander' });
    // The reminder for the old date had gone out.
    await Meeting.update({ reminderSentAt: new Date() }, { where: { id: meetingId } });
    await clearMail();

    const newStart = new Date(startsAt.getTime() + 7 * DAY);
    const changed = await librarianClient.send('patch', `/api/meetings/${meetingId}`, { startsAt: newStart.toISOString(), place: 'Millbrook Library, back room' });
    expect(changed.status).toBe(200);
    expect(changed.body.meeting).toMatchObject({ startsAt: newStart.toISOString(), place: 'Millbrook Library, back room' });
    const row = (await Meeting.findByPk(meetingId))!;
    expect(row.reminderSentAt).toBeNull();

    const before = meetingLabel({ startsAt, place: 'Millbrook Hall' }, ZONE);
    const after = meetingLabel({ startsAt: newStart, place: 'Millbrook Library, back room' }, ZONE);
    // Auckland is 12 or 13 hours ahead of UTC (New Zealand standard and daylight time); from memory, not checked against the tz database here.
    expect(after).toMatch(/GMT\+1[23]/);
    const expectations: [Member, string, string][] = [
      [seller, 'Please bring:', 'Bag of flannel offcuts'],
      [buyer, 'You will collect:', 'Bag of flannel offcuts'],
      [donor, 'Please bring:', 'Starter bag of batik squares'],
      [newcomer, 'You will collect:', 'Starter bag of batik squares'],
    ];
    for (const [member, heading, title] of expectations) {
      const mail = await waitForMail({ to: member.email, subjectIncludes: 'Meeting changed' });
      expect(mail.subject).toContain(after);
      expect(mail.text).toContain(`Was: ${before}`);
      expect(mail.text).toContain(`Now: ${after}`);
      expect(mail.text).toMatch(new RegExp(`${heading}\\r?\\n- ${title}`));
    }
    expect((await listMail()).some((m) => m.to.includes(bystander.email))).toBe(false);

    // The reminder goes again two days before the new date.
    api.clock.advance(newStart.getTime() - Date.now() - DAY);
    try {
      await sendMeetingReminders(api.runtime.ctx);
    } finally {
      api.clock.reset();
    }
    expect((await Meeting.findByPk(meetingId))!.reminderSentAt).not.toBeNull();
    const reminder = await waitForMail({ to: newcomer.email, subjectIncludes: 'Reminder for the meeting' });
    expect(reminder.text).toContain(after);
  });

  it('sends nothing when only the notes change, and keeps the reminder as sent', async () => {
    const { meetingId } = await meetingWithHandovers('Millbrook Hall');
    const sentAt = new Date();
    await Meeting.update({ reminderSentAt: sentAt }, { where: { id: meetingId } });
    await clearMail();
    const queuedBefore = await queuedChangeMail(buyer.email);
    const changed = await librarianClient.send('patch', `/api/meetings/${meetingId}`, { notes: 'Use the side door.' });
    expect(changed.status).toBe(200);
    expect(changed.body.meeting.notes).toBe('Use the side door.');
    expect((await Meeting.findByPk(meetingId))!.reminderSentAt).toEqual(sentAt);
    // Read from the job queue's table, so nothing is left in flight to miss.
    expect(await queuedChangeMail(buyer.email)).toBe(queuedBefore);
  });

  it('refuses with 409, naming startsAt, to move a meeting with handovers into the past, and changes nothing', async () => {
    const { meetingId, startsAt } = await meetingWithHandovers('Millbrook Hall');
    await clearMail();
    const res = await librarianClient.send('patch', `/api/meetings/${meetingId}`, { startsAt: new Date(Date.now() - DAY).toISOString() });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.startsAt).toBeDefined();
    expect((await Meeting.findByPk(meetingId))!.startsAt).toEqual(startsAt);

    // A meeting nobody hands over at can still be put right after the fact.
    const empty = await librarianClient.send('post', '/api/meetings', { startsAt: new Date(Date.now() + 3 * DAY).toISOString(), place: 'Millbrook Hall' });
    const earlier = new Date(Date.now() - 2 * DAY);
    const corrected = await librarianClient.send('patch', `/api/meetings/${empty.body.meeting.id}`, { startsAt: earlier.toISOString() });
    expect(corrected.status).toBe(200);
    expect((await Meeting.findByPk(empty.body.meeting.id))!.startsAt).toEqual(earlier);
  });

  it('lets only officers change a meeting', async () => {
    const { meetingId, startsAt } = await meetingWithHandovers('Millbrook Hall');
    const res = await buyerClient.send('patch', `/api/meetings/${meetingId}`, { place: 'My kitchen' });
    expect(res.status).toBe(403);
    expect((await Meeting.findByPk(meetingId))!.startsAt).toEqual(startsAt);
    expect((await Meeting.findByPk(meetingId))!.place).toBe('Millbrook Hall');
  });
});
