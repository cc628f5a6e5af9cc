// The one error type services throw; the error handler turns it into {error:{code,message,fields}}.
export class AppError extends Error {
  constructor(
    public readonly code: string,
    message: string,
    public readonly status = 400,
    public readonly fields?: Record<string, string>,
    public readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'That') => new AppError('not_found', `${what} was not found`, 404);
export const forbidden = (message = 'You do not have access to this') => new AppError('forbidden', message, 403);
export const unauthorized = () => new AppError('unauthorized', 'Sign in to continue', 401);
export const conflict = (code: string, message: string) => new AppError(code, message, 409);
