import { QueryTypes } from 'sequelize';
import type { AppContext } from '../context.ts';
import { bundleExpired } from '../emails/bundles.ts';
import { loadGuild } from '../modules/guild/guild.service.ts';
import { autoReceive, refundLatePayment, releaseOverdueHolds } from '../modules/orders/orders.service.ts';
import { LATE_REFUND_QUEUE } from './queue.ts';
import { lapseOffers } from '../modules/starter/starter.service.ts';
import { sendMeetingReminders } from '../modules/handovers/handovers.service.ts';

export const EXPIRE_BUNDLES_QUEUE = 'bundles-expire';
export const RELEASE_HOLDS_QUEUE = 'orders-release-holds';
export const AUTO_RECEIVE_QUEUE = 'orders-auto-receive';

/** Takes bundles past the guild's shelf limit off the shelf and tells each seller, in one transaction. */
export async function expireBundles(ctx: AppContext): Promise<number> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const expired = await ctx.sequelize.query<{ id: string; title: string; name: string; email: string }>(
      `UPDATE bundles b SET state = 'expired', updated_at = now()
       FROM members m
       WHERE b.state = 'on_shelf' AND b.expires_at <= $1 AND m.id = b.seller_id
       RETURNING b.id, b.title, m.name, m.email`,
      { bind: [ctx.now()], type: QueryTypes.SELECT, transaction },
    );
    for (const row of expired) {
      const mail = bundleExpired({
        guildName: guild.name,
        name: row.name,
        title: row.title,
        days: guild.settings.shelfLimitDays,
        link: `${ctx.config.appUrl}/my-bundles`,
      });
      await ctx.queue.enqueueEmail({ to: row.email, kind: 'review', ...mail }, transaction);
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
  await boss.work<{ orderId: string }>(LATE_REFUND_QUEUE, async ([job]) => refundLatePayment(ctx, job!.data.orderId));
  const jobs: [string, string, () => Promise<number>][] = [
    [EXPIRE_BUNDLES_QUEUE, '*/15 * * * *', () => expireBundles(ctx)],
    [RELEASE_HOLDS_QUEUE, '* * * * *', () => releaseOverdueHolds(ctx)],
    [AUTO_RECEIVE_QUEUE, '17 3 * * *', () => autoReceive(ctx)],
    ['starter-offers-lapse', '*/5 * * * *', () => lapseOffers(ctx)],
    ['meetings-remind', '7 * * * *', () => sendMeetingReminders(ctx)],
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
