import { mkdtemp, readdir, rm, utimes } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BuildPhotoRow, Hull, HullMember } from '../../server/models';
import { buildPhotoDelete, buildPhotosAdd, photoFileKeys, photoSweep, THUMB_SIDE_PX } from '../../server/services/build-log-photos';
import { cutPartIdsOf } from '../../server/services/cut-parts';
import { folderPhotoStorage, type PhotoStorage } from '../../server/services/photo-storage';
import { demoPlan } from '../../server/seed/demo-plan';
import type { BuildBoardResponse, BuildPartResponse } from '../../shared/api/build-log';
import { PHOTO_MAX_BYTES } from '../../shared/api/build-log';
import { makeUser, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
let dataDir: string;
let owner: TestAgent;
let helper: TestAgent;
let designer: TestAgent;
let people: Record<'owner' | 'helper' | 'designer', Awaited<ReturnType<typeof makeUser>>>;

beforeAll(async () => {
  // The photos go to a folder of this test's own, so what is (or is not) written can be listed.
  dataDir = await mkdtemp(path.join(os.tmpdir(), 'loftbench-build-log-'));
  server = testServer({ dataDir });
  people = { owner: await makeUser('owner'), helper: await makeUser('helper'), designer: await makeUser('designer') };
  owner = await signedIn(server.app, people.owner);
  helper = await signedIn(server.app, people.helper);
  designer = await signedIn(server.app, people.designer);
});
afterAll(async () => {
  await server.close();
  await rm(dataDir, { recursive: true, force: true });
});

async function demoHull() {
  const hullId = (await owner.post('/api/hulls').send({ name: 'Build log test', units: 'mm' })).body.hull.id as number;
  await HullMember.create({ hullId, userId: people.helper.id, role: 'helper' });
  await HullMember.create({ hullId, userId: people.designer.id, role: 'designer' });
  const saved = await owner.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: null, plan: demoPlan() });
  expect(saved.status, JSON.stringify(saved.body)).toBe(201);
  return { hullId, revisionId: saved.body.revision.id as number };
}

/** The demo plan with the chine's half-breadth at station 3 moved outward by `mm`. */
function chineMovedAtSt3(mm: number) {
  const plan = demoPlan();
  const chine = plan.lines.lines.find((l) => l.id === 'ln-chine')!;
  const cells = chine.cells as Record<string, { y: number; z: number }>;
  cells['st-3'] = { ...cells['st-3']!, y: cells['st-3']!.y + mm };
  return plan;
}

const board = async (hullId: number) => (await owner.get(`/api/hulls/${hullId}/build-log`)).body as BuildBoardResponse;
const photoFiles = async () => (await readdir(path.join(dataDir, 'photos')).catch(() => [] as string[])).filter((f) => !f.startsWith('.tmp'));
const png = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: '#a0522d' } }).png().toBuffer();

