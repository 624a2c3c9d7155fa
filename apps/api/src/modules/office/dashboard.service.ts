import type { Sequelize } from 'sequelize';
import { startOfDayIn, wallTimeAt, type DashboardFigures, type DashboardQuery } from '@scrap-relay/shared';
import { AppError } from '../../errors/index.ts';
import { runNamedStatement, type NamedStatement } from '../../db/named-statement.ts';
import { decimalAmount, IN_CURRENCY_UNITS } from '../ledger/csv.ts';
import { guildTimeZone, loadGuild } from '../guild/guild.service.ts';

/**
 * The period as [from, to) timestamps; null ends are open. Days, months and years are the guild's calendar, in its
 * time zone (the days office_tallies are kept in, migration 20261204030000), so a month here is the statement's month.
 */
export function periodBounds(q: DashboardQuery, now: Date, timeZone: string): { from: Date | null; to: Date | null; label: string } {
  if (q.period === 'all') return { from: null, to: null, label: 'All time' };
  if (q.period === 'custom') {
    const [fy, fm, fd] = q.from!.split('-').map(Number) as [number, number, number];
    const [ty, tm, td] = q.to!.split('-').map(Number) as [number, number, number];
    return { from: startOfDayIn(fy, fm, fd, timeZone), to: startOfDayIn(ty, tm, td + 1, timeZone), label: `${q.from} to ${q.to}` };
  }
  const { year: y, month: m } = wallTimeAt(now, timeZone);
  if (q.period === 'year') return { from: startOfDayIn(y, 1, 1, timeZone), to: startOfDayIn(y + 1, 1, 1, timeZone), label: `${y}` };
  return { from: startOfDayIn(y, m, 1, timeZone), to: startOfDayIn(y, m + 1, 1, timeZone), label: `${y}-${String(m).padStart(2, '0')}` };
}

/** The period of a dashboard query in the guild's calendar. */
export async function guildPeriodBounds(q: DashboardQuery, now: Date): Promise<ReturnType<typeof periodBounds>> {
  return periodBounds(q, now, guildTimeZone(await loadGuild()));
}

/** The first day of the guild's month eleven months before now's: where the twelve-month charts start. */
function chartStart(now: Date, timeZone: string): string {
  const { year, month } = wallTimeAt(now, timeZone);
  return new Date(Date.UTC(year, month - 12, 1)).toISOString().slice(0, 10);
}

interface FiguresRow {
  currency: string | null;
  tallies: { figure: string; key: string; amount: number }[] | null;
  served: number;
  waiting: number;
  median_hours: number | null;
  weight_by_month: { month: string; offer: string; grams: number }[] | null;
  shelf_by_value: { value: string; bundles: number }[] | null;
  shelf_by_cut: { cut: string; bundles: number }[] | null;
  review_by_month: { month: string; medianHours: number }[] | null;
}

/**
 * One statement for every figure and the guild's currency, named (see db/named-statement.ts).
 * What is added up comes from office_tallies (migration 20261202120000-office-tallies.ts: per-day, per-month and running totals that triggers keep
 * exact in the same transaction as each change), so a period is a sum over at most a few
 * hundred rows whatever the guild's history. The rule is the one the figures always had: a
 * unit is rehomed when its order is paid (or confirmed free) and not cancelled or refunded,
 * or when a starter claim for it stands; dated when paid or claimed, by the guild's day (its time zone).
 * New quilters served (distinct members) and bundles waiting for review are counted live
 * from small partial indexes; the median review time comes from review counts by bucket and by
 * tenth of an hour (office_review_median_hours, migration 20261202130000). The twelve monthly
 * medians of the chart are the same steps done for every month at once, in SQL (calling the
 * function once per month cost about 0.25 ms of PostgreSQL CPU each): each month's middle
 * position(s) in its review buckets, the tenth of an hour of each inside its bucket, and only
 * where the middle two round to different tenths, the last review time of the lower tenth and
 * the first of the higher, interpolated as percentile_cont does.
 */
export function dashboardStatement(q: DashboardQuery, now: Date, timeZone: string): { statement: NamedStatement; period: DashboardFigures['period'] } {
  const { from, to, label } = periodBounds(q, now, timeZone);
  return {
    statement: { name: 'office-dashboard-figures', text: DASHBOARD_SQL, values: [from, to, chartStart(now, timeZone), timeZone] },
    period: { from: from?.toISOString() ?? null, to: to?.toISOString() ?? null, label },
  };
}

