import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RevisionSummary } from '../../../../shared/api/plan';
import { api } from '../../../lib/api-client';

export function getRevisions(hullId: number, options: { signal?: AbortSignal } = {}): Promise<{ revisions: RevisionSummary[] }> {
  return api.get<{ revisions: RevisionSummary[] }>(`/api/hulls/${hullId}/plan/revisions`, options);
}

export function getRevisionsQueryOptions(hullId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'plan', 'revisions'], queryFn: ({ signal }) => getRevisions(hullId, { signal }) });
}

/** The hull's revisions, newest first. */
export function useRevisions(hullId: number) {
  return useQuery(getRevisionsQueryOptions(hullId));
}
