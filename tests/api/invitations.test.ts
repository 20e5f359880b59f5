import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HullMember, Invitation } from '../../server/models';
import { hullCreate } from '../../server/services/hulls';
import { agentOf, makeUser, signedIn, testServer, uniqueEmail, type TestServer } from './support';
import { linkIn, mailTo, onlyMailTo } from './mailbox';

let server: TestServer;
let owner: Awaited<ReturnType<typeof makeUser>>;
let ownerAgent: Awaited<ReturnType<typeof signedIn>>;

beforeAll(async () => {
  server = testServer();
  owner = await makeUser('owner');
  ownerAgent = await signedIn(server.app, owner);
});
afterAll(() => server.close());

async function newHull(name = 'Saltgrass punt dinghy') {
  return hullCreate(owner.id, { name, units: 'mm', notes: '' });
}

/** Invite `email` to a new hull through the API and return the hull, the answer and the token from the mail. */
async function invite(email: string, role: 'builder' | 'helper' | 'designer' | 'owner' = 'helper') {
  const hull = await newHull();
  const res = await ownerAgent.post(`/api/hulls/${hull.id}/invitations`).send({ email, role });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const mail = await onlyMailTo(email.toLowerCase());
  return { hull, res, mail, ...linkIn(mail, '/invitation') };
}

const sessionOf = async (agent: ReturnType<typeof agentOf>) => (await agent.get('/api/session')).body.user;

