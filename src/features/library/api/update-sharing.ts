import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LibraryItemDetail, SharingInput } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';
import { libraryItemKey } from './get-library-item';

export function updateSharing(itemId: number, sharing: SharingInput): Promise<{ item: LibraryItemDetail }> {
  return api.patch<{ item: LibraryItemDetail }>(`/api/library/${itemId}`, { sharing });
}

/** The author changes who may see the item. */
export function useUpdateSharing(itemId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (sharing: SharingInput) => updateSharing(itemId, sharing),
    onSuccess: (data) => {
      queryClient.setQueryData(libraryItemKey(itemId), data);
      return queryClient.invalidateQueries({ queryKey: ['library'], exact: true });
    },
  });
}
