import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { demoPlan } from '../../server/seed/demo-plan';
import type { PartsResponse } from '../../shared/api/parts';
import { makeUser, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
let owner: TestAgent;
beforeAll(async () => {
  server = testServer();
  owner = await signedIn(server.app, await makeUser('owner'));
});
afterAll(() => server.close());

async function hullWith(plan: unknown) {
  const hullId = (await owner.post('/api/hulls').send({ name: 'Parts test', units: 'mm' })).body.hull.id as number;
  const saved = await owner.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: null, plan });
  expect(saved.status, JSON.stringify(saved.body)).toBe(201);
  return { hullId, revisionId: saved.body.revision.id as number };
}

describe('parts computed on the server from the stored plan', () => {
  it('computes every part of the demo plan, with areas that agree with the full geometry', async () => {
    const { hullId, revisionId } = await hullWith(demoPlan());
    const res = await owner.get(`/api/hulls/${hullId}/parts`);
    expect(res.status).toBe(200);
    const body = res.body as PartsResponse;
    expect(body.revisionId).toBe(revisionId);
    expect(body.results.map((r) => [r.partId, r.ok])).toEqual([
      ['pt-frame-3', true],
      ['pt-bulkhead-5', true],
      ['pt-transom', true],
    ]);
    const frame = body.results[0];
    expect(frame.stationName).toBe('St 3');
    expect(frame.layers.map((l) => l.thicknessMm)).toEqual([9, 9]);
    expect(frame.layers.every((l) => l.areaMm2 > 0 && l.pieces >= 1)).toBe(true);
    expect(frame.massKg).toBeGreaterThan(0);

    const full = await owner.get(`/api/hulls/${hullId}/parts/pt-frame-3`);
    expect(full.status).toBe(200);
    expect(full.body.result.ok).toBe(true);
    const geometry = full.body.result.part;
    expect(geometry.layers).toHaveLength(2);
    expect(geometry.layers[0].regions[0].outer.length).toBeGreaterThan(20);
    // A ring frame has its inner edge as a hole of the region.
    expect(geometry.layers[0].regions[0].holes.length).toBeGreaterThanOrEqual(1);
    // The summary's bevel range is the range of the full geometry's marks.
    const tilts = geometry.bevelMarks.map((m: { bevelDeg: number }) => m.bevelDeg);
    expect(frame.bevelRangeDeg).toEqual([Math.min(...tilts), Math.max(...tilts)]);
  });

  it('reports a part that cannot be built with its issue, and still builds the others', async () => {
    const plan = demoPlan();
    (plan.parts.parts[1] as { stationId: string }).stationId = 'st-none';
    const { hullId } = await hullWith(plan);
    const body = (await owner.get(`/api/hulls/${hullId}/parts`)).body as PartsResponse;
    const bulkhead = body.results.find((r) => r.partId === 'pt-bulkhead-5')!;
    expect(bulkhead.ok).toBe(false);
    expect(bulkhead.issues[0].message).toMatch(/st-none|station/);
    expect(body.results.find((r) => r.partId === 'pt-frame-3')!.ok).toBe(true);
  });

  it('builds a bulkhead at the widest station under a one-pattern camber cut for that beam', async () => {
    // Regression: the sheer spline bulges ~0.05 mm past the widest station (St 4, 930 mm) between
    // stations, and the bulkhead's other face lies there; the pattern cut for 1860 mm must still serve.
    const plan = demoPlan();
    plan.parts.parts.push({ ...plan.parts.parts[1], id: 'pt-bulkhead-4', name: 'Bulkhead 4', stationId: 'st-4' } as (typeof plan.parts.parts)[number]);
    const { hullId } = await hullWith(plan);
    const body = (await owner.get(`/api/hulls/${hullId}/parts`)).body as PartsResponse;
    const result = body.results.find((r) => r.partId === 'pt-bulkhead-4')!;
    expect(result.issues).toEqual([]);
    expect(result.ok).toBe(true);
  });

  it('answers 404 for a part id the revision does not have', async () => {
    const { hullId } = await hullWith(demoPlan());
    expect((await owner.get(`/api/hulls/${hullId}/parts/no-such-part`)).status).toBe(404);
  });
});
