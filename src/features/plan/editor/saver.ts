import type { SaveDraftInput, SavePlanInput, RevisionSummary } from '../../../../shared/api/plan';
import { planSchema, type Plan } from '../../../../shared/geometry/plan-schema';
import { ApiError, describeError } from '../../../lib/api-client';
import type { EditorStore } from './editor-store';

/**
 * Gets the working copy to the server: the draft autosave (debounced after edits, at once when the tab is
 * hidden or closed) and the explicit "Save revision". Requests go one after another through one queue, so
 * a late draft can never land after the revision it preceded and leave a stale draft behind.
 */

export const AUTOSAVE_DELAY_MS = 1500;
/** While offline, try again this often (and at once when the browser says it is back online). */
export const OFFLINE_RETRY_MS = 15_000;
/** Browsers refuse keepalive bodies over 64 KiB; a larger plan goes as an ordinary request. */
const KEEPALIVE_MAX_BYTES = 60_000;

export interface SaverDeps {
  putDraft: (input: SaveDraftInput, options: { keepalive?: boolean }) => Promise<{ draft: { updatedAt: string } }>;
  postRevision: (input: SavePlanInput) => Promise<{ revision: RevisionSummary }>;
  /** After a revision is saved: the caller updates the query cache. */
  onRevisionSaved?: (revision: RevisionSummary, plan: Plan) => void | Promise<void>;
  isOnline?: () => boolean;
  delayMs?: number;
}

export type RevisionSaveResult = { ok: true; revision: RevisionSummary } | { ok: false; conflict: boolean; message: string };

export interface Saver {
  /** Start (or restart) the quiet-time countdown to the next draft save. */
  schedule: (delayMs?: number) => void;
  /** Save the draft now if the copy differs from what the server holds. */
  flush: (options?: { keepalive?: boolean }) => Promise<void>;
  saveRevision: (summary?: string) => Promise<RevisionSaveResult>;
  /** Watch the store and autosave after edits; the returned function stops watching. */
  start: () => () => void;
}

function invalidMessage(plan: Plan): string | null {
  const parsed = planSchema.safeParse(plan);
  if (parsed.success) return null;
  const issue = parsed.error.issues[0];
  return `the plan does not validate at ${issue?.path.join('.')}: ${issue?.message}`;
}

function isNetworkFailure(error: unknown): boolean {
  return error instanceof ApiError && error.status === 0;
}

export function createSaver(store: EditorStore, deps: SaverDeps): Saver {
  const delay = deps.delayMs ?? AUTOSAVE_DELAY_MS;
  const online = deps.isOnline ?? (() => (typeof navigator === 'undefined' ? true : navigator.onLine !== false));
  let timer: ReturnType<typeof setTimeout> | null = null;
  let queue: Promise<unknown> = Promise.resolve();
  let running = false;

  const clear = () => {
    if (timer !== null) clearTimeout(timer);
    timer = null;
  };

  const schedule = (ms = delay) => {
    if (!running) return;
    clear();
    timer = setTimeout(() => {
      timer = null;
      void flush();
    }, ms);
  };

  const enqueue = <T>(task: () => Promise<T>): Promise<T> => {
    const run = queue.then(task, task);
    queue = run.catch(() => undefined);
    return run;
  };

  async function sendDraft(keepalive: boolean): Promise<void> {
    const state = store.getState();
    const plan = state.plan;
    if (plan === state.serverPlan) return;
    const invalid = invalidMessage(plan);
    if (invalid) {
      store.getState().setStatus({ state: 'failed', message: `Not saved: ${invalid}.` });
      return;
    }
    if (!online()) {
      store.getState().setStatus({ state: 'offline' });
      schedule(OFFLINE_RETRY_MS);
      return;
    }
    const input: SaveDraftInput = { baseRevisionId: state.baseRevisionId, plan };
    store.getState().setStatus({ state: 'saving' });
    try {
      const small = keepalive && JSON.stringify(input).length <= KEEPALIVE_MAX_BYTES;
      const { draft } = await deps.putDraft(input, { keepalive: small });
      store.getState().draftSaved(plan, draft.updatedAt);
      if (store.getState().plan !== plan) schedule();
    } catch (error) {
      if (isNetworkFailure(error) || !online()) {
        store.getState().setStatus({ state: 'offline' });
        schedule(OFFLINE_RETRY_MS);
      } else {
        store.getState().setStatus({ state: 'failed', message: describeError(error) });
      }
    }
  }

  const flush = (options: { keepalive?: boolean } = {}) => {
    clear();
    return enqueue(() => sendDraft(options.keepalive ?? false));
  };

  const saveRevision = (summary?: string) => {
    clear();
    return enqueue(async (): Promise<RevisionSaveResult> => {
      const state = store.getState();
      const plan = state.plan;
      const invalid = invalidMessage(plan);
      if (invalid) return { ok: false, conflict: false, message: `The revision was not saved: ${invalid}.` };
      const previous = state.status;
      store.getState().setStatus({ state: 'saving' });
      try {
        const trimmed = summary?.trim();
        const { revision } = await deps.postRevision({ baseRevisionId: state.baseRevisionId, plan, ...(trimmed ? { summary: trimmed } : {}) });
        store.getState().revisionSaved(plan, revision);
        await deps.onRevisionSaved?.(revision, plan);
        // Edits made while the save was on its way are a draft on top of the new revision.
        if (store.getState().plan !== plan) schedule();
        return { ok: true, revision };
      } catch (error) {
        if (error instanceof ApiError && error.status === 409 && error.code === 'stale_revision') {
          store.getState().setStatus(previous.state === 'saving' ? { state: 'unsaved' } : previous);
          store.getState().setConflict({ latestRevision: (error.details.latestRevision as RevisionSummary | null | undefined) ?? null });
          return { ok: false, conflict: true, message: error.message };
        }
        const offline = isNetworkFailure(error);
        store.getState().setStatus(offline ? { state: 'offline' } : { state: 'failed', message: describeError(error) });
        if (offline) schedule(OFFLINE_RETRY_MS);
        return { ok: false, conflict: false, message: describeError(error) };
      }
    });
  };

  const start = () => {
    running = true;
    const unsubscribe = store.subscribe((state, previous) => {
      if (state.plan === previous.plan) return;
      if (state.plan !== state.serverPlan) schedule();
      else clear();
    });
    // A copy that differs from the server's when watching starts (changes reapplied after a conflict) goes soon.
    if (store.getState().plan !== store.getState().serverPlan) schedule();
    return () => {
      running = false;
      clear();
      unsubscribe();
    };
  };

  return { schedule, flush, saveRevision, start };
}
