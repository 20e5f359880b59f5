import { Bezier } from 'bezier-js';
import { CHORD_TOLERANCE_MM, type SectionPoint } from './types';

/**
 * Cubic Bezier segments in the section plane and their adaptive flattening. A segment is plain data
 * (four points); `curveBezierJs` turns one into a bezier-js curve for callers that want its toolbox
 * (length, projection, offsets, export). The hot path evaluates the cubic by hand: bezier-js `get` costs
 * about five times the arithmetic, and the editor flattens sections on every pointer move.
 */

/** A cubic Bezier segment in the section plane (mm): end points p0, p3 and control points p1, p2. */
export interface CubicSegment {
  p0: SectionPoint;
  p1: SectionPoint;
  p2: SectionPoint;
  p3: SectionPoint;
}

/** The same cubic as eight numbers [a0, b0, a1, b1, a2, b2, a3, b3], for planes other than a section's. */
export type CubicCoords = readonly [number, number, number, number, number, number, number, number];

/** Deepest subdivision when flattening: 2^-24 of a segment is far below any chord tolerance in use. */
const MAX_DEPTH = 24;

/**
 * Cubic Hermite span to Bezier: ends q0, q1 with derivatives d0, d1 with respect to a parameter that
 * runs over a span of length `h`. Exact (the same cubic), so nothing is lost converting.
 */
export function curveFromHermite(q0: SectionPoint, d0: SectionPoint, q1: SectionPoint, d1: SectionPoint, h: number): CubicSegment {
  const k = h / 3;
  return {
    p0: { y: q0.y, z: q0.z },
    p1: { y: q0.y + k * d0.y, z: q0.z + k * d0.z },
    p2: { y: q1.y - k * d1.y, z: q1.z - k * d1.z },
    p3: { y: q1.y, z: q1.z },
  };
}

/** Point of the segment at parameter t in [0, 1]. */
export function curvePointAt(s: CubicSegment, t: number): SectionPoint {
  const u = 1 - t;
  const w0 = u * u * u;
  const w1 = 3 * u * u * t;
  const w2 = 3 * u * t * t;
  const w3 = t * t * t;
  return {
    y: w0 * s.p0.y + w1 * s.p1.y + w2 * s.p2.y + w3 * s.p3.y,
    z: w0 * s.p0.z + w1 * s.p1.z + w2 * s.p2.z + w3 * s.p3.z,
  };
}

/** Derivative of the segment with respect to t at t in [0, 1] (not normalised). */
export function curveDerivativeAt(s: CubicSegment, t: number): SectionPoint {
  const u = 1 - t;
  const w0 = 3 * u * u;
  const w1 = 6 * u * t;
  const w2 = 3 * t * t;
  return {
    y: w0 * (s.p1.y - s.p0.y) + w1 * (s.p2.y - s.p1.y) + w2 * (s.p3.y - s.p2.y),
    z: w0 * (s.p1.z - s.p0.z) + w1 * (s.p2.z - s.p1.z) + w2 * (s.p3.z - s.p2.z),
  };
}

/** A one-dimensional cubic in Bernstein form (four coefficients) evaluated at t in [0, 1]. */
export function curveScalarAt(c: readonly [number, number, number, number], t: number): number {
  const u = 1 - t;
  return u * u * u * c[0] + 3 * u * u * t * c[1] + 3 * u * t * t * c[2] + t * t * t * c[3];
}

/**
 * Parameters t in (0, 1), increasing, at which to cut the segment so that the chords between
 * consecutive cuts (and the ends) stay within `toleranceMm` of the curve. Adaptive: each piece is halved
 * (de Casteljau) only while its control points stand further than the tolerance from its chord; since
 * the curve lies in the hull of its control points, that distance bounds the chord's error.
 * The ends 0 and 1 are not included.
 */
export function curveFlattenParams(s: CubicSegment, toleranceMm: number = CHORD_TOLERANCE_MM): number[] {
  return curveFlattenCoords([s.p0.y, s.p0.z, s.p1.y, s.p1.z, s.p2.y, s.p2.z, s.p3.y, s.p3.z], toleranceMm);
}

/** `curveFlattenParams` for a cubic given as eight coordinates (any plane, same units as the tolerance). */
export function curveFlattenCoords(c: CubicCoords, toleranceMm: number = CHORD_TOLERANCE_MM): number[] {
  const out: number[] = [];
  const tol = Math.max(toleranceMm, 1e-9);
  split(c[0], c[1], c[2], c[3], c[4], c[5], c[6], c[7], 0, 1, 0, tol * tol, out);
  return out;
}

function split(
  x0: number, y0: number, x1: number, y1: number, x2: number, y2: number, x3: number, y3: number,
  t0: number, t1: number, depth: number, tol2: number, out: number[],
): void {
  if (depth >= MAX_DEPTH) return;
  // Both control points within the tolerance of the chord (the second not worked out when the first is not).
  if (dist2ToChord(x1, y1, x0, y0, x3, y3) <= tol2 && dist2ToChord(x2, y2, x0, y0, x3, y3) <= tol2) return;
  const ax = (x0 + x1) / 2, ay = (y0 + y1) / 2;
  const bx = (x1 + x2) / 2, by = (y1 + y2) / 2;
  const cx = (x2 + x3) / 2, cy = (y2 + y3) / 2;
  const dx = (ax + bx) / 2, dy = (ay + by) / 2;
  const ex = (bx + cx) / 2, ey = (by + cy) / 2;
  const mx = (dx + ex) / 2, my = (dy + ey) / 2;
  const tm = (t0 + t1) / 2;
  split(x0, y0, ax, ay, dx, dy, mx, my, t0, tm, depth + 1, tol2, out);
  out.push(tm);
  split(mx, my, ex, ey, cx, cy, x3, y3, tm, t1, depth + 1, tol2, out);
}

/** Squared distance from (px, py) to the segment (ax, ay)-(bx, by). */
function dist2ToChord(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const vx = bx - ax;
  const vy = by - ay;
  const len2 = vx * vx + vy * vy;
  let f = len2 > 0 ? ((px - ax) * vx + (py - ay) * vy) / len2 : 0;
  f = f < 0 ? 0 : f > 1 ? 1 : f;
  const dx = px - (ax + f * vx);
  const dy = py - (ay + f * vy);
  return dx * dx + dy * dy;
}

/** The segment as a bezier-js curve (bezier-js x = y, bezier-js y = z), for its length, projection, offset and export tools. */
export function curveBezierJs(s: CubicSegment): Bezier {
  return new Bezier(s.p0.y, s.p0.z, s.p1.y, s.p1.z, s.p2.y, s.p2.z, s.p3.y, s.p3.z);
}
