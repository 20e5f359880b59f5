import { deductionAt } from './deduction';
import type { EdgePoint } from './edge';
import type { PartFaces } from './frame-faces';
import type { BuiltHull } from './hull';
import type { Station } from './hull-schema';
import { layerFaceDepths, markedFaceAuto, thicknessDirectionOf } from './layers';
import type { ContactRun } from './marks';
import { type OutlineRun, edgePointMirrored, hullEdgeOpen, loopMirrored, outlineContactRuns, outlineEdgeLength, outlineRuns } from './outline';
import type { PartIssue, Transom } from './part-schema';
import { splineFit, splineValueAt } from './spline';
import { CHORD_TOLERANCE_MM, GeometryInputError, type SectionPoint } from './types';

/**
 * A flat transom raked from the vertical, cut to its true (expanded) shape.
 *
 * The transom's face is the plane through the station's x at the pivot height, leaning its top aft by the
 * rake theta: x(z) = xs + sigma tan(theta) (z - pivotZ), sigma = +1 when x grows aft. Its unit normal in
 * (x, z) is N = (cos theta, -sigma sin theta); a face s further along N (a layer's depth) is the same plane
 * moved to x(z) = xs + s / cos(theta) + sigma tan(theta) (z - pivotZ). The frame's edge on a face is that
 * plane cut through the inside of the skin (the deducted surface: skin and clearance set in normal to the
 * hull), found from deductions at sample x's across the plane's reach: each run of the outline (between
 * corners) is followed at fixed fractions of its length from sample to sample (a cubic along x), and where
 * that path meets the plane is a point of the edge.
 *
 * Expansion: a point on the plane at height z lies (z - z0) / cos(theta) from the pivot line along the face
 * (it is (z - z0) above it and (z - z0) tan(theta) aft: sqrt(1 + tan^2) = 1 / cos). The template keeps y and
 * puts that true height above the pivot height: zT = pivotZ + (z - z0) / cos(theta), z0 = pivotZ - sigma s
 * sin(theta) being where face s's pivot line is (face 0: the pivot itself). Derived.
 *
 * Bevels come from the two outer faces: the far face's edge, in the same expanded frame, stands off the
 * marked face's edge by m along its normal; tan(bevel) = m / thickness.
 */

/** Sections sampled across the plane's reach along x (a cubic through them follows each point of the outline). */
export const TRANSOM_SAMPLES = 9;
/** How far (as a fraction of the end station spacing) the lines may be carried past the last station to reach a raked transom. */
export const TRANSOM_EXTENSION_FRACTION = 0.5;

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

/**
 * The hull with every line that reaches an end station carried on past it by `byMm` along its end cubic
 * (spline.ts continues the end span), so a raked transom's top can be cut beyond the last station.
 */
export function hullExtended(hull: BuiltHull, byMm: number): BuiltHull {
  if (!(byMm > 0)) return hull;
  const fitted = hull.fitted.map((f) => ({
    ...f,
    xMin: Math.abs(f.xMin - hull.xMin) < 1e-6 ? f.xMin - byMm : f.xMin,
    xMax: Math.abs(f.xMax - hull.xMax) < 1e-6 ? f.xMax + byMm : f.xMax,
  }));
  return { ...hull, fitted, xMin: hull.xMin - byMm, xMax: hull.xMax + byMm };
}

/** The point a fraction u of the way along a polyline by length (`cum` its cumulative lengths). */
function atFraction(pts: readonly SectionPoint[], cum: readonly number[], u: number): SectionPoint {
  const s = u * cum[cum.length - 1]!;
  let i = 0;
  while (i < cum.length - 2 && cum[i + 1]! < s) i++;
  const len = cum[i + 1]! - cum[i]!;
  const f = len > 0 ? (s - cum[i]!) / len : 0;
  const a = pts[i]!;
  const b = pts[i + 1] ?? a;
  return { y: a.y + f * (b.y - a.y), z: a.z + f * (b.z - a.z) };
}

const cumOf = (pts: readonly SectionPoint[]): number[] => {
  const c = [0];
  for (let i = 1; i < pts.length; i++) c.push(c[i - 1]! + Math.hypot(pts[i]!.y - pts[i - 1]!.y, pts[i]!.z - pts[i - 1]!.z));
  return c;
};

/** The transom's plane: station x, pivot height, rake and which way x grows. */
export interface TransomPlane {
  x: number;
  pivotZ: number;
  rakeRad: number;
  xDirection: 'aft' | 'forward';
}

