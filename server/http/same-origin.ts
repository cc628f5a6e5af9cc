import type { RequestHandler } from 'express';
import { AppError } from './app-error';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

// Cookie sessions need a CSRF guard: a browser always sends Origin (and Sec-Fetch-Site) on a
// cross-site POST, so a mutating request that names another origin is refused. Requests without
// Origin come from non-browser clients (CLI, webhooks), which cannot carry a victim's cookie.
export function sameOrigin(allowedOrigins: string[]): RequestHandler {
  const allowed = new Set(allowedOrigins.map((o) => new URL(o).origin));
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    const fetchSite = req.get('sec-fetch-site');
    const ownOrigin = `${req.protocol}://${req.get('host')}`;
    const originOk = !origin || allowed.has(origin) || origin === ownOrigin;
    if (!originOk || fetchSite === 'cross-site') {
      return next(new AppError('cross_origin', 'Requests from other sites are not accepted', 403));
    }
    next();
  };
}
