import { QueryTypes, type Sequelize } from 'sequelize';
import type { DashboardFigures, DashboardQuery } from '@scrap-relay/shared';
import type { Guild } from '../../db/models/index.ts';

const PAID_STATES = `('confirmed', 'posted', 'received', 'handed_over')`;

/** The period as [from, to) timestamps; null ends are open. Months and years are the calendar's, in UTC. */
export function periodBounds(q: DashboardQuery, now: Date): { from: Date | null; to: Date | null; label: string } {
  if (q.period === 'all') return { from: null, to: null, label: 'All time' };
  if (q.period === 'custom') {
    const to = new Date(`${q.to!}T00:00:00Z`);
    to.setUTCDate(to.getUTCDate() + 1);
    return { from: new Date(`${q.from!}T00:00:00Z`), to, label: `${q.from} to ${q.to}` };
  }
  const y = now.getUTCFullYear();
  if (q.period === 'year') return { from: new Date(Date.UTC(y, 0, 1)), to: new Date(Date.UTC(y + 1, 0, 1)), label: `${y}` };
  const m = now.getUTCMonth();
  return { from: new Date(Date.UTC(y, m, 1)), to: new Date(Date.UTC(y, m + 1, 1)), label: new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 7) };
}

type Row = Record<string, number | string | null>;

/**
 * Every figure is one SQL aggregate. A unit is rehomed when its order is paid (or confirmed
 * free) and not cancelled or refunded, or when a starter claim for it stands.
 */
