import { mkdirSync, readFileSync, renameSync, writeFileSync, openSync, fsyncSync, closeSync, existsSync } from 'node:fs';
import { dirname } from 'node:path';
import { randomBytes } from 'node:crypto';
import { ID_PREFIX, newId } from './ids';
import type { FakeState } from './types';

export function emptyState(): FakeState {
  return {
    version: 1,
    platformAccountId: newId(ID_PREFIX.account, 16),
    checkoutSessions: {},
    sessionLineItems: {},
    sessionIntentData: {},
    paymentIntents: {},
    paymentMethods: {},
    charges: {},
    refunds: {},
    transfers: {},
    transferReversals: {},
    accounts: {},
    accountLinks: {},
    balanceTransactions: {},
    balanceTransactionOwner: {},
    balances: {},
    events: {},
    deliveries: [],
    idempotency: {},
    webhookMode: 'normal',
  };
}

/** Loads the state file, or starts empty when it does not exist yet. A corrupt file is an error, not a reset. */
export function loadState(file: string): FakeState {
  if (!existsSync(file)) return emptyState();
  const parsed = JSON.parse(readFileSync(file, 'utf8')) as Partial<FakeState>;
  if (parsed.version !== 1) throw new Error(`payments fake: unsupported state file version in ${file}`);
  // Tables added later start empty when an older file lacks them.
  return { ...emptyState(), ...parsed } as FakeState;
}

/**
 * Writes the state atomically: a temp file in the same directory, flushed, then renamed over the old one,
 * so a crash leaves either the previous or the new document, never half of one.
 */
export function saveState(file: string, state: FakeState): void {
  mkdirSync(dirname(file), { recursive: true });
  const temp = `${file}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`;
  const fd = openSync(temp, 'w');
  try {
    writeFileSync(fd, JSON.stringify(state));
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  renameSync(temp, file);
}
