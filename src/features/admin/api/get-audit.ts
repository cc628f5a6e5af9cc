import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditList } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export const AUDIT_LIST_LIMIT = 200;

export function getAudit(signal?: AbortSignal): Promise<AuditList> {
  return api.get<AuditList>(`/api/admin/audit?limit=${AUDIT_LIST_LIMIT}`, { signal });
}

export function auditQueryOptions() {
  return queryOptions({ queryKey: adminKeys.audit(), queryFn: ({ signal }) => getAudit(signal) });
}

export function useAudit() {
  return useQuery(auditQueryOptions());
}
