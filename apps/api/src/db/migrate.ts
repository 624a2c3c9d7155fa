import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize } from 'sequelize';
import { createSequelize } from './sequelize.ts';

const MIGRATIONS_DIR = path.resolve(import.meta.dirname, '../../../../migrations');

export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: {
      glob: ['*.ts', { cwd: MIGRATIONS_DIR }],
      resolve: ({ name, path: file, context }) => ({
        name,
        up: async () => (await import(pathToFileURL(file!).href)).up({ name, path: file, context }),
        down: async () => (await import(pathToFileURL(file!).href)).down({ name, path: file, context }),
      }),
    },
    context: sequelize,
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; safe to call from several processes since each runs inside an advisory lock. */
export async function migrateUp(sequelize: Sequelize): Promise<string[]> {
  const migrator = createMigrator(sequelize);
  await sequelize.query('SELECT pg_advisory_lock(727001)');
  try {
    const done = await migrator.up();
    return done.map((m) => m.name);
  } finally {
    await sequelize.query('SELECT pg_advisory_unlock(727001)');
  }
}

async function main() {
  const direction = process.argv[2] ?? 'up';
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('Set DATABASE_URL to run migrations.');
  const sequelize = createSequelize(url, { poolMax: 1 });
  try {
    if (direction === 'up') {
      const names = await migrateUp(sequelize);
      console.log(names.length ? `Applied ${names.length} migration(s): ${names.join(', ')}` : 'Database is up to date.');
    } else if (direction === 'down') {
      const undone = await createMigrator(sequelize).down();
      console.log(`Reverted: ${undone.map((m) => m.name).join(', ') || 'nothing'}`);
    } else {
      throw new Error(`Unknown direction "${direction}"; use up or down.`);
    }
  } finally {
    await sequelize.close();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
