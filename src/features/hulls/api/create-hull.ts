import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateHullInput, HullSummary } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';
import { getHullQueryOptions } from './get-hull';

export function createHull(input: CreateHullInput): Promise<{ hull: HullSummary }> {
  return api.post<{ hull: HullSummary }>('/api/hulls', input);
}

export function useCreateHull() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createHull,
    onSuccess: async ({ hull }) => {
      // The answer is the new hull itself: its page can show at once, and the list is read again.
      queryClient.setQueryData(getHullQueryOptions(hull.id).queryKey, { hull });
      await queryClient.invalidateQueries({ queryKey: ['hulls'], exact: true });
    },
  });
}
