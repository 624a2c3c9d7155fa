import { Op, QueryTypes, type Transaction } from 'sequelize';
import { isNewQuilter, offerExpiresAtFrom, starterEligibility, type StarterEligibility, type StarterStatus, type WaitlistRow } from '@scrap-relay/shared';
import { Bundle, Meeting, Member, StarterClaim, WaitlistEntry, WaitlistOffer, type Guild } from '../../db/models/index.ts';
import { AppError, badRequest, conflict, notFound } from '../../errors/index.ts';
import { starterClaimed, starterMeetingSet, starterOfferLapsed, starterOffered, starterOfferReminder, starterWaitlistRemoved } from '../../emails/starter.ts';
import { formatWhen, meetingLabel } from '../../emails/format.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';

const DAY_MS = 86_400_000;


/** Whether the member may claim now, from the guild's window and limit and their claims not cancelled. */
export async function eligibilityOf(member: Member, guild: Guild, now: Date, transaction?: Transaction): Promise<StarterEligibility> {
  const newQuilter = isNewQuilter({ joinedAt: member.joinedAt, newQuilterFlag: member.newQuilterFlag, newcomerWindowMonths: guild.settings.newcomerWindowMonths, now });
  const claims = await StarterClaim.findAll({
    where: { memberId: member.id, state: { [Op.ne]: 'cancelled' }, claimedAt: { [Op.gt]: new Date(now.getTime() - guild.settings.starterWindowDays * DAY_MS) } },
    transaction,
  });
  return starterEligibility({
    isNewQuilter: newQuilter,
    claimsAt: claims.map((c) => c.claimedAt),
    limitPerWindow: guild.settings.starterLimitPerWindow,
    windowDays: guild.settings.starterWindowDays,
    now,
  });
}

/** Why a member on the waiting list may no longer have a starter bundle, in words for them. */
function ineligibleReason(e: Exclude<StarterEligibility, { eligible: true }>, guild: Guild): string {
  if (e.reason === 'not_new_quilter') {
    return `Starter bundles are for new quilters: members in their first ${guild.settings.newcomerWindowMonths} months with the guild, or flagged as new by the librarian.`;
  }
  return `You have had your starter bundle for now; you may claim another from ${e.nextEligibleAt.toISOString().slice(0, 10)}.`;
}

export function ineligible(e: Exclude<StarterEligibility, { eligible: true }>): AppError {
  if (e.reason === 'not_new_quilter') {
    return new AppError(403, 'forbidden', 'Starter bundles are for new quilters. Ask the librarian if you think you should be on the list.');
  }
  const when = e.nextEligibleAt.toISOString().slice(0, 10);
  return new AppError(403, 'forbidden', `You have had your starter bundle for now; you may claim another from ${when}.`, { nextEligibleAt: when });
}

export async function availableStarterBundles(): Promise<Bundle[]> {
  return Bundle.findAll({
    where: { offer: 'starter', state: 'on_shelf', quantityAvailable: { [Op.gt]: 0 } },
    include: [{ association: 'photos' }, { association: 'seller' }],
    order: [
      ['onShelfAt', 'ASC'],
      ['photos', 'position', 'ASC'],
    ],
  });
}

/**
 * The meeting row is share-locked: a change of its date or place (which tells everyone with a
 * handover there) waits for this claim to commit, or this claim reads the changed meeting.
 */
async function nextMeeting(now: Date, transaction: Transaction) {
  return Meeting.findOne({ where: { startsAt: { [Op.gt]: now } }, order: [['startsAt', 'ASC']], transaction, lock: transaction.LOCK.SHARE });
}

async function chosenMeeting(meetingId: string | undefined, now: Date, transaction: Transaction) {
  if (!meetingId) return nextMeeting(now, transaction);
  const meeting = await Meeting.findByPk(meetingId, { transaction, lock: transaction.LOCK.SHARE });
  if (!meeting || meeting.startsAt <= now) throw badRequest('Choose a meeting that is still to come.', { meetingId: 'Not a coming meeting.' });
  return meeting;
}

