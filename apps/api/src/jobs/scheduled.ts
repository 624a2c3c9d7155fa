import { QueryTypes } from 'sequelize';
import type { AppContext } from '../context.ts';
import { bundleExpired, bundleLeavingShelf } from '../emails/bundles.ts';
import { formatWhen } from '../emails/format.ts';
import { guildTimeZone, loadGuild } from '../modules/guild/guild.service.ts';
import { autoReceive, releaseOverdueHolds, remindUnposted, runLateRefund } from '../modules/orders/orders.service.ts';
import { LATE_REFUND_QUEUE } from './queue.ts';
import { lapseOffers, placeUnplacedClaims, remindOpenOffers } from '../modules/starter/starter.service.ts';
import { sendMeetingReminders } from '../modules/handovers/handovers.service.ts';
import { pruneShelfPages } from '../modules/bundles/shelf-pages.ts';

export const EXPIRE_BUNDLES_QUEUE = 'bundles-expire';
export const RELEASE_HOLDS_QUEUE = 'orders-release-holds';
export const AUTO_RECEIVE_QUEUE = 'orders-auto-receive';

const DAY_MS = 24 * 60 * 60 * 1000;
/** How long before a bundle's time on the shelf ends its seller is told. */
export const SHELF_WARNING_DAYS = 7;

interface LeavingShelfRow {
  id: string;
  title: string;
  on_shelf_at: Date;
  expires_at: Date;
  name: string;
  email: string;
}

const daysBetween = (from: Date, to: Date) => Math.floor((to.getTime() - from.getTime()) / DAY_MS);

/**
 * Tells each seller once, about SHELF_WARNING_DAYS before it happens, that a bundle's time on the shelf ends; only
 * for bundles on the shelf at least that long, so a guild with a short shelf limit does not get a warning with the
 * approval. The bundles are locked and marked in the statement that picks them (SKIP LOCKED), and the e-mail is
 * queued in the same transaction, so two API processes running this at once never both warn about one bundle.
 */
export async function warnBundlesLeavingShelf(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const now = ctx.now();
    const leaving = await ctx.sequelize.query<LeavingShelfRow>(
      `UPDATE bundles b SET expiry_warned_for = b.expires_at
       FROM members m
       WHERE b.id IN (
           SELECT id FROM bundles
           WHERE state = 'on_shelf' AND expires_at > $1::timestamptz AND expires_at <= $1::timestamptz + make_interval(days => $2::int)
             AND on_shelf_at <= $1::timestamptz - make_interval(days => $2::int)
             AND expiry_warned_for IS DISTINCT FROM expires_at
           FOR UPDATE SKIP LOCKED)
         AND b.state = 'on_shelf' AND b.expiry_warned_for IS DISTINCT FROM b.expires_at AND m.id = b.seller_id
       RETURNING b.id, b.title, b.on_shelf_at, b.expires_at, m.name, m.email`,
      { bind: [now, SHELF_WARNING_DAYS], type: QueryTypes.SELECT, transaction },
    );
    const zone = guildTimeZone(guild);
    for (const row of leaving) {
      const mail = bundleLeavingShelf({
        guildName: guild.name,
        name: row.name,
        title: row.title,
        onShelfSince: formatWhen(new Date(row.on_shelf_at), zone),
        comesOff: formatWhen(new Date(row.expires_at), zone),
        daysOnShelf: daysBetween(new Date(row.on_shelf_at), now),
        link: `${ctx.config.appUrl}/bundles/${row.id}`,
      });
      // Always sent: it is about the member's own bundle, and none of the e-mail choices on the profile is about the shelf.
      await ctx.queue.enqueueEmail({ to: row.email, ...mail }, transaction);
    }
    return leaving.length;
  });
}

/** Takes bundles past their time on the shelf off it and tells each seller how long it was there, in one transaction. */
export async function expireBundles(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const now = ctx.now();
    const expired = await ctx.sequelize.query<Omit<LeavingShelfRow, 'expires_at'>>(
      `UPDATE bundles b SET state = 'expired', updated_at = now()
       FROM members m
       WHERE b.state = 'on_shelf' AND b.expires_at <= $1 AND m.id = b.seller_id
       RETURNING b.id, b.title, b.on_shelf_at, m.name, m.email`,
      { bind: [now], type: QueryTypes.SELECT, transaction },
    );
    const zone = guildTimeZone(guild);
    for (const row of expired) {
      const mail = bundleExpired({
        guildName: guild.name,
        name: row.name,
        title: row.title,
        onShelfSince: formatWhen(new Date(row.on_shelf_at), zone),
        daysOnShelf: daysBetween(new Date(row.on_shelf_at), now),
        link: `${ctx.config.appUrl}/bundles/${row.id}`,
      });
      // Always sent, like the warning before it.
      await ctx.queue.enqueueEmail({ to: row.email, ...mail }, transaction);
    }
    return expired.length;
  });
}

/**
 * pg-boss keeps one schedule for the whole database, so with several API processes each job still runs once.
 * Also starts the worker for jobs a change queues: a late payment's refund, retried until the card service answers.
 */
export async function startScheduledJobs(ctx: AppContext): Promise<void> {
  const { boss } = ctx.queue;
  await boss.work<{ orderId: string }>(LATE_REFUND_QUEUE, { includeMetadata: true }, async ([job]) => runLateRefund(ctx, job!));
  const jobs: [string, string, () => Promise<number>][] = [
    [EXPIRE_BUNDLES_QUEUE, '*/15 * * * *', async () => (await warnBundlesLeavingShelf(ctx)) + (await expireBundles(ctx))],
    [RELEASE_HOLDS_QUEUE, '* * * * *', () => releaseOverdueHolds(ctx)],
    [AUTO_RECEIVE_QUEUE, '17 3 * * *', () => autoReceive(ctx)],
    ['orders-remind-unposted', '37 * * * *', () => remindUnposted(ctx)],
    ['starter-offers-lapse', '*/5 * * * *', () => lapseOffers(ctx)],
    ['starter-offers-remind', '*/15 * * * *', () => remindOpenOffers(ctx)],
    ['starter-claims-place', '*/15 * * * *', () => placeUnplacedClaims(ctx)],
    ['meetings-remind', '7 * * * *', () => sendMeetingReminders(ctx)],
    ['shelf-pages-prune', '*/10 * * * *', () => pruneShelfPages(ctx.sequelize)],
  ];
  for (const [name, cron, run] of jobs) {
    await boss.createQueue(name, { name, policy: 'singleton' });
    await boss.schedule(name, cron);
    await boss.work(name, async () => {
      const count = await run();
      if (count) ctx.logger.info({ job: name, count }, 'scheduled job did work');
    });
  }
}
