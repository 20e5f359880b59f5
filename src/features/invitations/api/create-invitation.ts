import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateInvitationInput, InvitationSummary } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';
import { invitationsKey } from './get-invitations';

export function createInvitation(hullId: number, input: CreateInvitationInput): Promise<{ invitation: InvitationSummary }> {
  return api.post<{ invitation: InvitationSummary }>(`/api/hulls/${hullId}/invitations`, input);
}

/** The owner invites someone by e-mail; the server mails the link before it answers. */
export function useCreateInvitation(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateInvitationInput) => createInvitation(hullId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsKey(hullId) }),
  });
}
