import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/** When the halfway reminder of a starter-bundle offer went out; set once, under the offer's row lock. */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE waitlist_offers ADD COLUMN reminder_sent_at timestamptz;
    CREATE INDEX waitlist_offers_open_unreminded ON waitlist_offers (expires_at) WHERE status = 'open' AND reminder_sent_at IS NULL;
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE waitlist_offers DROP COLUMN IF EXISTS reminder_sent_at;`);
};
