import Stripe from 'stripe';
import type { Config } from '../config/index.ts';

/**
 * The Stripe client. Locally host, port and protocol point it at our stand-in
 * (docker-local/stripe-fake); in production they are unset and it talks to Stripe.
 */
export function createStripe(config: Config['stripe']): Stripe {
  return new Stripe(config.secretKey, {
    ...(config.host && { host: config.host }),
    ...(config.port && { port: config.port }),
    ...(config.protocol && { protocol: config.protocol }),
    maxNetworkRetries: 1,
    timeout: 10_000,
  });
}

/** A failure to reach the payment service at all, as opposed to a refusal from it. */
export function isUnreachable(err: unknown): boolean {
  return err instanceof Stripe.errors.StripeConnectionError || err instanceof Stripe.errors.StripeAPIError;
}
