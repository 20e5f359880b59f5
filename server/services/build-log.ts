import {
  buildStages,
  DEFAULT_MOVE_TOLERANCE_MM,
  layerStages,
  type BevelRow,
  type BuildBoardResponse,
  type BuildEvent,
  type BuildFlag,
  type BuildLayerState,
  type BuildPartResponse,
  type BuildPartState,
  type BuildStage,
  type MaterialFigures,
} from '../../shared/api/build-log';
import type { PartGeometry, PlanFrames } from '../../shared/geometry/frame-types';
import type { Plan } from '../../shared/geometry/plan-schema';
import { polylineDistance, type Loop } from '../../shared/geometry/polygon';
import { AppError } from '../errors';
import type { HullAccess } from '../http/hull-access';
import { BuildEventRow, BuildPhotoRow, BuildSetting, User } from '../models';
import { photoOut, type PhotoWithUploader } from './build-log-photos';
import { partsOfRevision } from './parts';

/** A full sheet of plywood, 1220 x 2440 mm (4 x 8 ft): how the cut list's face area becomes sheets to buy. */
const SHEET_AREA_MM2 = 1220 * 2440;

type EventWithAuthor = BuildEventRow & { author?: User };

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

/**
 * How far (mm) one layer's outline (layer 0: the marked face) moved from one revision to another; null
 * when either cannot be built or has no such layer. Each layer is measured on its own because each was
 * cut to its own outline (the layers of a frame on a changing section differ).
 */
export async function partMovedMm(access: HullAccess, partId: string, fromRevisionId: number, toRevisionId: number, layerIndex = 0): Promise<number | null> {
  const key = `${fromRevisionId}:${toRevisionId}:${partId}:${layerIndex}`;
  if (movedCache.has(key)) return movedCache.get(key)!;
  const [from, to] = await Promise.all([partsOfRevision(access.hullId, fromRevisionId, access.units), partsOfRevision(access.hullId, toRevisionId, access.units)]);
  const a = geometryOf(from.frames, partId)?.layers[layerIndex]?.regions[0]?.outer;
  const b = geometryOf(to.frames, partId)?.layers[layerIndex]?.regions[0]?.outer;
  const moved = a && b ? outlineDistance(a, b) : null;
  if (movedCache.size > 2000) movedCache.clear();
  movedCache.set(key, moved);
  return moved;
}

/** The layers of a part as the plan states them (also for a part that cannot be built), at least one. */
function layersOfPlan(plan: Plan, partId: string): { thicknessMm: number }[] {
  const stated = plan.parts.parts.find((p) => p.id === partId);
  return stated && stated.layers.length > 0 ? stated.layers : [{ thicknessMm: stated?.thicknessMm ?? 0 }];
}

/**
 * The event that says whether `stage` is done now for one layer (a reopen undoes it): the last one for that
 * layer or for the part as a whole. Whole-part events count for every layer, so a part marked cut as a
 * whole and laminated from more layers in a later revision still reads as cut, layer by layer.
 */
function lastEventOf(events: readonly BuildEventRow[], stage: BuildStage, layerIndex: number | null): BuildEventRow | undefined {
  for (let i = events.length - 1; i >= 0; i--) {
    const e = events[i]!;
    if (e.stage === stage && (e.layerIndex === null || e.layerIndex === layerIndex)) return e;
  }
  return undefined;
}

const isLayerStage = (stage: BuildStage) => layerStages.includes(stage);

/** Where a stage is marked: a layer stage of a single-layer part is layer 0's; the later stages are the whole part's. */
function slotOf(stage: BuildStage, layerIndex: number | null): number | null {
  return isLayerStage(stage) ? (layerIndex ?? 0) : null;
}

async function flagOf(access: HullAccess, partId: string, cutRevisionId: number | null, layerIndex: number, tolerance: number, laminated: boolean): Promise<BuildFlag | null> {
  const latest = access.latestRevisionId;
  if (cutRevisionId === null || latest === null || cutRevisionId === latest) return null;
  const moved = await partMovedMm(access, partId, cutRevisionId, latest, layerIndex);
  if (moved === null || moved <= tolerance) return null;
  return { movedMm: Math.round(moved * 10) / 10, cutRevisionId, latestRevisionId: latest, layerIndex: laminated ? layerIndex : null };
}

async function partState(access: HullAccess, plan: Plan, partId: string, name: string, events: readonly BuildEventRow[], photos: number, tolerance: number): Promise<BuildPartState> {
  const stated = layersOfPlan(plan, partId);
  const laminated = stated.length > 1;
  const layers: BuildLayerState[] = await Promise.all(
    stated.map(async (layer, index) => {
      const done = layerStages.filter((s) => lastEventOf(events, s, index)?.action === 'done');
      const cut = lastEventOf(events, 'cut', index);
      const cutRevisionId = cut?.action === 'done' ? cut.revisionId : null;
      return {
        index,
        thicknessMm: layer.thicknessMm,
        done,
        next: layerStages.find((s) => !done.includes(s)) ?? null,
        cutRevisionId,
        flag: await flagOf(access, partId, cutRevisionId, index, tolerance, laminated),
      };
    }),
  );
  const done = buildStages.filter((s) => (isLayerStage(s) ? layers.every((l) => l.done.includes(s)) : lastEventOf(events, s, null)?.action === 'done'));
  const cutFrom = layers.map((l) => l.cutRevisionId).filter((id): id is number => id !== null);
  const flags = layers.map((l) => l.flag).filter((f): f is BuildFlag => f !== null);
  return {
    partId,
    name,
    done,
    next: buildStages.find((s) => !done.includes(s)) ?? null,
    // Revision ids only grow, so the smallest is the oldest a layer was cut from.
    cutRevisionId: cutFrom.length > 0 ? Math.min(...cutFrom) : null,
    flag: flags.reduce<BuildFlag | null>((worst, f) => (worst === null || f.movedMm > worst.movedMm ? f : worst), null),
    photos,
    layers: laminated ? layers : [],
  };
}

