import { lastOf } from './arrays';
// @ts-expect-error clipper-lib 6.4.2 publishes no type declarations; the few calls used are typed below.
import ClipperLibUntyped from 'clipper-lib';
import { vectorLength } from './vector';
import { CHORD_TOLERANCE_MM, GeometryInputError, POINT_TOLERANCE_MM, type SectionPoint } from './types';

/**
 * Closed loops in a section plane (y across, z up, millimetres): measures, tests and clipper-lib offsets.
 * A loop is its vertices in order, the closing edge implied (the first point is not repeated). A shape is
 * an outer loop and its holes, as one ply part is (a ring frame, a bulkhead with openings).
 * Counter-clockwise means counter-clockwise with y to the right and z up: positive signed area.
 */

/** A closed loop: vertices in order, the last joined back to the first. */
export type Loop = readonly SectionPoint[];
/** A region: one outer loop (counter-clockwise) and its holes (clockwise). */
export interface Shape {
  outer: SectionPoint[];
  holes: SectionPoint[][];
}
/** An axis-aligned box (mm). */
export interface Bounds {
  minY: number;
  minZ: number;
  maxY: number;
  maxZ: number;
}

/** Integer units per millimetre when a loop goes to clipper-lib (1 micrometre; clipper works in integers). */
export const CLIPPER_SCALE = 1000;
/** Default arc tolerance (mm) of round joins in offsets: the chord tolerance used everywhere in geometry. */
export const OFFSET_ARC_TOLERANCE_MM = CHORD_TOLERANCE_MM;

/** Signed area (mm^2) by the shoelace formula: positive when counter-clockwise, 0 for fewer than 3 points. */
export function polygonSignedArea(loop: Loop): number {
  const n = loop.length;
  if (n < 3) return 0;
  // Edge by edge in the loop's order, the closing edge last (no modulo per point: this runs on every loop).
  let twice = 0;
  let a = loop[0]!;
  for (let i = 1; i < n; i++) {
    const b = loop[i]!;
    twice += a.y * b.z - b.y * a.z;
    a = b;
  }
  const b = loop[0]!;
  twice += a.y * b.z - b.y * a.z;
  return twice / 2;
}

/** Area (mm^2) enclosed by a loop, whatever its direction. */
export function polygonArea(loop: Loop): number {
  return Math.abs(polygonSignedArea(loop));
}

/** Perimeter (mm) of a closed loop, the closing edge included. */
export function polygonPerimeter(loop: Loop): number {
  let sum = 0;
  for (let i = 0, n = loop.length; i < n && n > 1; i++) {
    const a = loop[i]!;
    const b = loop[(i + 1) % n]!;
    sum += vectorLength(b.y - a.y, b.z - a.z);
  }
  return sum;
}

/** Length (mm) of an open polyline. */
export function polylineLength(points: Loop): number {
  let sum = 0;
  for (let i = 1; i < points.length; i++) sum += vectorLength(points[i]!.y - points[i - 1]!.y, points[i]!.z - points[i - 1]!.z);
  return sum;
}

/** Bounding box of points, or null when there are none. */
export function polygonBounds(points: Loop): Bounds | null {
  if (points.length === 0) return null;
  let minY = Infinity;
  let minZ = Infinity;
  let maxY = -Infinity;
  let maxZ = -Infinity;
  for (const p of points) {
    if (p.y < minY) minY = p.y;
    if (p.y > maxY) maxY = p.y;
    if (p.z < minZ) minZ = p.z;
    if (p.z > maxZ) maxZ = p.z;
  }
  return { minY, minZ, maxY, maxZ };
}

/** Direction of a loop: `ccw`, `cw`, or `degenerate` when its area is within `toleranceMm2` of zero. */
export function polygonOrientation(loop: Loop, toleranceMm2: number = POINT_TOLERANCE_MM): 'ccw' | 'cw' | 'degenerate' {
  const a = polygonSignedArea(loop);
  return a > toleranceMm2 ? 'ccw' : a < -toleranceMm2 ? 'cw' : 'degenerate';
}

