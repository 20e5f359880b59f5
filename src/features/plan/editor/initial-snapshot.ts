import type { DraftResponse, PlanResponse } from '../../../../shared/api/plan';
import { planRead } from '../../../../shared/geometry/plan';
import type { EditorSnapshot } from './editor-store';
import { jsonEqual } from './plan-update';

export type OpenResult = { ok: true; snapshot: EditorSnapshot; notice: string | null } | { ok: false; message: string };

/**
 * The working copy when a hull is opened: the person's draft when they left one (it is newer than any
 * revision they saw), else the latest revision. Both are read through `planRead` so defaults are filled
 * in and an unreadable document is said plainly instead of half-loaded.
 */
export function openSnapshot(latest: PlanResponse, draft: DraftResponse['draft'] | null): OpenResult {
  const read = planRead(latest.plan);
  if (!read.ok) return { ok: false, message: `The saved plan could not be read (${read.issues[0]?.field}: ${read.issues[0]?.message}).` };
  const latestId = latest.revision?.id ?? null;
  const base: EditorSnapshot = { plan: read.plan, baseRevisionId: latestId, basePlan: read.plan, serverPlan: read.plan };
  if (!draft) return { ok: true, snapshot: base, notice: null };

  const fromDraft = planRead(draft.plan);
  if (!fromDraft.ok) {
    return { ok: true, snapshot: base, notice: 'Your unsaved changes from last time could not be read, so the latest revision is shown.' };
  }
  // A draft that is the revision itself (changes made and undone) is nothing to restore.
  if (draft.baseRevisionId === latestId && jsonEqual(fromDraft.plan, read.plan)) return { ok: true, snapshot: base, notice: null };
  return {
    ok: true,
    snapshot: {
      plan: fromDraft.plan,
      baseRevisionId: draft.baseRevisionId,
      basePlan: draft.baseRevisionId === latestId ? read.plan : null,
      serverPlan: fromDraft.plan,
      restoredDraftAt: draft.updatedAt,
    },
    notice: null,
  };
}
