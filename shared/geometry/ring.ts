import { lastOf } from './arrays';
import { vectorLength } from './vector';
import type { EdgePoint } from './edge';
import { arcPoints } from './holes';
import { type OutlineRun, loopMirrored, outlineRuns } from './outline';
import { type RingSpec, ringRunWidths } from './ring-width';
import { polygonIsSimple, type Shape } from './polygon';
import { polylineLinesMeet, polylineLoopsTrim, polylineSegmentsCross, polylineTailHeadCross } from './polyline';
import { CHORD_TOLERANCE_MM, GeometryInputError, type SectionPoint } from './types';

export { RING_WIDTH_TAPER, type RingBottomRule, type RingSpec, ringWidthAt } from './ring-width';

/**
 * The inner edge of a ring frame: the outer edge (a deducted half outline) set in by the ring width, which
 * may differ across the bottom, up the sides and under the deck, with the inner corners rounded.
 *
 * Each run of the outline (a stretch between corners) is moved in along its own normals by its width, so
 * the ring is exactly as wide as asked, normal to the edge, wherever the width is constant; the loops an
 * inward move makes round a bend tighter than the width are cut out. At a corner the two moved runs are cut
 * where they cross; with a corner radius r, the runs moved in by width + r cross at the centre of the
 * rounding circle, which touches each inner run at the foot of that centre (parallel curves share
 * normals). Where the width changes along a smooth stretch (a stated height, or a round bilge's turn) the
 * change is tapered, `RING_WIDTH_TAPER` mm of girth per mm of width, on the narrower side: a step would be
 * a notch where the ring takes its load.
 */

interface Moved {
  y: number;
  z: number;
  /** Outward normal of the outline point it came from. */
  ny: number;
  nz: number;
}

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

/** The run moved in by its widths plus `extra` (mm), with the loops of a too-tight bend cut out. */
function moveIn(r: { pts: SectionPoint[]; normals: SectionPoint[]; widths: number[] }, extra: number): Moved[] {
  const out = r.pts.map((p, i) => {
    const n = r.normals[i]!;
    const d = r.widths[i]! + extra;
    return { y: p.y - n.y * d, z: p.z - n.z * d, ny: n.y, nz: n.z };
  });
  const backward = (p: Moved, q: Moved): boolean => {
    const dy = q.y - p.y;
    const dz = q.z - p.z;
    return dy * -p.nz + dz * p.ny < 0 && dy * -q.nz + dz * q.ny < 0;
  };
  let any = false;
  for (let k = 0; k < out.length - 1 && !any; k++) any = backward(out[k]!, out[k + 1]!);
  const lerp = (p: Moved, q: Moved, s: number): Moved => ({ y: p.y + s * (q.y - p.y), z: p.z + s * (q.z - p.z), ny: p.ny, nz: p.nz });
  return any ? polylineLoopsTrim(out, backward, lerp) : out;
}

const lerpP = (a: SectionPoint, b: SectionPoint, s: number): SectionPoint => ({ y: a.y + s * (b.y - a.y), z: a.z + s * (b.z - a.z) });

/** The rounding arc from the foot on one inner run to the foot on the next, about `centre`, the short way round. */
function fillet(from: SectionPoint, to: SectionPoint, centre: SectionPoint, r: number, tol: number): SectionPoint[] {
  const a0 = Math.atan2(from.z - centre.z, from.y - centre.y);
  const a1 = Math.atan2(to.z - centre.z, to.y - centre.y);
  let sweep = a1 - a0;
  while (sweep > Math.PI) sweep -= 2 * Math.PI;
  while (sweep < -Math.PI) sweep += 2 * Math.PI;
  const arc = arcPoints(centre, r, a0, sweep, tol);
  arc[0] = from;
  arc[arc.length - 1] = to;
  return arc;
}

/** How much (mm) closer than the narrowest width the inner edge may come to the outer edge (rounding of the joins). */
export const RING_WIDTH_CHECK_MM = 0.01;

/** Points, or segments, to a block of `ringEdgeClearance` (consecutive ones, so a block keeps to one stretch of edge). */
const CLEARANCE_BLOCK = 6;

/**
 * Room (mm) added to the distance a block is passed over at. The squared distances round by far less than
 * the 2 x 1e-3 x d + 1e-6 mm^2 this adds (hull coordinates to 1e5 mm), even where d is near 0, so no segment
 * whose rounded distance might still come out nearer is passed over.
 */
