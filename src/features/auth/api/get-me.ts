import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me, MeUser } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { authKeys } from './keys';

// Checked by hand rather than with the shared zod schema: /api/me runs on every page, and zod would
// otherwise be part of the first download (~30 kB gzip) although only the forms need it.
function isMeUser(value: unknown): value is MeUser {
  const u = value as Partial<Record<keyof MeUser, unknown>> | null;
  return (
    typeof u === 'object' &&
    u !== null &&
    typeof u.id === 'string' &&
    typeof u.email === 'string' &&
    typeof u.displayName === 'string' &&
    Array.isArray(u.roles) &&
    u.roles.every((r) => typeof r === 'string') &&
    typeof u.emailVerified === 'boolean' &&
    typeof u.timeZone === 'string'
  );
}

export function parseMe(body: unknown): Me {
  const user = (body as { user?: unknown } | null)?.user;
  if (user === null) return { user: null };
  if (isMeUser(user)) return { user };
  throw new Error('The server sent an unexpected answer for the signed-in user.');
}

export async function getMe(signal?: AbortSignal): Promise<Me> {
  return parseMe(await api.get<unknown>('/api/me', { signal }));
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: authKeys.me,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });
}

export function useMeQuery() {
  return useQuery(meQueryOptions());
}
