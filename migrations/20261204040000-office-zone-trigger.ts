import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * The office's tallies are bucketed by the guild's days (migration 20261204030000), so whenever the guild's time
 * zone is set or changes they are rebuilt, in the transaction that changes it, by the database itself: every way
 * of changing the guild row (the settings page, a script, a test) keeps the figures in one zone. The rebuild's
 * locks are office_tallies_rebuild()'s own; the row is visible to it, so it reads the new zone.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE FUNCTION office_zone_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM office_tallies_rebuild();
      RETURN NULL;
    END $$;
    CREATE TRIGGER guild_zone_changed AFTER UPDATE OF settings ON guild FOR EACH ROW
      WHEN ((OLD.settings->>'timeZone') IS DISTINCT FROM (NEW.settings->>'timeZone'))
      EXECUTE FUNCTION office_zone_changed();
    CREATE TRIGGER guild_zone_set AFTER INSERT ON guild FOR EACH ROW
      WHEN (coalesce(NEW.settings->>'timeZone', 'UTC') <> 'UTC')
      EXECUTE FUNCTION office_zone_changed();
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP TRIGGER guild_zone_set ON guild;
    DROP TRIGGER guild_zone_changed ON guild;
    DROP FUNCTION office_zone_changed();
  `);
};
