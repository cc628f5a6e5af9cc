import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReelTrackSummary } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { profileKeys } from '@/features/profiles/api/keys';

export async function reorderReelTracks(ids: string[]): Promise<ReelTrackSummary[]> {
  return (await api.put<{ tracks: ReelTrackSummary[] }>('/api/reel-tracks/order', { ids })).tracks;
}

export function useReorderReelTracks() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: reorderReelTracks, onSuccess: () => void queryClient.invalidateQueries({ queryKey: profileKeys.all }) });
}
