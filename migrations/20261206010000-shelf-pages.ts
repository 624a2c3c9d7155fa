import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * Pages of the shelf kept in PostgreSQL, so a page many members ask for (the newest bundles, a popular filter)
 * is worked out once, not once per request, and every API process shares the copy.
 *
 * A kept page is served only while no change to the shelf has committed that the page did not see, so it is
 * never out of date: each transaction that changes what the shelf shows (a bundle on the shelf, or coming on or
 * off it, or such a bundle's photos) leaves its transaction id in `shelf_changes`, and each kept page holds the
 * snapshot it was made in. A page is current when every change committed since is visible in that snapshot
 * (`pg_visible_in_snapshot`); ids are compared, not clocks, so commits in any order are right.
 *
 * A page also holds the mark of the run it was read in (`shelf_run`: a random id and the row's own xmin), and is
 * kept and served only while that mark stands. The row is unlogged like the changes: a crash (which may hand out
 * transaction ids again) or a standby taking over empties both, and the next page lays a new mark; a database
 * restored from a dump gets the row back under a new xmin. Either way nothing read before counts.
 *
 * `shelf_pages_floor` lets the prune job forget old changes: a change below the floor was visible to every kept
 * page's snapshot, and a page made in a snapshot older than the floor is not kept. The pages and the changes are
 * unlogged: a crash (or a standby taking over) empties them together, and no kept page is only a slower first
 * request. The floor's one row is logged, so it is never lost with them.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE UNLOGGED TABLE shelf_changes (xid xid8 NOT NULL);
    CREATE INDEX shelf_changes_xid ON shelf_changes (xid);

    CREATE UNLOGGED TABLE shelf_pages (
      key text PRIMARY KEY,
      snapshot pg_snapshot NOT NULL,
      run text NOT NULL,
      made_at timestamptz NOT NULL,
      etag text,
      body text NOT NULL
    );

    CREATE UNLOGGED TABLE shelf_run (
      one boolean PRIMARY KEY DEFAULT true CHECK (one),
      id uuid NOT NULL DEFAULT gen_random_uuid()
    );
    INSERT INTO shelf_run DEFAULT VALUES;

    CREATE TABLE shelf_pages_floor (
      one boolean PRIMARY KEY DEFAULT true CHECK (one),
      xid xid8 NOT NULL
    );
    INSERT INTO shelf_pages_floor (xid) VALUES (pg_snapshot_xmin(pg_current_snapshot()));

    -- One row per changing transaction, however many bundles it touches.
    CREATE FUNCTION shelf_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      INSERT INTO shelf_changes (xid) SELECT pg_current_xact_id()
      WHERE NOT EXISTS (SELECT 1 FROM shelf_changes WHERE xid = pg_current_xact_id());
      RETURN NULL;
    END $$;

    CREATE TRIGGER bundles_shelf_insert AFTER INSERT ON bundles
      FOR EACH ROW WHEN (NEW.state = 'on_shelf') EXECUTE FUNCTION shelf_changed();
    -- Every column counts but the few the shelf never shows or filters on (a column added later counts too).
    CREATE TRIGGER bundles_shelf_update AFTER UPDATE ON bundles
      FOR EACH ROW WHEN (
        (OLD.state = 'on_shelf' OR NEW.state = 'on_shelf')
        AND to_jsonb(OLD) - '{updated_at,expires_at,expiry_warned_for}'::text[]
            IS DISTINCT FROM to_jsonb(NEW) - '{updated_at,expires_at,expiry_warned_for}'::text[]
      ) EXECUTE FUNCTION shelf_changed();
    CREATE TRIGGER bundles_shelf_delete AFTER DELETE ON bundles
      FOR EACH ROW WHEN (OLD.state = 'on_shelf') EXECUTE FUNCTION shelf_changed();
    CREATE TRIGGER bundles_shelf_truncate AFTER TRUNCATE ON bundles
      FOR EACH STATEMENT EXECUTE FUNCTION shelf_changed();

    -- A card shows its bundle's first photo. Photos of bundles off the shelf change nothing on it. The bundle's row
    -- is share-locked, so a review deciding its state at the same moment is waited for, not missed.
    CREATE FUNCTION shelf_photo_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM 1 FROM bundles
      WHERE state = 'on_shelf'
        AND id IN (CASE WHEN TG_OP <> 'INSERT' THEN OLD.bundle_id END, CASE WHEN TG_OP <> 'DELETE' THEN NEW.bundle_id END)
      FOR SHARE;
      IF FOUND THEN
        INSERT INTO shelf_changes (xid) SELECT pg_current_xact_id()
        WHERE NOT EXISTS (SELECT 1 FROM shelf_changes WHERE xid = pg_current_xact_id());
      END IF;
      RETURN NULL;
    END $$;
    CREATE TRIGGER bundle_photos_shelf AFTER INSERT OR UPDATE OR DELETE ON bundle_photos
      FOR EACH ROW EXECUTE FUNCTION shelf_photo_changed();
    CREATE TRIGGER bundle_photos_shelf_truncate AFTER TRUNCATE ON bundle_photos
      FOR EACH STATEMENT EXECUTE FUNCTION shelf_changed();
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP TRIGGER IF EXISTS bundle_photos_shelf_truncate ON bundle_photos;
    DROP TRIGGER IF EXISTS bundle_photos_shelf ON bundle_photos;
    DROP FUNCTION IF EXISTS shelf_photo_changed();
    DROP TRIGGER IF EXISTS bundles_shelf_truncate ON bundles;
    DROP TRIGGER IF EXISTS bundles_shelf_delete ON bundles;
    DROP TRIGGER IF EXISTS bundles_shelf_update ON bundles;
    DROP TRIGGER IF EXISTS bundles_shelf_insert ON bundles;
    DROP FUNCTION IF EXISTS shelf_changed();
    DROP TABLE IF EXISTS shelf_pages_floor, shelf_run, shelf_pages, shelf_changes;
  `);
};
