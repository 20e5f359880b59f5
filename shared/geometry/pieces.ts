import { DEFAULT_SHEET, type Jointing, type LayerJoints, type Sheet } from './part-schema';
import { CLIPPER_SCALE, type Shape, polygonBounds, polygonCounterClockwise, polygonPointLocation, shapeBoolean } from './polygon';
import { GeometryInputError, POINT_TOLERANCE_MM, type SectionPoint } from './types';

/**
 * A layer's outline cut into the pieces it is made of: joints across the layer at stated girths (or a
 * number of pieces, the joints placed to clear the neighbouring layers' joints by the minimum stagger),
 * then any piece too large for the sheet split at butt-block joints.
 *
 * Girth is measured along an edge of the layer, normally its outer edge: from the lowest point where the
 * edge crosses the centreline (y = 0; the lowest point of the edge if it never does), positive toward
 * starboard, negative toward port. An open edge runs from its port end to its starboard end; a closed edge
 * goes all round (girths in (-P/2, P/2] for a perimeter P, distances between joints taken round the loop).
 * A joint is the straight cut square to the edge at its girth (to the bisector where it falls on a vertex),
 * across the material to the first boundary.
 */

/** The edge girths are measured along. */
export interface GirthEdge {
  points: SectionPoint[];
  closed: boolean;
}

/** A straight cut across the material (mm). */
export interface Cut {
  from: SectionPoint;
  to: SectionPoint;
}
/** A joint across a layer: its girth and the cut from the edge side to the far side. */
export interface Joint extends Cut {
  girthMm: number;
}

/** A layer in pieces. `buttBlocks`: the block over each butt joint, `buttBlockWidthMm` wide, clipped to the layer. */
export interface LayerPieces {
  pieces: Shape[];
  joints: Joint[];
  buttJoints: Cut[];
  buttBlocks: Shape[];
}

/** Width (mm) of the cut clipper-lib takes out at a joint: two clipper units, so pieces stay separate shapes. */
export const JOINT_CUT_WIDTH_MM = 2 / CLIPPER_SCALE;
/** How far (mm) the edge may lie outside the layer and still find it (the edge before the fillet clearance). */
export const JOINT_SNAP_MM = 10;

interface Girth {
  pts: SectionPoint[];
  cum: number[];
  total: number;
  closed: boolean;
  /** Arc length from pts[0] to the girth origin. */
  origin: number;
}

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

/** Refuses an edge girths cannot be measured along. */
function girthEdgeChecked(edge: GirthEdge): void {
  if (edge.points.length < 2) fail('girth-edge', 'edge', edge.points.length, `a girth edge needs at least two points, found ${edge.points.length}`);
}

function girthOf(edge: GirthEdge): Girth {
  girthEdgeChecked(edge);
  let pts = edge.closed ? polygonCounterClockwise(edge.points) : [...edge.points];
  if (!edge.closed && pts[0]!.y > pts[pts.length - 1]!.y) pts = pts.reverse();
  if (edge.closed) pts.push(pts[0]!);
  const cum = [0];
  for (let i = 1; i < pts.length; i++) cum.push(cum[i - 1]! + Math.hypot(pts[i]!.y - pts[i - 1]!.y, pts[i]!.z - pts[i - 1]!.z));
  let origin = -1;
  let originZ = Infinity;
  for (let i = 0; i + 1 < pts.length; i++) {
    const a = pts[i]!;
    const b = pts[i + 1]!;
    if ((a.y > 0 && b.y > 0) || (a.y < 0 && b.y < 0) || (a.y === b.y && a.y !== 0)) continue;
    const t = a.y === b.y ? 0 : a.y / (a.y - b.y);
    const z = a.z + t * (b.z - a.z);
    if (z < originZ) [origin, originZ] = [cum[i]! + t * (cum[i + 1]! - cum[i]!), z];
  }
  if (origin < 0) {
    let low = 0;
    pts.forEach((p, i) => {
      if (p.z < pts[low]!.z || (p.z === pts[low]!.z && Math.abs(p.y) < Math.abs(pts[low]!.y))) low = i;
    });
    origin = cum[low]!;
  }
  return { pts, cum, total: cum[cum.length - 1]!, closed: edge.closed, origin };
}

