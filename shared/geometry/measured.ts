import type { Measurement, MeasuredFrame } from './part-schema';
import { polygonIsSimple, polygonSignedArea, polygonArea, polylineDistance, polylineLength } from './polygon';
import { GeometryInputError, POINT_TOLERANCE_MM, type SectionPoint } from './types';

/**
 * A frame measured by hand on a standing hull, turned into outlines in its section plane (mm): the edge
 * as measured (or one side mirrored), the other face from the bevel readings, and each layer's faces.
 *
 * Bevel convention (precise): a reading r is the angle a sliding bevel shows between the measured face
 * (going into the wood) and the edge. The signed bevel is b = r - 90 deg: negative for an under bevel
 * (r < 90, the edge leans in, so the face away from the measured one is smaller), positive for a standing
 * bevel (r > 90, the far face is larger). At a depth d from the measured face the edge point lies d*tan(b)
 * along the outward normal of the edge: inward for under, outward for standing. Wood removed across a
 * frame of siding s is s*tan(|b|) (REFERENCES.md, "Bevels and skin deduction").
 */

/** A point of the edge: section-plane position (mm) and signed bevel (rad; + standing, - under; null: none read). */
export interface MeasuredPoint {
  y: number;
  z: number;
  bevelRad: number | null;
}

/** How far port and starboard differ at one girth of the kept side: distance (mm) to the other side mirrored. */
export interface MeasuredAsymmetry {
  girthMm: number;
  differenceMm: number;
}

/** One layer's two faces; depths are from the measured face, `near` the face nearer to it. */
export interface MeasuredLayerOutline {
  index: number;
  thicknessMm: number;
  nearDepthMm: number;
  farDepthMm: number;
  near: SectionPoint[];
  far: SectionPoint[];
  /** The larger face, the one the layer is marked and cut to (its bevels are then all under or square). */
  cutTo: 'near' | 'far';
}

/** A measured frame worked out: see `measuredFrameOutline`. */
export interface MeasuredOutline {
  /** The edge from the port end to the starboard end (counter-clockwise), bevels filled in along the girth. */
  edge: MeasuredPoint[];
  /** The measured face: the edge closed by a straight line between its ends, counter-clockwise. */
  outline: SectionPoint[];
  /** The face at the frame's thickness from the measured face. */
  otherFace: SectionPoint[];
  /** The face the layers are stacked from (`auto`: the larger of the two faces). */
  markedFace: 'forward' | 'aft';
  /** Per girth of the kept side, when one side was mirrored and both had been measured; else null. */
  asymmetry: MeasuredAsymmetry[] | null;
  maxAsymmetryMm: number | null;
  layers: MeasuredLayerOutline[];
}

/** Default spacing (mm of girth) of the asymmetry report. */
export const ASYMMETRY_STEP_MM = 50;

type FrameInput = Pick<MeasuredFrame, 'id' | 'name' | 'measurement' | 'symmetry' | 'measuredFace' | 'markedFace' | 'thicknessMm' | 'layers'>;

const fail = (frame: { id: string; name: string }, code: string, field: string, value: unknown, what: string): never => {
  throw new GeometryInputError([{ code, message: `part "${frame.name}" (${frame.id}): ${what}`, field, value }]);
};

/**
 * The readings as points in the section plane, in the order taken: offsets are (y, referenceZ + h);
 * an angle-and-distance reading on the starboard side is (oy + d cos a, oz - d sin a), on the port side
 * (oy - d cos a, oz - d sin a), a being below the horizontal. Bevels become signed (reading - 90 deg).
 */
export function measuredFramePoints(m: Measurement): MeasuredPoint[] {
  const bevel = (b: { readingRad: number } | null): number | null => (b ? b.readingRad - Math.PI / 2 : null);
  if (m.kind === 'offsets') return m.points.map((p) => ({ y: p.y, z: m.referenceZ + p.h, bevelRad: bevel(p.bevel) }));
  return m.points.map((p) => {
    const across = p.distanceMm * Math.cos(p.angleRad);
    return { y: m.origin.y + (p.side === 'starboard' ? across : -across), z: m.origin.z - p.distanceMm * Math.sin(p.angleRad), bevelRad: bevel(p.bevel) };
  });
}