const CLEARANCE_ROUNDING_MM = 1e-3;

/** The box (minY, maxY, minZ, maxZ) of each run of `CLEARANCE_BLOCK` of n items, item k spanning y0(k) to y1(k) and z0(k) to z1(k). */
function blockBoxes(n: number, y0: (k: number) => number, y1: (k: number) => number, z0: (k: number) => number, z1: (k: number) => number): Float64Array {
  const boxes = new Float64Array(4 * Math.ceil(n / CLEARANCE_BLOCK));
  for (let b = 0; 4 * b < boxes.length; b++) {
    let minY = Infinity;
    let maxY = -Infinity;
    let minZ = Infinity;
    let maxZ = -Infinity;
    for (let k = b * CLEARANCE_BLOCK, end = Math.min(n, k + CLEARANCE_BLOCK); k < end; k++) {
      minY = Math.min(minY, y0(k));
      maxY = Math.max(maxY, y1(k));
      minZ = Math.min(minZ, z0(k));
      maxZ = Math.max(maxZ, z1(k));
    }
    boxes[4 * b] = minY;
    boxes[4 * b + 1] = maxY;
    boxes[4 * b + 2] = minZ;
    boxes[4 * b + 3] = maxZ;
  }
  return boxes;
}

/**
 * The least distance (mm) from the points to the runs' segments when it is less than `limit`, and the point
 * where it is (else `limit`). Points and segments go in blocks of `CLEARANCE_BLOCK` consecutive ones with
 * their boxes: a block of segments is passed over for a block of points, then for a point, when their boxes
 * are the distance found so far apart in y or z (no segment in it can be nearer; the distance only shrinks,
 * so a block passed over for the points' block stays passed over). Along an edge a block of inner points
 * has only the few blocks of the outer edge beside it to look at, and there is no grid to build; the box
 * tests grow as the square of the blocks (some 10^5 for a 2000-point edge, still faster there than the grid was).
 * Which segments are looked at does not change the answer: the least distance, at the first point in order
 * that has it.
 */
