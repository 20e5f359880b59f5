import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LibraryRevision } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export function getLibraryRevision(itemId: number, revisionId: number, options: { signal?: AbortSignal } = {}): Promise<{ revision: LibraryRevision }> {
  return api.get<{ revision: LibraryRevision }>(`/api/library/${itemId}/revisions/${revisionId}`, options);
}

export function getLibraryRevisionQueryOptions(itemId: number, revisionId: number) {
  // A revision never changes: once read, it is good for the whole visit.
  return queryOptions({ queryKey: ['library', itemId, 'revisions', revisionId], queryFn: ({ signal }) => getLibraryRevision(itemId, revisionId, { signal }), staleTime: Infinity });
}

/** One revision with its curve or lines. */
export function useLibraryRevision(itemId: number, revisionId: number | null) {
  return useQuery({ ...getLibraryRevisionQueryOptions(itemId, revisionId ?? 0), enabled: revisionId !== null });
}
