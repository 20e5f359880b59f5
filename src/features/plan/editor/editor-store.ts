import { createStore, type StoreApi } from 'zustand/vanilla';
import type { RevisionSummary } from '../../../../shared/api/plan';
import type { Notation } from '../../../../shared/geometry/notation-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { cellEntriesApply, pendingPrune, type CellEntry } from './cell-entry';
import { cellKey, type CellRef, type Edit, type PendingCells } from './types';

/**
 * The editor's working copy of one hull's plan: the draft document, the revision it started from, what
 * the server holds of it, undo and redo, and text typed into cells that is not (yet) in the plan. Server
 * data itself stays in TanStack Query; this is only the person's copy being edited. Every change of the
 * plan goes through `apply(edit)`, so undo spans the lines table, the frames form and (later) the canvas.
 */

export interface UndoEntry {
  label: string;
  before: Plan;
  after: Plan;
}

/** How far the working copy has got to the server, in the words the header shows. */
export type SaveStatus =
  | { state: 'clean' }
  | { state: 'unsaved' }
  | { state: 'saving' }
  | { state: 'draft-saved'; at: string }
  | { state: 'revision-saved'; revisionId: number }
  | { state: 'offline' }
  | { state: 'failed'; message: string };

/** A save refused because someone saved a newer revision since this copy's base. */
export interface Conflict {
  latestRevision: RevisionSummary | null;
}

export interface EditorSnapshot {
  plan: Plan;
  baseRevisionId: number | null;
  /** The plan of `baseRevisionId` when known (what "my changes" are measured from); null until fetched. */
  basePlan: Plan | null;
  /** What the server holds for this person: their draft, or the revision when there is none. */
  serverPlan: Plan;
  /** When the working copy came from a draft left earlier, when that draft was saved. */
  restoredDraftAt?: string | null;
}

export interface EditorState extends Required<EditorSnapshot> {
  status: SaveStatus;
  undo: UndoEntry[];
  redo: UndoEntry[];
  pending: PendingCells;
  conflict: Conflict | null;
  /** A note after something changed the copy wholesale (changes reapplied on a newer revision...). */
  notice: string | null;
  /** The status to show whenever the copy is back to `serverPlan`. */
  serverStatus: SaveStatus;
  apply: (edit: Edit) => boolean;
  enterCells: (entries: readonly CellEntry[], notation: Notation, label: string) => void;
  clearPending: (ref: CellRef) => void;
  undoLast: () => void;
  redoLast: () => void;
  load: (snapshot: EditorSnapshot & { notice?: string | null }) => void;
  setStatus: (status: SaveStatus) => void;
  /** The server has `plan` as this person's draft. */
  draftSaved: (plan: Plan, at: string) => void;
  /** `plan` was saved as `revision`: it is the new base. */
  revisionSaved: (plan: Plan, revision: RevisionSummary) => void;
  setConflict: (conflict: Conflict | null) => void;
  setNotice: (notice: string | null) => void;
  dismissRestored: () => void;
}

export type EditorStore = StoreApi<EditorState>;

/** Enough undo for an afternoon's work; each entry shares all unchanged parts of the plan with its neighbours. */
export const UNDO_LIMIT = 500;

function afterChange(state: EditorState, plan: Plan): Pick<EditorState, 'status'> {
  // Back to exactly what the server holds (undo after a save): nothing to send.
  if (plan === state.serverPlan) return { status: state.serverStatus };
  return { status: state.status.state === 'saving' ? state.status : { state: 'unsaved' } };
}

/** The status when the copy is what the server holds. */
function heldStatus(snapshot: EditorSnapshot): SaveStatus {
  if (snapshot.restoredDraftAt) return { state: 'draft-saved', at: snapshot.restoredDraftAt };
  return snapshot.baseRevisionId === null ? { state: 'clean' } : { state: 'revision-saved', revisionId: snapshot.baseRevisionId };
}

export function createEditorStore(snapshot: EditorSnapshot): EditorStore {
  return createStore<EditorState>()((set, get) => ({
    restoredDraftAt: null,
    status: heldStatus(snapshot),
    serverStatus: heldStatus(snapshot),
    ...snapshot,
    undo: [],
    redo: [],
    pending: {},
    conflict: null,
    notice: null,

    apply: (edit) => {
      const state = get();
      const plan = edit.apply(state.plan);
      if (plan === state.plan) return false;
      set({
        plan,
        undo: [...state.undo, { label: edit.label, before: state.plan, after: plan }].slice(-UNDO_LIMIT),
        redo: [],
        pending: pendingPrune(plan, state.pending),
        ...afterChange(state, plan),
      });
      return true;
    },

    enterCells: (entries, notation, label) => {
      const state = get();
      const next = cellEntriesApply({ plan: state.plan, pending: state.pending }, entries, notation);
      if (next.plan === state.plan) {
        if (next.pending !== state.pending) set({ pending: next.pending });
        return;
      }
      set({
        plan: next.plan,
        pending: next.pending,
        undo: [...state.undo, { label, before: state.plan, after: next.plan }].slice(-UNDO_LIMIT),
        redo: [],
        ...afterChange(state, next.plan),
      });
    },

    clearPending: (ref) => {
      const { pending } = get();
      const row = pending[ref.lineId];
      const key = cellKey(ref.stationId, ref.field);
      if (!row || !(key in row)) return;
      const { [key]: _gone, ...rest } = row;
      const { [ref.lineId]: _row, ...others } = pending;
      set({ pending: Object.keys(rest).length ? { ...others, [ref.lineId]: rest } : others });
    },

    undoLast: () => {
      const state = get();
      const entry = state.undo[state.undo.length - 1];
      if (!entry) return;
      set({
        plan: entry.before,
        undo: state.undo.slice(0, -1),
        redo: [...state.redo, entry],
        pending: pendingPrune(entry.before, state.pending),
        ...afterChange(state, entry.before),
      });
    },

    redoLast: () => {
      const state = get();
      const entry = state.redo[state.redo.length - 1];
      if (!entry) return;
      set({
        plan: entry.after,
        redo: state.redo.slice(0, -1),
        undo: [...state.undo, entry],
        pending: pendingPrune(entry.after, state.pending),
        ...afterChange(state, entry.after),
      });
    },

    load: ({ notice = null, ...next }) => {
      // A wholesale change (a restored revision, changes reapplied on the latest): the old undo steps
      // describe another document, so they go.
      set({
        restoredDraftAt: null,
        status: next.plan !== next.serverPlan ? { state: 'unsaved' } : heldStatus(next),
        serverStatus: heldStatus(next),
        ...next,
        undo: [],
        redo: [],
        pending: {},
        conflict: null,
        notice,
      });
    },

    setStatus: (status) => set({ status }),

    draftSaved: (plan, at) => {
      const state = get();
      const held: SaveStatus = { state: 'draft-saved', at };
      set({ serverPlan: plan, serverStatus: held, status: state.plan === plan ? held : { state: 'unsaved' } });
    },

    revisionSaved: (plan, revision) => {
      const state = get();
      set({
        baseRevisionId: revision.id,
        basePlan: plan,
        serverPlan: plan,
        restoredDraftAt: null,
        conflict: null,
        serverStatus: { state: 'revision-saved', revisionId: revision.id },
        status: state.plan === plan ? { state: 'revision-saved', revisionId: revision.id } : { state: 'unsaved' },
      });
    },

    setConflict: (conflict) => set({ conflict }),
    setNotice: (notice) => set({ notice }),
    dismissRestored: () => set({ restoredDraftAt: null }),
  }));
}
