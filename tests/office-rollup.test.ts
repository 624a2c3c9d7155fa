/**
 * The guild office's tallies (office_tallies, kept by triggers) against a fresh
 * recomputation from the base tables after each kind of change, and the dashboard's
 * figures against the full-history aggregates they replaced.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Transaction } from 'sequelize';
import { Meeting, Order, type Member } from '../apps/api/src/db/models/index.ts';
import { createMember, listenOnApiPort, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';
import { dashboardStatement } from '../apps/api/src/modules/office/dashboard.service.ts';
import { payCheckout, sessionIdFromUrl } from './support/stripe-fake.ts';

let api: TestApi;
let stopListening: () => Promise<void>;
let seller: Member;
let sellerClient: Client;
let buyerClient: Client;
let officerClient: Client;

const address = { name: 'Orla Quennell', line1: '9 Tenter Row', town: 'Millbrook', postalCode: '97451', country: 'US' };

beforeAll(async () => {
  api = await startTestApi();
  stopListening = await listenOnApiPort(api);
  seller = await createMember({ name: 'Wren Halloway' });
  sellerClient = await signedInClient(api.runtime.app, seller);
  buyerClient = await signedInClient(api.runtime.app, await createMember({ name: 'Orla Quennell' }));
  officerClient = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'librarian', 'treasurer', 'admin'] }));
});
afterAll(async () => {
  await stopListening();
  await api.close();
});

/** Rows where the tallies and a recomputation from the base tables disagree (none when they agree). */
async function tallyDifferences(transaction?: Transaction) {
  return api.runtime.ctx.sequelize.query(
    `WITH kept AS (SELECT grain, day, figure, key, sum(amount)::bigint AS amount FROM office_tallies GROUP BY 1, 2, 3, 4 HAVING sum(amount) <> 0),
          fresh AS (SELECT * FROM office_tallies_expected())
     SELECT 'kept only' AS side, * FROM (SELECT * FROM kept EXCEPT SELECT * FROM fresh) a
     UNION ALL
     SELECT 'recomputed only', * FROM (SELECT * FROM fresh EXCEPT SELECT * FROM kept) b`,
    { type: QueryTypes.SELECT, transaction },
  );
}

