import type { PaymentsCore } from './core';
import type { FormObject } from './form-encoding';

export interface ApiRequest {
  method: string;
  /** Decoded query (GET) or body (POST) parameters. */
  params: FormObject;
  /** Named segments of the route pattern, e.g. `{ id: 'tr_…' }`. */
  path: Record<string, string>;
  /** The Stripe-Account header: the connected account the request acts for, or null for the platform. */
  account: string | null;
}

export interface Route {
  method: 'GET' | 'POST';
  pattern: string;
  /** Whether the route also works on behalf of a connected account (Stripe-Account header). */
  connectAware?: boolean;
  handle: (core: PaymentsCore, request: ApiRequest) => unknown;
}
