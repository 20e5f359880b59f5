import { waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CrewMember, Role } from '../../shared/api/hulls';
import { apiError, stubApi, type Handlers } from './api-stub';
import { ann, hull, member, priya, sessionOf, tomas } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { errorUnder, renderApp, screen } from './render-app';

const ola = { id: 4, email: 'ola.berg@example.test', displayName: 'Ola Berg' };

/** Hull 3, "Tidewrack", with Ann (signed in) in `myRole`; `more` adds handlers that may change the crew as the server would. */
function crewServer(myRole: Role, more: (crew: CrewMember[]) => Handlers = () => ({})) {
  const crew: CrewMember[] = [member(ann, myRole), member(tomas, 'builder'), member(priya, 'helper')];
  if (myRole !== 'owner') crew.push(member(ola, 'owner'));
  const myRoleNow = () => crew.find((m) => m.userId === ann.id)?.role ?? myRole;
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': () => ({ body: { hull: hull({ id: 3, name: 'Tidewrack', role: myRoleNow() }) } }),
    'GET /api/hulls/3/crew': () => ({ body: { crew: crew.map((m) => ({ ...m })) } }),
    ...planHandlers(3),
    ...more(crew),
  });
}

async function crewTable() {
  const section = (await screen.findByRole('heading', { name: 'Crew', level: 2 })).closest('section');
  if (!section) throw new Error('the Crew heading is not in a section');
  return within(section).findByRole('table');
}

