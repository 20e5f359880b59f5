import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SavedRevision } from './save-revision';

/** Upload a whole plan document (as downloaded from Loftbench); saved as a new revision when it validates. */
export function importPlanJson(hullId: number, input: { baseRevisionId: number | null; document: unknown }): Promise<SavedRevision> {
  return api.post<SavedRevision>(`/api/hulls/${hullId}/plan/import/json`, input);
}

export function useImportPlanJson(hullId: number) {
  return useMutation({ mutationFn: (input: { baseRevisionId: number | null; document: unknown }) => importPlanJson(hullId, input) });
}
