import { rateLimit, ipKeyGenerator, type Options } from 'express-rate-limit';

export type LimitConfig = { windowMs: number; limit: number };

// express-rate-limit sends Retry-After on 429; the body keeps our error shape.
export function limiter(name: string, cfg: LimitConfig, keyExtra?: Options['keyGenerator']) {
  return rateLimit({
    windowMs: cfg.windowMs,
    limit: cfg.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    ...(keyExtra ? { keyGenerator: keyExtra } : {}),
    handler: (_req, res, _next, options) => {
      res.status(options.statusCode).json({
        error: { code: 'rate_limited', message: `Too many ${name} attempts. Wait a moment and try again.` },
      });
    },
  });
}

export const DEFAULT_LIMITS = {
  // Per address and per account: a flood on one account is stopped early, a spray over many
  // accounts from one address a little later.
  login: { windowMs: 5 * 60_000, limit: 100 },
  loginPerAccount: { windowMs: 5 * 60_000, limit: 10 },
  signup: { windowMs: 60 * 60_000, limit: 20 },
  passwordReset: { windowMs: 15 * 60_000, limit: 10 },
  messages: { windowMs: 60_000, limit: 30 },
} satisfies Record<string, LimitConfig>;
export type Limits = typeof DEFAULT_LIMITS;

/** Key for per-account limits: the client's address plus the email it tries. */
export const ipAndEmailKey: Options['keyGenerator'] = (req) => {
  const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase().slice(0, 254) : '';
  return `${ipKeyGenerator(req.ip ?? '')}|${email}`;
};
