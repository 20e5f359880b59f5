import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanResponse } from '../../../../shared/api/plan';
import { api } from '../../../lib/api-client';

export const planKey = (hullId: number) => ['hulls', hullId, 'plan'] as const;

export function getPlan(hullId: number, options: { signal?: AbortSignal } = {}): Promise<PlanResponse> {
  return api.get<PlanResponse>(`/api/hulls/${hullId}/plan`, options);
}

export function getPlanQueryOptions(hullId: number) {
  return queryOptions({ queryKey: planKey(hullId), queryFn: ({ signal }) => getPlan(hullId, { signal }) });
}

/** The hull's latest saved revision (`revision` null and an empty plan before the first save). */
export function usePlan(hullId: number, options: { enabled?: boolean } = {}) {
  return useQuery({ ...getPlanQueryOptions(hullId), ...options });
}
