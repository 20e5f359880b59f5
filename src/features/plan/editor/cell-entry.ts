import type { Line, Station } from '../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../shared/geometry/notation-schema';
import { lengthFormat, lengthParse } from '../../../../shared/geometry/notation';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { cellSet } from './cell-actions';
import { cellKey, type CellField, type CellRef, type PendingCell, type PendingCells } from './types';

/**
 * Text typed or pasted into the table of offsets, turned into plan edits. A value that reads as a length
 * goes into the plan; one that does not stays as typed, marked with the reason, and the plan keeps what
 * it had. A point line's cell holds a half-breadth and a height together, so one half typed alone waits
 * (as `incomplete`) until the other half is there.
 */

export interface EntryState {
  plan: Plan;
  pending: PendingCells;
}

export interface CellEntry {
  ref: CellRef;
  text: string;
}

/** Pending text with its value in mm, for an `incomplete` half that will join its other half. */
export type PendingWithValue = PendingCell & { mm?: number };

const fieldWords: Record<CellField, string> = { value: '', y: ' half-breadth', z: ' height' };

/** The words for a cell, as a person says it and as its aria-label reads: "WL 300 at St 4", "Sheer height at St 2". */
export function cellLabel(line: Pick<Line, 'name'>, field: CellField, station: Pick<Station, 'name'>): string {
  return `${line.name}${fieldWords[field]} at ${station.name}`;
}

/** The number (mm) a cell holds for `field`, or null when empty. */
export function cellNumber(line: Line, stationId: string, field: CellField): number | null {
  const cell = (line.cells as Record<string, unknown>)[stationId];
  if (cell === null || cell === undefined) return null;
  if (typeof cell === 'number') return field === 'value' ? cell : null;
  const point = cell as { y: number; z: number };
  return field === 'y' ? point.y : field === 'z' ? point.z : null;
}

/** A cell's value as text in the notation ('' when empty). */
export function cellText(line: Line, stationId: string, field: CellField, notation: Notation): string {
  const value = cellNumber(line, stationId, field);
  return value === null ? '' : lengthFormat(value, notation);
}

export function pendingOf(pending: PendingCells, ref: CellRef): PendingWithValue | undefined {
  return pending[ref.lineId]?.[cellKey(ref.stationId, ref.field)] as PendingWithValue | undefined;
}

function pendingSet(pending: PendingCells, ref: CellRef, value: PendingWithValue | null): PendingCells {
  const key = cellKey(ref.stationId, ref.field);
  const row = pending[ref.lineId] ?? {};
  if (!value && !(key in row)) return pending;
  const { [key]: _dropped, ...rest } = row;
  const nextRow = value ? { ...rest, [key]: value } : rest;
  const { [ref.lineId]: _row, ...others } = pending;
  return Object.keys(nextRow).length ? { ...others, [ref.lineId]: nextRow } : others;
}

const otherHalf = (field: CellField): CellField => (field === 'y' ? 'z' : 'y');
const halfWords: Record<CellField, string> = { value: 'value', y: 'half-breadth', z: 'height' };

function entryApply(state: EntryState, entry: CellEntry, notation: Notation): EntryState {
  const { ref, text } = entry;
  const line = state.plan.lines.lines.find((l) => l.id === ref.lineId);
  const station = state.plan.lines.stations.find((s) => s.id === ref.stationId);
  if (!line || !station) return state;
  if ((line.kind === 'point') !== (ref.field !== 'value')) return state;

  const parsed = lengthParse(text, notation);
  if (parsed && !parsed.ok) {
    const message = `${cellLabel(line, ref.field, station)}: ${parsed.message}`;
    return { plan: state.plan, pending: pendingSet(state.pending, ref, { text: text.trim(), message, kind: 'error' }) };
  }
  const mine = parsed ? parsed.mm : null;

  if (line.kind !== 'point') {
    return { plan: cellSet(state.plan, { lineId: line.id, stationId: station.id, value: mine }), pending: pendingSet(state.pending, ref, null) };
  }

  // A point line: the cell takes both halves or neither.
  const otherRef: CellRef = { ...ref, field: otherHalf(ref.field) };
  const otherPending = pendingOf(state.pending, otherRef);
  const other = otherPending?.kind === 'incomplete' && otherPending.mm !== undefined ? otherPending.mm : cellNumber(line, station.id, otherRef.field);
  const keepOther = otherPending?.kind === 'error' ? otherPending : null;
  const y = ref.field === 'y' ? mine : other;
  const z = ref.field === 'z' ? mine : other;

  if (mine !== null && other !== null) {
    const plan = cellSet(state.plan, { lineId: line.id, stationId: station.id, value: { y: y!, z: z! } });
    return { plan, pending: pendingSet(pendingSet(state.pending, ref, null), otherRef, keepOther) };
  }
  const plan = cellSet(state.plan, { lineId: line.id, stationId: station.id, value: null });
  if (mine === null && other === null) {
    return { plan, pending: pendingSet(pendingSet(state.pending, ref, null), otherRef, keepOther) };
  }
  const waiting = (field: CellField, shown: string, mm: number): PendingWithValue => ({
    text: shown,
    mm,
    kind: 'incomplete',
    message: `${cellLabel(line, field, station)}: this ${halfWords[field]} waits for the ${halfWords[otherHalf(field)]} at ${station.name}; the point goes into the plan when both are filled in`,
  });
  if (mine !== null) return { plan, pending: pendingSet(state.pending, ref, waiting(ref.field, text.trim(), mine)) };
  // This half was cleared: the other half is kept in the tab, waiting, rather than lost.
  const shown = otherPending?.kind === 'incomplete' ? otherPending.text : lengthFormat(other!, notation);
  return { plan, pending: pendingSet(pendingSet(state.pending, ref, null), otherRef, keepOther ?? waiting(otherRef.field, shown, other!)) };
}

/**
 * Apply typed or pasted text to cells, in order (so a paste of a point line's height and half-breadth
 * rows fills the point). Empty text clears a cell.
 */
export function cellEntriesApply(state: EntryState, entries: readonly CellEntry[], notation: Notation): EntryState {
  return entries.reduce((s, e) => entryApply(s, e, notation), state);
}

/** Drop pending text for lines and stations no longer in the plan. */
export function pendingPrune(plan: Plan, pending: PendingCells): PendingCells {
  const lines = new Set(plan.lines.lines.map((l) => l.id));
  const stations = new Set(plan.lines.stations.map((s) => s.id));
  let changed = false;
  const next: Record<string, Record<string, PendingCell>> = {};
  for (const [lineId, row] of Object.entries(pending)) {
    if (!lines.has(lineId)) {
      changed = true;
      continue;
    }
    const kept = Object.fromEntries(Object.entries(row).filter(([key]) => stations.has(key.slice(0, key.lastIndexOf(':')))));
    if (Object.keys(kept).length !== Object.keys(row).length) changed = true;
    if (Object.keys(kept).length) next[lineId] = kept;
  }
  return changed ? next : pending;
}

/** Split text copied from a spreadsheet (tab-separated columns, one line per row) into rows of cells. */
export function clipboardBlock(text: string): string[][] {
  const rows = text.replace(/\r\n?/g, '\n').split('\n');
  // Spreadsheets end a copied block with a line break; that is not an extra empty row.
  if (rows.length > 1 && rows[rows.length - 1] === '') rows.pop();
  return rows.map((row) => row.split('\t'));
}
