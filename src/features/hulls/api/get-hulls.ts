import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';

export function getHulls(options: { signal?: AbortSignal } = {}): Promise<{ hulls: HullSummary[] }> {
  return api.get<{ hulls: HullSummary[] }>('/api/hulls', options);
}

export function getHullsQueryOptions() {
  return queryOptions({
    queryKey: ['hulls'],
    queryFn: ({ signal }) => getHulls({ signal }),
  });
}

/** The signed-in person's hulls, each with their role on it. */
export function useHulls() {
  return useQuery(getHullsQueryOptions());
}
