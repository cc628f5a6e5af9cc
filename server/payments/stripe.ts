import Stripe from 'stripe';
import type { Env } from '../env';

export type { Stripe };

/**
 * The processor client: the official SDK, pointed at the payment fake unless STRIPE_API_URL names
 * another host (REFERENCES.md, Payments: "The SDK can be pointed anywhere: new Stripe(key, {host, port, protocol})").
 * `port` overrides PAYMENTS_PORT when boot started the fake on a random port. The SDK sends an
 * idempotency key on every POST and reuses it on its own retries.
 */
export function createStripeClient(env: Pick<Env, 'STRIPE_SECRET_KEY' | 'STRIPE_API_URL' | 'PAYMENTS_PORT'>, opts: { port?: number; maxNetworkRetries?: number } = {}): Stripe {
  const target = env.STRIPE_API_URL ? new URL(env.STRIPE_API_URL) : new URL(`http://127.0.0.1:${opts.port ?? env.PAYMENTS_PORT}`);
  const protocol = target.protocol === 'https:' ? 'https' : 'http';
  const port = target.port ? Number(target.port) : protocol === 'https' ? 443 : 80;
  return new Stripe(env.STRIPE_SECRET_KEY, {
    host: target.hostname,
    port: env.STRIPE_API_URL ? port : (opts.port ?? env.PAYMENTS_PORT),
    protocol,
    maxNetworkRetries: opts.maxNetworkRetries ?? 2,
    timeout: 20_000,
    appInfo: { name: 'Kitlane' },
  });
}
