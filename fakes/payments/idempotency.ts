import { createHash } from 'node:crypto';
import { FakeApiError } from './errors';
import type { FakeState, IdempotencyRecord } from './types';

/** REFERENCES.md: keys may expire after 24 hours. */
export const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;
const MAX_KEY_LENGTH = 255;

/** Same request = same method, path and parameters (key order on the wire does not matter). */
export function requestFingerprint(method: string, path: string, params: unknown): string {
  return createHash('sha256').update(canonicalJson({ method, path, params })).digest('hex');
}

export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** Keys are scoped to the account the request acts for, like the hosted API. */
export function scopedKey(account: string | null, key: string): string {
  return `${account ?? 'platform'}:${key}`;
}

export function purgeExpired(state: FakeState, nowMs: number): void {
  for (const [key, record] of Object.entries(state.idempotency)) {
    if (nowMs - record.created_at >= IDEMPOTENCY_TTL_MS) delete state.idempotency[key];
  }
}

export type IdempotencyLookup = { kind: 'new' } | { kind: 'replay'; record: IdempotencyRecord };

export function lookupIdempotency(state: FakeState, scoped: string, key: string, fingerprint: string, nowMs: number): IdempotencyLookup {
  if (key.length > MAX_KEY_LENGTH) {
    throw new FakeApiError(400, { type: 'invalid_request_error', message: `Idempotency-Key must be at most ${MAX_KEY_LENGTH} characters.` });
  }
  purgeExpired(state, nowMs);
  const record = state.idempotency[scoped];
  if (!record) return { kind: 'new' };
  if (record.fingerprint !== fingerprint) {
    throw new FakeApiError(400, {
      type: 'idempotency_error',
      message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
    });
  }
  return { kind: 'replay', record };
}