/**
 * How far past the move a corner point may go along its bisector, as a multiple of the move: 4 keeps
 * corners down to about 29 degrees mitred exactly (1 / cos(75.5 deg) = 4) and clips sharper ones.
 */
const MITRE_LIMIT = 4;

/**
 * The edge at depth `depthMm` from the measured face: each point moved along the edge's outward normal
 * (the bisector of the two neighbouring edges' normals, mitred so both edges move by the same amount; at
 * the ends, the end edge's) by depth*tan(bevel),
 * outward for a standing bevel, inward for an under one. `edge` runs counter-clockwise (port to
 * starboard round the bottom); the closing line across the top is not an edge and gives no normal.
 */
export function measuredEdgeAtDepth(edge: readonly MeasuredPoint[], depthMm: number): SectionPoint[] {
  const n = edge.length;
  const normal = (i: number): { y: number; z: number } => {
    const a = edge[i]!;
    const b = edge[i + 1]!;
    const len = Math.hypot(b.y - a.y, b.z - a.z);
    // Counter-clockwise loop: the inside is to the left of travel, so outward is to the right.
    return len === 0 ? { y: 0, z: 0 } : { y: (b.z - a.z) / len, z: -(b.y - a.y) / len };
  };
  return edge.map((p, i) => {
    const before = i > 0 ? normal(i - 1) : { y: 0, z: 0 };
    const after = i < n - 1 ? normal(i) : { y: 0, z: 0 };
    const sy = before.y + after.y;
    const sz = before.z + after.z;
    const len = Math.hypot(sy, sz);
    const move = depthMm * Math.tan(p.bevelRad ?? 0);
    if (len < 1e-12) return { y: p.y, z: p.z };
    // Between two edges the point goes along the bisector by move / cos(half the turn), so both edges
    // beside it move by `move` and stay parallel to themselves (a mitred corner). The sum of the two unit
    // normals is 2 cos(half the turn) long; at an end there is one normal and no turn. A needle-sharp
    // corner would send the point far away: the mitre is limited to MITRE_LIMIT times the move.
    const normals = (i > 0 ? 1 : 0) + (i < n - 1 ? 1 : 0);
    const cosHalfTurn = Math.max(len / normals, 1 / MITRE_LIMIT);
    const along = move / cosHalfTurn;
    return { y: p.y + (sy / len) * along, z: p.z + (sz / len) * along };
  });
}

/**
 * A hand-measured frame worked out (see the file's note for the bevel convention):
 * - `as-measured`: the points kept as read, so an asymmetric hull stays asymmetric;
 * - `mirror-starboard` / `mirror-port`: that side kept from the lowest crossing of the centreline outward
 *   and mirrored; when the other side was measured too, the asymmetry is reported every `asymmetryStepMm`
 *   of girth as the distance from the kept side to the other side mirrored.
 * Points without a bevel reading take one interpolated along the girth between their neighbours' (the
 * nearest one's beyond the last reading); with no readings at all the edge is square.
 * @throws GeometryInputError for fewer than three points, a mirrored side that was not measured, an
 *   outline that crosses itself (points out of order), or an edge moved so far by the bevels that a face
 *   crosses itself.
 */
