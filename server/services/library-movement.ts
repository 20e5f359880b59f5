import type { CamberDrawing, LibraryDocument, LibraryKind, LinesDrawing, PartMovement } from '../../shared/api/library';
import type { Camber } from '../../shared/geometry/camber-schema';
import { camberHeightAt, camberReferenceHalfBeamMm } from '../../shared/geometry/camber';
import { deckLineAt } from '../../shared/geometry/deck';
import type { HullLines } from '../../shared/geometry/hull-schema';
import { hullCheck, type BuiltHull } from '../../shared/geometry/hull';
import { sectionAt } from '../../shared/geometry/section';
import type { Plan } from '../../shared/geometry/plan-schema';
import type { Part } from '../../shared/geometry/part-schema';
import { framesOfPlan } from '../../shared/geometry/frame';
import type { PartResult, PlanFrames } from '../../shared/geometry/frame-types';
import { CHORD_TOLERANCE_MM } from '../../shared/geometry/types';

/**
 * How far each part of a hull moves between two plans that differ by a Library camber or lines.
 *
 * The measure is the part itself: `framesOfPlan` (shared/geometry/frame.ts) works out every part in both
 * plans, and the figure is the largest distance between the two outlines of its marked face (outer edge,
 * deck edge and the edges of its holes, either way round: the Hausdorff distance of the loops), with
 * where on the template it is. A part that cannot be worked out in one of the plans falls back to the
 * hull geometry at its station:
 * - for a camber change, the largest change of the deck line's height (deckLineAt) across the beam;
 * - for a lines change, the largest distance between the hull sections (sectionAt, outside of skin).
 */

/** Deck-line samples per half-beam when comparing two decks (plus both lines' own sample points). */
const DECK_SAMPLES = 64;
/**
 * Chord tolerance (mm) of the deck lines compared. One line is read between its own points where the
 * other has a point, so the figure can be out by up to this much; far finer than the default.
 */
export const DECK_COMPARE_TOLERANCE_MM = 0.001;

/** Parts whose outline the deck never shapes. */
function stopsBelowDeck(part: Part): string | null {
  if (part.kind === 'floor') return 'a floor stops below the deck: the camber does not shape it';
  if (part.kind === 'ring-frame' && part.top === 'open') return 'open at the top: the camber does not shape it';
  return null;
}

function built(lines: HullLines): BuiltHull | null {
  const result = hullCheck(lines);
  return result.ok ? result.hull : null;
}

/** z at y along a polyline sorted by y (linear between its points, which are within the chord tolerance). */
function zAt(points: readonly { y: number; z: number }[], y: number): number {
  let i = 1;
  while (i < points.length - 1 && points[i]!.y < y) i++;
  const a = points[i - 1]!;
  const b = points[i]!;
  const t = b.y === a.y ? 0 : (y - a.y) / (b.y - a.y);
  return a.z + t * (b.z - a.z);
}

function deckMove(a: BuiltHull, b: BuiltHull, xa: number, xb: number): { moveMm: number; atY: number; atZ: number } | null {
  const sa = sectionAt(a, xa);
  const sb = sectionAt(b, xb);
  const da = sa && deckLineAt(a, sa, 0, DECK_COMPARE_TOLERANCE_MM);
  const db = sb && deckLineAt(b, sb, 0, DECK_COMPARE_TOLERANCE_MM);
  if (!da || !db) return null;
  const reach = Math.min(da.halfBeamMm, db.halfBeamMm);
  const ys = new Set<number>();
  for (let k = 0; k <= DECK_SAMPLES; k++) ys.add((reach * k) / DECK_SAMPLES);
  for (const p of [...da.top, ...db.top]) if (p.y <= reach) ys.add(p.y);
  const moves = [...ys].sort((p, q) => p - q).map((y) => ({ y, d: Math.abs(zAt(db.top, y) - zAt(da.top, y)) }));
  const moveMm = Math.max(...moves.map((m) => m.d));
  // Where: the first place (from the centreline out) within the reading's own uncertainty of the largest.
  const atY = moves.find((m) => m.d >= moveMm - 2 * DECK_COMPARE_TOLERANCE_MM)!.y;
  return { moveMm, atY, atZ: zAt(db.top, atY) };
}

