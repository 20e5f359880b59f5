import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PartsResponse } from '../../../../shared/api/parts';
import { api } from '../../../lib/api-client';

export function getExportParts(hullId: number, options: { signal?: AbortSignal } = {}): Promise<PartsResponse> {
  return api.get<PartsResponse>(`/api/hulls/${hullId}/parts`, options);
}

/** The same key as the Frames screen's parts results: one cache entry for one server answer. */
export function getExportPartsQueryOptions(hullId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'parts'], queryFn: ({ signal }) => getExportParts(hullId, { signal }) });
}

/** The parts of the latest revision with their layers: which can be printed, which cannot yet and why. */
export function useExportParts(hullId: number) {
  return useQuery(getExportPartsQueryOptions(hullId));
}
