import { describe, expect, it } from 'vitest';
import { cellSet } from '../../src/features/plan/editor/cell-actions';
import { createEditorStore, UNDO_LIMIT } from '../../src/features/plan/editor/editor-store';
import { edit } from '../../src/features/plan/editor/types';
import { mm, plan } from './plan-editor-fixtures';
import type { RevisionSummary } from '../../shared/api/plan';

function storeAtRevision(id = 4) {
  const p = plan();
  return createEditorStore({ plan: p, baseRevisionId: id, basePlan: p, serverPlan: p });
}
const wl = (s: ReturnType<typeof storeAtRevision>, stationId: string) => s.getState().plan.lines.lines[0]!.cells[stationId];
const set = (value: number, stationId = 'st-1') => edit(`WL 300 at ${stationId}`, cellSet, { lineId: 'ln-wl', stationId, value });
const revision = (id: number): RevisionSummary => ({ id, hullId: 3, baseRevisionId: id - 1, authorId: 1, authorName: 'Ann', summary: '', createdAt: '2025-04-11T16:40:00.000Z', bytes: 1 });

describe('editor store', () => {
  it('applies an edit with an undo entry, undoes and redoes it', () => {
    const s = storeAtRevision();
    expect(s.getState().apply(set(310))).toBe(true);
    expect(s.getState().apply(set(320))).toBe(true);
    expect(wl(s, 'st-1')).toBe(320);
    expect(s.getState().undo.map((u) => u.label)).toEqual(['WL 300 at st-1', 'WL 300 at st-1']);
    s.getState().undoLast();
    expect(wl(s, 'st-1')).toBe(310);
    s.getState().redoLast();
    expect(wl(s, 'st-1')).toBe(320);
  });

  it('makes no undo entry for an edit that changes nothing, and a new edit ends the redo', () => {
    const s = storeAtRevision();
    expect(s.getState().apply(set(300))).toBe(false);
    expect(s.getState().undo).toEqual([]);
    s.getState().apply(set(310));
    s.getState().undoLast();
    expect(s.getState().redo).toHaveLength(1);
    s.getState().apply(set(330, 'st-2'));
    expect(s.getState().redo).toEqual([]);
  });

  it('says the copy is unsaved after an edit, and back to the revision after undoing it', () => {
    const s = storeAtRevision(4);
    expect(s.getState().status).toEqual({ state: 'revision-saved', revisionId: 4 });
    s.getState().apply(set(310));
    expect(s.getState().status).toEqual({ state: 'unsaved' });
    s.getState().undoLast();
    expect(s.getState().status).toEqual({ state: 'revision-saved', revisionId: 4 });
  });

  it('keeps only the last UNDO_LIMIT steps', () => {
    const s = storeAtRevision();
    for (let i = 1; i <= UNDO_LIMIT + 5; i += 1) s.getState().apply(set(300 + i));
    expect(s.getState().undo).toHaveLength(UNDO_LIMIT);
  });

  it('takes typed text through enterCells: a good value as one undo step, a bad one only marked', () => {
    const s = storeAtRevision();
    s.getState().enterCells([{ ref: { lineId: 'ln-wl', stationId: 'st-2', field: 'value' }, text: 'abc' }], mm, 'WL 300 at St 2');
    expect(s.getState().undo).toEqual([]);
    expect(s.getState().pending['ln-wl']?.['st-2:value']?.kind).toBe('error');
    s.getState().enterCells([{ ref: { lineId: 'ln-wl', stationId: 'st-2', field: 'value' }, text: '470' }], mm, 'WL 300 at St 2');
    expect(s.getState().undo.map((u) => u.label)).toEqual(['WL 300 at St 2']);
    expect(s.getState().pending).toEqual({});
  });

  it('after a draft save, is saved; after a revision save, the revision is the new base', () => {
    const s = storeAtRevision(4);
    s.getState().apply(set(310));
    const sent = s.getState().plan;
    s.getState().draftSaved(sent, '2025-04-12T08:00:00.000Z');
    expect(s.getState().status).toEqual({ state: 'draft-saved', at: '2025-04-12T08:00:00.000Z' });
    s.getState().apply(set(320));
    s.getState().undoLast();
    expect(s.getState().status.state).toBe('draft-saved');
    s.getState().revisionSaved(sent, revision(5));
    expect(s.getState()).toMatchObject({ baseRevisionId: 5, basePlan: sent, serverPlan: sent, status: { state: 'revision-saved', revisionId: 5 } });
  });

  it('load() replaces the copy wholesale and forgets the undo steps of the old one', () => {
    const s = storeAtRevision(4);
    s.getState().apply(set(310));
    const fresh = plan();
    s.getState().load({ plan: fresh, baseRevisionId: 6, basePlan: fresh, serverPlan: fresh, notice: 'Restored' });
    expect(s.getState()).toMatchObject({ plan: fresh, baseRevisionId: 6, undo: [], redo: [], notice: 'Restored', status: { state: 'revision-saved', revisionId: 6 } });
  });
});
