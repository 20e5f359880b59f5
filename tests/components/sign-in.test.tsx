import { describe, expect, it } from 'vitest';
import { apiError, stubApi } from './api-stub';
import { ann, hull, sessionOf, signedOutSession } from './fixtures';
import { errorUnder, renderApp, screen } from './render-app';

async function signInWith(user: ReturnType<typeof renderApp>['user'], email: string, password: string) {
  if (email) await user.type(screen.getByLabelText('E-mail'), email);
  if (password) await user.type(screen.getByLabelText('Password'), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('sign-in form', () => {
  it('checks both fields with the shared schema before sending anything', async () => {
    const api = stubApi({ 'GET /api/session': signedOutSession });
    const { user } = renderApp('/sign-in');

    await signInWith(user, 'not-an-address', '');

    errorUnder(screen.getByLabelText('E-mail'), 'Enter a valid e-mail address');
    errorUnder(screen.getByLabelText('Password'), 'Enter your password');
    expect(api.writes()).toEqual([]);
  });

  it('says plainly when the e-mail and password do not match, and stays on the form', async () => {
    stubApi({
      'GET /api/session': signedOutSession,
      'POST /api/auth/sign-in': apiError(401, 'bad_credentials', 'Wrong e-mail or password'),
    });
    const { user, here } = renderApp('/sign-in?next=%2Fhulls');

    await signInWith(user, 'ann.marsh@example.test', 'not the password');

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('That e-mail and password do not match an account');
    // A 401 from sign-in itself is an answer to show, not a reason to bounce to the sign-in page.
    expect(here()).toBe('/sign-in?next=%2Fhulls');
  });

  it('tells the person to wait after too many attempts (429)', async () => {
    stubApi({
      'GET /api/session': signedOutSession,
      'POST /api/auth/sign-in': apiError(429, 'too_many_attempts', 'Slow down'),
    });
    const { user } = renderApp('/sign-in');

    await signInWith(user, 'ann.marsh@example.test', 'whatever it is');

    expect((await screen.findByRole('alert')).textContent).toContain('Too many tries in a short time. Wait a few minutes');
  });

  it('goes to ?next= after signing in', async () => {
    let signedIn = false;
    const api = stubApi({
      'GET /api/session': () => (signedIn ? sessionOf(ann) : signedOutSession),
      'POST /api/auth/sign-in': () => {
        signedIn = true;
        return { body: { user: ann } };
      },
      'GET /api/hulls': { body: { hulls: [hull({ name: 'Tidewrack' })] } },
    });
    const { user, here } = renderApp('/sign-in?next=%2Fhulls');

    await signInWith(user, 'ann.marsh@example.test', 'the right password');

    expect(await screen.findByRole('link', { name: /Tidewrack/ })).toBeTruthy();
    expect(here()).toBe('/hulls');
    expect(api.writes()[0]).toMatchObject({ body: { email: 'ann.marsh@example.test', password: 'the right password' }, headers: { 'x-csrf-token': 'token-anon' } });
  });

  it('ignores a ?next= that points off the site and goes to Hulls', async () => {
    let signedIn = false;
    stubApi({
      'GET /api/session': () => (signedIn ? sessionOf(ann) : signedOutSession),
      'POST /api/auth/sign-in': () => {
        signedIn = true;
        return { body: { user: ann } };
      },
      'GET /api/hulls': { body: { hulls: [] } },
    });
    const { user, here } = renderApp('/sign-in?next=%2F%2Felsewhere.example%2Fsteal');

    await signInWith(user, 'ann.marsh@example.test', 'the right password');

    await screen.findByRole('heading', { name: 'Hulls', level: 1 });
    expect(here()).toBe('/hulls');
  });

  it('links to sign-up, keeping ?next=', () => {
    stubApi({ 'GET /api/session': signedOutSession });
    renderApp('/sign-in?next=%2Fhulls%2F3');
    expect(screen.getByRole('link', { name: 'Create an account' }).getAttribute('href')).toBe('/sign-up?next=%2Fhulls%2F3');
  });
});
