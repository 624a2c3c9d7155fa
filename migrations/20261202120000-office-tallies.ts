import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * The guild office's figures from data shaped for the question: `office_tallies`
 * holds what the dashboard and the month statement add up, per UTC day ('d'), per
 * UTC month ('m') or in total ('t'), kept exact by triggers in the same transaction
 * as every change to orders, order lines, starter claims, ledger entries and bundles.
 *
 * Triggers only ever INSERT signed deltas (never update a shared counter row), so
 * concurrent checkouts, payments and refunds never wait for or deadlock on each
 * other here. Deltas are merged into one row per (grain, figure, day, key) from time
 * to time by `office_tallies_compact()`, which changes no sum; a reader adds up
 * whatever rows there are, so every figure is current to the last commit.
 *
 * figures (key → amount):
 *   units, grams        offer → units / grams rehomed, dated when the order was paid
 *                        (or the starter claim made); the same rule as before: an order
 *                        in a paid state, or a standing starter claim with no order
 *   postage             '' → postage of orders in a paid state, dated paid_at
 *   money               charges, fees, refunds, processing, payouts, credits → minor
 *                        units of ledger entries, dated created_at
 *   balance             'seller:<id>' → that seller account's entries (grains m and t)
 *   expired             '' → bundles expired, dated expires_at
 *   review              review_time_bucket → bundles reviewed, dated reviewed_at
 *   shelf_value         colour value → bundles on the shelf (grain t)
 *   shelf_cut           cut kind → bundles on the shelf listing it (grain t)
 * An undated row (paid_at or expires_at null) has day '-infinity': counted in all time,
 * in no bounded period, exactly as the figures were before.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE office_tallies (
      id bigserial PRIMARY KEY,
      grain char(1) NOT NULL CHECK (grain IN ('d', 'm', 't')),
      day date NOT NULL,
      figure text NOT NULL,
      key text NOT NULL DEFAULT '',
      amount bigint NOT NULL,
      compacted boolean NOT NULL DEFAULT false
    );
    CREATE INDEX office_tallies_lookup ON office_tallies (figure, grain, day, key) INCLUDE (amount);
    CREATE INDEX office_tallies_fresh ON office_tallies (id) WHERE NOT compacted;

    CREATE FUNCTION office_day(p_at timestamptz) RETURNS date LANGUAGE sql IMMUTABLE AS
      $$ SELECT coalesce((p_at AT TIME ZONE 'UTC')::date, '-infinity'::date) $$;
    CREATE FUNCTION office_month(p_at timestamptz) RETURNS date LANGUAGE sql IMMUTABLE AS
      $$ SELECT coalesce(date_trunc('month', p_at AT TIME ZONE 'UTC')::date, '-infinity'::date) $$;

    -- Review time in buckets that keep the order of the times: hours for the first week, then days.
    CREATE FUNCTION review_time_bucket(submitted timestamptz, reviewed timestamptz) RETURNS integer LANGUAGE sql IMMUTABLE AS $$
      SELECT CASE WHEN s < 604800 THEN floor(s / 3600) ELSE 168 + floor((s - 604800) / 86400) END::integer
      FROM (SELECT extract(epoch FROM reviewed - submitted) AS s) x
    $$;
    -- The median's second step reads only the bundles of one bucket in the period.
    CREATE INDEX bundles_review_buckets ON bundles (review_time_bucket(submitted_at, reviewed_at), reviewed_at) INCLUDE (submitted_at)
      WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL;
    -- New quilters served stays a live count of distinct members; this keeps it to the claims' index.
    CREATE INDEX starter_claims_standing ON starter_claims (claimed_at) INCLUDE (member_id) WHERE state <> 'cancelled';

    -- Merges the rows of every key that has fresh deltas (after p_after, for a long transaction's
    -- repeated compactions). Sums are unchanged, so readers never notice.
    CREATE FUNCTION office_tallies_compact(p_after bigint DEFAULT 0) RETURNS void LANGUAGE sql AS $$
      WITH fresh AS (SELECT DISTINCT grain, figure, day, key FROM office_tallies WHERE NOT compacted AND id > p_after),
      gone AS (
        DELETE FROM office_tallies t USING fresh f
        WHERE t.grain = f.grain AND t.figure = f.figure AND t.day = f.day AND t.key = f.key
        RETURNING t.grain, t.figure, t.day, t.key, t.amount
      )
      INSERT INTO office_tallies (grain, figure, day, key, amount, compacted)
      SELECT grain, figure, day, key, sum(amount), true FROM gone GROUP BY 1, 2, 3, 4 HAVING sum(amount) <> 0
    $$;

    /*
     * Called by every tally trigger. When compaction runs changes no figure, only how many rows
     * a reader adds up, so about one call in 32 looks whether 256 fresh rows wait. One compaction
     * at a time (the others skip), and only under READ COMMITTED so that a stricter transaction
     * never meets a row another compaction removed. A transaction that compacts more than once
     * (a bulk load) remembers how far it got, so it never rereads the rows it already merged.
     */
    CREATE FUNCTION office_tallies_maybe_compact() RETURNS void LANGUAGE plpgsql AS $$
    DECLARE mark bigint;
    BEGIN
      IF random() >= 1.0 / 32 OR current_setting('transaction_isolation') <> 'read committed' THEN RETURN; END IF;
      mark := coalesce(nullif(current_setting('office.compacted_to', true), ''), '0')::bigint;
      IF (SELECT count(*) FROM (SELECT 1 FROM office_tallies WHERE NOT compacted AND id > mark LIMIT 256) f) >= 256
         AND pg_try_advisory_xact_lock(727002) THEN
        PERFORM office_tallies_compact(mark);
        PERFORM set_config('office.compacted_to', coalesce((SELECT max(id) FROM office_tallies), mark)::text, true);
      END IF;
    END $$;

    -- One dated delta, at day and month grain.
    CREATE FUNCTION office_tally(p_figure text, p_at timestamptz, p_key text, p_amount bigint) RETURNS void LANGUAGE sql AS $$
      INSERT INTO office_tallies (grain, day, figure, key, amount)
      SELECT g, CASE g WHEN 'd' THEN office_day(p_at) ELSE office_month(p_at) END, p_figure, p_key, p_amount
      FROM unnest(ARRAY['d', 'm']) AS g WHERE p_amount <> 0
    $$;

    -- An order's rehomed units and grams (by the offer of each bundle) and its postage, with a sign.
    CREATE FUNCTION office_tally_order(p_order uuid, p_at timestamptz, p_postage integer, p_sign integer) RETURNS void LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM office_tally(f.figure, p_at, f.key, f.amount * p_sign)
      FROM (
        SELECT 'units' AS figure, coalesce(b.offer, '') AS key, sum(i.quantity)::bigint AS amount
        FROM order_items i JOIN bundles b ON b.id = i.bundle_id WHERE i.order_id = p_order GROUP BY b.offer
        UNION ALL
        SELECT 'grams', coalesce(b.offer, ''), sum(i.quantity * i.weight_grams)::bigint
        FROM order_items i JOIN bundles b ON b.id = i.bundle_id WHERE i.order_id = p_order GROUP BY b.offer
        UNION ALL
        SELECT 'postage', '', p_postage::bigint
      ) f;
    END $$;

    CREATE FUNCTION office_orders_tally() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE paid constant text[] := ARRAY['confirmed', 'posted', 'received', 'handed_over'];
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') AND OLD.state = ANY (paid) THEN
        PERFORM office_tally_order(OLD.id, OLD.paid_at, OLD.postage_minor, -1);
      END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') AND NEW.state = ANY (paid) THEN
        PERFORM office_tally_order(NEW.id, NEW.paid_at, NEW.postage_minor, 1);
      END IF;
      PERFORM office_tallies_maybe_compact();
      RETURN NULL;
    END $$;
    CREATE TRIGGER orders_office_tally_insert AFTER INSERT ON orders FOR EACH ROW EXECUTE FUNCTION office_orders_tally();
    CREATE TRIGGER orders_office_tally_update AFTER UPDATE OF state, paid_at, postage_minor ON orders FOR EACH ROW
      WHEN (OLD.state IS DISTINCT FROM NEW.state OR OLD.paid_at IS DISTINCT FROM NEW.paid_at OR OLD.postage_minor IS DISTINCT FROM NEW.postage_minor)
      EXECUTE FUNCTION office_orders_tally();
    -- Before the delete, while the order's lines are still there (the cascade then finds no order to count them against).
    CREATE FUNCTION office_orders_untally() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF OLD.state IN ('confirmed', 'posted', 'received', 'handed_over') THEN
        PERFORM office_tally_order(OLD.id, OLD.paid_at, OLD.postage_minor, -1);
      END IF;
      RETURN OLD;
    END $$;
    CREATE TRIGGER orders_office_tally_delete BEFORE DELETE ON orders FOR EACH ROW EXECUTE FUNCTION office_orders_untally();

    CREATE FUNCTION office_order_items_tally() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE o record; offer text;
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN
        SELECT state, paid_at INTO o FROM orders WHERE id = OLD.order_id;
        IF FOUND AND o.state IN ('confirmed', 'posted', 'received', 'handed_over') THEN
          SELECT coalesce(b.offer, '') INTO offer FROM bundles b WHERE b.id = OLD.bundle_id;
          PERFORM office_tally('units', o.paid_at, offer, -OLD.quantity);
          PERFORM office_tally('grams', o.paid_at, offer, -(OLD.quantity * OLD.weight_grams));
        END IF;
      END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') THEN
        SELECT state, paid_at INTO o FROM orders WHERE id = NEW.order_id;
        IF FOUND AND o.state IN ('confirmed', 'posted', 'received', 'handed_over') THEN
          SELECT coalesce(b.offer, '') INTO offer FROM bundles b WHERE b.id = NEW.bundle_id;
          PERFORM office_tally('units', o.paid_at, offer, NEW.quantity);
          PERFORM office_tally('grams', o.paid_at, offer, NEW.quantity * NEW.weight_grams);
        END IF;
      END IF;
      PERFORM office_tallies_maybe_compact();
      RETURN NULL;
    END $$;
    CREATE TRIGGER order_items_office_tally AFTER INSERT OR UPDATE OR DELETE ON order_items FOR EACH ROW EXECUTE FUNCTION office_order_items_tally();

    -- A standing starter claim with no order of its own is one 'starter' unit of the bundle's weight.
    CREATE FUNCTION office_starter_claims_tally() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE grams bigint;
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') AND OLD.state <> 'cancelled' AND OLD.order_id IS NULL THEN
        SELECT coalesce(weight_grams, 0) INTO grams FROM bundles WHERE id = OLD.bundle_id;
        PERFORM office_tally('units', OLD.claimed_at, 'starter', -1);
        PERFORM office_tally('grams', OLD.claimed_at, 'starter', -grams);
      END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') AND NEW.state <> 'cancelled' AND NEW.order_id IS NULL THEN
        SELECT coalesce(weight_grams, 0) INTO grams FROM bundles WHERE id = NEW.bundle_id;
        PERFORM office_tally('units', NEW.claimed_at, 'starter', 1);
        PERFORM office_tally('grams', NEW.claimed_at, 'starter', grams);
      END IF;
      PERFORM office_tallies_maybe_compact();
      RETURN NULL;
    END $$;
    CREATE TRIGGER starter_claims_office_tally_insert AFTER INSERT OR DELETE ON starter_claims FOR EACH ROW EXECUTE FUNCTION office_starter_claims_tally();
    CREATE TRIGGER starter_claims_office_tally_update AFTER UPDATE OF state, order_id, claimed_at, bundle_id ON starter_claims FOR EACH ROW
      WHEN (OLD.state IS DISTINCT FROM NEW.state OR OLD.order_id IS DISTINCT FROM NEW.order_id
            OR OLD.claimed_at IS DISTINCT FROM NEW.claimed_at OR OLD.bundle_id IS DISTINCT FROM NEW.bundle_id)
      EXECUTE FUNCTION office_starter_claims_tally();

    -- The ledger's figures, by the same filters the dashboard and the statement used on the entries.
    CREATE FUNCTION office_ledger_deltas(p_kind text, p_reverses text, p_account text, p_amount integer)
    RETURNS TABLE (key text, amount bigint) LANGUAGE sql IMMUTABLE AS $$
      SELECT k, a FROM (VALUES
        ('charges', CASE WHEN p_kind = 'charge' THEN -p_amount::bigint END),
        ('fees', CASE WHEN p_account = 'guild' AND (p_kind = 'guild_fee' OR p_reverses = 'guild_fee') THEN p_amount::bigint END),
        ('refunds', CASE WHEN p_account = 'buyer' AND p_kind = 'refund' THEN p_amount::bigint END),
        ('processing', CASE WHEN p_account = 'processor' THEN p_amount::bigint END),
        ('payouts', CASE WHEN p_account = 'payouts' THEN p_amount::bigint END),
        ('credits', CASE WHEN p_account LIKE 'seller:%' AND p_kind <> 'payout' THEN p_amount::bigint END)
      ) v(k, a) WHERE a IS NOT NULL AND a <> 0
    $$;
    CREATE FUNCTION office_ledger_tally_entry(e ledger_entries, p_sign integer) RETURNS void LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM office_tally('money', e.created_at, d.key, d.amount * p_sign) FROM office_ledger_deltas(e.kind, e.reverses, e.account, e.amount_minor) d;
      INSERT INTO office_tallies (grain, day, figure, key, amount)
      SELECT g, CASE g WHEN 'm' THEN office_month(e.created_at) ELSE '-infinity'::date END, 'balance', e.account, e.amount_minor::bigint * p_sign
      FROM unnest(ARRAY['m', 't']) AS g WHERE e.account LIKE 'seller:%' AND e.amount_minor <> 0;
    END $$;
    CREATE FUNCTION office_ledger_tally() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN PERFORM office_ledger_tally_entry(OLD, -1); END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') THEN PERFORM office_ledger_tally_entry(NEW, 1); END IF;
      PERFORM office_tallies_maybe_compact();
      RETURN NULL;
    END $$;
    CREATE TRIGGER ledger_entries_office_tally AFTER INSERT OR UPDATE OR DELETE ON ledger_entries FOR EACH ROW EXECUTE FUNCTION office_ledger_tally();

    -- A bundle's own figures: on the shelf (by value and by cut), expired, review time.
    CREATE FUNCTION office_bundle_tally_row(b bundles, p_sign integer) RETURNS void LANGUAGE plpgsql AS $$
    BEGIN
      INSERT INTO office_tallies (grain, day, figure, key, amount)
      SELECT 't', '-infinity'::date, 'shelf_value', coalesce(b.colour_value, 'unknown'), p_sign WHERE b.state = 'on_shelf'
      UNION ALL
      SELECT 't', '-infinity'::date, 'shelf_cut', cut, p_sign FROM unnest(b.cut_kinds) AS cut WHERE b.state = 'on_shelf';
      IF b.state = 'expired' THEN PERFORM office_tally('expired', b.expires_at, '', p_sign); END IF;
      IF b.reviewed_at IS NOT NULL AND b.submitted_at IS NOT NULL THEN
        PERFORM office_tally('review', b.reviewed_at, review_time_bucket(b.submitted_at, b.reviewed_at)::text, p_sign);
      END IF;
    END $$;
    CREATE FUNCTION office_bundles_tally() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN PERFORM office_bundle_tally_row(OLD, -1); END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') THEN PERFORM office_bundle_tally_row(NEW, 1); END IF;
      IF TG_OP = 'UPDATE' AND OLD.offer IS DISTINCT FROM NEW.offer THEN
        -- Units and grams already counted for this bundle's lines move to the new offer.
        PERFORM office_tally(f.figure, o.paid_at, f.key, f.amount)
        FROM order_items i JOIN orders o ON o.id = i.order_id
        CROSS JOIN LATERAL (VALUES ('units', coalesce(OLD.offer, ''), -i.quantity::bigint), ('grams', coalesce(OLD.offer, ''), -(i.quantity * i.weight_grams)::bigint),
                                   ('units', coalesce(NEW.offer, ''), i.quantity::bigint), ('grams', coalesce(NEW.offer, ''), (i.quantity * i.weight_grams)::bigint)) f(figure, key, amount)
        WHERE i.bundle_id = NEW.id AND o.state IN ('confirmed', 'posted', 'received', 'handed_over');
      END IF;
      IF TG_OP = 'UPDATE' AND OLD.weight_grams IS DISTINCT FROM NEW.weight_grams THEN
        -- A standing starter claim weighs what its bundle weighs.
        PERFORM office_tally('grams', c.claimed_at, 'starter', coalesce(NEW.weight_grams, 0)::bigint - coalesce(OLD.weight_grams, 0))
        FROM starter_claims c WHERE c.bundle_id = NEW.id AND c.state <> 'cancelled' AND c.order_id IS NULL;
      END IF;
      PERFORM office_tallies_maybe_compact();
      RETURN NULL;
    END $$;
    CREATE TRIGGER bundles_office_tally_insert AFTER INSERT OR DELETE ON bundles FOR EACH ROW EXECUTE FUNCTION office_bundles_tally();
    CREATE TRIGGER bundles_office_tally_update AFTER UPDATE OF state, colour_value, cut_kinds, expires_at, reviewed_at, submitted_at, offer, weight_grams ON bundles FOR EACH ROW
      WHEN (OLD.state IS DISTINCT FROM NEW.state OR OLD.colour_value IS DISTINCT FROM NEW.colour_value OR OLD.cut_kinds IS DISTINCT FROM NEW.cut_kinds
            OR OLD.expires_at IS DISTINCT FROM NEW.expires_at OR OLD.reviewed_at IS DISTINCT FROM NEW.reviewed_at
            OR OLD.submitted_at IS DISTINCT FROM NEW.submitted_at OR OLD.offer IS DISTINCT FROM NEW.offer OR OLD.weight_grams IS DISTINCT FROM NEW.weight_grams)
      EXECUTE FUNCTION office_bundles_tally();

    -- Every tally recomputed from the base tables, one row per (grain, day, figure, key): the
    -- backfill below, and what tests compare office_tallies against.
    CREATE FUNCTION office_tallies_expected() RETURNS TABLE (grain char(1), day date, figure text, key text, amount bigint) LANGUAGE sql STABLE AS $$
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

    /*
     * The tallies of the period [p_from, p_to) (UTC midnights; null is open): whole months from
     * the month rows, the days before the first and after the last whole month from the day rows.
     */
    CREATE FUNCTION office_period_tallies(p_from timestamptz, p_to timestamptz, p_figures text[])
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
      )
      SELECT t.figure, t.key, sum(t.amount)::bigint
      FROM office_tallies t, bounds b
      WHERE t.figure = ANY (p_figures)
        AND ((t.grain = 'm' AND t.day >= b.m_from AND t.day < b.m_to)
          OR (t.grain = 'd' AND t.day >= b.d_from AND t.day < least(b.m_from, b.d_to))
          OR (t.grain = 'd' AND t.day >= greatest(b.m_to, b.d_from) AND t.day < b.d_to))
      GROUP BY 1, 2 HAVING sum(t.amount) <> 0
    $$;

    /*
     * The median review time in seconds of bundles reviewed in [p_from, p_to), exactly as
     * percentile_cont(0.5) over every one of them gives it: the bucket counts say which
     * bucket holds the middle one or two, and only that bucket's bundles are read.
     */
    CREATE FUNCTION office_review_median_seconds(p_from timestamptz, p_to timestamptz) RETURNS double precision LANGUAGE plpgsql STABLE AS $$
    DECLARE
      lo_from constant timestamptz := coalesce(p_from, '-infinity');
      hi_to constant timestamptz := coalesce(p_to, 'infinity');
      buckets integer[];
      counts bigint[];
      total bigint;
      positions bigint[];
      picked double precision[] := '{}';
      pos bigint;
      below bigint;
      bucket integer;
      v double precision;
    BEGIN
      SELECT array_agg(key::integer ORDER BY key::integer), array_agg(amount ORDER BY key::integer), sum(amount)
      INTO buckets, counts, total FROM office_period_tallies(p_from, p_to, ARRAY['review']);
      IF total IS NULL OR total <= 0 THEN RETURN NULL; END IF;
      -- The middle one (odd count) or two (even count), counted from 0.
      positions := CASE WHEN total % 2 = 1 THEN ARRAY[(total - 1) / 2] ELSE ARRAY[total / 2 - 1, total / 2] END;
      FOREACH pos IN ARRAY positions LOOP
        below := 0;
        FOR i IN 1 .. array_length(buckets, 1) LOOP
          bucket := buckets[i];
          EXIT WHEN pos < below + counts[i];
          below := below + counts[i];
        END LOOP;
        SELECT extract(epoch FROM reviewed_at - submitted_at)::double precision INTO v FROM bundles
        WHERE review_time_bucket(submitted_at, reviewed_at) = bucket AND reviewed_at >= lo_from AND reviewed_at < hi_to
          AND reviewed_at IS NOT NULL AND submitted_at IS NOT NULL
        ORDER BY 1 OFFSET pos - below LIMIT 1;
        picked := picked || v;
      END LOOP;
      -- The same interpolation percentile_cont makes over all of them, made over the middle ones.
      RETURN (SELECT percentile_cont(0.5) WITHIN GROUP (ORDER BY x) FROM unnest(picked) AS x);
    END $$;

    INSERT INTO office_tallies (grain, day, figure, key, amount, compacted) SELECT *, true FROM office_tallies_expected();
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP TRIGGER IF EXISTS bundles_office_tally_update ON bundles;
    DROP TRIGGER IF EXISTS bundles_office_tally_insert ON bundles;
    DROP TRIGGER IF EXISTS ledger_entries_office_tally ON ledger_entries;
    DROP TRIGGER IF EXISTS starter_claims_office_tally_update ON starter_claims;
    DROP TRIGGER IF EXISTS starter_claims_office_tally_insert ON starter_claims;
    DROP TRIGGER IF EXISTS order_items_office_tally ON order_items;
    DROP TRIGGER IF EXISTS orders_office_tally_delete ON orders;
    DROP TRIGGER IF EXISTS orders_office_tally_update ON orders;
    DROP TRIGGER IF EXISTS orders_office_tally_insert ON orders;
    DROP FUNCTION IF EXISTS office_review_median_seconds(timestamptz, timestamptz);
    DROP FUNCTION IF EXISTS office_period_tallies(timestamptz, timestamptz, text[]);
    DROP FUNCTION IF EXISTS office_tallies_expected();
    DROP FUNCTION IF EXISTS office_bundles_tally();
    DROP FUNCTION IF EXISTS office_bundle_tally_row(bundles, integer);
    DROP FUNCTION IF EXISTS office_ledger_tally();
    DROP FUNCTION IF EXISTS office_ledger_tally_entry(ledger_entries, integer);
    DROP FUNCTION IF EXISTS office_ledger_deltas(text, text, text, integer);
    DROP FUNCTION IF EXISTS office_starter_claims_tally();
    DROP FUNCTION IF EXISTS office_order_items_tally();
    DROP FUNCTION IF EXISTS office_orders_untally();
    DROP FUNCTION IF EXISTS office_orders_tally();
    DROP FUNCTION IF EXISTS office_tally_order(uuid, timestamptz, integer, integer);
    DROP FUNCTION IF EXISTS office_tally(text, timestamptz, text, bigint);
    DROP FUNCTION IF EXISTS office_tallies_maybe_compact();
    DROP FUNCTION IF EXISTS office_tallies_compact(bigint);
    DROP INDEX IF EXISTS starter_claims_standing;
    DROP INDEX IF EXISTS bundles_review_buckets;
    DROP FUNCTION IF EXISTS review_time_bucket(timestamptz, timestamptz);
    DROP FUNCTION IF EXISTS office_month(timestamptz);
    DROP FUNCTION IF EXISTS office_day(timestamptz);
    DROP TABLE IF EXISTS office_tallies;
  `);
};
