import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LibraryItemDetail } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export const libraryItemKey = (itemId: number) => ['library', itemId] as const;

export function getLibraryItem(itemId: number, options: { signal?: AbortSignal } = {}): Promise<{ item: LibraryItemDetail }> {
  return api.get<{ item: LibraryItemDetail }>(`/api/library/${itemId}`, options);
}

export function getLibraryItemQueryOptions(itemId: number) {
  return queryOptions({ queryKey: libraryItemKey(itemId), queryFn: ({ signal }) => getLibraryItem(itemId, { signal }) });
}

/** One Library item with its revisions and the latest curve or lines. */
export function useLibraryItem(itemId: number) {
  return useQuery(getLibraryItemQueryOptions(itemId));
}
