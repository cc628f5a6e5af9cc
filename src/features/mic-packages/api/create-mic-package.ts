import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MicPackageInput, MicPackageView } from '@shared/schemas/mic-packages';
import { api } from '@/lib/api-client';
import { roomKeys } from '@/features/rooms/api/keys';
import { micPackageKeys } from './keys';
import { micPackageQueryOptions } from './get-mic-package';

export async function createMicPackage({ roomId, input }: { roomId: string; input: MicPackageInput }): Promise<MicPackageView> {
  return (await api.post<{ package: MicPackageView }>(`/api/rooms/${encodeURIComponent(roomId)}/packages`, input)).package;
}

export function useCreateMicPackage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createMicPackage,
    onSuccess: (pkg) => {
      queryClient.setQueryData(micPackageQueryOptions(pkg.id).queryKey, pkg);
      void queryClient.invalidateQueries({ queryKey: micPackageKeys.forRoom(pkg.roomId) });
      void queryClient.invalidateQueries({ queryKey: roomKeys.all });
    },
  });
}
