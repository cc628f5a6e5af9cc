// The ledger views come from the payments feature's routes (/api/admin/ledger…, /api/bookings/:id/ledger).
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingLedgerView, LedgerTotalsView, ReconciliationView } from '@shared/schemas/payments';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export async function getLedgerTotals(signal?: AbortSignal): Promise<LedgerTotalsView> {
  return (await api.get<{ ledger: LedgerTotalsView }>('/api/admin/ledger', { signal })).ledger;
}

export async function getBookingLedger(bookingId: string, signal?: AbortSignal): Promise<BookingLedgerView> {
  return (await api.get<{ ledger: BookingLedgerView }>(`/api/bookings/${encodeURIComponent(bookingId)}/ledger`, { signal })).ledger;
}

export async function getReconciliation(signal?: AbortSignal): Promise<ReconciliationView> {
  return (await api.get<{ reconciliation: ReconciliationView }>('/api/admin/ledger/reconcile', { signal })).reconciliation;
}

export function ledgerTotalsQueryOptions() {
  return queryOptions({ queryKey: adminKeys.ledger(), queryFn: ({ signal }) => getLedgerTotals(signal) });
}

export function bookingLedgerQueryOptions(bookingId: string) {
  return queryOptions({ queryKey: adminKeys.bookingLedger(bookingId), queryFn: ({ signal }) => getBookingLedger(bookingId, signal), enabled: bookingId !== '' });
}

/** Asks the processor each time: only run when the admin asks for it. */
export function reconciliationQueryOptions() {
  return queryOptions({ queryKey: adminKeys.reconciliation(), queryFn: ({ signal }) => getReconciliation(signal), enabled: false, staleTime: 0 });
}

export const useLedgerTotals = () => useQuery(ledgerTotalsQueryOptions());
export const useBookingLedger = (bookingId: string) => useQuery(bookingLedgerQueryOptions(bookingId));
export const useReconciliation = () => useQuery(reconciliationQueryOptions());
