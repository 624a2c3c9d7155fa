import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import QRCode from 'qrcode';
import { canOrderTransition, formatMoney, HANDOVER_UNTICK, sellerAccount, type HandoverView } from '@scrap-relay/shared';
import { Bundle, BundlePhoto, Meeting, Member, Order, OrderItem, StarterClaim } from '../../db/models/index.ts';
import { conflict, notFound } from '../../errors/index.ts';
import { handoverMoved, meetingReminder } from '../../emails/starter.ts';
import { meetingLabel } from '../../emails/format.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';
import { lockSellerPayable, sellerBalanceSplits } from '../orders/ledger-writer.ts';
import { cancelOrder } from '../orders/orders.service.ts';
import { offerToNextInLine } from '../starter/starter.service.ts';

const DAY_MS = 86_400_000;

/**
 * Ticks can be undone until midnight at the end of the meeting's day in the guild's time zone, so a slip at the door
 * can be put right that evening, wherever the guild meets.
 */
async function undoDeadline(meeting: Meeting, timeZone: string, transaction?: Transaction): Promise<Date> {
  const [row] = await Meeting.sequelize!.query<{ deadline: Date }>(
    `SELECT (($1::timestamptz AT TIME ZONE $2::text)::date + 1)::timestamp AT TIME ZONE $2::text AS deadline`,
    { bind: [meeting.startsAt.toISOString(), timeZone], transaction, type: QueryTypes.SELECT },
  );
  return new Date(row!.deadline);
}

/**
 * The ticked orders among these whose untick would take back money already paid out, with what their seller would
 * then owe the guild. Unticking moves an order's seller credit from payable back to waiting (`sellerBalanceSplits`);
 * that is refused when the seller was paid out after the tick and their payable-now figure would go below zero,
 * since the payout may have counted on the bag having changed hands. Only the treasurer can put that right.
 */
async function untickShortfalls(sequelize: Sequelize, orders: readonly Order[], transaction?: Transaction): Promise<Map<string, number>> {
  const ticked = orders.filter((o) => o.state === HANDOVER_UNTICK.from && o.handedOverAt);
  if (ticked.length === 0) return new Map();
  const payouts = await sequelize.query<{ seller_id: string; last: Date }>(
    `SELECT seller_id, max(created_at) AS last FROM payouts WHERE seller_id = ANY($1::uuid[]) GROUP BY seller_id`,
    { bind: [[...new Set(ticked.map((o) => o.sellerId))]], transaction, type: QueryTypes.SELECT },
  );
  const lastPayout = new Map(payouts.map((p) => [p.seller_id, new Date(p.last).getTime()]));
  const paidSince = ticked.filter((o) => (lastPayout.get(o.sellerId) ?? -Infinity) > o.handedOverAt!.getTime());
  if (paidSince.length === 0) return new Map();
  const splits = await sellerBalanceSplits(sequelize, [...new Set(paidSince.map((o) => o.sellerId))], transaction);
  // The order's entries that wait while it is `confirmed`: its seller credit and whatever takes it back.
  const credits = await sequelize.query<{ order_id: string; credit: number }>(
    `SELECT w.order_id, coalesce(sum(e.amount_minor), 0)::int AS credit
     FROM unnest($1::uuid[], $2::text[]) AS w(order_id, account)
     LEFT JOIN ledger_entries e ON e.order_id = w.order_id AND e.account = w.account AND (e.kind = 'seller_credit' OR e.reverses = 'seller_credit')
     GROUP BY w.order_id`,
    { bind: [paidSince.map((o) => o.id), paidSince.map((o) => sellerAccount(o.sellerId))], transaction, type: QueryTypes.SELECT },
  );
  const payable = new Map(splits.map((b) => [b.sellerId, b.payableMinor]));
  const credit = new Map(credits.map((c) => [c.order_id, c.credit]));
  const shortfalls = new Map<string, number>();
  for (const o of paidSince) {
    const after = (payable.get(o.sellerId) ?? 0) - (credit.get(o.id) ?? 0);
    if (after < 0) shortfalls.set(o.id, -after);
  }
  return shortfalls;
}

/** Why a tick cannot be undone at the door, and whom to ask: the 409's message and the sheet's note. */
const untickRefusal = (sellerName: string, owingMinor: number, currency: string) =>
  `This tick can no longer be undone here: ${sellerName} was paid out after the handover was ticked, and unticking it would leave them owing the guild ${formatMoney(owingMinor, currency)}. If it was ticked by mistake, please ask the treasurer to put it right.`;

