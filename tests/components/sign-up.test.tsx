import { describe, expect, it } from 'vitest';
import { apiError, stubApi } from './api-stub';
import { ann, sessionOf, signedOutSession } from './fixtures';
import { errorUnder, renderApp, screen } from './render-app';

async function fillSignUp(user: ReturnType<typeof renderApp>['user'], values: { name: string; email: string; password: string }) {
  await user.type(screen.getByLabelText('Your name'), values.name);
  await user.type(screen.getByLabelText('E-mail'), values.email);
  await user.type(screen.getByLabelText('Password'), values.password);
  await user.click(screen.getByRole('button', { name: 'Create account' }));
}

describe('sign-up form', () => {
  it('shows the shared schema’s message under Password for a short password and sends nothing', async () => {
    const api = stubApi({ 'GET /api/session': signedOutSession });
    const { user } = renderApp('/sign-up');

    await fillSignUp(user, { name: 'Ann Marsh', email: 'ann.marsh@example.test', password: 'short' });

    errorUnder(screen.getByLabelText('Password'), 'Use at least 10 characters');
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBeNull();
    expect(api.writes()).toEqual([]);
  });

  it('shows a 400’s message under the field the server names', async () => {
    const api = stubApi({
      'GET /api/session': signedOutSession,
      'POST /api/auth/sign-up': apiError(400, 'invalid_input', 'Check the marked field.', {
        field: 'displayName',
        issues: [{ field: 'displayName', message: 'A name cannot hold control characters' }],
      }),
    });
    const { user, here } = renderApp('/sign-up');

    await fillSignUp(user, { name: 'Ann Marsh', email: 'ann.marsh@example.test', password: 'long enough pass' });

    errorUnder(await screen.findByLabelText('Your name'), 'A name cannot hold control characters');
    await screen.findByText('A name cannot hold control characters');
    expect(screen.getByLabelText('Password').getAttribute('aria-invalid')).toBeNull();
    expect(api.count('POST', '/api/auth/sign-up')).toBe(1);
    expect(here()).toBe('/sign-up');
  });

  it('shows a 400 that gives only `field` under that field', async () => {
    stubApi({
      'GET /api/session': signedOutSession,
      'POST /api/auth/sign-up': apiError(400, 'invalid_input', 'That e-mail domain cannot receive mail', { field: 'email' }),
    });
    const { user } = renderApp('/sign-up');

    await fillSignUp(user, { name: 'Ann Marsh', email: 'ann.marsh@example.test', password: 'long enough pass' });

    await screen.findByText('That e-mail domain cannot receive mail');
    errorUnder(screen.getByLabelText('E-mail'), 'That e-mail domain cannot receive mail');
  });

  it('says under E-mail when the e-mail already has an account (409)', async () => {
    stubApi({
      'GET /api/session': signedOutSession,
      'POST /api/auth/sign-up': apiError(409, 'email_taken', 'email taken'),
    });
    const { user } = renderApp('/sign-up');

    await fillSignUp(user, { name: 'Ann Marsh', email: 'ann.marsh@example.test', password: 'long enough pass' });

    await screen.findByText(/already an account with this e-mail/);
    errorUnder(screen.getByLabelText('E-mail'), 'already an account with this e-mail');
    expect(screen.getByRole('link', { name: 'Sign in instead' }).getAttribute('href')).toBe('/sign-in');
  });

  it('sends the form as JSON with the CSRF token, then goes on to ?next=', async () => {
    let signedUp = false;
    const api = stubApi({
      'GET /api/session': () => (signedUp ? sessionOf(ann, 'token-after') : signedOutSession),
      'POST /api/auth/sign-up': () => {
        signedUp = true;
        return { status: 201, body: { user: ann } };
      },
    });
    const { user, here } = renderApp('/sign-up?next=%2Fsafety');

    await fillSignUp(user, { name: '  Ann Marsh ', email: 'ann.marsh@example.test', password: 'long enough pass' });

    await screen.findByRole('heading', { name: 'Safety notes', level: 1 });
    expect(here()).toBe('/safety');
    const [post] = api.writes();
    expect(post).toMatchObject({
      method: 'POST',
      path: '/api/auth/sign-up',
      credentials: 'same-origin',
      headers: { 'x-csrf-token': 'token-anon', 'content-type': 'application/json' },
      // The shared schema trims the name before it is sent.
      body: { displayName: 'Ann Marsh', email: 'ann.marsh@example.test', password: 'long enough pass' },
    });
    // Signed in now: the header shows the person and the new session was read.
    expect(await screen.findByRole('button', { name: 'Sign out' })).toBeTruthy();
    expect(screen.getByText('Ann Marsh')).toBeTruthy();
  });
});
