import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** Delete a photo: the owner and builders any, a helper the ones they added. */
export function deleteBuildPhoto(hullId: number, photoId: number): Promise<void> {
  return api.delete<void>(`/api/hulls/${hullId}/build-log/photos/${photoId}`);
}

export function useDeleteBuildPhoto(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (photoId: number) => deleteBuildPhoto(hullId, photoId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['hulls', hullId, 'build-log'] }),
  });
}
