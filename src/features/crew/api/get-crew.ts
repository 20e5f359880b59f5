import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CrewMember } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';

export function getCrew(hullId: number, options: { signal?: AbortSignal } = {}): Promise<{ crew: CrewMember[] }> {
  return api.get<{ crew: CrewMember[] }>(`/api/hulls/${hullId}/crew`, options);
}

export function getCrewQueryOptions(hullId: number) {
  return queryOptions({
    queryKey: ['hulls', hullId, 'crew'],
    queryFn: ({ signal }) => getCrew(hullId, { signal }),
  });
}

/** Everyone on a hull's crew with their role. */
export function useCrew(hullId: number) {
  return useQuery(getCrewQueryOptions(hullId));
}
