import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeUser, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
beforeAll(() => {
  server = testServer();
});
afterAll(() => server.close());

async function ownerWithHull() {
  const owner = await makeUser('owner');
  const agent = await signedIn(server.app, owner);
  const res = await agent.post('/api/hulls').send({ name: 'Crew test hull', units: 'ftin', notes: 'n' });
  expect(res.status).toBe(201);
  return { owner, agent, hullId: res.body.hull.id as number };
}

describe('hulls', () => {
  it('lists only my hulls, with my role', async () => {
    const { agent, hullId } = await ownerWithHull();
    const other = await ownerWithHull();
    const list = (await agent.get('/api/hulls')).body.hulls as { id: number; role: string; units: string }[];
    expect(list.map((h) => h.id)).toEqual([hullId]);
    expect(list[0]).toMatchObject({ role: 'owner', units: 'ftin' });
    expect(list.map((h) => h.id)).not.toContain(other.hullId);
  });

  it('refuses a hull without a name with a 400 naming the field', async () => {
    const { agent } = await ownerWithHull();
    const res = await agent.post('/api/hulls').send({ name: '   ', units: 'mm' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('name');
  });
});

describe('crew', () => {
  it('lets the owner add an existing account by e-mail, change its role and remove it', async () => {
    const { agent, hullId } = await ownerWithHull();
    const helper = await makeUser('helper');
    const added = await agent.post(`/api/hulls/${hullId}/crew`).send({ email: helper.email.toUpperCase(), role: 'helper' });
    expect(added.status).toBe(201);
    expect(added.body.member).toMatchObject({ userId: helper.id, role: 'helper' });

    const helperAgent = await signedIn(server.app, helper);
    expect((await helperAgent.get(`/api/hulls/${hullId}`)).body.hull.role).toBe('helper');

    const changed = await agent.patch(`/api/hulls/${hullId}/crew/${helper.id}`).send({ role: 'designer' });
    expect(changed.body.member.role).toBe('designer');
    const crew = (await agent.get(`/api/hulls/${hullId}/crew`)).body.crew as { userId: number; role: string }[];
    expect(crew.map((m) => m.role)).toEqual(['owner', 'designer']);

    expect((await agent.delete(`/api/hulls/${hullId}/crew/${helper.id}`)).status).toBe(204);
    expect((await helperAgent.get(`/api/hulls/${hullId}`)).status).toBe(404);
  });

  it('names the e-mail field when nobody has that address, and refuses a second membership', async () => {
    const { agent, hullId } = await ownerWithHull();
    const nobody = await agent.post(`/api/hulls/${hullId}/crew`).send({ email: 'nobody-here@example.test', role: 'builder' });
    expect(nobody.status).toBe(404);
    expect(nobody.body.error).toMatchObject({ code: 'no_such_account', field: 'email' });
    const builder = await makeUser('builder');
    await agent.post(`/api/hulls/${hullId}/crew`).send({ email: builder.email, role: 'builder' });
    const again = await agent.post(`/api/hulls/${hullId}/crew`).send({ email: builder.email, role: 'helper' });
    expect(again.status).toBe(409);
  });

  it('never leaves a hull without an owner', async () => {
    const { owner, agent, hullId } = await ownerWithHull();
    const demote = await agent.patch(`/api/hulls/${hullId}/crew/${owner.id}`).send({ role: 'builder' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_owner');
    expect((await agent.delete(`/api/hulls/${hullId}/crew/${owner.id}`)).status).toBe(409);
    // With a second owner, the first may step down.
    const second = await makeUser('second');
    await agent.post(`/api/hulls/${hullId}/crew`).send({ email: second.email, role: 'owner' });
    expect((await agent.patch(`/api/hulls/${hullId}/crew/${owner.id}`).send({ role: 'builder' })).status).toBe(200);
  });

  it('answers 404, not 403, to a stranger and to a hull id that is not a number', async () => {
    const { hullId } = await ownerWithHull();
    const stranger = await signedIn(server.app, await makeUser('stranger'));
    const res = await stranger.get(`/api/hulls/${hullId}/crew`);
    expect(res.status).toBe(404);
    expect((await stranger.get('/api/hulls/not-a-number')).status).toBe(404);
    expect((await stranger.get(`/api/hulls/${hullId + 100000}`)).status).toBe(404);
  });

  it('answers unknown API routes with the JSON error shape', async () => {
    const { agent } = await ownerWithHull();
    const res = await agent.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
