import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * The standard sizes a bag of strips or squares holds (CUT_SIZES in packages/shared/src/domain/fibres.ts),
 * so the shelf and wishes can ask for "2½-inch strips" rather than strips of any width. A GIN index on the
 * shelf's bundles answers `cut_sizes @> ARRAY[…]` as the cut kinds' index does.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE bundles ADD COLUMN cut_sizes text[] NOT NULL DEFAULT '{}'
      CHECK (cut_sizes <@ ARRAY['strip_1_5', 'strip_2', 'strip_2_5', 'strip_3_5', 'strip_5', 'square_2_5', 'square_5', 'square_10']::text[]);
    CREATE INDEX bundles_shelf_cut_sizes ON bundles USING gin (cut_sizes) WHERE state = 'on_shelf';
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP INDEX bundles_shelf_cut_sizes;
    ALTER TABLE bundles DROP COLUMN cut_sizes;
  `);
};
