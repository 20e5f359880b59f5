import { waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '../../shared/api/hulls';
import type { PlanChange } from '../../shared/geometry/plan-compare';
import { stubApi, type Handlers } from './api-stub';
import { ann, hull, sessionOf } from './fixtures';
import { planHandlers, revision, smallPlan } from './plan-fixtures';
import { renderApp, screen } from './render-app';

const changes: PlanChange[] = [
  { area: 'lines', kind: 'cell', path: 'lines.lines.ln-wl.cells.st-2', label: 'WL 300 at St 2', before: 450, after: 466 },
  { area: 'lines', kind: 'cell', path: 'lines.lines.ln-chine.cells.st-3', label: 'Chine at St 3', before: null, after: { y: 610, z: 172 } },
  { area: 'lines', kind: 'station', path: 'lines.stations.st-4.x', label: 'station St 4 x', before: 2400, after: 2450 },
];

function historyServer(role: Role = 'owner', more: Handlers = {}) {
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role }) } },
    ...planHandlers(3, { plan: smallPlan(), revision: revision(7) }),
    'GET /api/hulls/3/plan/revisions': { body: { revisions: [revision(7, { summary: 'Chine at St 3' }), revision(6, { authorName: 'Tomas Reed', summary: 'Offsets from sheet 2' }), revision(5)] } },
    'GET /api/hulls/3/plan/compare': (call) => ({ body: { from: Number(new URLSearchParams(call.search).get('from')), to: Number(new URLSearchParams(call.search).get('to')), changes } }),
    ...more,
  });
}

describe('Revisions', () => {
  it('lists the revisions newest first, with when, who and what', async () => {
    historyServer();
    renderApp('/hulls/3/history');
    const list = await screen.findByRole('region', { name: 'Revision list' });
    const rows = within(list).getAllByRole('row').slice(1);
    expect(rows.map((r) => within(r).getByRole('rowheader').textContent)).toEqual(['7latest', '6', '5']);
    expect(rows[1]!.textContent).toContain('Tomas Reed');
    expect(rows[1]!.textContent).toContain('Offsets from sheet 2');
    expect(rows[1]!.textContent).toContain('11 Apr 2025');
  });

  it('compares the latest with the one before, and any two picked, in plain words and the hull’s units', async () => {
    const api = historyServer();
    const { user } = renderApp('/hulls/3/history');
    const heading = await screen.findByRole('heading', { name: 'From revision 6 to revision 7: 3 changes' });
    const table = within(heading.closest('section')!).getByRole('table');
    expect(within(table).getAllByRole('row').slice(1).map((r) => [...r.children].map((c) => c.textContent))).toEqual([
      ['WL 300 at St 2', '450 mm', '→', '466 mm'],
      ['Chine at St 3', 'empty', '→', 'half-breadth 610 mm, height 172 mm'],
      ['station St 4 x', '2400 mm', '→', '2450 mm'],
    ]);

    await user.click(screen.getByRole('radio', { name: 'Compare from revision 5' }));
    await screen.findByRole('heading', { name: 'From revision 5 to revision 7: 3 changes' });
    expect(api.calls.filter((c) => c.path === '/api/hulls/3/plan/compare').map((c) => c.search)).toEqual(['?from=6&to=7', '?from=5&to=7']);
  });

  it('restores an older revision after asking: it becomes a new revision on top of the latest', async () => {
    let restored = false;
    const restoredPlan = smallPlan();
    const api = historyServer('owner', {
      'POST /api/hulls/3/plan/revisions/5/restore': () => {
        restored = true;
        return { status: 201, body: { revision: revision(8, { summary: 'Restored revision 5' }), changes: [] } };
      },
      'GET /api/hulls/3/plan': () => ({ body: { revision: restored ? revision(8) : revision(7), plan: restoredPlan } }),
      'GET /api/hulls': { body: { hulls: [] } },
    });
    const { user } = renderApp('/hulls/3/history');
    await screen.findByRole('region', { name: 'Revision list' });
    expect(screen.queryByRole('button', { name: 'Restore revision 7' })).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Restore revision 5' }));
    expect(screen.getByText(/Restore revision 5\? Its plan is saved again as a new revision on top of revision 7; no revision is changed or lost\./)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Yes, restore revision 5' }));

    await waitFor(() => expect(screen.getByTestId('save-status').textContent).toBe('Revision 8 saved'));
    expect(screen.getByText('Revision 5 restored: it is saved again as revision 8.')).toBeTruthy();
    expect(api.writes()).toMatchObject([{ method: 'POST', path: '/api/hulls/3/plan/revisions/5/restore', body: { baseRevisionId: 7 } }]);
  });

  it('offers a helper no restore', async () => {
    historyServer('helper');
    renderApp('/hulls/3/history');
    await screen.findByRole('region', { name: 'Revision list' });
    expect(screen.queryByRole('button', { name: /^Restore/ })).toBeNull();
  });
});
