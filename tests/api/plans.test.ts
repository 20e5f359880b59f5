import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { HullMember } from '../../server/models';
import { demoPlan } from '../../server/seed/demo-plan';
import type { Plan } from '../../shared/geometry/plan-schema';
import { makeUser, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
beforeAll(() => {
  server = testServer();
});
afterAll(() => server.close());

interface Crew {
  hullId: number;
  owner: TestAgent;
  builder: TestAgent;
  designer: TestAgent;
  helper: TestAgent;
  stranger: TestAgent;
}

async function hullWithCrew(): Promise<Crew> {
  const people = { owner: await makeUser('owner'), builder: await makeUser('builder'), designer: await makeUser('designer'), helper: await makeUser('helper'), stranger: await makeUser('stranger') };
  const owner = await signedIn(server.app, people.owner);
  const hullId = (await owner.post('/api/hulls').send({ name: 'Plan test', units: 'mm' })).body.hull.id as number;
  for (const role of ['builder', 'designer', 'helper'] as const) await HullMember.create({ hullId, userId: people[role].id, role });
  return {
    hullId,
    owner,
    builder: await signedIn(server.app, people.builder),
    designer: await signedIn(server.app, people.designer),
    helper: await signedIn(server.app, people.helper),
    stranger: await signedIn(server.app, people.stranger),
  };
}

async function save(agent: TestAgent, hullId: number, baseRevisionId: number | null, plan: Plan, summary?: string) {
  return agent.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId, plan, summary });
}

function withCell(plan: Plan, lineId: string, stationId: string, value: { y: number; z: number }): Plan {
  const copy = structuredClone(plan);
  const line = copy.lines.lines.find((l) => l.id === lineId)!;
  (line.cells as Record<string, unknown>)[stationId] = value;
  return copy;
}

const revisionCount = async (hullId: number) => {
  const [rows] = await server.sequelize.query('SELECT COUNT(*) AS n FROM plan_revisions WHERE hull_id = ?', { replacements: [hullId] });
  return Number((rows as { n: number }[])[0].n);
};

