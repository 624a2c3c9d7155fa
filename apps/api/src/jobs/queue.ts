import PgBoss from 'pg-boss';
import type { Transaction } from 'sequelize';
import type { ClientBase } from 'pg';
import type { Logger } from 'pino';
import type { Mailer, OutgoingMail } from '../integrations/mailer.ts';

export const EMAIL_QUEUE = 'email-send';
/** Refunds of payments that came in after their order was cancelled (`refundLatePayment`). */
export const LATE_REFUND_QUEUE = 'payments-refund-late';

/**
 * Twelve retries, each waiting twice as long as the one before (pg-boss 10: 5–10 s, then 10–20 s, … 2.8–5.7 h),
 * about 6 to 11 hours in all: a mail server or card service that is down delays the mail or the refund, never
 * loses it.
 */
const RETRY = { retryLimit: 12, retryDelay: 5, retryBackoff: true } as const;

export interface JobQueue {
  boss: PgBoss;
  /** Queues an e-mail; pass the transaction so the mail is queued only if the change it reports commits. */
  enqueueEmail(mail: OutgoingMail, transaction?: Transaction): Promise<void>;
  /** Queues a job that a change asks for, in the change's transaction, retried like mail. */
  enqueue(queue: typeof LATE_REFUND_QUEUE, data: object, transaction: Transaction): Promise<void>;
  startWorkers(): Promise<void>;
  stop(): Promise<void>;
}

/**
 * Runs pg-boss's SQL on the transaction's own connection, so a queued job commits or rolls
 * back with the change it belongs to. (Sequelize's bind formatting does not take pg-boss's
 * positional SQL, hence the pg client underneath.)
 */
function transactionDb(transaction: Transaction): PgBoss.Db {
  const client = (transaction as unknown as { connection: ClientBase }).connection;
  return {
    async executeSql(text, values) {
      const result = await client.query(text, values);
      return { rows: result.rows };
    },
  };
}

export async function createJobQueue(opts: {
  databaseUrl: string;
  mailer: Mailer;
  logger: Logger;
  pollingIntervalSeconds?: number;
  /** Decides at send time whether the recipient still wants this kind of mail. */
  wanted?: (mail: OutgoingMail) => Promise<boolean>;
}): Promise<JobQueue> {
  const boss = new PgBoss({ connectionString: opts.databaseUrl, max: 4, application_name: 'scrap-relay-jobs' });
  boss.on('error', (err) => opts.logger.error({ err }, 'job queue error'));
  await boss.start();
  await boss.createQueue(EMAIL_QUEUE, { name: EMAIL_QUEUE, ...RETRY });
  await boss.createQueue(LATE_REFUND_QUEUE, { name: LATE_REFUND_QUEUE, ...RETRY });

  return {
    boss,
    async enqueueEmail(mail, transaction) {
      const options: PgBoss.SendOptions = { ...RETRY };
      if (transaction) options.db = transactionDb(transaction);
      await boss.send(EMAIL_QUEUE, mail, options);
    },
    async enqueue(queue, data, transaction) {
      await boss.send(queue, data, { ...RETRY, db: transactionDb(transaction) });
    },
    async startWorkers() {
      // A batch per poll keeps a burst of wish e-mails moving; each job succeeds or fails on its own, and is
      // recorded as done the moment it is sent, so one bad address, or the process stopping half-way through a
      // batch, never makes the others go twice.
      await boss.work<OutgoingMail>(EMAIL_QUEUE, { batchSize: 20, pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 2 }, async (jobs) => {
        for (const job of jobs) {
          try {
            if (opts.wanted && !(await opts.wanted(job.data))) continue;
            await opts.mailer.send(job.data, job.id);
          } catch (err) {
            opts.logger.warn({ err, to: job.data.to }, 'e-mail not sent; it will be retried');
            await boss.fail(EMAIL_QUEUE, job.id, { message: err instanceof Error ? err.message : String(err) });
            continue;
          }
          opts.logger.info({ to: job.data.to, subject: job.data.subject }, 'e-mail sent');
          // Sent: a failure to record it (PostgreSQL restarting) only means it may go again, with the same Message-ID.
          await boss.complete(EMAIL_QUEUE, job.id).catch((err: unknown) => opts.logger.warn({ err, jobId: job.id }, 'e-mail sent, but not yet recorded as sent'));
        }
      });
    },
    async stop() {
      await boss.stop({ graceful: true, timeout: 5_000 });
    },
  };
}