/** The loop counter-clockwise (a reversed copy if it was clockwise, else a copy). */
export function polygonCounterClockwise(loop: Loop): SectionPoint[] {
  return polygonSignedArea(loop) < 0 ? [...loop].reverse() : [...loop];
}

/** Distance (mm) from p to segment ab. */
export function segmentDistance(p: SectionPoint, a: SectionPoint, b: SectionPoint): number {
  const dy = b.y - a.y;
  const dz = b.z - a.z;
  const len2 = dy * dy + dz * dz;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.y - a.y) * dy + (p.z - a.z) * dz) / len2));
  return vectorLength(p.y - (a.y + t * dy), p.z - (a.z + t * dz));
}

/**
 * Distance (mm) from p to a polyline (open unless `closed`), or null when there are no points.
 */
export function polylineDistance(points: Loop, p: SectionPoint, closed = false): number | null {
  if (points.length === 0) return null;
  if (points.length === 1) return vectorLength(p.y - points[0]!.y, p.z - points[0]!.z);
  let best = Infinity;
  const edges = closed ? points.length : points.length - 1;
  for (let i = 0; i < edges; i++) best = Math.min(best, segmentDistance(p, points[i]!, points[(i + 1) % points.length]!));
  return best;
}

/**
 * Where p lies against a closed loop: `boundary` within `toleranceMm` of an edge, else `inside` or
 * `outside` by the even-odd crossing rule (direction does not matter).
 */
export function polygonPointLocation(loop: Loop, p: SectionPoint, toleranceMm: number = POINT_TOLERANCE_MM): 'inside' | 'outside' | 'boundary' {
  let inside = false;
  for (let i = 0, n = loop.length, j = n - 1; i < n; j = i++) {
    const a = loop[i]!;
    const b = loop[j]!;
    if (segmentDistance(p, a, b) <= toleranceMm) return 'boundary';
    if (a.z > p.z !== b.z > p.z && p.y < ((b.y - a.y) * (p.z - a.z)) / (b.z - a.z) + a.y) inside = !inside;
  }
  return inside ? 'inside' : 'outside';
}

/** True when p is strictly inside the loop (not within `toleranceMm` of its boundary). */
export function polygonContainsPoint(loop: Loop, p: SectionPoint, toleranceMm: number = POINT_TOLERANCE_MM): boolean {
  return polygonPointLocation(loop, p, toleranceMm) === 'inside';
}

// ---------------------------------------------------------------------------------------------------
// Segment intersection, bucketed on a grid so that long loops stay near linear in time.

/**
 * Segments as flat coordinates: segment i runs from (c[4i], c[4i + 1]) to (c[4i + 2], c[4i + 3]). Flat, not
 * an object a segment: the checks run on every ring face, and the objects were most of their time.
 */
type Segs = Float64Array;

/** Squared distance from (py, pz) to segment ab (no square root: only compared). */
function segmentDistance2(py: number, pz: number, ay: number, az: number, by: number, bz: number): number {
  const dy = by - ay;
  const dz = bz - az;
  const len2 = dy * dy + dz * dz;
  let t = len2 === 0 ? 0 : ((py - ay) * dy + (pz - az) * dz) / len2;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  const ey = py - (ay + t * dy);
  const ez = pz - (az + t * dz);
  return ey * ey + ez * ez;
}

