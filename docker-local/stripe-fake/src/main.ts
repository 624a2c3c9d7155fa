/** Runs the Stripe stand-in on 127.0.0.1 from the environment (see docker-local/README.md). */
import { createServer } from 'node:http';
import { ConfigError, readConfig } from './config.ts';
import { createStripeFake } from './server.ts';

function start(): void {
  let config;
  try {
    config = readConfig(process.env);
  } catch (error) {
    if (error instanceof ConfigError) {
      console.error(error.message);
      process.exit(1);
    }
    throw error;
  }

  const fake = createStripeFake({
    publicUrl: config.publicUrl,
    webhookUrl: config.webhookUrl,
    webhookSecret: config.webhookSecret,
  });
  const server = createServer(fake.app);

  server.on('error', (error) => {
    console.error(`stripe-fake could not listen on 127.0.0.1:${config.port}: ${error.message}`);
    process.exit(1);
  });

  server.listen(config.port, '127.0.0.1', () => {
    const webhooks = config.webhookUrl ? `webhooks to ${config.webhookUrl}` : 'webhooks off (STRIPE_FAKE_WEBHOOK_URL unset; events are only logged)';
    console.log(`stripe-fake ready on http://127.0.0.1:${config.port} (payment pages at ${config.publicUrl}/pay/…, ${webhooks})`);
  });

  let stopping = false;
  const stop = (signal: NodeJS.Signals): void => {
    if (stopping) return;
    stopping = true;
    fake.close();
    server.close(() => process.exit(0));
    // Idle keep-alive connections would hold close() open.
    server.closeIdleConnections();
    setTimeout(() => {
      console.error(`stripe-fake: connections still open ${signal === 'SIGINT' ? 'after Ctrl-C' : 'after SIGTERM'}, exiting anyway`);
      process.exit(0);
    }, 3000).unref();
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

start();
