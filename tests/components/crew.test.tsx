import { waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CrewMember, Role } from '../../shared/api/hulls';
import { apiError, stubApi, type Handlers } from './api-stub';
import { ann, hull, member, priya, sessionOf, tomas } from './fixtures';
import { errorUnder, renderApp, screen } from './render-app';

/** Hull 3 with a crew the handlers can change, as the server would. */
function crewServer(myRole: Role, extra: Handlers = {}) {
  const crew: CrewMember[] = [member(ann, myRole), member(tomas, 'builder'), member(priya, 'helper')];
  if (myRole !== 'owner') crew.push(member({ id: 4, email: 'ola.berg@example.test', displayName: 'Ola Berg' }, 'owner'));
  const api = stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': () => ({ body: { hull: hull({ id: 3, name: 'Curlew', role: crew.find((m) => m.userId === ann.id)?.role ?? myRole }) } }),
    'GET /api/hulls/3/crew': () => ({ body: { crew: [...crew] } }),
    ...extra,
  });
  return { api, crew };
}

async function crewTable() {
  const section = (await screen.findByRole('heading', { name: 'Crew', level: 2 })).closest('section')!;
  return within(section).findByRole('table');
}

function bodyRows(table: HTMLElement) {
  return within(table).getAllByRole('row').filter((row) => row.closest('tbody'));
}

function rowOf(table: HTMLElement, name: string) {
  const row = within(table).getByText(name).closest('tr');
  if (!row) throw new Error(`no row for ${name}`);
  return row;
}

describe('Crew on the hull page', () => {
  it('gives an owner the add form and, on each row, a role select and a Remove button', async () => {
    crewServer('owner');
    renderApp('/hulls/3');

    const table = await crewTable();
    expect(bodyRows(table)).toHaveLength(3);
    const tomasRow = rowOf(table, 'Tomas Reed');
    expect(tomasRow.textContent).toContain('tomas.reed@example.test');
    expect((within(tomasRow).getByLabelText('Role for Tomas Reed') as HTMLSelectElement).value).toBe('builder');
    expect(within(table).getAllByRole('button', { name: 'Remove' })).toHaveLength(3);

    expect(screen.getByLabelText("Crew member's e-mail")).toBeTruthy();
    const role = screen.getByLabelText('Role') as HTMLSelectElement;
    expect([...role.options].map((o) => [o.value, o.textContent])).toEqual([
      ['owner', 'Owner'],
      ['builder', 'Builder'],
      ['designer', 'Designer'],
      ['helper', 'Helper'],
    ]);
    expect(screen.getByRole('button', { name: 'Add to crew' })).toBeTruthy();
  });

  it('shows a helper the crew read-only: no add form, no role selects, no Remove', async () => {
    crewServer('helper');
    renderApp('/hulls/3');

    const table = await crewTable();
    expect(bodyRows(table)).toHaveLength(4);
    expect(rowOf(table, 'Tomas Reed').textContent).toContain('Builder');
    expect(screen.queryByLabelText("Crew member's e-mail")).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add to crew' })).toBeNull();
    expect(screen.queryByLabelText('Role for Tomas Reed')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Remove' })).toBeNull();
    expect(screen.getByText('The people who work on this hull. Only an owner can change the crew.')).toBeTruthy();
  });

  it('asks before removing, and removes only when confirmed', async () => {
    const { api, crew } = crewServer('owner', {});
    const handlers: Handlers = {};
    void handlers;
    const removed: string[] = [];
    api.calls.length = 0;
    // The DELETE handler edits the server's crew.
    const { user } = renderApp('/hulls/3');
    const stub = stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Curlew', role: 'owner' }) } },
      'GET /api/hulls/3/crew': () => ({ body: { crew: [...crew] } }),
      'DELETE /api/hulls/3/crew/2': () => {
        removed.push('tomas');
        crew.splice(crew.findIndex((m) => m.userId === tomas.id), 1);
        return { status: 204 };
      },
    });

    const table = await crewTable();
    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Remove' }));
    expect(within(rowOf(table, 'Tomas Reed')).getByText('Take Tomas Reed off this crew?')).toBeTruthy();
    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Keep' }));
    expect(stub.writes()).toEqual([]);

    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Remove' }));
    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Yes, remove' }));

    await waitFor(() => expect(within(table).queryByText('Tomas Reed')).toBeNull());
    expect(removed).toEqual(['tomas']);
    expect(stub.writes()).toMatchObject([{ method: 'DELETE', path: '/api/hulls/3/crew/2', headers: { 'x-csrf-token': 'token-1' } }]);
    expect(bodyRows(table)).toHaveLength(2);
  });
});
