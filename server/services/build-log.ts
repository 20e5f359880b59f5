import { randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import sharp, { type OutputInfo } from 'sharp';
import {
  buildStages,
  DEFAULT_MOVE_TOLERANCE_MM,
  type BevelRow,
  type BuildBoardResponse,
  type BuildEvent,
  type BuildPartResponse,
  type BuildPartState,
  type BuildPhoto,
  type BuildStage,
  type MaterialFigures,
} from '../../shared/api/build-log';
import type { PartGeometry, PlanFrames } from '../../shared/geometry/frame-types';
import { polylineDistance, type Loop } from '../../shared/geometry/polygon';
import { AppError, notFound } from '../errors';
import type { HullAccess } from '../http/hull-access';
import { BuildEventRow, BuildPhotoRow, BuildSetting, User } from '../models';
import { partsOfRevision } from './parts';
import type { PhotoStorage } from './photo-storage';

/** A full sheet of plywood, 1220 x 2440 mm (4 x 8 ft): how the cut list's face area becomes sheets to buy. */
const SHEET_AREA_MM2 = 1220 * 2440;
/** Photos are kept at most this size on the long side, and thumbnails fit this square. */
const PHOTO_LONG_SIDE_PX = 2400;
export const THUMB_SIDE_PX = 320;
const ACCEPTED_IMAGES = new Set(['image/jpeg', 'image/png', 'image/webp']);

type EventWithAuthor = BuildEventRow & { author?: User };
type PhotoWithUploader = BuildPhotoRow & { uploader?: User };

function eventOut(row: EventWithAuthor): BuildEvent {
  return {
    id: row.id,
    partId: row.partId,
    layerIndex: row.layerIndex,
    stage: row.stage,
    action: row.action,
    note: row.note,
    revisionId: row.revisionId,
    used: { plySheets: row.usedPlySheets, epoxyMl: row.usedEpoxyMl, fillerMl: row.usedFillerMl, tapeM: row.usedTapeM },
    author: { id: row.authorId, displayName: row.author?.displayName ?? '' },
    createdAt: row.createdAt.toISOString(),
  };
}

function photoOut(row: PhotoWithUploader): BuildPhoto {
  return {
    id: row.id,
    partId: row.partId,
    stage: row.stage,
    caption: row.caption,
    width: row.width,
    height: row.height,
    thumbWidth: row.thumbWidth,
    thumbHeight: row.thumbHeight,
    uploader: { id: row.uploaderId, displayName: row.uploader?.displayName ?? '' },
    createdAt: row.createdAt.toISOString(),
  };
}

export async function moveToleranceOf(hullId: number): Promise<number> {
  return (await BuildSetting.findByPk(hullId))?.moveToleranceMm ?? DEFAULT_MOVE_TOLERANCE_MM;
}

export async function buildSettingsPut(hullId: number, moveToleranceMm: number) {
  await BuildSetting.upsert({ hullId, moveToleranceMm });
  return { moveToleranceMm };
}

/** The largest distance (mm) between two outlines: every point of each measured to the other (a Hausdorff distance). */
function outlineDistance(a: Loop, b: Loop): number {
  let worst = 0;
  for (const p of a) worst = Math.max(worst, polylineDistance(b, p, true) ?? 0);
  for (const p of b) worst = Math.max(worst, polylineDistance(a, p, true) ?? 0);
  return worst;
}

function geometryOf(frames: PlanFrames, partId: string): PartGeometry | null {
  const r = frames.parts.find((p) => p.partId === partId);
  return r && r.ok ? r.part : null;
}

// Revisions never change, so how far a part moved between two of them is worked out once.
const movedCache = new Map<string, number | null>();

/** How far (mm) the part's marked-face outline moved from one revision to another; null when either cannot be built. */
export async function partMovedMm(access: HullAccess, partId: string, fromRevisionId: number, toRevisionId: number): Promise<number | null> {
  const key = `${fromRevisionId}:${toRevisionId}:${partId}`;
  if (movedCache.has(key)) return movedCache.get(key)!;
  const [from, to] = await Promise.all([partsOfRevision(access.hullId, fromRevisionId, access.units), partsOfRevision(access.hullId, toRevisionId, access.units)]);
  const a = geometryOf(from.frames, partId)?.layers[0]?.regions[0]?.outer;
  const b = geometryOf(to.frames, partId)?.layers[0]?.regions[0]?.outer;
  const moved = a && b ? outlineDistance(a, b) : null;
  if (movedCache.size > 2000) movedCache.clear();
  movedCache.set(key, moved);
  return moved;
}

/** Which whole-part stages are done now: a stage is done when its last event says so (a reopen undoes it). */
function stagesDone(events: readonly BuildEventRow[]): { done: BuildStage[]; cutRevisionId: number | null } {
  const last = new Map<BuildStage, BuildEventRow>();
  for (const e of events) if (e.layerIndex === null) last.set(e.stage, e);
  const done = buildStages.filter((s) => last.get(s)?.action === 'done');
  const cut = last.get('cut');
  return { done, cutRevisionId: cut?.action === 'done' ? cut.revisionId : null };
}

async function partState(access: HullAccess, partId: string, name: string, events: readonly BuildEventRow[], photos: number, tolerance: number): Promise<BuildPartState> {
  const { done, cutRevisionId } = stagesDone(events);
  const latest = access.latestRevisionId;
  let flag: BuildPartState['flag'] = null;
  if (cutRevisionId !== null && latest !== null && cutRevisionId !== latest) {
    const moved = await partMovedMm(access, partId, cutRevisionId, latest);
    if (moved !== null && moved > tolerance) flag = { movedMm: Math.round(moved * 10) / 10, cutRevisionId, latestRevisionId: latest };
  }
  return { partId, name, done, next: buildStages.find((s) => !done.includes(s)) ?? null, cutRevisionId, flag, photos };
}

function nameOf(frames: PlanFrames, partId: string): string {
  const r = frames.parts.find((p) => p.partId === partId);
  if (!r) return partId;
  return r.ok ? r.part.name : r.name;
}

/** Every part of the latest revision with its stages, flags, and the material used against the estimate. */
export async function buildBoard(access: HullAccess): Promise<BuildBoardResponse> {
  const [{ frames }, events, photos, tolerance] = await Promise.all([
    partsOfRevision(access.hullId, access.latestRevisionId, access.units),
    BuildEventRow.findAll({ where: { hullId: access.hullId }, order: [['id', 'ASC']] }),
    BuildPhotoRow.findAll({ where: { hullId: access.hullId }, attributes: ['id', 'partId'] }),
    moveToleranceOf(access.hullId),
  ]);
  const parts = await Promise.all(
    frames.parts.map((r) =>
      partState(
        access,
        r.partId,
        nameOf(frames, r.partId),
        events.filter((e) => e.partId === r.partId),
        photos.filter((p) => p.partId === r.partId).length,
        tolerance,
      ),
    ),
  );
  const e = frames.estimate;
  const estimate: MaterialFigures = {
    plySheets: Object.values(e.plyAreaByThicknessMm2).reduce((sum, area) => sum + Math.ceil(area / SHEET_AREA_MM2), 0),
    epoxyMl: Math.round(e.resinMl),
    fillerMl: Math.round(e.filletMl),
    tapeM: Math.round(e.tapeLengthMm / 100) / 10,
  };
  const used: MaterialFigures = { plySheets: 0, epoxyMl: 0, fillerMl: 0, tapeM: 0 };
  for (const ev of events) {
    used.plySheets += ev.usedPlySheets;
    used.epoxyMl += ev.usedEpoxyMl;
    used.fillerMl += ev.usedFillerMl;
    used.tapeM += ev.usedTapeM;
  }
  return { latestRevisionId: access.latestRevisionId, moveToleranceMm: tolerance, parts, material: { estimate, used } };
}

/** A part of the latest revision, or a 400 naming the field (the log only follows parts the plan has). */
async function partOfLatest(access: HullAccess, partId: string, field = 'partId') {
  const { frames } = await partsOfRevision(access.hullId, access.latestRevisionId, access.units);
  const result = frames.parts.find((p) => p.partId === partId);
  if (!result) throw new AppError(field === 'partId' ? 400 : 404, field === 'partId' ? 'no_such_part' : 'not_found', `The plan has no part ${partId}`, field === 'partId' ? 'partId' : undefined);
  return { frames, result };
}

export interface BuildEventRequest {
  partId: string;
  layerIndex: number | null;
  stage: BuildStage;
  action: 'done' | 'reopened';
  note: string;
  used: { plySheets?: number; epoxyMl?: number; fillerMl?: number; tapeM?: number };
}

/** Mark a stage done or reopen it: always a new row, with who, when and the revision the plan was at. */
export async function buildEventAdd(access: HullAccess, authorId: number, input: BuildEventRequest): Promise<BuildEvent> {
  const { result } = await partOfLatest(access, input.partId);
  if (input.layerIndex !== null && result.ok && input.layerIndex >= result.part.layers.length) {
    throw new AppError(400, 'no_such_layer', `Part ${input.partId} has ${result.part.layers.length} layer(s); layer ${input.layerIndex} does not exist`, 'layerIndex');
  }
  const previous = await BuildEventRow.findOne({ where: { hullId: access.hullId, partId: input.partId, stage: input.stage, layerIndex: input.layerIndex }, order: [['id', 'DESC']] });
  const isDone = previous?.action === 'done';
  if (input.action === 'done' && isDone) throw new AppError(409, 'already_done', `${input.stage} is already marked done for this part`, 'stage');
  if (input.action === 'reopened' && !isDone) throw new AppError(409, 'not_done', `${input.stage} is not marked done, so there is nothing to reopen`, 'stage');
  const row = await BuildEventRow.create({
    hullId: access.hullId,
    partId: input.partId,
    layerIndex: input.layerIndex,
    stage: input.stage,
    action: input.action,
    note: input.note,
    revisionId: access.latestRevisionId,
    usedPlySheets: input.used.plySheets ?? 0,
    usedEpoxyMl: input.used.epoxyMl ?? 0,
    usedFillerMl: input.used.fillerMl ?? 0,
    usedTapeM: input.used.tapeM ?? 0,
    authorId,
  });
  const author = await User.findByPk(authorId, { attributes: ['id', 'displayName'] });
  return eventOut(Object.assign(row, { author: author ?? undefined }));
}

/** One part's build sheet: state, full history, photos and the bevel table of the latest revision. */
export async function buildPart(access: HullAccess, partId: string): Promise<BuildPartResponse> {
  const { frames, result } = await partOfLatest(access, partId, 'path');
  const [events, photos, tolerance] = await Promise.all([
    BuildEventRow.findAll({ where: { hullId: access.hullId, partId }, order: [['id', 'ASC']], include: [{ model: User, as: 'author', attributes: ['id', 'displayName'] }] }),
    BuildPhotoRow.findAll({ where: { hullId: access.hullId, partId }, order: [['id', 'ASC']], include: [{ model: User, as: 'uploader', attributes: ['id', 'displayName'] }] }),
    moveToleranceOf(access.hullId),
  ]);
  const bevels: BevelRow[] = result.ok
    ? result.part.bevelMarks.map((m) => ({
        side: m.side,
        edge: m.edge,
        girthMm: Math.round(m.girthMm),
        tiltDeg: Math.round((m.bevelDeg as number) * 10) / 10,
        slidingBevelDeg: Math.round((m.slidingBevelDeg as number) * 10) / 10,
        kind: m.kind,
        faceDown: m.faceDown,
      }))
    : [];
  return {
    state: await partState(access, partId, nameOf(frames, partId), events, photos.length, tolerance),
    events: events.map((e) => eventOut(e as EventWithAuthor)),
    photos: photos.map((p) => photoOut(p as PhotoWithUploader)),
    bevels,
  };
}

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
}

