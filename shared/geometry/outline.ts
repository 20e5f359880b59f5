import { vectorLength } from './vector';
import type { EdgePoint } from './edge';
import type { SectionPoint } from './types';

/**
 * A deducted half outline (deduction.ts: starboard, from the centreline at the bottom along the hull edge,
 * then along the deck's underside back to the centreline, last point not repeated) taken apart into the
 * runs the frame stages work on, and put back together as whole loops.
 */

/** -v, but 0 for 0 (never -0, which plain JSON cannot tell from 0). */
export const negated = (v: number): number => (v === 0 ? 0 : -v);

/** Points closer than this (mm) are the same point (a corner given twice, once with each side's normal). */
export const OUTLINE_SAME_POINT_MM = 1e-7;

/** Which edge a run lies along: the skin, the deck's underside, a closure (a straight line the outline adds). */
export type RunKind = 'hull' | 'deck' | 'closure';

/** A stretch of the outline without a corner inside, every point with its unit outward normal. */
export interface OutlineRun {
  kind: RunKind;
  /** Index of the first point in the half outline. */
  from: number;
  points: EdgePoint[];
  /** Outward normals, index for index with `points` (a straight run uses its own segment's normal). */
  normals: SectionPoint[];
}

const same = (a: SectionPoint, b: SectionPoint): boolean => Math.abs(a.y - b.y) <= OUTLINE_SAME_POINT_MM && Math.abs(a.z - b.z) <= OUTLINE_SAME_POINT_MM;

/**
 * The runs of a half outline, split at every corner. A corner given twice ends one run and starts the
 * next; a corner given once is shared by both. A segment between points of two kinds (a straight join the
 * deduction adds) is a closure. Straight runs (two points) and closures take the segment's own normal,
 * since the points' normals are the moulded curve's; curved runs keep the points' normals.
 */
export function outlineRuns(half: readonly EdgePoint[]): OutlineRun[] {
  const runs: OutlineRun[] = [];
  const kindOf = (a: EdgePoint, b: EdgePoint): RunKind => (a.edge === b.edge ? a.edge : 'closure');
  let start = 0;
  const close = (end: number): void => {
    if (end - start < 1) return;
    const points = half.slice(start, end + 1);
    const kind = kindOf(points[0]!, points[1]!);
    runs.push({ kind, from: start, points, normals: runNormals(points, kind) });
  };
  for (let i = 1; i < half.length; i++) {
    const a = half[i - 1]!;
    const b = half[i]!;
    if (same(a, b)) {
      close(i - 1);
      start = i;
      continue;
    }
    const next = half[i + 1];
    const kindChanges = next !== undefined && !same(b, next) && kindOf(a, b) !== kindOf(b, next);
    if ((b.corner && next !== undefined && !same(b, next)) || kindChanges) {
      close(i);
      start = i;
    }
  }
  close(half.length - 1);
  return runs;
}

function runNormals(points: readonly EdgePoint[], kind: RunKind): SectionPoint[] {
  const straight = kind === 'closure' || points.length === 2;
  if (!straight) return points.map((p) => ({ y: p.ny, z: p.nz }));
  // The half outline runs counter-clockwise: outward is to the right of travel.
  const a = points[0]!;
  const b = points[points.length - 1]!;
  const len = vectorLength(b.y - a.y, b.z - a.z) || 1;
  const n = { y: (b.z - a.z) / len, z: -(b.y - a.y) / len };
  return points.map(() => n);
}

/**
 * The whole loop from a starboard half that starts and ends on the centreline (y = 0): the half, then the
 * port side mirrored in reverse; centreline points are not doubled, the first point is not repeated. A
 * counter-clockwise half gives a counter-clockwise loop.
 */
export function loopMirrored(half: readonly SectionPoint[]): SectionPoint[] {
  const out = half.map((p) => ({ y: p.y, z: p.z }));
  for (let i = half.length - 1; i >= 0; i--) {
    const p = half[i]!;
    if (p.y > OUTLINE_SAME_POINT_MM) out.push({ y: -p.y, z: p.z });
  }
  return out;
}

