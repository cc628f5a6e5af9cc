import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { roomKeys } from '@/features/rooms/api/keys';
import { micPackageKeys } from './keys';

export async function archiveMicPackage(id: string): Promise<void> {
  await api.delete<null>(`/api/mic-packages/${encodeURIComponent(id)}`);
}

export function useArchiveMicPackage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: archiveMicPackage,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: micPackageKeys.all });
      void queryClient.invalidateQueries({ queryKey: roomKeys.all });
    },
  });
}