export async function dashboardFigures(sequelize: Sequelize, guild: Guild, q: DashboardQuery, now: Date, withMoney: boolean): Promise<DashboardFigures> {
  const { from, to, label } = periodBounds(q, now);
  const bind = [from, to];
  const inPeriod = (col: string) => `($1::timestamptz IS NULL OR ${col} >= $1) AND ($2::timestamptz IS NULL OR ${col} < $2)`;
  const one = async <T extends Row>(sql: string, extraBind: unknown[] = bind) => (await sequelize.query<T>(sql, { bind: extraBind, type: QueryTypes.SELECT }))[0]!;
  const many = <T extends Row>(sql: string, extraBind: unknown[] = bind) => sequelize.query<T>(sql, { bind: extraBind, type: QueryTypes.SELECT });

  const rehomedUnits = `
    SELECT b.offer, i.quantity AS units, i.quantity * i.weight_grams AS grams, o.paid_at AS at
    FROM order_items i JOIN orders o ON o.id = i.order_id JOIN bundles b ON b.id = i.bundle_id
    WHERE o.state IN ${PAID_STATES}
    UNION ALL
    SELECT 'starter', 1, b.weight_grams, c.claimed_at
    FROM starter_claims c JOIN bundles b ON b.id = c.bundle_id WHERE c.state <> 'cancelled' AND c.order_id IS NULL`;

  const [weight, byOffer, served, waiting, review, expired, weightByMonth, shelfByValue, shelfByCut, reviewByMonth] = await Promise.all([
    one<{ grams: number }>(`SELECT coalesce(sum(grams), 0)::int AS grams FROM (${rehomedUnits}) r WHERE ${inPeriod('r.at')}`),
    many<{ offer: string; units: number }>(`SELECT offer, sum(units)::int AS units FROM (${rehomedUnits}) r WHERE ${inPeriod('r.at')} GROUP BY offer ORDER BY offer`),
    one<{ n: number }>(`SELECT count(DISTINCT member_id)::int AS n FROM starter_claims WHERE state <> 'cancelled' AND ${inPeriod('claimed_at')}`),
    one<{ n: number }>(`SELECT count(*)::int AS n FROM bundles WHERE state = 'in_review'`, []),
    one<{ hours: number | null }>(
      `SELECT round((percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM reviewed_at - submitted_at)) / 3600)::numeric, 1)::float AS hours
       FROM bundles WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL AND ${inPeriod('reviewed_at')}`,
    ),
    one<{ n: number }>(`SELECT count(*)::int AS n FROM bundles WHERE state = 'expired' AND ${inPeriod('expires_at')}`),
    many<{ month: string; offer: string; grams: number }>(
      `SELECT to_char(date_trunc('month', at), 'YYYY-MM') AS month, offer, sum(grams)::int AS grams
       FROM (${rehomedUnits}) r WHERE r.at >= date_trunc('month', $1::timestamptz) - interval '11 months'
       GROUP BY 1, 2 ORDER BY 1, 2`,
      [now],
    ),
    many<{ value: string; bundles: number }>(
      `SELECT coalesce(colour_value, 'unknown') AS value, count(*)::int AS bundles FROM bundles WHERE state = 'on_shelf' GROUP BY 1 ORDER BY 1`,
      [],
    ),
    many<{ cut: string; bundles: number }>(
      `SELECT cut, count(*)::int AS bundles FROM bundles, unnest(cut_kinds) AS cut WHERE state = 'on_shelf' GROUP BY 1 ORDER BY 2 DESC, 1`,
      [],
    ),
    many<{ month: string; median_hours: number }>(
      `SELECT to_char(date_trunc('month', reviewed_at), 'YYYY-MM') AS month,
              round((percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM reviewed_at - submitted_at)) / 3600)::numeric, 1)::float AS median_hours
       FROM bundles WHERE reviewed_at >= date_trunc('month', $1::timestamptz) - interval '11 months' AND submitted_at IS NOT NULL
       GROUP BY 1 ORDER BY 1`,
      [now],
    ),
  ]);

  let money: DashboardFigures['money'] = null;
  if (withMoney) {
    const m = await one<{ fees: number; credits: number; payouts: number; refunds: number; postage: number }>(
      `SELECT
         coalesce(sum(amount_minor) FILTER (WHERE account = 'guild' AND (kind = 'guild_fee' OR reverses = 'guild_fee')), 0)::int AS fees,
         coalesce(sum(amount_minor) FILTER (WHERE account LIKE 'seller:%' AND kind <> 'payout'), 0)::int AS credits,
         coalesce(sum(amount_minor) FILTER (WHERE account = 'payouts'), 0)::int AS payouts,
         coalesce(sum(amount_minor) FILTER (WHERE account = 'buyer' AND kind = 'refund'), 0)::int AS refunds,
         (SELECT coalesce(sum(postage_minor), 0)::int FROM orders WHERE state IN ${PAID_STATES} AND ${inPeriod('paid_at')}) AS postage
       FROM ledger_entries WHERE ${inPeriod('created_at')}`,
    );
    money = { fundsRaisedMinor: m.fees, sellerCreditsMinor: m.credits, payoutsMinor: m.payouts, postagePaidMinor: m.postage, refundsMinor: m.refunds, currency: guild.currency };
  }

  return {
    period: { from: from?.toISOString() ?? null, to: to?.toISOString() ?? null, label },
    weightRehomedGrams: weight.grams,
    bundlesRehomedByOffer: byOffer,
    newQuiltersServed: served.n,
    waitingForReview: waiting.n,
    medianReviewHours: review.hours,
    bundlesExpired: expired.n,
    money,
    charts: {
      weightByMonth,
      shelfByValue,
      shelfByCut,
      reviewHoursByMonth: reviewByMonth.map((r) => ({ month: r.month, medianHours: r.median_hours })),
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
    rows.push(
      ['funds_raised_minor', f.money.fundsRaisedMinor],
      ['seller_credits_minor', f.money.sellerCreditsMinor],
      ['payouts_minor', f.money.payoutsMinor],
      ['postage_paid_minor', f.money.postagePaidMinor],
      ['refunds_minor', f.money.refundsMinor],
      ['currency', f.money.currency],
    );
  }
  return rows;
}
