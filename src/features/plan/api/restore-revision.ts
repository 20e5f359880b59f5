import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SavedRevision } from './save-revision';

/** Save an older revision's plan again as a new revision on top of the latest; the old one stays as it was. */
export function restoreRevision(hullId: number, revisionId: number, baseRevisionId: number | null): Promise<SavedRevision> {
  return api.post<SavedRevision>(`/api/hulls/${hullId}/plan/revisions/${revisionId}/restore`, { baseRevisionId });
}

export function useRestoreRevision(hullId: number) {
  return useMutation({
    mutationFn: ({ revisionId, baseRevisionId }: { revisionId: number; baseRevisionId: number | null }) => restoreRevision(hullId, revisionId, baseRevisionId),
  });
}