export function ringEdgeClearance(points: readonly SectionPoint[], runs: readonly Pick<OutlineRun, 'points'>[], limit: number): { d: number; p: SectionPoint } {
  let at = points[0] ?? { y: 0, z: 0 };
  let n = 0;
  for (const run of runs) n += Math.max(0, run.points.length - 1);
  if (!(limit > 0) || n === 0) return { d: limit, p: at };
  // Segment ends, flat: ay, az, by, bz.
  const seg = new Float64Array(4 * n);
  let s = 0;
  for (const run of runs) {
    const q = run.points;
    for (let k = 0; k + 1 < q.length; k++, s += 4) {
      seg[s] = q[k]!.y;
      seg[s + 1] = q[k]!.z;
      seg[s + 2] = q[k + 1]!.y;
      seg[s + 3] = q[k + 1]!.z;
    }
  }
  const segBoxes = blockBoxes(
    n,
    (k) => Math.min(seg[4 * k]!, seg[4 * k + 2]!),
    (k) => Math.max(seg[4 * k]!, seg[4 * k + 2]!),
    (k) => Math.min(seg[4 * k + 1]!, seg[4 * k + 3]!),
    (k) => Math.max(seg[4 * k + 1]!, seg[4 * k + 3]!),
  );
  const ptBoxes = blockBoxes(
    points.length,
    (k) => points[k]!.y,
    (k) => points[k]!.y,
    (k) => points[k]!.z,
    (k) => points[k]!.z,
  );
  const segBlocks = segBoxes.length / 4;
  // The blocks of segments near the block of points in hand.
  const near = new Int32Array(segBlocks);
  // Squared distances compared; the one square root at the end gives the same figure.
  let best2 = limit * limit;
  let reach = limit + CLEARANCE_ROUNDING_MM;
  for (let pb = 0; 4 * pb < ptBoxes.length; pb++) {
    const pMinY = ptBoxes[4 * pb]!;
    const pMaxY = ptBoxes[4 * pb + 1]!;
    const pMinZ = ptBoxes[4 * pb + 2]!;
    const pMaxZ = ptBoxes[4 * pb + 3]!;
    let nearCount = 0;
    for (let sb = 0; sb < segBlocks; sb++) {
      const o = 4 * sb;
      if (!(segBoxes[o]! - pMaxY > reach || pMinY - segBoxes[o + 1]! > reach || segBoxes[o + 2]! - pMaxZ > reach || pMinZ - segBoxes[o + 3]! > reach)) near[nearCount++] = sb;
    }
    for (let k = pb * CLEARANCE_BLOCK, kEnd = Math.min(points.length, k + CLEARANCE_BLOCK); k < kEnd; k++) {
      const p = points[k]!;
      const py = p.y;
      const pz = p.z;
      for (let c = 0; c < nearCount; c++) {
        const sb = near[c]!;
        const o = 4 * sb;
        if (segBoxes[o]! - py > reach || py - segBoxes[o + 1]! > reach || segBoxes[o + 2]! - pz > reach || pz - segBoxes[o + 3]! > reach) continue;
        for (let m = sb * CLEARANCE_BLOCK, mEnd = Math.min(n, m + CLEARANCE_BLOCK); m < mEnd; m++) {
          const ay = seg[4 * m]!;
          const az = seg[4 * m + 1]!;
          const vy = seg[4 * m + 2]! - ay;
          const vz = seg[4 * m + 3]! - az;
          const l2 = vy * vy + vz * vz;
          const wy = py - ay;
          const wz = pz - az;
          const along = wy * vy + wz * vz;
          let d2: number;
          if (along <= 0) d2 = wy * wy + wz * wz;
          else if (along >= l2) d2 = (wy - vy) * (wy - vy) + (wz - vz) * (wz - vz);
          else {
            // Foot inside the segment: the squared distance times l2 needs no division, and most segments of
            // the block are far off; the margin covers rounding, so only those that may be nearer are worked out.
            const w2 = wy * wy + wz * wz;
            if (w2 * l2 - along * along > best2 * l2 + 1e-9 * w2 * l2) continue;
            const t = along / l2;
            const dy = wy - t * vy;
            const dz = wz - t * vz;
            d2 = dy * dy + dz * dz;
          }
          if (d2 < best2) {
            best2 = d2;
            at = p;
            reach = Math.sqrt(best2) + CLEARANCE_ROUNDING_MM;
          }
        }
      }
    }
  }
  return { d: best2 < limit * limit ? Math.sqrt(best2) : limit, p: at };
}

/** How many segments from the end (or the start) of a polyline it takes to cover `lengthMm` of it. */
function segmentsWithin(pts: readonly SectionPoint[], lengthMm: number, fromEnd: boolean): number {
  let sum = 0;
  const n = pts.length;
  for (let k = 1; k < n; k++) {
    const a = pts[fromEnd ? n - k : k - 1]!;
    const b = pts[fromEnd ? n - k - 1 : k]!;
    sum += vectorLength(b.y - a.y, b.z - a.z);
    if (sum > lengthMm) return k;
  }
  return n - 1;
}

/** How far (in widths) from a corner the moved runs are looked for crossing: a corner as sharp as 15 degrees. */
export const RING_JOIN_REACH = 8;

/** A place on a run's polyline: between point i and i + 1, a fraction s along. */
interface Cut {
  i: number;
  s: number;
}
const at = (pts: readonly SectionPoint[], c: Cut): SectionPoint => lerpP(pts[c.i]!, pts[Math.min(c.i + 1, pts.length - 1)]!, c.s);
const order = (c: Cut): number => c.i + c.s;

/** The place on a polyline nearest to p. */
function footOn(pts: readonly SectionPoint[], p: SectionPoint): Cut {
  let best = { i: 0, s: 0 };
  let bestD = Infinity;
  for (let i = 0; i + 1 < pts.length; i++) {
    const a = pts[i]!;
    const b = pts[i + 1]!;
    const dy = b.y - a.y;
    const dz = b.z - a.z;
    const l2 = dy * dy + dz * dz;
    const s = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.y - a.y) * dy + (p.z - a.z) * dz) / l2));
    const d = vectorLength(a.y + s * dy - p.y, a.z + s * dz - p.z);
    if (d < bestD) [best, bestD] = [{ i, s }, d];
  }
  return best;
}

