import type { Request, Response, NextFunction, RequestHandler } from 'express';
import type { z } from 'zod';

// Parsed values go to res.locals (Express 5's req.query is read-only); a ZodError reaches the
// error handler, which answers 400 with field messages. On a route that needs an account these come
// after requireSignedIn / requirePermission (server/auth/middleware.ts): who may call is answered first.
export function validateBody<S extends z.ZodType>(schema: S): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    res.locals.body = schema.parse(req.body ?? {});
    next();
  };
}

export function validateQuery<S extends z.ZodType>(schema: S): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    res.locals.query = schema.parse(req.query ?? {});
    next();
  };
}

export function bodyOf<S extends z.ZodType>(res: Response, _schema: S): z.infer<S> {
  return res.locals.body as z.infer<S>;
}

export function queryOf<S extends z.ZodType>(res: Response, _schema: S): z.infer<S> {
  return res.locals.query as z.infer<S>;
}
