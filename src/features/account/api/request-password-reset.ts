import { useMutation } from '@tanstack/react-query';
import type { RequestPasswordResetInput } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

export function requestPasswordReset(input: RequestPasswordResetInput): Promise<{ message: string }> {
  return api.post<{ message: string }>('/api/account/password-reset', input);
}

/** Ask for a link to choose a new password (the answer never says whether the address has an account). */
export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