/**
 * The outer edge against the skin as one open polyline from the port end round the bottom to the starboard
 * end (the edge limbers and joints are measured along): the half outline's points up to its last hull-edge
 * point, mirrored.
 */
export function hullEdgeOpen(half: readonly EdgePoint[]): SectionPoint[] {
  let last = -1;
  half.forEach((p, i) => {
    if (p.edge === 'hull') last = i;
  });
  const out: SectionPoint[] = [];
  for (let i = last; i >= 0; i--) if (half[i]!.y > OUTLINE_SAME_POINT_MM) out.push({ y: -half[i]!.y, z: half[i]!.z });
  for (let i = 0; i <= last; i++) out.push({ y: half[i]!.y, z: half[i]!.z });
  return out;
}

/** Length (mm) of the half outline's segments along an edge of `kind` (what a fillet runs along). */
export function outlineEdgeLength(half: readonly EdgePoint[], kinds: readonly RunKind[]): number {
  let sum = 0;
  for (let i = 1; i < half.length; i++) {
    const a = half[i - 1]!;
    const b = half[i]!;
    if (a.edge === b.edge && kinds.includes(a.edge)) sum += vectorLength(b.y - a.y, b.z - a.z);
  }
  return sum;
}

/**
 * The edge point mirrored to the other side of the centreline (y and the normal's y negated, never -0).
 * Built field by field: an object spread that overrides keys takes V8's slow path, about 8 us an object,
 * which on every point of every face is most of a frame's time.
 */
export function edgePointMirrored(p: EdgePoint): EdgePoint {
  return { y: negated(p.y), z: p.z, ny: negated(p.ny), nz: p.nz, rate: p.rate, bevel: p.bevel, girthMm: p.girthMm, setInMm: p.setInMm, edge: p.edge, corner: p.corner };
}

/** The edge point a fraction f of the way from a to b (normal re-normalised; not a corner). */
export function edgePointLerp(a: EdgePoint, b: EdgePoint, f: number): EdgePoint {
  const ny = a.ny + f * (b.ny - a.ny);
  const nz = a.nz + f * (b.nz - a.nz);
  const nl = vectorLength(ny, nz) || 1;
  const rate = a.rate + f * (b.rate - a.rate);
  return {
    y: a.y + f * (b.y - a.y),
    z: a.z + f * (b.z - a.z),
    ny: ny / nl,
    nz: nz / nl,
    rate,
    bevel: Math.atan(Math.abs(rate)),
    girthMm: a.girthMm + f * (b.girthMm - a.girthMm),
    setInMm: a.setInMm + f * (b.setInMm - a.setInMm),
    edge: a.edge,
    corner: false,
  };
}

/**
 * The stretches of a polyline of edge points where `value(p) <= limit` (e.g. height for a floor), each cut
 * exactly where the value crosses the limit (linear between points).
 */
export function edgeRunsBelow(points: readonly EdgePoint[], value: (p: EdgePoint) => number, limit: number): EdgePoint[][] {
  const out: EdgePoint[][] = [];
  let cur: EdgePoint[] = [];
  for (let i = 0; i < points.length; i++) {
    const p = points[i]!;
    const vp = value(p);
    if (i > 0) {
      const q = points[i - 1]!;
      const vq = value(q);
      if ((vq <= limit) !== (vp <= limit) && vq !== vp) {
        const c = edgePointLerp(q, p, (limit - vq) / (vp - vq));
        cur.push(c);
        if (vp > limit) {
          if (cur.length > 1) out.push(cur);
          cur = [];
        }
      }
    }
    if (vp <= limit) cur.push(p);
  }
  if (cur.length > 1) out.push(cur);
  return out;
}

/** The starboard edges against the skin and the deck, each in order of girth from the centreline. */
export function outlineContactRuns(half: readonly EdgePoint[]): { hull: EdgePoint[]; deck: EdgePoint[] } {
  return { hull: half.filter((p) => p.edge === 'hull'), deck: half.filter((p) => p.edge === 'deck').reverse() };
}
