import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MicPackageView } from '@shared/schemas/mic-packages';
import { api } from '@/lib/api-client';
import { micPackageKeys } from './keys';

export async function getMicPackage(id: string, signal?: AbortSignal): Promise<MicPackageView> {
  return (await api.get<{ package: MicPackageView }>(`/api/mic-packages/${encodeURIComponent(id)}`, { signal })).package;
}

export function micPackageQueryOptions(id: string) {
  return queryOptions({ queryKey: micPackageKeys.detail(id), queryFn: ({ signal }) => getMicPackage(id, signal) });
}

export function useMicPackage(id: string | null) {
  return useQuery({ ...micPackageQueryOptions(id ?? ''), enabled: Boolean(id) });
}
