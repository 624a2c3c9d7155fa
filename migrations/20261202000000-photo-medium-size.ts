import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

/** An 800 px size between the thumbnail and the display size; photos stored before it have none (null). */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE bundle_photos ADD COLUMN medium_key text;`);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`ALTER TABLE bundle_photos DROP COLUMN IF EXISTS medium_key;`);
};