/** Takes one unit of a starter bundle for the member and records the claim; the caller holds the bundle's row lock. */
async function recordClaim(ctx: AppContext, guild: Guild, member: Member, bundle: Bundle, meeting: Meeting | null, transaction: Transaction) {
  const remaining = bundle.quantityAvailable - 1;
  await bundle.update({ quantityAvailable: remaining, state: remaining === 0 ? 'rehomed' : 'on_shelf' }, { transaction });
  const claim = await StarterClaim.create({ bundleId: bundle.id, memberId: member.id, meetingId: meeting?.id ?? null, claimedAt: ctx.now() }, { transaction });
  await leaveWaitlistWithClaim(ctx, member.id, transaction);
  const mail = starterClaimed({ guildName: guild.name, name: member.name, title: bundle.title, link: `${ctx.config.appUrl}/starter`, meeting: meeting ? meetingLabel(meeting, guildTimeZone(guild)) : null });
  await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
  return claim;
}

/**
 * A member who has claimed a starter bundle leaves the waiting list as `claimed`. A bundle held for them
 * by an open offer passes to the next person in line, so nobody is offered a second bundle past the limit.
 */
export async function leaveWaitlistWithClaim(ctx: AppContext, memberId: string, transaction: Transaction): Promise<void> {
  const entry = await WaitlistEntry.findOne({ where: { memberId, status: { [Op.in]: ['waiting', 'offered'] } }, transaction, lock: transaction.LOCK.UPDATE });
  if (!entry) return;
  await entry.update({ status: 'claimed' }, { transaction });
  const offer = await WaitlistOffer.findOne({ where: { entryId: entry.id, status: 'open' }, transaction, lock: transaction.LOCK.UPDATE });
  if (offer) {
    await offer.update({ status: 'withdrawn', answeredAt: ctx.now() }, { transaction });
    await offerToNextInLine(ctx, offer.bundleId, transaction);
  }
}

/**
 * First come, first served: the member's row is locked (so their own limit holds under
 * concurrency), then the bundle's; the last unit goes to exactly one claimant.
 */
export async function claimStarterBundle(ctx: AppContext, memberId: string, bundleId: string, meetingId: string | undefined): Promise<StarterClaim> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const member = (await Member.findByPk(memberId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const eligibility = await eligibilityOf(member, guild, ctx.now(), transaction);
    if (!eligibility.eligible) throw ineligible(eligibility);
    const bundle = await Bundle.findByPk(bundleId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!bundle || bundle.offer !== 'starter') throw notFound('That starter bundle');
    if (bundle.sellerId === member.id) throw new AppError(403, 'forbidden', 'You cannot claim a bundle you gave.');
    if (bundle.state !== 'on_shelf' || bundle.quantityAvailable < 1) {
      throw conflict('Someone else claimed that one a moment ago. You can join the waiting list for the next.', { bundleId: 'Already claimed.' });
    }
    const meeting = await chosenMeeting(meetingId, ctx.now(), transaction);
    return recordClaim(ctx, guild, member, bundle, meeting, transaction);
  });
}

/** A new quilter joins the queue once; when a starter bundle is free they should claim it instead. */
export async function joinWaitlist(ctx: AppContext, memberId: string): Promise<WaitlistEntry> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const member = (await Member.findByPk(memberId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const eligibility = await eligibilityOf(member, guild, ctx.now(), transaction);
    if (!eligibility.eligible) throw ineligible(eligibility);
    const open = await WaitlistEntry.findOne({ where: { memberId, status: { [Op.in]: ['waiting', 'offered'] } }, transaction });
    if (open) throw conflict('You are already on the waiting list.', { waitlist: 'Already waiting.' });
    const free = await Bundle.count({ where: { offer: 'starter', state: 'on_shelf', quantityAvailable: { [Op.gt]: 0 } }, transaction });
    if (free > 0) throw conflict('A starter bundle is free right now: claim it instead of waiting.', { waitlist: 'One is free now.' });
    return WaitlistEntry.create({ memberId, joinedAt: ctx.now() }, { transaction });
  });
}

