import { deckLineAt } from './deck';
import { type EdgePoint, edgePointMoved, edgeSkinMm } from './edge';
import type { BuiltHull } from './hull';
import { polylineLinesMeet, polylineLoopsTrim, polylineSegmentsCross, polylineTailHeadCross } from './polyline';
import { type Section, type SectionOptions, type SectionVertex, sectionAt } from './section';

/**
 * The frame's edge: the section set in normal to the hull surface by the skin (its panel's thickness,
 * plus sheathing when the offsets are to the outside of it) and then the fillet clearance. Normal to the
 * surface means, in the station plane, (t + c) / cos(bevel) = (t + c) sqrt(1 + rate^2) along the section's
 * normal (Gougeon 2005, fig. 16-14). Each flattened point is moved along the curve's own normal, so the
 * offset is as true as the section (no polygon offset in the hot path). Corners are mitred: the two
 * offset sides are cut where they cross, or extended along their end tangents until they meet.
 */

/** Default fillet clearance (mm): none. The frame passes the builder's choice (1 to 3 mm is common practice). */
export const FILLET_CLEARANCE_MM = 0;
/** A mitre longer than this many times the set-in is cut square instead (two corner points, no spike). */
export const MITRE_LIMIT = 25;

/** Options of the deduction; every field has a default. */
export interface DeductionOptions {
  /** Gap (mm) left between frame and skin (and deck) for the epoxy fillet, normal to the surface. */
  filletClearanceMm?: number;
  mitreLimit?: number;
}

/** The frame's outline at one station. */
export interface Deduction {
  x: number;
  /** The edge against the skin, keel to sheer corner. */
  hull: EdgePoint[];
  /** The deck's underside from the centreline out to the hull edge; null when the hull has no deck. */
  deck: EdgePoint[] | null;
  /**
   * The closed half outline (starboard, y >= 0): from the centreline at the bottom along the hull edge to
   * the top corner, then along the deck's underside (without a deck: level across at the sheer's height)
   * back to the centreline. The last point is not repeated. `outlineMirrored` gives the whole frame.
   */
  outline: EdgePoint[];
}

/** The frame outline of the section at x (mm), or null where the hull has no section. */
export function deductionAt(hull: BuiltHull, x: number, options: DeductionOptions & SectionOptions = {}): Deduction | null {
  const section = sectionAt(hull, x, options);
  return section ? deductionOf(hull, section, options) : null;
}

/** Set the section in by skin and clearance and close it into the frame's half outline. */
export function deductionOf(hull: BuiltHull, section: Section, options: DeductionOptions = {}): Deduction {
  const clearance = options.filletClearanceMm ?? FILLET_CLEARANCE_MM;
  const mitre = options.mitreLimit ?? MITRE_LIMIT;
  const runs: EdgePoint[][] = [];
  let maxSetIn = 0;
  for (const v of section.vertices) {
    const seg = section.segments[v.segment]!;
    const d = (edgeSkinMm(hull, seg.panel) + clearance) * Math.sqrt(1 + v.rate * v.rate);
    maxSetIn = Math.max(maxSetIn, d);
    const p = edgePointOf(v, d);
    if (!runs[seg.run]) runs[seg.run] = [];
    runs[seg.run]!.push(p);
  }
  const trimmed = runs.map((r) => (maxSetIn > 0 ? trimLoops(r) : r));
  let edge = trimmed[0]!;
  for (let i = 1; i < trimmed.length; i++) edge = joinCorner(edge, trimmed[i]!, mitre * Math.max(maxSetIn, 1e-3));
  edge = startAtCentreline(edge, section);

  const deck = hull.lines.deck ? deckLineAt(hull, section, clearance) : null;
  const outline = closeOutline(edge, deck?.underside ?? null, section.vertices[section.vertices.length - 1]!.z);
  return { x: section.x, hull: edge, deck: deck?.underside ?? null, outline };
}

