import { createContext, useContext } from 'react';
import { useStore } from 'zustand';
import type { HullSummary } from '../../../../shared/api/hulls';
import type { EditorState, EditorStore } from '../editor/editor-store';
import type { Saver } from '../editor/saver';

/** What the hull's screens share: the working copy's store, its saver and what the person may change. */
export interface PlanEditor {
  hull: HullSummary;
  store: EditorStore;
  saver: Saver;
  /** Owner, builder and designer edit lines, offsets and camber (DESIGN.md section 7). */
  canEditLines: boolean;
  /** Owner and builder edit the parts. */
  canEditParts: boolean;
}

export type PlanEditorContextValue = { state: 'loading' } | { state: 'error'; message: string; retry: () => void } | ({ state: 'ready' } & PlanEditor);

export const PlanEditorContext = createContext<PlanEditorContextValue | null>(null);

/** The editor's context as it is, loading or failed included (for the parts of the page that show either). */
export function usePlanEditorState(): PlanEditorContextValue {
  const value = useContext(PlanEditorContext);
  if (!value) throw new Error('usePlanEditorState needs a PlanEditorProvider above it');
  return value;
}

/** The ready editor; only for components rendered under `RequireEditor`. */
export function usePlanEditor(): PlanEditor {
  const value = usePlanEditorState();
  if (value.state !== 'ready') throw new Error('usePlanEditor used before the plan loaded; wrap the screen in RequireEditor');
  return value;
}

/** A slice of the working copy; the component re-renders only when that slice changes. */
export function useEditor<T>(selector: (state: EditorState) => T): T {
  return useStore(usePlanEditor().store, selector);
}
