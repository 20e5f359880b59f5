import { act, fireEvent, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Plan } from '../../shared/geometry/plan-schema';
import { apiError, stubApi, type Handlers, type RecordedCall } from './api-stub';
import { ann, hull, member, sessionOf } from './fixtures';
import { planHandlers, revision, smallPlan } from './plan-fixtures';
import { renderApp, screen } from './render-app';

const cell = (name: string) => screen.getByRole('gridcell', { name });
const cellText = (name: string) => cell(name).querySelector('[data-cell-value]')?.textContent?.trim() ?? null;
const status = () => screen.getByTestId('save-status').textContent;

function withWaterline(plan: Plan, stationId: string, value: number): Plan {
  return { ...plan, lines: { ...plan.lines, lines: plan.lines.lines.map((l) => (l.id === 'ln-wl' ? ({ ...l, cells: { ...l.cells, [stationId]: value } } as typeof l) : l)) } };
}

function server(more: Handlers = {}) {
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role: 'builder' }) } },
    ...planHandlers(3, { plan: smallPlan(), revision: revision(4) }),
    ...more,
  });
}

afterEach(() => {
  vi.useRealTimers();
});

describe('autosave', () => {
  it('PUTs the draft a moment after the edits stop, not on every keystroke', async () => {
    const api = server();
    renderApp('/hulls/3/lines');
    await screen.findByRole('grid');
    // From here the clock is the test's. user-event waits on real timers between keys, so the typing is
    // done with plain events, each flushed by act.
    vi.useFakeTimers();
    const type = (name: string, text: string) => {
      fireEvent.click(cell(name));
      fireEvent.keyDown(cell(name), { key: 'F2' });
      fireEvent.change(within(cell(name)).getByRole('textbox'), { target: { value: text } });
      fireEvent.keyDown(within(cell(name)).getByRole('textbox'), { key: 'Enter' });
    };

    type('WL 300 at St 1', '333');
    expect(cellText('WL 300 at St 1')).toBe('333');
    expect(status()).toBe('Changes not saved yet');
    await act(() => vi.advanceTimersByTimeAsync(1000));
    expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(0);

    // Another edit before the quiet time is up starts it again.
    type('Chine height at St 1', '444');
    await act(() => vi.advanceTimersByTimeAsync(1000));
    expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(0);
    await act(() => vi.advanceTimersByTimeAsync(600));

    const puts = api.calls.filter((c) => c.method === 'PUT');
    expect(puts).toHaveLength(1);
    const body = puts[0]!.body as { baseRevisionId: number; plan: Plan };
    expect(body.baseRevisionId).toBe(4);
    const wl = body.plan.lines.lines.find((l) => l.id === 'ln-wl')!;
    const chine = body.plan.lines.lines.find((l) => l.id === 'ln-chine')!;
    expect(wl.cells['st-1']).toBe(333);
    expect(chine.cells['st-1']).toEqual({ y: 300, z: 444 });
    expect(puts[0]!.headers['x-csrf-token']).toBe('token-1');
    await act(() => vi.advanceTimersByTimeAsync(50));
    expect(status()).toBe('Draft saved');
  });

  it('says so when offline, keeps the changes in the tab, and sends them when the connection is back', async () => {
    let online = false;
    const api = server({ 'PUT /api/hulls/3/plan/draft': () => (online ? { body: { draft: { updatedAt: '2025-04-12T08:30:00.000Z' } } } : { status: 503, body: {} }) });
    const onLine = vi.spyOn(window.navigator, 'onLine', 'get').mockImplementation(() => online);
    const { user } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');

    await user.click(cell('WL 300 at St 2'));
    await user.keyboard('461{Enter}');
    await waitFor(() => expect(status()).toBe('Offline — changes kept in this tab'), { timeout: 3000 });
    expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(0);
    expect(cellText('WL 300 at St 2')).toBe('461');

    online = true;
    window.dispatchEvent(new Event('online'));
    await waitFor(() => expect(status()).toBe('Draft saved'));
    expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(1);
    onLine.mockRestore();
  });

  it('restores a draft left earlier, says from when, and can discard it', async () => {
    const draftPlan = withWaterline(smallPlan(), 'st-2', 777);
    let draftGone = false;
    const api = server({
      'GET /api/hulls/3/plan/draft': () => ({ body: { draft: draftGone ? null : { baseRevisionId: 4, plan: draftPlan, updatedAt: '2025-04-12T07:05:00.000Z' } } }),
      'DELETE /api/hulls/3/plan/draft': () => {
        draftGone = true;
        return { status: 204 };
      },
    });
    const { user } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');

    expect(screen.getByText(/^Restored your unsaved changes from 12 Apr 2025/)).toBeTruthy();
    expect(cellText('WL 300 at St 2')).toBe('777');
    expect(status()).toBe('Draft saved');

    await user.click(screen.getByRole('button', { name: 'Discard my changes' }));
    await user.click(screen.getByRole('button', { name: 'Yes, discard my changes' }));
    await waitFor(() => expect(cellText('WL 300 at St 2')).toBe('450'));
    expect(screen.queryByText(/^Restored your unsaved changes/)).toBeNull();
    expect(status()).toBe('Revision 4 saved');
    expect(api.writes().map((c) => `${c.method} ${c.path}`)).toEqual(['DELETE /api/hulls/3/plan/draft']);
  });
});

