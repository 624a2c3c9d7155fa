import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * Indexes for the shelf at guild scale, found with `npm run bench -- shelf`
 * (docs/PERFORMANCE.md has the plans before and after).
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    -- Sales sorted by price: bundles_shelf_price puts every free bundle (no price, NULLS FIRST) ahead
    -- of the first sale, so a sale-only page walked through all of them before finding a match.
    CREATE INDEX bundles_shelf_offer_price ON bundles (offer, price_minor NULLS FIRST, id) WHERE state = 'on_shelf';
    -- The shelf counts the matches of every query: with the filterable columns in one index, counts
    -- by offer, fibre, colour, weight and price read the index alone instead of the whole table.
    CREATE INDEX bundles_shelf_facets ON bundles (offer, fibre, colour_value, colour_family, weight_grams, price_minor)
      WHERE state = 'on_shelf';
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP INDEX IF EXISTS bundles_shelf_facets;
    DROP INDEX IF EXISTS bundles_shelf_offer_price;
  `);
};
