import { describe, expect, it } from 'vitest';
import { apiError, stubApi } from './api-stub';
import { ann, hull, member, sessionOf } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { errorUnder, renderApp, screen } from './render-app';

const signedIn = { 'GET /api/session': sessionOf(ann) };

describe('create-hull form', () => {
  it('offers the two units, millimetres first', async () => {
    stubApi(signedIn);
    renderApp('/hulls/new');
    const units = (await screen.findByLabelText('Units')) as HTMLSelectElement;
    expect([...units.options].map((o) => [o.value, o.textContent])).toEqual([
      ['mm', 'Millimetres'],
      ['ftin', 'Feet-inches-eighths'],
    ]);
    expect(units.value).toBe('mm');
  });

  it.each([
    ['an empty name', ''],
    ['a name of spaces only (the shared schema trims it)', '   '],
  ])('refuses %s with the schema’s message and sends nothing', async (_, name) => {
    const api = stubApi(signedIn);
    const { user } = renderApp('/hulls/new');

    const nameInput = await screen.findByLabelText('Hull name');
    if (name) await user.type(nameInput, name);
    await user.click(screen.getByRole('button', { name: 'Create hull' }));

    errorUnder(screen.getByLabelText('Hull name'), 'Give the hull a name');
    expect(api.writes()).toEqual([]);
  });

  it('refuses notes longer than the schema allows', async () => {
    const api = stubApi(signedIn);
    const { user } = renderApp('/hulls/new');

    await user.type(await screen.findByLabelText('Hull name'), 'Tidewrack');
    await user.click(screen.getByLabelText('Notes'));
    await user.paste('x'.repeat(2001));
    await user.click(screen.getByRole('button', { name: 'Create hull' }));

    expect(screen.getByLabelText('Notes').getAttribute('aria-invalid')).toBe('true');
    expect(api.writes()).toEqual([]);
  });

  it('sends the hull and opens its page', async () => {
    const created = hull({ id: 12, name: 'Tidewrack', units: 'ftin', notes: 'Plans from the designer, sheet 3 of 9.' });
    const api = stubApi({
      ...signedIn,
      'POST /api/hulls': { status: 201, body: { hull: created } },
      'GET /api/hulls/12': { body: { hull: created } },
      'GET /api/hulls/12/crew': { body: { crew: [member(ann, 'owner')] } },
      ...planHandlers(12),
    });
    const { user, here } = renderApp('/hulls/new');

    await user.type(await screen.findByLabelText('Hull name'), '  Tidewrack ');
    await user.selectOptions(screen.getByLabelText('Units'), 'Feet-inches-eighths');
    await user.type(screen.getByLabelText('Notes'), 'Plans from the designer, sheet 3 of 9.');
    await user.click(screen.getByRole('button', { name: 'Create hull' }));

    expect(await screen.findByRole('heading', { name: 'Tidewrack', level: 1 })).toBeTruthy();
    expect(here()).toBe('/hulls/12');
    expect(screen.getByText('Feet-inches-eighths')).toBeTruthy();
    expect(api.writes()).toMatchObject([
      {
        method: 'POST',
        path: '/api/hulls',
        headers: { 'x-csrf-token': 'token-1' },
        body: { name: 'Tidewrack', units: 'ftin', notes: 'Plans from the designer, sheet 3 of 9.' },
      },
    ]);
  });

  it('shows the server’s complaint about a field under that field', async () => {
    stubApi({ ...signedIn, 'POST /api/hulls': apiError(400, 'invalid_input', 'You already have a hull with this name', { field: 'name' }) });
    const { user, here } = renderApp('/hulls/new');

    await user.type(await screen.findByLabelText('Hull name'), 'Tidewrack');
    await user.click(screen.getByRole('button', { name: 'Create hull' }));

    await screen.findByText('You already have a hull with this name');
    errorUnder(screen.getByLabelText('Hull name'), 'You already have a hull with this name');
    expect(here()).toBe('/hulls/new');
  });
});
