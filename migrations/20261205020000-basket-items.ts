import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * A member's basket, kept on the server so it follows them from the phone at a meeting to the computer at home.
 * One line per bundle; nothing is held for the member until checkout. A line goes with its member or its bundle.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE basket_items (
      member_id uuid NOT NULL REFERENCES members(id) ON DELETE CASCADE,
      bundle_id uuid NOT NULL REFERENCES bundles(id) ON DELETE CASCADE,
      quantity integer NOT NULL CHECK (quantity BETWEEN 1 AND 50),
      added_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (member_id, bundle_id)
    );
    CREATE INDEX basket_items_bundle ON basket_items (bundle_id);
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`DROP TABLE IF EXISTS basket_items`);
};
