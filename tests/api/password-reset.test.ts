import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mailerOf } from '../../server/mail/mailer';
import { PasswordReset, Session } from '../../server/models';
import { agentOf, makeUser, signedIn, testServer, uniqueEmail, type TestServer } from './support';
import { linkIn, mailTo, onlyMailTo } from './mailbox';

let server: TestServer;
beforeAll(() => {
  server = testServer();
});
afterAll(() => server.close());

const NEW_PASSWORD = 'a brand new password';

/** Ask for a link for this address and return the token from the mail that arrives. */
async function askForLink(email: string) {
  const res = await agentOf(server.app).post('/api/account/password-reset').send({ email });
  expect(res.status).toBe(202);
  await mailerOf(server.app).settled();
  return linkIn(await onlyMailTo(email), '/reset-password').token;
}

async function signInStatus(email: string, password: string) {
  return (await agentOf(server.app).post('/api/auth/sign-in').send({ email, password })).status;
}

describe('password reset by e-mail', () => {
  it('answers the same for an address with and without an account, and mails only the one with', async () => {
    const person = await makeUser('forgetful');
    const nobody = uniqueEmail('nobody');
    const withAccount = await agentOf(server.app).post('/api/account/password-reset').send({ email: person.email.toUpperCase() });
    const without = await agentOf(server.app).post('/api/account/password-reset').send({ email: nobody });
    expect(withAccount.status).toBe(202);
    expect(without.status).toBe(202);
    expect(without.body).toEqual(withAccount.body);
    await mailerOf(server.app).settled();

    const mail = await onlyMailTo(person.email);
    expect(mail.subject).toBe('Choose a new Loftbench password');
    expect(linkIn(mail, '/reset-password').url.pathname).toBe('/reset-password');
    expect(await mailTo(nobody)).toEqual([]);
    const row = (await PasswordReset.findOne({ where: { userId: person.id } }))!;
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeGreaterThanOrEqual(3600 * 1000 - 1000);
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeLessThanOrEqual(3600 * 1000 + 1000);
  });

  it('sets the new password once, and ends every session of the account', async () => {
    const person = await makeUser('reset');
    const laptop = await signedIn(server.app, person);
    const tablet = await signedIn(server.app, person);
    const bystander = await makeUser('bystander');
    const other = await signedIn(server.app, bystander);
    expect(await Session.count({ where: { userId: person.id } })).toBe(2);
    const token = await askForLink(person.email);

    const preview = await agentOf(server.app).post('/api/account/password-reset/preview').send({ token });
    expect(preview.body).toEqual({ email: person.email });
    const done = await agentOf(server.app).post('/api/account/password-reset/complete').send({ token, password: NEW_PASSWORD });
    expect(done.status).toBe(200);

    expect(await Session.count({ where: { userId: person.id } })).toBe(0);
    for (const agent of [laptop, tablet]) {
      expect((await agent.get('/api/session')).body.user).toBeNull();
      expect((await agent.get('/api/hulls')).status).toBe(401);
    }
    expect((await other.get('/api/session')).body.user).toMatchObject({ id: bystander.id });
    expect(await signInStatus(person.email, person.password)).toBe(401);
    expect(await signInStatus(person.email, NEW_PASSWORD)).toBe(200);

    const again = await agentOf(server.app).post('/api/account/password-reset/complete').send({ token, password: 'yet another password' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('reset_used');
    expect(await signInStatus(person.email, NEW_PASSWORD)).toBe(200);
  });

  it('ends the session of the browser that completes the reset too, when it is the same account', async () => {
    const person = await makeUser('self-reset');
    const agent = await signedIn(server.app, person);
    const token = await askForLink(person.email);
    expect((await agent.post('/api/account/password-reset/complete').send({ token, password: NEW_PASSWORD })).status).toBe(200);
    expect((await agent.get('/api/session')).body.user).toBeNull();
    expect(await Session.count({ where: { userId: person.id } })).toBe(0);
  });

  it('does not work after it expires, and changes nothing', async () => {
    const person = await makeUser('late-reset');
    const agent = await signedIn(server.app, person);
    const token = await askForLink(person.email);
    await server.sequelize.query('UPDATE password_resets SET expires_at = NOW(3) - INTERVAL 1 SECOND WHERE user_id = ?', { replacements: [person.id] });
    const res = await agentOf(server.app).post('/api/account/password-reset/complete').send({ token, password: NEW_PASSWORD });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('reset_expired');
    expect(await signInStatus(person.email, person.password)).toBe(200);
    expect((await agent.get('/api/session')).body.user).toMatchObject({ id: person.id });
  });

  it('stops every other link of the account once one is used', async () => {
    const person = await makeUser('two-links');
    await agentOf(server.app).post('/api/account/password-reset').send({ email: person.email }).expect(202);
    await agentOf(server.app).post('/api/account/password-reset').send({ email: person.email }).expect(202);
    await mailerOf(server.app).settled();
    const [second, first] = (await mailTo(person.email)).map((m) => linkIn(m.parsed, '/reset-password').token);
    expect((await agentOf(server.app).post('/api/account/password-reset/complete').send({ token: first, password: NEW_PASSWORD })).status).toBe(200);
    const later = await agentOf(server.app).post('/api/account/password-reset/complete').send({ token: second, password: 'yet another password' });
    expect(later.body.error.code).toBe('reset_used');
  });

  it('refuses a short password under its field and keeps the link usable', async () => {
    const person = await makeUser('short');
    const token = await askForLink(person.email);
    const res = await agentOf(server.app).post('/api/account/password-reset/complete').send({ token, password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('password');
    const [row] = await server.sequelize.query<{ used_at: Date | null }>('SELECT used_at FROM password_resets WHERE user_id = ?', { replacements: [person.id], type: QueryTypes.SELECT });
    expect(row!.used_at).toBeNull();
    expect(await signInStatus(person.email, person.password)).toBe(200);
  });

  it('limits how often one address asks for a link', async () => {
    const email = uniqueEmail('flood');
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await agentOf(server.app).post('/api/account/password-reset').send({ email })).status);
    expect(statuses).toEqual([202, 202, 202, 202, 202, 429]);
  });
});

describe('account: password change and settings', () => {
  it('checks the present password, then ends the other sessions but keeps this one', async () => {
    const person = await makeUser('changer');
    const here = await signedIn(server.app, person);
    const elsewhere = await signedIn(server.app, person);
    const wrong = await here.post('/api/account/password').send({ currentPassword: 'not it', newPassword: NEW_PASSWORD });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error).toMatchObject({ code: 'wrong_password', field: 'currentPassword' });
    expect(await signInStatus(person.email, person.password)).toBe(200);

    const ok = await here.post('/api/account/password').send({ currentPassword: person.password, newPassword: NEW_PASSWORD });
    expect(ok.status).toBe(200);
    expect((await here.get('/api/session')).body.user).toMatchObject({ id: person.id });
    expect((await elsewhere.get('/api/session')).body.user).toBeNull();
    expect(await signInStatus(person.email, NEW_PASSWORD)).toBe(200);
  });

  it('keeps the other sessions when asked to', async () => {
    const person = await makeUser('keeper');
    const here = await signedIn(server.app, person);
    const elsewhere = await signedIn(server.app, person);
    await here.post('/api/account/password').send({ currentPassword: person.password, newPassword: NEW_PASSWORD, signOutOthers: false }).expect(200);
    expect((await elsewhere.get('/api/session')).body.user).toMatchObject({ id: person.id });
  });

  it('keeps the notice-mail setting per person, off by default', async () => {
    const person = await makeUser('settings');
    const agent = await signedIn(server.app, person);
    expect((await agent.get('/api/account/settings')).body.settings).toEqual({ noticeMail: false });
    expect((await agent.put('/api/account/settings').send({ noticeMail: true })).body.settings).toEqual({ noticeMail: true });
    expect((await agent.get('/api/account/settings')).body.settings).toEqual({ noticeMail: true });
    const bad = await agent.put('/api/account/settings').send({ noticeMail: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('noticeMail');
  });
});