/** The girth range of an edge (mm): [min, max] for an open edge, (-P/2, P/2] for a closed one, and its length. */
export function girthRange(edge: GirthEdge): { minMm: number; maxMm: number; lengthMm: number; closed: boolean } {
  return rangeOf(girthOf(edge));
}

function rangeOf(g: Girth): { minMm: number; maxMm: number; lengthMm: number; closed: boolean } {
  return g.closed ? { minMm: -g.total / 2, maxMm: g.total / 2, lengthMm: g.total, closed: true } : { minMm: -g.origin, maxMm: g.total - g.origin, lengthMm: g.total, closed: false };
}

/** The point at girth g (mm) and the unit normal into the layer there (to the left of the edge), or null off an open edge. */
export function girthPoint(edge: GirthEdge, girthMm: number, toleranceMm: number = POINT_TOLERANCE_MM): { point: SectionPoint; inward: SectionPoint } | null {
  return pointOf(girthOf(edge), girthMm, toleranceMm);
}

/** `girthPoint` at each of several girths (mm) along one edge, its girths measured once. */
export function girthPoints(edge: GirthEdge, girthsMm: readonly number[], toleranceMm: number = POINT_TOLERANCE_MM): ({ point: SectionPoint; inward: SectionPoint } | null)[] {
  if (girthsMm.length === 0) return [];
  const g = girthOf(edge);
  return girthsMm.map((gm) => pointOf(g, gm, toleranceMm));
}

function pointOf(g: Girth, girthMm: number, tol: number): { point: SectionPoint; inward: SectionPoint } | null {
  let s = g.origin + girthMm;
  if (g.closed) s = ((s % g.total) + g.total) % g.total;
  else if (s < -tol || s > g.total + tol) return null;
  s = Math.max(0, Math.min(g.total, s));
  let i = 0;
  while (i < g.pts.length - 2 && (g.cum[i + 1]! < s || g.cum[i + 1] === g.cum[i])) i++;
  const a = g.pts[i]!;
  const b = g.pts[i + 1]!;
  const len = g.cum[i + 1]! - g.cum[i]!;
  const t = len === 0 ? 0 : (s - g.cum[i]!) / len;
  const point = { y: a.y + t * (b.y - a.y), z: a.z + t * (b.z - a.z) };
  // Square to the segment inside it; at a vertex square to the bisector, so a joint there cuts evenly.
  const atVertex = s - g.cum[i]! <= tol ? i : g.cum[i + 1]! - s <= tol ? i + 1 : -1;
  if (atVertex < 0) return { point, inward: segmentInward(g, i) };
  const last = g.pts.length - 2;
  const before = atVertex > 0 ? atVertex - 1 : g.closed ? last : 0;
  const after = atVertex <= last ? atVertex : g.closed ? 0 : last;
  const n0 = segmentInward(g, before);
  const n1 = segmentInward(g, after);
  const ln = Math.hypot(n0.y + n1.y, n0.z + n1.z);
  return { point, inward: ln < 1e-12 ? n1 : { y: (n0.y + n1.y) / ln, z: (n0.z + n1.z) / ln } };
}

/** Unit normal to the left of segment i (into the layer for an edge run counter-clockwise). */
function segmentInward(g: Girth, i: number): SectionPoint {
  const a = g.pts[i]!;
  const b = g.pts[i + 1]!;
  const len = Math.hypot(b.y - a.y, b.z - a.z);
  return len === 0 ? { y: 0, z: 1 } : { y: -(b.z - a.z) / len, z: (b.y - a.y) / len };
}

