import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CompletePasswordResetInput } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

export function completePasswordReset(input: CompletePasswordResetInput): Promise<{ message: string }> {
  return api.post<{ message: string }>('/api/account/password-reset/complete', input);
}

/** Set the new password; every session of the account ends, this browser's included if it was signed in as it. */
export function useCompletePasswordReset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: completePasswordReset,
    onSuccess: async () => {
      // What belonged to the account is gone with its sessions; the link's own answer stays (it is used now).
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'session' && q.queryKey[0] !== 'password-reset' });
      await queryClient.refetchQueries({ queryKey: ['session'] });
    },
  });
}
