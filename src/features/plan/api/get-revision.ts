import { queryOptions } from '@tanstack/react-query';
import type { PlanResponse } from '../../../../shared/api/plan';
import { api } from '../../../lib/api-client';

/** One saved revision and its plan (immutable, so cached for good). */
export function getRevision(hullId: number, revisionId: number, options: { signal?: AbortSignal } = {}): Promise<PlanResponse> {
  return api.get<PlanResponse>(`/api/hulls/${hullId}/plan/revisions/${revisionId}`, options);
}

export function getRevisionQueryOptions(hullId: number, revisionId: number) {
  return queryOptions({
    queryKey: ['hulls', hullId, 'plan', 'revisions', revisionId],
    queryFn: ({ signal }) => getRevision(hullId, revisionId, { signal }),
    staleTime: Infinity,
  });
}