async function meetingOrThrow(id: string, transaction?: Transaction) {
  const meeting = await Meeting.findByPk(id, { transaction });
  if (!meeting) throw notFound('That meeting');
  return meeting;
}

/** Everything due at one meeting: paid or free meeting orders and starter claims, with a QR code per handover. */
export async function handoverSheet(ctx: AppContext, actor: Actor, meetingId: string): Promise<{ meeting: Meeting; handovers: HandoverView[] }> {
  authorize(actor, 'meeting.manage');
  const meeting = await meetingOrThrow(meetingId);
  const [orders, claims, guild] = await Promise.all([
    Order.findAll({ where: { meetingId, state: { [Op.in]: ['confirmed', 'handed_over'] } }, include: [{ association: 'items' }, { association: 'buyer' }, { association: 'seller' }] }),
    StarterClaim.findAll({ where: { meetingId, state: { [Op.in]: ['claimed', 'handed_over'] } }, include: [{ association: 'bundle', include: [{ association: 'seller' }] }, { association: 'member' }] }),
    loadGuild(),
  ]);
  const bundleIds = [...orders.flatMap((o) => (o.items ?? []).map((i) => i.bundleId)), ...claims.map((c) => c.bundleId)];
  const photos = bundleIds.length ? await BundlePhoto.findAll({ where: { bundleId: bundleIds, position: 0 } }) : [];
  const thumbs = new Map(photos.map((p) => [p.bundleId, ctx.storage.publicUrl(p.thumbKey)]));
  const markers = new Map((await Member.findAll({ where: { id: [...orders.map((o) => o.handedOverBy), ...claims.map((c) => c.handedOverBy)].filter((x): x is string => !!x) } })).map((m) => [m.id, m.name]));
  const canUndo = ctx.now() < (await undoDeadline(meeting, guildTimeZone(guild)));
  const shortfalls = canUndo ? await untickShortfalls(ctx.sequelize, orders) : new Map<string, number>();

  const views: HandoverView[] = [];
  for (const o of orders) {
    const url = `${ctx.config.appUrl}/handovers/${o.id}`;
    const owing = shortfalls.get(o.id);
    views.push({
      id: o.id,
      kind: 'order',
      reference: o.reference,
      giver: { id: o.sellerId, name: o.seller?.name ?? '' },
      collector: { id: o.buyerId, name: o.buyer?.name ?? '' },
      items: (o.items ?? []).map((i) => ({ title: i.title, quantity: i.quantity, thumbUrl: thumbs.get(i.bundleId) ?? null })),
      done: o.state === 'handed_over',
      doneAt: o.handedOverAt?.toISOString() ?? null,
      doneBy: o.handedOverBy ? (markers.get(o.handedOverBy) ?? null) : null,
      checkOffUrl: url,
      qrSvg: await QRCode.toString(url, { type: 'svg', margin: 1, errorCorrectionLevel: 'M' }),
      abilities: {
        markDone: canOrderTransition(o.state, 'handed_over'),
        undo: o.state === HANDOVER_UNTICK.from && canUndo && owing === undefined,
        cancel: o.state === 'confirmed',
      },
      undoNote: owing === undefined ? null : untickRefusal(o.seller?.name ?? 'The seller', owing, o.currency),
    });
  }
  for (const c of claims) {
    const url = `${ctx.config.appUrl}/handovers/${c.id}`;
    views.push({
      id: c.id,
      kind: 'starter',
      reference: `Starter ${c.id.slice(0, 8).toUpperCase()}`,
      giver: { id: c.bundle?.sellerId ?? '', name: c.bundle?.seller?.name ?? 'Guild stash' },
      collector: { id: c.memberId, name: c.member?.name ?? '' },
      items: [{ title: c.bundle?.title ?? '', quantity: 1, thumbUrl: thumbs.get(c.bundleId) ?? null }],
      done: c.state === 'handed_over',
      doneAt: c.handedOverAt?.toISOString() ?? null,
      doneBy: c.handedOverBy ? (markers.get(c.handedOverBy) ?? null) : null,
      checkOffUrl: url,
      qrSvg: await QRCode.toString(url, { type: 'svg', margin: 1, errorCorrectionLevel: 'M' }),
      abilities: { markDone: c.state === 'claimed', undo: c.state === 'handed_over' && canUndo, cancel: c.state === 'claimed' },
      undoNote: null,
    });
  }
  views.sort((a, b) => a.giver.name.localeCompare(b.giver.name) || a.collector.name.localeCompare(b.collector.name));
  return { meeting, handovers: views };
}

