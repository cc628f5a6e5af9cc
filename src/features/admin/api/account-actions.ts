import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AccountActionInput, AdminAccountView } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export type AccountAction = 'disable' | 'enable' | 'grant-admin';

export async function accountAction(userId: string, action: AccountAction, input: AccountActionInput): Promise<AdminAccountView> {
  return (await api.post<{ account: AdminAccountView }>(`/api/admin/accounts/${encodeURIComponent(userId)}/${action}`, input)).account;
}

export function useAccountAction() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (vars: { userId: string; action: AccountAction; input: AccountActionInput }) => accountAction(vars.userId, vars.action, vars.input),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: adminKeys.accountLists() }),
        queryClient.invalidateQueries({ queryKey: adminKeys.audit() }),
      ]),
  });
}