/**
 * Offers the bundle to the first eligible person in the queue (in the order they asked),
 * holding it for them until the deadline; people who are no longer eligible leave the
 * queue on the way. With nobody waiting the bundle stays on the shelf for anyone eligible.
 */
export async function offerToNextInLine(ctx: AppContext, bundleId: string, transaction: Transaction): Promise<WaitlistOffer | null> {
  const guild = await loadGuild();
  const bundle = await Bundle.findByPk(bundleId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!bundle || bundle.offer !== 'starter' || bundle.quantityAvailable < 1 || !['on_shelf', 'held'].includes(bundle.state)) return null;
  const openOffer = await WaitlistOffer.findOne({ where: { bundleId, status: 'open' }, transaction });
  if (openOffer) return openOffer;
  const now = ctx.now();
  const timeZone = guildTimeZone(guild);
  // One entry at a time, the first not locked by another offer: two bundles offered at once go to
  // the first two people in line, and the entries behind them stay free for the next offer.
  for (;;) {
    const entry = await WaitlistEntry.findOne({
      where: { status: 'waiting' },
      order: [
        ['joinedAt', 'ASC'],
        ['id', 'ASC'],
      ],
      transaction,
      lock: transaction.LOCK.UPDATE,
      skipLocked: true,
    });
    if (!entry) break;
    const member = await Member.findByPk(entry.memberId, { transaction });
    if (!member || !member.active) {
      await entry.update({ status: 'removed', removedReason: 'Account closed or switched off.' }, { transaction });
      continue;
    }
    const eligibility = await eligibilityOf(member, guild, now, transaction);
    if (!eligibility.eligible) {
      const reason = ineligibleReason(eligibility, guild);
      await entry.update({ status: 'removed', removedReason: reason }, { transaction });
      const mail = starterWaitlistRemoved({ guildName: guild.name, name: member.name, reason, link: `${ctx.config.appUrl}/starter`, byLibrarian: false });
      await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
      continue;
    }
    const offer = await WaitlistOffer.create(
      { entryId: entry.id, bundleId, offeredAt: now, expiresAt: offerExpiresAtFrom(now, guild.settings.starterOfferHours) },
      { transaction },
    );
    await entry.update({ status: 'offered' }, { transaction });
    await bundle.update({ state: 'held' }, { transaction });
    const mail = starterOffered({
      guildName: guild.name,
      name: member.name,
      title: bundle.title,
      link: `${ctx.config.appUrl}/starter/offers/${offer.id}`,
      deadline: formatWhen(offer.expiresAt, timeZone),
    });
    // Not an optional kind: the bundle is held for them, and not answering takes them off the list.
    await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
    return offer;
  }
  if (bundle.state === 'held') await bundle.update({ state: 'on_shelf' }, { transaction });
  return null;
}

async function lockedOffer(offerId: string, memberId: string, transaction: Transaction) {
  const offer = await WaitlistOffer.findByPk(offerId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!offer) throw notFound('That offer');
  const entry = (await WaitlistEntry.findByPk(offer.entryId, { transaction, lock: transaction.LOCK.UPDATE }))!;
  if (entry.memberId !== memberId) throw notFound('That offer');
  return { offer, entry };
}

