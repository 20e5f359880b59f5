import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

export function changePassword(input: ChangePasswordInput): Promise<{ message: string }> {
  return api.post<{ message: string }>('/api/account/password', input);
}

/** Change one's own password, proving the present one. */
export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
