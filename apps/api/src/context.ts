import type { Sequelize } from 'sequelize';
import type Stripe from 'stripe';
import type { Logger } from 'pino';
import type { Config } from './config/index.ts';
import type { JobQueue } from './jobs/queue.ts';
import type { FileStorage } from './integrations/storage.ts';

/** What services need from the outside world, passed explicitly rather than imported as singletons. */
export interface AppContext {
  config: Config;
  sequelize: Sequelize;
  queue: JobQueue;
  storage: FileStorage;
  stripe: Stripe;
  logger: Logger;
  now: () => Date;
}