/** How two neighbouring inner runs meet: where each is cut and what goes between (a rounding arc, a corner). */
interface Join {
  endA: Cut;
  startB: Cut;
  middle: SectionPoint[];
}

/** The join of inner runs a and b (with their copies moved in further by the radius, when rounding). */
function joinOf(a: Moved[], aR: Moved[] | null, b: Moved[], bR: Moved[] | null, radius: number, reachMm: number, tol: number): Join {
  // Moved runs cross within a few widths of the corner: search that far back along each (the search is
  // quadratic in its window, and a fine section has hundreds of points a run).
  const window = Math.max(8, Math.min(segmentsWithin(a, reachMm, true), segmentsWithin(b, reachMm, false)));
  if (aR && bR && radius > 0) {
    const c = polylineTailHeadCross(aR, bR, window);
    // Parallel runs share their indices: the foot of the centre on each inner run is at the same place.
    if (c) {
      const centre = lerpP(aR[c.i]!, aR[c.i + 1]!, c.s);
      // Where loop trimming made the two copies differ, find the feet by projection instead.
      const endA = aR.length === a.length ? { i: c.i, s: c.s } : footOn(a, centre);
      const startB = bR.length === b.length ? { i: c.j, s: c.u } : footOn(b, centre);
      return { endA, startB, middle: fillet(at(a, endA), at(b, startB), centre, radius, tol) };
    }
  }
  const cross = polylineTailHeadCross(a, b, window);
  if (cross) return { endA: { i: cross.i, s: cross.s }, startB: { i: cross.j, s: cross.u }, middle: [lerpP(a[cross.i]!, a[cross.i + 1]!, cross.s)] };
  // No crossing: the runs part (a corner turning the other way). Meet along the end tangents, else join straight.
  const ea = a[a.length - 1]!;
  const sb = b[0]!;
  // Literals, not a spread of a shared base (V8's slow path: several microseconds each).
  const endA = { i: Math.max(0, a.length - 2), s: a.length > 1 ? 1 : 0 };
  const meet = polylineLinesMeet(ea, { y: -ea.nz, z: ea.ny }, sb, { y: sb.nz, z: -sb.ny });
  if (meet && meet.s >= 0 && meet.u >= 0 && meet.s < 1e4 && meet.u < 1e4) return { endA, startB: { i: 0, s: 0 }, middle: [{ y: ea.y - ea.nz * meet.s, z: ea.z + ea.ny * meet.s }] };
  return { endA, startB: { i: 0, s: 0 }, middle: [] };
}

/**
 * Where the first inner run starts on the centreline: at its first point when that is on it; cut where it
 * crosses from port (a V: the two halves meet there, rounded with the mirror image when there is a radius);
 * or run back along its first segment to it (a hollow at the keel).
 */
function centrelineStart(run: Moved[], rounded: Moved[] | null, radius: number, tol: number): Join {
  const p0 = run[0]!;
  if (Math.abs(p0.y) <= 1e-9) return { endA: { i: 0, s: 0 }, startB: { i: 0, s: 0 }, middle: [{ y: 0, z: p0.z }] };
  if (p0.y > 0) {
    const p1 = run[1] ?? p0;
    const dy = p1.y - p0.y;
    const z = Math.abs(dy) < 1e-12 ? p0.z : p0.z - ((p1.z - p0.z) / dy) * p0.y;
    return { endA: { i: 0, s: 0 }, startB: { i: 0, s: 0 }, middle: [{ y: 0, z }, { y: p0.y, z: p0.z }] };
  }
  if (rounded && radius > 0) {
    for (let i = 0; i + 1 < rounded.length; i++) {
      const a = rounded[i]!;
      const b = rounded[i + 1]!;
      if (!(a.y < 0 && b.y >= 0)) continue;
      const s = -a.y / (b.y - a.y);
      const centre = { y: 0, z: a.z + s * (b.z - a.z) };
      const foot = lerpP(run[i]!, run[i + 1]!, s);
      if (foot.y < 0) break;
      // The circle touches both halves; its point on the centreline is on the side away from the feet.
      const bottom = { y: 0, z: centre.z + (foot.z < centre.z ? -radius : radius) };
      return { endA: { i: 0, s: 0 }, startB: { i, s }, middle: fillet(bottom, foot, centre, radius, tol) };
    }
  }
  for (let i = 0; i + 1 < run.length; i++) {
    const a = run[i]!;
    const b = run[i + 1]!;
    if (a.y < 0 && b.y >= 0) {
      const s = -a.y / (b.y - a.y);
      return { endA: { i: 0, s: 0 }, startB: { i, s }, middle: [{ y: 0, z: a.z + s * (b.z - a.z) }] };
    }
  }
  return fail('ring-too-wide', 'ringWidth', null, 'the ring widths leave no opening: the inner edge never reaches the centreline');
}

