// Account names and the ledger's own error; see ledger.service.ts for the sign convention.
export const ACCOUNTS = {
  clearing: 'processor:clearing',
  fees: 'platform:fees',
  commission: 'platform:commission',
  refunds: 'refunds',
  escrow: (bookingId: string) => `escrow:${bookingId}`,
  payable: (userId: string) => `payable:${userId}`,
} as const;

export const ACCOUNT_NAME = /^[a-z]+(:[A-Za-z0-9_-]+)?$/;

/** A ledger rule was broken by the caller: always a bug in our code, never the user's input. */
export class LedgerError extends Error {
  constructor(
    public readonly code: 'ledger_unbalanced' | 'ledger_invalid_entry',
    message: string,
  ) {
    super(message);
  }
}

