import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BriefView } from '@shared/schemas/briefs';
import { api } from '@/lib/api-client';
import { briefQueryOptions } from './get-brief';

export function inviteDrummers({ id, drummerIds }: { id: string; drummerIds: string[] }): Promise<{ invited: string[]; brief: BriefView }> {
  return api.post(`/api/briefs/${encodeURIComponent(id)}/invites`, { drummerIds });
}

export function useInviteDrummers() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteDrummers,
    onSuccess: ({ brief }) => queryClient.setQueryData(briefQueryOptions(brief.id).queryKey, brief),
  });
}
