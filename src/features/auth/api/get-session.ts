import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionResponse } from '../../../../shared/api/auth';
import { api } from '../../../lib/api-client';

export const sessionQueryKey = ['session'] as const;

export function getSession(options: { signal?: AbortSignal } = {}): Promise<SessionResponse> {
  return api.get<SessionResponse>('/api/session', options);
}

export function getSessionQueryOptions() {
  return queryOptions({
    queryKey: sessionQueryKey,
    queryFn: ({ signal }) => getSession({ signal }),
    staleTime: 60_000,
  });
}

/** Who is signed in (`data.user`, null when nobody) and the CSRF token for state-changing calls. */
export function useSession() {
  return useQuery(getSessionQueryOptions());
}