/** Inside the layer: inside its outer loop and not in a hole. */
const inMaterial = (shape: Shape, p: SectionPoint): boolean =>
  polygonPointLocation(shape.outer, p, 0) === 'inside' && shape.holes.every((h) => polygonPointLocation(h, p, 0) !== 'inside');

/** Stretches [t0, t1] of the line p + t*dir that lie in the layer, in order of t. */
function materialSpans(shapes: readonly Shape[], p: SectionPoint, dir: SectionPoint): [number, number][] {
  const ts: number[] = [];
  for (const loop of shapes.flatMap((s) => [s.outer, ...s.holes])) {
    for (let i = 0; i < loop.length; i++) {
      const a = loop[i]!;
      const b = loop[(i + 1) % loop.length]!;
      const ey = b.y - a.y;
      const ez = b.z - a.z;
      const den = dir.y * ez - dir.z * ey;
      if (den === 0) continue;
      const t = ((a.y - p.y) * ez - (a.z - p.z) * ey) / den;
      const u = ((a.y - p.y) * dir.z - (a.z - p.z) * dir.y) / den;
      if (u >= 0 && u <= 1) ts.push(t);
    }
  }
  ts.sort((x, y) => x - y);
  const spans: [number, number][] = [];
  for (let k = 0; k + 1 < ts.length; k++) {
    const m = (ts[k]! + ts[k + 1]!) / 2;
    if (ts[k + 1]! - ts[k]! > 1e-9 && shapes.some((s) => inMaterial(s, { y: p.y + m * dir.y, z: p.z + m * dir.z }))) {
      const last = spans[spans.length - 1];
      if (last && Math.abs(last[1] - ts[k]!) <= 1e-9) last[1] = ts[k + 1]!;
      else spans.push([ts[k]!, ts[k + 1]!]);
    }
  }
  return spans;
}

/** A thin rectangle (the saw cut clipper removes) along a to b, run on `overrun` mm past each end. */
function knife(a: SectionPoint, b: SectionPoint, overrun: [number, number]): Shape {
  const len = Math.hypot(b.y - a.y, b.z - a.z);
  const u = { y: (b.y - a.y) / len, z: (b.z - a.z) / len };
  const w = JOINT_CUT_WIDTH_MM / 2;
  const s = { y: a.y - u.y * overrun[0], z: a.z - u.z * overrun[0] };
  const e = { y: b.y + u.y * overrun[1], z: b.z + u.z * overrun[1] };
  return { outer: [{ y: s.y + u.z * w, z: s.z - u.y * w }, { y: e.y + u.z * w, z: e.z - u.y * w }, { y: e.y - u.z * w, z: e.z + u.y * w }, { y: s.y - u.z * w, z: s.z + u.y * w }], holes: [] };
}

/**
 * The layer `shape` cut at joints at `girthsMm` along `edge` (see the file's note); with no girths, the
 * shape itself. Pieces come back as shapes (clipper-lib difference with a cut `JOINT_CUT_WIDTH_MM` wide,
 * so their areas sum to the layer's less that cut).
 * @throws GeometryInputError for a girth off an open edge or a joint that does not meet the layer within
 *   `snapMm` of the edge.
 */
export function piecesOfLayer(shape: Shape, edge: GirthEdge, girthsMm: readonly number[], snapMm: number = JOINT_SNAP_MM): { pieces: Shape[]; joints: Joint[] } {
  return layerCutAlong(shape, girthOf(edge), girthsMm, snapMm);
}

