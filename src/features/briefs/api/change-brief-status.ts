import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BriefView } from '@shared/schemas/briefs';
import { api } from '@/lib/api-client';
import { briefKeys } from './keys';
import { briefQueryOptions } from './get-brief';

export type BriefStatusAction = 'publish' | 'withdraw';

export async function changeBriefStatus({ id, action }: { id: string; action: BriefStatusAction }): Promise<BriefView> {
  return (await api.post<{ brief: BriefView }>(`/api/briefs/${encodeURIComponent(id)}/${action}`)).brief;
}

/** Publish a draft or withdraw a brief; every brief list may change, so the whole feature is refreshed. */
export function useChangeBriefStatus() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeBriefStatus,
    onSuccess: (brief) => {
      queryClient.setQueryData(briefQueryOptions(brief.id).queryKey, brief);
      void queryClient.invalidateQueries({ queryKey: briefKeys.all });
    },
  });
}