/** Segments i and j cross or come within tol of each other. */
function segmentsTouch(c: Segs, i: number, j: number, tol: number): boolean {
  const say = c[4 * i]!;
  const saz = c[4 * i + 1]!;
  const sby = c[4 * i + 2]!;
  const sbz = c[4 * i + 3]!;
  const tay = c[4 * j]!;
  const taz = c[4 * j + 1]!;
  const tby = c[4 * j + 2]!;
  const tbz = c[4 * j + 3]!;
  // Boxes grown by tol must overlap before anything else is worth computing.
  if (Math.max(say, sby) + tol < Math.min(tay, tby) || Math.max(tay, tby) + tol < Math.min(say, sby)) return false;
  if (Math.max(saz, sbz) + tol < Math.min(taz, tbz) || Math.max(taz, tbz) + tol < Math.min(saz, sbz)) return false;
  // Which side of each segment the other's ends are on (the orientation of the three points).
  const d1 = (sby - say) * (taz - saz) - (sbz - saz) * (tay - say);
  const d2 = (sby - say) * (tbz - saz) - (sbz - saz) * (tby - say);
  const d3 = (tby - tay) * (saz - taz) - (tbz - taz) * (say - tay);
  const d4 = (tby - tay) * (sbz - taz) - (tbz - taz) * (sby - tay);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  const tol2 = tol * tol;
  return (
    segmentDistance2(tay, taz, say, saz, sby, sbz) <= tol2 ||
    segmentDistance2(tby, tbz, say, saz, sby, sbz) <= tol2 ||
    segmentDistance2(say, saz, tay, taz, tby, tbz) <= tol2 ||
    segmentDistance2(sby, sbz, tay, taz, tby, tbz) <= tol2
  );
}

/**
 * Calls `test` once for every pair of the n segments whose boxes (grown by tol) share a cell of a grid of about
 * n cells; stops and returns true as soon as a call does. A pair is visited only in the first cell the two
 * boxes share, so no pair is tested twice. Cells are filled by counting sort into flat arrays (no
 * per-cell allocation): the 2000-point loops of a fine section must take well under a millisecond.
 */
function anyPair(c: Segs, n: number, tol: number, test: (i: number, j: number) => boolean): boolean {
  if (n < 2) return false;
  let minY = Infinity;
  let minZ = Infinity;
  let maxY = -Infinity;
  let maxZ = -Infinity;
  for (let i = 0; i < n; i++) {
    minY = Math.min(minY, c[4 * i]!, c[4 * i + 2]!);
    maxY = Math.max(maxY, c[4 * i]!, c[4 * i + 2]!);
    minZ = Math.min(minZ, c[4 * i + 1]!, c[4 * i + 3]!);
    maxZ = Math.max(maxZ, c[4 * i + 1]!, c[4 * i + 3]!);
  }
  const w = maxY - minY + 2 * tol;
  const h = maxZ - minZ + 2 * tol;
  // A loop's points lie along a curve, not over the area, so the grid is finer than one cell per segment.
  const cell = Math.max(Math.sqrt((w * h) / (4 * n)), w / (4 * n), h / (4 * n), 1e-12);
  const cols = Math.max(1, Math.min(4096, Math.ceil(w / cell)));
  const rows = Math.max(1, Math.min(4096, Math.ceil(h / cell)));
  const fy = cols / w;
  const fz = rows / h;
  const range = new Int32Array(4 * n);
  const count = new Int32Array(cols * rows + 1);
  for (let i = 0; i < n; i++) {
    const ay = c[4 * i]!;
    const az = c[4 * i + 1]!;
    const by = c[4 * i + 2]!;
    const bz = c[4 * i + 3]!;
    const c0 = Math.max(0, Math.floor((Math.min(ay, by) - minY) * fy));
    const r0 = Math.max(0, Math.floor((Math.min(az, bz) - minZ) * fz));
    const c1 = Math.min(cols - 1, Math.floor((Math.max(ay, by) - minY + 2 * tol) * fy));
    const r1 = Math.min(rows - 1, Math.floor((Math.max(az, bz) - minZ + 2 * tol) * fz));
    range[4 * i] = c0;
    range[4 * i + 1] = r0;
    range[4 * i + 2] = c1;
    range[4 * i + 3] = r1;
    for (let r = r0; r <= r1; r++) for (let k = c0; k <= c1; k++) count[r * cols + k + 1]!++;
  }
  for (let k = 1; k < count.length; k++) count[k]! += count[k - 1]!;
  const fill = count.slice(0, cols * rows);
  const members = new Int32Array(count[cols * rows]!);
  for (let i = 0; i < n; i++) {
    for (let r = range[4 * i + 1]!; r <= range[4 * i + 3]!; r++) {
      for (let k = range[4 * i]!; k <= range[4 * i + 2]!; k++) members[fill[r * cols + k]!++] = i;
    }
  }
  for (let key = 0; key < cols * rows; key++) {
    const from = count[key]!;
    const to = count[key + 1]!;
    if (to - from < 2) continue;
    const col = key % cols;
    const r = (key - col) / cols;
    for (let x = from; x < to; x++) {
      const i = members[x]!;
      for (let y = x + 1; y < to; y++) {
        const j = members[y]!;
        // Visit the pair only in the first cell both boxes cover.
        if (Math.max(range[4 * i]!, range[4 * j]!) !== col || Math.max(range[4 * i + 1]!, range[4 * j + 1]!) !== r) continue;
        if (test(i, j)) return true;
      }
    }
  }
  return false;
}

