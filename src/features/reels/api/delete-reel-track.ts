import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { profileKeys } from '@/features/profiles/api/keys';

export function deleteReelTrack(id: string): Promise<void> {
  return api.delete(`/api/reel-tracks/${encodeURIComponent(id)}`);
}

export function useDeleteReelTrack() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteReelTrack, onSuccess: () => void queryClient.invalidateQueries({ queryKey: profileKeys.all }) });
}
