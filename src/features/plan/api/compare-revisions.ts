import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CompareResponse } from '../../../../shared/api/plan';
import { api } from '../../../lib/api-client';

export function compareRevisions(hullId: number, from: number, to: number, options: { signal?: AbortSignal } = {}): Promise<CompareResponse> {
  return api.get<CompareResponse>(`/api/hulls/${hullId}/plan/compare?from=${from}&to=${to}`, options);
}

export function compareRevisionsQueryOptions(hullId: number, from: number, to: number) {
  // Revisions never change, so neither does what differs between two of them.
  return queryOptions({
    queryKey: ['hulls', hullId, 'plan', 'compare', from, to],
    queryFn: ({ signal }) => compareRevisions(hullId, from, to, { signal }),
    staleTime: Infinity,
  });
}

/** What changed from revision `from` to revision `to`, in plain words; nothing asked until both are chosen. */
export function useCompareRevisions(hullId: number, pair: { from: number; to: number } | null) {
  return useQuery({ ...compareRevisionsQueryOptions(hullId, pair?.from ?? 0, pair?.to ?? 0), enabled: pair !== null });
}
