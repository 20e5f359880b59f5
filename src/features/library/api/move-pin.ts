import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MovePinInput, PinSaveResponse } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';
import { forgetHullPlan } from './take-into-hull';

export function movePin(hullId: number, pinId: number, input: MovePinInput): Promise<PinSaveResponse> {
  return api.post<PinSaveResponse>(`/api/hulls/${hullId}/pins/${pinId}/move`, input);
}

/** Move the hull to another revision of what it pins: a new plan revision. */
export function useMovePin(hullId: number, pinId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MovePinInput) => movePin(hullId, pinId, input),
    onSuccess: () => forgetHullPlan(queryClient, hullId),
  });
}
