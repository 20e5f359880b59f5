import type { PartResultSummary, PartsResponse } from '../../shared/api/parts';
import { framesOfPlan } from '../../shared/geometry/frame';
import type { PartResult, PlanFrames } from '../../shared/geometry/frame-types';
import type { Plan } from '../../shared/geometry/plan-schema';
import { notFound } from '../errors';
import { planResponseJson } from './plans';

/**
 * Parts computed on the server from a stored revision with shared/geometry. A revision never changes, so
 * its parts are computed once and kept by revision id (bounded, oldest out first).
 */
const MAX_ENTRIES = 64;
const framesByRevision = new Map<number, { plan: Plan; frames: PlanFrames }>();

/** The plan of a revision (null: the hull's empty plan) and every part of it. */
export async function partsOfRevision(hullId: number, revisionId: number | null, units: 'mm' | 'ftin'): Promise<{ plan: Plan; frames: PlanFrames }> {
  const hit = revisionId === null ? undefined : framesByRevision.get(revisionId);
  if (hit) return hit;
  const plan = JSON.parse(await planResponseJson(hullId, revisionId, units)).plan as Plan;
  const entry = { plan, frames: framesOfPlan(plan) };
  if (revisionId !== null) {
    framesByRevision.set(revisionId, entry);
    if (framesByRevision.size > MAX_ENTRIES) framesByRevision.delete(framesByRevision.keys().next().value!);
  }
  return entry;
}

/** What the Frames screen shows beside a part's form. */
export function partSummaryOf(result: PartResult, plan: Plan): PartResultSummary {
  const stated = plan.parts.parts.find((p) => p.id === result.partId);
  const stationId = stated && 'stationId' in stated ? stated.stationId : null;
  const stationName = plan.lines.stations.find((s) => s.id === stationId)?.name ?? null;
  if (!result.ok) {
    return {
      partId: result.partId,
      name: result.name,
      kind: result.kind,
      stationName,
      ok: false,
      issues: result.issues.map((i) => ({ code: i.code, message: i.message, field: i.path.join('.') || undefined })),
      warnings: [],
      layers: [],
      massKg: null,
      bevelRangeDeg: null,
    };
  }
  const part = result.part;
  const tilts = part.bevelMarks.map((m) => m.bevelDeg as number);
  return {
    partId: part.partId,
    name: part.name,
    kind: part.kind,
    stationName: part.stationName,
    ok: true,
    issues: [],
    warnings: part.warnings.map((w) => ({ code: w.code, message: w.message })),
    layers: part.layers.map((layer) => {
      const figures = part.estimate.layers.find((e) => e.index === layer.index);
      return { index: layer.index, thicknessMm: layer.thicknessMm, areaMm2: figures?.areaMm2 ?? 0, perimeterMm: figures?.perimeterMm ?? 0, pieces: layer.pieces.pieces.length };
    }),
    massKg: part.estimate.massKg,
    bevelRangeDeg: tilts.length ? [Math.min(...tilts), Math.max(...tilts)] : null,
  };
}

/** GET /api/hulls/:hullId/parts for the latest revision (or a given one). */
export async function partsSummary(hullId: number, revisionId: number | null, units: 'mm' | 'ftin'): Promise<PartsResponse & { hullIssues: string[] }> {
  const { plan, frames } = await partsOfRevision(hullId, revisionId, units);
  return {
    revisionId,
    results: frames.parts.map((r) => partSummaryOf(r, plan)),
    hullIssues: [...frames.hullIssues, ...frames.planIssues].map((i) => i.message),
  };
}

/** One part's full geometry, as the editor and the exports use it. */
export async function partResult(hullId: number, revisionId: number | null, units: 'mm' | 'ftin', partId: string): Promise<PartResult> {
  const { frames } = await partsOfRevision(hullId, revisionId, units);
  const found = frames.parts.find((p) => p.partId === partId);
  if (!found) throw notFound('No such part in this revision');
  return found;
}

