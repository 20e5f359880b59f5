import { memo, useEffect, useRef, useState } from 'react';
import { useStore } from 'zustand';
import { CircleAlert, Hourglass, TriangleAlert } from 'lucide-react';
import type { Station } from '../../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { cellLabel, cellText } from '../../editor/cell-entry';
import { cellKey } from '../../editor/types';
import { deviationShort } from '../../format';
import type { CellFlag } from '../../hooks/use-lines-check';
import { useEditor } from '../../hooks/use-plan-editor';
import { messageId, rowHeaderDetail, type GridRowSpec } from './grid-rows';
import type { GridStore } from './grid-store';

export interface CellCommit {
  row: number;
  col: number;
  text: string;
  /** Where to go after committing (rows, columns); null to stay. */
  move: [number, number] | null;
}

/** The text box inside a cell being edited. Enter, Tab and the up and down arrows commit and move; Escape puts the cell back. */
function CellEditor({ initial, label, onCommit, onCancel }: { initial: string; label: string; onCommit: (text: string, move: [number, number] | null) => void; onCancel: () => void }) {
  const [text, setText] = useState(initial);
  const input = useRef<HTMLInputElement>(null);
  const done = useRef(false);
  useEffect(() => {
    const el = input.current;
    if (!el) return;
    el.focus();
    el.setSelectionRange(el.value.length, el.value.length);
  }, []);
  const finish = (move: [number, number] | null) => {
    if (done.current) return;
    done.current = true;
    onCommit(text, move);
  };
  return (
    <input
      ref={input}
      aria-label={label}
      value={text}
      spellCheck={false}
      autoComplete="off"
      className="h-full w-full min-w-0 bg-surface px-2 font-mono text-base text-ink outline-none"
      onChange={(event) => setText(event.target.value)}
      onBlur={() => finish(null)}
      onKeyDown={(event) => {
        const moves: Record<string, [number, number]> = { Enter: [event.shiftKey ? -1 : 1, 0], ArrowDown: [1, 0], ArrowUp: [-1, 0], Tab: [0, event.shiftKey ? -1 : 1] };
        const move = moves[event.key];
        if (move) {
          event.preventDefault();
          event.stopPropagation();
          finish(move);
        } else if (event.key === 'Escape') {
          event.preventDefault();
          event.stopPropagation();
          done.current = true;
          onCancel();
        } else {
          // The grid's own keys (Delete, letters, Ctrl+Z) belong to the text box while editing.
          event.stopPropagation();
        }
      }}
    />
  );
}

interface GridRowProps {
  spec: GridRowSpec;
  rowIndex: number;
  stations: readonly Station[];
  notation: Notation;
  readOnly: boolean;
  grid: GridStore;
  flags: Map<string, CellFlag> | undefined;
  onCommit: (commit: CellCommit) => void;
}

/**
 * One row of the table of offsets. Memoised and subscribed only to its own line, its own pending text and
 * whether the active cell is in it, so a keystroke in one cell re-renders one row, not the table.
 */
export const GridRow = memo(function GridRow({ spec, rowIndex, stations, notation, readOnly, grid, flags, onCommit }: GridRowProps) {
  const line = useEditor((s) => s.plan.lines.lines.find((l) => l.id === spec.lineId));
  const pending = useEditor((s) => s.pending[spec.lineId]);
  const activeCol = useStore(grid, (s) => (s.row === rowIndex ? s.col : -1));
  const editing = useStore(grid, (s) => (s.row === rowIndex ? s.editing : null));
  if (!line) return null;
  const firstOfLine = spec.field !== 'y';

  return (
    <tr role="row" aria-rowindex={rowIndex + 2} className={firstOfLine ? 'border-t-2 border-rule' : ''}>
      <th
        role="rowheader"
        scope="row"
        className="sticky left-0 z-10 border-r-2 border-edge bg-paper px-3 py-1 text-left align-middle"
      >
        <span className="block truncate font-semibold">{line.name}</span>{' '}
        <span className="block truncate text-sm font-normal text-muted">{rowHeaderDetail(line, spec.field, notation)}</span>
      </th>
      {stations.map((station, col) => {
        const key = cellKey(station.id, spec.field);
        const waiting = pending?.[key];
        const flag = flags?.get(key);
        const active = col === activeCol;
        const label = cellLabel(line, spec.field, station);
        const text = waiting ? waiting.text : cellText(line, station.id, spec.field, notation);
        const described = [waiting && messageId('cell-msg', line.id, station.id, spec.field), flag && !waiting && messageId('cell-flag', line.id, station.id, spec.field)].filter(Boolean).join(' ') || undefined;
        // Marks are drawn inside the cell (an inset ring): collapsed table borders would let a neighbour's win.
        const tone = waiting?.kind === 'error' ? 'bg-danger-soft ring-2 ring-inset ring-danger' : waiting ? 'bg-caution-soft ring-2 ring-inset ring-caution' : flag ? 'bg-caution-soft ring-2 ring-inset ring-caution' : '';
        const isEditing = active && editing !== null && !readOnly;
        return (
          <td
            key={station.id}
            id={`cell-${rowIndex}-${col}`}
            role="gridcell"
            data-row={rowIndex}
            data-col={col}
            aria-colindex={col + 2}
            aria-label={label}
            aria-selected={active}
            aria-invalid={waiting?.kind === 'error' ? true : undefined}
            aria-describedby={described}
            aria-readonly={readOnly || undefined}
            tabIndex={active ? 0 : -1}
            title={waiting?.message ?? flag?.message}
            className={`relative h-12 scroll-mt-16 scroll-ml-64 border border-rule/60 p-0 align-middle ${tone} ${active ? 'outline-3 -outline-offset-3 outline-focus' : ''}`}
          >
            {isEditing ? (
              <CellEditor
                key={editing.key}
                initial={editing.text}
                label={label}
                onCommit={(typed, move) => onCommit({ row: rowIndex, col, text: typed, move })}
                onCancel={() => grid.getState().stopEditing()}
              />
            ) : (
              <span className="flex h-full flex-col items-end justify-center px-2 font-mono tabular-nums slashed-zero">
                <span className="flex items-center gap-1">
                  {waiting?.kind === 'error' && <CircleAlert aria-hidden="true" className="size-4 shrink-0 text-danger" />}
                  {waiting?.kind === 'incomplete' && <Hourglass aria-hidden="true" className="size-4 shrink-0 text-caution" />}
                  {flag && !waiting && <TriangleAlert aria-hidden="true" className="size-4 shrink-0 text-caution" />}
                  <span data-cell-value className={waiting?.kind === 'error' ? 'text-danger-strong' : ''}>
                    {text}
                  </span>
                </span>
                {flag && !waiting && <span className="text-xs leading-tight text-caution">{deviationShort(flag.deviationMm, notation)}</span>}
              </span>
            )}
          </td>
        );
      })}
    </tr>
  );
});