const DASHBOARD_SQL = `SELECT
       (SELECT currency FROM guild WHERE id = 1) AS currency,
       (SELECT json_agg(json_build_object('figure', figure, 'key', key, 'amount', amount::int) ORDER BY figure, key)
        FROM office_period_tallies($1, $2, ARRAY['units', 'grams', 'postage', 'money', 'expired'])) AS tallies,
       (SELECT count(DISTINCT member_id)::int FROM starter_claims
        WHERE state <> 'cancelled' AND ($1::timestamptz IS NULL OR claimed_at >= $1) AND ($2::timestamptz IS NULL OR claimed_at < $2)) AS served,
       (SELECT count(*)::int FROM bundles WHERE state = 'in_review') AS waiting,
       office_review_median_hours($1, $2) AS median_hours,
       (SELECT json_agg(json_build_object('month', to_char(day, 'YYYY-MM'), 'offer', key, 'grams', grams) ORDER BY to_char(day, 'YYYY-MM'), key)
        FROM (SELECT day, key, (sum(amount) FILTER (WHERE figure = 'grams'))::int AS grams FROM office_tallies
              WHERE figure IN ('units', 'grams') AND grain = 'm' AND day >= $3::date
              GROUP BY day, key HAVING sum(amount) FILTER (WHERE figure = 'units') <> 0) w) AS weight_by_month,
       (SELECT json_agg(json_build_object('value', value, 'bundles', bundles) ORDER BY value)
        FROM (SELECT key AS value, sum(amount)::int AS bundles FROM office_tallies WHERE figure = 'shelf_value' AND grain = 't'
              GROUP BY key HAVING sum(amount) <> 0) v) AS shelf_by_value,
       (SELECT json_agg(json_build_object('cut', cut, 'bundles', bundles) ORDER BY bundles DESC, cut)
        FROM (SELECT key AS cut, sum(amount)::int AS bundles FROM office_tallies WHERE figure = 'shelf_cut' AND grain = 't'
              GROUP BY key HAVING sum(amount) <> 0) c) AS shelf_by_cut,
       (SELECT json_agg(json_build_object('month', to_char(day, 'YYYY-MM'), 'medianHours', hours) ORDER BY day)
        FROM (SELECT day,
                     CASE WHEN lo = hi THEN (lo::numeric / 10)::double precision
                          ELSE (SELECT round((percentile_cont(0.5) WITHIN GROUP (ORDER BY x) / 3600)::numeric, 1)::double precision
                                FROM unnest(ARRAY[
                                  (SELECT max(extract(epoch FROM reviewed_at - submitted_at)::double precision) FROM bundles
                                   WHERE review_time_tenths(submitted_at, reviewed_at) = lo AND reviewed_at IS NOT NULL AND submitted_at IS NOT NULL
                                     AND reviewed_at >= day::timestamp AT TIME ZONE $4::text AND reviewed_at < (day + interval '1 month') AT TIME ZONE $4::text),
                                  (SELECT min(extract(epoch FROM reviewed_at - submitted_at)::double precision) FROM bundles
                                   WHERE review_time_tenths(submitted_at, reviewed_at) = hi AND reviewed_at IS NOT NULL AND submitted_at IS NOT NULL
                                     AND reviewed_at >= day::timestamp AT TIME ZONE $4::text AND reviewed_at < (day + interval '1 month') AT TIME ZONE $4::text)
                                ]) AS x) END AS hours
              FROM (SELECT p.day, min(t.tenth) AS lo, max(t.tenth) AS hi
                    FROM (SELECT day, bucket, n, sum(n) OVER (PARTITION BY day ORDER BY bucket) - n AS below, sum(n) OVER (PARTITION BY day) AS total
                          FROM (SELECT day, key::integer AS bucket, sum(amount) AS n FROM office_tallies
                                WHERE figure = 'review' AND grain = 'm' AND day >= $3::date
                                GROUP BY day, key HAVING sum(amount) <> 0) b) p
                    CROSS JOIN LATERAL unnest(ARRAY[div(p.total - 1, 2), div(p.total, 2)]) AS m(pos)
                    CROSS JOIN LATERAL (
                      SELECT c.tenth FROM (
                        SELECT key::integer AS tenth, sum(sum(amount)) OVER (ORDER BY key::integer) AS upto FROM office_tallies
                        WHERE figure = 'review:' || p.bucket AND grain = 'm' AND day = p.day
                        GROUP BY key HAVING sum(amount) <> 0) c
                      WHERE m.pos < p.below + c.upto ORDER BY c.tenth LIMIT 1) t
                    WHERE m.pos >= p.below AND m.pos < p.below + p.n
                    GROUP BY p.day) mid) r) AS review_by_month`;

