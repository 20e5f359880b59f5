import { useState } from 'react';
import { useBlocker } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { usePlanEditor } from '../hooks/use-plan-editor';

/**
 * Leaving the hull with changes that are not in a revision: offer to save one first. The changes are
 * safe either way (they are the draft and come back next time); this is about not forgetting them.
 */
export function LeaveGuard() {
  const { hull, store, saver, canEditLines } = usePlanEditor();
  const blocker = useBlocker(({ nextLocation }) => {
    if (!canEditLines) return false;
    // Sign-out and a lapsed session go to sign-in: never stand in their way.
    if (nextLocation.pathname === '/sign-in' || nextLocation.pathname.startsWith(`/hulls/${hull.id}/`) || nextLocation.pathname === `/hulls/${hull.id}`) return false;
    const state = store.getState();
    return state.plan !== state.basePlan;
  });
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (blocker.state !== 'blocked') return null;

  const saveAndLeave = async () => {
    setBusy(true);
    setError(null);
    const result = await saver.saveRevision();
    setBusy(false);
    if (result.ok) blocker.proceed();
    else if (result.conflict) blocker.reset();
    else setError(result.message);
  };

  return (
    <Dialog title="Save a revision before you go?" onCancel={() => blocker.reset()}>
      <p>Your changes to this plan are not in a revision yet. They are kept as your draft and come back when you open this hull again, but the rest of the crew cannot see them until you save a revision.</p>
      {error && <Alert tone="error">{error}</Alert>}
      <div className="flex flex-wrap gap-3">
        <Button busy={busy} onClick={() => void saveAndLeave()}>
          Save revision and leave
        </Button>
        <Button
          variant="secondary"
          disabled={busy}
          onClick={() => {
            void saver.flush();
            blocker.proceed();
          }}
        >
          Leave, keep my draft
        </Button>
        <Button variant="quiet" disabled={busy} onClick={() => blocker.reset()}>
          Stay here
        </Button>
      </div>
    </Dialog>
  );
}
