import { createStore, type StoreApi } from 'zustand/vanilla';

/**
 * Where the person is in the table: the active cell, and whether it is being edited (with the text the
 * editor starts from). Kept apart from the plan so moving around re-renders only the two rows involved.
 */
export interface GridState {
  row: number;
  col: number;
  editing: { text: string; key: number } | null;
  moveTo: (row: number, col: number) => void;
  startEditing: (text: string) => void;
  stopEditing: () => void;
}

export type GridStore = StoreApi<GridState>;

export function createGridStore(bounds: () => { rows: number; cols: number }): GridStore {
  let editKey = 0;
  return createStore<GridState>()((set, get) => ({
    row: 0,
    col: 0,
    editing: null,
    moveTo: (row, col) => {
      const { rows, cols } = bounds();
      const r = Math.max(0, Math.min(rows - 1, row));
      const c = Math.max(0, Math.min(cols - 1, col));
      if (r !== get().row || c !== get().col || get().editing) set({ row: r, col: c, editing: null });
    },
    startEditing: (text) => set({ editing: { text, key: (editKey += 1) } }),
    stopEditing: () => {
      if (get().editing) set({ editing: null });
    },
  }));
}
