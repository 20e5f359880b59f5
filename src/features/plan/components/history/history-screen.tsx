import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { RotateCcw } from 'lucide-react';
import type { RevisionSummary } from '../../../../../shared/api/plan';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import { ConfirmInline } from '../../../../components/ui/confirm-inline';
import { Loading } from '../../../../components/ui/loading';
import { ApiError, describeError } from '../../../../lib/api-client';
import { formatWhen } from '../../../../lib/labels';
import { getPlanQueryOptions } from '../../api/get-plan';
import { useRevisions } from '../../api/get-revisions';
import { useRestoreRevision } from '../../api/restore-revision';
import { revisionSavedInCache } from '../../api/save-revision';
import { openSnapshot } from '../../editor/initial-snapshot';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';
import { RevisionChanges } from './revision-changes';
import { EmptyNote } from '../../../../components/ui/empty-note';

function RestoreButton({ revision, latestId }: { revision: RevisionSummary; latestId: number }) {
  const { hull, store } = usePlanEditor();
  const changed = useEditor((s) => s.plan !== s.basePlan);
  const restore = useRestoreRevision(hull.id);
  const queryClient = useQueryClient();
  const [asking, setAsking] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const confirm = async () => {
    setError(null);
    try {
      const saved = await restore.mutateAsync({ revisionId: revision.id, baseRevisionId: latestId });
      const fresh = await queryClient.fetchQuery({ ...getPlanQueryOptions(hull.id), staleTime: 0 });
      await revisionSavedInCache(queryClient, hull.id, saved.revision, fresh.plan);
      const opened = openSnapshot(fresh, null);
      if (opened.ok) store.getState().load({ ...opened.snapshot, notice: `Revision ${revision.id} restored: it is saved again as revision ${saved.revision.id}.` });
      setAsking(false);
    } catch (e) {
      if (e instanceof ApiError && e.status === 409) {
        setError('Someone saved a newer revision a moment ago; the list now shows it. Look at it, then restore again if you still want to.');
        await queryClient.invalidateQueries({ queryKey: ['hulls', hull.id, 'plan', 'revisions'] });
      } else {
        setError(describeError(e));
      }
    }
  };

  return (
    <div className="flex flex-col gap-2">
      {asking ? (
        <ConfirmInline
          question={`Restore revision ${revision.id}? Its plan is saved again as a new revision on top of revision ${latestId}; no revision is changed or lost.${changed ? ' Your changes not yet in a revision are discarded.' : ''}`}
          confirmLabel={`Yes, restore revision ${revision.id}`}
          tone="primary"
          busy={restore.isPending}
          onCancel={() => setAsking(false)}
          onConfirm={() => void confirm()}
        />
      ) : (
        <Button variant="secondary" aria-label={`Restore revision ${revision.id}`} onClick={() => setAsking(true)}>
          <RotateCcw aria-hidden="true" className="size-5" />
          Restore
        </Button>
      )}
      {error && <Alert tone="error">{error}</Alert>}
    </div>
  );
}

/** The Revisions screen: every saved revision, two of them compared in plain words, and an older one restored. */
export function HistoryScreen() {
  const { hull, canEditLines } = usePlanEditor();
  const notation = useEditor((s) => s.plan.lines.notation);
  const revisions = useRevisions(hull.id);
  const [pair, setPair] = useState<{ from: number | null; to: number | null }>({ from: null, to: null });

  if (revisions.isPending) return <Loading label="Loading the revisions…" />;
  if (revisions.isError) {
    return (
      <Alert tone="error" title="The revisions could not be loaded.">
        <p>{describeError(revisions.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void revisions.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  const list = revisions.data.revisions;
  const latestId = list[0]?.id ?? null;
  // Until the person picks, compare the latest with the one before it.
  const from = pair.from ?? list[1]?.id ?? null;
  const to = pair.to ?? list[0]?.id ?? null;

  return (
    <div className="flex flex-col gap-6">
      <title>{`Revisions · ${hull.name} · Loftbench`}</title>
      <div className="flex flex-col gap-1">
        <h2 className="text-2xl font-bold">Revisions</h2>
        <p className="max-w-prose text-muted">Every saved state of the plan, newest first. A revision never changes: restoring an old one saves it again as a new one.</p>
      </div>
      {list.length === 0 ? (
        <EmptyNote>No revision is saved yet. Press Save revision when the lines are as you want them.</EmptyNote>
      ) : (
        <div className="overflow-x-auto rounded-xl border border-rule bg-surface" role="region" aria-label="Revision list" tabIndex={0}>
          <table className="min-w-full border-collapse text-left">
            <caption className="sr-only">Revisions of {hull.name}</caption>
            <thead className="bg-paper">
              <tr>
                <th scope="col" className="px-3 py-2">From</th>
                <th scope="col" className="px-3 py-2">To</th>
                <th scope="col" className="px-3 py-2">Revision</th>
                <th scope="col" className="px-3 py-2">When</th>
                <th scope="col" className="px-3 py-2">Who</th>
                <th scope="col" className="px-3 py-2">What changed</th>
                {canEditLines && (
                  <th scope="col" className="px-3 py-2">
                    <span className="sr-only">Restore</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {list.map((revision) => (
                <tr key={revision.id} className="border-t border-rule align-top">
                  <td className="px-3 py-2">
                    <input type="radio" name="compare-from" className="size-6" aria-label={`Compare from revision ${revision.id}`} checked={from === revision.id} onChange={() => setPair({ from: revision.id, to })} />
                  </td>
                  <td className="px-3 py-2">
                    <input type="radio" name="compare-to" className="size-6" aria-label={`Compare to revision ${revision.id}`} checked={to === revision.id} onChange={() => setPair({ from, to: revision.id })} />
                  </td>
                  <th scope="row" className="px-3 py-2 font-mono font-semibold whitespace-nowrap">
                    {revision.id}
                    {revision.id === latestId && <span className="ml-2 font-sans text-sm font-normal text-ok">latest</span>}
                  </th>
                  <td className="px-3 py-2 whitespace-nowrap">
                    <time dateTime={revision.createdAt}>{formatWhen(revision.createdAt)}</time>
                  </td>
                  <td className="px-3 py-2 whitespace-nowrap">{revision.authorName}</td>
                  <td className="px-3 py-2">{revision.summary}</td>
                  {canEditLines && <td className="px-3 py-2">{revision.id !== latestId && latestId !== null && <RestoreButton revision={revision} latestId={latestId} />}</td>}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {from !== null && to !== null && from !== to && <RevisionChanges hullId={hull.id} from={from} to={to} notation={notation} />}
      {from !== null && from === to && <p className="text-muted">Pick two different revisions to compare.</p>}
      {list.length === 1 && <p className="text-muted">With one revision there is nothing to compare yet.</p>}
    </div>
  );
}