describe('stages', () => {
  it('marks a stage with who and when, and reopens it as a new event without changing the first', async () => {
    const { hullId, revisionId } = await demoHull();
    const before = Date.now();
    const cut = await helper.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-bulkhead-5', stage: 'cut', action: 'done', note: 'Height at centreline 2 mm over the pattern; planed to the line', used: { plySheets: 1 } });
    expect(cut.status, JSON.stringify(cut.body)).toBe(201);
    expect(cut.body.event).toMatchObject({ stage: 'cut', action: 'done', revisionId, author: { id: people.helper.id, displayName: people.helper.displayName } });
    expect(Date.parse(cut.body.event.createdAt)).toBeGreaterThanOrEqual(before - 1000);

    let state = (await board(hullId)).parts.find((p) => p.partId === 'pt-bulkhead-5')!;
    expect(state.done).toEqual(['cut']);
    expect(state.next).toBe('patterned');
    expect(state.cutRevisionId).toBe(revisionId);

    const again = await helper.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-bulkhead-5', stage: 'cut', action: 'done' });
    expect(again.status).toBe(409);
    expect(again.body.error.field).toBe('stage');

    const reopen = await owner.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-bulkhead-5', stage: 'cut', action: 'reopened', note: 'Recut: wrong face marked' });
    expect(reopen.status).toBe(201);
    expect(reopen.body.event.author.id).toBe(people.owner.id);

    const part = (await designer.get(`/api/hulls/${hullId}/build-log/parts/pt-bulkhead-5`)).body as BuildPartResponse;
    expect(part.events.map((e) => [e.stage, e.action, e.author.id])).toEqual([
      ['cut', 'done', people.helper.id],
      ['cut', 'reopened', people.owner.id],
    ]);
    expect(part.events[0]!.note).toMatch(/2 mm over/);
    expect(part.state.done).toEqual([]);
    expect(part.bevels.length).toBeGreaterThan(0);
    expect(part.bevels[0]).toHaveProperty('slidingBevelDeg');
    state = (await board(hullId)).parts.find((p) => p.partId === 'pt-bulkhead-5')!;
    expect(state.cutRevisionId).toBeNull();
    expect((await board(hullId)).material.used.plySheets).toBe(1);
  });

  it('refuses bad input naming the field and writes nothing', async () => {
    const { hullId } = await demoHull();
    const cases: [object, string][] = [
      [{ partId: 'pt-frame-3', stage: 'sanded', action: 'done' }, 'stage'],
      [{ partId: 'pt-none', stage: 'cut', action: 'done' }, 'partId'],
      [{ partId: 'pt-frame-3', stage: 'cut', action: 'done', used: { epoxyMl: -5 } }, 'used.epoxyMl'],
      [{ partId: 'pt-frame-3', stage: 'cut', action: 'done', layerIndex: 7 }, 'layerIndex'],
      [{ partId: 'pt-frame-3', stage: 'cut', action: 'done', layerIndex: -1 }, 'layerIndex'],
    ];
    for (const [body, field] of cases) {
      const res = await helper.post(`/api/hulls/${hullId}/build-log/events`).send(body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.field).toBe(field);
    }
    expect((await owner.get(`/api/hulls/${hullId}/build-log/parts/pt-frame-3`)).body.events).toEqual([]);
  });

  it('marks a laminated part patterned and cut layer by layer, then laminated as a whole', async () => {
    const { hullId, revisionId } = await demoHull();
    const mark = (body: object) => helper.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', action: 'done', ...body });
    const frame = async () => (await board(hullId)).parts.find((p) => p.partId === 'pt-frame-3')!;

    // Frame 3 of the demo plan is two 9 mm laminations; Bulkhead 5 is one 12 mm sheet.
    expect((await frame()).layers.map((l) => [l.index, l.thicknessMm, l.done])).toEqual([
      [0, 9, []],
      [1, 9, []],
    ]);
    expect((await board(hullId)).parts.find((p) => p.partId === 'pt-bulkhead-5')!.layers).toEqual([]);

    // Where the layer does not fit the stage or the part: 400 naming layerIndex, and nothing written.
    const refusals: [object, string, string][] = [
      [{ stage: 'cut' }, 'layer_needed', 'laminated from 2 layers'],
      [{ stage: 'laminated', layerIndex: 0 }, 'whole_part_stage', 'as a whole'],
      [{ stage: 'cut', layerIndex: 2 }, 'no_such_layer', 'layer 3 does not exist'],
      [{ partId: 'pt-bulkhead-5', stage: 'cut', layerIndex: 0 }, 'single_layer', 'single layer'],
    ];
    for (const [body, code, words] of refusals) {
      const res = await mark(body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error).toMatchObject({ code, field: 'layerIndex' });
      expect(res.body.error.message).toContain(words);
    }
    expect((await owner.get(`/api/hulls/${hullId}/build-log/parts/pt-frame-3`)).body.events).toEqual([]);

    await mark({ stage: 'patterned', layerIndex: 0 }).expect(201);
    await mark({ stage: 'patterned', layerIndex: 1 }).expect(201);
    const cut0 = await mark({ stage: 'cut', layerIndex: 0, note: 'Layer 1 from the second sheet' });
    expect(cut0.status).toBe(201);
    expect(cut0.body.event).toMatchObject({ layerIndex: 0, stage: 'cut', revisionId, author: { id: people.helper.id } });
    // The same layer twice is a conflict; the other layer is not.
    expect((await mark({ stage: 'cut', layerIndex: 0 })).status).toBe(409);

    let state = await frame();
    expect(state.done).toEqual(['patterned']);
    expect(state.next).toBe('cut');
    expect(state.layers.map((l) => [l.done, l.next, l.cutRevisionId])).toEqual([
      [['patterned', 'cut'], null, revisionId],
      [['patterned'], 'cut', null],
    ]);
    // Wood is cut as soon as one layer is: the Library's movement check counts the part.
    expect([...(await cutPartIdsOf(hullId))]).toEqual(['pt-frame-3']);

    await mark({ stage: 'cut', layerIndex: 1 }).expect(201);
    await mark({ stage: 'laminated' }).expect(201);
    state = await frame();
    expect(state.done).toEqual(['patterned', 'cut', 'laminated']);
    expect(state.next).toBe('shaped');
    expect(state.cutRevisionId).toBe(revisionId);

    // Reopening one layer's cut takes the part's cut back, not the other layer's.
    await owner.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', layerIndex: 0, stage: 'cut', action: 'reopened', note: 'Split along a joint; recut' }).expect(201);
    state = await frame();
    expect(state.done).toEqual(['patterned', 'laminated']);
    expect(state.layers.map((l) => l.done)).toEqual([['patterned'], ['patterned', 'cut']]);
    expect(state.cutRevisionId).toBe(revisionId);
    expect([...(await cutPartIdsOf(hullId))]).toEqual(['pt-frame-3']);
    await owner.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', layerIndex: 1, stage: 'cut', action: 'reopened' }).expect(201);
    expect([...(await cutPartIdsOf(hullId))]).toEqual([]);

    const history = ((await designer.get(`/api/hulls/${hullId}/build-log/parts/pt-frame-3`)).body as BuildPartResponse).events;
    expect(history.map((e) => [e.stage, e.layerIndex, e.action])).toEqual([
      ['patterned', 0, 'done'],
      ['patterned', 1, 'done'],
      ['cut', 0, 'done'],
      ['cut', 1, 'done'],
      ['laminated', null, 'done'],
      ['cut', 0, 'reopened'],
      ['cut', 1, 'reopened'],
    ]);
  });

  it('lets the designer read the log but not keep it', async () => {
    const { hullId } = await demoHull();
    expect((await designer.get(`/api/hulls/${hullId}/build-log`)).status).toBe(200);
    expect((await designer.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', stage: 'cut', action: 'done' })).status).toBe(403);
  });
});

describe('flags when a later revision moves a cut part', () => {
  it('flags a part cut from an older revision once a new one moves it past the tolerance', async () => {
    const { hullId, revisionId } = await demoHull();
    for (const layerIndex of [0, 1]) await helper.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', layerIndex, stage: 'cut', action: 'done' }).expect(201);

    // A move well inside the tolerance is not flagged.
    const small = await owner.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: revisionId, plan: chineMovedAtSt3(0.2) });
    expect(small.status, JSON.stringify(small.body)).toBe(201);
    let frame = (await board(hullId)).parts.find((p) => p.partId === 'pt-frame-3')!;
    expect(frame.flag).toBeNull();

    const big = await owner.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: small.body.revision.id, plan: chineMovedAtSt3(8) });
    expect(big.status).toBe(201);
    const after = await board(hullId);
    frame = after.parts.find((p) => p.partId === 'pt-frame-3')!;
    expect(frame.flag).toMatchObject({ cutRevisionId: revisionId, latestRevisionId: big.body.revision.id });
    expect(frame.flag!.movedMm).toBeGreaterThan(1);
    // The chine moved 8 mm outward at the frame's station: the outline moves by about that much, not more.
    expect(frame.flag!.movedMm).toBeLessThanOrEqual(8.5);
    // Each cut layer is measured against its own outline, and the part carries the worst of them.
    expect(frame.layers.every((l) => l.flag !== null && l.flag.layerIndex === l.index)).toBe(true);
    expect(frame.flag!.movedMm).toBe(Math.max(...frame.layers.map((l) => l.flag!.movedMm)));
    // A part not cut is never flagged, however the plan moves.
    expect(after.parts.find((p) => p.partId === 'pt-bulkhead-5')!.flag).toBeNull();

    // A looser per-hull tolerance clears the flag.
    // Only those who may change the parts set it: a helper who cut the part cannot wave its flag away.
    expect((await helper.put(`/api/hulls/${hullId}/build-log/settings`).send({ moveToleranceMm: 20 })).status).toBe(403);
    expect((await board(hullId)).moveToleranceMm).toBe(1);
    await owner.put(`/api/hulls/${hullId}/build-log/settings`).send({ moveToleranceMm: 20 }).expect(200);
    expect((await board(hullId)).parts.find((p) => p.partId === 'pt-frame-3')!.flag).toBeNull();
    const bad = await owner.put(`/api/hulls/${hullId}/build-log/settings`).send({ moveToleranceMm: -1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('moveToleranceMm');
    expect(bad.body.error.message).toContain('at least 0.1 mm');
    expect((await board(hullId)).moveToleranceMm).toBe(20);
  });
});

