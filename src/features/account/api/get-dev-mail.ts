import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FakeMailMessage } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

export function getDevMail(options: { signal?: AbortSignal } = {}): Promise<{ messages: FakeMailMessage[] }> {
  return api.get<{ messages: FakeMailMessage[] }>('/api/dev/mail', options);
}

export function getDevMailQueryOptions() {
  return queryOptions({ queryKey: ['dev', 'mail'], queryFn: ({ signal }) => getDevMail({ signal }), staleTime: 0 });
}

/** What the local fake SMTP server received (development only; 404 elsewhere). */
export function useDevMail() {
  return useQuery({ ...getDevMailQueryOptions(), refetchInterval: 5000 });
}
