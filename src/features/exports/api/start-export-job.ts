import { useMutation } from '@tanstack/react-query';
import type { ExportJobStart, ExportJobStatus } from '../../../../shared/api/exports';
import { api } from '../../../lib/api-client';

export function startExportJob(hullId: number, input: ExportJobStart): Promise<{ job: ExportJobStatus }> {
  return api.post<{ job: ExportJobStatus }>(`/api/hulls/${hullId}/exports/jobs`, input);
}

/** Starts an export that may take a while (a big tiled PDF, the zip) on the server. */
export function useStartExportJob(hullId: number) {
  return useMutation({ mutationFn: (input: ExportJobStart) => startExportJob(hullId, input) });
}