/** `piecesOfLayer` on an edge whose girths are measured already. */
function layerCutAlong(shape: Shape, g: Girth, girthsMm: readonly number[], snapMm: number): { pieces: Shape[]; joints: Joint[] } {
  const joints: Joint[] = [];
  const knives: Shape[] = [];
  for (const girthMm of girthsMm) {
    const at = pointOf(g, girthMm, POINT_TOLERANCE_MM);
    if (at === null) fail('joint-off-edge', 'joints.girthsMm', girthMm, `a joint at girth ${girthMm} mm is off the edge, which runs from ${-g.origin} to ${g.total - g.origin} mm`);
    const spans = materialSpans([shape], at!.point, at!.inward);
    const k = spans.findIndex(([, t1]) => t1 > 0);
    const span = spans[k];
    if (span === undefined || span[0] > snapMm) fail('joint-misses-layer', 'joints.girthsMm', girthMm, `a joint at girth ${girthMm} mm does not meet the layer within ${snapMm} mm of the edge`);
    const [t0, t1] = span!;
    const before = k > 0 ? (t0 - spans[k - 1]![1]) / 2 : 1;
    const after = k + 1 < spans.length ? (spans[k + 1]![0] - t1) / 2 : 1;
    const p = at!.point;
    const n = at!.inward;
    const from = { y: p.y + n.y * t0, z: p.z + n.z * t0 };
    const to = { y: p.y + n.y * t1, z: p.z + n.z * t1 };
    joints.push({ girthMm, from, to });
    knives.push(knife(from, to, [Math.min(1, before), Math.min(1, after)]));
  }
  return { pieces: knives.length === 0 ? [shape] : shapeBoolean('difference', [shape], knives), joints };
}

/** Distance (mm) between two girths: straight on an open edge, round the loop (perimeter `period`) on a closed one. */
function girthGap(a: number, b: number, period: number | null): number {
  const d = Math.abs(a - b);
  if (period === null) return d;
  const m = d % period;
  return Math.min(m, period - m);
}

/**
 * Joint girths for every layer (index for index with `layers`), neighbouring layers' joints at least
 * `minStaggerMm` apart. Layers with stated girths keep them. A layer given as a number of pieces gets them
 * of equal girth (an open edge: n - 1 joints; a closed one: n joints, none for one piece), all shifted
 * together by the least amount, at most half a piece, that clears the joints of both neighbours already
 * known (stated, or placed earlier in order).
 * @throws GeometryInputError naming the layers when no shift clears the neighbours, when two stated layers
 *   are too close, or when a stated girth is off the edge.
 */
export function piecesJointGirths(layers: readonly { edge: GirthEdge; joints: LayerJoints }[], minStaggerMm: number): number[][] {
  const edges = layers.map((l) => girthOf(l.edge));
  return jointGirthsAlong((i) => edges[i]!, layers, minStaggerMm);
}

/**
 * `piecesJointGirths` with each layer's edge measured by `edgeAt(i)` (index for index with the layers), called
 * only for a layer that has joints to place or check: a layer in one piece has none on either kind of edge.
 */