function edgePointOf(v: SectionVertex, d: number): EdgePoint {
  return { y: v.y - v.ny * d, z: v.z - v.nz * d, ny: v.ny, nz: v.nz, rate: v.rate, bevel: Math.atan(Math.abs(v.rate)), girthMm: v.girthMm, setInMm: d, edge: 'hull', corner: v.corner };
}

function lerpEdge(a: EdgePoint, b: EdgePoint, s: number, corner: boolean): EdgePoint {
  return {
    y: a.y + s * (b.y - a.y),
    z: a.z + s * (b.z - a.z),
    ny: a.ny,
    nz: a.nz,
    rate: a.rate + s * (b.rate - a.rate),
    bevel: Math.atan(Math.abs(a.rate + s * (b.rate - a.rate))),
    girthMm: a.girthMm + s * (b.girthMm - a.girthMm),
    setInMm: a.setInMm + s * (b.setInMm - a.setInMm),
    edge: a.edge,
    corner,
  };
}

/** Cut the swallowtail an inward offset makes where the set-in exceeds the radius of a convex bend. */
function trimLoops(run: EdgePoint[]): EdgePoint[] {
  // A segment runs backward when it points against the curve's direction (-nz, ny) at both its ends (one
  // end alone can disagree where a cut has just joined two sides at an angle).
  const backward = (p: EdgePoint, q: EdgePoint): boolean => {
    const dy = q.y - p.y;
    const dz = q.z - p.z;
    return q.girthMm !== p.girthMm && dy * -p.nz + dz * p.ny < 0 && dy * -q.nz + dz * q.ny < 0;
  };
  let any = false;
  for (let k = 0; k < run.length - 1 && !any; k++) any = backward(run[k]!, run[k + 1]!);
  return any ? polylineLoopsTrim(run, backward, (p, q, s) => lerpEdge(p, q, s, false)) : run;
}

/** Join two offset runs at a knuckle: cut where they cross, else mitre their end tangents. */
function joinCorner(a: EdgePoint[], b: EdgePoint[], mitreMm: number): EdgePoint[] {
  const window = Math.min(256, Math.max(8, Math.min(a.length, b.length)));
  const cross = polylineTailHeadCross(a, b, window);
  if (cross) {
    const ca = lerpEdge(a[cross.i]!, a[cross.i + 1]!, cross.s, true);
    const cb = lerpEdge(b[cross.j]!, b[cross.j + 1]!, cross.u, true);
    cb.y = ca.y;
    cb.z = ca.z;
    return [...a.slice(0, cross.i + 1), ca, cb, ...b.slice(cross.j + 1)];
  }
  const ea = a[a.length - 1]!;
  const sb = b[0]!;
  const meet = polylineLinesMeet(ea, { y: -ea.nz, z: ea.ny }, sb, { y: sb.nz, z: -sb.ny });
  if (meet && meet.s >= 0 && meet.u >= 0 && meet.s <= mitreMm && meet.u <= mitreMm) {
    const y = ea.y - ea.nz * meet.s;
    const z = ea.z + ea.ny * meet.s;
    return [...a.slice(0, -1), edgePointMoved(ea, y, z, true), edgePointMoved(sb, y, z, true), ...b.slice(1)];
  }
  return [...a.slice(0, -1), edgePointMoved(ea, ea.y, ea.z, true), edgePointMoved(sb, sb.y, sb.z, true), ...b.slice(1)];
}

/** Where the section starts on the centreline, make the edge start there too (a V keel's offset crosses it). */
function startAtCentreline(edge: EdgePoint[], section: Section): EdgePoint[] {
  if (!section.startsOnCentreline || edge.length < 2) return edge;
  const first = edge[0]!;
  if (first.y === 0) return edge;
  if (first.y < 0) {
    for (let i = 0; i < edge.length - 1; i++) {
      const p = edge[i]!;
      const q = edge[i + 1]!;
      if (q.y >= 0) {
        const s = p.y === q.y ? 0 : -p.y / (q.y - p.y);
        const c = lerpEdge(p, q, s, first.corner);
        c.y = 0;
        return [c, ...edge.slice(i + 1)];
      }
    }
    return edge;
  }
  // Set in away from the centreline (a section leaving it downward): run back along the end tangent.
  const ty = -first.nz;
  if (Math.abs(ty) < 1e-12) return edge;
  const s = -first.y / ty;
  return [edgePointMoved(first, 0, first.z + first.ny * s, first.corner), ...edge];
}

