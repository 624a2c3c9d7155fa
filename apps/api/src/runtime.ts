import pg from 'pg';
import { pino, type Logger } from 'pino';
import type { Express } from 'express';
import type { Config } from './config/index.ts';
import type { AppContext } from './context.ts';
import { createApp } from './app.ts';
import { initModels, Member } from './db/models/index.ts';
import { createSequelize } from './db/sequelize.ts';
import { createMailer } from './integrations/mailer.ts';
import { createJobQueue } from './jobs/queue.ts';
import { startScheduledJobs } from './jobs/scheduled.ts';
import { localStorage } from './integrations/storage.ts';
import { createStripe } from './integrations/payments.ts';

export interface Runtime {
  app: Express;
  ctx: AppContext;
  pool: pg.Pool;
  close(): Promise<void>;
}

/**
 * Wires config, database, job queue and app together; server.ts and the integration tests both start here.
 * Sequelize models are bound to one connection per process, so a process holds one runtime at a time.
 */
export async function createRuntime(
  config: Config,
  options: { logger?: Logger; now?: () => Date; workers?: boolean; pollingIntervalSeconds?: number } = {},
): Promise<Runtime> {
  const logger = options.logger ?? pino({ level: config.logLevel });
  const sequelize = createSequelize(config.databaseUrl);
  initModels(sequelize);
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 5, application_name: 'scrap-relay-sessions' });
  pool.on('error', (err) => logger.error({ err }, 'session pool error'));
  const mailer = createMailer(config.smtp);
  const queue = await createJobQueue({
    databaseUrl: config.databaseUrl,
    mailer,
    logger,
    pollingIntervalSeconds: options.pollingIntervalSeconds,
    wanted: async (mail) => {
      if (!mail.kind) return true;
      const member = await Member.findOne({ where: { email: mail.to } });
      return member?.emailPreferences[mail.kind] !== false;
    },
  });
  const storage = localStorage(config.uploadDir);
  const stripe = createStripe(config.stripe);
  const ctx: AppContext = { config, sequelize, queue, storage, stripe, logger, now: options.now ?? (() => new Date()) };
  if (options.workers !== false) {
    await queue.startWorkers();
    await startScheduledJobs(ctx);
  }
  const app = createApp(ctx, pool);

  return {
    app,
    ctx,
    pool,
    async close() {
      await queue.stop();
      mailer.close();
      await pool.end();
      await sequelize.close();
    },
  };
}
