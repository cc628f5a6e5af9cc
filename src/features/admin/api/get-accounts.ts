import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminAccountList } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

/** The table pages and sorts on the client; the server filters and caps the list. */
export const ACCOUNT_LIST_LIMIT = 200;

export function getAccounts(q: string, signal?: AbortSignal): Promise<AdminAccountList> {
  const params = new URLSearchParams({ limit: String(ACCOUNT_LIST_LIMIT) });
  if (q) params.set('q', q);
  return api.get<AdminAccountList>(`/api/admin/accounts?${params}`, { signal });
}

export function accountsQueryOptions(q: string) {
  return queryOptions({ queryKey: adminKeys.accounts(q), queryFn: ({ signal }) => getAccounts(q, signal), placeholderData: keepPreviousData });
}

export function useAccounts(q: string) {
  return useQuery(accountsQueryOptions(q));
}
