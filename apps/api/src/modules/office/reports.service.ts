import { QueryTypes, type Sequelize } from 'sequelize';
import { startOfDayIn, type MonthStatement } from '@scrap-relay/shared';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';
import { AppError } from '../../errors/index.ts';
import { runNamedStatement, type NamedStatement } from '../../db/named-statement.ts';

interface StatementRow {
  currency: string | null;
  totals: { key: string; amount: number }[] | null;
  /** [seller id, name, closing balance in minor units], by name: arrays, not objects, so the ~500 rows carry no repeated keys. */
  balances: [string, string, number][] | null;
}

/*
 * A seller account's closing balance is its running total (grain 't') less what was entered from
 * the next month on (grain 'm', day >= $3). The two are read as two ranges of office_tallies_lookup,
 * the later months' rows negated, so both are index-only scans that return (key, amount) straight
 * from the index; an OR of the two conditions made PostgreSQL visit the heap for every row
 * (about 435 table pages for ~580 rows on the bench data).
 */
const STATEMENT_SQL = `SELECT
       (SELECT currency FROM guild WHERE id = 1) AS currency,
       (SELECT json_agg(json_build_object('key', key, 'amount', amount::int)) FROM office_period_tallies($1, $2, ARRAY['money'])) AS totals,
       (SELECT json_agg(json_build_array(m.id, m.name, b.balance) ORDER BY m.name, m.id)
        FROM (SELECT r.key AS account, sum(r.amount)::int AS balance
              FROM (SELECT key, amount FROM office_tallies WHERE figure = 'balance' AND grain = 't'
                    UNION ALL
                    SELECT key, -amount FROM office_tallies WHERE figure = 'balance' AND grain = 'm' AND day >= $3::date) r
              GROUP BY r.key
              HAVING sum(r.amount) <> 0) b
        JOIN members m ON m.id = substring(b.account from 8)::uuid) AS balances`;

/**
 * The statement GET /api/reports/statement sends for a month (YYYY-MM) of the guild's calendar, named (see
 * db/named-statement.ts): from its first midnight in the guild's time zone to the next month's.
 */
export function monthStatementStatement(month: string, timeZone: string): NamedStatement {
  const [year, m] = month.split('-').map(Number) as [number, number];
  const next = new Date(Date.UTC(year, m, 1)).toISOString().slice(0, 10);
  const values = [startOfDayIn(year, m, 1, timeZone), startOfDayIn(year, m + 1, 1, timeZone), next];
  return { name: 'office-month-statement', text: STATEMENT_SQL, values };
}

/**
 * The month-end statement from the ledger's tallies (office_tallies, kept by a trigger on
 * ledger_entries in the same transaction as each entry): each total is the month's row of
 * the same sum of entries dated in the month, and each seller's closing balance is the
 * account's running total less what was entered from the next month on, so the statement
 * ties to the ledger by construction without reading the ledger's history. The guild's
 * currency comes in the same statement.
 */
export async function monthStatement(sequelize: Sequelize, month: string): Promise<MonthStatement> {
  const [row] = await runNamedStatement<StatementRow>(sequelize, monthStatementStatement(month, guildTimeZone(await loadGuild())));
  if (row!.currency === null) throw new AppError(503, 'service_unavailable', 'The guild has not been set up yet: run the migrations and the set-up.');
  const total = (key: string) => row!.totals?.find((t) => t.key === key)?.amount ?? 0;
  const balances = row!.balances ?? [];
  return {
    month,
    currency: row!.currency,
    chargesMinor: total('charges'),
    guildFeesMinor: total('fees'),
    refundsMinor: total('refunds'),
    processingCostMinor: total('processing'),
    disputesLostMinor: total('disputes'),
    disputeFeesMinor: total('dispute_fees'),
    payoutsMinor: total('payouts'),
    sellerCreditsMinor: total('credits'),
    closingBalances: balances.map(([sellerId, name, balanceMinor]) => ({ sellerId, name, balanceMinor })),
    closingBalancesTotalMinor: balances.reduce((sum, [, , balanceMinor]) => sum + balanceMinor, 0),
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
