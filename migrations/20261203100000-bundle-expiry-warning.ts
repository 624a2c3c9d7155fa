import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/**
 * The shelf end a seller was warned about (apps/api/src/jobs/scheduled.ts `warnBundlesLeavingShelf`). Recording
 * the `expires_at` the warning was for, not a flag, means a relisted bundle (a new `expires_at`) is warned again
 * without anything having to clear it, and a bundle is never warned twice about the same end.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE bundles ADD COLUMN expiry_warned_for timestamptz`);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE bundles DROP COLUMN expiry_warned_for`);
};