/** The last inner run ended where it first reaches the centreline from starboard (under the deck). */
function centrelineEnd(run: Moved[]): Join {
  const n = run.length;
  const pe = run[n - 1]!;
  if (Math.abs(pe.y) <= 1e-9) return { endA: { i: Math.max(0, n - 2), s: n > 1 ? 1 : 0 }, startB: { i: 0, s: 0 }, middle: [{ y: 0, z: pe.z }] };
  if (pe.y > 0) {
    const p1 = run[n - 2] ?? pe;
    const dy = pe.y - p1.y;
    const z = Math.abs(dy) < 1e-12 ? pe.z : pe.z - ((pe.z - p1.z) / dy) * pe.y;
    return { endA: { i: Math.max(0, n - 2), s: n > 1 ? 1 : 0 }, startB: { i: 0, s: 0 }, middle: [{ y: 0, z }] };
  }
  for (let i = n - 2; i >= 0; i--) {
    const a = run[i]!;
    const b = run[i + 1]!;
    if (a.y >= 0 && b.y < 0) {
      const s = a.y / (a.y - b.y);
      return { endA: { i, s }, startB: { i: 0, s: 0 }, middle: [{ y: 0, z: a.z + s * (b.z - a.z) }] };
    }
  }
  return fail('ring-too-wide', 'ringWidth', null, 'the ring widths leave no opening: the inner edge never reaches the centreline under the deck');
}

/**
 * The inner edge of a ring frame, starboard half: from the centreline at the bottom round to the centreline
 * under the deck (`top: 'deck'`), or from the centreline at the bottom up past the top line (`open`: the
 * caller cuts the arms there). `half` is the outer half outline (deduction.ts). Widths and radius in mm.
 * @throws GeometryInputError (code `ring-too-wide`) when the widths leave no opening.
 */
