import { useMemo, useState, type ReactNode } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { HullSummary } from '../../../../shared/api/hulls';
import type { DraftResponse, PlanResponse } from '../../../../shared/api/plan';
import { describeError } from '../../../lib/api-client';
import { usePlanDraft } from '../api/get-plan-draft';
import { usePlan } from '../api/get-plan';
import { revisionSavedInCache, saveRevision } from '../api/save-revision';
import { savePlanDraft } from '../api/save-plan-draft';
import { createEditorStore, type EditorStore } from '../editor/editor-store';
import { openSnapshot } from '../editor/initial-snapshot';
import { createSaver, type Saver } from '../editor/saver';
import { useAutosaveEvents } from '../hooks/use-autosave-events';
import { PlanEditorContext, type PlanEditorContextValue } from '../hooks/use-plan-editor';

type Core = { ok: true; store: EditorStore; saver: Saver } | { ok: false; message: string };

function coreOf(hullId: number, latest: PlanResponse, draft: DraftResponse['draft'], queryClient: QueryClient): Core {
  const opened = openSnapshot(latest, draft);
  if (!opened.ok) return { ok: false, message: opened.message };
  const store = createEditorStore(opened.snapshot);
  if (opened.notice) store.getState().setNotice(opened.notice);
  const saver = createSaver(store, {
    putDraft: (input, options) => savePlanDraft(hullId, input, options),
    postRevision: (input) => saveRevision(hullId, input),
    onRevisionSaved: (revision, plan) => revisionSavedInCache(queryClient, hullId, revision, plan),
  });
  return { ok: true, store, saver };
}

/**
 * Loads the hull's latest revision and (for those who may edit) the person's draft, then holds the one
 * working copy that the Lines, Frames and Revisions screens edit and the header's save state shows.
 * Mounted once per hull page, so switching screens keeps the copy and its undo steps.
 */
export function PlanEditorProvider({ hull, children }: { hull: HullSummary; children: ReactNode }) {
  const queryClient = useQueryClient();
  const mayEdit = hull.role !== 'helper';
  const plan = usePlan(hull.id);
  // A helper can leave no draft, so there is none to look for.
  const draft = usePlanDraft(hull.id, { enabled: mayEdit });
  const [core, setCore] = useState<Core | null>(null);

  // Made once, from the first answers: later answers of these queries (a refetch, a save) must not
  // replace the copy being edited. Set during render so the screens see it in the same pass.
  if (core === null && plan.data && (!mayEdit || draft.data)) {
    setCore(coreOf(hull.id, plan.data, mayEdit ? (draft.data?.draft ?? null) : null, queryClient));
  }

  const failed = core === null ? (plan.isError ? plan.error : mayEdit && draft.isError ? draft.error : null) : null;
  const retry = plan.refetch;
  const retryDraft = draft.refetch;
  const value = useMemo((): PlanEditorContextValue => {
    if (failed) {
      return {
        state: 'error',
        message: describeError(failed),
        retry: () => {
          void retry();
          if (mayEdit) void retryDraft();
        },
      };
    }
    if (!core) return { state: 'loading' };
    if (!core.ok) return { state: 'error', message: core.message, retry: () => window.location.reload() };
    return { state: 'ready', hull, store: core.store, saver: core.saver, canEditLines: mayEdit, canEditParts: hull.role === 'owner' || hull.role === 'builder' };
  }, [core, failed, hull, mayEdit, retry, retryDraft]);

  useAutosaveEvents(core?.ok ? core.store : null, core?.ok ? core.saver : null, !!core?.ok && mayEdit);
  return <PlanEditorContext.Provider value={value}>{children}</PlanEditorContext.Provider>;
}