function jointGirthsAlong(edgeAt: (i: number) => Girth, layers: readonly { joints: LayerJoints }[], minStaggerMm: number): number[][] {
  const rangeAt = (i: number): ReturnType<typeof rangeOf> => rangeOf(edgeAt(i));
  const known: (number[] | null)[] = layers.map((l, i) => {
    if (l.joints.by !== 'girth') return null;
    const r = rangeAt(i);
    for (const gm of l.joints.girthsMm) {
      if (!r.closed && (gm < r.minMm - POINT_TOLERANCE_MM || gm > r.maxMm + POINT_TOLERANCE_MM)) {
        fail('joint-off-edge', `layers.${i}.joints.girthsMm`, gm, `layer ${i + 1}: a joint at girth ${gm} mm is off the edge, which runs from ${r.minMm.toFixed(1)} to ${r.maxMm.toFixed(1)} mm`);
      }
    }
    return [...l.joints.girthsMm];
  });
  const tooClose = (a: number[], b: number[], period: number | null): [number, number] | null => {
    for (const x of a) for (const y of b) if (girthGap(x, y, period) < minStaggerMm - 1e-9) return [x, y];
    return null;
  };
  layers.forEach((l, i) => {
    if (l.joints.by === 'girth' || known[i] !== null) return;
    const n = l.joints.pieces;
    if (n === 1) {
      known[i] = [];
      return;
    }
    const r = rangeAt(i);
    const base = r.closed ? (n < 2 ? [] : Array.from({ length: n }, (_, k) => -r.lengthMm / 2 + ((k + 0.5) * r.lengthMm) / n)) : Array.from({ length: n - 1 }, (_, k) => r.minMm + ((k + 1) * (r.maxMm - r.minMm)) / n);
    const neighbours = [known[i - 1], known[i + 1]].filter((x): x is number[] => Array.isArray(x)).flat();
    const period = r.closed ? r.lengthMm : null;
    const limit = (r.closed ? r.lengthMm : r.maxMm - r.minMm) / (2 * n);
    const wraps = period === null ? [0] : [-period, 0, period];
    const forbidden: [number, number][] = [];
    for (const b of base) for (const q of neighbours) for (const w of wraps) forbidden.push([q + w - b - minStaggerMm, q + w - b + minStaggerMm]);
    const candidates = [0, ...forbidden.flat()].filter((s) => Math.abs(s) <= limit + 1e-9).sort((a, b) => Math.abs(a) - Math.abs(b) || b - a);
    const shift = candidates.find((s) => forbidden.every(([lo, hi]) => s <= lo + 1e-9 || s >= hi - 1e-9));
    if (shift === undefined) {
      fail('joint-stagger', `layers.${i}.joints`, n, `layer ${i + 1}: no placing of ${n} pieces keeps its joints ${minStaggerMm} mm from the joints of the layers beside it; use fewer pieces, a smaller stagger or state the joints`);
    }
    known[i] = base.map((b) => {
      const gm = b + shift!;
      return period === null ? gm : gm > period / 2 ? gm - period : gm <= -period / 2 ? gm + period : gm;
    });
  });
  const out = known.map((k) => k ?? []);
  for (let i = 0; i + 1 < out.length; i++) {
    if (out[i]!.length === 0 || out[i + 1]!.length === 0) continue;
    const r = rangeAt(i);
    const hit = tooClose(out[i]!, out[i + 1]!, r.closed ? r.lengthMm : null);
    if (hit) fail('joint-stagger', `layers.${i + 1}.joints`, hit, `layers ${i + 1} and ${i + 2} have joints at girths ${hit[0]} and ${hit[1]} mm, closer than the minimum stagger of ${minStaggerMm} mm`);
  }
  return out;
}

/** True when the shape's bounding box fits the sheet either way round (within `toleranceMm`). */
export function pieceFitsSheet(shape: Shape, sheet: Sheet = DEFAULT_SHEET, toleranceMm: number = POINT_TOLERANCE_MM): boolean {
  const b = polygonBounds(shape.outer);
  if (b === null) return true;
  const w = b.maxY - b.minY - toleranceMm;
  const h = b.maxZ - b.minZ - toleranceMm;
  return (w <= sheet.widthMm && h <= sheet.lengthMm) || (w <= sheet.lengthMm && h <= sheet.widthMm);
}

/**
 * The pieces with any that does not fit the sheet split into a grid of equal slabs of its bounding box,
 * as few as fit either way round; each cut line across the material is a butt joint and gets a butt block
 * `buttBlockWidthMm` wide centred on it, clipped to the piece.
 */
