import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BuildPartResponse } from '../../../../shared/api/build-log';
import { api } from '../../../lib/api-client';

export function getBuildPart(hullId: number, partId: string, options: { signal?: AbortSignal } = {}): Promise<BuildPartResponse> {
  return api.get<BuildPartResponse>(`/api/hulls/${hullId}/build-log/parts/${encodeURIComponent(partId)}`, options);
}

export function getBuildPartQueryOptions(hullId: number, partId: string) {
  return queryOptions({ queryKey: ['hulls', hullId, 'build-log', 'parts', partId], queryFn: ({ signal }) => getBuildPart(hullId, partId, { signal }) });
}

/** One part's history, photos and bevel table. */
export function useBuildPart(hullId: number, partId: string | null) {
  return useQuery({ ...getBuildPartQueryOptions(hullId, partId ?? ''), enabled: partId !== null });
}
