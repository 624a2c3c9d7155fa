import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/** `office_day`, `office_month` and the period sums, reading days in `zone` (an SQL expression giving a zone name). */
const zonedFunctions = (zone: string, volatility: 'IMMUTABLE' | 'STABLE') => `
  CREATE OR REPLACE FUNCTION office_day(p_at timestamptz) RETURNS date LANGUAGE sql ${volatility} AS
    $$ SELECT coalesce((p_at AT TIME ZONE ${zone})::date, '-infinity'::date) $$;
  CREATE OR REPLACE FUNCTION office_month(p_at timestamptz) RETURNS date LANGUAGE sql ${volatility} AS
    $$ SELECT coalesce(date_trunc('month', p_at AT TIME ZONE ${zone})::date, '-infinity'::date) $$;

  /*
   * The tallies of the period [p_from, p_to) (midnights of the days the tallies are kept in; null is open):
   * whole months from the month rows, the days before the first and after the last whole month from the day rows.
   */
  CREATE OR REPLACE FUNCTION office_period_tallies(p_from timestamptz, p_to timestamptz, p_figures text[])
  RETURNS TABLE (figure text, key text, amount bigint) LANGUAGE sql STABLE AS $$
    WITH bounds AS (
      SELECT d_from, d_to, m_from, greatest(m_from, m_to) AS m_to FROM (
        SELECT coalesce((p_from AT TIME ZONE z)::date, '-infinity'::date) AS d_from,
               coalesce((p_to AT TIME ZONE z)::date, 'infinity'::date) AS d_to,
               CASE WHEN p_from IS NULL THEN '-infinity'::date
                    WHEN extract(day FROM p_from AT TIME ZONE z) = 1 THEN (p_from AT TIME ZONE z)::date
                    ELSE (date_trunc('month', p_from AT TIME ZONE z) + interval '1 month')::date END AS m_from,
               CASE WHEN p_to IS NULL THEN 'infinity'::date ELSE date_trunc('month', p_to AT TIME ZONE z)::date END AS m_to
        FROM (SELECT ${zone} AS z) zone
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
  $$;`;

/**
 * The guild office's days and months are the guild's, in its time zone (guild.settings->>'timeZone', UTC when
 * unset), as the ledger's day filter already is, so November's statement and the ledger filtered to 1–30
 * November add up the same entries. `office_day` and `office_month` now read the guild's row, so they are
 * STABLE rather than IMMUTABLE; no index or generated column uses them (the tally tables index `day`, a plain
 * column the triggers fill in), so nothing has to be rebuilt but the tallies themselves.
 *
 * `office_tallies_rebuild()` recomputes every tally from the base tables; the migration uses it to bucket the
 * existing rows by the guild's days, and the guild's settings use it whenever the time zone changes.
 *
 * Why it locks what it locks: the triggers compute each delta's day from the zone they read when the change is
 * written, and insert it in the writer's transaction. A rebuild that only deleted and re-inserted the rows could
 * (a) miss, or count twice, a change committed between its DELETE and its INSERT (each statement of a READ
 * COMMITTED transaction sees a new snapshot; a delta uncommitted at the DELETE survives it, and its base row may
 * be visible to the INSERT), and (b) keep deltas bucketed by the old zone from writers still in flight. So the
 * rebuild first takes SHARE ROW EXCLUSIVE on every table the triggers read from and on office_tallies: it
 * conflicts with the ROW EXCLUSIVE lock every INSERT/UPDATE/DELETE holds until its transaction ends (so the
 * rebuild waits for every writer in flight to commit or roll back, and new writers wait for the rebuild's
 * transaction), and with itself (two rebuilds take turns); plain reads, the dashboard's among them, go on and
 * see the old tallies until the rebuild commits, then the new ones. After the locks, the rebuild's next
 * statement sees every committed change and none in flight; a writer that waited takes its statement snapshot
 * after getting its lock, so it sees the new zone. The tables are locked in one fixed order so two rebuilds
 * never deadlock. (A REPEATABLE READ or SERIALIZABLE writer whose snapshot predates the change would still read
 * the old zone; the API writes only READ COMMITTED.)
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DO $$ BEGIN
      IF EXISTS (
        SELECT 1 FROM pg_depend d JOIN pg_proc p ON p.oid = d.refobjid
        WHERE d.refclassid = 'pg_proc'::regclass AND p.proname IN ('office_day', 'office_month') AND d.classid IN ('pg_class'::regclass, 'pg_attrdef'::regclass)
      ) THEN
        RAISE EXCEPTION 'An index or generated column uses office_day or office_month; drop it before they read the guild''s zone.';
      END IF;
    END $$;

    -- The guild's time zone: the days and months the office counts in.
    CREATE FUNCTION office_zone() RETURNS text LANGUAGE sql STABLE AS
      $$ SELECT coalesce((SELECT settings->>'timeZone' FROM guild WHERE id = 1), 'UTC') $$;
    ${zonedFunctions('office_zone()', 'STABLE')}

    CREATE FUNCTION office_tallies_rebuild() RETURNS void LANGUAGE plpgsql AS $$
    BEGIN
      LOCK TABLE bundles, orders, order_items, starter_claims, ledger_entries, office_tallies IN SHARE ROW EXCLUSIVE MODE;
      DELETE FROM office_tallies;
      INSERT INTO office_tallies (grain, day, figure, key, amount, compacted)
      SELECT grain, day, figure, key, amount, true FROM office_tallies_expected();
    END $$;

    SELECT office_tallies_rebuild();
  `);
};

/** Back to UTC days, IMMUTABLE as they were, and the tallies bucketed by them again. */
export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ${zonedFunctions(`'UTC'`, 'IMMUTABLE')}
    SELECT office_tallies_rebuild();
    DROP FUNCTION office_tallies_rebuild();
    DROP FUNCTION office_zone();
  `);
};
