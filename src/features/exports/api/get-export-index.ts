import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExportIndexResponse } from '../../../../shared/api/exports';
import { api } from '../../../lib/api-client';

export function getExportIndex(hullId: number, options: { signal?: AbortSignal } = {}): Promise<ExportIndexResponse> {
  return api.get<ExportIndexResponse>(`/api/hulls/${hullId}/exports`, options);
}

export function getExportIndexQueryOptions(hullId: number) {
  return queryOptions({ queryKey: ['hulls', hullId, 'exports', 'index'], queryFn: ({ signal }) => getExportIndex(hullId, { signal }) });
}

/** Every export of the latest revision with its size (the server makes each file once per revision to measure it). */
export function useExportIndex(hullId: number) {
  return useQuery(getExportIndexQueryOptions(hullId));
}
