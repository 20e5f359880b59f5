import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionUser, SignUpInput } from '../../../../shared/api/auth';
import { api } from '../../../lib/api-client';
import { refreshAfterSignIn } from './sign-in';

export function signUp(input: SignUpInput): Promise<{ user: SessionUser }> {
  return api.post<{ user: SessionUser }>('/api/auth/sign-up', input);
}

/** Creates the account; the server signs the new person in. */
export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: () => refreshAfterSignIn(queryClient),
  });
}
