import { describe, expect, it } from 'vitest';
import { apiError, stubApi } from './api-stub';
import { ann, sessionOf, signedOutSession } from './fixtures';
import { errorUnder, renderApp, screen } from './render-app';

const TOKEN = 'Zy9xWv8uTs7rQp6oNm5lKj4iHg3fEd2cBa1_-ZyXwVu';

describe('forgotten password', () => {
  it('checks the address, then says the same thing whatever the server knows', async () => {
    const api = stubApi({ 'GET /api/session': signedOutSession, 'POST /api/account/password-reset': { status: 202, body: { message: 'If this e-mail address has a Loftbench account, a link to choose a new password is on its way to it.' } } });
    const { user } = renderApp('/forgot-password');
    await user.type(await screen.findByLabelText('E-mail'), 'ann at home');
    await user.click(screen.getByRole('button', { name: 'Send me a link' }));
    errorUnder(screen.getByLabelText('E-mail'), 'Enter a valid e-mail address');
    expect(api.writes()).toEqual([]);
    await user.clear(screen.getByLabelText('E-mail'));
    await user.type(screen.getByLabelText('E-mail'), 'ann.marsh@example.test');
    await user.click(screen.getByRole('button', { name: 'Send me a link' }));
    expect((await screen.findByText('Check your mail.')).closest('[role="status"]')?.textContent).toContain('If this e-mail address has a Loftbench account');
    expect(api.writes()).toMatchObject([{ path: '/api/account/password-reset', body: { email: 'ann.marsh@example.test' } }]);
  });

  it('asks to wait when the server limits the requests', async () => {
    stubApi({ 'GET /api/session': signedOutSession, 'POST /api/account/password-reset': apiError(429, 'too_many_attempts', 'Too many') });
    const { user } = renderApp('/forgot-password');
    await user.type(await screen.findByLabelText('E-mail'), 'ann.marsh@example.test');
    await user.click(screen.getByRole('button', { name: 'Send me a link' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Wait a few minutes');
  });
});

describe('the reset link', () => {
  it('names the account, refuses a short password under its field, then sets it and offers sign-in', async () => {
    const api = stubApi({
      'GET /api/session': signedOutSession,
      'POST /api/account/password-reset/preview': { body: { email: 'ann.marsh@example.test' } },
      'POST /api/account/password-reset/complete': { body: { message: 'Your new password is set, and the account is signed out everywhere.' } },
    });
    const { user } = renderApp(`/reset-password#${TOKEN}`);
    expect((await screen.findByText('ann.marsh@example.test')).closest('p')?.textContent).toContain('signs the account out everywhere');
    await user.type(screen.getByLabelText('New password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Set the new password' }));
    errorUnder(screen.getByLabelText('New password'), 'Use at least 10 characters');
    await user.clear(screen.getByLabelText('New password'));
    await user.type(screen.getByLabelText('New password'), 'a brand new password');
    await user.click(screen.getByRole('button', { name: 'Set the new password' }));
    expect(await screen.findByText('Your new password is set.')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Sign in' }).getAttribute('href')).toBe('/sign-in');
    expect(api.writes().map((w) => w.body)).toEqual([{ token: TOKEN }, { token: TOKEN, password: 'a brand new password' }]);
  });

  it('says a used link cannot be used and offers a new one', async () => {
    stubApi({ 'GET /api/session': signedOutSession, 'POST /api/account/password-reset/preview': apiError(410, 'reset_used', 'This password link has been used already.') });
    renderApp(`/reset-password#${TOKEN}`);
    expect((await screen.findByRole('alert')).textContent).toContain('This link cannot be used.');
    expect(screen.getByRole('link', { name: 'Ask for a new link' }).getAttribute('href')).toBe('/forgot-password');
  });
});

describe('account page', () => {
  it('turns notice mail on, and changes the password, the wrong present one said under its field', async () => {
    let noticeMail = false;
    const api = stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/account/settings': () => ({ body: { settings: { noticeMail } } }),
      'PUT /api/account/settings': (call) => {
        noticeMail = (call.body as { noticeMail: boolean }).noticeMail;
        return { body: { settings: { noticeMail } } };
      },
      'POST /api/account/password': (call) =>
        (call.body as { currentPassword: string }).currentPassword === 'the right one'
          ? { body: { message: 'Your password is changed and every other session of your account has ended.' } }
          : apiError(400, 'wrong_password', 'That is not your present password', { field: 'currentPassword' }),
    });
    const { user } = renderApp('/account');
    const box = (await screen.findByLabelText(/E-mail me when a hull of mine/)) as HTMLInputElement;
    expect(box.checked).toBe(false);
    await user.click(box);
    expect(await screen.findByText('Saved.')).toBeTruthy();
    expect(box.checked).toBe(true);

    await user.type(screen.getByLabelText('Present password'), 'a wrong one');
    await user.type(screen.getByLabelText('New password'), 'a brand new password');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    await screen.findByText('That is not your present password');
    errorUnder(screen.getByLabelText('Present password'), 'That is not your present password');

    await user.clear(screen.getByLabelText('Present password'));
    await user.type(screen.getByLabelText('Present password'), 'the right one');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    expect(await screen.findByText(/every other session of your account has ended/)).toBeTruthy();
    expect(api.writes().map((w) => [w.method, w.path, w.body])).toEqual([
      ['PUT', '/api/account/settings', { noticeMail: true }],
      ['POST', '/api/account/password', { currentPassword: 'a wrong one', newPassword: 'a brand new password', signOutOthers: true }],
      ['POST', '/api/account/password', { currentPassword: 'the right one', newPassword: 'a brand new password', signOutOthers: true }],
    ]);
  });
});