/** The loop's edges (repeated points within tol dropped, the closing edge last) into `c` from segment `at` on; how many. */
function loopSegments(loop: Loop, tol: number, c: Segs, at: number): number {
  const pts = dedupe(loop, tol);
  const n = pts.length;
  for (let i = 0; i < n; i++) {
    const a = pts[i]!;
    const b = pts[i + 1 < n ? i + 1 : 0]!;
    c[4 * (at + i)] = a.y;
    c[4 * (at + i) + 1] = a.z;
    c[4 * (at + i) + 2] = b.y;
    c[4 * (at + i) + 3] = b.z;
  }
  return n;
}

/** The loop without repeated consecutive points (within tol), the closing pair included. */
function dedupe(loop: Loop, tol: number): SectionPoint[] {
  const out: SectionPoint[] = [];
  for (const p of loop) {
    const q = lastOf(out);
    if (!q || vectorLength(p.y - q.y, p.z - q.z) > tol) out.push(p);
  }
  while (out.length > 1 && vectorLength(out[0]!.y - out[out.length - 1]!.y, out[0]!.z - out[out.length - 1]!.z) <= tol) out.pop();
  return out;
}

/**
 * True when the loop is simple: at least three distinct points, no two non-adjacent edges within
 * `toleranceMm` of each other and no edge doubling back over its neighbour. Repeated consecutive points
 * are ignored. Grid-bucketed, near O(n) for a loop of evenly spread points.
 */
export function polygonIsSimple(loop: Loop, toleranceMm: number = POINT_TOLERANCE_MM): boolean {
  const c: Segs = new Float64Array(4 * loop.length);
  const n = loopSegments(loop, toleranceMm, c, 0);
  if (n < 3) return false;
  if (polygonOrientation(loop, 0) === 'degenerate') return false;
  const tol2 = toleranceMm * toleranceMm;
  // Neighbours share a vertex, so they always "touch"; they fail only when one folds back along the other.
  for (let i = 0; i < n; i++) {
    const s = 4 * i;
    const t = 4 * (i + 1 < n ? i + 1 : 0);
    const dot = (c[s]! - c[s + 2]!) * (c[t + 2]! - c[t]!) + (c[s + 1]! - c[s + 3]!) * (c[t + 3]! - c[t + 1]!);
    if (dot > 0 && (segmentDistance2(c[t + 2]!, c[t + 3]!, c[s]!, c[s + 1]!, c[s + 2]!, c[s + 3]!) <= tol2 || segmentDistance2(c[s]!, c[s + 1]!, c[t]!, c[t + 1]!, c[t + 2]!, c[t + 3]!) <= tol2)) return false;
  }
  return !anyPair(c, n, toleranceMm, (i, j) => {
    const gap = Math.abs(i - j);
    if (gap === 1 || gap === n - 1) return false;
    return segmentsTouch(c, i, j, toleranceMm);
  });
}

/**
 * True when `inner` lies strictly inside `outer`: every vertex inside and no edges within `toleranceMm` of
 * each other. Both should be simple.
 */