export function measuredFrameOutline(frame: FrameInput, asymmetryStepMm: number = ASYMMETRY_STEP_MM, toleranceMm: number = POINT_TOLERANCE_MM): MeasuredOutline {
  const raw = measuredFramePoints(frame.measurement);
  if (raw.length < 3) fail(frame, 'measured-too-few', 'measurement.points', raw.length, `a measured frame needs at least three points, found ${raw.length}`);
  if (!(asymmetryStepMm > 0)) fail(frame, 'measured-step', 'asymmetryStepMm', asymmetryStepMm, `the asymmetry step must be more than 0 mm, found ${asymmetryStepMm}`);

  let edge: MeasuredPoint[];
  let asymmetry: MeasuredAsymmetry[] | null = null;
  if (frame.symmetry === 'as-measured') {
    edge = raw;
  } else {
    const keep = frame.symmetry === 'mirror-starboard' ? 1 : -1;
    const { kept, other } = halves(raw, keep, toleranceMm);
    if (kept === null) {
      fail(frame, 'measured-side-missing', 'symmetry', frame.symmetry, `the ${keep > 0 ? 'starboard' : 'port'} side is to be mirrored but no point was measured on it`);
    }
    const k = kept!;
    const mirrored = k.map((p) => ({ ...p, y: -p.y })).reverse();
    edge = [...(Math.abs(k[0]!.y) <= toleranceMm ? mirrored.slice(0, -1) : mirrored), ...k];
    if (other !== null) asymmetry = asymmetryOf(k, other.map((p) => ({ y: -p.y, z: p.z })), asymmetryStepMm);
  }
  if (polygonSignedArea(edge) < 0) edge = [...edge].reverse();
  if (!polygonIsSimple(edge, toleranceMm)) {
    fail(frame, 'measured-crossing', 'measurement.points', edge.length, 'the measured outline crosses itself: are the points in order along the edge?');
  }
  edge = bevelsFilled(edge);

  const outline = edge.map(({ y, z }) => ({ y, z }));
  const otherFace = measuredEdgeAtDepth(edge, frame.thicknessMm);
  if (!polygonIsSimple(otherFace, toleranceMm)) {
    fail(frame, 'measured-bevel-crossing', 'thicknessMm', frame.thicknessMm, 'the bevels move the far face so much that its outline crosses itself; check the bevel readings');
  }
  const otherFaceName = frame.measuredFace === 'forward' ? 'aft' : 'forward';
  const markedFace = frame.markedFace === 'auto' ? (polygonArea(otherFace) > polygonArea(outline) ? otherFaceName : frame.measuredFace) : frame.markedFace;

  // Layers are stacked from the marked face: depth from the measured face runs the other way if that is not it.
  const fromMeasured = markedFace === frame.measuredFace;
  let stacked = 0;
  const layers = frame.layers.map((layer, index): MeasuredLayerOutline => {
    const a = fromMeasured ? stacked : frame.thicknessMm - stacked - layer.thicknessMm;
    stacked += layer.thicknessMm;
    const near = measuredEdgeAtDepth(edge, a);
    const far = measuredEdgeAtDepth(edge, a + layer.thicknessMm);
    return { index, thicknessMm: layer.thicknessMm, nearDepthMm: a, farDepthMm: a + layer.thicknessMm, near, far, cutTo: polygonArea(far) > polygonArea(near) ? 'far' : 'near' };
  });
  const maxAsymmetryMm = asymmetry === null ? null : Math.max(...asymmetry.map((s) => s.differenceMm));
  return { edge, outline, otherFace, markedFace, asymmetry, maxAsymmetryMm, layers };
}

/**
 * The side `keep` (+1 starboard, -1 port) and the other, each from the centreline outward. Both measured:
 * split at the lowest crossing of y = 0 (the point there interpolated, bevel too). One side measured: that
 * side from its end nearer the centreline, the other null.
 */
