import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CrewMember, Role } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';

export function changeCrewRole(hullId: number, userId: number, role: Role): Promise<{ member: CrewMember }> {
  return api.patch<{ member: CrewMember }>(`/api/hulls/${hullId}/crew/${userId}`, { role });
}

/** The owner gives a crew member another role. */
export function useChangeCrewRole(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: number; role: Role }) => changeCrewRole(hullId, userId, role),
    // An owner may change their own role, which changes this hull's page and the list of hulls too.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['hulls'] }),
  });
}
