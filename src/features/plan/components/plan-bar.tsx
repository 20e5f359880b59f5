import type { ReactNode } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { usePlanEditorState } from '../hooks/use-plan-editor';
import { ConflictDialog } from './conflict-dialog';
import { DraftRestoredNote, EditorNotice } from './draft-restored-note';
import { LeaveGuard } from './leave-guard';
import { SaveRevisionControl } from './save-revision-control';
import { SaveStatusText } from './save-status';
import { UndoRedoButtons } from './undo-redo-buttons';

/** The hull page's plan controls under its title: where the copy stands, undo and redo, Save revision, and the notes and dialogs that go with them. */
export function PlanBar() {
  const editor = usePlanEditorState();
  if (editor.state === 'loading') return <Loading label="Loading the plan…" />;
  if (editor.state === 'error') {
    return (
      <Alert tone="error" title="The plan could not be loaded.">
        <p>{editor.message}</p>
        <Button variant="secondary" className="mt-3" onClick={editor.retry}>
          Try again
        </Button>
      </Alert>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-start gap-3">
        <SaveStatusText />
        {editor.canEditLines && (
          <>
            <UndoRedoButtons />
            <SaveRevisionControl />
          </>
        )}
      </div>
      <DraftRestoredNote />
      <EditorNotice />
      <ConflictDialog />
      <LeaveGuard />
    </div>
  );
}

/** A screen that needs the plan: waits for it, and says so plainly when it could not be loaded (the bar above says why). */
export function RequireEditor({ children }: { children: ReactNode }) {
  const editor = usePlanEditorState();
  if (editor.state !== 'ready') return null;
  return <>{children}</>;
}
