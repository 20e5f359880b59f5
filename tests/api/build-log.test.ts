import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BuildPhotoRow, HullMember } from '../../server/models';
import { buildPhotosAdd, THUMB_SIDE_PX } from '../../server/services/build-log';
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
    const cut = await helper.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', stage: 'cut', action: 'done', note: 'Height at centreline 2 mm over the pattern; planed to the line', used: { plySheets: 1 } });
    expect(cut.status, JSON.stringify(cut.body)).toBe(201);
    expect(cut.body.event).toMatchObject({ stage: 'cut', action: 'done', revisionId, author: { id: people.helper.id, displayName: people.helper.displayName } });
    expect(Date.parse(cut.body.event.createdAt)).toBeGreaterThanOrEqual(before - 1000);

    let state = (await board(hullId)).parts.find((p) => p.partId === 'pt-frame-3')!;
    expect(state.done).toEqual(['cut']);
    expect(state.next).toBe('patterned');
    expect(state.cutRevisionId).toBe(revisionId);

    const again = await helper.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', stage: 'cut', action: 'done' });
    expect(again.status).toBe(409);
    expect(again.body.error.field).toBe('stage');

    const reopen = await owner.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', stage: 'cut', action: 'reopened', note: 'Recut: wrong face marked' });
    expect(reopen.status).toBe(201);
    expect(reopen.body.event.author.id).toBe(people.owner.id);

    const part = (await designer.get(`/api/hulls/${hullId}/build-log/parts/pt-frame-3`)).body as BuildPartResponse;
    expect(part.events.map((e) => [e.stage, e.action, e.author.id])).toEqual([
      ['cut', 'done', people.helper.id],
      ['cut', 'reopened', people.owner.id],
    ]);
    expect(part.events[0]!.note).toMatch(/2 mm over/);
    expect(part.state.done).toEqual([]);
    expect(part.bevels.length).toBeGreaterThan(0);
    expect(part.bevels[0]).toHaveProperty('slidingBevelDeg');
    state = (await board(hullId)).parts.find((p) => p.partId === 'pt-frame-3')!;
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
    ];
    for (const [body, field] of cases) {
      const res = await helper.post(`/api/hulls/${hullId}/build-log/events`).send(body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.field).toBe(field);
    }
    expect((await owner.get(`/api/hulls/${hullId}/build-log/parts/pt-frame-3`)).body.events).toEqual([]);
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
    await helper.post(`/api/hulls/${hullId}/build-log/events`).send({ partId: 'pt-frame-3', stage: 'cut', action: 'done' }).expect(201);

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
    // A part not cut is never flagged, however the plan moves.
    expect(after.parts.find((p) => p.partId === 'pt-bulkhead-5')!.flag).toBeNull();

    // A looser per-hull tolerance clears the flag.
    await owner.put(`/api/hulls/${hullId}/build-log/settings`).send({ moveToleranceMm: 20 }).expect(200);
    expect((await board(hullId)).parts.find((p) => p.partId === 'pt-frame-3')!.flag).toBeNull();
    const bad = await owner.put(`/api/hulls/${hullId}/build-log/settings`).send({ moveToleranceMm: -1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('moveToleranceMm');
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
