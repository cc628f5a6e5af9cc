import { resolve } from 'node:path';
import { DEFAULT_WEBHOOK_SECRET, startPaymentsFake } from './server';

// Standalone runner: `tsx fakes/payments/main.ts`. Environment: PAYMENTS_PORT (4010), PAYMENTS_HOST
// (127.0.0.1), PAYMENTS_STATE_FILE (./data/payments-fake.json), PAYMENTS_PUBLIC_URL, STRIPE_WEBHOOK_URL,
// STRIPE_WEBHOOK_SECRET (whsec_kitlane_local), PAYMENTS_WEBHOOK_RETRY_BASE_MS (1000).

function numberFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 0) throw new Error(`${name} must be a non-negative integer, got "${raw}"`);
  return value;
}

async function main(): Promise<void> {
  const fake = await startPaymentsFake({
    port: numberFromEnv('PAYMENTS_PORT', 4010),
    host: process.env.PAYMENTS_HOST || '127.0.0.1',
    stateFile: resolve(process.env.PAYMENTS_STATE_FILE || './data/payments-fake.json'),
    webhookUrl: process.env.STRIPE_WEBHOOK_URL || undefined,
    webhookSecret: process.env.STRIPE_WEBHOOK_SECRET || DEFAULT_WEBHOOK_SECRET,
    publicUrl: process.env.PAYMENTS_PUBLIC_URL || undefined,
    retryBaseMs: numberFromEnv('PAYMENTS_WEBHOOK_RETRY_BASE_MS', 1000),
  });
  process.stdout.write(`payments fake listening on ${fake.url}${process.env.STRIPE_WEBHOOK_URL ? `, webhooks to ${process.env.STRIPE_WEBHOOK_URL}` : ''}\n`);
  const shutdown = (signal: string): void => {
    process.stdout.write(`payments fake: ${signal}, stopping\n`);
    fake.close().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error('payments fake: error while stopping', error);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', () => shutdown('SIGINT'));
  process.once('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((error: unknown) => {
  console.error('payments fake: failed to start', error);
  process.exit(1);
});
