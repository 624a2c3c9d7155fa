import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/** A starter claim the guild posts is paid (postage only) through an order; the claim points at it. */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE starter_claims ADD COLUMN order_id uuid REFERENCES orders(id);
    CREATE INDEX starter_claims_order ON starter_claims (order_id) WHERE order_id IS NOT NULL;
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE starter_claims DROP COLUMN IF EXISTS order_id;`);
};
