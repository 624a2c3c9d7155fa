import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * A dispute's standing fee is the sum of its balance movements' fees (`fee_movements`), so the model derives it
 * and the column that repeated it goes.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE order_disputes DROP COLUMN fee_minor`);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE order_disputes ADD COLUMN fee_minor integer NOT NULL DEFAULT 0;
    UPDATE order_disputes d SET fee_minor = coalesce((SELECT sum(value::integer) FROM jsonb_each_text(d.fee_movements)), 0);
  `);
};
