import { QueryTypes, type Sequelize } from 'sequelize';
import type { MonthStatement } from '@scrap-relay/shared';
import type { Guild } from '../../db/models/index.ts';

/**
 * The month-end statement, straight from the ledger: each total is a sum of entries dated
 * in the month, and the closing balances are every seller's entries up to the month's end,
 * so the statement ties to the ledger by construction.
 */
export async function monthStatement(sequelize: Sequelize, guild: Guild, month: string): Promise<MonthStatement> {
  const from = new Date(`${month}-01T00:00:00Z`);
  const to = new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth() + 1, 1));
  const [totals] = await sequelize.query<{ charges: number; fees: number; refunds: number; processing: number; payouts: number; credits: number }>(
    `SELECT
       coalesce(-sum(amount_minor) FILTER (WHERE kind = 'charge'), 0)::int AS charges,
       coalesce(sum(amount_minor) FILTER (WHERE account = 'guild' AND (kind = 'guild_fee' OR reverses = 'guild_fee')), 0)::int AS fees,
       coalesce(sum(amount_minor) FILTER (WHERE account = 'buyer' AND kind = 'refund'), 0)::int AS refunds,
       coalesce(sum(amount_minor) FILTER (WHERE account = 'processor'), 0)::int AS processing,
       coalesce(sum(amount_minor) FILTER (WHERE account = 'payouts'), 0)::int AS payouts,
       coalesce(sum(amount_minor) FILTER (WHERE account LIKE 'seller:%' AND kind <> 'payout'), 0)::int AS credits
     FROM ledger_entries WHERE created_at >= $1 AND created_at < $2`,
    { bind: [from, to], type: QueryTypes.SELECT },
  );
  const balances = await sequelize.query<{ seller_id: string; name: string; balance: number }>(
    `SELECT m.id AS seller_id, m.name, sum(e.amount_minor)::int AS balance
     FROM ledger_entries e JOIN members m ON m.id = (CASE WHEN e.account LIKE 'seller:%' THEN substring(e.account from 8)::uuid END)
     WHERE e.created_at < $1
     GROUP BY m.id, m.name HAVING sum(e.amount_minor) <> 0 ORDER BY m.name`,
    { bind: [to], type: QueryTypes.SELECT },
  );
  return {
    month,
    currency: guild.currency,
    chargesMinor: totals!.charges,
    guildFeesMinor: totals!.fees,
    refundsMinor: totals!.refunds,
    processingCostMinor: totals!.processing,
    payoutsMinor: totals!.payouts,
    sellerCreditsMinor: totals!.credits,
    closingBalances: balances.map((b) => ({ sellerId: b.seller_id, name: b.name, balanceMinor: b.balance })),
    closingBalancesTotalMinor: balances.reduce((sum, b) => sum + b.balance, 0),
  };
}

export interface LibrarianReport {
  review: { approved: number; returned: number; commonReturnNotes: { notes: string; times: number }[] };
  starter: { claims: number; waitingNow: number; medianWaitDays: number | null };
  handovers: { meetingId: string; startsAt: string; place: string; done: number; missed: number; due: number }[];
}

export async function librarianReport(sequelize: Sequelize, from: Date | null, to: Date | null, now: Date): Promise<LibrarianReport> {
  const bind = [from, to];
  const inPeriod = (col: string) => `($1::timestamptz IS NULL OR ${col} >= $1) AND ($2::timestamptz IS NULL OR ${col} < $2)`;
  const q = <T extends object>(sql: string, b: unknown[] = bind) => sequelize.query<T>(sql, { bind: b, type: QueryTypes.SELECT });
  const [decisions, notes, starter, waiting, handovers] = await Promise.all([
    q<{ approved: number; returned: number }>(
      `SELECT count(*) FILTER (WHERE decision = 'approve')::int AS approved, count(*) FILTER (WHERE decision = 'return')::int AS returned
       FROM bundle_reviews WHERE ${inPeriod('created_at')}`,
    ),
    q<{ notes: string; times: number }>(
      `SELECT min(notes) AS notes, count(*)::int AS times FROM bundle_reviews
       WHERE decision = 'return' AND notes IS NOT NULL AND ${inPeriod('created_at')}
       GROUP BY lower(trim(notes)) ORDER BY times DESC, notes LIMIT 5`,
    ),
    q<{ claims: number; median_days: number | null }>(
      `SELECT (SELECT count(*)::int FROM starter_claims WHERE state <> 'cancelled' AND ${inPeriod('claimed_at')}) AS claims,
              (SELECT round((percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM o.answered_at - e.joined_at)) / 86400)::numeric, 1)::float
               FROM waitlist_offers o JOIN waitlist_entries e ON e.id = o.entry_id
               WHERE o.status = 'accepted' AND ${inPeriod('o.answered_at')}) AS median_days`,
    ),
    q<{ n: number }>(`SELECT count(*)::int AS n FROM waitlist_entries WHERE status IN ('waiting', 'offered')`, []),
    q<{ id: string; starts_at: Date; place: string; done: number; due: number }>(
      `SELECT m.id, m.starts_at, m.place,
              (SELECT count(*) FROM orders o WHERE o.meeting_id = m.id AND o.state = 'handed_over')::int
                + (SELECT count(*) FROM starter_claims c WHERE c.meeting_id = m.id AND c.state = 'handed_over')::int AS done,
              (SELECT count(*) FROM orders o WHERE o.meeting_id = m.id AND o.state = 'confirmed')::int
                + (SELECT count(*) FROM starter_claims c WHERE c.meeting_id = m.id AND c.state = 'claimed')::int AS due
       FROM meetings m WHERE ${inPeriod('m.starts_at')} ORDER BY m.starts_at`,
    ),
  ]);
  return {
    review: { approved: decisions[0]!.approved, returned: decisions[0]!.returned, commonReturnNotes: notes },
    starter: { claims: starter[0]!.claims, waitingNow: waiting[0]!.n, medianWaitDays: starter[0]!.median_days },
    handovers: handovers.map((h) => {
      const past = new Date(h.starts_at) < now;
      return { meetingId: h.id, startsAt: new Date(h.starts_at).toISOString(), place: h.place, done: h.done, missed: past ? h.due : 0, due: past ? 0 : h.due };
    }),
  };
}
