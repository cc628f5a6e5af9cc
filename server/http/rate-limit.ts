import { rateLimit, type Options } from 'express-rate-limit';

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
  login: { windowMs: 5 * 60_000, limit: 20 },
  signup: { windowMs: 60 * 60_000, limit: 20 },
  passwordReset: { windowMs: 15 * 60_000, limit: 10 },
  messages: { windowMs: 60_000, limit: 30 },
} satisfies Record<string, LimitConfig>;
export type Limits = typeof DEFAULT_LIMITS;
