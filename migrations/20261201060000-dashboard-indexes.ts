import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * Indexes for the guild office's dashboard at scale, found with
 * `npm run bench -- dashboard` (docs/PERFORMANCE.md has the figures). Each
 * lets a dashboard figure read a small index instead of the whole bundles
 * table (about 100 MB at 170 000 bundles, most of it descriptions and the
 * search vector).
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    -- "Bundles expired in the period": nothing served state = 'expired', so every request scanned the table.
    CREATE INDEX bundles_expired ON bundles (expires_at) WHERE state = 'expired';
    -- Median review time, for the period and by month: both columns in the index, so the figures come from it alone.
    CREATE INDEX bundles_review_times ON bundles (reviewed_at) INCLUDE (submitted_at)
      WHERE reviewed_at IS NOT NULL AND submitted_at IS NOT NULL;
    -- "Shelf by cut": the shelf's cut lists, unnested and counted from the index alone.
    CREATE INDEX bundles_shelf_cut_lists ON bundles (cut_kinds) WHERE state = 'on_shelf';
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP INDEX IF EXISTS bundles_shelf_cut_lists;
    DROP INDEX IF EXISTS bundles_review_times;
    DROP INDEX IF EXISTS bundles_expired;
  `);
};
