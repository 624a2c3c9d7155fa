import type { Transaction } from 'sequelize';
import type { MeetingInput } from '@scrap-relay/shared';
import { Meeting, Member, Order, StarterClaim } from '../../db/models/index.ts';
import { conflict, notFound } from '../../errors/index.ts';
import { meetingChanged } from '../../emails/meetings.ts';
import { meetingLabel } from '../../emails/format.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';
import { placeUnplacedClaims } from '../starter/starter.service.ts';

/** A new meeting; starter claims made while no meeting was set go to it (or to an earlier coming one) in the same transaction. */
export async function createMeeting(ctx: AppContext, actor: Actor, input: MeetingInput): Promise<Meeting> {
  authorize(actor, 'meeting.manage');
  return ctx.sequelize.transaction(async (transaction) => {
    const meeting = await Meeting.create({ startsAt: new Date(input.startsAt), place: input.place, notes: input.notes, createdBy: actor.id }, { transaction });
    await placeUnplacedClaims(ctx, transaction);
    return meeting;
  });
}

/** Who brings and who collects what at one meeting: confirmed meeting orders and starter claims still to be handed over. */
async function liveHandovers(meetingId: string, transaction: Transaction) {
  const bring = new Map<string, string[]>();
  const collect = new Map<string, string[]>();
  const add = (map: Map<string, string[]>, id: string, title: string) => map.set(id, [...(map.get(id) ?? []), title]);
  const orders = await Order.findAll({ where: { meetingId, state: 'confirmed' }, include: [{ association: 'items' }], transaction });
  for (const o of orders) {
    for (const i of o.items ?? []) {
      add(bring, o.sellerId, i.title);
      add(collect, o.buyerId, i.title);
    }
  }
  const claims = await StarterClaim.findAll({ where: { meetingId, state: 'claimed' }, include: [{ association: 'bundle' }], transaction });
  for (const c of claims) {
    add(collect, c.memberId, c.bundle?.title ?? 'A starter bundle');
    if (c.bundle) add(bring, c.bundle.sellerId, c.bundle.title);
  }
  return { bring, collect, count: orders.length + claims.length };
}

/**
 * Changes a meeting. When its date, time or place changes, everyone with a handover there is
 * told what changed (in the guild's time zone) in the same transaction, and a new date gets its
 * own reminder. A meeting with handovers cannot be moved into the past: move the handovers first.
 */
export async function updateMeeting(ctx: AppContext, actor: Actor, meetingId: string, input: Partial<MeetingInput>): Promise<Meeting> {
  authorize(actor, 'meeting.manage');
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    // The row lock makes a claim or a move for this meeting wait, so nobody misses the news.
    const meeting = await Meeting.findByPk(meetingId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!meeting) throw notFound('That meeting');
    const before = { startsAt: meeting.startsAt, place: meeting.place };
    const startsAt = input.startsAt === undefined ? meeting.startsAt : new Date(input.startsAt);
    const place = input.place ?? meeting.place;
    const timeChanged = startsAt.getTime() !== before.startsAt.getTime();
    const placeChanged = place !== before.place;
    const handovers = timeChanged || placeChanged ? await liveHandovers(meeting.id, transaction) : null;
    const now = ctx.now();
    if (timeChanged && startsAt <= now && handovers!.count > 0) {
      throw conflict('Members have handovers at this meeting: give it a time still to come, or move its handovers to another meeting first.', {
        startsAt: 'A meeting with handovers must still be to come.',
      });
    }
    await meeting.update(
      { startsAt, place, ...(input.notes !== undefined && { notes: input.notes }), ...(timeChanged && { reminderSentAt: null }) },
      { transaction },
    );
    if (handovers && startsAt > now) {
      const zone = guildTimeZone(guild);
      const people = new Set([...handovers.bring.keys(), ...handovers.collect.keys()]);
      for (const id of people) {
        const member = await Member.findByPk(id, { transaction });
        if (!member?.active) continue;
        const mail = meetingChanged({
          guildName: guild.name,
          name: member.name,
          before: meetingLabel(before, zone),
          after: meetingLabel(meeting, zone),
          bring: handovers.bring.get(id) ?? [],
          collect: handovers.collect.get(id) ?? [],
          link: ctx.config.appUrl,
        });
        // Not an optional kind: a paid order or a held bundle changes hands at the new time and place.
        await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
      }
    }
    // A meeting moved from the past to a coming date may now be the next one for claims still without a meeting.
    if (timeChanged && startsAt > now) await placeUnplacedClaims(ctx, transaction);
    return meeting;
  });
}
