import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NoticesResponse } from '../../../../shared/api/library';
import { api } from '../../../lib/api-client';

export function getNotices(options: { signal?: AbortSignal } = {}): Promise<NoticesResponse> {
  return api.get<NoticesResponse>('/api/notices', options);
}

export function getNoticesQueryOptions() {
  return queryOptions({ queryKey: ['notices'], queryFn: ({ signal }) => getNotices({ signal }) });
}

/**
 * The person's open notices. Asked again every few minutes and when the tab comes back into view, so a
 * revision published while the page was open shows up without a reload.
 */
export function useNotices(options: { enabled?: boolean } = {}) {
  return useQuery({ ...getNoticesQueryOptions(), refetchInterval: 3 * 60_000, ...options });
}