describe('Save revision', () => {
  it('saves the working copy as a revision with the summary, and says which', async () => {
    const api = server({
      'POST /api/hulls/3/plan/revisions': (call: RecordedCall) => ({ status: 201, body: { revision: revision(5, { summary: (call.body as { summary: string }).summary }), changes: [] } }),
      'GET /api/hulls/3/plan/revisions': { body: { revisions: [revision(5), revision(4)] } },
      'GET /api/hulls': { body: { hulls: [] } },
    });
    const { user } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');
    expect((screen.getByRole('button', { name: 'Save revision' }) as HTMLButtonElement).disabled).toBe(true);

    await user.click(cell('WL 300 at St 3'));
    await user.keyboard('505{Enter}');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));
    await user.type(screen.getByLabelText('What changed (optional)'), 'St 3 from the designer');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));

    await waitFor(() => expect(status()).toBe('Revision 5 saved'));
    const post = api.calls.find((c) => c.method === 'POST')!;
    expect(post.body).toMatchObject({ baseRevisionId: 4, summary: 'St 3 from the designer' });
    expect((post.body as { plan: Plan }).plan.lines.lines[0]!.cells['st-3']).toBe(505);
  });

  it('on a 409 shows the conflict with its two ways on, and reapplies my change on the latest revision', async () => {
    // Tomas saved revision 5 meanwhile, changing St 4 of the waterline.
    const theirs = withWaterline(smallPlan(), 'st-4', 444);
    let latestIs5 = false;
    const api = server({
      'GET /api/hulls/3/plan': () => ({ body: latestIs5 ? { revision: revision(5, { authorName: 'Tomas Reed' }), plan: theirs } : { revision: revision(4), plan: smallPlan() } }),
      'POST /api/hulls/3/plan/revisions': () => {
        latestIs5 = true;
        return { status: 409, body: { error: { code: 'stale_revision', message: 'Someone saved a newer revision', latestRevisionId: 5, latestRevision: revision(5, { authorName: 'Tomas Reed', summary: 'Fixed St 4' }) } } };
      },
    });
    const { user } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');

    await user.click(cell('WL 300 at St 2'));
    await user.keyboard('466{Enter}');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));
    await user.click(screen.getByRole('button', { name: 'Save revision' }));

    const dialog = await screen.findByRole('dialog', { name: 'Someone saved a newer revision' });
    expect(dialog.textContent).toContain('Tomas Reed saved revision 5');
    expect(within(dialog).getByRole('button', { name: 'Reload the latest and reapply my change' })).toBeTruthy();
    expect(within(dialog).getByRole('button', { name: 'Save my version as a copy of the hull' })).toBeTruthy();
    expect(within(dialog).getByRole('button', { name: 'Cancel' })).toBeTruthy();

    await user.click(within(dialog).getByRole('button', { name: 'Reload the latest and reapply my change' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    // Mine and theirs, both.
    expect(cellText('WL 300 at St 2')).toBe('466');
    expect(cellText('WL 300 at St 4')).toBe('444');
    expect(screen.getByText(/1 change of yours reapplied on top of revision 5 \(saved by Tomas Reed\)/)).toBeTruthy();
    expect(api.count('POST', '/api/hulls/3/plan/revisions')).toBe(1);
  });

  it('after a 409 can keep my version whole as a copy of the hull', async () => {
    const api = server({
      'POST /api/hulls/3/plan/revisions': { status: 409, body: { error: { code: 'stale_revision', message: 'Someone saved a newer revision', latestRevisionId: 5, latestRevision: revision(5) } } },
      'POST /api/hulls/3/copy': { status: 201, body: { hull: hull({ id: 9, name: 'Tidewrack (my version)' }) } },
      'DELETE /api/hulls/3/plan/draft': { status: 204 },
      'GET /api/hulls': { body: { hulls: [] } },
      'GET /api/hulls/9': { body: { hull: hull({ id: 9, name: 'Tidewrack (my version)' }) } },
      'GET /api/hulls/9/crew': { body: { crew: [member(ann, 'owner')] } },
      ...planHandlers(9, { plan: withWaterline(smallPlan(), 'st-1', 321), revision: revision(6, { hullId: 9 }) }),
    });
    const { user, here } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');

    await user.click(cell('WL 300 at St 1'));
    await user.keyboard('321{Enter}');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));
    await user.click(screen.getByRole('button', { name: 'Save revision' }));
    const dialog = await screen.findByRole('dialog');
    expect((within(dialog).getByLabelText('Name of the copy') as HTMLInputElement).value).toBe('Tidewrack (my version)');
    await user.click(within(dialog).getByRole('button', { name: 'Save my version as a copy of the hull' }));

    await screen.findByRole('heading', { name: 'Tidewrack (my version)', level: 1 });
    expect(here()).toBe('/hulls/9/lines');
    const copy = api.calls.find((c) => c.path === '/api/hulls/3/copy')!;
    expect((copy.body as { name: string; plan: Plan }).name).toBe('Tidewrack (my version)');
    expect((copy.body as { plan: Plan }).plan.lines.lines[0]!.cells['st-1']).toBe(321);
  });

  it('refuses nothing silently: a save the server turns down says why and keeps the changes', async () => {
    server({ 'POST /api/hulls/3/plan/revisions': apiError(400, 'invalid_plan', 'plan.lines.stations.0.name: Too small', { field: 'plan.lines.stations.0.name' }) });
    const { user } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');
    await user.click(cell('WL 300 at St 1'));
    await user.keyboard('350{Enter}');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));
    await user.click(screen.getByRole('button', { name: 'Save revision' }));
    expect((await screen.findByRole('alert')).textContent).toContain('plan.lines.stations.0.name: Too small');
    expect(status()).toBe('Not saved');
    expect(cellText('WL 300 at St 1')).toBe('350');
  });
});

