import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';
import { getHullQueryOptions } from './get-hull';

export function renameHull(hullId: number, name: string): Promise<{ hull: HullSummary }> {
  return api.patch<{ hull: HullSummary }>(`/api/hulls/${hullId}`, { name });
}

/** Owner or builder gives the hull another name. */
export function useRenameHull(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => renameHull(hullId, name),
    onSuccess: async ({ hull }) => {
      queryClient.setQueryData(getHullQueryOptions(hullId).queryKey, { hull });
      await queryClient.invalidateQueries({ queryKey: ['hulls'], exact: true });
    },
  });
}
