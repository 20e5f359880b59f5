import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PartMovement } from '../../shared/api/library';
import type { Plan } from '../../shared/geometry/plan-schema';
import type { Camber } from '../../shared/geometry/camber-schema';
import { mailerOf } from '../../server/mail/mailer';
import { HullMember, LibraryItem } from '../../server/models';
import { hullCreate } from '../../server/services/hulls';
import { revisionSave } from '../../server/services/plans';
import { demoPlan } from '../../server/seed/demo-plan';
import { movementOf } from '../../server/services/library-movement';
import { framesOfPlan } from '../../shared/geometry/frame';
import { makeUser, signedIn, testServer, type TestServer } from './support';
import { mailTo } from './mailbox';

let server: TestServer;
type Person = Awaited<ReturnType<typeof makeUser>>;
type Agent = Awaited<ReturnType<typeof signedIn>>;
let designer: Person, builder: Person, helper: Person, stranger: Person;
let asDesigner: Agent, asBuilder: Agent, asHelper: Agent, asStranger: Agent;

beforeAll(async () => {
  server = testServer();
  [designer, builder, helper, stranger] = await Promise.all(['designer', 'builder', 'helper', 'stranger'].map((w) => makeUser(w)));
  [asDesigner, asBuilder, asHelper, asStranger] = await Promise.all([designer, builder, helper, stranger].map((p) => signedIn(server.app, p)));
});
afterAll(() => server.close());

/** The demo skiff's deck camber: a parabola rising 60 mm over a 1860 mm beam, one pattern for every station. */
const camberOf = (riseMm: number, shape: Camber['shape'] = 'parabola'): Camber => ({ shape, points: [], crown: { kind: 'rise', riseMm, referenceBeamMm: 1860 }, convention: 'one-pattern' });

/** A hull owned by the builder, with the helper on its crew, at the demo plan (its first revision). */
async function builderHull() {
  const hull = await hullCreate(builder.id, { name: 'Saltmarsh skiff, hull 7', units: 'mm', notes: '' });
  await HullMember.create({ hullId: hull.id, userId: helper.id, role: 'helper' });
  const { revision } = await revisionSave({ hullId: hull.id, units: 'mm', authorId: builder.id, role: 'owner', baseRevisionId: null, plan: demoPlan() });
  return { hullId: hull.id, revisionId: revision.id };
}

