import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DisputeView, PreviewSettlementInput, SettleDisputeInput, SettlementPreview } from '@shared/schemas/disputes';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export async function previewSettlement(disputeId: string, input: PreviewSettlementInput): Promise<SettlementPreview> {
  return (await api.post<{ preview: SettlementPreview }>(`/api/admin/disputes/${encodeURIComponent(disputeId)}/preview`, input)).preview;
}

export function settleDispute(disputeId: string, input: SettleDisputeInput): Promise<{ dispute: DisputeView; plan: SettlementPreview }> {
  return api.post(`/api/admin/disputes/${encodeURIComponent(disputeId)}/settle`, input);
}

/** The confirmation step: the exact amounts, computed by the server the way the settlement will move them. */
export function usePreviewSettlement(disputeId: string) {
  return useMutation({ mutationFn: (input: PreviewSettlementInput) => previewSettlement(disputeId, input) });
}

export function useSettleDispute(disputeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SettleDisputeInput) => settleDispute(disputeId, input),
    // The queue, the case file, the ledger and the audit log all change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.all }),
  });
}