describe('leaving with changes', () => {
  it('asks before the tab closes only while the changes are not on the server yet', async () => {
    const api = server();
    const { user } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');
    const closing = () => {
      const event = new Event('beforeunload', { cancelable: true });
      window.dispatchEvent(event);
      return event.defaultPrevented;
    };
    expect(closing()).toBe(false);

    await user.click(cell('WL 300 at St 1'));
    await user.keyboard('333{Enter}');
    // Not on the server: the browser asks, and the draft goes at once (keepalive) rather than after the pause.
    expect(closing()).toBe(true);
    await waitFor(() => expect(status()).toBe('Draft saved'));
    expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(1);
    expect(closing()).toBe(false);
  });

  it('offers to save a revision when leaving the hull with changes not in one, and can leave keeping the draft', async () => {
    const api = server({ 'GET /api/hulls': { body: { hulls: [] } }, 'GET /api/hulls/3/parts': apiError(404, 'not_found', 'No such API route') });
    const { user, here } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');
    await user.click(cell('WL 300 at St 1'));
    await user.keyboard('333{Enter}');

    // Another screen of the same hull is not leaving.
    await user.click(screen.getByRole('link', { name: 'Frames' }));
    expect(here()).toBe('/hulls/3/frames');
    expect(screen.queryByRole('dialog')).toBeNull();

    await user.click(screen.getByRole('link', { name: 'Hulls' }));
    const dialog = await screen.findByRole('dialog', { name: 'Save a revision before you go?' });
    expect(within(dialog).getByRole('button', { name: 'Save revision and leave' })).toBeTruthy();
    await user.click(within(dialog).getByRole('button', { name: 'Stay here' }));
    expect(here()).toBe('/hulls/3/frames');

    await user.click(screen.getByRole('link', { name: 'Hulls' }));
    await user.click(await screen.findByRole('button', { name: 'Leave, keep my draft' }));
    await waitFor(() => expect(here()).toBe('/hulls'));
    await waitFor(() => expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(1));
  });
});
