import { waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ApiError, toApiError } from '../../src/lib/api-client';
import { apiError, stubApi } from './api-stub';
import { ann, hull, member, sessionOf, signedOutSession } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { renderApp, screen } from './render-app';

describe('signed-in pages', () => {
  it('send a signed-out person to sign-in, remembering where they were going', async () => {
    stubApi({ 'GET /api/session': signedOutSession });
    const { here } = renderApp('/hulls/7');

    await screen.findByRole('button', { name: 'Sign in' });
    expect(here()).toBe('/sign-in?next=%2Fhulls%2F7');
  });

  it('send the person to sign-in with ?next= when an API call answers 401, and back again after signing in', async () => {
    // The session was alive when the app read it, and ended on the server before the hull was asked for.
    let state: 'ending' | 'ended' | 'signed-in' = 'ending';
    stubApi({
      'GET /api/session': () => (state === 'ended' ? signedOutSession : sessionOf(ann)),
      'GET /api/hulls/7': () => {
        if (state === 'signed-in') return { body: { hull: hull({ id: 7, name: 'Saltgrass punt' }) } };
        state = 'ended';
        return apiError(401, 'signed_out', 'Sign in first');
      },
      'GET /api/hulls/7/crew': () => (state === 'signed-in' ? { body: { crew: [member(ann, 'owner')] } } : apiError(401, 'signed_out', 'Sign in first')),
      ...planHandlers(7),
      'POST /api/auth/sign-in': () => {
        state = 'signed-in';
        return { body: { user: ann } };
      },
    });
    const { user, here } = renderApp('/hulls/7');

    await screen.findByRole('button', { name: 'Sign in' });
    expect(here()).toBe('/sign-in?next=%2Fhulls%2F7');
    // What belonged to the signed-in person is forgotten: the header no longer shows her.
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Sign out' })).toBeNull());

    await user.type(screen.getByLabelText('E-mail'), ann.email);
    await user.type(screen.getByLabelText('Password'), 'the right password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { name: 'Saltgrass punt', level: 1 })).toBeTruthy();
    expect(here()).toBe('/hulls/7');
  });

  it('sign out: tells the server, then shows sign-in without a ?next= into the last person’s hull', async () => {
    let signedIn = true;
    const api = stubApi({
      'GET /api/session': () => (signedIn ? sessionOf(ann, 'token-ann') : signedOutSession),
      'GET /api/hulls/7': { body: { hull: hull({ id: 7, name: 'Saltgrass punt' }) } },
      'GET /api/hulls/7/crew': { body: { crew: [member(ann, 'owner')] } },
      ...planHandlers(7),
      'POST /api/auth/sign-out': () => {
        signedIn = false;
        return { status: 204 };
      },
    });
    const { user, here } = renderApp('/hulls/7');

    await screen.findByRole('heading', { name: 'Saltgrass punt', level: 1 });
    await user.click(screen.getByRole('button', { name: 'Sign out' }));

    await screen.findByRole('button', { name: 'Sign in' });
    expect(here()).toBe('/sign-in');
    expect(api.writes()).toMatchObject([{ method: 'POST', path: '/api/auth/sign-out', headers: { 'x-csrf-token': 'token-ann' } }]);
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Sign out' })).toBeNull());
    expect(screen.queryByText('Saltgrass punt')).toBeNull();
  });

  it('show a page of its own for an address that does not exist, with a way back', async () => {
    stubApi({ 'GET /api/session': sessionOf(ann) });
    renderApp('/frames/nowhere');
    expect(screen.getByRole('heading', { name: 'Nothing at this address' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to the hull list' }).getAttribute('href')).toBe('/hulls');
  });

  it('redirect / to /hulls', async () => {
    stubApi({ 'GET /api/session': sessionOf(ann), 'GET /api/hulls': { body: { hulls: [] } } });
    const { here } = renderApp('/');
    await screen.findByRole('heading', { name: 'Hulls', level: 1 });
    expect(here()).toBe('/hulls');
  });
});

describe('toApiError', () => {
  it('reads status, code, message and field from the error shape', async () => {
    const error = await toApiError(
      new Response(JSON.stringify({ error: { code: 'no_such_account', message: 'No account has that e-mail', field: 'email' } }), { status: 404 }),
    );
    expect(error).toBeInstanceOf(ApiError);
    expect({ status: error.status, code: error.code, message: error.message, field: error.field }).toEqual({
      status: 404,
      code: 'no_such_account',
      message: 'No account has that e-mail',
      field: 'email',
    });
  });

  it('copes with a body that is not the error shape', async () => {
    const error = await toApiError(new Response('<html>Bad gateway</html>', { status: 502 }));
    expect({ status: error.status, code: error.code, field: error.field }).toEqual({ status: 502, code: 'http_502', field: undefined });
  });
});

