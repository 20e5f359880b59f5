import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';
import { getHullQueryOptions } from './get-hull';

export function unarchiveHull(hullId: number): Promise<{ hull: HullSummary }> {
  return api.post<{ hull: HullSummary }>(`/api/hulls/${hullId}/unarchive`);
}

/** The owner brings an archived hull back among the current ones. */
export function useUnarchiveHull(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => unarchiveHull(hullId),
    onSuccess: async ({ hull }) => {
      queryClient.setQueryData(getHullQueryOptions(hullId).queryKey, { hull });
      await queryClient.invalidateQueries({ queryKey: ['hulls'], exact: true });
    },
  });
}
