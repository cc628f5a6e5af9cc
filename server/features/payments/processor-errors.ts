// What the user is told when a call to the payment processor fails. An unreachable processor (no
// connection, a timeout, or its own 5xx) is a passing outage: the user is asked to try again, and nothing
// was charged or moved. Any other refusal is shown with the processor's own words.
import { AppError } from '../../http/app-error';

export const PAYMENT_UNAVAILABLE_MESSAGE = 'The payment service cannot be reached right now. Nothing was charged or changed; please try again in a minute.';

type SdkError = { type?: string; statusCode?: number; message?: string };

export function isProcessorUnreachable(error: unknown): boolean {
  const e = error as SdkError | null;
  if (!e || typeof e !== 'object') return false;
  return e.type === 'StripeConnectionError' || (e.type === 'StripeAPIError' && typeof e.statusCode === 'number' && e.statusCode >= 500);
}

export function paymentUnavailable(): AppError {
  return new AppError('payment_unavailable', PAYMENT_UNAVAILABLE_MESSAGE, 503, undefined, { 'retry-after': '30' });
}

/** The AppError for a failed processor call; `what` completes "The payment processor …" for refusals. */
export function processorError(error: unknown, what: string): AppError {
  if (isProcessorUnreachable(error)) return paymentUnavailable();
  return new AppError('processor_error', `The payment processor ${what}: ${(error as SdkError)?.message ?? 'no answer'}`, 502);
}
