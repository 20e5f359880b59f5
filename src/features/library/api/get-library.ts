import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LibraryItemSummary } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export function getLibrary(options: { signal?: AbortSignal } = {}): Promise<{ items: LibraryItemSummary[] }> {
  return api.get<{ items: LibraryItemSummary[] }>('/api/library', options);
}

export function getLibraryQueryOptions() {
  return queryOptions({ queryKey: ['library'], queryFn: ({ signal }) => getLibrary({ signal }) });
}

/** What the signed-in person may see in the Library: their own, what is shared with them, what is public. */
export function useLibrary() {
  return useQuery(getLibraryQueryOptions());
}
