import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DraftResponse } from '../../../../shared/api/plan';
import { api } from '../../../lib/api-client';

export const planDraftKey = (hullId: number) => ['hulls', hullId, 'plan', 'draft'] as const;

export function getPlanDraft(hullId: number, options: { signal?: AbortSignal } = {}): Promise<DraftResponse> {
  return api.get<DraftResponse>(`/api/hulls/${hullId}/plan/draft`, options);
}

export function getPlanDraftQueryOptions(hullId: number) {
  // The draft is read once when the hull opens; after that the editor's copy is newer than the server's.
  return queryOptions({ queryKey: planDraftKey(hullId), queryFn: ({ signal }) => getPlanDraft(hullId, { signal }), staleTime: Infinity });
}

/** The signed-in person's own autosaved draft of the plan, if they left one. */
export function usePlanDraft(hullId: number, options: { enabled?: boolean } = {}) {
  return useQuery({ ...getPlanDraftQueryOptions(hullId), ...options });
}
