import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PartsResponse } from '../../../../shared/api/parts';
import { api, ApiError } from '../../../lib/api-client';

export function getPartsResults(hullId: number, options: { signal?: AbortSignal } = {}): Promise<PartsResponse> {
  return api.get<PartsResponse>(`/api/hulls/${hullId}/parts`, options);
}

export function getPartsResultsQueryOptions(hullId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'parts'], queryFn: ({ signal }) => getPartsResults(hullId, { signal }) });
}

/** The server's computed results for every part of the latest revision (areas, mass, bevels, warnings). */
export function usePartsResults(hullId: number) {
  return useQuery(getPartsResultsQueryOptions(hullId));
}

/** A 404 means this server does not compute parts yet, which is not an error to shout about. */
export function resultsNotAvailable(error: unknown): boolean {
  return error instanceof ApiError && error.status === 404;
}
