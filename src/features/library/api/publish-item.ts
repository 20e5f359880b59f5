import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LibraryItemDetail, PublishItemInput } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';
import { getLibraryQueryOptions } from './get-library';

export function publishItem(input: PublishItemInput): Promise<{ item: LibraryItemDetail }> {
  return api.post<{ item: LibraryItemDetail }>('/api/library', input);
}

/** Publish a new camber curve or set of lines, as its first revision. */
export function usePublishItem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: publishItem,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getLibraryQueryOptions().queryKey }),
  });
}