/** The meeting a handover belongs to, for the check-off page a QR code opens. */
export async function handoverMeetingId(actor: Actor, id: string): Promise<string> {
  authorize(actor, 'meeting.manage');
  const order = await Order.findByPk(id);
  if (order?.fulfilment === 'meeting' && order.meetingId) return order.meetingId;
  const claim = await StarterClaim.findByPk(id);
  if (claim?.meetingId) return claim.meetingId;
  throw notFound('That handover');
}

async function findHandover(id: string, transaction: Transaction) {
  const order = await Order.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (order && order.fulfilment === 'meeting') return { order, claim: null };
  const claim = await StarterClaim.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (claim) return { order: null, claim };
  throw notFound('That handover');
}

/**
 * Tick (done = true) or untick a handover at the door; who and when are recorded. An order moves only as the shared
 * list of order moves allows; unticking is its one move back, for a tick made by mistake, on the meeting's day.
 */
export async function markHandover(ctx: AppContext, actor: Actor, id: string, done: boolean): Promise<void> {
  authorize(actor, 'meeting.manage');
  const guild = await loadGuild();
  await ctx.sequelize.transaction(async (transaction) => {
    if (!done) {
      // An untick can take back money paid out: the seller's payable figure is held still first, as for a payout.
      const seller = await Order.findOne({ where: { id, fulfilment: 'meeting' }, attributes: ['sellerId'], transaction });
      if (seller) await lockSellerPayable(ctx.sequelize, seller.sellerId, transaction);
    }
    const { order, claim } = await findHandover(id, transaction);
    const meeting = await meetingOrThrow((order?.meetingId ?? claim?.meetingId)!, transaction);
    const now = ctx.now();
    if (done) {
      if (order) {
        if (!canOrderTransition(order.state, 'handed_over')) throw conflict('That handover is not waiting to be done.', { id: `It is ${order.state}.` });
        await order.update({ state: 'handed_over', handedOverAt: now, handedOverBy: actor.id }, { transaction });
      } else {
        if (claim!.state !== 'claimed') throw conflict('That handover is not waiting to be done.', { id: `It is ${claim!.state}.` });
        await claim!.update({ state: 'handed_over', handedOverAt: now, handedOverBy: actor.id }, { transaction });
      }
      return;
    }
    if (now >= (await undoDeadline(meeting, guildTimeZone(guild), transaction))) {
      throw conflict('A tick can only be undone on the day of the meeting.', { id: 'Too late to undo.' });
    }
    if (order) {
      if (order.state !== HANDOVER_UNTICK.from || !canOrderTransition(order.state, HANDOVER_UNTICK.to)) throw conflict('That handover is not ticked.', { id: 'Not ticked.' });
      const owing = (await untickShortfalls(ctx.sequelize, [order], transaction)).get(order.id);
      if (owing !== undefined) {
        const seller = await Member.findByPk(order.sellerId, { transaction });
        throw conflict(untickRefusal(seller?.name ?? 'The seller', owing, order.currency), { id: 'Paid out since the tick: ask the treasurer.' });
      }
      await order.update({ state: HANDOVER_UNTICK.to, handedOverAt: null, handedOverBy: null }, { transaction });
    } else if (claim!.state === 'handed_over') {
      await claim!.update({ state: 'claimed', handedOverAt: null, handedOverBy: null }, { transaction });
    } else {
      throw conflict('That handover is not ticked.', { id: 'Not ticked.' });
    }
  });
}

/** After a meeting: what did not change hands moves to another meeting, and both people are told. */
export async function moveOpenHandovers(ctx: AppContext, actor: Actor, fromMeetingId: string, toMeetingId: string): Promise<number> {
  authorize(actor, 'meeting.manage');
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const to = await meetingOrThrow(toMeetingId, transaction);
    if (to.startsAt <= ctx.now()) throw conflict('Move them to a meeting still to come.', { toMeetingId: 'Not a coming meeting.' });
    const orders = await Order.findAll({ where: { meetingId: fromMeetingId, state: 'confirmed' }, transaction, lock: transaction.LOCK.UPDATE });
    const claims = await StarterClaim.findAll({ where: { meetingId: fromMeetingId, state: 'claimed' }, transaction, lock: transaction.LOCK.UPDATE });
    const titlesFor = new Map<string, string[]>();
    const note = (memberId: string, title: string) => titlesFor.set(memberId, [...(titlesFor.get(memberId) ?? []), title]);
    for (const o of orders) {
      await o.update({ meetingId: to.id }, { transaction });
      for (const item of await OrderItem.findAll({ where: { orderId: o.id }, transaction })) {
        note(o.buyerId, item.title);
        note(o.sellerId, item.title);
      }
    }
    for (const c of claims) {
      await c.update({ meetingId: to.id }, { transaction });
      const bundle = await Bundle.findByPk(c.bundleId, { transaction });
      note(c.memberId, bundle?.title ?? '');
      if (bundle) note(bundle.sellerId, bundle.title);
    }
    for (const [memberId, titles] of titlesFor) {
      const member = await Member.findByPk(memberId, { transaction });
      if (!member) continue;
      const mail = handoverMoved({ guildName: guild.name, name: member.name, titles, meeting: meetingLabel(to, guildTimeZone(guild)), link: ctx.config.appUrl });
      // Always sent, like a change to the meeting itself: it says when to come instead.
      await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
    }
    return orders.length + claims.length;
  });
}