async function publishCamber(riseMm: number, sharing: { visibility: 'private' | 'shared' | 'public'; shareWith?: string[] } = { visibility: 'public' }) {
  const res = await asDesigner.post('/api/library').send({
    kind: 'camber',
    sharing,
    revision: { name: 'Skiff deck camber', notes: 'Parabolic, for the 4.9 m skiff.', rules: 'Rise measured at the widest beam, 1860 mm.', document: camberOf(riseMm) },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.item as { id: number; latest: { id: number; number: number } };
}

async function latestPlan(agent: Agent, hullId: number): Promise<{ revision: { id: number; summary: string }; plan: Plan }> {
  return (await agent.get(`/api/hulls/${hullId}/plan`)).body;
}

const byPart = (movement: PartMovement[]) => Object.fromEntries(movement.map((m) => [m.partName, m]));

/**
 * Expected movement of the deck line when a one-pattern parabolic camber's rise changes from r0 to r1 over
 * the reference half-beam B: the deck top at half-breadth y is sheer z + r(1 - (y/B)^2) - r(1 - (b/B)^2),
 * b the station's half-beam, so the change is (r1 - r0)((b/B)^2 - (y/B)^2), largest on the centreline:
 * (r1 - r0)(b/B)^2. (Analytic, from the definition of the parabola in camber.ts; b is the sheer
 * half-breadth in the demo table.)
 */
const deckRise = (r0: number, r1: number, halfBeam: number) => (r1 - r0) * (halfBeam / 930) ** 2;

describe('publishing to the Library', () => {
  it('makes an immutable first revision with name, notes, rules and the curve', async () => {
    const item = await publishCamber(60);
    const detail = await asDesigner.get(`/api/library/${item.id}`);
    expect(detail.body.item).toMatchObject({ kind: 'camber', visibility: 'public', mine: true, revisionCount: 1, latest: { number: 1, name: 'Skiff deck camber', rules: 'Rise measured at the widest beam, 1860 mm.' } });
    expect(detail.body.item.latestDocument).toEqual(camberOf(60));
    // The database refuses to change a published revision.
    await expect(server.sequelize.query('UPDATE library_revisions SET name = ? WHERE id = ?', { replacements: ['changed', item.latest.id] })).rejects.toThrow(/immutable/);
  });

  it('refuses an unusable curve, saying where, and writes nothing', async () => {
    const before = await LibraryItem.count();
    const res = await asDesigner.post('/api/library').send({
      kind: 'camber',
      sharing: { visibility: 'private' },
      revision: { name: 'Own curve', document: { shape: 'custom', points: [{ t: 0, h: 0.9 }, { t: 1, h: 0 }], crown: { kind: 'rise', riseMm: 50, referenceBeamMm: 1800 }, convention: 'one-pattern' } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('revision.document.points[0]');
    expect(res.body.error.message).toContain('h = 0.9');
    const wrongType = await asDesigner.post('/api/library').send({ kind: 'camber', sharing: { visibility: 'private' }, revision: { name: 'x', document: { ...camberOf(60), crown: { kind: 'rise', riseMm: -3, referenceBeamMm: 1860 } } } });
    expect(wrongType.status).toBe(400);
    expect(wrongType.body.error.field).toBe('revision.document.crown.riseMm');
    const noOne = await asDesigner.post('/api/library').send({ kind: 'camber', sharing: { visibility: 'shared', shareWith: [] }, revision: { name: 'x', document: camberOf(60) } });
    expect(noOne.body.error.field).toBe('sharing.shareWith');
    expect(await LibraryItem.count()).toBe(before);
  });

  it('keeps private items invisible to everyone else (404), and shows shared ones only to the people named', async () => {
    const secret = await publishCamber(55, { visibility: 'private' });
    const shared = await publishCamber(58, { visibility: 'shared', shareWith: [builder.email.toUpperCase()] });
    const { hullId, revisionId } = await builderHull();

    for (const agent of [asBuilder, asHelper, asStranger]) {
      expect((await agent.get(`/api/library/${secret.id}`)).status).toBe(404);
      expect((await agent.get(`/api/library/${secret.id}/revisions/${secret.latest.id}`)).status).toBe(404);
      expect(((await agent.get('/api/library')).body.items as { id: number }[]).map((i) => i.id)).not.toContain(secret.id);
    }
    const take = await asBuilder.post(`/api/hulls/${hullId}/pins`).send({ itemId: secret.id, revisionId: secret.latest.id, baseRevisionId: revisionId });
    expect(take.status).toBe(404);
    // Nor can anyone but the author publish a revision of it: 404, not 403, so its existence is not revealed.
    expect((await asBuilder.post(`/api/library/${secret.id}/revisions`).send({ baseRevisionId: secret.latest.id, name: 'x', document: camberOf(1) })).status).toBe(404);

    expect((await asBuilder.get(`/api/library/${shared.id}`)).body.item).toMatchObject({ mine: false, shareWith: null });
    expect((await asHelper.get(`/api/library/${shared.id}`)).status).toBe(404);
    // Someone who may see it but did not write it: 403.
    expect((await asBuilder.post(`/api/library/${shared.id}/revisions`).send({ baseRevisionId: shared.latest.id, name: 'x', document: camberOf(1) })).status).toBe(403);
    expect((await asDesigner.get(`/api/library/${shared.id}`)).body.item.shareWith).toEqual([builder.email.toLowerCase()]);
  });
});

describe('taking a camber into a hull, a newer revision, and moving to it', () => {
  it('pins the revision, raises a notice when a newer one is published, compares, and moves the hull', async () => {
    const item = await publishCamber(60, { visibility: 'shared', shareWith: [builder.email, helper.email] });
    const { hullId, revisionId } = await builderHull();
    await asBuilder.put('/api/account/settings').send({ noticeMail: true }).expect(200);

    // Take into hull: a plan revision with the deck camber replaced, the pin at revision 1.
    const take = await asBuilder.post(`/api/hulls/${hullId}/pins`).send({ itemId: item.id, revisionId: item.latest.id, baseRevisionId: revisionId });
    expect(take.status, JSON.stringify(take.body)).toBe(201);
    expect(take.body.pin).toMatchObject({ kind: 'camber', itemId: item.id, revisionId: item.latest.id, revisionNumber: 1, latestRevisionNumber: 1, planRevisionId: take.body.revision.id });
    const taken = await latestPlan(asBuilder, hullId);
    expect(taken.revision.id).toBe(take.body.revision.id);
    expect(taken.revision.summary).toBe('Took camber "Skiff deck camber" (revision 1) from the Library');
    expect(taken.plan.lines.deck!.camber).toEqual(camberOf(60));
    expect(taken.plan.lines.deck!.thicknessMm).toBe(9);
    // The demo hull had this camber already: taking it moves nothing.
    expect(take.body.movement.every((m: PartMovement) => m.moveMm === 0)).toBe(true);
    expect((await asHelper.get(`/api/hulls/${hullId}/pins`)).body.pins).toMatchObject([{ id: take.body.pin.id, revisionNumber: 1 }]);
    expect((await asBuilder.get('/api/notices')).body.notices).toEqual([]);
    // The build log says Frame 3 is cut already (its event row written as the log writes it).
    await server.sequelize.query(
      "INSERT INTO build_events (hull_id, part_id, layer_index, stage, action, note, revision_id, author_id, created_at) VALUES (?, 'pt-frame-3', NULL, 'cut', 'done', '', ?, ?, NOW(3))",
      { replacements: [hullId, take.body.revision.id, builder.id] },
    );

    // The designer publishes revision 2: a higher crown.
    const r2 = await asDesigner.post(`/api/library/${item.id}/revisions`).send({ baseRevisionId: item.latest.id, name: 'Skiff deck camber', notes: 'More crown sheds water better.', rules: 'Rise at 1860 mm beam.', document: camberOf(80) });
    expect(r2.status, JSON.stringify(r2.body)).toBe(201);
    expect(r2.body.revision.number).toBe(2);
    expect(r2.body.noticesRaised).toBe(2);

    const notices = (await asBuilder.get('/api/notices')).body.notices;
    expect(notices).toMatchObject([{ hullId, pinId: take.body.pin.id, itemId: item.id, kind: 'camber', pinnedRevisionNumber: 1, newRevisionNumber: 2, newRevisionId: r2.body.revision.id, authorName: designer.displayName }]);
    expect((await asHelper.get('/api/notices')).body.notices).toHaveLength(1);
    expect((await asStranger.get('/api/notices')).body.notices).toEqual([]);
    expect((await asDesigner.get('/api/notices')).body.notices).toEqual([]);
    // Only the builder asked for mail.
    await mailerOf(server.app).settled();
    const mails = await mailTo(builder.email);
    expect(mails.map((m) => m.parsed.subject)).toEqual(['Newer revision of Skiff deck camber (Saltmarsh skiff, hull 7)']);
    expect(mails[0]!.parsed.text).toContain('/notices');
    expect(await mailTo(helper.email)).toEqual([]);

    // Compare: the two curves, and how far the deck line moves at each part's station.
    const compare = await asHelper.get(`/api/hulls/${hullId}/pins/${take.body.pin.id}/compare?to=${r2.body.revision.id}`);
    expect(compare.status, JSON.stringify(compare.body)).toBe(200);
    expect(compare.body).toMatchObject({ from: { number: 1 }, to: { number: 2 }, hullDiffersFromPin: false, movementMethod: 'outline', cutPartsKnown: true });
    const drawing = compare.body.drawing;
    expect(drawing.kind).toBe('camber');
    expect(drawing.halfBeamMm).toBe(930);
    const crown = (points: { y: number; z: number }[]) => points.find((p) => p.y === 0)!.z;
    expect(crown(drawing.before)).toBeCloseTo(60, 9);
    expect(crown(drawing.after)).toBeCloseTo(80, 9);
    const moved = byPart(compare.body.movement);
    // Each part's own outline (framesOfPlan): the frame's top edge follows the deck's underside, which moves
    // as the deck line does; sheer half-breadths in the demo table: St 3 900 mm, St 5 910 mm. Both parts lie
    // with their marked face on the station.
    expect(moved['Frame 3']).toMatchObject({ note: 'outline of the marked face', atY: 0 });
    expect(Math.abs(moved['Frame 3']!.moveMm! - deckRise(60, 80, 900))).toBeLessThan(0.01);
    expect(Math.abs(moved['Bulkhead 5']!.moveMm! - deckRise(60, 80, 910))).toBeLessThan(0.01);
    // The raked transom is drawn expanded and reaches aft of St 7: no closed form here; it does move.
    expect(moved['Transom']!.moveMm).toBeGreaterThan(10);
    expect(Object.fromEntries(Object.values(moved).map((m) => [m.partName, m.cut]))).toEqual({ 'Frame 3': true, 'Bulkhead 5': false, Transom: false });

    // The helper may look but not move the hull.
    const helperMove = await asHelper.post(`/api/hulls/${hullId}/pins/${take.body.pin.id}/move`).send({ toRevisionId: r2.body.revision.id, baseRevisionId: take.body.revision.id });
    expect(helperMove.status).toBe(403);

    // Moving from a stale base is 409 and changes nothing.
    const stale = await asBuilder.post(`/api/hulls/${hullId}/pins/${take.body.pin.id}/move`).send({ toRevisionId: r2.body.revision.id, baseRevisionId: revisionId });
    expect(stale.status).toBe(409);
    expect((await latestPlan(asBuilder, hullId)).revision.id).toBe(take.body.revision.id);

    const move = await asBuilder.post(`/api/hulls/${hullId}/pins/${take.body.pin.id}/move`).send({ toRevisionId: r2.body.revision.id, baseRevisionId: take.body.revision.id });
    expect(move.status, JSON.stringify(move.body)).toBe(201);
    expect(move.body.revision.baseRevisionId).toBe(take.body.revision.id);
    expect(move.body.pin).toMatchObject({ revisionId: r2.body.revision.id, revisionNumber: 2, planRevisionId: move.body.revision.id });
    expect(move.body.movement).toEqual(compare.body.movement);
    const after = await latestPlan(asBuilder, hullId);
    expect(after.revision.id).toBe(move.body.revision.id);
    expect(after.plan.lines.deck!.camber).toEqual(camberOf(80));
    // The earlier revision is as it was.
    const earlier = await asBuilder.get(`/api/hulls/${hullId}/plan/revisions/${take.body.revision.id}`);
    expect(earlier.body.plan.lines.deck.camber).toEqual(camberOf(60));
    // Answered for the whole crew.
    expect((await asBuilder.get('/api/notices')).body.notices).toEqual([]);
    expect((await asHelper.get('/api/notices')).body.notices).toEqual([]);
  });

  it('lets each person stay (dismiss) until an even newer revision comes', async () => {
    const item = await publishCamber(60);
    const { hullId, revisionId } = await builderHull();
    await asBuilder.post(`/api/hulls/${hullId}/pins`).send({ itemId: item.id, revisionId: item.latest.id, baseRevisionId: revisionId }).expect(201);
    const r2 = await asDesigner.post(`/api/library/${item.id}/revisions`).send({ baseRevisionId: item.latest.id, name: 'Skiff deck camber', document: camberOf(70) });
    const onThisHull = async (agent: Agent) => ((await agent.get('/api/notices')).body.notices as { id: number; hullId: number }[]).filter((n) => n.hullId === hullId);
    const [mine] = await onThisHull(asBuilder);
    const [helpers] = await onThisHull(asHelper);

    expect((await asHelper.post(`/api/notices/${mine!.id}/dismiss`)).status).toBe(404);
    expect((await asBuilder.post(`/api/notices/${mine!.id}/dismiss`)).status).toBe(204);
    expect(await onThisHull(asBuilder)).toEqual([]);
    expect(await onThisHull(asHelper)).toMatchObject([{ id: helpers!.id }]);
    expect((await asBuilder.get(`/api/hulls/${hullId}/pins`)).body.pins).toMatchObject([{ revisionNumber: 1, latestRevisionNumber: 2 }]);

    // A stale publication is refused; a fresh one raises the notice again, about revision 3.
    const stale = await asDesigner.post(`/api/library/${item.id}/revisions`).send({ baseRevisionId: item.latest.id, name: 'Skiff deck camber', document: camberOf(75) });
    expect(stale.status).toBe(409);
    expect(stale.body.error.latestRevision).toMatchObject({ id: r2.body.revision.id, number: 2 });
    await asDesigner.post(`/api/library/${item.id}/revisions`).send({ baseRevisionId: r2.body.revision.id, name: 'Skiff deck camber', document: camberOf(75) }).expect(201);
    expect(await onThisHull(asBuilder)).toMatchObject([{ pinnedRevisionNumber: 1, newRevisionNumber: 3 }]);
  });

  it('says when the hull was changed since it took the revision, and refuses a camber for a hull with no deck', async () => {
    const item = await publishCamber(60);
    const { hullId, revisionId } = await builderHull();
    const take = await asBuilder.post(`/api/hulls/${hullId}/pins`).send({ itemId: item.id, revisionId: item.latest.id, baseRevisionId: revisionId });
    const edited = (await latestPlan(asBuilder, hullId)).plan;
    edited.lines.deck!.camber = camberOf(64, 'arc');
    const saved = await asBuilder.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: take.body.revision.id, plan: edited });
    expect(saved.status).toBe(201);
    const compare = await asBuilder.get(`/api/hulls/${hullId}/pins/${take.body.pin.id}/compare?to=${item.latest.id}`);
    expect(compare.body.hullDiffersFromPin).toBe(true);

    const bare = await hullCreate(builder.id, { name: 'No deck yet', units: 'mm', notes: '' });
    const refused = await asBuilder.post(`/api/hulls/${bare.id}/pins`).send({ itemId: item.id, revisionId: item.latest.id, baseRevisionId: null });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('no_deck');
    const [{ n }] = await server.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM plan_revisions WHERE hull_id = ?', { replacements: [bare.id], type: QueryTypes.SELECT });
    expect(Number(n)).toBe(0);
  });
});

describe('taking lines into a hull', () => {
  /** The demo lines with the sheer raised 30 mm at St 3. */
  function raisedSheer() {
    const lines = demoPlan().lines;
    const sheer = lines.lines.find((l) => l.id === 'ln-sheer')!;
    (sheer.cells as Record<string, { y: number; z: number }>)['st-3'] = { y: 900, z: 820 };
    return lines;
  }

  it('replaces the stations and offsets, and reports how far each part’s outline moves', async () => {
    const published = await asDesigner.post('/api/library').send({ kind: 'lines', sharing: { visibility: 'public' }, revision: { name: 'Skiff lines', notes: 'Offsets to the outside of the skin.', document: demoPlan().lines } });
    expect(published.status, JSON.stringify(published.body)).toBe(201);
    const item = published.body.item;
    const { hullId, revisionId } = await builderHull();
    const take = await asBuilder.post(`/api/hulls/${hullId}/pins`).send({ itemId: item.id, revisionId: item.latest.id, baseRevisionId: revisionId });
    expect(take.status, JSON.stringify(take.body)).toBe(201);

    const r2 = await asDesigner.post(`/api/library/${item.id}/revisions`).send({ baseRevisionId: item.latest.id, name: 'Skiff lines', notes: 'Sheer at St 3 raised 30 mm.', document: raisedSheer() });
    expect(r2.status, JSON.stringify(r2.body)).toBe(201);
    const compare = await asBuilder.get(`/api/hulls/${hullId}/pins/${take.body.pin.id}/compare?to=${r2.body.revision.id}`);
    expect(compare.status, JSON.stringify(compare.body)).toBe(200);
    expect(compare.body.movementMethod).toBe('outline');
    const st3 = compare.body.drawing.stations.find((s: { name: string }) => s.name === 'St 3');
    expect(st3.before.at(-1)).toEqual({ y: 900, z: 790 });
    expect(st3.after.at(-1)).toEqual({ y: 900, z: 820 });
    const moved = byPart(compare.body.movement);
    // The sheer point at St 3 moves 30 mm straight up, and the deck with it: so does the top of Frame 3.
    // The lines still pass through the table's values at St 5, so Bulkhead 5 is where it was (to well
    // under the 0.05 mm the page calls "does not move"); the raked transom reaches aft of St 7, where the
    // refitted sheer does differ a little.
    expect(moved['Frame 3']!.moveMm).toBeCloseTo(30, 6);
    expect(moved['Bulkhead 5']!.moveMm).toBeLessThan(0.05);
    expect(moved['Transom']!.moveMm).toBeGreaterThan(0.05);

    const move = await asBuilder.post(`/api/hulls/${hullId}/pins/${take.body.pin.id}/move`).send({ toRevisionId: r2.body.revision.id, baseRevisionId: take.body.revision.id });
    expect(move.status).toBe(201);
    const plan = (await latestPlan(asBuilder, hullId)).plan;
    expect((plan.lines.lines.find((l) => l.id === 'ln-sheer')!.cells as Record<string, unknown>)['st-3']).toEqual({ y: 900, z: 820 });
    expect(plan.lines.skin).toEqual(demoPlan().lines.skin);
  });

  it('refuses lines the hull’s parts do not fit, naming the part and field', async () => {
    const lines = demoPlan().lines;
    lines.stations = lines.stations.filter((s) => s.id !== 'st-3');
    for (const line of lines.lines) delete (line.cells as Record<string, unknown>)['st-3'];
    const published = await asDesigner.post('/api/library').send({ kind: 'lines', sharing: { visibility: 'public' }, revision: { name: 'Skiff lines, fewer stations', document: lines } });
    expect(published.status).toBe(201);
    const { hullId, revisionId } = await builderHull();
    const take = await asBuilder.post(`/api/hulls/${hullId}/pins`).send({ itemId: published.body.item.id, revisionId: published.body.item.latest.id, baseRevisionId: revisionId });
    expect(take.status).toBe(409);
    expect(take.body.error).toMatchObject({ code: 'parts_do_not_fit', field: 'parts.parts.0.stationId' });
    expect((await latestPlan(asBuilder, hullId)).revision.id).toBe(revisionId);
  });
});

describe('movementOf, when a part cannot be worked out', () => {
  it('measures the hull at its station instead, and says so', () => {
    const before = demoPlan();
    const after = demoPlan();
    after.lines.deck!.camber = camberOf(80);
    const frames = framesOfPlan(before);
    // As if Frame 3 could not be built in the hull's plan (a part with an issue of its own).
    frames.parts = frames.parts.map((r) => (r.partId === 'pt-frame-3' ? { ok: false, partId: r.partId, name: 'Frame 3', kind: 'ring-frame', issues: [] } : r));
    const moved = byPart(movementOf(before, after, 'camber', new Set(['pt-bulkhead-5']), { before: frames }));
    expect(moved['Frame 3']!.note).toBe('deck line at the station, as the part itself could not be worked out');
    expect(Math.abs(moved['Frame 3']!.moveMm! - deckRise(60, 80, 900))).toBeLessThan(0.01);
    expect(moved['Bulkhead 5']).toMatchObject({ note: 'outline of the marked face', cut: true });
  });
});
