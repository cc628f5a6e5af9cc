import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MicPackageUpdateInput, MicPackageView } from '@shared/schemas/mic-packages';
import { api } from '@/lib/api-client';
import { micPackageKeys } from './keys';
import { micPackageQueryOptions } from './get-mic-package';

export async function updateMicPackage({ id, input }: { id: string; input: MicPackageUpdateInput }): Promise<MicPackageView> {
  return (await api.patch<{ package: MicPackageView }>(`/api/mic-packages/${encodeURIComponent(id)}`, input)).package;
}

export function useUpdateMicPackage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMicPackage,
    onSuccess: (pkg) => {
      queryClient.setQueryData(micPackageQueryOptions(pkg.id).queryKey, pkg);
      void queryClient.invalidateQueries({ queryKey: micPackageKeys.forRoom(pkg.roomId) });
    },
  });
}
