import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** How far (mm) a later revision may move a cut part before it is flagged, for this hull. */
export function updateBuildSettings(hullId: number, moveToleranceMm: number): Promise<{ moveToleranceMm: number }> {
  return api.put<{ moveToleranceMm: number }>(`/api/hulls/${hullId}/build-log/settings`, { moveToleranceMm });
}

export function useUpdateBuildSettings(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (moveToleranceMm: number) => updateBuildSettings(hullId, moveToleranceMm),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['hulls', hullId, 'build-log'] }),
  });
}