export async function dashboardFigures(sequelize: Sequelize, q: DashboardQuery, now: Date, withMoney: boolean): Promise<DashboardFigures> {
  const { statement, period } = dashboardStatement(q, now, guildTimeZone(await loadGuild()));
  const [row] = await runNamedStatement<FiguresRow>(sequelize, statement);
  if (row!.currency === null) throw new AppError(503, 'service_unavailable', 'The guild has not been set up yet: run the migrations and the set-up.');
  const tallies = row!.tallies ?? [];
  const total = (figure: string, key?: string) =>
    tallies.filter((t) => t.figure === figure && (key === undefined || t.key === key)).reduce((sum, t) => sum + t.amount, 0);

  const money: DashboardFigures['money'] = withMoney
    ? {
        // Card costs: the processing cost of payments and the processor's fees for disputes.
        fundsRaisedMinor: total('money', 'fees') - total('money', 'processing') - total('money', 'dispute_fees'),
        guildFeesMinor: total('money', 'fees'),
        processingCostMinor: total('money', 'processing'),
        disputeFeesMinor: total('money', 'dispute_fees'),
        disputesLostMinor: total('money', 'disputes'),
        sellerCreditsMinor: total('money', 'credits'),
        payoutsMinor: total('money', 'payouts'),
        postagePaidMinor: total('postage'),
        refundsMinor: total('money', 'refunds'),
        currency: row!.currency,
      }
    : null;

  return {
    period,
    weightRehomedGrams: total('grams'),
    bundlesRehomedByOffer: tallies.filter((t) => t.figure === 'units').map((t) => ({ offer: t.key, units: t.amount })),
    newQuiltersServed: row!.served,
    waitingForReview: row!.waiting,
    medianReviewHours: row!.median_hours,
    bundlesExpired: total('expired'),
    money,
    charts: {
      weightByMonth: row!.weight_by_month ?? [],
      shelfByValue: row!.shelf_by_value ?? [],
      shelfByCut: row!.shelf_by_cut ?? [],
      reviewHoursByMonth: row!.review_by_month ?? [],
    },
  };
}

/** The figures as rows of name and value, for the CSV beside the page. */
export function dashboardRows(f: DashboardFigures): [string, string | number][] {
  const rows: [string, string | number][] = [
    ['period', f.period.label],
    ['weight_rehomed_grams', f.weightRehomedGrams],
    ...f.bundlesRehomedByOffer.map((r): [string, number] => [`units_rehomed_${r.offer}`, r.units]),
    ['new_quilters_served', f.newQuiltersServed],
    ['waiting_for_review', f.waitingForReview],
    ['median_review_hours', f.medianReviewHours ?? ''],
    ['bundles_expired', f.bundlesExpired],
  ];
  if (f.money) {
    // Decimals in the currency's units (51.70, not 5170 cents), as in the ledger's CSV; the currency follows.
    const m = f.money;
    const money = (figure: string, minor: number): [string, string] => [`${figure}_${IN_CURRENCY_UNITS}`, decimalAmount(minor, m.currency)];
    rows.push(
      money('funds_raised', m.fundsRaisedMinor),
      money('guild_fees', m.guildFeesMinor),
      money('processing_cost', m.processingCostMinor),
      money('dispute_fees', m.disputeFeesMinor),
      money('disputes_lost', m.disputesLostMinor),
      money('seller_credits', m.sellerCreditsMinor),
      money('payouts', m.payoutsMinor),
      money('postage_paid', m.postagePaidMinor),
      money('refunds', m.refundsMinor),
      ['currency', m.currency],
    );
  }
  return rows;
}
