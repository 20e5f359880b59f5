import { within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { HullSummary, Role } from '../../shared/api/hulls';
import { stubApi, type Handlers } from './api-stub';
import { ann, hull, member, sessionOf } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { errorUnder, renderApp, screen } from './render-app';

function server(role: Role, more: (current: { hull: HullSummary }) => Handlers = () => ({})) {
  const current = { hull: hull({ id: 3, name: 'Tidewrack', role }) };
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': () => ({ body: { hull: current.hull } }),
    'GET /api/hulls/3/crew': { body: { crew: [member(ann, role)] } },
    'GET /api/hulls': () => ({ body: { hulls: [current.hull] } }),
    ...planHandlers(3),
    ...more(current),
  });
}

describe('Hull settings', () => {
  it('lets a builder rename the hull, checked by the shared schema, but not archive it', async () => {
    const api = server('builder', (current) => ({
      'PATCH /api/hulls/3': (call) => {
        current.hull = { ...current.hull, name: (call.body as { name: string }).name };
        return { body: { hull: current.hull } };
      },
    }));
    const { user } = renderApp('/hulls/3');
    await user.click(await screen.findByRole('button', { name: 'Rename hull' }));
    expect(screen.queryByRole('button', { name: 'Archive hull' })).toBeNull();

    const name = screen.getByLabelText('New name');
    await user.clear(name);
    await user.click(screen.getByRole('button', { name: 'Rename hull' }));
    errorUnder(screen.getByLabelText('New name'), 'Give the hull a name');
    await user.type(screen.getByLabelText('New name'), 'Tidewrack II');
    await user.click(screen.getByRole('button', { name: 'Rename hull' }));

    expect(await screen.findByRole('heading', { name: 'Tidewrack II', level: 1 })).toBeTruthy();
    expect(api.writes()).toMatchObject([{ method: 'PATCH', path: '/api/hulls/3', body: { name: 'Tidewrack II' } }]);
  });

  it('lets the owner archive after asking, and bring it back', async () => {
    const api = server('owner', (current) => ({
      'POST /api/hulls/3/archive': () => {
        current.hull = { ...current.hull, archived: true };
        return { body: { hull: current.hull } };
      },
      'POST /api/hulls/3/unarchive': () => {
        current.hull = { ...current.hull, archived: false };
        return { body: { hull: current.hull } };
      },
    }));
    const { user } = renderApp('/hulls/3');
    await user.click(await screen.findByRole('button', { name: 'Archive hull' }));
    await user.click(screen.getByRole('button', { name: 'Yes, archive it' }));
    expect(await screen.findByText(/This hull is archived/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Bring back from the archive' }));
    expect(await screen.findByRole('button', { name: 'Archive hull' })).toBeTruthy();
    expect(api.writes().map((c) => c.path)).toEqual(['/api/hulls/3/archive', '/api/hulls/3/unarchive']);
  });

  it('shows a helper no settings at all', async () => {
    server('helper');
    renderApp('/hulls/3');
    await screen.findByRole('heading', { name: 'Crew', level: 2 });
    expect(screen.queryByRole('heading', { name: 'Hull settings' })).toBeNull();
  });
});

describe('Hull list', () => {
  it('lists archived hulls apart from the current ones', async () => {
    stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/hulls': { body: { hulls: [hull({ id: 3, name: 'Tidewrack' }), hull({ id: 4, name: 'Old punt', archived: true }), hull({ id: 5, name: 'Saltgrass punt' })] } },
    });
    renderApp('/hulls');
    const current = await screen.findByRole('list', { name: 'Your hulls' });
    expect(within(current).getAllByRole('link').map((a) => a.getAttribute('href'))).toEqual(['/hulls/3', '/hulls/5']);
    const archived = screen.getByRole('list', { name: 'Archived hulls' });
    expect(within(archived).getAllByRole('link').map((a) => a.getAttribute('href'))).toEqual(['/hulls/4']);
  });
});
