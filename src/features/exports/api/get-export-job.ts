import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExportJobStatus } from '../../../../shared/api/exports';
import { api } from '../../../lib/api-client';

/** How often a running job is asked about (ms): often enough for a bar that moves, rarely enough to cost nothing. */
export const EXPORT_JOB_POLL_MS = 300;

export function getExportJob(hullId: number, jobId: string, options: { signal?: AbortSignal } = {}): Promise<{ job: ExportJobStatus }> {
  return api.get<{ job: ExportJobStatus }>(`/api/hulls/${hullId}/exports/jobs/${jobId}`, options);
}

export function getExportJobQueryOptions(hullId: number, jobId: string) {
  return queryOptions({
    queryKey: ['hulls', hullId, 'exports', 'jobs', jobId],
    queryFn: ({ signal }) => getExportJob(hullId, jobId, { signal }),
    // Asked again while it runs, and never once the server has said it does not know the job (it restarted,
    // or the job was forgotten): asking again would only hear the same, every 300 ms, for as long as the tab is open.
    refetchInterval: (query) => (query.state.status !== 'error' && (query.state.data?.job.state === 'running' || !query.state.data) ? EXPORT_JOB_POLL_MS : false),
  });
}

/** Where a started job is, asked again while it runs. */
export function useExportJob(hullId: number, jobId: string | null) {
  return useQuery({ ...getExportJobQueryOptions(hullId, jobId ?? ''), enabled: jobId !== null });
}

/** The finished file. */
export const exportJobFileHref = (hullId: number, jobId: string) => `/api/hulls/${hullId}/exports/jobs/${jobId}/file`;