async function shelved(overrides: Record<string, unknown>) {
  const id = await listAndSubmit(sellerClient, overrides);
  expect((await officerClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
  return id;
}

async function placed(bundleId: string) {
  const res = await buyerClient.send('post', '/api/orders', { items: [{ bundleId, quantity: 1 }], fulfilment: 'post', address });
  expect(res.status).toBe(201);
  return res.body as { order: { id: string }; checkoutUrl: string };
}

async function paidOrder(bundleId: string) {
  const res = await placed(bundleId);
  await payCheckout(sessionIdFromUrl(res.checkoutUrl));
  for (let i = 0; i < 100 && (await Order.findByPk(res.order.id))!.state !== 'confirmed'; i++) await new Promise((r) => setTimeout(r, 100));
  expect((await Order.findByPk(res.order.id))!.state).toBe('confirmed');
  return res.order.id;
}

describe('office tallies', () => {
  it('equal a recomputation from the base tables after sales, refunds, cancellations, claims, payouts and reviews', async () => {
    expect(await tallyDifferences()).toEqual([]);

    const sale = await paidOrder(await shelved({ title: 'Rollup sale', priceMinor: 1500, weightGrams: 500 }));
    expect(await tallyDifferences()).toEqual([]);
    expect((await sellerClient.send('post', `/api/orders/${sale}/posted`, {})).status).toBe(200);

    const refunded = await paidOrder(await shelved({ title: 'Rollup refund', priceMinor: 900, weightGrams: 300 }));
    expect((await sellerClient.send('post', `/api/orders/${refunded}/posted`, {})).status).toBe(200);
    expect((await officerClient.send('post', `/api/orders/${refunded}/refund`)).status).toBe(200);
    expect(await tallyDifferences()).toEqual([]);

    const cancelledPaid = await paidOrder(await shelved({ title: 'Rollup cancelled', priceMinor: 700, weightGrams: 250 }));
    expect((await sellerClient.send('post', `/api/orders/${cancelledPaid}/cancel`, { reason: 'Found a stain' })).status).toBe(200);
    const unpaid = await placed(await shelved({ title: 'Rollup unpaid', priceMinor: 800, weightGrams: 250 }));
    expect((await buyerClient.send('post', `/api/orders/${unpaid.order.id}/cancel`, { reason: 'Ordered twice' })).status).toBe(200);
    expect(await tallyDifferences()).toEqual([]);

    const meeting = await Meeting.create({ startsAt: new Date(Date.now() + 6 * 86_400_000), place: 'Hall', createdBy: null });
    const gift = await shelved({ title: 'Rollup gift', offer: 'meeting', priceMinor: null, meetingHandoverOk: false, weightGrams: 200 });
    expect((await buyerClient.send('post', '/api/orders', { items: [{ bundleId: gift, quantity: 1 }], fulfilment: 'meeting', meetingId: meeting.id })).status).toBe(201);

    const newcomer = await signedInClient(api.runtime.app, await createMember({ joinedAt: new Date(Date.now() - 5 * 86_400_000) }));
    const kept = await shelved({ title: 'Rollup starter', offer: 'starter', priceMinor: null, meetingHandoverOk: false, weightGrams: 400 });
    expect((await newcomer.send('post', `/api/starter-bundles/${kept}/claims`, {})).status).toBe(201);
    const claim = (await api.runtime.ctx.sequelize.query<{ id: string }>(`SELECT id FROM starter_claims WHERE bundle_id = $1`, { bind: [kept], type: QueryTypes.SELECT }))[0]!;
    expect(await tallyDifferences()).toEqual([]);
    expect((await officerClient.send('post', `/api/handovers/${claim.id}/cancel`)).status).toBe(204);
    expect(await tallyDifferences()).toEqual([]);

    expect((await officerClient.send('post', '/api/payouts', { sellerId: seller.id, amountMinor: 300, method: 'cash' })).status).toBe(201);
    const returned = await listAndSubmit(sellerClient, { title: 'Rollup returned' });
    expect((await officerClient.send('post', `/api/bundles/${returned}/review`, { decision: 'return', notes: 'Photo too dark' })).status).toBe(200);
    expect(await tallyDifferences()).toEqual([]);
  });

  it('stay exact through changes made straight in the database, and compacting changes no sum', async () => {
    const sequelize = api.runtime.ctx.sequelize;
    const transaction = await sequelize.transaction();
    try {
      const run = (sql: string) => sequelize.query(sql, { transaction });
      // A rehomed bundle's offer and a starter bundle's weight change; a line's quantity changes; a bundle expires; a free order goes.
      await run(`UPDATE bundles SET offer = 'postage_only', price_minor = NULL
                 WHERE id = (SELECT i.bundle_id FROM order_items i JOIN orders o ON o.id = i.order_id WHERE o.state = 'posted' AND i.title = 'Rollup sale')`);
      await run(`UPDATE bundles SET weight_grams = weight_grams + 123 WHERE id IN (SELECT bundle_id FROM starter_claims WHERE state <> 'cancelled')`);
      await run(`UPDATE order_items SET quantity = quantity + 1 WHERE title = 'Rollup gift'`);
      await run(`UPDATE bundles SET state = 'expired', expires_at = now() - interval '40 days' WHERE id = (SELECT id FROM bundles WHERE state = 'on_shelf' LIMIT 1)`);
      await run(`UPDATE bundles SET cut_kinds = cut_kinds || '{selvages}'::text[], colour_value = 'dark' WHERE state = 'on_shelf'`);
      await run(`UPDATE orders SET paid_at = paid_at - interval '45 days' WHERE state = 'posted'`);
      await run(`DELETE FROM orders WHERE id IN (SELECT o.id FROM orders o WHERE o.charge_minor = 0 AND NOT EXISTS (SELECT 1 FROM ledger_entries e WHERE e.order_id = o.id)
                   AND NOT EXISTS (SELECT 1 FROM starter_claims c WHERE c.order_id = o.id))`);
      await run(`UPDATE bundles SET submitted_at = submitted_at - interval '9 days' WHERE reviewed_at IS NOT NULL`);
      expect(await tallyDifferences(transaction)).toEqual([]);
      await run(`SELECT office_tallies_compact()`);
      expect(await tallyDifferences(transaction)).toEqual([]);
      const [fresh] = await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM office_tallies WHERE NOT compacted`, { type: QueryTypes.SELECT, transaction });
      expect(fresh!.n).toBe(0);
    } finally {
      await transaction.rollback();
    }
  });

  it('give the dashboard the figures the full-history aggregates give', async () => {
    const sequelize = api.runtime.ctx.sequelize;
    const today = new Date().toISOString().slice(0, 10);
    const fortyDaysAgo = new Date(Date.now() - 40 * 86_400_000).toISOString().slice(0, 10);
    for (const query of ['period=all', 'period=year', 'period=month', `period=custom&from=${fortyDaysAgo}&to=${today}`, `period=custom&from=${today}&to=${today}`]) {
      const figures = (await officerClient.get(`/api/dashboard?${query}`)).body.figures;
      const bind = [figures.period.from, figures.period.to];
      const inPeriod = (col: string) => `($1::timestamptz IS NULL OR ${col} >= $1) AND ($2::timestamptz IS NULL OR ${col} < $2)`;
      const rehomed = `
        SELECT b.offer, i.quantity AS units, i.quantity * i.weight_grams AS grams, o.paid_at AS at
        FROM order_items i JOIN orders o ON o.id = i.order_id JOIN bundles b ON b.id = i.bundle_id
        WHERE o.state IN ('confirmed', 'posted', 'received', 'handed_over')
        UNION ALL
        SELECT 'starter', 1, b.weight_grams, c.claimed_at
        FROM starter_claims c JOIN bundles b ON b.id = c.bundle_id WHERE c.state <> 'cancelled' AND c.order_id IS NULL`;
      const [expected] = await sequelize.query<Record<string, unknown>>(
        `SELECT
           (SELECT coalesce(sum(grams), 0)::int FROM (${rehomed}) r WHERE ${inPeriod('r.at')}) AS grams,
           (SELECT coalesce(json_agg(json_build_object('offer', offer, 'units', units) ORDER BY offer), '[]')
            FROM (SELECT offer, sum(units)::int AS units FROM (${rehomed}) r WHERE ${inPeriod('r.at')} GROUP BY offer) u) AS by_offer,
           (SELECT round((percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM reviewed_at - submitted_at)) / 3600)::numeric, 1)::float
            FROM bundles WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL AND ${inPeriod('reviewed_at')}) AS median,
           (SELECT count(*)::int FROM bundles WHERE state = 'expired' AND ${inPeriod('expires_at')}) AS expired,
           (SELECT coalesce(sum(amount_minor) FILTER (WHERE account = 'guild' AND (kind = 'guild_fee' OR reverses = 'guild_fee')), 0)::int
            FROM ledger_entries WHERE ${inPeriod('created_at')}) AS fees,
           -- A lost dispute's money leaves through the processor too, but is no card cost; the processor's dispute fees
           -- are a card cost with a line of their own.
           (SELECT coalesce(sum(amount_minor) FILTER (WHERE account = 'processor' AND kind NOT IN ('dispute', 'dispute_fee')), 0)::int FROM ledger_entries WHERE ${inPeriod('created_at')}) AS processing,
           (SELECT coalesce(sum(amount_minor) FILTER (WHERE account = 'processor' AND kind = 'dispute_fee'), 0)::int FROM ledger_entries WHERE ${inPeriod('created_at')}) AS dispute_fees,
           (SELECT coalesce(sum(amount_minor) FILTER (WHERE account = 'processor' AND kind = 'dispute'), 0)::int FROM ledger_entries WHERE ${inPeriod('created_at')}) AS disputes_lost,
           (SELECT coalesce(sum(amount_minor) FILTER (WHERE account LIKE 'seller:%' AND kind <> 'payout'), 0)::int FROM ledger_entries WHERE ${inPeriod('created_at')}) AS credits,
           (SELECT coalesce(sum(amount_minor) FILTER (WHERE account = 'payouts'), 0)::int FROM ledger_entries WHERE ${inPeriod('created_at')}) AS payouts,
           (SELECT coalesce(sum(amount_minor) FILTER (WHERE account = 'buyer' AND kind = 'refund'), 0)::int FROM ledger_entries WHERE ${inPeriod('created_at')}) AS refunds,
           (SELECT coalesce(sum(postage_minor), 0)::int FROM orders WHERE state IN ('confirmed', 'posted', 'received', 'handed_over') AND ${inPeriod('paid_at')}) AS postage,
           (SELECT coalesce(json_agg(json_build_object('month', month, 'offer', offer, 'grams', grams) ORDER BY month, offer), '[]')
            FROM (SELECT to_char(date_trunc('month', at), 'YYYY-MM') AS month, offer, sum(grams)::int AS grams FROM (${rehomed}) r
                  WHERE r.at >= date_trunc('month', now()) - interval '11 months' GROUP BY 1, 2) w) AS weight_by_month,
           (SELECT coalesce(json_agg(json_build_object('value', value, 'bundles', bundles) ORDER BY value), '[]')
            FROM (SELECT coalesce(colour_value, 'unknown') AS value, count(*)::int AS bundles FROM bundles WHERE state = 'on_shelf' GROUP BY 1) v) AS by_value,
           (SELECT coalesce(json_agg(json_build_object('cut', cut, 'bundles', bundles) ORDER BY bundles DESC, cut), '[]')
            FROM (SELECT cut, count(*)::int AS bundles FROM bundles, unnest(cut_kinds) AS cut WHERE state = 'on_shelf' GROUP BY 1) c) AS by_cut,
           (SELECT coalesce(json_agg(json_build_object('month', month, 'medianHours', median_hours) ORDER BY month), '[]')
            FROM (SELECT to_char(date_trunc('month', reviewed_at), 'YYYY-MM') AS month,
                         round((percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM reviewed_at - submitted_at)) / 3600)::numeric, 1)::float AS median_hours
                  FROM bundles WHERE reviewed_at >= date_trunc('month', now()) - interval '11 months' AND submitted_at IS NOT NULL GROUP BY 1) m) AS review_by_month`,
        { bind, type: QueryTypes.SELECT },
      );
      expect(figures.weightRehomedGrams, query).toBe(expected!.grams);
      expect(figures.bundlesRehomedByOffer, query).toEqual(expected!.by_offer);
      expect(figures.medianReviewHours, query).toBe(expected!.median);
      expect(figures.bundlesExpired, query).toBe(expected!.expired);
      expect(figures.money, query).toMatchObject({
        fundsRaisedMinor: (expected!.fees as number) - (expected!.processing as number) - (expected!.dispute_fees as number),
        guildFeesMinor: expected!.fees,
        processingCostMinor: expected!.processing,
        disputeFeesMinor: expected!.dispute_fees,
        disputesLostMinor: expected!.disputes_lost,
        sellerCreditsMinor: expected!.credits,
        payoutsMinor: expected!.payouts,
        refundsMinor: expected!.refunds,
        postagePaidMinor: expected!.postage,
      });
      expect(figures.charts.weightByMonth, query).toEqual(expected!.weight_by_month);
      expect(figures.charts.shelfByValue, query).toEqual(expected!.by_value);
      expect(figures.charts.shelfByCut, query).toEqual(expected!.by_cut);
      expect(figures.charts.reviewHoursByMonth, query).toEqual(expected!.review_by_month);
    }
  });

  it('find the exact median review time for any period, however the times fall into buckets', async () => {
    const sequelize = api.runtime.ctx.sequelize;
    const transaction = await sequelize.transaction();
    try {
      // Reviews spread over three months, with long and short waits, ties and an even and odd count.
      await sequelize.query(
        `UPDATE bundles SET submitted_at = reviewed_at - (interval '1 second' * (abs(hashtext(id::text)) % 2000000)) WHERE reviewed_at IS NOT NULL`,
        { transaction },
      );
      await sequelize.query(
        `UPDATE bundles SET reviewed_at = reviewed_at - (interval '1 day' * (abs(hashtext(id::text || 'r')) % 80)),
                            submitted_at = submitted_at - (interval '1 day' * (abs(hashtext(id::text || 'r')) % 80))
         WHERE reviewed_at IS NOT NULL`,
        { transaction },
      );
      const periods: [string | null, string | null][] = [
        [null, null],
        [new Date(Date.now() - 30 * 86_400_000).toISOString().slice(0, 10), null],
        [new Date(Date.now() - 75 * 86_400_000).toISOString().slice(0, 10), new Date(Date.now() - 10 * 86_400_000).toISOString().slice(0, 10)],
        [new Date(Date.now() - 45 * 86_400_000).toISOString().slice(0, 8) + '01', new Date(Date.now() - 15 * 86_400_000).toISOString().slice(0, 8) + '01'],
      ];
      for (const [from, to] of periods) {
        const bind = [from && `${from}T00:00:00Z`, to && `${to}T00:00:00Z`];
        const [row] = await sequelize.query<{ fast: number | null; full: number | null; n: number }>(
          `SELECT office_review_median_hours($1, $2) AS fast,
                  (SELECT round((percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM reviewed_at - submitted_at)) / 3600)::numeric, 1)::float FROM bundles
                   WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL
                     AND ($1::timestamptz IS NULL OR reviewed_at >= $1) AND ($2::timestamptz IS NULL OR reviewed_at < $2)) AS full,
                  (SELECT count(*)::int FROM bundles WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL
                     AND ($1::timestamptz IS NULL OR reviewed_at >= $1) AND ($2::timestamptz IS NULL OR reviewed_at < $2)) AS n`,
          { bind, type: QueryTypes.SELECT, transaction },
        );
        expect(row!.fast, `${from} to ${to}, ${row!.n} reviews`).toBe(row!.full);
      }
      // The chart's monthly medians, worked out for all months at once in the dashboard's own statement, on the same times.
      const { statement } = dashboardStatement({ period: 'all' }, new Date(), 'UTC');
      const [chart] = await sequelize.query<{ review_by_month: unknown }>(statement.text, { bind: statement.values, type: QueryTypes.SELECT, transaction });
      const [full] = await sequelize.query<{ by_month: unknown }>(
        `SELECT json_agg(json_build_object('month', month, 'medianHours', median_hours) ORDER BY month) AS by_month
         FROM (SELECT to_char(date_trunc('month', reviewed_at AT TIME ZONE 'UTC'), 'YYYY-MM') AS month,
                      round((percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM reviewed_at - submitted_at)) / 3600)::numeric, 1)::float AS median_hours
               FROM bundles WHERE reviewed_at >= $1 AND submitted_at IS NOT NULL GROUP BY 1) m`,
        { bind: [`${statement.values[2]}T00:00:00Z`], type: QueryTypes.SELECT, transaction },
      );
      expect(chart!.review_by_month).toEqual(full!.by_month);
      expect(await tallyDifferences(transaction)).toEqual([]);
    } finally {
      await transaction.rollback();
    }
  });
});
