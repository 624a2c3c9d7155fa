import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * When the seller of a paid order to be posted was reminded to post it (`remindUnposted`): set once, under the
 * order's row lock, so two API processes running the job send one reminder between them.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE orders ADD COLUMN post_reminder_sent_at timestamptz`);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE orders DROP COLUMN post_reminder_sent_at`);
};