export function piecesFittingSheet(pieces: readonly Shape[], sheet: Sheet = DEFAULT_SHEET, buttBlockWidthMm = 100): { pieces: Shape[]; buttJoints: Cut[]; buttBlocks: Shape[] } {
  const out: Shape[] = [];
  const buttJoints: Cut[] = [];
  const buttBlocks: Shape[] = [];
  for (const piece of pieces) {
    if (pieceFitsSheet(piece, sheet)) {
      out.push(piece);
      continue;
    }
    const b = polygonBounds(piece.outer)!;
    const w = b.maxY - b.minY;
    const h = b.maxZ - b.minZ;
    const grid = (a: number, c: number): [number, number] => [Math.ceil(w / a - 1e-9), Math.ceil(h / c - 1e-9)];
    const [g1, g2] = [grid(sheet.widthMm, sheet.lengthMm), grid(sheet.lengthMm, sheet.widthMm)];
    const [nx, ny] = g1[0] * g1[1] <= g2[0] * g2[1] ? g1 : g2;
    const ys = Array.from({ length: nx + 1 }, (_, i) => (i === 0 ? b.minY - 1 : i === nx ? b.maxY + 1 : b.minY + (i * w) / nx));
    const zs = Array.from({ length: ny + 1 }, (_, j) => (j === 0 ? b.minZ - 1 : j === ny ? b.maxZ + 1 : b.minZ + (j * h) / ny));
    for (let i = 0; i < nx; i++) {
      for (let j = 0; j < ny; j++) out.push(...shapeBoolean('intersection', [piece], [rect(ys[i]!, zs[j]!, ys[i + 1]!, zs[j + 1]!)]));
    }
    const half = buttBlockWidthMm / 2;
    for (let i = 1; i < nx; i++) {
      for (const [t0, t1] of materialSpans([piece], { y: ys[i]!, z: 0 }, { y: 0, z: 1 })) buttJoints.push({ from: { y: ys[i]!, z: t0 }, to: { y: ys[i]!, z: t1 } });
      buttBlocks.push(...shapeBoolean('intersection', [piece], [rect(ys[i]! - half, b.minZ - 1, ys[i]! + half, b.maxZ + 1)]));
    }
    for (let j = 1; j < ny; j++) {
      for (const [t0, t1] of materialSpans([piece], { y: 0, z: zs[j]! }, { y: 1, z: 0 })) buttJoints.push({ from: { y: t0, z: zs[j]! }, to: { y: t1, z: zs[j]! } });
      buttBlocks.push(...shapeBoolean('intersection', [piece], [rect(b.minY - 1, zs[j]! - half, b.maxY + 1, zs[j]! + half)]));
    }
  }
  return { pieces: out, buttJoints, buttBlocks };
}

const rect = (y0: number, z0: number, y1: number, z1: number): Shape => ({ outer: [{ y: y0, z: z0 }, { y: y1, z: z0 }, { y: y1, z: z1 }, { y: y0, z: z1 }], holes: [] });

/**
 * Every layer of a part in pieces: joint girths staggered (`piecesJointGirths`, `jointing.minStaggerMm`),
 * each layer cut at its joints (`piecesOfLayer`), then split to fit `jointing.sheet` at butt blocks.
 * `layers[k]` gives layer k's shape, the edge its girths run along and its joints (from the schema).
 */
export function piecesOfLayers(layers: readonly { shape: Shape; edge: GirthEdge; joints: LayerJoints }[], jointing: Jointing): LayerPieces[] {
  // Each edge's girths measured at most once, for placing the joints and for cutting at them, and not at all
  // for a layer with no joints (one piece): a frame's outline is hundreds of points.
  for (const l of layers) girthEdgeChecked(l.edge);
  const measured: Girth[] = [];
  const edgeAt = (i: number): Girth => (measured[i] ??= girthOf(layers[i]!.edge));
  const girths = jointGirthsAlong(edgeAt, layers, jointing.minStaggerMm);
  return layers.map((l, i) => {
    const cut = girths[i]!.length === 0 ? { pieces: [l.shape], joints: [] } : layerCutAlong(l.shape, edgeAt(i), girths[i]!, JOINT_SNAP_MM);
    const fitted = piecesFittingSheet(cut.pieces, jointing.sheet, jointing.buttBlockWidthMm);
    return { pieces: fitted.pieces, joints: cut.joints, buttJoints: fitted.buttJoints, buttBlocks: fitted.buttBlocks };
  });
}
