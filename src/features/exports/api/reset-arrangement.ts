import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ArrangementResponse } from '../../../../shared/api/exports';
import { api } from '../../../lib/api-client';
import { arrangementChanged } from './get-arrangement';

export function resetArrangement(hullId: number): Promise<ArrangementResponse> {
  return api.delete<ArrangementResponse>(`/api/hulls/${hullId}/cut-list/arrangement`);
}

/** Forgets the hand arrangement: the cut list goes back to the packer's. */
export function useResetArrangement(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: () => resetArrangement(hullId), onSuccess: (fresh) => arrangementChanged(queryClient, hullId, fresh) });
}
