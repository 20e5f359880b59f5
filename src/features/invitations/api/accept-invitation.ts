import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput, AcceptInvitationResponse } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

export function acceptInvitation(input: AcceptInvitationInput): Promise<AcceptInvitationResponse> {
  // Signed out without an account this is 401 by design: the page asks, it must not bounce to sign-in.
  return api.post<AcceptInvitationResponse>('/api/invitations/accept', input, { redirectOnUnauthorized: false });
}

/** Accept: as the signed-in person, or with a new account on the invited address (then signed in). */
export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: async () => {
      // A new account means a new session (and CSRF token); either way the hull list changed.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'session' && q.queryKey[0] !== 'invitations' });
      await queryClient.refetchQueries({ queryKey: ['session'] });
    },
  });
}