export async function acceptOffer(ctx: AppContext, memberId: string, offerId: string, meetingId: string | undefined): Promise<StarterClaim> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const member = (await Member.findByPk(memberId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const { offer, entry } = await lockedOffer(offerId, memberId, transaction);
    if (offer.status !== 'open' || offer.expiresAt <= ctx.now()) throw conflict('This offer has ended; it went to the next person in line.', { offer: 'Ended.' });
    // The member may have reached the guild's limit since the offer was made.
    const eligibility = await eligibilityOf(member, guild, ctx.now(), transaction);
    if (!eligibility.eligible) throw ineligible(eligibility);
    const bundle = (await Bundle.findByPk(offer.bundleId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const meeting = await chosenMeeting(meetingId, ctx.now(), transaction);
    await offer.update({ status: 'accepted', answeredAt: ctx.now() }, { transaction });
    await entry.update({ status: 'claimed' }, { transaction });
    const claim = await recordClaim(ctx, guild, member, bundle, meeting, transaction);
    if (bundle.quantityAvailable > 0) await offerToNextInLine(ctx, bundle.id, transaction);
    return claim;
  });
}

export async function declineOffer(ctx: AppContext, memberId: string, offerId: string): Promise<void> {
  await ctx.sequelize.transaction(async (transaction) => {
    const { offer, entry } = await lockedOffer(offerId, memberId, transaction);
    if (offer.status !== 'open') throw conflict('This offer has already ended.', { offer: 'Ended.' });
    await offer.update({ status: 'declined', answeredAt: ctx.now() }, { transaction });
    await entry.update({ status: 'declined' }, { transaction });
    await offerToNextInLine(ctx, offer.bundleId, transaction);
  });
}

/** Scheduled: offers past their deadline lapse and pass to the next person in line; the member is told they left the list. */
export async function lapseOffers(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  const due = await WaitlistOffer.findAll({ where: { status: 'open', expiresAt: { [Op.lte]: ctx.now() } }, limit: 200 });
  for (const stale of due) {
    await ctx.sequelize.transaction(async (transaction) => {
      const offer = (await WaitlistOffer.findByPk(stale.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
      if (offer.status !== 'open') return;
      await offer.update({ status: 'lapsed', answeredAt: ctx.now() }, { transaction });
      const entry = (await WaitlistEntry.findByPk(offer.entryId, { transaction, lock: transaction.LOCK.UPDATE }))!;
      const wasWaiting = entry.status === 'offered';
      await entry.update({ status: 'lapsed' }, { transaction });
      const member = await Member.findByPk(entry.memberId, { transaction });
      const bundle = await Bundle.findByPk(offer.bundleId, { transaction });
      if (wasWaiting && member?.active) {
        const mail = starterOfferLapsed({ guildName: guild.name, name: member.name, title: bundle?.title ?? 'A starter bundle', link: `${ctx.config.appUrl}/starter` });
        await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
      }
      await offerToNextInLine(ctx, offer.bundleId, transaction);
    });
  }
  return due.length;
}

/**
 * Scheduled: once half the time to answer has gone, one reminder per open offer. The reminder is
 * recorded on the offer's row by the same UPDATE that picks it (which locks the row), so two API
 * processes running this at once never send it twice, and a rolled-back run sends none.
 */
export async function remindOpenOffers(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  const now = ctx.now();
  return ctx.sequelize.transaction(async (transaction) => {
    const due = await ctx.sequelize.query<{ id: string; expires_at: Date; title: string; name: string; email: string }>(
      `UPDATE waitlist_offers o SET reminder_sent_at = $1, updated_at = $1
       FROM waitlist_entries e, members m, bundles b
       WHERE o.id IN (
               SELECT id FROM waitlist_offers
               WHERE status = 'open' AND reminder_sent_at IS NULL AND expires_at > $1
                 AND offered_at + (expires_at - offered_at) / 2 <= $1
               ORDER BY expires_at LIMIT 200)
         AND o.status = 'open' AND o.reminder_sent_at IS NULL
         AND e.id = o.entry_id AND m.id = e.member_id AND m.active AND b.id = o.bundle_id
       RETURNING o.id, o.expires_at, b.title, m.name, m.email`,
      { bind: [now], type: QueryTypes.SELECT, transaction },
    );
    for (const row of due) {
      const mail = starterOfferReminder({
        guildName: guild.name,
        name: row.name,
        title: row.title,
        link: `${ctx.config.appUrl}/starter/offers/${row.id}`,
        deadline: formatWhen(new Date(row.expires_at), guildTimeZone(guild)),
      });
      // The offer itself always went; this nudge is the one the member may turn off.
      await ctx.queue.enqueueEmail({ to: row.email, kind: 'starter', ...mail }, transaction);
    }
    return due.length;
  });
}

/**
 * Claims made while no meeting was set (not posted, not handed over) go to the next coming
 * meeting, and the new quilter and the donor are told. Called in the transaction that creates a
 * meeting, and on a schedule for a claim that committed just as a meeting was being created.
 * The UPDATE takes each claim's row lock and re-checks `meeting_id IS NULL`, so a claim is
 * placed, and its e-mails queued, exactly once however many processes run this.
 */
export async function placeUnplacedClaims(ctx: AppContext, transaction?: Transaction): Promise<number> {
  if (!transaction) return ctx.sequelize.transaction((t) => placeUnplacedClaims(ctx, t));
  const meeting = await nextMeeting(ctx.now(), transaction);
  if (!meeting) return 0;
  const guild = await loadGuild();
  const placed = await ctx.sequelize.query<{ bundle_id: string; member_id: string }>(
    `UPDATE starter_claims SET meeting_id = $1, updated_at = $2
     WHERE state = 'claimed' AND meeting_id IS NULL AND order_id IS NULL
     RETURNING bundle_id, member_id`,
    { bind: [meeting.id, ctx.now()], type: QueryTypes.SELECT, transaction },
  );
  const label = meetingLabel(meeting, guildTimeZone(guild));
  const link = `${ctx.config.appUrl}/starter`;
  for (const claim of placed) {
    const collector = await Member.findByPk(claim.member_id, { transaction });
    const bundle = await Bundle.findByPk(claim.bundle_id, { include: [{ association: 'seller' }], transaction });
    const title = bundle?.title ?? 'Your starter bundle';
    for (const [person, role] of [
      [collector, 'collect'],
      [bundle?.seller, 'bring'],
    ] as const) {
      if (!person?.active) continue;
      const mail = starterMeetingSet({ guildName: guild.name, name: person.name, title, meeting: label, role, link: role === 'collect' ? link : ctx.config.appUrl });
      await ctx.queue.enqueueEmail({ to: person.email, ...mail }, transaction);
    }
  }
  return placed.length;
}

/** Leaving (by the member) or removal (by the librarian, with a reason): an open offer passes to the next person. */
export async function leaveWaitlist(ctx: AppContext, memberId: string, removal?: { by: Actor; reason: string; entryId: string }): Promise<void> {
  await ctx.sequelize.transaction(async (transaction) => {
    const entry = removal
      ? await WaitlistEntry.findByPk(removal.entryId, { transaction, lock: transaction.LOCK.UPDATE })
      : await WaitlistEntry.findOne({ where: { memberId, status: { [Op.in]: ['waiting', 'offered'] } }, transaction, lock: transaction.LOCK.UPDATE });
    if (!entry || !['waiting', 'offered'].includes(entry.status)) throw notFound('A place on the waiting list');
    if (removal) authorize(removal.by, 'starter.manage');
    await entry.update(removal ? { status: 'removed', removedReason: removal.reason } : { status: 'left' }, { transaction });
    if (removal) {
      const guild = await loadGuild();
      const member = await Member.findByPk(entry.memberId, { transaction });
      if (member?.active) {
        const mail = starterWaitlistRemoved({ guildName: guild.name, name: member.name, reason: removal.reason, link: `${ctx.config.appUrl}/starter`, byLibrarian: true });
        await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
      }
    }
    const offer = await WaitlistOffer.findOne({ where: { entryId: entry.id, status: 'open' }, transaction, lock: transaction.LOCK.UPDATE });
    if (offer) {
      await offer.update({ status: 'withdrawn', answeredAt: ctx.now() }, { transaction });
      await offerToNextInLine(ctx, offer.bundleId, transaction);
    }
  });
}


export async function waitlistQueue(sequelize: AppContext['sequelize'], now: Date): Promise<WaitlistRow[]> {
  const rows = await sequelize.query<{ id: string; member_id: string; name: string; status: string; joined_at: Date; offer_id: string | null; title: string | null; expires_at: Date | null }>(
    `SELECT e.id, e.member_id, m.name, e.status, e.joined_at, o.id AS offer_id, b.title, o.expires_at
     FROM waitlist_entries e JOIN members m ON m.id = e.member_id
     LEFT JOIN waitlist_offers o ON o.entry_id = e.id AND o.status = 'open'
     LEFT JOIN bundles b ON b.id = o.bundle_id
     WHERE e.status IN ('waiting', 'offered')
     ORDER BY e.joined_at, e.id`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r, i) => ({
    id: r.id,
    position: i + 1,
    memberId: r.member_id,
    name: r.name,
    status: r.status,
    joinedAt: new Date(r.joined_at).toISOString(),
    waitingDays: Math.floor((now.getTime() - new Date(r.joined_at).getTime()) / DAY_MS),
    offer: r.offer_id ? { id: r.offer_id, bundleTitle: r.title ?? '', expiresAt: new Date(r.expires_at!).toISOString() } : null,
  }));
}

/** A member's own view: eligibility, claims, place in the queue and any open offer. */
export async function myStarterStatus(ctx: AppContext, member: Member): Promise<StarterStatus> {
  const guild = await loadGuild();
  const now = ctx.now();
  const eligibility = await eligibilityOf(member, guild, now);
  const claims = await StarterClaim.findAll({ where: { memberId: member.id }, include: [{ association: 'bundle' }, { association: 'meeting' }], order: [['claimedAt', 'DESC']] });
  const entry = await WaitlistEntry.findOne({ where: { memberId: member.id, status: { [Op.in]: ['waiting', 'offered'] } } });
  const position = entry
    ? await WaitlistEntry.count({ where: { status: { [Op.in]: ['waiting', 'offered'] }, [Op.or]: [{ joinedAt: { [Op.lt]: entry.joinedAt } }, { joinedAt: entry.joinedAt, id: { [Op.lte]: entry.id } }] } })
    : null;
  const offer = entry ? await WaitlistOffer.findOne({ where: { entryId: entry.id, status: 'open' } }) : null;
  const offerBundle = offer ? await Bundle.findByPk(offer.bundleId) : null;
  return {
    rules: { limitPerWindow: guild.settings.starterLimitPerWindow, windowDays: guild.settings.starterWindowDays, offerHours: guild.settings.starterOfferHours, postingAllowed: guild.settings.starterPostingAllowed },
    eligibility: eligibility.eligible
      ? { eligible: true as const }
      : { eligible: false as const, reason: eligibility.reason, nextEligibleAt: eligibility.reason === 'over_limit' ? eligibility.nextEligibleAt.toISOString() : null },
    waitlist: entry ? { status: entry.status as 'waiting' | 'offered', position: position!, joinedAt: entry.joinedAt.toISOString() } : null,
    offer: offer && offerBundle ? { id: offer.id, bundleId: offerBundle.id, title: offerBundle.title, expiresAt: offer.expiresAt.toISOString() } : null,
    claims: claims.map((c) => ({
      id: c.id,
      state: c.state,
      claimedAt: c.claimedAt.toISOString(),
      bundle: { id: c.bundleId, title: c.bundle?.title ?? '' },
      meeting: c.meeting ? { id: c.meeting.id, startsAt: c.meeting.startsAt.toISOString(), place: c.meeting.place } : null,
    })),
  };
}