function segmentDistance(p: { y: number; z: number }, a: { y: number; z: number }, b: { y: number; z: number }): number {
  const dy = b.y - a.y;
  const dz = b.z - a.z;
  const len2 = dy * dy + dz * dz;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.y - a.y) * dy + (p.z - a.z) * dz) / len2));
  return Math.hypot(p.y - (a.y + t * dy), p.z - (a.z + t * dz));
}

type Pt = { y: number; z: number };

/** The point of `from` farthest from the polylines `to` (each closed when `closed`), and that distance. */
function farthest(from: readonly Pt[], to: readonly (readonly Pt[])[], closed: boolean, tolerance: number): { moveMm: number; atY: number; atZ: number } {
  const distances = from.map((p) => {
    let d = Infinity;
    for (const line of to) {
      const n = line.length;
      if (n === 1) d = Math.min(d, Math.hypot(p.y - line[0]!.y, p.z - line[0]!.z));
      for (let i = 1; i < n + (closed && n > 2 ? 1 : 0); i++) d = Math.min(d, segmentDistance(p, line[i - 1]!, line[i % n]!));
    }
    return { p, d };
  });
  const moveMm = Math.max(0, ...distances.map((x) => x.d));
  // Where: of the points within the outlines' own uncertainty of the largest, the one nearest the centreline.
  const near = distances.filter((x) => x.d >= moveMm - 2 * tolerance).sort((a, b) => Math.abs(a.p.y) - Math.abs(b.p.y))[0];
  return { moveMm, atY: near?.p.y ?? 0, atZ: near?.p.z ?? 0 };
}

/** The larger of the two one-way distances: how far the outline moved, either way round. */
function hausdorff(a: readonly (readonly Pt[])[], b: readonly (readonly Pt[])[], closed: boolean, tolerance: number) {
  const one = farthest(a.flat(), b, closed, tolerance);
  const two = farthest(b.flat(), a, closed, tolerance);
  return one.moveMm >= two.moveMm ? one : two;
}

/** Every loop of the marked face's outline (layer 0, near face): outer edges and holes. */
function outlineLoops(result: PartResult | undefined): Pt[][] | null {
  if (!result?.ok) return null;
  const layer = result.part.layers[0];
  if (!layer) return null;
  return layer.regions.flatMap((r) => [r.outer, ...r.holes]);
}

function sectionMove(a: BuiltHull, b: BuiltHull, xa: number, xb: number): { moveMm: number; atY: number; atZ: number } | null {
  const sa = sectionAt(a, xa);
  const sb = sectionAt(b, xb);
  if (!sa || !sb) return null;
  return hausdorff([sa.vertices], [sb.vertices], false, sa.chordToleranceMm);
}

/** The part's station x in a plan, or its own x for a hand-measured frame; null when the station is gone. */
function stationOf(plan: Plan, part: Part): { name: string | null; x: number } | null {
  if (part.kind === 'measured-frame') return { name: null, x: part.x };
  const st = plan.lines.stations.find((s) => s.id === part.stationId);
  return st ? { name: st.name, x: st.x } : null;
}

/** Already worked-out parts of either plan (the Frames screen's cache of a stored revision), to spare the work. */
export interface KnownFrames {
  before?: PlanFrames;
  after?: PlanFrames;
}

