import type { MeUser } from '@shared/schemas/auth';
import { useMeQuery } from '../api/get-me';

/**
 * The signed-in user, or null when signed out. The root loader fetched it before the first render, so
 * `isPending` is only true in tests or after the cache was dropped.
 */
export function useMe(): { user: MeUser | null; isPending: boolean; error: Error | null } {
  const query = useMeQuery();
  return { user: query.data?.user ?? null, isPending: query.isPending, error: query.error };
}