function halves(pts: MeasuredPoint[], keep: number, tol: number): { kept: MeasuredPoint[] | null; other: MeasuredPoint[] | null } {
  let best: { i: number; t: number; z: number } | null = null;
  for (let i = 0; i + 1 < pts.length; i++) {
    const a = pts[i]!;
    const b = pts[i + 1]!;
    const sa = Math.abs(a.y) <= tol ? 0 : Math.sign(a.y);
    const sb = Math.abs(b.y) <= tol ? 0 : Math.sign(b.y);
    if (sa !== 0 && sa === sb) continue;
    const t = sa === 0 ? 0 : sb === 0 ? 1 : a.y / (a.y - b.y);
    const z = a.z + t * (b.z - a.z);
    if (best === null || z < best.z) best = { i, t, z };
  }
  const side = (h: MeasuredPoint[]): number => Math.sign(h.reduce((s, p) => s + p.y, 0));
  if (best === null || (best.i === 0 && best.t === 0) || (best.i === pts.length - 2 && best.t === 1)) {
    // No crossing inside the run: one side only, from its end nearer the centreline.
    const run = Math.abs(pts[0]!.y) <= Math.abs(pts[pts.length - 1]!.y) ? pts : [...pts].reverse();
    return side(run) === keep ? { kept: run, other: null } : { kept: null, other: run };
  }
  const a = pts[best.i]!;
  const b = pts[best.i + 1]!;
  const lerp = (u: number | null, v: number | null): number | null => (u === null || v === null ? (best!.t < 0.5 ? u : v) : u + best!.t * (v - u));
  const c: MeasuredPoint = { y: 0, z: best.z, bevelRad: lerp(a.bevelRad, b.bevelRad) };
  const start = best.t === 0 ? best.i - 1 : best.i;
  const end = best.t === 1 ? best.i + 2 : best.i + 1;
  const back = [c, ...pts.slice(0, start + 1).reverse()];
  const ahead = [c, ...pts.slice(end)];
  const keptHalf = side(ahead) === keep ? ahead : back;
  const otherHalf = keptHalf === ahead ? back : ahead;
  return { kept: keptHalf.length > 1 ? keptHalf : null, other: otherHalf.length > 1 ? otherHalf : null };
}

function asymmetryOf(kept: MeasuredPoint[], otherMirrored: SectionPoint[], step: number): MeasuredAsymmetry[] {
  const total = polylineLength(kept);
  const out: MeasuredAsymmetry[] = [];
  const count = Math.floor(total / step + 1e-9);
  for (let k = 0; k <= count + 1; k++) {
    const g = Math.min(k * step, total);
    if (k > count && g - out[out.length - 1]!.girthMm < 1e-9) break;
    const p = pointAtGirth(kept, g);
    out.push({ girthMm: g, differenceMm: polylineDistance(otherMirrored, p) ?? 0 });
  }
  return out;
}

function pointAtGirth(pts: readonly SectionPoint[], g: number): SectionPoint {
  let run = 0;
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1]!;
    const b = pts[i]!;
    const len = Math.hypot(b.y - a.y, b.z - a.z);
    if (run + len >= g && len > 0) {
      const t = (g - run) / len;
      return { y: a.y + t * (b.y - a.y), z: a.z + t * (b.z - a.z) };
    }
    run += len;
  }
  return pts[pts.length - 1]!;
}

/** Bevels interpolated along the girth where none was read; the nearest reading beyond the last; square with none. */
function bevelsFilled(edge: MeasuredPoint[]): MeasuredPoint[] {
  const girth = [0];
  for (let i = 1; i < edge.length; i++) girth.push(girth[i - 1]! + Math.hypot(edge[i]!.y - edge[i - 1]!.y, edge[i]!.z - edge[i - 1]!.z));
  const read = edge.map((p, i) => (p.bevelRad === null ? -1 : i)).filter((i) => i >= 0);
  if (read.length === 0) return edge.map((p) => ({ ...p, bevelRad: 0 }));
  return edge.map((p, i) => {
    if (p.bevelRad !== null) return p;
    const after = read.find((k) => k > i);
    const before = [...read].reverse().find((k) => k < i);
    if (before === undefined) return { ...p, bevelRad: edge[after!]!.bevelRad };
    if (after === undefined) return { ...p, bevelRad: edge[before]!.bevelRad };
    const t = (girth[i]! - girth[before]!) / (girth[after]! - girth[before]! || 1);
    return { ...p, bevelRad: edge[before]!.bevelRad! + t * (edge[after]!.bevelRad! - edge[before]!.bevelRad!) };
  });
}