export function polygonInsidePolygon(inner: Loop, outer: Loop, toleranceMm: number = POINT_TOLERANCE_MM): boolean {
  if (inner.length === 0 || outer.length < 3) return false;
  if (!inner.every((p) => polygonPointLocation(outer, p, toleranceMm) === 'inside')) return false;
  const c: Segs = new Float64Array(4 * (inner.length + outer.length));
  const ni = loopSegments(inner, toleranceMm, c, 0);
  const n = ni + loopSegments(outer, toleranceMm, c, ni);
  // Segments 0 .. ni - 1 are the inner loop's, the rest the outer's: only pairs across the two are tested.
  return !anyPair(c, n, toleranceMm, (i, j) => i < ni !== j < ni && segmentsTouch(c, i, j, toleranceMm));
}

// ---------------------------------------------------------------------------------------------------
// Shapes and clipper-lib

/** Area (mm^2) of a shape net of its holes. */
export function shapeArea(shape: Shape): number {
  return shape.holes.reduce((a, h) => a - polygonArea(h), polygonArea(shape.outer));
}

/** Length (mm) of all a shape's edges: the outside and every hole (what a saw or router cuts). */
export function shapePerimeter(shape: Shape): number {
  return shape.holes.reduce((a, h) => a + polygonPerimeter(h), polygonPerimeter(shape.outer));
}

/** A shape with the outer loop counter-clockwise and every hole clockwise. */
export function shapeNormalised(shape: Shape): Shape {
  return { outer: polygonCounterClockwise(shape.outer), holes: shape.holes.map((h) => polygonCounterClockwise(h).reverse()) };
}

interface IntPoint {
  X: number;
  Y: number;
}
interface PolyNode {
  Contour(): IntPoint[];
  Childs(): PolyNode[];
}
interface ClipperApi {
  ClipperOffset: new (miterLimit: number, arcTolerance: number) => {
    AddPaths(paths: IntPoint[][], joinType: number, endType: number): void;
    Execute(solution: PolyNode, delta: number): void;
  };
  Clipper: new (options: number) => {
    AddPaths(paths: IntPoint[][], polyType: number, closed: boolean): boolean;
    Execute(clipType: number, solution: PolyNode, subjectFill: number, clipFill: number): boolean;
  };
  PolyTree: new () => PolyNode;
  JoinType: { jtRound: number };
  EndType: { etClosedPolygon: number };
  ClipType: { ctIntersection: number; ctUnion: number; ctDifference: number };
  PolyType: { ptSubject: number; ptClip: number };
  PolyFillType: { pftNonZero: number };
}
/** clipper-lib (Angus Johnson's Clipper 6.4.2, JavaScript translation), typed by hand. */
const ClipperLib = ClipperLibUntyped as ClipperApi;

const toPath = (loop: Loop): IntPoint[] => loop.map((p) => ({ X: Math.round(p.y * CLIPPER_SCALE), Y: Math.round(p.z * CLIPPER_SCALE) }));
const fromPath = (path: IntPoint[]): SectionPoint[] => path.map((p) => ({ y: p.X / CLIPPER_SCALE, z: p.Y / CLIPPER_SCALE }));
const shapesToPaths = (shapes: readonly Shape[]): IntPoint[][] => shapes.flatMap((s) => [s.outer, ...s.holes]).map(toPath);

/** Outer contours of a poly tree with their holes, islands in holes as shapes of their own. */
function treeShapes(tree: PolyNode): Shape[] {
  const out: Shape[] = [];
  const walkOuter = (node: PolyNode): void => {
    const holes = node.Childs();
    out.push(shapeNormalised({ outer: fromPath(node.Contour()), holes: holes.map((h) => fromPath(h.Contour())) }));
    for (const h of holes) for (const island of h.Childs()) walkOuter(island);
  };
  for (const top of tree.Childs()) walkOuter(top);
  return out;
}

function assertFinite(shapes: readonly Shape[], where: string): void {
  for (const s of shapes) {
    for (const p of [s.outer, ...s.holes].flat()) {
      if (!Number.isFinite(p.y) || !Number.isFinite(p.z)) {
        throw new GeometryInputError([{ code: 'polygon-not-finite', message: `${where}: a point is not finite (y = ${p.y}, z = ${p.z})`, field: where, value: p }]);
      }
    }
  }
}

