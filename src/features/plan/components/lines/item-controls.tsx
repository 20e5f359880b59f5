import { ArrowDown, ArrowLeft, ArrowRight, ArrowUp, Pencil, Trash2 } from 'lucide-react';
import { Button } from '../../../../components/ui/button';

/** Which way the list runs on the table: lines are its rows (up and down), stations its columns (left and right). */
type ListRuns = 'rows' | 'columns';

const arrows = {
  rows: { earlier: { word: 'up', Icon: ArrowUp }, later: { word: 'down', Icon: ArrowDown } },
  columns: { earlier: { word: 'left', Icon: ArrowLeft }, later: { word: 'right', Icon: ArrowRight } },
} as const;

/**
 * The buttons of one line or station in its list: move it one place either way, change it, delete it.
 * Each names the item in its accessible name, because a screen reader hears "Move St 3 left", not an arrow.
 */
export function ItemControls({ name, index, count, runs, onMove, onChange, onDelete }: { name: string; index: number; count: number; runs: ListRuns; onMove: (label: string, toIndex: number) => void; onChange: () => void; onDelete: () => void }) {
  const { earlier, later } = arrows[runs];
  return (
    <div className="ml-auto flex flex-wrap gap-2 [&>button]:px-3">
      <Button variant="secondary" aria-label={`Move ${name} ${earlier.word}`} disabled={index === 0} onClick={() => onMove(`Move ${name} ${earlier.word}`, index - 1)}>
        <earlier.Icon aria-hidden="true" className="size-5" />
      </Button>
      <Button variant="secondary" aria-label={`Move ${name} ${later.word}`} disabled={index === count - 1} onClick={() => onMove(`Move ${name} ${later.word}`, index + 1)}>
        <later.Icon aria-hidden="true" className="size-5" />
      </Button>
      <Button variant="secondary" aria-label={`Change ${name}`} onClick={onChange}>
        <Pencil aria-hidden="true" className="size-5" />
        Change
      </Button>
      <Button variant="secondary" aria-label={`Delete ${name}`} onClick={onDelete}>
        <Trash2 aria-hidden="true" className="size-5" />
        Delete
      </Button>
    </div>
  );
}
