import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PinCompareResponse } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export function getPinCompare(hullId: number, pinId: number, toRevisionId: number, options: { signal?: AbortSignal } = {}): Promise<PinCompareResponse> {
  return api.get<PinCompareResponse>(`/api/hulls/${hullId}/pins/${pinId}/compare?to=${toRevisionId}`, options);
}

export function getPinCompareQueryOptions(hullId: number, pinId: number, toRevisionId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'pins', pinId, 'compare', toRevisionId], queryFn: ({ signal }) => getPinCompare(hullId, pinId, toRevisionId, { signal }) });
}

/** The pinned revision against another, drawn over each other, with how far each part would move. */
export function usePinCompare(hullId: number, pinId: number, toRevisionId: number) {
  return useQuery(getPinCompareQueryOptions(hullId, pinId, toRevisionId));
}