function bodyRows(table: HTMLElement) {
  return within(table)
    .getAllByRole('row')
    .filter((row) => row.closest('tbody'));
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

  it('shows the hull, my role, a line per role, and the parts of the hull as links', async () => {
    crewServer('designer');
    renderApp('/hulls/3');

    expect(await screen.findByRole('heading', { name: 'Tidewrack', level: 1 })).toBeTruthy();
    expect(screen.getByText('Your role').nextElementSibling?.textContent).toBe('Designer');
    expect(screen.getByText('Units').nextElementSibling?.textContent).toBe('Millimetres');
    const guide = screen.getByRole('heading', { name: 'What each role may do' }).closest('section');
    expect(guide && within(guide).getAllByRole('term').map((t) => t.textContent)).toEqual(['Owner', 'Builder', 'Designer', 'Helper']);
    const parts = screen.getByRole('navigation', { name: 'Parts of this hull' });
    expect(within(parts).queryByText(/not built yet/)).toBeNull();
    expect(within(parts).getAllByRole('link').map((a) => [a.textContent, a.getAttribute('href')])).toEqual([
      ['Crew', '/hulls/3'],
      ['Lines', '/hulls/3/lines'],
      ['Frames', '/hulls/3/frames'],
      ['Drawing', '/hulls/3/drawing'],
      ['Revisions', '/hulls/3/history'],
      ['Build log', '/hulls/3/build-log'],
      ['Print shop', '/hulls/3/print-shop'],
      ['Downloads', '/hulls/3/downloads'],
    ]);
  });

  it('asks before removing, and removes only when confirmed', async () => {
    const api = crewServer('owner', (crew) => ({
      'DELETE /api/hulls/3/crew/2': () => {
        crew.splice(
          crew.findIndex((m) => m.userId === tomas.id),
          1,
        );
        return { status: 204 };
      },
    }));
    const { user } = renderApp('/hulls/3');

    const table = await crewTable();
    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Remove' }));
    expect(within(rowOf(table, 'Tomas Reed')).getByText('Take Tomas Reed off this crew?')).toBeTruthy();
    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Keep' }));
    expect(api.writes()).toEqual([]);
    expect(document.activeElement?.textContent).toBe('Remove');

    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Remove' }));
    await user.click(within(rowOf(table, 'Tomas Reed')).getByRole('button', { name: 'Yes, remove' }));

    await waitFor(() => expect(within(table).queryByText('Tomas Reed')).toBeNull());
    expect(api.writes()).toMatchObject([{ method: 'DELETE', path: '/api/hulls/3/crew/2', headers: { 'x-csrf-token': 'token-1' } }]);
    expect(bodyRows(table)).toHaveLength(2);
  });

  it('adds an existing account by e-mail, and says under the e-mail when nobody has that e-mail', async () => {
    const api = crewServer('owner', (crew) => ({
      'POST /api/hulls/3/crew': (call) => {
        const { email, role } = call.body as { email: string; role: Role };
        if (email !== ola.email) return apiError(404, 'no_such_account', 'No account has that e-mail', { field: 'email' });
        crew.push(member(ola, role));
        return { status: 201, body: { member: member(ola, role) } };
      },
    }));
    const { user } = renderApp('/hulls/3');
    const table = await crewTable();

    await user.type(screen.getByLabelText("Crew member's e-mail"), 'nobody@example.test');
    await user.click(screen.getByRole('button', { name: 'Add to crew' }));
    await screen.findByText(/Nobody has a Loftbench account with this e-mail/);
    errorUnder(screen.getByLabelText("Crew member's e-mail"), 'Nobody has a Loftbench account with this e-mail');
    expect(bodyRows(table)).toHaveLength(3);

    await user.clear(screen.getByLabelText("Crew member's e-mail"));
    await user.type(screen.getByLabelText("Crew member's e-mail"), ola.email);
    await user.selectOptions(screen.getByLabelText('Role'), 'Designer');
    await user.click(screen.getByRole('button', { name: 'Add to crew' }));

    expect((await screen.findByText('Ola Berg is on the crew as Designer.')).textContent).toBeTruthy();
    await waitFor(() => expect(bodyRows(table)).toHaveLength(4));
    expect((within(rowOf(table, 'Ola Berg')).getByLabelText('Role for Ola Berg') as HTMLSelectElement).value).toBe('designer');
    expect(api.writes().map((call) => call.body)).toEqual([
      { email: 'nobody@example.test', role: 'helper' },
      { email: 'ola.berg@example.test', role: 'designer' },
    ]);
    expect((screen.getByLabelText("Crew member's e-mail") as HTMLInputElement).value).toBe('');
  });

  it('checks the e-mail with the shared schema before sending', async () => {
    const api = crewServer('owner');
    const { user } = renderApp('/hulls/3');
    await crewTable();

    await user.type(screen.getByLabelText("Crew member's e-mail"), 'tomas at the yard');
    await user.click(screen.getByRole('button', { name: 'Add to crew' }));

    errorUnder(screen.getByLabelText("Crew member's e-mail"), 'Enter a valid e-mail address');
    expect(api.writes()).toEqual([]);
  });

  it('changes a role, and explains when the change would leave no owner', async () => {
    const api = crewServer('owner', (crew) => ({
      'PATCH /api/hulls/3/crew/2': (call) => {
        const changed = crew.find((m) => m.userId === tomas.id)!;
        changed.role = (call.body as { role: Role }).role;
        return { body: { member: changed } };
      },
      'PATCH /api/hulls/3/crew/1': apiError(409, 'last_owner', 'A hull must keep an owner'),
    }));
    const { user } = renderApp('/hulls/3');
    const table = await crewTable();

    await user.selectOptions(within(table).getByLabelText('Role for Tomas Reed'), 'Designer');
    await waitFor(() => expect((within(table).getByLabelText('Role for Tomas Reed') as HTMLSelectElement).disabled).toBe(false));
    expect((within(table).getByLabelText('Role for Tomas Reed') as HTMLSelectElement).value).toBe('designer');

    await user.selectOptions(within(table).getByLabelText('Role for Ann Marsh'), 'Helper');
    const annRole = within(table).getByLabelText('Role for Ann Marsh') as HTMLSelectElement;
    await waitFor(() => errorUnder(annRole, 'A hull needs at least one owner'));
    expect(annRole.value).toBe('owner');

    expect(api.writes().map((call) => [call.method, call.path, call.body])).toEqual([
      ['PATCH', '/api/hulls/3/crew/2', { role: 'designer' }],
      ['PATCH', '/api/hulls/3/crew/1', { role: 'helper' }],
    ]);
  });
});
