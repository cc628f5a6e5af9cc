import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BriefValues, BriefView } from '@shared/schemas/briefs';
import { api } from '@/lib/api-client';
import { briefKeys } from './keys';
import { myBriefsQueryOptions } from './get-my-briefs';

export async function createBrief(input: BriefValues): Promise<BriefView> {
  return (await api.post<{ brief: BriefView }>('/api/briefs', input)).brief;
}

export function useCreateBrief() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBrief,
    onSuccess: (brief) => {
      queryClient.setQueryData(briefKeys.detail(brief.id), brief);
      void queryClient.invalidateQueries({ queryKey: myBriefsQueryOptions().queryKey });
    },
  });
}
