import { within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { apiError, stubApi } from './api-stub';
import { ann, hull, sessionOf } from './fixtures';
import { renderApp, screen } from './render-app';

describe('Hulls page', () => {
  it('explains what to do when there are no hulls yet', async () => {
    stubApi({ 'GET /api/session': sessionOf(ann), 'GET /api/hulls': { body: { hulls: [] } } });
    renderApp('/hulls');

    expect(await screen.findByRole('heading', { name: 'No hull yet' })).toBeTruthy();
    expect(screen.getByText(/Ask its owner to add you to the crew/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'New hull' }).getAttribute('href')).toBe('/hulls/new');
  });

  it('lists each hull with its units, my role and its last change, linking to its page', async () => {
    stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/hulls': {
        body: {
          hulls: [
            hull({ id: 3, name: 'Tidewrack', units: 'ftin', role: 'owner', updatedAt: '2025-04-11T16:40:00.000Z' }),
            hull({ id: 8, name: 'Saltgrass punt', units: 'mm', role: 'helper' }),
          ],
        },
      },
    });
    renderApp('/hulls');

    const list = await screen.findByRole('list', { name: 'Your hulls' });
    const links = within(list).getAllByRole('link');
    expect(links.map((a) => a.getAttribute('href'))).toEqual(['/hulls/3', '/hulls/8']);
    expect(links[0].textContent).toContain('Tidewrack');
    expect(links[0].textContent).toContain('Feet-inches-eighths');
    expect(links[0].textContent).toContain('Owner');
    expect(links[0].textContent).toContain('11 Apr 2025');
    expect(links[1].textContent).toContain('Millimetres');
    expect(links[1].textContent).toContain('Helper');
    expect(within(list).queryByRole('heading', { name: 'No hull yet' })).toBeNull();
  });

  it('says so when the list cannot be loaded, and can try again', async () => {
    let fail = true;
    stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/hulls': () => (fail ? apiError(500, 'internal', 'The server had a problem. Try again in a moment.') : { body: { hulls: [hull({ name: 'Tidewrack' })] } }),
    });
    const { user } = renderApp('/hulls');

    expect((await screen.findByRole('alert')).textContent).toContain('Your hulls could not be loaded.');
    fail = false;
    await user.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('link', { name: /Tidewrack/ })).toBeTruthy();
  });

  it('shows a hull that is not mine (404) as not found, with a way back', async () => {
    stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/hulls/99': apiError(404, 'not_found', 'No such hull'),
      'GET /api/hulls/99/crew': apiError(404, 'not_found', 'No such hull'),
    });
    renderApp('/hulls/99');

    expect(await screen.findByRole('heading', { name: 'No hull here' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to the hull list' }).getAttribute('href')).toBe('/hulls');
  });
});