/** The expanded half outlines of the transom's faces (offsets `s` mm along its normal), and how far the lines were carried on. */
export interface TransomExpansion {
  faces: EdgePoint[][];
  linesExtendedMm: number;
}

/**
 * The faces of a raked flat transom, expanded (see the file's note): for each offset s (mm along the plane's
 * normal, which points toward larger x), the starboard half outline in template coordinates, starting on
 * the centreline at the bottom, as deduction.ts lays it out (edge kinds and corners kept; rates 0).
 * @throws GeometryInputError where the plane reaches beyond the lines by more than `TRANSOM_EXTENSION_FRACTION`
 *   of the end station spacing, or the hull's outline changes its corners across the plane's reach.
 */
export function transomExpanded(hull: BuiltHull, plane: TransomPlane, offsetsMm: readonly number[], clearanceMm: number, toleranceMm: number = CHORD_TOLERANCE_MM): TransomExpansion {
  const sigma = plane.xDirection === 'aft' ? 1 : -1;
  const c = Math.cos(plane.rakeRad);
  const t = Math.tan(plane.rakeRad);
  const sn = Math.sin(plane.rakeRad);
  const xOf = (s: number, z: number): number => plane.x + s / c + sigma * t * (z - plane.pivotZ);
  const base = deductionAt(hull, plane.x, { filletClearanceMm: clearanceMm, chordToleranceMm: toleranceMm });
  if (!base) return fail('hull-does-not-reach', 'stationId', plane.x, `the hull does not reach x = ${plane.x} mm`);
  let zMin = Infinity;
  let zMax = -Infinity;
  for (const p of base!.outline) [zMin, zMax] = [Math.min(zMin, p.z), Math.max(zMax, p.z)];
  const pad = 0.1 * (zMax - zMin) + 10;
  let x0 = Infinity;
  let x1 = -Infinity;
  for (const s of offsetsMm) for (const z of [zMin - pad, zMax + pad]) [x0, x1] = [Math.min(x0, xOf(s, z)), Math.max(x1, xOf(s, z))];
  [x0, x1] = [x0 - 2, x1 + 2];
  const st = hull.stations;
  const beyond = Math.max(0, hull.xMin - x0, x1 - hull.xMax);
  let h = hull;
  if (beyond > 0) {
    const endSpacing = x1 > hull.xMax ? st[st.length - 1]!.x - st[st.length - 2]!.x : st[1]!.x - st[0]!.x;
    const limit = TRANSOM_EXTENSION_FRACTION * endSpacing;
    if (beyond > limit) fail('hull-does-not-reach', 'rakeRad', plane.rakeRad, `the raked transom reaches x = ${(x1 > hull.xMax ? x1 : x0).toFixed(1)} mm, ${beyond.toFixed(1)} mm past the end of the lines; they may be carried on by at most ${limit.toFixed(1)} mm (half the end station spacing)`);
    h = hullExtended(hull, beyond + 1);
  }
  const xs = Array.from({ length: TRANSOM_SAMPLES }, (_, k) => x0 + ((x1 - x0) * k) / (TRANSOM_SAMPLES - 1));
  const samples: OutlineRun[][] = xs.map((x) => {
    const d = deductionAt(h, x, { filletClearanceMm: clearanceMm, chordToleranceMm: toleranceMm });
    if (!d) return fail('hull-does-not-reach', 'rakeRad', plane.rakeRad, `the hull has no section at x = ${x.toFixed(1)} mm, where the raked transom reaches`);
    return outlineRuns(d!.outline);
  });
  const mid = samples[(TRANSOM_SAMPLES - 1) >> 1]!;
  for (const runs of samples) {
    if (runs.length !== mid.length || runs.some((r, i) => r.kind !== mid[i]!.kind)) {
      fail('transom-outline-changes', 'rakeRad', plane.rakeRad, `the hull's outline changes its corners between x = ${x0.toFixed(0)} and ${x1.toFixed(0)} mm, across the raked transom (a line starts or ends there): cut it with less rake or move the pivot`);
    }
  }
  const faces: EdgePoint[][] = offsetsMm.map(() => []);
  mid.forEach((run, r) => {
    const midPts = run.points;
    const midCum = cumOf(midPts);
    const us = midCum.map((v) => v / (midCum[midCum.length - 1] || 1));
    const perSample = samples.map((runs) => {
      const pts = runs[r]!.points;
      return { pts, cum: cumOf(pts) };
    });
    const pointsPerFace: SectionPoint[][] = offsetsMm.map(() => []);
    for (const u of us) {
      const at = perSample.map((p) => atFraction(p.pts, p.cum, u));
      const ySp = splineFit(xs, at.map((p) => p.y));
      const zSp = splineFit(xs, at.map((p) => p.z));
      offsetsMm.forEach((s, f) => {
        const x = planeCrossing(xs, (xx) => xx - xOf(s, splineValueAt(zSp, xx)));
        if (x === null) fail('transom-plane-misses', 'rakeRad', plane.rakeRad, 'the transom plane misses the hull across the sampled reach: reduce the rake');
        const z = splineValueAt(zSp, x!);
        const z0 = plane.pivotZ - sigma * s * sn;
        pointsPerFace[f]!.push({ y: Math.max(0, splineValueAt(ySp, x!)), z: plane.pivotZ + (z - z0) / c });
      });
    }
    pointsPerFace.forEach((pts, f) => faces[f]!.push(...pts.map((p, i) => edgePointOf(p, run.kind, i === 0 || i === pts.length - 1))));
  });
  return { faces: faces.map(finishHalf), linesExtendedMm: beyond > 0 ? beyond : 0 };
}

