// Query keys of the admin desk, general → specific; read through the queryOptions factories.
export const adminKeys = {
  all: ['admin'] as const,
  disputes: (status: 'open' | 'settled' | undefined) => [...adminKeys.all, 'disputes', { status }] as const,
  disputeCase: (id: string) => [...adminKeys.all, 'dispute', id] as const,
  accountLists: () => [...adminKeys.all, 'accounts'] as const,
  accounts: (q: string) => [...adminKeys.accountLists(), { q }] as const,
  bookings: (q: string, status: string) => [...adminKeys.all, 'bookings', { q, status }] as const,
  audit: () => [...adminKeys.all, 'audit'] as const,
  ledger: () => [...adminKeys.all, 'ledger'] as const,
  bookingLedger: (bookingId: string) => [...adminKeys.all, 'ledger', bookingId] as const,
  reconciliation: () => [...adminKeys.all, 'reconciliation'] as const,
};