describe('photos', () => {
  it('re-encodes a good photo, makes a thumbnail, and serves both only to the crew', async () => {
    const { hullId } = await demoHull();
    const res = await helper.post(`/api/hulls/${hullId}/build-log/parts/pt-frame-3/photos`).field('stage', 'cut').attach('photo', await png(1600, 900), 'frame.png');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const photo = res.body.photos[0];
    expect(photo).toMatchObject({ partId: 'pt-frame-3', stage: 'cut', width: 1600, height: 900 });

    const thumb = await designer.get(`/api/hulls/${hullId}/build-log/photos/${photo.id}?size=thumb`).buffer(true);
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([THUMB_SIDE_PX, 180]);
    expect(meta.format).toBe('jpeg');

    const stranger = await signedIn(server.app, await makeUser('stranger'));
    expect((await stranger.get(`/api/hulls/${hullId}/build-log/photos/${photo.id}`)).status).toBe(404);
    // Another hull's id with this photo's id: not found either.
    const other = await demoHull();
    expect((await owner.get(`/api/hulls/${other.hullId}/build-log/photos/${photo.id}`)).status).toBe(404);
  });

  it('strips EXIF metadata (where a camera puts GPS) from the stored photo', async () => {
    const { hullId } = await demoHull();
    const withExif = await sharp(await png(200, 100)).jpeg().withExifMerge({ IFD0: { Copyright: 'secret-place' } }).toBuffer();
    expect((await sharp(withExif).metadata()).exif).toBeDefined();
    const res = await helper.post(`/api/hulls/${hullId}/build-log/parts/pt-frame-3/photos`).attach('photo', withExif, 'a.jpg');
    expect(res.status).toBe(201);
    const full = await helper.get(`/api/hulls/${hullId}/build-log/photos/${res.body.photos[0].id}`).buffer(true);
    expect((await sharp(full.body as Buffer).metadata()).exif).toBeUndefined();
  });

  it('refuses a file that is not an image even when named .jpg, and an oversized one, writing nothing', async () => {
    const { hullId } = await demoHull();
    const rowsBefore = await BuildPhotoRow.count();
    const filesBefore = await photoFiles();

    const text = await helper.post(`/api/hulls/${hullId}/build-log/parts/pt-frame-3/photos`).attach('photo', Buffer.from('%PDF-1.4\nnot a photo at all\n'), 'frame.jpg');
    expect(text.status).toBe(415);
    expect(text.body.error).toMatchObject({ code: 'not_an_image', field: 'photo' });

    const huge = Buffer.concat([await png(10, 10), Buffer.alloc(PHOTO_MAX_BYTES)]);
    const big = await helper.post(`/api/hulls/${hullId}/build-log/parts/pt-frame-3/photos`).attach('photo', huge, 'big.png');
    expect(big.status).toBe(413);
    expect(big.body.error.field).toBe('photo');

    // One good file beside a bad one: the whole upload is refused, the good one not kept either.
    const mixed = await helper
      .post(`/api/hulls/${hullId}/build-log/parts/pt-frame-3/photos`)
      .attach('photo', await png(50, 50), 'good.png')
      .attach('photo', Buffer.from('just text'), 'bad.png');
    expect(mixed.status).toBe(415);

    expect(await BuildPhotoRow.count()).toBe(rowsBefore);
    expect(await photoFiles()).toEqual(filesBefore);
    expect((await owner.get(`/api/hulls/${hullId}/build-log/parts/pt-frame-3`)).body.photos).toEqual([]);
  });

  it('leaves no files behind when storing fails part-way, and no row', async () => {
    const { hullId, revisionId } = await demoHull();
    const folder = await mkdtemp(path.join(os.tmpdir(), 'loftbench-photos-'));
    const real = folderPhotoStorage(folder);
    let puts = 0;
    // A disk that fills up on the third write: the first photo's two files are written, then it fails.
    const failing: PhotoStorage = { ...real, put: async (key, bytes) => ((puts += 1) === 3 ? Promise.reject(new Error('disk full')) : real.put(key, bytes)) };
    const access = { hullId, role: 'owner' as const, units: 'mm' as const, latestRevisionId: revisionId };
    const files = [{ buffer: await png(30, 30), originalname: 'a.png' }, { buffer: await png(30, 30), originalname: 'b.png' }];
    await expect(buildPhotosAdd(access, people.owner.id, failing, { partId: 'pt-frame-3', stage: null, caption: '', files })).rejects.toThrow('disk full');
    expect((await readdir(folder)).filter((f) => !f.startsWith('.tmp'))).toEqual([]);
    expect(await BuildPhotoRow.count({ where: { hullId } })).toBe(0);
    await rm(folder, { recursive: true, force: true });
  });
});

