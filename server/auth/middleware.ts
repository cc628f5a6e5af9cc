import type { Request, Response, NextFunction, RequestHandler } from 'express';
import type { AuthLucia } from './lucia';
import { AppError, unauthorized, forbidden } from '../http/app-error';
import { can, type Permission } from '@shared/permissions';

export type CurrentUser = {
  id: string;
  email: string;
  displayName: string;
  roles: string[];
  emailVerified: boolean;
  timeZone: string;
};

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      user?: CurrentUser | null;
      sessionId?: string | null;
      body?: unknown;
      query?: unknown;
    }
  }
}

export function setSessionCookie(req: Request, res: Response, lucia: AuthLucia, sessionId: string): void {
  const cookie = lucia.createSessionCookie(sessionId);
  res.append('Set-Cookie', withSecure(req, cookie.serialize()));
}

export function clearSessionCookie(req: Request, res: Response, lucia: AuthLucia): void {
  res.append('Set-Cookie', withSecure(req, lucia.createBlankSessionCookie().serialize()));
}

// Secure only over https, so the local http demo keeps working (issue 2).
function withSecure(req: Request, serialized: string): string {
  const https = req.secure || req.get('x-forwarded-proto') === 'https';
  return https ? `${serialized}; Secure` : serialized;
}

export function loadSession(lucia: AuthLucia): RequestHandler {
  return async (req, res, next) => {
    const sessionId = lucia.readSessionCookie(req.get('cookie') ?? '');
    res.locals.user = null;
    res.locals.sessionId = null;
    if (!sessionId) return next();
    const { session, user } = await lucia.validateSession(sessionId);
    if (session?.fresh) setSessionCookie(req, res, lucia, session.id);
    if (!session) clearSessionCookie(req, res, lucia);
    if (session && user && !user.disabledAt) {
      res.locals.sessionId = session.id;
      res.locals.user = {
        id: user.id,
        email: user.email,
        displayName: user.displayName,
        roles: user.roles,
        emailVerified: user.emailVerifiedAt != null,
        timeZone: user.timeZone,
      };
    }
    next();
  };
}

export function requireUser(res: Response): CurrentUser {
  const user = res.locals.user;
  if (!user) throw unauthorized();
  return user;
}

export function optionalUser(res: Response): CurrentUser | null {
  return res.locals.user ?? null;
}

/**
 * 401 for a signed-out caller. Mount it before validateBody/validateQuery (per route, or with `r.use(paths, …)`
 * for a router's private paths) so the answer never depends on the input: a stranger learns nothing about a
 * route's schema, and parsing is not spent on someone who may not call it at all.
 */
export const requireSignedIn: RequestHandler = (_req: Request, res: Response, next: NextFunction) => {
  requireUser(res);
  next();
};

/** 401 signed out, 403 without `permission`; like requireSignedIn, mounted before any input is parsed. */
export function requirePermission(permission: Permission, message?: string): RequestHandler {
  return (_req, res, next) => {
    assertCan(requireUser(res), permission, message);
    next();
  };
}

export function assertCan(user: CurrentUser, permission: Permission, message?: string): void {
  if (!can(user.roles, permission)) throw forbidden(message);
}

export function assertVerified(user: CurrentUser): void {
  if (!user.emailVerified) {
    throw new AppError('email_unverified', 'Verify your email address first (check your inbox)', 403);
  }
}