/** The root of F (monotone across the samples in practice) between sample x's: bracketed, then regula falsi (Illinois). */
function planeCrossing(xs: readonly number[], F: (x: number) => number): number | null {
  let a = xs[0]!;
  let fa = F(a);
  for (let k = 1; k < xs.length; k++) {
    const b0 = xs[k]!;
    const fb0 = F(b0);
    if (fa === 0) return a;
    if (fa * fb0 <= 0) {
      let b = b0;
      let fb = fb0;
      let side = 0;
      for (let it = 0; it < 60 && Math.abs(b - a) > 1e-9; it++) {
        const m = (a * fb - b * fa) / (fb - fa);
        const fm = F(m);
        if (fm * fb > 0) {
          [b, fb] = [m, fm];
          if (side === -1) fa /= 2;
          side = -1;
        } else {
          [a, fa] = [m, fm];
          if (side === 1) fb /= 2;
          side = 1;
        }
        if (Math.abs(fm) < 1e-10) return m;
      }
      return (a + b) / 2;
    }
    [a, fa] = [b0, fb0];
  }
  return null;
}

function edgePointOf(p: SectionPoint, kind: EdgePoint['edge'], corner: boolean): EdgePoint {
  return { y: p.y, z: p.z, ny: 0, nz: 0, rate: 0, bevel: 0, girthMm: 0, setInMm: 0, edge: kind, corner };
}

/**
 * Normals (outward: right of travel, the half runs counter-clockwise) from the polyline, girths along it
 * (hull edge from the centreline at the bottom, deck edge from the centreline at the top), the first
 * point on the centreline.
 */
function finishHalf(half: EdgePoint[]): EdgePoint[] {
  const n = half.length;
  const segN = (i: number): SectionPoint => {
    const a = half[i]!;
    const b = half[i + 1]!;
    const len = Math.hypot(b.y - a.y, b.z - a.z);
    return len === 0 ? { y: 0, z: 0 } : { y: (b.z - a.z) / len, z: -(b.y - a.y) / len };
  };
  const same = (i: number, j: number): boolean => j >= 0 && j < n && Math.hypot(half[i]!.y - half[j]!.y, half[i]!.z - half[j]!.z) < 1e-9;
  for (let i = 0; i < n; i++) {
    // A corner given twice: each copy takes the normal of its own side only (the zero-length step is skipped).
    const before = i > 0 && !same(i, i - 1) ? segN(i - 1) : { y: 0, z: 0 };
    const after = i < n - 1 && !same(i, i + 1) ? segN(i) : { y: 0, z: 0 };
    const sy = before.y + after.y;
    const sz = before.z + after.z;
    const len = Math.hypot(sy, sz) || 1;
    half[i]!.ny = sy / len;
    half[i]!.nz = sz / len;
  }
  let g = 0;
  for (let i = 0; i < n; i++) {
    if (i > 0 && half[i]!.edge !== 'deck') g += Math.hypot(half[i]!.y - half[i - 1]!.y, half[i]!.z - half[i - 1]!.z);
    if (half[i]!.edge !== 'deck') half[i]!.girthMm = g;
  }
  let gd = 0;
  for (let i = n - 1; i >= 0; i--) {
    if (half[i]!.edge !== 'deck') break;
    if (i < n - 1) gd += Math.hypot(half[i]!.y - half[i + 1]!.y, half[i]!.z - half[i + 1]!.z);
    half[i]!.girthMm = gd;
  }
  if (half[0]) half[0].y = 0;
  if (half[n - 1]) half[n - 1]!.y = 0;
  return half;
}

