import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invitationsKey } from './get-invitations';

export function revokeInvitation(hullId: number, invitationId: number): Promise<void> {
  return api.delete<void>(`/api/hulls/${hullId}/invitations/${invitationId}`);
}

/** The owner takes a pending invitation back; its link stops working. */
export function useRevokeInvitation(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: number) => revokeInvitation(hullId, invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsKey(hullId) }),
  });
}
