// The hosted API's error envelope: `{error:{type, code, decline_code, message, param, ...}}`. The SDK picks
// its error class from the HTTP status (400/404 invalid request, 401 authentication, 402 card, 403
// permission, 409/5xx retried) and from `type` (idempotency_error), so both have to match.

export type ErrorType =
  | 'api_error'
  | 'card_error'
  | 'idempotency_error'
  | 'invalid_request_error'
  | 'authentication_error'
  | 'permission_error';

export interface ErrorBody {
  type: ErrorType;
  message: string;
  code?: string;
  decline_code?: string;
  param?: string;
  charge?: string;
  payment_intent?: unknown;
  payment_method?: unknown;
}

/**
 * `stage` tells the idempotency layer whether the request "started executing": the hosted API stores the
 * result of requests that ran (including card declines) but not of requests rejected while validating.
 */
export class FakeApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: ErrorBody,
    readonly stage: 'validation' | 'execution' = 'validation',
  ) {
    super(body.message);
    this.name = 'FakeApiError';
  }
}

export function invalidRequest(message: string, details: { code?: string; param?: string; status?: number; stage?: 'validation' | 'execution' } = {}): FakeApiError {
  return new FakeApiError(
    details.status ?? 400,
    { type: 'invalid_request_error', message, ...(details.code ? { code: details.code } : {}), ...(details.param ? { param: details.param } : {}) },
    details.stage ?? 'validation',
  );
}

/** Money rules that fail after lookup (refund too large, balance short) count as executed requests. */
export function executionError(message: string, code: string, param?: string): FakeApiError {
  return invalidRequest(message, { code, param, stage: 'execution' });
}

export function noSuch(objectName: string, id: string, param = 'id'): FakeApiError {
  return invalidRequest(`No such ${objectName}: '${id}'`, { code: 'resource_missing', param, status: 404 });
}

export function cardError(body: Omit<ErrorBody, 'type'>): FakeApiError {
  return new FakeApiError(402, { type: 'card_error', ...body }, 'execution');
}

export function errorEnvelope(error: FakeApiError): { error: ErrorBody } {
  return { error: error.body };
}
