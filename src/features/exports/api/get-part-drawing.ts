import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PartDrawingResponse } from '../../../../shared/api/exports';
import { api } from '../../../lib/api-client';

export function getPartDrawing(hullId: number, partId: string, layer: number, options: { signal?: AbortSignal } = {}): Promise<PartDrawingResponse> {
  return api.get<PartDrawingResponse>(`/api/hulls/${hullId}/exports/parts/${encodeURIComponent(partId)}/drawing?layer=${layer}`, options);
}

export function getPartDrawingQueryOptions(hullId: number, partId: string, layer: number) {
  return queryOptions({
    queryKey: ['hulls', hullId, 'exports', 'drawing', partId, layer],
    queryFn: ({ signal }) => getPartDrawing(hullId, partId, layer, { signal }),
    // A revision's drawing never changes; a new revision changes the parts key, which the screen follows.
    staleTime: Infinity,
  });
}

/** One layer's template drawing, as the PDF writer draws it, for the tile preview. */
export function usePartDrawing(hullId: number, partId: string | null, layer: number) {
  return useQuery({ ...getPartDrawingQueryOptions(hullId, partId ?? '', layer), enabled: partId !== null });
}
