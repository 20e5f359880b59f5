import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { SessionResponse } from '../../../../shared/api/auth';
import { api } from '../../../lib/api-client';
import { sessionQueryKey } from './get-session';

export function signOut(): Promise<void> {
  return api.post<void>('/api/auth/sign-out');
}

/**
 * Forgets whatever belonged to the person who was signed in, so the next one at a shared workshop laptop
 * sees none of it, and reads the session again (the server hands out a new CSRF token with it).
 * Call it only once the signed-in pages are gone: their guard would otherwise send the person to sign-in
 * with a `next` pointing back at the last person's hull.
 */
export async function forgetSignedInPerson(queryClient: QueryClient): Promise<void> {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionQueryKey[0] });
  queryClient.setQueryData<SessionResponse>(sessionQueryKey, (old) => ({ user: null, csrfToken: old?.csrfToken ?? '' }));
  await queryClient.invalidateQueries({ queryKey: sessionQueryKey, refetchType: 'all' });
}

/** Signs out, then goes to the sign-in page. */
export function useSignOut() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      // flushSync: the signed-in pages must be gone from the screen, not just from the router's state,
      // before the session is dropped (see forgetSignedInPerson).
      await navigate('/sign-in', { replace: true, flushSync: true });
      await forgetSignedInPerson(queryClient);
    },
  });
}
