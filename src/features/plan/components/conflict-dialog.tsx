import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { planEmpty, planRead } from '../../../../shared/geometry/plan';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { InputField } from '../../../components/ui/field';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useCopyHull } from '../api/copy-hull';
import { discardPlanDraft } from '../api/discard-plan-draft';
import { getPlanQueryOptions } from '../api/get-plan';
import { getRevisionQueryOptions } from '../api/get-revision';
import { openSnapshot } from '../editor/initial-snapshot';
import { planRebase } from '../editor/rebase';
import { useEditor, usePlanEditor } from '../hooks/use-plan-editor';

const copyNameMax = 120;

/**
 * Shown when a save came back 409: someone saved a newer revision since this copy's base. Two ways on,
 * neither losing anything: reapply my changes on top of the latest, or keep my version whole as a copy of
 * the hull. Cancel leaves everything as it is (the draft stays on the server).
 */
export function ConflictDialog() {
  const { hull, store } = usePlanEditor();
  const conflict = useEditor((s) => s.conflict);
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const copyHull = useCopyHull(hull.id);
  const [busy, setBusy] = useState<'reapply' | 'copy' | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [copyName, setCopyName] = useState(`${hull.name} (my version)`.slice(0, copyNameMax));
  if (!conflict) return null;
  const latest = conflict.latestRevision;

  const close = () => {
    setError(null);
    store.getState().setConflict(null);
  };

  const basePlanOf = async (): Promise<Plan> => {
    const state = store.getState();
    if (state.basePlan) return state.basePlan;
    if (state.baseRevisionId === null) return planEmpty(hull.units);
    const response = await queryClient.fetchQuery(getRevisionQueryOptions(hull.id, state.baseRevisionId));
    const read = planRead(response.plan);
    if (!read.ok) throw new Error('The revision your changes started from could not be read.');
    return read.plan;
  };

  const reapply = async () => {
    setBusy('reapply');
    setError(null);
    try {
      const base = await basePlanOf();
      const fresh = await queryClient.fetchQuery({ ...getPlanQueryOptions(hull.id), staleTime: 0 });
      const opened = openSnapshot(fresh, null);
      if (!opened.ok) throw new Error(opened.message);
      const state = store.getState();
      const result = planRebase(base, state.plan, opened.snapshot.plan);
      if (!result.ok) {
        setError(result.message);
        return;
      }
      const revisionWords = fresh.revision ? `revision ${fresh.revision.id}${fresh.revision.authorName ? ` (saved by ${fresh.revision.authorName})` : ''}` : 'the latest plan';
      const clashes = result.clashes.length
        ? `\nChanged by both of you, yours kept: ${result.clashes.map((c) => c.label).join('; ')}.`
        : '';
      store.getState().load({
        plan: result.plan,
        baseRevisionId: opened.snapshot.baseRevisionId,
        basePlan: opened.snapshot.plan,
        // The server still holds the old draft, so the reapplied copy is autosaved over it.
        serverPlan: state.serverPlan,
        notice: `${result.applied.length} change${result.applied.length === 1 ? '' : 's'} of yours reapplied on top of ${revisionWords}. Look them over, then press Save revision.${clashes}`,
      });
    } catch (e) {
      setError(e instanceof Error && !('status' in e) ? e.message : describeError(e));
    } finally {
      setBusy(null);
    }
  };

  const saveAsCopy = async () => {
    const name = copyName.trim();
    if (!name) {
      setError('Give the copy a name.');
      return;
    }
    setBusy('copy');
    setError(null);
    try {
      const { hull: copy } = await copyHull.mutateAsync({ name, plan: store.getState().plan });
      // My version lives on in the copy; the draft on this hull would only bring the conflict back.
      await discardPlanDraft(hull.id).catch(() => undefined);
      const fresh = await queryClient.fetchQuery({ ...getPlanQueryOptions(hull.id), staleTime: 0 });
      const opened = openSnapshot(fresh, null);
      if (opened.ok) store.getState().load(opened.snapshot);
      await navigate(`/hulls/${copy.id}/lines`);
    } catch (e) {
      setError(describeError(e));
      setBusy(null);
    }
  };

  return (
    <Dialog title="Someone saved a newer revision" onCancel={close}>
      <p>
        {latest
          ? `${latest.authorName || 'Someone'} saved revision ${latest.id} at ${formatWhen(latest.createdAt)}${latest.summary ? ` (“${latest.summary}”)` : ''}, after you started from ${store.getState().baseRevisionId === null ? 'the empty plan' : `revision ${store.getState().baseRevisionId}`}.`
          : 'A newer revision was saved after you started.'}{' '}
        Your changes are safe in this tab and in your draft. How do you want to go on?
      </p>
      <div className="flex flex-col gap-2 rounded-lg border border-rule p-3">
        <Button busy={busy === 'reapply'} disabled={busy !== null} onClick={() => void reapply()}>
          Reload the latest and reapply my change
        </Button>
        <p className="text-base text-muted">Your changed cells and settings go on top of the newer revision. Where you both changed the same thing, yours is kept and listed.</p>
      </div>
      <div className="flex flex-col gap-2 rounded-lg border border-rule p-3">
        <InputField label="Name of the copy" maxLength={copyNameMax} value={copyName} onChange={(e) => setCopyName(e.target.value)} />
        <Button variant="secondary" busy={busy === 'copy'} disabled={busy !== null} onClick={() => void saveAsCopy()}>
          Save my version as a copy of the hull
        </Button>
        <p className="text-base text-muted">A new hull, yours, starting from your version. This hull stays at the newer revision.</p>
      </div>
      {error && <Alert tone="error">{error}</Alert>}
      <div>
        <Button variant="quiet" onClick={close} disabled={busy !== null}>
          Cancel
        </Button>
      </div>
    </Dialog>
  );
}