describe('inviting by e-mail', () => {
  it('mails a link with a single-use token; only the hash of the token is stored, expiring in 7 days', async () => {
    const email = uniqueEmail('newcomer');
    const { hull, res, mail, url, token } = await invite(email, 'builder');

    expect(res.body.invitation).toMatchObject({ email, role: 'builder', invitedByName: owner.displayName });
    expect(mail.subject).toBe(`${owner.displayName} invites you to the crew of Saltgrass punt dinghy`);
    expect(mail.text).toContain('as a builder');
    expect(url.pathname).toBe('/invitation');
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

    const row = (await Invitation.findOne({ where: { hullId: hull.id } }))!;
    expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    const [raw] = await server.sequelize.query<Record<string, unknown>>('SELECT * FROM invitations WHERE id = ?', { replacements: [row.id], type: QueryTypes.SELECT });
    expect(JSON.stringify(raw)).not.toContain(token);
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeGreaterThanOrEqual(7 * 24 * 3600 * 1000 - 1000);
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeLessThanOrEqual(7 * 24 * 3600 * 1000 + 1000);

    const pending = await ownerAgent.get(`/api/hulls/${hull.id}/invitations`);
    expect(pending.body.invitations).toMatchObject([{ email, role: 'builder' }]);
  });

  it('says what the link is for, then signs a newcomer up on the invited address and adds them to the crew, once', async () => {
    const email = uniqueEmail('newcomer');
    const { hull, token } = await invite(email, 'helper');
    const visitor = agentOf(server.app);

    const preview = await visitor.post('/api/invitations/preview').send({ token });
    expect(preview.status).toBe(200);
    expect(preview.body.invitation).toMatchObject({ hullName: 'Saltgrass punt dinghy', role: 'helper', email, invitedByName: owner.displayName });

    const accepted = await visitor.post('/api/invitations/accept').send({ token, newAccount: { displayName: 'Noor Wend', password: 'a long enough password' } });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(201);
    expect(accepted.body).toEqual({ hullId: hull.id, role: 'helper', alreadyMember: false });
    expect(await sessionOf(visitor)).toMatchObject({ email, displayName: 'Noor Wend' });
    const hulls = await visitor.get('/api/hulls');
    expect(hulls.body.hulls).toMatchObject([{ id: hull.id, role: 'helper' }]);

    // The same link a second time, from anywhere, does nothing.
    const again = await agentOf(server.app).post('/api/invitations/accept').send({ token, newAccount: { displayName: 'Someone else', password: 'another long password' } });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
    expect((await agentOf(server.app).post('/api/invitations/preview').send({ token })).body.error.code).toBe('invitation_used');
    expect(await HullMember.count({ where: { hullId: hull.id } })).toBe(2);
    expect((await ownerAgent.get(`/api/hulls/${hull.id}/invitations`)).body.invitations).toEqual([]);
  });

  it('lets a signed-in person accept with their own account', async () => {
    const existing = await makeUser('existing');
    const { hull, token } = await invite(existing.email, 'designer');
    const agent = await signedIn(server.app, existing);
    const res = await agent.post('/api/invitations/accept').send({ token });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ hullId: hull.id, role: 'designer', alreadyMember: false });
    expect((await HullMember.findOne({ where: { hullId: hull.id, userId: existing.id } }))?.role).toBe('designer');
  });

  it('does not work after it expires', async () => {
    const email = uniqueEmail('late');
    const { hull, token } = await invite(email);
    await server.sequelize.query('UPDATE invitations SET expires_at = NOW(3) - INTERVAL 1 SECOND WHERE hull_id = ?', { replacements: [hull.id] });

    const preview = await agentOf(server.app).post('/api/invitations/preview').send({ token });
    expect(preview.status).toBe(410);
    expect(preview.body.error.code).toBe('invitation_expired');
    const visitor = agentOf(server.app);
    const res = await visitor.post('/api/invitations/accept').send({ token, newAccount: { displayName: 'Too Late', password: 'a long enough password' } });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('invitation_expired');
    expect(await sessionOf(visitor)).toBeNull();
    expect(await HullMember.count({ where: { hullId: hull.id } })).toBe(1);
    expect((await server.sequelize.query('SELECT id FROM users WHERE email = ?', { replacements: [email], type: QueryTypes.SELECT })).length).toBe(0);
  });

  it('can be taken back by the owner; the link then stops working', async () => {
    const email = uniqueEmail('revoked');
    const { hull, res, token } = await invite(email);
    const revoke = await ownerAgent.delete(`/api/hulls/${hull.id}/invitations/${res.body.invitation.id}`);
    expect(revoke.status).toBe(204);
    expect((await ownerAgent.get(`/api/hulls/${hull.id}/invitations`)).body.invitations).toEqual([]);
    const accept = await agentOf(server.app).post('/api/invitations/accept').send({ token, newAccount: { displayName: 'Revoked', password: 'a long enough password' } });
    expect(accept.status).toBe(410);
    expect(accept.body.error.code).toBe('invitation_revoked');
    // Revoking twice, or another hull's invitation, is 404.
    expect((await ownerAgent.delete(`/api/hulls/${hull.id}/invitations/${res.body.invitation.id}`)).status).toBe(404);
  });

  it('replaces a pending invitation when the same address is invited again: only the newest link works', async () => {
    const email = uniqueEmail('twice');
    const hull = await newHull();
    await ownerAgent.post(`/api/hulls/${hull.id}/invitations`).send({ email, role: 'helper' }).expect(201);
    await ownerAgent.post(`/api/hulls/${hull.id}/invitations`).send({ email, role: 'builder' }).expect(201);
    const mails = await mailTo(email);
    expect(mails).toHaveLength(2);
    const [newest, oldest] = mails.map((m) => linkIn(m.parsed, '/invitation').token);
    expect((await agentOf(server.app).post('/api/invitations/preview').send({ token: oldest })).body.error.code).toBe('invitation_revoked');
    expect((await agentOf(server.app).post('/api/invitations/preview').send({ token: newest })).body.invitation.role).toBe('builder');
    expect((await ownerAgent.get(`/api/hulls/${hull.id}/invitations`)).body.invitations).toHaveLength(1);
  });

  it('refuses a bad address or someone already on the crew, sending nothing and storing nothing', async () => {
    const hull = await newHull();
    const bad = await ownerAgent.post(`/api/hulls/${hull.id}/invitations`).send({ email: 'not an address', role: 'helper' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('email');
    const badRole = await ownerAgent.post(`/api/hulls/${hull.id}/invitations`).send({ email: uniqueEmail(), role: 'skipper' });
    expect(badRole.body.error.field).toBe('role');
    const member = await ownerAgent.post(`/api/hulls/${hull.id}/invitations`).send({ email: owner.email, role: 'helper' });
    expect(member.status).toBe(409);
    expect(member.body.error).toMatchObject({ code: 'already_member', field: 'email' });
    expect(await Invitation.count({ where: { hullId: hull.id } })).toBe(0);
    expect(await mailTo(owner.email)).toEqual([]);
  });

  it('asks a signed-out visitor to sign in or make an account, and leaves the link usable when the address has an account', async () => {
    const existing = await makeUser('has-account');
    const { hull, token } = await invite(existing.email);
    const noAccount = await agentOf(server.app).post('/api/invitations/accept').send({ token });
    expect(noAccount.status).toBe(401);
    const taken = await agentOf(server.app).post('/api/invitations/accept').send({ token, newAccount: { displayName: 'Twin', password: 'a long enough password' } });
    expect(taken.status).toBe(409);
    expect(taken.body.error).toMatchObject({ code: 'email_taken', field: 'email' });
    const agent = await signedIn(server.app, existing);
    expect((await agent.post('/api/invitations/accept').send({ token })).status).toBe(200);
    expect(await HullMember.count({ where: { hullId: hull.id } })).toBe(2);
  });

  it('refuses a token that is not one, saying where', async () => {
    const res = await agentOf(server.app).post('/api/invitations/preview').send({ token: 'abc' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('token');
    const unknown = await agentOf(server.app).post('/api/invitations/preview').send({ token: 'A'.repeat(43) });
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('invitation_not_found');
  });
});