function nameOf(frames: PlanFrames, partId: string): string {
  const r = frames.parts.find((p) => p.partId === partId);
  if (!r) return partId;
  return r.ok ? r.part.name : r.name;
}

/**
 * Every part of the latest revision with its stages, flags, and the material used against the estimate.
 * A part taken out of the plan keeps its events and photos (restoring an older revision brings it back
 * with its log); the board shows only the parts the latest revision has.
 */
export async function buildBoard(access: HullAccess): Promise<BuildBoardResponse> {
  const [{ plan, frames }, events, photos, tolerance] = await Promise.all([
    partsOfRevision(access.hullId, access.latestRevisionId, access.units),
    BuildEventRow.findAll({ where: { hullId: access.hullId }, order: [['id', 'ASC']] }),
    BuildPhotoRow.findAll({ where: { hullId: access.hullId }, attributes: ['id', 'partId'] }),
    moveToleranceOf(access.hullId),
  ]);
  const parts = await Promise.all(
    frames.parts.map((r) =>
      partState(
        access,
        plan,
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
  return { latestRevisionId: access.latestRevisionId, moveToleranceMm: tolerance, notation: plan.lines.notation, parts, material: { estimate, used } };
}

/** A part of the latest revision, or a 400 naming the field (the log only follows parts the plan has). */
async function partOfLatest(access: HullAccess, partId: string, field = 'partId') {
  const { plan, frames } = await partsOfRevision(access.hullId, access.latestRevisionId, access.units);
  const result = frames.parts.find((p) => p.partId === partId);
  if (!result) throw new AppError(field === 'partId' ? 400 : 404, field === 'partId' ? 'no_such_part' : 'not_found', `The plan has no part ${partId}`, field === 'partId' ? 'partId' : undefined);
  return { plan, frames, result };
}

export interface BuildEventRequest {
  partId: string;
  layerIndex: number | null;
  stage: BuildStage;
  action: 'done' | 'reopened';
  note: string;
  used: { plySheets?: number; epoxyMl?: number; fillerMl?: number; tapeM?: number };
}

/** A 400 naming `layerIndex` when the layer given does not fit the stage and the part (see `layerStages`). */
function layerChecked(name: string, layerCount: number, stage: BuildStage, layerIndex: number | null): void {
  const refuse = (code: string, message: string) => {
    throw new AppError(400, code, message, 'layerIndex');
  };
  if (layerIndex !== null && !isLayerStage(stage)) refuse('whole_part_stage', `${stage} is marked for ${name} as a whole, not layer by layer (found layer ${layerIndex + 1}); leave the layer out`);
  if (layerIndex !== null && layerCount === 1) refuse('single_layer', `${name} is a single layer: mark ${stage} for the part as a whole (found layer ${layerIndex + 1}); leave the layer out`);
  if (layerIndex !== null && layerIndex >= layerCount) refuse('no_such_layer', `${name} has ${layerCount} layers; layer ${layerIndex + 1} does not exist`);
  if (layerIndex === null && layerCount > 1 && isLayerStage(stage)) refuse('layer_needed', `${name} is laminated from ${layerCount} layers: mark ${stage} for one layer at a time (layer 1 to ${layerCount})`);
}

/** Mark a stage done or reopen it: always a new row, with who, when and the revision the plan was at. */
export async function buildEventAdd(access: HullAccess, authorId: number, input: BuildEventRequest): Promise<BuildEvent> {
  const { plan, frames } = await partOfLatest(access, input.partId);
  layerChecked(nameOf(frames, input.partId), layersOfPlan(plan, input.partId).length, input.stage, input.layerIndex);
  const events = await BuildEventRow.findAll({ where: { hullId: access.hullId, partId: input.partId, stage: input.stage }, order: [['id', 'ASC']] });
  const isDone = lastEventOf(events, input.stage, slotOf(input.stage, input.layerIndex))?.action === 'done';
  const what = input.layerIndex === null ? 'this part' : `layer ${input.layerIndex + 1} of this part`;
  if (input.action === 'done' && isDone) throw new AppError(409, 'already_done', `${input.stage} is already marked done for ${what}`, 'stage');
  if (input.action === 'reopened' && !isDone) throw new AppError(409, 'not_done', `${input.stage} is not marked done for ${what}, so there is nothing to reopen`, 'stage');
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
  const { plan, frames, result } = await partOfLatest(access, partId, 'path');
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
    state: await partState(access, plan, partId, nameOf(frames, partId), events, photos.length, tolerance),
    events: events.map((e) => eventOut(e as EventWithAuthor)),
    photos: photos.map((p) => photoOut(p as PhotoWithUploader)),
    bevels,
  };
}

/** Parts with wood cut now: the part, or any one of its layers, marked cut and not reopened (the seam in cut-parts.ts). */
export async function cutPartIds(hullId: number): Promise<Set<string>> {
  const events = await BuildEventRow.findAll({ where: { hullId, stage: 'cut' }, order: [['id', 'ASC']], attributes: ['partId', 'layerIndex', 'action'] });
  const last = new Map<string, string>();
  for (const e of events) {
    // A whole-part event stands for every layer: it replaces what the layers said before it.
    if (e.layerIndex === null) for (const key of last.keys()) if (key.startsWith(`${e.partId}\u0000`)) last.delete(key);
    last.set(`${e.partId}\u0000${e.layerIndex ?? 'all'}`, e.action);
  }
  return new Set([...last].filter(([, action]) => action === 'done').map(([key]) => key.split('\u0000')[0]!));
}
