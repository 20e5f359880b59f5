import { within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { apiError, stubApi } from './api-stub';
import { ann, hull, sessionOf, signedOutSession } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { errorUnder, renderApp, screen } from './render-app';

const TOKEN = 'Ab3dEf6hIj9lMn2pQr5tUv8xYz1bCd4fGh7jKl0nOp_';
const preview = { hullName: 'Tidewrack', role: 'helper', email: 'noor.wend@example.test', invitedByName: 'Ann Marsh', expiresAt: '2025-05-11T09:00:00.000Z' };

afterEach(() => sessionStorage.clear());

describe('inviting by e-mail (hull owner)', () => {
  function ownerServer(more = {}) {
    return stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role: 'owner' }) } },
      ...planHandlers(3),
      ...more,
    });
  }

  it('checks the address with the shared schema, sends, and lists the invitation with a way to take it back', async () => {
    let pending: unknown[] = [];
    const api = ownerServer({
      'GET /api/hulls/3/invitations': () => ({ body: { invitations: pending } }),
      'POST /api/hulls/3/invitations': (call: { body: unknown }) => {
        const { email, role } = call.body as { email: string; role: string };
        const invitation = { id: 4, email, role, invitedByName: 'Ann Marsh', createdAt: '2025-05-04T09:00:00.000Z', expiresAt: '2025-05-11T09:00:00.000Z' };
        pending = [invitation];
        return { status: 201, body: { invitation } };
      },
      'DELETE /api/hulls/3/invitations/4': () => {
        pending = [];
        return { status: 204 };
      },
    });
    const { user } = renderApp('/hulls/3/invitations');
    await user.type(await screen.findByLabelText('Their e-mail'), 'noor at the yard');
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    errorUnder(screen.getByLabelText('Their e-mail'), 'Enter a valid e-mail address');
    expect(api.writes()).toEqual([]);

    await user.clear(screen.getByLabelText('Their e-mail'));
    await user.type(screen.getByLabelText('Their e-mail'), 'noor.wend@example.test');
    await user.selectOptions(screen.getByLabelText('Role on this hull'), 'Builder');
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('Invitation sent to noor.wend@example.test, as Builder.')).toBeTruthy();
    const waiting = screen.getByRole('heading', { name: 'Waiting for an answer' }).closest('section')!;
    expect((await within(waiting).findByText('noor.wend@example.test')).closest('li')?.textContent).toContain('as Builder');

    await user.click(within(waiting).getByRole('button', { name: 'Take back the invitation to noor.wend@example.test' }));
    expect(await within(waiting).findByText('No invitation is waiting.')).toBeTruthy();
    expect(api.writes().map((w) => `${w.method} ${w.path}`)).toEqual(['POST /api/hulls/3/invitations', 'DELETE /api/hulls/3/invitations/4']);
    expect(api.writes()[0]!.body).toEqual({ email: 'noor.wend@example.test', role: 'builder' });
  });

  it('says under the address when the person is on the crew already', async () => {
    ownerServer({
      'GET /api/hulls/3/invitations': { body: { invitations: [] } },
      'POST /api/hulls/3/invitations': apiError(409, 'already_member', 'Tomas is on this crew already', { field: 'email' }),
    });
    const { user } = renderApp('/hulls/3/invitations');
    await user.type(await screen.findByLabelText('Their e-mail'), 'tomas.reed@example.test');
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    await screen.findByText('This person is on the crew already.');
    errorUnder(screen.getByLabelText('Their e-mail'), 'This person is on the crew already.');
  });

  it('tells someone who is not an owner that only owners invite, and asks the server nothing', async () => {
    const api = stubApi({ 'GET /api/session': sessionOf(ann), 'GET /api/hulls/3': { body: { hull: hull({ id: 3, role: 'helper' }) } }, ...planHandlers(3) });
    renderApp('/hulls/3/invitations');
    expect(await screen.findByText(/Only an owner of this hull invites people/)).toBeTruthy();
    expect(api.count('GET', '/api/hulls/3/invitations')).toBe(0);
  });
});

describe('the invitation link', () => {
  it('shows what it is, then makes an account on the invited address and opens the hull', async () => {
    let signedIn = false;
    const api = stubApi({
      'GET /api/session': () => (signedIn ? sessionOf(ann) : signedOutSession),
      'POST /api/invitations/preview': { body: { invitation: preview } },
      'POST /api/invitations/accept': () => {
        signedIn = true;
        return { status: 201, body: { hullId: 3, role: 'helper', alreadyMember: false } };
      },
      'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role: 'helper' }) } },
      'GET /api/hulls/3/crew': { body: { crew: [] } },
      ...planHandlers(3),
    });
    const { user, here } = renderApp(`/invitation#${TOKEN}`);
    expect((await screen.findByText(/invites/)).closest('p')?.textContent).toContain('Ann Marsh invites noor.wend@example.test onto the crew of Tidewrack as Helper');
    await user.type(screen.getByLabelText('Your name'), 'Noor Wend');
    await user.type(screen.getByLabelText('Choose a password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Make my account and join the crew' }));
    errorUnder(screen.getByLabelText('Choose a password'), 'Use at least 10 characters');
    expect(api.writes().filter((w) => w.path === '/api/invitations/accept')).toEqual([]);

    await user.clear(screen.getByLabelText('Choose a password'));
    await user.type(screen.getByLabelText('Choose a password'), 'a long enough password');
    await user.click(screen.getByRole('button', { name: 'Make my account and join the crew' }));
    expect(await screen.findByRole('heading', { name: 'Tidewrack', level: 1 })).toBeTruthy();
    expect(here()).toBe('/hulls/3');
    const accept = api.writes().find((w) => w.path === '/api/invitations/accept');
    expect(accept?.body).toEqual({ token: TOKEN, newAccount: { displayName: 'Noor Wend', password: 'a long enough password' } });
    // The token went in request bodies only, never in a URL.
    expect(api.calls.some((c) => c.search.includes(TOKEN))).toBe(false);
    expect(sessionStorage.getItem('loftbench.invitation')).toBeNull();
  });

  it('lets a signed-in person accept with their account', async () => {
    const api = stubApi({
      'GET /api/session': sessionOf(ann),
      'POST /api/invitations/preview': { body: { invitation: preview } },
      'POST /api/invitations/accept': { body: { hullId: 3, role: 'helper', alreadyMember: false } },
      'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role: 'helper' }) } },
      'GET /api/hulls/3/crew': { body: { crew: [] } },
      ...planHandlers(3),
    });
    const { user } = renderApp(`/invitation#${TOKEN}`);
    expect(await screen.findByText(/You are signed in as/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Accept and join the crew' }));
    await screen.findByRole('heading', { name: 'Tidewrack', level: 1 });
    expect(api.writes().find((w) => w.path === '/api/invitations/accept')?.body).toEqual({ token: TOKEN });
  });

  it('says plainly that a used or expired link cannot be used', async () => {
    stubApi({ 'GET /api/session': signedOutSession, 'POST /api/invitations/preview': apiError(410, 'invitation_expired', 'This invitation has expired. Ask the hull’s owner to invite you again.') });
    renderApp(`/invitation#${TOKEN}`);
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('This invitation cannot be used.');
    expect(alert.textContent).toContain('has expired');
    expect(screen.queryByLabelText('Your name')).toBeNull();
  });
});
