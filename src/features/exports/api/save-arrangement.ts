import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ArrangementResponse, SheetLayoutInput } from '../../../../shared/api/exports';
import { api } from '../../../lib/api-client';
import { arrangementChanged } from './get-arrangement';

export function saveArrangement(hullId: number, input: { revisionId: number; layout: SheetLayoutInput }): Promise<ArrangementResponse> {
  return api.put<ArrangementResponse>(`/api/hulls/${hullId}/cut-list/arrangement`, input);
}

/** Saves the hand arrangement (checked again by the server with the same rules). */
export function useSaveArrangement(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: (input: { revisionId: number; layout: SheetLayoutInput }) => saveArrangement(hullId, input), onSuccess: (saved) => arrangementChanged(queryClient, hullId, saved) });
}
