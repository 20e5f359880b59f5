import { useCallback, useEffect, useMemo, useRef, useState, type ClipboardEvent, type KeyboardEvent, type MouseEvent } from 'react';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat } from '../../../../../shared/geometry/notation';
import { cellLabel, cellText, clipboardBlock, pendingOf, type CellEntry } from '../../editor/cell-entry';
import type { LinesCheck } from '../../hooks/use-lines-check';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';
import { GridRow, type CellCommit } from './grid-row';
import { gridRowSpecs } from './grid-rows';
import { createGridStore } from './grid-store';
import { EmptyNote } from '../../../../components/ui/empty-note';

/** Widths of the row headers and of each station's column. */
const ROW_HEADER_REM = 13;
const COLUMN_REM = 7;

interface OffsetsGridProps {
  notation: Notation;
  readOnly: boolean;
  check: LinesCheck;
  /** Said to the person after a paste that did not fit, and the like. */
  onMessage: (message: string | null) => void;
}

/**
 * The table of offsets, edited like a spreadsheet: stations across, lines down. Arrow keys, Tab and
 * Shift+Tab move; Enter or F2 (or a tap on the active cell) edits; typing starts editing; Delete clears;
 * a block copied from a spreadsheet pastes from the active cell; Ctrl+Z and Ctrl+Shift+Z (or Ctrl+Y) undo
 * and redo. Values are read and shown in `notation`.
 */
