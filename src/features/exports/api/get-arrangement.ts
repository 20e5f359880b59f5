import { type QueryClient, queryOptions, useQuery } from '@tanstack/react-query';
import type { ArrangementResponse } from '../../../../shared/api/exports';
import { api } from '../../../lib/api-client';

export function getArrangement(hullId: number, options: { signal?: AbortSignal } = {}): Promise<ArrangementResponse> {
  return api.get<ArrangementResponse>(`/api/hulls/${hullId}/cut-list/arrangement`, options);
}

export function getArrangementQueryOptions(hullId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'cut-list', 'arrangement'], queryFn: ({ signal }) => getArrangement(hullId, { signal }) });
}

/** The cut list's pieces on sheets: the one saved by hand for the latest revision, or the packer's. */
export function useArrangement(hullId: number) {
  return useQuery(getArrangementQueryOptions(hullId));
}

/** After a save or a reset: the answer is the arrangement now, and the cut list files (Downloads sizes) changed with it. */
export function arrangementChanged(queryClient: QueryClient, hullId: number, fresh: ArrangementResponse) {
  queryClient.setQueryData(getArrangementQueryOptions(hullId).queryKey, fresh);
  return queryClient.invalidateQueries({ queryKey: ['hulls', hullId, 'exports', 'index'] });
}
