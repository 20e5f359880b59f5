import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HullPin } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export const hullPinsKey = (hullId: number) => ['hulls', hullId, 'pins'] as const;

export function getHullPins(hullId: number, options: { signal?: AbortSignal } = {}): Promise<{ pins: HullPin[] }> {
  return api.get<{ pins: HullPin[] }>(`/api/hulls/${hullId}/pins`, options);
}

export function getHullPinsQueryOptions(hullId: number) {
  return queryOptions({ queryKey: hullPinsKey(hullId), queryFn: ({ signal }) => getHullPins(hullId, { signal }) });
}

/** What the hull took from the Library, and whether there is something newer. */
export function useHullPins(hullId: number) {
  return useQuery(getHullPinsQueryOptions(hullId));
}
