import { Redo2, Undo2 } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { useEditor } from '../hooks/use-plan-editor';

/** Undo and redo for touch screens (the keyboard has Ctrl+Z and Ctrl+Shift+Z); each says what it will undo. */
export function UndoRedoButtons() {
  const undoLabel = useEditor((s) => s.undo[s.undo.length - 1]?.label ?? null);
  const redoLabel = useEditor((s) => s.redo[s.redo.length - 1]?.label ?? null);
  const undo = useEditor((s) => s.undoLast);
  const redo = useEditor((s) => s.redoLast);
  return (
    <div className="flex gap-2">
      <Button variant="secondary" disabled={!undoLabel} onClick={undo} title={undoLabel ? `Undo: ${undoLabel}` : 'Nothing to undo'} aria-label={undoLabel ? `Undo: ${undoLabel}` : 'Undo'}>
        <Undo2 aria-hidden="true" className="size-5" />
        Undo
      </Button>
      <Button variant="secondary" disabled={!redoLabel} onClick={redo} title={redoLabel ? `Redo: ${redoLabel}` : 'Nothing to redo'} aria-label={redoLabel ? `Redo: ${redoLabel}` : 'Redo'}>
        <Redo2 aria-hidden="true" className="size-5" />
        Redo
      </Button>
    </div>
  );
}
