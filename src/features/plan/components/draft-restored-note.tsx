import { useState } from 'react';
import { History } from 'lucide-react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ConfirmInline } from '../../../components/ui/confirm-inline';
import { useQueryClient } from '@tanstack/react-query';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useDiscardPlanDraft } from '../api/discard-plan-draft';
import { getPlanQueryOptions } from '../api/get-plan';
import { openSnapshot } from '../editor/initial-snapshot';
import { useEditor, usePlanEditor } from '../hooks/use-plan-editor';

/** "Restored your unsaved changes from …", with a way to throw them away and go back to the latest revision. */
export function DraftRestoredNote() {
  const { hull, store } = usePlanEditor();
  const restoredAt = useEditor((s) => s.restoredDraftAt);
  const baseRevisionId = useEditor((s) => s.baseRevisionId);
  const basePlanKnown = useEditor((s) => s.basePlan !== null);
  const discard = useDiscardPlanDraft(hull.id);
  const queryClient = useQueryClient();
  const [asking, setAsking] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!restoredAt) return null;

  const discardNow = async () => {
    setError(null);
    try {
      await discard.mutateAsync();
      const latest = await queryClient.fetchQuery({ ...getPlanQueryOptions(hull.id), staleTime: 0 });
      const opened = openSnapshot(latest, null);
      if (opened.ok) store.getState().load({ ...opened.snapshot, notice: 'Your unsaved changes were discarded. This is the latest revision.' });
    } catch (e) {
      setError(describeError(e));
    }
  };

  return (
    <Alert tone="info" title={`Restored your unsaved changes from ${formatWhen(restoredAt)}`}>
      <p>
        {basePlanKnown
          ? 'They are your draft: keep working, and save a revision when they are ready.'
          : `They were made on ${baseRevisionId === null ? 'the empty plan' : `revision ${baseRevisionId}`}, and someone has saved a newer revision since. Saving will ask how to combine them.`}
      </p>
      <div className="mt-2 flex flex-wrap gap-3">
        {asking ? (
          <ConfirmInline
            question="Discard your unsaved changes? The plan goes back to the latest revision, and this cannot be undone."
            confirmLabel="Yes, discard my changes"
            cancelLabel="Keep my changes"
            busy={discard.isPending}
            onCancel={() => setAsking(false)}
            onConfirm={() => void discardNow()}
          />
        ) : (
          <>
            <Button variant="secondary" onClick={() => setAsking(true)}>
              <History aria-hidden="true" className="size-5" />
              Discard my changes
            </Button>
            <Button variant="quiet" onClick={() => store.getState().dismissRestored()}>
              Hide this note
            </Button>
          </>
        )}
      </div>
      {error && <p className="mt-2 font-medium text-danger">{error}</p>}
    </Alert>
  );
}

/** A note after the copy changed wholesale (changes reapplied on a newer revision, a revision restored). */
export function EditorNotice() {
  const { store } = usePlanEditor();
  const notice = useEditor((s) => s.notice);
  if (!notice) return null;
  return (
    <Alert tone="info">
      <p className="whitespace-pre-line">{notice}</p>
      <Button variant="quiet" className="mt-1 -ml-5" onClick={() => store.getState().setNotice(null)}>
        Hide this note
      </Button>
    </Alert>
  );
}