describe('deleting photos', () => {
  const upload = async (agent: TestAgent, hullId: number) => {
    const res = await agent.post(`/api/hulls/${hullId}/build-log/parts/pt-frame-3/photos`).attach('photo', await png(120, 80), 'bench.png');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.photos[0].id as number;
  };
  const filesOf = async (photoId: number) => Object.values(photoFileKeys((await BuildPhotoRow.findByPk(photoId))!.storageKey));

  it('removes the row and both files; a helper deletes their own photos, the owner and builders any', async () => {
    const { hullId } = await demoHull();
    const own = await upload(helper, hullId);
    const owners = await upload(owner, hullId);
    const ownFiles = await filesOf(own);
    const ownersFiles = await filesOf(owners);
    expect(await photoFiles()).toEqual(expect.arrayContaining([...ownFiles, ...ownersFiles]));

    const refused = await helper.delete(`/api/hulls/${hullId}/build-log/photos/${owners}`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/only the photos they added/);
    expect((await designer.delete(`/api/hulls/${hullId}/build-log/photos/${own}`)).status).toBe(403);
    // Another hull's path with this photo's id finds nothing.
    const other = await demoHull();
    expect((await owner.delete(`/api/hulls/${other.hullId}/build-log/photos/${own}`)).status).toBe(404);
    expect(await BuildPhotoRow.count({ where: { hullId } })).toBe(2);
    expect(await photoFiles()).toEqual(expect.arrayContaining([...ownFiles, ...ownersFiles]));

    expect((await helper.delete(`/api/hulls/${hullId}/build-log/photos/${own}`)).status).toBe(204);
    expect(await BuildPhotoRow.findByPk(own)).toBeNull();
    expect((await photoFiles()).filter((f) => ownFiles.includes(f))).toEqual([]);
    expect((await owner.get(`/api/hulls/${hullId}/build-log/photos/${own}?size=thumb`)).status).toBe(404);
    expect((await helper.delete(`/api/hulls/${hullId}/build-log/photos/${own}`)).status).toBe(404);

    expect((await owner.delete(`/api/hulls/${hullId}/build-log/photos/${owners}`)).status).toBe(204);
    expect((await photoFiles()).filter((f) => ownersFiles.includes(f))).toEqual([]);
    expect((await board(hullId)).parts.find((p) => p.partId === 'pt-frame-3')!.photos).toBe(0);
  });

  it('still deletes the row when a file cannot be removed, logs it, and the sweep removes the file later', async () => {
    const { hullId, revisionId } = await demoHull();
    const folder = await mkdtemp(path.join(os.tmpdir(), 'loftbench-photos-'));
    const real = folderPhotoStorage(folder);
    const access = { hullId, role: 'owner' as const, units: 'mm' as const, latestRevisionId: revisionId };
    const [photo] = await buildPhotosAdd(access, people.owner.id, real, { partId: 'pt-frame-3', stage: null, caption: '', files: [{ buffer: await png(30, 30), originalname: 'a.png' }] });
    const stuck: PhotoStorage = { ...real, delete: () => Promise.reject(new Error('read-only file system')) };
    const warnings: Record<string, unknown>[] = [];
    await buildPhotoDelete(access, people.owner.id, stuck, photo!.id, { warn: (details) => warnings.push(details) });
    expect(await BuildPhotoRow.findByPk(photo!.id)).toBeNull();
    expect(warnings.map((w) => w.key)).toEqual([expect.stringMatching(/\.jpg$/), expect.stringMatching(/\.thumb\.jpg$/)]);
    expect((await readdir(folder)).length).toBe(2);
    expect(await photoSweep(real, { graceMs: 0 })).toHaveLength(2);
    expect(await readdir(folder)).toEqual([]);
    await rm(folder, { recursive: true, force: true });
  });
});

