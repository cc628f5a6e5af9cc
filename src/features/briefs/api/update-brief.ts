import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BriefValues, BriefView } from '@shared/schemas/briefs';
import { api } from '@/lib/api-client';
import { briefQueryOptions } from './get-brief';
import { myBriefsQueryOptions } from './get-my-briefs';

export async function updateBrief({ id, input }: { id: string; input: BriefValues }): Promise<BriefView> {
  return (await api.patch<{ brief: BriefView }>(`/api/briefs/${encodeURIComponent(id)}`, input)).brief;
}

export function useUpdateBrief() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBrief,
    onSuccess: (brief) => {
      queryClient.setQueryData(briefQueryOptions(brief.id).queryKey, brief);
      void queryClient.invalidateQueries({ queryKey: myBriefsQueryOptions().queryKey });
    },
  });
}
