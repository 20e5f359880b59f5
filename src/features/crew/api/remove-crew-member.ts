import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function removeCrewMember(hullId: number, userId: number): Promise<void> {
  return api.delete<void>(`/api/hulls/${hullId}/crew/${userId}`);
}

/** The owner takes someone off the hull's crew. */
export function useRemoveCrewMember(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: number) => removeCrewMember(hullId, userId),
    // Removing oneself takes the hull off one's own list as well.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['hulls'] }),
  });
}