/**
 * Attach photos to a part. Every file is checked and re-encoded before anything is stored, so a refused
 * file leaves nothing behind; files are stored before the rows, and removed again if the rows fail.
 */
export async function buildPhotosAdd(
  access: HullAccess,
  uploaderId: number,
  storage: PhotoStorage,
  input: { partId: string; stage: BuildStage | null; caption: string; files: readonly UploadedFile[] },
): Promise<BuildPhoto[]> {
  if (input.files.length === 0) throw new AppError(400, 'no_file', 'Choose a photo to attach', 'photo');
  await partOfLatest(access, input.partId, 'path');
  type Encoded = { data: Buffer; info: OutputInfo };
  const prepared: { key: string; full: Encoded; thumb: Encoded }[] = [];
  for (const file of input.files) {
    // The name and the browser's type say nothing reliable: the bytes decide.
    const sniffed = await fileTypeFromBuffer(file.buffer);
    if (!sniffed || !ACCEPTED_IMAGES.has(sniffed.mime)) {
      throw new AppError(415, 'not_an_image', `${file.originalname} is not a JPEG, PNG or WebP photo${sniffed ? ` (it is ${sniffed.mime})` : ''}. Nothing was attached.`, 'photo');
    }
    try {
      // rotate() applies the camera's orientation before the metadata (GPS included) is dropped by re-encoding.
      const full = await sharp(file.buffer).rotate().resize(PHOTO_LONG_SIDE_PX, PHOTO_LONG_SIDE_PX, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 85 }).toBuffer({ resolveWithObject: true });
      const thumb = await sharp(full.data).resize(THUMB_SIDE_PX, THUMB_SIDE_PX, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 75 }).toBuffer({ resolveWithObject: true });
      prepared.push({ key: randomUUID(), full, thumb });
    } catch {
      throw new AppError(415, 'bad_image', `${file.originalname} could not be read as an image. Nothing was attached.`, 'photo');
    }
  }
  const written: string[] = [];
  try {
    for (const p of prepared) {
      for (const [key, bytes] of [[`${p.key}.jpg`, p.full.data], [`${p.key}.thumb.jpg`, p.thumb.data]] as const) {
        await storage.put(key, bytes);
        written.push(key);
      }
    }
    const sequelize = BuildPhotoRow.sequelize!;
    const rows = await sequelize.transaction((transaction) =>
      Promise.all(
        prepared.map((p) =>
          BuildPhotoRow.create(
            {
              hullId: access.hullId,
              partId: input.partId,
              stage: input.stage,
              caption: input.caption,
              storageKey: p.key,
              width: p.full.info.width,
              height: p.full.info.height,
              thumbWidth: p.thumb.info.width,
              thumbHeight: p.thumb.info.height,
              uploaderId,
            },
            { transaction },
          ),
        ),
      ),
    );
    const uploader = await User.findByPk(uploaderId, { attributes: ['id', 'displayName'] });
    return rows.map((r) => photoOut(Object.assign(r, { uploader: uploader ?? undefined })));
  } catch (err) {
    await Promise.all(written.map((key) => storage.delete(key).catch(() => undefined)));
    throw err;
  }
}

/** A photo's bytes (full size or thumbnail), only for this hull's crew. */
export async function buildPhotoBytes(access: HullAccess, storage: PhotoStorage, photoId: number, size: 'full' | 'thumb'): Promise<Buffer> {
  const row = await BuildPhotoRow.findOne({ where: { id: photoId, hullId: access.hullId } });
  if (!row) throw notFound('No such photo');
  const bytes = await storage.get(size === 'thumb' ? `${row.storageKey}.thumb.jpg` : `${row.storageKey}.jpg`);
  if (!bytes) throw new AppError(500, 'photo_missing', 'The photo file is missing from storage', undefined, false);
  return bytes;
}

/** Parts whose cut stage is done now (the seam in cut-parts.ts). */
export async function cutPartIds(hullId: number): Promise<Set<string>> {
  const events = await BuildEventRow.findAll({ where: { hullId, stage: 'cut', layerIndex: null }, order: [['id', 'ASC']], attributes: ['partId', 'action'] });
  const last = new Map<string, string>();
  for (const e of events) last.set(e.partId, e.action);
  return new Set([...last].filter(([, action]) => action === 'done').map(([id]) => id));
}
