import { join, resolve } from 'node:path';
import { mkdirSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Env } from './env';
import { appUrlOf } from './env';
import { openDb, type Db } from './db/client';
import { applyMigrations } from './db/migrate';
import { seedDemo } from './db/seed';
import { createLocalStorage } from './storage/storage';
import { createSmtpTransport } from './mail/outbox';
import { createApp, type AppDeps, type KitlaneApp } from './app';
import { startMailCatcher, type MailCatcher } from '../fakes/mail/server';
import { startPaymentsFake, type PaymentsFake } from '../fakes/payments/server';
import { createStripeClient } from './payments/stripe';
import { createLogger } from './logger';

export type Running = {
  url: string;
  port: number;
  db: Db;
  kitlane: KitlaneApp;
  mail: MailCatcher | null;
  mailWebUrl: string | null;
  /** The payment fake when START_FAKES (tests drive its /_fake controls). */
  payments: PaymentsFake | null;
  close(): Promise<void>;
};

export type BootOptions = {
  env: Env;
  /** For tests: start the fakes on random ports (0) and keep them private to this instance. */
  randomPorts?: boolean;
  dev?: boolean;
  quiet?: boolean;
  appDeps?: Partial<AppDeps>;
};

/**
 * Starts everything `npm start` needs in one process: database (migrated, seeded on first start),
 * the local fakes, the job runner and the HTTP server. Tests call the same function.
 */
export async function boot(opts: BootOptions): Promise<Running> {
  const { env } = opts;
  const logger = createLogger(opts.quiet ? 'silent' : env.LOG_LEVEL);
  const dataDir = resolve(env.DATA_DIR);
  mkdirSync(dataDir, { recursive: true });
  const db = openDb(join(dataDir, 'kitlane.db'));
  applyMigrations(db);

  const mail = env.START_FAKES
    ? await startMailCatcher({ smtpPort: opts.randomPorts ? 0 : env.MAIL_SMTP_PORT, webPort: opts.randomPorts ? 0 : env.MAIL_WEB_PORT })
    : null;
  // The fake sends webhooks to this app; the URL is set once the app listens (its port may be random).
  const payments = env.START_FAKES
    ? await startPaymentsFake({
        port: opts.randomPorts ? 0 : env.PAYMENTS_PORT,
        stateFile: join(dataDir, 'payments-fake.json'),
        webhookSecret: env.STRIPE_WEBHOOK_SECRET,
        retryBaseMs: opts.randomPorts ? 50 : 1000,
      })
    : null;
  const stripe = createStripeClient(env, { port: payments?.port });
  const mailTransport = env.SMTP_URL
    ? createSmtpTransport({ url: env.SMTP_URL })
    : createSmtpTransport({ host: '127.0.0.1', port: mail?.smtpPort ?? env.MAIL_SMTP_PORT });

  let vite: { middlewares: AppDeps['devMiddleware']; close(): Promise<void> } | null = null;
  if (opts.dev) {
    const { createServer } = await import('vite');
    const server = await createServer({ server: { middlewareMode: true }, appType: 'spa' });
    vite = { middlewares: server.middlewares, close: () => server.close() };
  }

  const kitlane = createApp({
    env,
    db,
    storage: createLocalStorage(join(dataDir, 'files')),
    mailTransport,
    logger,
    clientDist: opts.dev ? null : resolve('dist'),
    devMiddleware: vite?.middlewares,
    publicConfig: { mailInboxUrl: mail?.webUrl ?? null, stripePublishableKey: env.STRIPE_PUBLISHABLE_KEY ?? null },
    stripe,
    ...opts.appDeps,
  });

  const seeded = env.SEED_DEMO ? await seedDemo(kitlane.ctx, env.DEMO_PASSWORD) : { seeded: false };
  if (seeded.seeded) logger.info('seeded the demo world');

  const server: Server = await new Promise((res, rej) => {
    const s = kitlane.app.listen(opts.randomPorts ? 0 : env.PORT, env.HOST, () => res(s));
    s.once('error', rej);
  });
  const port = (server.address() as AddressInfo).port;
  payments?.setWebhookUrl(`http://127.0.0.1:${port}/api/webhooks/stripe`);
  kitlane.ctx.jobs.start();

  let closed = false;
  return {
    url: opts.randomPorts ? `http://127.0.0.1:${port}` : appUrlOf(env),
    port,
    db,
    kitlane,
    mail,
    mailWebUrl: mail?.webUrl ?? null,
    payments,
    async close() {
      if (closed) return;
      closed = true;
      server.closeAllConnections?.();
      await new Promise<void>((r) => server.close(() => r()));
      payments?.setWebhookUrl(null);
      await kitlane.ctx.jobs.stop();
      await payments?.close();
      mailTransport.close();
      await mail?.close();
      await vite?.close();
      db.$client.close();
    },
  };
}
