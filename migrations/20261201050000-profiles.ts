import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE members ADD COLUMN email_preferences jsonb NOT NULL DEFAULT '{}';
    ALTER TABLE members ADD COLUMN closed_at timestamptz;
    CREATE INDEX orders_paid_at ON orders (paid_at) WHERE paid_at IS NOT NULL;
    CREATE INDEX starter_claims_claimed_at ON starter_claims (claimed_at);
    CREATE INDEX bundles_reviewed_at ON bundles (reviewed_at) WHERE reviewed_at IS NOT NULL;
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP INDEX IF EXISTS bundles_reviewed_at;
    DROP INDEX IF EXISTS starter_claims_claimed_at;
    DROP INDEX IF EXISTS orders_paid_at;
    ALTER TABLE members DROP COLUMN IF EXISTS closed_at;
    ALTER TABLE members DROP COLUMN IF EXISTS email_preferences;
  `);
};