/** Movement of every part of `after` (the plan as it would be) against `before` (the hull now). */
export function movementOf(before: Plan, after: Plan, kind: LibraryKind, cut: ReadonlySet<string>, known: KnownFrames = {}): PartMovement[] {
  const framesBefore = known.before ?? framesOfPlan(before);
  const framesAfter = known.after ?? framesOfPlan(after);
  const a = built(before.lines);
  const b = built(after.lines);
  return after.parts.parts.map((part) => {
    const here = stationOf(after, part);
    const there = stationOf(before, part) ?? here;
    const base = { partId: part.id, partName: part.name, partKind: part.kind, stationName: here?.name ?? null, x: here?.x ?? null, cut: cut.has(part.id) };
    const none = (note: string) => ({ ...base, moveMm: null, atY: null, atZ: null, note });
    const loopsA = outlineLoops(framesBefore.parts.find((r) => r.partId === part.id));
    const loopsB = outlineLoops(framesAfter.parts.find((r) => r.partId === part.id));
    if (loopsA && loopsB) return { ...base, ...hausdorff(loopsA, loopsB, true, CHORD_TOLERANCE_MM), note: 'outline of the marked face' };

    // The part cannot be worked out in one of the plans: measure the hull at its station instead.
    if (!here || !there) return none('its station is not in the lines');
    if (!a || !b) return none('the lines do not build a hull, so the movement cannot be worked out');
    if (part.kind === 'measured-frame' && kind === 'lines') return none('measured off the hull: the lines do not shape it');
    if (kind === 'camber') {
      const below = stopsBelowDeck(part);
      if (below) return { ...base, moveMm: 0, atY: null, atZ: null, note: below };
      const m = deckMove(a, b, there.x, here.x);
      return m ? { ...base, ...m, note: 'deck line at the station, as the part itself could not be worked out' } : none('no deck line at this station');
    }
    const m = sectionMove(a, b, there.x, here.x);
    return m ? { ...base, ...m, note: 'hull section at the station, as the part itself could not be worked out' } : none('the hull has no section at this station');
  });
}

const STEPS = 40;

function camberCurve(camber: Camber, halfBeam: number): { y: number; z: number }[] {
  try {
    return Array.from({ length: 2 * STEPS + 1 }, (_, k) => {
      const y = (halfBeam * (k - STEPS)) / STEPS;
      return { y, z: camberHeightAt(camber, y, halfBeam, halfBeam) };
    });
  } catch {
    return [];
  }
}

/** The two camber patterns over one half-beam: the pattern's own for a rise crown, else the hull's widest. */
export function camberDrawing(from: Camber, to: Camber, hullLines: HullLines): CamberDrawing {
  const widest = built(hullLines)?.maxSheerHalfBeamMm ?? 1000;
  const half = (c: Camber) => {
    try {
      return camberReferenceHalfBeamMm(c, widest);
    } catch {
      return widest;
    }
  };
  const halfBeamMm = Math.max(half(from), half(to));
  return { kind: 'camber', halfBeamMm, before: camberCurve(from, half(from)), after: camberCurve(to, half(to)) };
}

function bodyPlan(lines: HullLines): Map<string, { name: string; x: number; points: { y: number; z: number }[] | null }> {
  const hull = built(lines);
  const out = new Map<string, { name: string; x: number; points: { y: number; z: number }[] | null }>();
  for (const st of [...lines.stations].sort((p, q) => p.x - q.x)) {
    const section = hull ? sectionAt(hull, st.x) : null;
    const v = section?.vertices ?? null;
    // A body plan on screen needs no more than about a hundred points a section.
    const stride = v ? Math.max(1, Math.ceil(v.length / 100)) : 1;
    const points = v ? v.filter((_, i) => i % stride === 0 || i === v.length - 1).map((p) => ({ y: p.y, z: p.z })) : null;
    out.set(st.id, { name: st.name, x: st.x, points });
  }
  return out;
}

/** The two body plans, station by station (a station only one of them has is drawn on its side only). */
export function linesDrawing(from: HullLines, to: HullLines): LinesDrawing {
  const a = bodyPlan(from);
  const b = bodyPlan(to);
  const ids = [...new Set([...a.keys(), ...b.keys()])];
  const stations = ids.map((id) => {
    const p = a.get(id);
    const q = b.get(id);
    return { name: (q ?? p)!.name, x: (q ?? p)!.x, before: p?.points ?? null, after: q?.points ?? null };
  });
  return { kind: 'lines', stations: stations.sort((s, t) => s.x - t.x) };
}

/** The part of a plan a Library document stands for, to tell whether the hull still has it exactly. */
export function pinnedPartOf(plan: Plan, kind: LibraryKind): unknown {
  if (kind === 'camber') return plan.lines.deck?.camber ?? null;
  return { stations: plan.lines.stations, lines: plan.lines.lines, xDirection: plan.lines.xDirection, designWaterlineZ: plan.lines.designWaterlineZ };
}

/** The same, of the document itself. */
export function documentPart(doc: LibraryDocument, kind: LibraryKind): unknown {
  if (kind === 'camber') return doc;
  const lines = doc as HullLines;
  return { stations: lines.stations, lines: lines.lines, xDirection: lines.xDirection, designWaterlineZ: lines.designWaterlineZ };
}
