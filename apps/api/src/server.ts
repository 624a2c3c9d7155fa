import { pino } from 'pino';
import { loadConfig } from './config/index.ts';
import { createRuntime } from './runtime.ts';

async function main() {
  const config = loadConfig();
  // Log lines are gathered up to 4 kB and written at least once a second (and at exit), instead of one
  // write to stdout per line: under load that write was a system call per request.
  const destination = pino.destination({ dest: 1, minLength: 4096, sync: false });
  setInterval(() => destination.flush(), 1000).unref();
  const logger = pino({ level: config.logLevel }, destination);
  const runtime = await createRuntime(config, { logger });
  const server = runtime.app.listen(config.port, '127.0.0.1', () => logger.info({ port: config.port }, 'Scrap Relay API listening'));
  server.on('error', (err) => {
    logger.fatal({ err }, 'could not listen');
    process.exit(1);
  });

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'shutting down');
    server.close();
    server.closeIdleConnections();
    await runtime.close();
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('unhandledRejection', (err) => logger.error({ err }, 'unhandled rejection'));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