/** Cancels a handover that will not happen: a paid order is refunded as any cancelled order; a starter bundle goes to the next new quilter. */
export async function cancelHandover(ctx: AppContext, actor: Actor, id: string): Promise<void> {
  authorize(actor, 'meeting.manage');
  const order = await Order.findByPk(id);
  if (order) {
    await cancelOrder(ctx, actor, id, 'Not handed over at the meeting.');
    return;
  }
  await ctx.sequelize.transaction(async (transaction) => {
    const claim = await StarterClaim.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!claim) throw notFound('That handover');
    if (claim.state !== 'claimed') throw conflict('Only a handover still waiting can be cancelled.', { id: `It is ${claim.state}.` });
    // A starter bundle sent by post is not a meeting handover: its order is cancelled as an order.
    if (claim.orderId) throw conflict('That starter bundle goes by post, not at a meeting; cancel its order instead.', { id: 'Sent by post.' });
    await claim.update({ state: 'cancelled', cancelledAt: ctx.now(), cancelReason: 'Not collected at the meeting.' }, { transaction });
    await Bundle.sequelize!.query(
      `UPDATE bundles SET quantity_available = least(quantity, quantity_available + 1), state = CASE WHEN state = 'rehomed' THEN 'on_shelf' ELSE state END WHERE id = $1`,
      { bind: [claim.bundleId], transaction },
    );
    await offerToNextInLine(ctx, claim.bundleId, transaction);
  });
}

/** Scheduled: two days before a meeting, one e-mail to each member with something to bring or collect. */
export async function sendMeetingReminders(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  const now = ctx.now();
  const meetings = await Meeting.findAll({ where: { startsAt: { [Op.gt]: now, [Op.lte]: new Date(now.getTime() + 2 * DAY_MS) }, reminderSentAt: null } });
  let sent = 0;
  for (const m of meetings) {
    await ctx.sequelize.transaction(async (transaction) => {
      const meeting = (await Meeting.findByPk(m.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
      if (meeting.reminderSentAt) return;
      const bring = new Map<string, string[]>();
      const collect = new Map<string, string[]>();
      const add = (map: Map<string, string[]>, id: string, title: string) => map.set(id, [...(map.get(id) ?? []), title]);
      const orders = await Order.findAll({ where: { meetingId: meeting.id, state: 'confirmed' }, include: [{ association: 'items' }], transaction });
      for (const o of orders) for (const i of o.items ?? []) {
        add(bring, o.sellerId, i.title);
        add(collect, o.buyerId, i.title);
      }
      const claims = await StarterClaim.findAll({ where: { meetingId: meeting.id, state: 'claimed' }, include: [{ association: 'bundle' }], transaction });
      for (const c of claims) {
        add(collect, c.memberId, c.bundle?.title ?? '');
        if (c.bundle) add(bring, c.bundle.sellerId, c.bundle.title);
      }
      const people = new Set([...bring.keys(), ...collect.keys()]);
      for (const id of people) {
        const member = await Member.findByPk(id, { transaction });
        if (!member || !member.active) continue;
        const mail = meetingReminder({ guildName: guild.name, name: member.name, meeting: meetingLabel(meeting, guildTimeZone(guild)), bring: bring.get(id) ?? [], collect: collect.get(id) ?? [], link: ctx.config.appUrl });
        await ctx.queue.enqueueEmail({ to: member.email, kind: 'meetings', ...mail }, transaction);
        sent++;
      }
      await meeting.update({ reminderSentAt: now }, { transaction });
    });
  }
  return sent;
}