/**
 * The closed half outline: the hull edge up to where it meets the top line (the deck's underside from the
 * centreline outward; without a deck, the level line through the sheer), then the top line back to the
 * centreline. An edge that stops short of the top line (tumblehome) is carried on along its end tangent.
 */
function closeOutline(edge: EdgePoint[], deck: EdgePoint[] | null, sheerZ: number): EdgePoint[] {
  const out: EdgePoint[] = [];
  const first = edge[0]!;
  if (first.y > 0) out.push(closure(0, first.z, 0));
  let yMax = 0;
  for (const p of edge) yMax = Math.max(yMax, p.y);
  const last = edge[edge.length - 1]!;
  const top = deck && deck.length >= 2 ? deck : [closure(0, sheerZ, last.girthMm), closure(yMax + 100, sheerZ, last.girthMm)];
  const topOut = [...top].reverse();
  for (let j = 0; j < topOut.length - 1; j++) {
    for (let i = edge.length - 2; i >= 0; i--) {
      const hit = polylineSegmentsCross(edge[i]!, edge[i + 1]!, topOut[j]!, topOut[j + 1]!);
      if (hit) return [...out, ...edge.slice(0, i + 1), ...cornerPair(edge[i]!, edge[i + 1]!, hit.s, topOut[j]!, topOut[j + 1]!, hit.u), ...topOut.slice(j + 1)];
    }
  }
  const ty = -last.nz;
  const tz = last.ny;
  for (let j = 0; j < topOut.length - 1; j++) {
    const a = topOut[j]!;
    const b = topOut[j + 1]!;
    const meet = polylineLinesMeet(last, { y: ty, z: tz }, a, { y: b.y - a.y, z: b.z - a.z });
    if (meet && meet.s >= 0 && meet.u >= 0 && meet.u <= 1) {
      const ext = edgePointMoved(last, last.y + ty * meet.s, last.z + tz * meet.s, false);
      return [...out, ...edge, ...cornerPair(last, ext, 1, a, b, meet.u), ...topOut.slice(j + 1)];
    }
  }
  // Nothing meets (a deck line clear of the side): join the two ends straight.
  return [...out, ...edge, edgePointMoved(topOut[0]!, topOut[0]!.y, topOut[0]!.z, true), ...topOut.slice(1)];
}

/** The top corner, once as the end of the hull edge and once as the start of the top line. */
function cornerPair(e0: EdgePoint, e1: EdgePoint, s: number, t0: EdgePoint, t1: EdgePoint, u: number): [EdgePoint, EdgePoint] {
  const ce = lerpEdge(e0, e1, s, true);
  const ct = lerpEdge(t0, t1, u, true);
  ct.y = ce.y;
  ct.z = ce.z;
  return [ce, ct];
}

function closure(y: number, z: number, girthMm: number): EdgePoint {
  return { y, z, ny: 0, nz: 0, rate: 0, bevel: 0, girthMm, setInMm: 0, edge: 'closure', corner: true };
}

/**
 * The whole frame from a half outline: port side (y negated, normals mirrored) in reverse, then the
 * starboard side, as one closed polygon (the last point not repeated). Points on the centreline are
 * not doubled.
 */
export function outlineMirrored(half: readonly EdgePoint[]): EdgePoint[] {
  const port = half
    .filter((p) => p.y > 0)
    .map((p) => ({ ...p, y: -p.y, ny: -p.ny }))
    .reverse();
  return [...half, ...port];
}
