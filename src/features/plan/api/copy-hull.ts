import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { api } from '../../../lib/api-client';

/** A new hull, owned by me, starting from `plan`: the way out of a conflict that keeps my version whole. */
export function copyHull(hullId: number, input: { name: string; plan?: Plan }): Promise<{ hull: HullSummary }> {
  return api.post<{ hull: HullSummary }>(`/api/hulls/${hullId}/copy`, input);
}

export function useCopyHull(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { name: string; plan?: Plan }) => copyHull(hullId, input),
    onSuccess: async ({ hull }) => {
      queryClient.setQueryData(['hulls', hull.id], { hull });
      await queryClient.invalidateQueries({ queryKey: ['hulls'], exact: true });
    },
  });
}
