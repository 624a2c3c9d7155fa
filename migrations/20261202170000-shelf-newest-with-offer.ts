import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * The shelf leaves starter bundles out (`offer <> 'starter'`), and bundles_shelf_newest did not
 * hold the offer, so paging back through the newest bundles read a table row for every bundle an
 * OFFSET skips: page 40 read 960 rows to show 24. With the offer carried in the index, the shelf
 * statement takes the page's ids from the index alone and reads only the 24 rows it shows (the
 * whole statement for page 40, prepared, at 100 000 bundles: 0.64 → 0.42 ms in pgbench,
 * docs/PERFORMANCE.md). It replaces the index it extends.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE INDEX bundles_shelf_newest_offer ON bundles (on_shelf_at, id) INCLUDE (offer) WHERE state = 'on_shelf';
    DROP INDEX bundles_shelf_newest;
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE INDEX bundles_shelf_newest ON bundles (on_shelf_at, id) WHERE state = 'on_shelf';
    DROP INDEX bundles_shelf_newest_offer;
  `);
};