/** Signed distance (mm) from p along its outward normal to the nearest crossing of `loop`, or 0 when none. */
function moveAlongNormal(p: EdgePoint, loop: readonly SectionPoint[]): number {
  let best: number | null = null;
  for (let i = 0; i < loop.length; i++) {
    const a = loop[i]!;
    const b = loop[(i + 1) % loop.length]!;
    const ey = b.y - a.y;
    const ez = b.z - a.z;
    const den = p.ny * ez - p.nz * ey;
    if (Math.abs(den) < 1e-12) continue;
    const tt = ((a.y - p.y) * ez - (a.z - p.z) * ey) / den;
    const u = ((a.y - p.y) * p.nz - (a.z - p.z) * p.ny) / den;
    if (u >= -1e-9 && u <= 1 + 1e-9 && (best === null || Math.abs(tt) < Math.abs(best))) best = tt;
  }
  return best ?? 0;
}

/**
 * The faces of a raked transom part (see the file's note). The marked face lies on the given plane;
 * `auto` marks the face toward the larger section, as for every frame.
 */
export function transomFaces(hull: BuiltHull, part: Transom, station: Station, toleranceMm: number): PartFaces {
  const xDir = hull.lines.xDirection;
  const warnings: PartIssue[] = [];
  const atStation = deductionAt(hull, station.x, { filletClearanceMm: part.filletClearanceMm, chordToleranceMm: toleranceMm });
  if (!atStation) fail('hull-does-not-reach', 'stationId', station.x, `the hull does not reach station ${station.name} (x = ${station.x} mm)`);
  const markedFace = part.markedFace === 'auto' ? markedFaceAuto(hull, station.x, atStation!.outline) : part.markedFace;
  const dir = thicknessDirectionOf(markedFace, xDir);
  const depths = layerFaceDepths(part.layers);
  const plane: TransomPlane = { x: station.x, pivotZ: part.pivotZ, rakeRad: part.rakeRad, xDirection: xDir };
  const ex = transomExpanded(hull, plane, depths.map((d) => dir * d), part.filletClearanceMm, toleranceMm);
  if (ex.linesExtendedMm > 0) {
    warnings.push({ code: 'transom-beyond-lines', message: `the raked transom reaches ${ex.linesExtendedMm.toFixed(1)} mm past the end of the lines; they are carried on along their end curves to meet it`, field: 'rakeRad', path: ['rakeRad'], value: part.rakeRad });
  }
  const c = Math.cos(part.rakeRad);
  const halves = ex.faces;
  const far = loopMirrored(halves[halves.length - 1]!);
  // Bevel from the two outer faces: rate such that bevel.ts reads move = rate * dir * siding (see layers.ts).
  const T = part.thicknessMm;
  for (const p of halves[0]!) if (p.edge !== 'closure') {
    p.rate = (moveAlongNormal(p, far) * dir) / T;
    p.bevel = Math.atan(Math.abs(p.rate));
  }
  const runs = outlineContactRuns(halves[0]!);
  const mirror = (pts: EdgePoint[]): EdgePoint[] => pts.map(edgePointMirrored);
  const contact: ContactRun[] = [];
  for (const pts of [runs.hull, runs.deck]) if (pts.length > 1) contact.push({ points: pts, side: 'starboard' }, { points: mirror(pts), side: 'port' });
  return {
    plane: 'transom-expanded',
    markedFace,
    markedFaceFrom: part.markedFace === 'auto' ? 'auto' : 'stated',
    direction: dir,
    markedFaceX: station.x,
    otherFaceX: station.x + (dir * T) / c,
    faces: halves.map((half, i) => {
      const edge = hullEdgeOpen(half);
      return { x: station.x + (dir * depths[i]!) / c, depthMm: depths[i]!, regions: [{ outer: loopMirrored(half), holes: [] }], girthEdges: [{ points: edge, closed: false }], hullEdge: edge, notches: [], ring: null };
    }),
    contact,
    frame: { markedFace, sidingMm: T, xDirection: xDir },
    jointLengthMm: 2 * outlineEdgeLength(halves[0]!, ['hull', 'deck']),
    templateZ: (hz) => part.pivotZ + (hz - part.pivotZ) / c,
    transom: { rakeRad: part.rakeRad, pivotZ: part.pivotZ, linesExtendedMm: ex.linesExtendedMm },
    warnings,
  };
}
