import type { QueryClient } from '@tanstack/react-query';
import type { Me, MeUser } from '@shared/schemas/auth';
import { meQueryOptions } from './get-me';

/** Every auth answer that returns the user refreshes the header at once, without another /api/me. */
export function setMe(queryClient: QueryClient, user: MeUser | null): void {
  queryClient.setQueryData<Me>(meQueryOptions().queryKey, { user });
}