describe('photo files when rows go by cascade', () => {
  it('removes the files of a deleted hull and of a deleted account, and nothing a row still names or an upload may still need', async () => {
    const folder = await mkdtemp(path.join(os.tmpdir(), 'loftbench-photos-'));
    const storage = folderPhotoStorage(folder);
    const add = async (hull: { hullId: number; revisionId: number }, uploaderId: number) => {
      const access = { hullId: hull.hullId, role: 'owner' as const, units: 'mm' as const, latestRevisionId: hull.revisionId };
      const [photo] = await buildPhotosAdd(access, uploaderId, storage, { partId: 'pt-frame-3', stage: 'cut', caption: '', files: [{ buffer: await png(40, 20), originalname: 'p.png' }] });
      const { full, thumb } = photoFileKeys((await BuildPhotoRow.findByPk(photo!.id))!.storageKey);
      return [full, thumb];
    };
    const doomed = await demoHull();
    const kept = await demoHull();
    const doomedFiles = await add(doomed, people.owner.id);
    const keptFiles = await add(kept, people.owner.id);
    // A helper whose account is deleted: their photo rows go with it (uploader_id ON DELETE CASCADE).
    const leaver = await makeUser('leaver');
    await HullMember.create({ hullId: kept.hullId, userId: leaver.id, role: 'helper' });
    const leaverFiles = await add(kept, leaver.id);

    // Rows removed by the database itself, as 0005-build-log's foreign keys cascade.
    await Hull.destroy({ where: { id: doomed.hullId } });
    await BuildPhotoRow.sequelize!.query('DELETE FROM users WHERE id = ?', { replacements: [leaver.id] });
    expect(await BuildPhotoRow.count({ where: { hullId: doomed.hullId } })).toBe(0);
    expect(await BuildPhotoRow.count({ where: { uploaderId: leaver.id } })).toBe(0);
    expect(await BuildPhotoRow.count({ where: { hullId: kept.hullId } })).toBe(1);

    // Files of an upload under way (stored, its row not yet inserted) are younger than the grace period.
    await storage.put('0a1b2c3d-in-flight.jpg', await png(10, 10));
    const orphans = [...doomedFiles, ...leaverFiles];
    const hourAgo = new Date(Date.now() - 2 * 60 * 60 * 1000);
    for (const f of [...orphans, ...keptFiles]) await utimes(path.join(folder, f), hourAgo, hourAgo);

    const removed = await photoSweep(storage);
    expect(removed.sort()).toEqual(orphans.sort());
    expect((await readdir(folder)).sort()).toEqual([...keptFiles, '0a1b2c3d-in-flight.jpg'].sort());
    // Once the grace period is over, the in-flight file that never got a row goes too.
    expect(await photoSweep(storage, { graceMs: 0 })).toEqual(['0a1b2c3d-in-flight.jpg']);
    await rm(folder, { recursive: true, force: true });
  });
});
