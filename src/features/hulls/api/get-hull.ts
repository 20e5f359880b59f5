import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';

export function getHull(hullId: number, options: { signal?: AbortSignal } = {}): Promise<{ hull: HullSummary }> {
  return api.get<{ hull: HullSummary }>(`/api/hulls/${hullId}`, options);
}

export function getHullQueryOptions(hullId: number) {
  return queryOptions({
    queryKey: ['hulls', hullId],
    queryFn: ({ signal }) => getHull(hullId, { signal }),
  });
}

/** One hull with the signed-in person's role on it; a 404 when they are not on its crew. */
export function useHull(hullId: number) {
  return useQuery(getHullQueryOptions(hullId));
}
