import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';

export function getHullList(options: { signal?: AbortSignal } = {}): Promise<{ hulls: HullSummary[] }> {
  return api.get<{ hulls: HullSummary[] }>('/api/hulls', options);
}

/** The same list and key as the Hulls page, read here for choosing a hull. */
export function getHullListQueryOptions() {
  return queryOptions({ queryKey: ['hulls'], queryFn: ({ signal }) => getHullList({ signal }) });
}

/** The person's hulls on which they may change lines and camber (owner, builder, designer), not archived. */
export function useEditableHulls() {
  return useQuery({
    ...getHullListQueryOptions(),
    select: (data) => data.hulls.filter((h) => h.role !== 'helper' && !h.archived),
  });
}
