import { Sequelize } from 'sequelize';

export function createSequelize(databaseUrl: string, options: { poolMax?: number } = {}): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: options.poolMax ?? 10, min: 0, idle: 10_000, acquire: 10_000 },
    define: { underscored: true, timestamps: true },
    dialectOptions: { application_name: 'scrap-relay-api' },
  });
}
