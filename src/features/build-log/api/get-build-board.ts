import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BuildBoardResponse } from '../../../../shared/api/build-log';
import { api } from '../../../lib/api-client';

export function getBuildBoard(hullId: number, options: { signal?: AbortSignal } = {}): Promise<BuildBoardResponse> {
  return api.get<BuildBoardResponse>(`/api/hulls/${hullId}/build-log`, options);
}

export function getBuildBoardQueryOptions(hullId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'build-log'], queryFn: ({ signal }) => getBuildBoard(hullId, { signal }) });
}

/** Every part of the hull with its stages, flags, and material used against the estimate. */
export function useBuildBoard(hullId: number) {
  return useQuery(getBuildBoardQueryOptions(hullId));
}
