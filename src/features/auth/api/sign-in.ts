import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { SessionUser, SignInInput } from '../../../../shared/api/auth';
import { api } from '../../../lib/api-client';
import { getSessionQueryOptions, sessionQueryKey } from './get-session';

export function signIn(input: SignInInput): Promise<{ user: SessionUser }> {
  // A 401 here means a wrong e-mail or password: the form shows it, the client must not bounce to sign-in.
  return api.post<{ user: SessionUser }>('/api/auth/sign-in', input, { redirectOnUnauthorized: false });
}

/**
 * After signing in or up the server starts a new session, with a new CSRF token: drop what belonged to
 * whoever was here before and read the session afresh.
 */
export async function refreshAfterSignIn(queryClient: QueryClient): Promise<void> {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionQueryKey[0] });
  await queryClient.fetchQuery({ ...getSessionQueryOptions(), staleTime: 0 });
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: () => refreshAfterSignIn(queryClient),
  });
}
