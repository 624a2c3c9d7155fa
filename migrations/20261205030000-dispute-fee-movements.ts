import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * The card service's balance movements a dispute has reported, by id, with each one's fee: news can arrive late or
 * out of order (the fee given back with a win comes in its own event after the decision), so the fee booked is the
 * sum over every movement seen so far, and a snapshot that lacks one never takes its fee back out.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE order_disputes ADD COLUMN fee_movements jsonb NOT NULL DEFAULT '{}'::jsonb`);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE order_disputes DROP COLUMN IF EXISTS fee_movements`);
};
