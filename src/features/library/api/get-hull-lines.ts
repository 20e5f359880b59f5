import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanResponse } from '../../../../shared/api/plan';
import { api } from '../../../lib/api-client';

export function getHullPlan(hullId: number, options: { signal?: AbortSignal } = {}): Promise<PlanResponse> {
  return api.get<PlanResponse>(`/api/hulls/${hullId}/plan`, options);
}

/** The hull's latest plan, under the same key and in the same shape as the Lines screen reads it. */
export function getHullPlanQueryOptions(hullId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'plan'], queryFn: ({ signal }) => getHullPlan(hullId, { signal }) });
}

/** The lines of a hull's latest revision, to publish them. */
export function useHullLines(hullId: number | null) {
  return useQuery({ ...getHullPlanQueryOptions(hullId ?? 0), enabled: hullId !== null, select: (data) => ({ revision: data.revision, lines: data.plan.lines }) });
}
