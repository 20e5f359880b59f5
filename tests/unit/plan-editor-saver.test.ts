import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { RevisionSummary, SaveDraftInput, SavePlanInput } from '../../shared/api/plan';
import { ApiError } from '../../src/lib/api-client';
import { cellSet } from '../../src/features/plan/editor/cell-actions';
import { createEditorStore } from '../../src/features/plan/editor/editor-store';
import { AUTOSAVE_DELAY_MS, createSaver, OFFLINE_RETRY_MS, type SaverDeps } from '../../src/features/plan/editor/saver';
import { edit } from '../../src/features/plan/editor/types';
import { plan } from './plan-editor-fixtures';

const revision = (id: number): RevisionSummary => ({ id, hullId: 3, baseRevisionId: id - 1, authorId: 2, authorName: 'Tomas Reed', summary: 'theirs', createdAt: '2025-04-11T16:40:00.000Z', bytes: 1 });

function setUp(overrides: Partial<SaverDeps> = {}) {
  const p = plan();
  const store = createEditorStore({ plan: p, baseRevisionId: 4, basePlan: p, serverPlan: p });
  const drafts: { input: SaveDraftInput; keepalive?: boolean }[] = [];
  const revisions: SavePlanInput[] = [];
  const deps: SaverDeps = {
    putDraft: async (input, options) => {
      drafts.push({ input, keepalive: options.keepalive });
      return { draft: { updatedAt: '2025-04-12T08:00:00.000Z' } };
    },
    postRevision: async (input) => {
      revisions.push(input);
      return { revision: revision(5) };
    },
    isOnline: () => true,
    ...overrides,
  };
  const saver = createSaver(store, deps);
  const stop = saver.start();
  const change = (value: number) => store.getState().apply(edit('WL 300 at St 1', cellSet, { lineId: 'ln-wl', stationId: 'st-1', value }));
  return { store, saver, stop, drafts, revisions, change };
}

beforeEach(() => {
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
});

describe('saver', () => {
  it('saves the draft once, AUTOSAVE_DELAY_MS after the last edit', async () => {
    const { drafts, change, store, stop } = setUp();
    change(301);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS - 100);
    change(302);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS - 100);
    expect(drafts).toHaveLength(0);
    await vi.advanceTimersByTimeAsync(100);
    expect(drafts).toHaveLength(1);
    expect(drafts[0]!.input.baseRevisionId).toBe(4);
    expect(drafts[0]!.input.plan.lines.lines[0]!.cells['st-1']).toBe(302);
    expect(store.getState().status.state).toBe('draft-saved');
    stop();
  });

  it('sends nothing when an edit is undone before the quiet time is up', async () => {
    const { drafts, change, store, stop } = setUp();
    change(301);
    store.getState().undoLast();
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 2);
    expect(drafts).toHaveLength(0);
    stop();
  });

  it('flushes at once with keepalive when asked (the tab is hidden)', async () => {
    const { drafts, change, saver, stop } = setUp();
    change(301);
    await saver.flush({ keepalive: true });
    expect(drafts).toEqual([expect.objectContaining({ keepalive: true })]);
    stop();
  });

  it('offline: marks it, keeps the copy, and tries again', async () => {
    let online = false;
    const { drafts, change, store, stop } = setUp({ isOnline: () => online });
    change(301);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(store.getState().status.state).toBe('offline');
    expect(drafts).toHaveLength(0);
    online = true;
    await vi.advanceTimersByTimeAsync(OFFLINE_RETRY_MS);
    expect(drafts).toHaveLength(1);
    expect(store.getState().status.state).toBe('draft-saved');
    stop();
  });

  it('a failed request that is not the network says why', async () => {
    const { change, store, stop } = setUp({
      putDraft: async () => {
        throw new ApiError({ status: 403, code: 'parts_not_allowed', message: 'As designer you cannot change the parts' });
      },
    });
    change(301);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(store.getState().status).toEqual({ state: 'failed', message: 'As designer you cannot change the parts' });
    stop();
  });

  it('saves a revision on top of the base, after any draft on its way, and makes it the base', async () => {
    const order: string[] = [];
    const { change, saver, store, stop } = setUp({
      putDraft: async () => {
        order.push('draft');
        return { draft: { updatedAt: 'x' } };
      },
      postRevision: async (input) => {
        order.push(`revision on ${input.baseRevisionId}: ${input.summary}`);
        return { revision: revision(5) };
      },
    });
    change(301);
    const draft = saver.flush();
    const result = await saver.saveRevision('  St 1 fixed ');
    await draft;
    expect(order).toEqual(['draft', 'revision on 4: St 1 fixed']);
    expect(result).toEqual({ ok: true, revision: revision(5) });
    expect(store.getState()).toMatchObject({ baseRevisionId: 5, status: { state: 'revision-saved', revisionId: 5 } });
    stop();
  });

  it('a 409 becomes the conflict, with the latest revision, and the copy is kept', async () => {
    const { change, saver, store, stop } = setUp({
      postRevision: async () => {
        throw new ApiError({ status: 409, code: 'stale_revision', message: 'stale', details: { latestRevisionId: 6, latestRevision: revision(6) } });
      },
    });
    change(301);
    const copy = store.getState().plan;
    const result = await saver.saveRevision();
    expect(result).toMatchObject({ ok: false, conflict: true });
    expect(store.getState().conflict).toEqual({ latestRevision: revision(6) });
    expect(store.getState().plan).toBe(copy);
    expect(store.getState().baseRevisionId).toBe(4);
    stop();
  });
});
