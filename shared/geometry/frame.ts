import { estimateHull } from './estimate';
import { type PartContext, type PartFaces, partOfFaces } from './frame-faces';
import { measuredFaces } from './frame-measured';
import { stationFaces } from './frame-station';
import type { PartGeometry, PartResult, PlanFrames } from './frame-types';
import { type BuiltHull, hullCheck } from './hull';
import type { Station } from './hull-schema';
import { type Longitudinal, type Part, type PartIssue, partIssues, partsIssues } from './part-schema';
import type { Plan } from './plan-schema';
import { transomFaces } from './transom';
import { CHORD_TOLERANCE_MM, GeometryInputError, type GeometryIssue } from './types';

/**
 * Every transverse part cut from the hull, as plain data for the editor and the exports: `frameOfPart` for
 * one part (what the editor calls on every drag), `framesOfPlan` for a whole plan (a result per part: a part
 * that cannot be built returns its issues, the others still build).
 *
 * The stages: the part's faces (a station part at its station's x and at x plus or minus each layer's
 * depth, frame-station.ts; a raked transom expanded, transom.ts; a hand-measured frame from its readings,
 * frame-measured.ts), then what every kind shares (frame-faces.ts): holes and notches cut, layers and their
 * pieces, bevel and template marks, the check dimension and the estimate. Output types: frame-types.ts.
 */

/** Options of `frameOfPart` and `framesOfPlan`. */
export interface FrameOptions {
  /** Largest distance (mm) between a curve and its flattened polyline (sections, arcs, holes). */
  chordToleranceMm?: number;
}

const label = (p: { id: string; name: string }): string => `part "${p.name}" (${p.id})`;

/** A geometry issue as a part's issue: the part named first in the message, its id and the field's path. */
function partIssueOf(part: Part, issue: GeometryIssue): PartIssue {
  const field = issue.field ?? '';
  const path = field === '' ? [] : field.split('.').map((k) => (/^\d+$/.test(k) ? Number(k) : k));
  const stationId = 'stationId' in part ? part.stationId : undefined;
  const message = issue.message.startsWith('part "') ? issue.message : `${label(part)}: ${issue.message}`;
  // Object.assign, not a spread that adds keys: V8 takes its slow path there, several microseconds an issue.
  const out: PartIssue = Object.assign({}, issue, { message, partId: part.id, path });
  if (stationId !== undefined && issue.stationId === undefined) out.stationId = stationId;
  return out;
}

/** The thinnest skin (mm) the hull's parts are bonded to, or null when none is given. */
function skinThicknessOf(hull: BuiltHull): number | null {
  const skin = hull.lines.skin;
  const all = [skin.defaultThicknessMm, ...skin.panels.map((p) => p.thicknessMm)].filter((t) => t > 0);
  return all.length === 0 ? null : Math.min(...all);
}

/**
 * One part worked out on a built hull. `longitudinals` are the hull's (the part notches those it lists, or
 * all that run through its x). Never throws: a part that cannot be built comes back with `ok: false` and
 * issues naming the part, the field and the value (code `part-geometry-failed` for a fault of the geometry
 * itself rather than of the input).
 */
export function frameOfPart(hull: BuiltHull, part: Part, longitudinals: readonly Longitudinal[] = [], options: FrameOptions = {}): PartResult {
  const tol = options.chordToleranceMm ?? CHORD_TOLERANCE_MM;
  const failed = (issues: PartIssue[]): PartResult => ({ ok: false, partId: part.id, name: part.name, kind: part.kind, issues });
  const own = partIssues(part);
  if (own.length > 0) return failed(own);
  let station: Station | null = null;
  if ('stationId' in part) {
    station = hull.stations.find((s) => s.id === part.stationId) ?? null;
    if (station === null) {
      return failed([{ code: 'part-station', message: `${label(part)}: station "${part.stationId}" is not a station of the hull`, partId: part.id, stationId: part.stationId, field: 'stationId', path: ['stationId'], value: part.stationId }]);
    }
  }
  const warnings: PartIssue[] = [];
  for (const id of part.longitudinalIds ?? []) {
    if (!longitudinals.some((l) => l.id === id)) warnings.push({ code: 'part-longitudinal', message: `${label(part)}: longitudinal "${id}" does not exist, so it is not notched`, partId: part.id, longitudinalId: id, field: 'longitudinalIds', path: ['longitudinalIds'], value: id });
  }
  try {
    let faces: PartFaces;
    if (part.kind === 'transom') faces = transomFaces(hull, part, station!, tol);
    else if (part.kind === 'measured-frame') faces = measuredFaces(hull, part, longitudinals);
    else faces = stationFaces(hull, part, station!, longitudinals, tol);
    const ctx: PartContext = { stationName: station?.name ?? null, designWaterlineZ: hull.lines.designWaterlineZ, skinThicknessMm: skinThicknessOf(hull), chordToleranceMm: tol };
    const geometry: PartGeometry = partOfFaces(part, faces, ctx);
    geometry.warnings = [...warnings, ...geometry.warnings.map((w) => partIssueOf(part, w)), ...geometry.estimate.issues.map((i) => partIssueOf(part, i))];
    return { ok: true, partId: part.id, part: geometry };
  } catch (e) {
    if (e instanceof GeometryInputError) return failed(e.issues.map((i) => partIssueOf(part, i)));
    // Not bad input but a fault of ours: reported on the part (the editor and the other parts go on), never hidden.
    const what = e instanceof Error ? e.message : String(e);
    return failed([{ code: 'part-geometry-failed', message: `${label(part)}: the part could not be worked out (${what}); please report it with the plan`, partId: part.id, field: '', path: [], value: null }]);
  }
}

/**
 * Every part of a plan: the hull built once, each part by `frameOfPart`, and the hull's totals over the parts
 * that were built. When the lines themselves have issues, no part is built and each part fails with a
 * pointer to them.
 */
export function framesOfPlan(plan: Plan, options: FrameOptions = {}): PlanFrames {
  const parts = plan.parts.parts;
  const built = hullCheck(plan.lines);
  if (!built.ok) {
    const hullIssues: PartIssue[] = built.issues.map((i) => ({ ...i, path: (i.field ?? '').split('.').filter((k) => k !== '') }));
    const results: PartResult[] = parts.map((p) => ({
      ok: false,
      partId: p.id,
      name: p.name,
      kind: p.kind,
      issues: [{ code: 'hull-invalid', message: `${label(p)}: the hull's lines have ${hullIssues.length} issue${hullIssues.length === 1 ? '' : 's'} to fix first (${hullIssues[0]?.message ?? ''})`, partId: p.id, field: 'lines', path: ['lines'], value: hullIssues.length }],
    }));
    return { hullIssues, planIssues: [], parts: results, estimate: estimateHull([]) };
  }
  const hull = built.hull;
  const planIssues = partsIssues(plan.parts, plan.lines);
  const results = parts.map((p) => frameOfPart(hull, p, plan.parts.longitudinals, options));
  const estimate = estimateHull(results.flatMap((r) => (r.ok ? [r.part.estimate] : [])));
  return { hullIssues: [], planIssues, parts: results, estimate };
}
