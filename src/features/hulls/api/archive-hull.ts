import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';
import { getHullQueryOptions } from './get-hull';

export function archiveHull(hullId: number): Promise<{ hull: HullSummary }> {
  return api.post<{ hull: HullSummary }>(`/api/hulls/${hullId}/archive`);
}

/** The owner puts a finished (or abandoned) hull away: kept whole, listed apart. */
export function useArchiveHull(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => archiveHull(hullId),
    onSuccess: async ({ hull }) => {
      queryClient.setQueryData(getHullQueryOptions(hullId).queryKey, { hull });
      await queryClient.invalidateQueries({ queryKey: ['hulls'], exact: true });
    },
  });
}
