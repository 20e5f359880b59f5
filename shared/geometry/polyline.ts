import type { SectionPoint } from './types';

/**
 * Polyline pieces the offset edges need: where two segments cross, where two lines meet, and cutting
 * the loop an inward offset makes where it is set in further than the curve's radius.
 */

/** Where segments a0-a1 and b0-b1 cross: parameters s (along a) and u (along b), both in [0, 1]; null if they do not. */
export function polylineSegmentsCross(a0: SectionPoint, a1: SectionPoint, b0: SectionPoint, b1: SectionPoint): { s: number; u: number } | null {
  const ry = a1.y - a0.y;
  const rz = a1.z - a0.z;
  const qy = b1.y - b0.y;
  const qz = b1.z - b0.z;
  const den = ry * qz - rz * qy;
  if (Math.abs(den) < 1e-15) return null;
  const wy = b0.y - a0.y;
  const wz = b0.z - a0.z;
  const s = (wy * qz - wz * qy) / den;
  const u = (wy * rz - wz * ry) / den;
  return s >= 0 && s <= 1 && u >= 0 && u <= 1 ? { s, u } : null;
}

/**
 * Where the lines p + s d and q + u e meet: s and u (any sign), or null when they are parallel
 * (the angle between them below about 1e-9 rad).
 */
export function polylineLinesMeet(p: SectionPoint, d: SectionPoint, q: SectionPoint, e: SectionPoint): { s: number; u: number } | null {
  const den = d.y * e.z - d.z * e.y;
  const scale = Math.sqrt((d.y * d.y + d.z * d.z) * (e.y * e.y + e.z * e.z));
  if (!(Math.abs(den) > 1e-9 * scale)) return null;
  const wy = q.y - p.y;
  const wz = q.z - p.z;
  return { s: (wy * e.z - wz * e.y) / den, u: (wy * d.z - wz * d.y) / den };
}

/**
 * The first crossing between the tail of `a` (its last segments, walking back at most `window`
 * segments) and the head of `b` (its first segments, at most `window`), nearest the join first:
 * indices of the crossing segments (a[i]-a[i+1], b[j]-b[j+1]) and the parameters along them.
 */
export function polylineTailHeadCross<P extends SectionPoint>(a: readonly P[], b: readonly P[], window: number): { i: number; s: number; j: number; u: number } | null {
  const ia = Math.max(0, a.length - 1 - window);
  const jb = Math.min(b.length - 1, window);
  for (let span = 0; span <= (a.length - 1 - ia) + jb; span++) {
    // Pairs at the same distance (in segments) from the join, so the nearest crossing wins.
    for (let da = 0; da <= span; da++) {
      const i = a.length - 2 - da;
      const j = span - da;
      if (i < ia || i < 0 || j >= jb) continue;
      const hit = polylineSegmentsCross(a[i]!, a[i + 1]!, b[j]!, b[j + 1]!);
      if (hit) return { i, s: hit.s, j, u: hit.u };
    }
  }
  return null;
}

/**
 * Remove the loops of an offset polyline. Wherever segments run against the curve they were offset
 * from (`backward(p, q)` for the segment p-q), the nearest crossing of a segment before them with a
 * segment after them is found and everything between is cut out (the crossing point made by
 * `between(p, q, s)`, s along p-q). Without a crossing the backward points alone are dropped.
 */
export function polylineLoopsTrim<P extends SectionPoint>(
  pts: readonly P[],
  backward: (p: P, q: P) => boolean,
  between: (p: P, q: P, s: number) => P,
): P[] {
  let arr = pts.slice();
  for (let guard = 0; guard < 64; guard++) {
    let k = 0;
    while (k < arr.length - 1 && !backward(arr[k]!, arr[k + 1]!)) k++;
    if (k >= arr.length - 1) return arr;
    let e = k;
    while (e < arr.length - 1 && backward(arr[e]!, arr[e + 1]!)) e++;
    let cut: { i: number; j: number; s: number } | null = null;
    const n = arr.length;
    for (let reach = 0; reach < n && !cut; reach++) {
      for (let di = 0; di <= reach && !cut; di++) {
        const i = k - 1 - di;
        const j = e + (reach - di);
        if (i < 0 || j > n - 2) continue;
        const hit = polylineSegmentsCross(arr[i]!, arr[i + 1]!, arr[j]!, arr[j + 1]!);
        if (hit) cut = { i, j, s: hit.s };
      }
    }
    arr = cut
      ? [...arr.slice(0, cut.i + 1), between(arr[cut.i]!, arr[cut.i + 1]!, cut.s), ...arr.slice(cut.j + 1)]
      : [...arr.slice(0, k + 1), ...arr.slice(e + 1)];
  }
  return arr;
}
