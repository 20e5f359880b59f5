import type { QueryClient } from '@tanstack/react-query';
import type { RevisionSummary, SavePlanInput } from '../../../../shared/api/plan';
import type { PlanChange } from '../../../../shared/geometry/plan-compare';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { api } from '../../../lib/api-client';
import { planDraftKey } from './get-plan-draft';
import { planKey } from './get-plan';

export interface SavedRevision {
  revision: RevisionSummary;
  changes: PlanChange[];
}

/** Save the plan as a new revision on top of `baseRevisionId`; 409 `stale_revision` when someone saved since. */
export function saveRevision(hullId: number, input: SavePlanInput): Promise<SavedRevision> {
  return api.post<SavedRevision>(`/api/hulls/${hullId}/plan/revisions`, input);
}

/**
 * What the cache learns from a new revision: it is the latest plan, the saver's draft is gone, and the
 * history, the parts' results and the hull list (its last change) are out of date.
 */
export async function revisionSavedInCache(queryClient: QueryClient, hullId: number, revision: RevisionSummary, plan: Plan): Promise<void> {
  queryClient.setQueryData(planKey(hullId), { revision, plan });
  queryClient.setQueryData(planDraftKey(hullId), { draft: null });
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: [...planKey(hullId), 'revisions'] }),
    queryClient.invalidateQueries({ queryKey: ['hulls', hullId, 'parts'] }),
    queryClient.invalidateQueries({ queryKey: ['hulls'], exact: true }),
  ]);
}
