import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { agentOf, makeUser, signedIn, testServer, TEST_ORIGIN, uniqueEmail, type TestServer } from './support';

let server: TestServer;
beforeAll(() => {
  server = testServer();
});
afterAll(() => server.close());

describe('sign-up', () => {
  it('refuses a bad e-mail with a 400 naming the field', async () => {
    const res = await agentOf(server.app).post('/api/auth/sign-up').send({ email: 'not-an-address', displayName: 'A', password: 'long enough password' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('email');
    expect(res.body.error.message).toMatch(/e-mail/i);
  });

  it('refuses a password under 10 characters with a 400 naming the field', async () => {
    const res = await agentOf(server.app).post('/api/auth/sign-up').send({ email: uniqueEmail(), displayName: 'A', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('password');
  });

  it('creates the account, signs it in, and stores only a bcrypt hash of cost 10 or more', async () => {
    const email = uniqueEmail('new');
    const agent = agentOf(server.app);
    const res = await agent.post('/api/auth/sign-up').send({ email, displayName: 'New Person', password: 'a long new password' });
    expect(res.status).toBe(201);
    expect(res.body.user.email).toBe(email);
    const session = await agent.get('/api/session');
    expect(session.body.user?.email).toBe(email);
    const [rows] = await server.sequelize.query('SELECT password_hash FROM users WHERE email = ?', { replacements: [email] });
    const hash = (rows as { password_hash: string }[])[0].password_hash;
    expect(hash).toMatch(/^\$2[aby]\$(\d\d)\$/);
    expect(Number(hash.slice(4, 6))).toBeGreaterThanOrEqual(10);
    expect(hash).not.toContain('a long new password');
  });

  it('refuses a second account on the same e-mail with 409', async () => {
    const user = await makeUser();
    const res = await agentOf(server.app).post('/api/auth/sign-up').send({ email: user.email.toUpperCase(), displayName: 'Again', password: 'another long one' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
  });
});

describe('sign-in and sessions', () => {
  it('answers 401 for a wrong password, and signs in with the right one', async () => {
    const user = await makeUser();
    const wrong = await agentOf(server.app).post('/api/auth/sign-in').send({ email: user.email, password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.code).toBe('bad_credentials');
    const agent = await signedIn(server.app, user);
    expect((await agent.get('/api/session')).body.user.id).toBe(user.id);
  });

  it('sets an httpOnly SameSite=Lax cookie and a new session id at sign-in', async () => {
    const user = await makeUser();
    const agent = agentOf(server.app);
    const before = await agent.get('/api/session');
    const firstCookie = String(before.headers['set-cookie'] ?? '');
    const res = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const sid = (c: string) => /loftbench\.sid=([^;]+)/.exec(c)?.[1];
    expect(sid(cookie)).toBeTruthy();
    expect(sid(cookie)).not.toBe(sid(firstCookie));
  });

  it('keeps a session across a server restart (sessions live in MariaDB)', async () => {
    const user = await makeUser();
    const res = await agentOf(server.app).post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    const cookie = String(res.headers['set-cookie']).split(';')[0];
    await server.close();
    server = testServer(); // a new app and a new database connection: nothing kept in memory
    const after = await request(server.app).get('/api/session').set('Cookie', cookie);
    expect(after.body.user?.id).toBe(user.id);
  });

  it('signs out and ends the session', async () => {
    const user = await makeUser();
    const agent = await signedIn(server.app, user);
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
    expect((await agent.get('/api/session')).body.user).toBeNull();
    expect((await agent.get('/api/hulls')).status).toBe(401);
  });

  it('refuses the eleventh rapid failed sign-in on one account', async () => {
    const user = await makeUser();
    const statuses: number[] = [];
    for (let i = 0; i < 11; i += 1) {
      const res = await agentOf(server.app).post('/api/auth/sign-in').send({ email: user.email, password: `wrong guess ${i}` });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses[10]).toBe(429);
    // Even the right password is refused while the limit holds.
    const right = await agentOf(server.app).post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    expect(right.status).toBe(429);
    expect(right.body.error.code).toBe('too_many_attempts');
  });
});

describe('cross-site request forgery', () => {
  it('refuses a state-changing request from a foreign Origin', async () => {
    const user = await makeUser();
    const agent = await signedIn(server.app, user);
    const res = await agent.post('/api/hulls').set('Origin', 'https://evil.example').send({ name: 'Forged', units: 'mm' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('foreign_origin');
    expect((await agent.get('/api/hulls')).body.hulls).toHaveLength(0);
  });

  it('refuses a state-changing request with no Origin and no token, and accepts it with the session token', async () => {
    const user = await makeUser();
    const login = await request(server.app).post('/api/auth/sign-in').set('Origin', TEST_ORIGIN).send({ email: user.email, password: user.password });
    const cookie = String(login.headers['set-cookie']).split(';')[0];
    const refused = await request(server.app).post('/api/hulls').set('Cookie', cookie).send({ name: 'No origin', units: 'mm' });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('missing_origin');
    const { csrfToken } = (await request(server.app).get('/api/session').set('Cookie', cookie)).body;
    const ok = await request(server.app).post('/api/hulls').set('Cookie', cookie).set('X-CSRF-Token', csrfToken).send({ name: 'With token', units: 'mm' });
    expect(ok.status).toBe(201);
  });

  it('refuses even the sign-in from a foreign Origin', async () => {
    const user = await makeUser();
    const res = await request(server.app).post('/api/auth/sign-in').set('Origin', 'https://evil.example').send({ email: user.email, password: user.password });
    expect(res.status).toBe(403);
  });

  it('accepts the same-origin request of a page served from this server', async () => {
    const user = await makeUser();
    const res = await request(server.app).post('/api/auth/sign-in').set('Host', 'shop.local:4310').set('Origin', 'http://shop.local:4310').send({ email: user.email, password: user.password });
    expect(res.status).toBe(200);
    expect(TEST_ORIGIN).not.toBe('http://shop.local:4310');
  });

  it('sends helmet security headers', async () => {
    const res = await request(server.app).get('/api/session');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
  });
});