export function OffsetsGrid({ notation, readOnly, check, onMessage }: OffsetsGridProps) {
  const { store } = usePlanEditor();
  const stations = useEditor((s) => s.plan.lines.stations);
  // Rows change only when lines are added, removed or reordered, not when a cell changes.
  const shape = useEditor((s) => s.plan.lines.lines.map((l) => `${l.id}\u0000${l.kind}`).join('\u0001'));
  const rows = useMemo(() => gridRowSpecs(shape ? shape.split('\u0001').map((entry) => {
    const [id, kind] = entry.split('\u0000');
    return { id: id!, kind: kind as 'point' };
  }) : []), [shape]);

  const bounds = useRef({ rows: rows.length, cols: stations.length });
  bounds.current = { rows: rows.length, cols: stations.length };
  const [grid] = useState(() => createGridStore(() => bounds.current));
  const table = useRef<HTMLTableElement>(null);
  const latest = useRef({ rows, stations, notation });
  latest.current = { rows, stations, notation };

  // Keep the active cell inside the table when rows or columns go away.
  useEffect(() => {
    const { row, col } = grid.getState();
    if (row >= rows.length || col >= stations.length) grid.getState().moveTo(row, col);
  }, [grid, rows.length, stations.length]);

  // Focus follows the active cell, but only while the person is in the table.
  useEffect(
    () =>
      grid.subscribe((state, previous) => {
        if (state.editing) return;
        if (state.row === previous.row && state.col === previous.col && !previous.editing) return;
        const inside = table.current?.contains(document.activeElement) ?? false;
        if (!inside && !previous.editing) return;
        document.getElementById(`cell-${state.row}-${state.col}`)?.focus();
      }),
    [grid],
  );

  const refAt = useCallback((row: number, col: number) => {
    const spec = latest.current.rows[row];
    const station = latest.current.stations[col];
    return spec && station ? { lineId: spec.lineId, stationId: station.id, field: spec.field } : null;
  }, []);

  const labelOf = useCallback(
    (row: number, col: number) => {
      const ref = refAt(row, col);
      const line = ref && store.getState().plan.lines.lines.find((l) => l.id === ref.lineId);
      const station = latest.current.stations[col];
      return line && station && ref ? cellLabel(line, ref.field, station) : '';
    },
    [refAt, store],
  );

  const currentText = useCallback(
    (row: number, col: number) => {
      const ref = refAt(row, col);
      if (!ref) return '';
      const state = store.getState();
      const waiting = pendingOf(state.pending, ref);
      if (waiting) return waiting.text;
      const line = state.plan.lines.lines.find((l) => l.id === ref.lineId);
      return line ? cellText(line, ref.stationId, ref.field, latest.current.notation) : '';
    },
    [refAt, store],
  );

  const enter = useCallback(
    (entries: CellEntry[], label: string) => {
      store.getState().enterCells(entries, latest.current.notation, label);
    },
    [store],
  );

  const onCommit = useCallback(
    ({ row, col, text, move }: CellCommit) => {
      const ref = refAt(row, col);
      const before = currentText(row, col);
      grid.getState().stopEditing();
      if (ref && text.trim() !== before.trim()) enter([{ ref, text }], labelOf(row, col));
      if (move) grid.getState().moveTo(row + move[0], col + move[1]);
    },
    [currentText, enter, grid, labelOf, refAt],
  );

  const onKeyDown = (event: KeyboardEvent<HTMLTableElement>) => {
    const state = grid.getState();
    if (state.editing) return;
    const { row, col } = state;
    const mod = event.ctrlKey || event.metaKey;
    const key = event.key;
    if (mod && (key === 'z' || key === 'Z')) {
      event.preventDefault();
      if (event.shiftKey) store.getState().redoLast();
      else store.getState().undoLast();
      return;
    }
    if (mod && (key === 'y' || key === 'Y')) {
      event.preventDefault();
      store.getState().redoLast();
      return;
    }
    const moves: Record<string, [number, number]> = { ArrowUp: [-1, 0], ArrowDown: [1, 0], ArrowLeft: [0, -1], ArrowRight: [0, 1] };
    if (moves[key] && !event.altKey) {
      event.preventDefault();
      const [dr, dc] = moves[key];
      if (mod) state.moveTo(dr === 0 ? row : dr < 0 ? 0 : rows.length - 1, dc === 0 ? col : dc < 0 ? 0 : stations.length - 1);
      else state.moveTo(row + dr, col + dc);
      return;
    }
    if (key === 'Home' || key === 'End') {
      event.preventDefault();
      const edge = key === 'Home' ? 0 : Number.MAX_SAFE_INTEGER;
      state.moveTo(mod ? edge : row, edge);
      return;
    }
    if (key === 'Tab') {
      // At the table's edge Tab leaves the table, as it does everywhere else.
      const next = col + (event.shiftKey ? -1 : 1);
      if (next < 0 || next >= stations.length) return;
      event.preventDefault();
      state.moveTo(row, next);
      return;
    }
    if (readOnly) return;
    if (key === 'Enter' || key === 'F2') {
      event.preventDefault();
      state.startEditing(currentText(row, col));
      return;
    }
    if (key === 'Delete' || key === 'Backspace') {
      event.preventDefault();
      const ref = refAt(row, col);
      if (ref && currentText(row, col) !== '') enter([{ ref, text: '' }], `Clear ${labelOf(row, col)}`);
      return;
    }
    if (key.length === 1 && !mod && !event.altKey) {
      // Typing over a cell starts editing with what was typed, as in a spreadsheet.
      event.preventDefault();
      state.startEditing(key);
    }
  };

  const onPaste = (event: ClipboardEvent<HTMLTableElement>) => {
    if (readOnly) return;
    const text = event.clipboardData.getData('text/plain');
    const state = grid.getState();
    // A plain value pasted while editing goes into the text box like any other text.
    if (state.editing && !/[\t\n]/.test(text.replace(/\r?\n$/, ''))) return;
    event.preventDefault();
    state.stopEditing();
    const block = clipboardBlock(text);
    const entries: CellEntry[] = [];
    let outside = 0;
    block.forEach((cells, i) =>
      cells.forEach((cell, j) => {
        const ref = refAt(state.row + i, state.col + j);
        if (ref) entries.push({ ref, text: cell });
        else outside += 1;
      }),
    );
    const width = Math.max(...block.map((r) => r.length));
    if (entries.length) enter(entries, `Paste ${block.length} × ${width} cells`);
    onMessage(outside ? `${outside} pasted value${outside === 1 ? ' was' : 's were'} beyond the edge of the table and left out.` : null);
  };

  const onCopy = (event: ClipboardEvent<HTMLTableElement>) => {
    const state = grid.getState();
    if (state.editing) return;
    event.preventDefault();
    event.clipboardData.setData('text/plain', currentText(state.row, state.col));
  };

  // Whether the pressed cell was already the active, focused one before the press moved focus to it.
  const pressedActive = useRef(false);
  const onMouseDown = (event: MouseEvent<HTMLTableElement>) => {
    const cell = (event.target as HTMLElement).closest<HTMLElement>('td[data-row]');
    const state = grid.getState();
    pressedActive.current = !!cell && document.activeElement === cell && Number(cell.dataset.row) === state.row && Number(cell.dataset.col) === state.col;
  };
  const onClick = (event: MouseEvent<HTMLTableElement>) => {
    const cell = (event.target as HTMLElement).closest<HTMLElement>('td[data-row]');
    if (!cell || grid.getState().editing) return;
    const row = Number(cell.dataset.row);
    const col = Number(cell.dataset.col);
    const state = grid.getState();
    // A second tap on the active cell edits it: a tablet has no F2.
    if (!readOnly && pressedActive.current) state.startEditing(currentText(row, col));
    else state.moveTo(row, col);
    cell.focus();
  };

  if (stations.length === 0 || rows.length === 0) {
    return (
      <EmptyNote>
        {stations.length === 0 && rows.length === 0
          ? 'The table is empty. Add stations and lines below, paste a table from a spreadsheet once they are there, or import a CSV file of offsets.'
          : stations.length === 0
            ? 'Add a station (below) to give the table its first column.'
            : 'Add a line (below) to give the table its first row.'}
      </EmptyNote>
    );
  }

  return (
    <div className="max-h-[70vh] w-fit max-w-full overflow-auto rounded-xl border-2 border-edge bg-surface">
      <table
        ref={table}
        role="grid"
        aria-label="Table of offsets"
        aria-rowcount={rows.length + 1}
        aria-colcount={stations.length + 1}
        aria-readonly={readOnly || undefined}
        // Fixed layout with set column widths: the browser need not measure 12,000 cells to lay out the table again.
        style={{ width: `${ROW_HEADER_REM + stations.length * COLUMN_REM}rem` }}
        className="table-fixed border-collapse"
        onKeyDown={onKeyDown}
        onPaste={onPaste}
        onCopy={onCopy}
        onMouseDown={onMouseDown}
        onClick={onClick}
      >
        <colgroup>
          <col style={{ width: `${ROW_HEADER_REM}rem` }} />
          {stations.map((station) => (
            <col key={station.id} style={{ width: `${COLUMN_REM}rem` }} />
          ))}
        </colgroup>
        <thead>
          <tr role="row" aria-rowindex={1}>
            <th role="columnheader" scope="col" className="sticky top-0 left-0 z-30 border-r-2 border-b-2 border-edge bg-paper px-3 py-2 text-left font-semibold">
              Line <span className="font-normal text-muted">\ station</span>
            </th>
            {stations.map((station, col) => (
              <th
                key={station.id}
                role="columnheader"
                scope="col"
                aria-colindex={col + 2}
                aria-label={`${station.name}, x ${lengthFormat(station.x, notation)}`}
                className="sticky top-0 z-20 truncate border-b-2 border-edge bg-paper px-2 py-2 text-right"
              >
                <span className="block font-semibold">{station.name}</span>
                <span className="block font-mono text-sm font-normal text-muted">x {lengthFormat(station.x, notation)}</span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((spec, rowIndex) => (
            <GridRow
              key={spec.key}
              spec={spec}
              rowIndex={rowIndex}
              stations={stations}
              notation={notation}
              readOnly={readOnly}
              grid={grid}
              flags={check.cellFlags.get(spec.lineId)}
              onCommit={onCommit}
            />
          ))}
        </tbody>
      </table>
    </div>
  );
}