/**
 * The shapes grown (`deltaMm` > 0) or shrunk (< 0) by `deltaMm` normal to every edge, with round joins
 * whose chords stay within `arcToleranceMm` of the true arc (clipper-lib `ClipperOffset`, integer-scaled
 * by `CLIPPER_SCALE`; clipper also caps the tolerance at a quarter of |delta|). Holes move the other way,
 * so a ring frame's ring narrows from both sides when shrunk. Shrinking may split a shape or remove it:
 * the result is every shape that remains (empty when nothing does). Coordinates are rounded to 1/CLIPPER_SCALE mm.
 */
export function shapeOffset(shapes: readonly Shape[], deltaMm: number, arcToleranceMm: number = OFFSET_ARC_TOLERANCE_MM): Shape[] {
  assertFinite(shapes, 'shapeOffset');
  if (!Number.isFinite(deltaMm) || !(arcToleranceMm > 0)) {
    throw new GeometryInputError([{ code: 'offset-input', message: `an offset needs a finite distance and a positive arc tolerance, found ${deltaMm} and ${arcToleranceMm} mm`, field: 'deltaMm', value: deltaMm }]);
  }
  const offset = new ClipperLib.ClipperOffset(2, arcToleranceMm * CLIPPER_SCALE);
  offset.AddPaths(shapesToPaths(shapes.map(shapeNormalised)), ClipperLib.JoinType.jtRound, ClipperLib.EndType.etClosedPolygon);
  const tree = new ClipperLib.PolyTree();
  offset.Execute(tree, deltaMm * CLIPPER_SCALE);
  return treeShapes(tree);
}

/**
 * The shapes with corners rounded to `radiusMm`: `convex` corners by shrinking then growing by the radius
 * (which also drops any part narrower than twice the radius), `concave` corners by growing then
 * shrinking (which also closes any gap narrower than that). A ring frame's inner corners are the
 * convex corners of its hole, i.e. the concave corners of the ring: round them with `concave`.
 */
export function shapeCornersRounded(shapes: readonly Shape[], radiusMm: number, corners: 'convex' | 'concave', arcToleranceMm: number = OFFSET_ARC_TOLERANCE_MM): Shape[] {
  if (!(radiusMm >= 0) || !Number.isFinite(radiusMm)) {
    throw new GeometryInputError([{ code: 'corner-radius', message: `a corner radius must be a finite length of 0 mm or more, found ${radiusMm}`, field: 'radiusMm', value: radiusMm }]);
  }
  if (radiusMm === 0) return shapes.map(shapeNormalised);
  const sign = corners === 'convex' ? -1 : 1;
  return shapeOffset(shapeOffset(shapes, sign * radiusMm, arcToleranceMm), -sign * radiusMm, arcToleranceMm);
}

/** A simple loop offset by `deltaMm` (positive outward), as `shapeOffset` of the loop with no holes. */
export function polygonOffset(loop: Loop, deltaMm: number, arcToleranceMm: number = OFFSET_ARC_TOLERANCE_MM): Shape[] {
  return shapeOffset([{ outer: [...loop], holes: [] }], deltaMm, arcToleranceMm);
}

/** Boolean of two sets of shapes by clipper-lib (non-zero fill): union, intersection or a minus b. */
export function shapeBoolean(op: 'union' | 'intersection' | 'difference', a: readonly Shape[], b: readonly Shape[]): Shape[] {
  assertFinite([...a, ...b], `shapeBoolean(${op})`);
  const c = new ClipperLib.Clipper(0);
  c.AddPaths(shapesToPaths(a.map(shapeNormalised)), ClipperLib.PolyType.ptSubject, true);
  c.AddPaths(shapesToPaths(b.map(shapeNormalised)), ClipperLib.PolyType.ptClip, true);
  const type = op === 'union' ? ClipperLib.ClipType.ctUnion : op === 'intersection' ? ClipperLib.ClipType.ctIntersection : ClipperLib.ClipType.ctDifference;
  const tree = new ClipperLib.PolyTree();
  c.Execute(type, tree, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  return treeShapes(tree);
}
