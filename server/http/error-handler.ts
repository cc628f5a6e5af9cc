import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError } from './app-error';
import type { Logger } from '../logger';
// The processor's outage is the one integration failure every money route shares, so it is mapped here.
import { isProcessorUnreachable, paymentUnavailable } from '../features/payments/processor-errors';

export function fieldsOf(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

// Body-parser and multer errors carry a status or code of their own; map them to our shape.
function fromKnownError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return new AppError('invalid_input', 'Some fields need attention', 400, fieldsOf(err));
  // A processor call no service caught (a refresh, a sync): still a "try again", not a 500.
  if (isProcessorUnreachable(err)) return paymentUnavailable();
  const e = err as { type?: string; status?: number; code?: string; message?: string; field?: string };
  if (e?.type === 'entity.too.large' || e?.code === 'LIMIT_FILE_SIZE') {
    return new AppError('too_large', 'That is larger than allowed', 413);
  }
  if (e?.type === 'entity.parse.failed') return new AppError('malformed_json', 'The request body is not valid JSON', 400);
  if (typeof e?.code === 'string' && e.code.startsWith('LIMIT_')) {
    return new AppError('upload_rejected', e.message ?? 'Upload rejected', 400);
  }
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    return new AppError(e.type ?? 'bad_request', e.message ?? 'Bad request', e.status);
  }
  return null;
}

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    const known = fromKnownError(err);
    if (!known) {
      logger.error(`unhandled error on ${req.method} ${req.path}`, err);
      res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
      return;
    }
    if (known.headers) res.set(known.headers);
    res.status(known.status).json({
      error: { code: known.code, message: known.message, ...(known.fields ? { fields: known.fields } : {}) },
    });
  };
}

export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `No API route for ${req.method} ${req.path}` } });
};