describe('saving revisions', () => {
  it('saves a first revision, serves it with its id as ETag, and answers 304 to that ETag', async () => {
    const { hullId, owner } = await hullWithCrew();
    const empty = await owner.get(`/api/hulls/${hullId}/plan`);
    expect(empty.body.revision).toBeNull();
    const res = await save(owner, hullId, null, demoPlan(), 'First lines');
    expect(res.status).toBe(201);
    const id = res.body.revision.id as number;
    const got = await owner.get(`/api/hulls/${hullId}/plan`);
    expect(got.headers.etag).toBe(`"${id}"`);
    expect(got.body.revision).toMatchObject({ id, summary: 'First lines', baseRevisionId: null });
    expect(got.body.plan).toEqual(demoPlan());
    expect((await owner.get(`/api/hulls/${hullId}/plan`).set('If-None-Match', `"${id}"`)).status).toBe(304);
  });

  it('refuses a save from a stale base with 409 and names the latest revision', async () => {
    const { hullId, owner, builder } = await hullWithCrew();
    const first = (await save(owner, hullId, null, demoPlan())).body.revision.id;
    const second = await save(builder, hullId, first, withCell(demoPlan(), 'ln-chine', 'st-3', { y: 745, z: 160 }));
    expect(second.status).toBe(201);
    const stale = await save(owner, hullId, first, withCell(demoPlan(), 'ln-chine', 'st-4', { y: 772, z: 155 }));
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_revision');
    expect(stale.body.error.latestRevisionId).toBe(second.body.revision.id);
    expect(await revisionCount(hullId)).toBe(2);
  });

  it('lets exactly one of ten parallel saves from one base succeed', async () => {
    const { hullId, owner } = await hullWithCrew();
    const base = (await save(owner, hullId, null, demoPlan())).body.revision.id;
    const results = await Promise.all(
      Array.from({ length: 10 }, (_, i) => save(owner, hullId, base, withCell(demoPlan(), 'ln-sheer', 'st-2', { y: 800 + i + 1, z: 830 }))),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(9);
    const winner = results.find((r) => r.status === 201)!.body.revision.id;
    expect((await owner.get(`/api/hulls/${hullId}/plan`)).body.revision.id).toBe(winner);
    expect(await revisionCount(hullId)).toBe(2);
  });

  it('lets a designer change the lines but not the parts, and a helper neither', async () => {
    const { hullId, owner, designer, helper } = await hullWithCrew();
    const base = (await save(owner, hullId, null, demoPlan())).body.revision.id;
    const lines = await save(designer, hullId, base, withCell(demoPlan(), 'ln-keel', 'st-4', { y: 0, z: 42 }));
    expect(lines.status).toBe(201);
    const partsChanged = withCell(demoPlan(), 'ln-keel', 'st-4', { y: 0, z: 42 });
    partsChanged.parts.parts[0].name = 'Frame three';
    const parts = await save(designer, hullId, lines.body.revision.id, partsChanged);
    expect(parts.status).toBe(403);
    expect(parts.body.error.code).toBe('parts_not_allowed');
    expect((await save(helper, hullId, lines.body.revision.id, demoPlan())).status).toBe(403);
    expect((await helper.put(`/api/hulls/${hullId}/plan/draft`).send({ baseRevisionId: lines.body.revision.id, plan: demoPlan() })).status).toBe(403);
  });

  it('answers 404 to a stranger on every plan route', async () => {
    const { hullId, owner, stranger } = await hullWithCrew();
    const base = (await save(owner, hullId, null, demoPlan())).body.revision.id;
    expect((await stranger.get(`/api/hulls/${hullId}/plan`)).status).toBe(404);
    expect((await stranger.get(`/api/hulls/${hullId}/plan/revisions/${base}`)).status).toBe(404);
    expect((await save(stranger, hullId, base, demoPlan())).status).toBe(404);
  });

  it('refuses an invalid plan with the field path, and writes nothing', async () => {
    const { hullId, owner } = await hullWithCrew();
    const bad = structuredClone(demoPlan()) as unknown as { parts: { parts: { thicknessMm: number }[] } };
    bad.parts.parts[1].thicknessMm = -12;
    const res = await save(owner, hullId, null, bad as unknown as Plan);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('plan.parts.parts.1.thicknessMm');
    expect(await revisionCount(hullId)).toBe(0);
  });

  it('keeps a saved revision immutable: the database refuses an UPDATE', async () => {
    const { hullId, owner } = await hullWithCrew();
    const id = (await save(owner, hullId, null, demoPlan())).body.revision.id;
    await expect(server.sequelize.query("UPDATE plan_revisions SET summary = 'changed' WHERE id = ?", { replacements: [id] })).rejects.toThrow(/immutable/);
  });
});

describe('history', () => {
  it('lists revisions newest first, compares two as changed cells, and restores an older one as a new revision', async () => {
    const { hullId, owner } = await hullWithCrew();
    const r1 = (await save(owner, hullId, null, demoPlan())).body.revision.id;
    const changed = withCell(demoPlan(), 'ln-chine', 'st-3', { y: 750, z: 162 });
    const r2 = (await save(owner, hullId, r1, changed)).body.revision;
    expect(r2.summary).toBe('1 offset changed');
    const listed = (await owner.get(`/api/hulls/${hullId}/plan/revisions`)).body.revisions;
    expect(listed.map((r: { id: number }) => r.id)).toEqual([r2.id, r1]);
    // What the save answered is what the row holds: the list reads it back from the table, not from a cache.
    expect(listed[0]).toEqual(r2);
    expect(r2.authorName).not.toBe('');

    const compare = await owner.get(`/api/hulls/${hullId}/plan/compare?from=${r1}&to=${r2.id}`);
    expect(compare.body.changes).toEqual([
      { area: 'lines', kind: 'cell', path: 'lines.lines.ln-chine.cells.st-3', label: 'Chine at St 3', before: { y: 740, z: 160 }, after: { y: 750, z: 162 } },
    ]);

    const restored = await owner.post(`/api/hulls/${hullId}/plan/revisions/${r1}/restore`).send({ baseRevisionId: r2.id });
    expect(restored.status).toBe(201);
    expect(restored.body.revision.summary).toBe(`Restored revision ${r1}`);
    const latest = await owner.get(`/api/hulls/${hullId}/plan`);
    expect(latest.body.revision.id).toBe(restored.body.revision.id);
    expect(latest.body.plan).toEqual(demoPlan());
    expect(await revisionCount(hullId)).toBe(3);
  });
});

describe('drafts', () => {
  it('autosaves a draft per person that survives a server restart, and clears it when saved', async () => {
    const { hullId, owner, builder } = await hullWithCrew();
    const base = (await save(owner, hullId, null, demoPlan())).body.revision.id;
    const draftPlan = withCell(demoPlan(), 'ln-sheer', 'st-5', { y: 915, z: 772 });
    const put = await builder.put(`/api/hulls/${hullId}/plan/draft`).send({ baseRevisionId: base, plan: draftPlan });
    expect(put.status).toBe(200);
    expect((await owner.get(`/api/hulls/${hullId}/plan/draft`)).body.draft).toBeNull();

    const cookie = (builder as unknown as { jar: { getCookies: (o: object) => { toValueString: () => string }[] } }).jar
      .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false })
      .map((c) => c.toValueString())
      .join('; ');
    await server.close();
    server = testServer();
    const { default: request } = await import('supertest');
    const after = await request(server.app).get(`/api/hulls/${hullId}/plan/draft`).set('Cookie', cookie);
    expect(after.status).toBe(200);
    expect(after.body.draft).toMatchObject({ baseRevisionId: base, plan: draftPlan });

    const saved = await request(server.app).post(`/api/hulls/${hullId}/plan/revisions`).set('Cookie', cookie).set('Origin', 'http://workshop.loftbench.test').send({ baseRevisionId: base, plan: draftPlan });
    expect(saved.status).toBe(201);
    expect((await request(server.app).get(`/api/hulls/${hullId}/plan/draft`).set('Cookie', cookie)).body.draft).toBeNull();
  });
});
