import compression from 'compression';
import express, { type Express, type Request, type RequestHandler, type Response } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import type { Transporter } from 'nodemailer';
import type { Env } from './env';
import { appUrlOf } from './env';
import type { Db } from './db/client';
import type { Storage } from './storage/storage';
import { createLogger, type Logger } from './logger';
import { JobRunner, type JobRunnerOptions } from './jobs/runner';
import { createMailer, type Mailer } from './mail/outbox';
import { createLucia, type AuthLucia } from './auth/lucia';
import { loadSession } from './auth/middleware';
import { sameOrigin } from './http/same-origin';
import { errorHandler, apiNotFound } from './http/error-handler';
import { DEFAULT_LIMITS, type Limits } from './http/rate-limit';
import { createAuthRepository } from './features/auth/auth.repository';
import { createAuthService } from './features/auth/auth.service';
import { authRoutes } from './features/auth/auth.routes';
import { createNotifications, type Notifications } from './features/notifications/notifications.service';
import { featureRoutes } from './features/registry';
import { createStripeClient, type Stripe } from './payments/stripe';

export type AppDeps = {
  env: Env;
  db: Db;
  storage: Storage;
  mailTransport: Transporter;
  logger?: Logger;
  limits?: Partial<Limits>;
  jobOptions?: JobRunnerOptions;
  /** Built client to serve (production); null when Vite serves it (dev) or in API tests. */
  clientDist?: string | null;
  /** Vite's dev middleware, mounted after the API in `npm run dev`. */
  devMiddleware?: RequestHandler;
  /** Public settings the client reads at boot (e.g. the mail catcher's inbox URL). */
  publicConfig?: Record<string, unknown>;
  /** The processor client (boot points it at the payment fake); made from env when absent. */
  stripe?: Stripe;
};

export type AppContext = {
  env: Env;
  db: Db;
  storage: Storage;
  logger: Logger;
  jobs: JobRunner;
  mailer: Mailer;
  lucia: AuthLucia;
  appUrl: string;
  limits: Limits;
  notifications: Notifications;
  stripe: Stripe;
};

export type KitlaneApp = { app: Express; ctx: AppContext };

function securityHeaders(dev: boolean, realStripe: boolean): RequestHandler {
  // Stripe.js can only come from Stripe's servers; it is allowed only when a real publishable key is set.
  const stripeScript = realStripe ? ['https://js.stripe.com'] : [];
  const stripeConnect = realStripe ? ['https://api.stripe.com'] : [];
  return helmet({
    contentSecurityPolicy: {
      directives: {
        // Vite's dev server injects an inline preamble for hot reload; production has no inline script.
        scriptSrc: dev ? ["'self'", "'unsafe-inline'", ...stripeScript] : ["'self'", ...stripeScript],
        connectSrc: dev ? ["'self'", 'ws:', ...stripeConnect] : ["'self'", ...stripeConnect],
        frameSrc: realStripe ? ["'self'", 'https://js.stripe.com'] : ["'self'"],
        mediaSrc: ["'self'", 'blob:'],
        imgSrc: ["'self'", 'data:', 'blob:'],
        // Form posts go to the payment fake's hosted page on another local port.
        formAction: ["'self'", 'http://localhost:*', 'http://127.0.0.1:*'],
        upgradeInsecureRequests: null,
      },
    },
    crossOriginEmbedderPolicy: false,
    strictTransportSecurity: false,
  });
}

/**
 * gzip for the client's scripts and styles and the API's JSON when the client asks for it. The API's stored
 * files (served with Accept-Ranges: previews, peaks, originals, attachments) are sent as they are: audio is
 * already compressed, and gzipping a dozen peaks files while the previews stream shares libuv's small
 * thread pool with the file reads, which delayed the review room's first play by about 0.3 s (bench:review).
 * Only under /api: express.static also says Accept-Ranges, and the client's bundle must still be gzipped.
 */
function worthCompressing(req: Request, res: Response): boolean {
  if (req.originalUrl.startsWith('/api/') && res.getHeader('Accept-Ranges')) return false;
  return compression.filter(req, res);
}

export function createApp(deps: AppDeps): KitlaneApp {
  const logger = deps.logger ?? createLogger(deps.env.LOG_LEVEL);
  const appUrl = appUrlOf(deps.env);
  const limits: Limits = { ...DEFAULT_LIMITS, ...deps.limits };
  const jobs = new JobRunner(deps.db, logger, deps.jobOptions);
  const mailer = createMailer(jobs, deps.mailTransport, deps.env.MAIL_FROM);
  const lucia = createLucia(deps.db);
  const notifications = createNotifications({ db: deps.db, mailer, appUrl });
  const stripe = deps.stripe ?? createStripeClient(deps.env);
  const ctx: AppContext = { env: deps.env, db: deps.db, storage: deps.storage, logger, jobs, mailer, lucia, appUrl, limits, notifications, stripe };

  const authService = createAuthService({ db: deps.db, repo: createAuthRepository(deps.db), lucia, mailer, appUrl });

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(securityHeaders(Boolean(deps.devMiddleware), Boolean(deps.env.STRIPE_PUBLISHABLE_KEY)));
  app.use(compression({ filter: worthCompressing }));

  const api = express.Router();
  api.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  api.get('/config', (_req, res) => {
    res.json({ ...deps.publicConfig });
  });
  api.use(sameOrigin([appUrl]));
  // Webhook signatures are over the raw bytes: that route keeps its body as a Buffer (STACK.md gotcha).
  api.use('/webhooks/stripe', express.raw({ type: 'application/json', limit: '1mb' }));
  api.use(express.json({ limit: '100kb' }));
  api.use(loadSession(lucia));
  api.use(authRoutes(authService, lucia, limits));
  for (const routes of featureRoutes) api.use(routes(ctx));
  api.use(apiNotFound);

  app.use('/api', api);

  if (deps.devMiddleware) {
    app.use(deps.devMiddleware);
  } else if (deps.clientDist && existsSync(deps.clientDist)) {
    const dist = deps.clientDist;
    // Vite names built assets by content hash, so they never change under a name: cache them for a year.
    app.use('/assets', express.static(join(dist, 'assets'), { index: false, immutable: true, maxAge: '365d' }));
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    // Client-side routes: every other GET gets the app shell; the router shows its own 404 page.
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(join(dist, 'index.html'));
    });
  }
  app.use(errorHandler(logger));
  return { app, ctx };
}
