import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { planDraftKey } from './get-plan-draft';

export function discardPlanDraft(hullId: number): Promise<void> {
  return api.delete<void>(`/api/hulls/${hullId}/plan/draft`);
}

/** Throw away my autosaved draft; the plan goes back to the latest revision. */
export function useDiscardPlanDraft(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => discardPlanDraft(hullId),
    onSuccess: () => queryClient.setQueryData(planDraftKey(hullId), { draft: null }),
  });
}
