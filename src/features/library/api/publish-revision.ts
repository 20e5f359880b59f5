import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LibraryRevisionSummary, NewRevisionInput } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export function publishRevision(itemId: number, input: NewRevisionInput): Promise<{ revision: LibraryRevisionSummary; noticesRaised: number }> {
  return api.post<{ revision: LibraryRevisionSummary; noticesRaised: number }>(`/api/library/${itemId}/revisions`, input);
}

/** Publish a newer revision of one's own item; hulls that pin an older one hear of it. */
export function usePublishRevision(itemId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: NewRevisionInput) => publishRevision(itemId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['library'] }),
  });
}
