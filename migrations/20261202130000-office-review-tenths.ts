import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';
import { down as downTallies, up as upTallies } from './20261202120000-office-tallies.ts';

/**
 * The median review time without sorting a crowded bucket. The figure shown is the median in
 * hours rounded to a tenth, and that rounding is monotonic, so when the middle review time(s)
 * of a period all round to the same tenth of an hour, that tenth is the figure exactly (the
 * interpolated median lies between them). Reviews are therefore also tallied by their own
 * rounded tenth of an hour ('review:<bucket>' → tenths), inside the hour (or, past a week, day)
 * buckets of 'review'; bundles are read only when the middle two fall in different tenths, and
 * then only the largest of one tenth and the smallest of the next.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    -- A review time in tenths of an hour, rounded exactly as the dashboard rounds the median.
    CREATE FUNCTION review_time_tenths(submitted timestamptz, reviewed timestamptz) RETURNS integer LANGUAGE sql IMMUTABLE AS $$
      SELECT (round((extract(epoch FROM reviewed - submitted)::double precision / 3600)::numeric, 1) * 10)::integer
    $$;
    DROP INDEX IF EXISTS bundles_review_buckets;
    -- Hours for the first week, then days, made from the tenths so that a tenth never spans two buckets.
    CREATE OR REPLACE FUNCTION review_time_bucket(submitted timestamptz, reviewed timestamptz) RETURNS integer LANGUAGE sql IMMUTABLE AS $$
      SELECT CASE WHEN t < 1680 THEN floor(t / 10.0) ELSE 168 + floor((t - 1680) / 240.0) END::integer
      FROM (SELECT review_time_tenths(submitted, reviewed) AS t) x
    $$;
    CREATE INDEX bundles_review_tenths ON bundles (review_time_tenths(submitted_at, reviewed_at), reviewed_at) INCLUDE (submitted_at)
      WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL;

    CREATE OR REPLACE FUNCTION office_bundle_tally_row(b bundles, p_sign integer) RETURNS void LANGUAGE plpgsql AS $$
    DECLARE bucket integer;
    BEGIN
      INSERT INTO office_tallies (grain, day, figure, key, amount)
      SELECT 't', '-infinity'::date, 'shelf_value', coalesce(b.colour_value, 'unknown'), p_sign WHERE b.state = 'on_shelf'
      UNION ALL
      SELECT 't', '-infinity'::date, 'shelf_cut', cut, p_sign FROM unnest(b.cut_kinds) AS cut WHERE b.state = 'on_shelf';
      IF b.state = 'expired' THEN PERFORM office_tally('expired', b.expires_at, '', p_sign); END IF;
      IF b.reviewed_at IS NOT NULL AND b.submitted_at IS NOT NULL THEN
        bucket := review_time_bucket(b.submitted_at, b.reviewed_at);
        PERFORM office_tally('review', b.reviewed_at, bucket::text, p_sign);
        PERFORM office_tally('review:' || bucket, b.reviewed_at, review_time_tenths(b.submitted_at, b.reviewed_at)::text, p_sign);
      END IF;
    END $$;

    CREATE OR REPLACE FUNCTION office_tallies_expected() RETURNS TABLE (grain char(1), day date, figure text, key text, amount bigint) LANGUAGE sql STABLE AS $$
      WITH dated AS (
        SELECT 'units' AS figure, coalesce(b.offer, '') AS key, o.paid_at AS at, i.quantity::bigint AS amount
        FROM order_items i JOIN orders o ON o.id = i.order_id JOIN bundles b ON b.id = i.bundle_id
        WHERE o.state IN ('confirmed', 'posted', 'received', 'handed_over')
        UNION ALL
        SELECT 'grams', coalesce(b.offer, ''), o.paid_at, (i.quantity * i.weight_grams)::bigint
        FROM order_items i JOIN orders o ON o.id = i.order_id JOIN bundles b ON b.id = i.bundle_id
        WHERE o.state IN ('confirmed', 'posted', 'received', 'handed_over')
        UNION ALL
        SELECT 'postage', '', paid_at, postage_minor FROM orders WHERE state IN ('confirmed', 'posted', 'received', 'handed_over')
        UNION ALL
        SELECT 'units', 'starter', c.claimed_at, 1 FROM starter_claims c WHERE c.state <> 'cancelled' AND c.order_id IS NULL
        UNION ALL
        SELECT 'grams', 'starter', c.claimed_at, coalesce(b.weight_grams, 0)
        FROM starter_claims c JOIN bundles b ON b.id = c.bundle_id WHERE c.state <> 'cancelled' AND c.order_id IS NULL
        UNION ALL
        SELECT 'money', d.key, e.created_at, d.amount FROM ledger_entries e, office_ledger_deltas(e.kind, e.reverses, e.account, e.amount_minor) d
        UNION ALL
        SELECT 'expired', '', expires_at, 1 FROM bundles WHERE state = 'expired'
        UNION ALL
        SELECT 'review', review_time_bucket(submitted_at, reviewed_at)::text, reviewed_at, 1 FROM bundles
        WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL
        UNION ALL
        SELECT 'review:' || review_time_bucket(submitted_at, reviewed_at), review_time_tenths(submitted_at, reviewed_at)::text, reviewed_at, 1 FROM bundles
        WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL
      ),
      grained AS (
        SELECT 'd'::char(1) AS grain, office_day(at) AS day, figure, key, amount FROM dated
        UNION ALL
        SELECT 'm', office_month(at), figure, key, amount FROM dated
        UNION ALL
        SELECT 'm', office_month(created_at), 'balance', account, amount_minor FROM ledger_entries WHERE account LIKE 'seller:%'
        UNION ALL
        SELECT 't', '-infinity', 'balance', account, amount_minor FROM ledger_entries WHERE account LIKE 'seller:%'
        UNION ALL
        SELECT 't', '-infinity', 'shelf_value', coalesce(colour_value, 'unknown'), 1 FROM bundles WHERE state = 'on_shelf'
        UNION ALL
        SELECT 't', '-infinity', 'shelf_cut', cut, 1 FROM bundles, unnest(cut_kinds) AS cut WHERE state = 'on_shelf'
      )
      SELECT grain, day, figure, key, sum(amount)::bigint FROM grained GROUP BY 1, 2, 3, 4 HAVING sum(amount) <> 0
    $$;


    -- The same sums, as three index ranges (whole months, leading days, trailing days) instead of
    -- one scan of every row of the figure filtered by grain.
    CREATE OR REPLACE FUNCTION office_period_tallies(p_from timestamptz, p_to timestamptz, p_figures text[])
    RETURNS TABLE (figure text, key text, amount bigint) LANGUAGE sql STABLE AS $$
      WITH bounds AS (
        SELECT d_from, d_to, m_from, greatest(m_from, m_to) AS m_to FROM (
          SELECT coalesce((p_from AT TIME ZONE 'UTC')::date, '-infinity'::date) AS d_from,
                 coalesce((p_to AT TIME ZONE 'UTC')::date, 'infinity'::date) AS d_to,
                 CASE WHEN p_from IS NULL THEN '-infinity'::date
                      WHEN extract(day FROM p_from AT TIME ZONE 'UTC') = 1 THEN (p_from AT TIME ZONE 'UTC')::date
                      ELSE (date_trunc('month', p_from AT TIME ZONE 'UTC') + interval '1 month')::date END AS m_from,
                 CASE WHEN p_to IS NULL THEN 'infinity'::date ELSE date_trunc('month', p_to AT TIME ZONE 'UTC')::date END AS m_to
        ) x
      ),
      picked AS (
        SELECT t.figure, t.key, t.amount FROM office_tallies t, bounds b
        WHERE t.figure = ANY (p_figures) AND t.grain = 'm' AND t.day >= b.m_from AND t.day < b.m_to
        UNION ALL
        SELECT t.figure, t.key, t.amount FROM office_tallies t, bounds b
        WHERE t.figure = ANY (p_figures) AND t.grain = 'd' AND t.day >= b.d_from AND t.day < least(b.m_from, b.d_to)
        UNION ALL
        SELECT t.figure, t.key, t.amount FROM office_tallies t, bounds b
        WHERE t.figure = ANY (p_figures) AND t.grain = 'd' AND t.day >= greatest(b.m_to, b.d_from) AND t.day < b.d_to
      )
      SELECT figure, key, sum(amount)::bigint FROM picked GROUP BY 1, 2 HAVING sum(amount) <> 0
    $$;

    DROP FUNCTION office_review_median_seconds(timestamptz, timestamptz);
    /*
     * The median review time of bundles reviewed in [p_from, p_to), in hours rounded to a tenth:
     * exactly round((percentile_cont(0.5) over every review time) / 3600, 1).
     */
    CREATE FUNCTION office_review_median_hours(p_from timestamptz, p_to timestamptz) RETURNS double precision LANGUAGE plpgsql STABLE AS $$
    DECLARE
      lo_from constant timestamptz := coalesce(p_from, '-infinity');
      hi_to constant timestamptz := coalesce(p_to, 'infinity');
      keys integer[];
      counts bigint[];
      total bigint;
      positions bigint[];
      tenths integer[] := '{}';
      pos bigint;
      below bigint;
      bucket integer;
      tenth integer;
      v_lo double precision;
      v_hi double precision;
    BEGIN
      SELECT array_agg(key::integer ORDER BY key::integer), array_agg(amount ORDER BY key::integer), sum(amount)
      INTO keys, counts, total FROM office_period_tallies(p_from, p_to, ARRAY['review']);
      IF total IS NULL OR total <= 0 THEN RETURN NULL; END IF;
      -- The middle one (odd count) or two (even count), counted from 0.
      positions := CASE WHEN total % 2 = 1 THEN ARRAY[(total - 1) / 2] ELSE ARRAY[total / 2 - 1, total / 2] END;
      FOREACH pos IN ARRAY positions LOOP
        below := 0;
        FOR i IN 1 .. array_length(keys, 1) LOOP
          bucket := keys[i];
          EXIT WHEN pos < below + counts[i];
          below := below + counts[i];
        END LOOP;
        FOR tenth, total IN
          SELECT key::integer, amount FROM office_period_tallies(p_from, p_to, ARRAY['review:' || bucket]) ORDER BY key::integer
        LOOP
          EXIT WHEN pos < below + total;
          below := below + total;
        END LOOP;
        tenths := tenths || tenth;
      END LOOP;
      IF tenths[1] = tenths[array_length(tenths, 1)] THEN RETURN (tenths[1]::numeric / 10)::double precision; END IF;
      -- The middle two round differently: the last of the lower tenth and the first of the higher decide.
      SELECT max(extract(epoch FROM reviewed_at - submitted_at)::double precision) INTO v_lo FROM bundles
      WHERE review_time_tenths(submitted_at, reviewed_at) = tenths[1] AND reviewed_at >= lo_from AND reviewed_at < hi_to
        AND reviewed_at IS NOT NULL AND submitted_at IS NOT NULL;
      SELECT min(extract(epoch FROM reviewed_at - submitted_at)::double precision) INTO v_hi FROM bundles
      WHERE review_time_tenths(submitted_at, reviewed_at) = tenths[2] AND reviewed_at >= lo_from AND reviewed_at < hi_to
        AND reviewed_at IS NOT NULL AND submitted_at IS NOT NULL;
      RETURN (SELECT round((percentile_cont(0.5) WITHIN GROUP (ORDER BY x) / 3600)::numeric, 1)::double precision FROM unnest(ARRAY[v_lo, v_hi]) AS x);
    END $$;

    DELETE FROM office_tallies WHERE figure = 'review' OR figure LIKE 'review:%';
    INSERT INTO office_tallies (grain, day, figure, key, amount, compacted)
    SELECT grain, day, figure, key, amount, true FROM office_tallies_expected() WHERE figure = 'review' OR figure LIKE 'review:%';
  `);
};

/** Back to hour buckets only: the tallies are rebuilt as the previous migration made them. */
export const down: MigrationFn<Sequelize> = async (params) => {
  await params.context.query(`
    DROP FUNCTION IF EXISTS office_review_median_hours(timestamptz, timestamptz);
    DROP INDEX IF EXISTS bundles_review_tenths;
  `);
  await downTallies(params);
  await params.context.query(`DROP FUNCTION IF EXISTS review_time_tenths(timestamptz, timestamptz);`);
  await upTallies(params);
};
