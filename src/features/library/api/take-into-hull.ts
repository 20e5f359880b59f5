import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { PinSaveResponse, TakeIntoHullInput } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export function takeIntoHull(hullId: number, input: TakeIntoHullInput): Promise<PinSaveResponse> {
  return api.post<PinSaveResponse>(`/api/hulls/${hullId}/pins`, input);
}

/**
 * The hull's plan changed on the server: drop what the cache holds of it (not just mark it stale), so a
 * Lines screen opened next starts from the new revision, not from the old one while it refetches.
 */
export function forgetHullPlan(queryClient: QueryClient, hullId: number) {
  queryClient.removeQueries({ queryKey: ['hulls', hullId, 'plan'] });
  return Promise.all([
    // The pin list only: a comparison on screen stays as it was compared.
    queryClient.invalidateQueries({ queryKey: ['hulls', hullId, 'pins'], exact: true }),
    queryClient.invalidateQueries({ queryKey: ['notices'] }),
    queryClient.invalidateQueries({ queryKey: ['hulls'], exact: true }),
  ]);
}

/** "Take into hull": the revision goes into the hull as a new plan revision, and the hull pins it. */
export function useTakeIntoHull() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ hullId, ...input }: TakeIntoHullInput & { hullId: number }) => takeIntoHull(hullId, input),
    onSuccess: (_data, { hullId }) => forgetHullPlan(queryClient, hullId),
  });
}
