// One error type for every money rule, so the server can map it to a 400 with a stable code and the
// client can show the same words beside a form field.

export type MoneyErrorCode =
  | 'invalid_currency'
  | 'invalid_amount'
  | 'too_many_decimals'
  | 'amount_too_large'
  | 'amount_too_small'
  | 'invalid_weights'
  | 'invalid_percents'
  | 'invalid_line_item';

export class MoneyError extends Error {
  readonly code: MoneyErrorCode;

  constructor(code: MoneyErrorCode, message: string) {
    super(message);
    this.name = 'MoneyError';
    this.code = code;
  }
}

/** Amounts in minor units are integers a double holds exactly; anything else is a bug upstream. */
export function assertSafeInteger(value: number, what: string): void {
  if (typeof value !== 'number' || !Number.isSafeInteger(value)) {
    throw new MoneyError('invalid_amount', `${what} must be a whole number of minor units, got ${String(value)}`);
  }
}

export function assertNonNegativeInteger(value: number, what: string): void {
  assertSafeInteger(value, what);
  if (value < 0) throw new MoneyError('invalid_amount', `${what} must not be negative, got ${value}`);
}