export function ringInnerEdge(half: readonly EdgePoint[], spec: RingSpec, toleranceMm: number = CHORD_TOLERANCE_MM): SectionPoint[] {
  const all = outlineRuns(half);
  const runs = spec.top === 'open' ? all.filter((r, i) => r.kind === 'hull' || (r.kind === 'closure' && i === 0)) : all;
  if (runs.length === 0) return fail('ring-no-edge', 'ringWidth', null, 'the frame has no edge against the skin to set the ring in from');
  const rho = spec.cornerRadiusMm;
  const inner: Moved[][] = [];
  const round: (Moved[] | null)[] = [];
  runs.forEach((run, i) => {
    const r = ringRunWidths(run, i === 0, spec);
    inner.push(moveIn(r, 0));
    round.push(rho > 0 ? moveIn(r, rho) : null);
  });
  const joins: Join[] = [centrelineStart(inner[0]!, round[0]!, rho, toleranceMm)];
  const reach = RING_JOIN_REACH * (Math.max(spec.bottomMm, spec.sidesMm, spec.underDeckMm) + rho) + 50;
  for (let k = 0; k + 1 < inner.length; k++) joins.push(joinOf(inner[k]!, round[k]!, inner[k + 1]!, round[k + 1]!, rho, reach, toleranceMm));
  const last = inner.length - 1;
  const tail: Join =
    spec.top === 'deck' ? centrelineEnd(inner[last]!) : { endA: { i: Math.max(0, inner[last]!.length - 2), s: inner[last]!.length > 1 ? 1 : 0 }, startB: { i: 0, s: 0 }, middle: [] };
  joins.push(tail);
  const edge: SectionPoint[] = [];
  const push = (p: SectionPoint): void => {
    const q = lastOf(edge);
    if (!q || Math.abs(q.y - p.y) > 1e-9 || Math.abs(q.z - p.z) > 1e-9) edge.push({ y: p.y, z: p.z });
  };
  for (let k = 0; k < inner.length; k++) {
    for (const p of joins[k]!.middle) push(p);
    const pts = inner[k]!;
    const from = joins[k]!.startB;
    const to = joins[k + 1]!.endA;
    // A run shorter than the roundings at its ends is used up by them: the joins meet directly.
    if (order(to) <= order(from)) continue;
    push(at(pts, from));
    for (let i = from.i + 1; i <= to.i; i++) push(pts[i]!);
    push(at(pts, to));
  }
  for (const p of tail.middle) push(p);
  if (spec.top === 'open') {
    // Carry the arm's inner edge on along its end tangent so that it is sure to cross the top line.
    const a = edge[edge.length - 2] ?? edge[0]!;
    const b = edge[edge.length - 1]!;
    const len = vectorLength(b.y - a.y, b.z - a.z) || 1;
    const reach = 3 * Math.max(spec.bottomMm, spec.sidesMm, spec.underDeckMm) + 100;
    edge.push({ y: b.y + ((b.y - a.y) / len) * reach, z: b.z + ((b.z - a.z) / len) * reach });
  }
  for (const p of edge) if (p.y < -1e-6) fail('ring-too-wide', 'ringWidth', p, `the ring widths leave no opening: the inner edge crosses the centreline at height ${p.z.toFixed(1)} mm`);
  if (edge[0]) edge[0] = { y: 0, z: edge[0].z };
  // Where the widths are wider than the frame, the moved runs cross past each other and what is left is not an
  // opening: every point of a true inner edge stands at least the narrowest width off the outer edge.
  const minWidth = Math.min(spec.bottomMm, spec.sidesMm, ...(spec.top === 'deck' ? [spec.underDeckMm] : []));
  const checked = spec.top === 'open' ? edge.slice(0, -1) : edge;
  const near = ringEdgeClearance(checked, runs, minWidth);
  if (near.d < minWidth - RING_WIDTH_CHECK_MM) {
    fail('ring-too-wide', 'ringWidth', minWidth, `the ring widths leave no clear opening: the inner edge comes within ${near.d.toFixed(1)} mm of the frame's edge at (${near.p.y.toFixed(0)}, ${near.p.z.toFixed(0)}) mm, less than the narrowest width of ${minWidth} mm`);
  }
  return edge;
}

/**
 * A ring frame's region from its outer half outline: `deck` top, the whole outline with the inner edge
 * (mirrored) as its hole; `open` top, one U-shaped loop whose arms end at the outline's top line.
 * @throws GeometryInputError (code `ring-too-wide`) when the widths leave no opening, or the arms miss the top line.
 */
export function ringRegion(half: readonly EdgePoint[], spec: RingSpec, toleranceMm: number = CHORD_TOLERANCE_MM): Shape {
  const inner = ringInnerEdge(half, spec, toleranceMm);
  const outerLoop = loopMirrored(half);
  if (spec.top === 'deck') {
    // The mirrored loop is simple when its half is, closed along the centreline (the half keeps to y > 0 between
    // its ends, checked above): half the points to test.
    if (!polygonIsSimple(inner)) fail('ring-too-wide', 'ringWidth', spec, 'the ring widths leave no clear opening: the inner edge crosses itself');
    return { outer: outerLoop, holes: [loopMirrored(inner).reverse()] };
  }
  // Open: the outline up to the top corner, along the top line to where the arm's inner edge meets it, down the inner edge.
  let topStart = -1;
  half.forEach((p, i) => {
    if (p.edge === 'hull') topStart = i;
  });
  for (let j = topStart; j + 1 < half.length; j++) {
    for (let i = inner.length - 2; i >= 0; i--) {
      const hit = polylineSegmentsCross(half[j]!, half[j + 1]!, inner[i]!, inner[i + 1]!);
      if (!hit) continue;
      const x = lerpP(half[j]!, half[j + 1]!, hit.s);
      const halfLoop = [...half.slice(0, j + 1).map((p) => ({ y: p.y, z: p.z })), x, ...inner.slice(0, i + 1).reverse()];
      const loop = loopMirrored(halfLoop);
      if (!polygonIsSimple(loop)) fail('ring-too-wide', 'ringWidth', spec, 'the ring widths leave no clear opening between the arms');
      return { outer: loop, holes: [] };
    }
  }
  return fail('ring-too-wide', 'ringWidth', spec, "the ring's arms do not reach the top line");
}
