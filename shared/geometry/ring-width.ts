import { vectorLength } from './vector';
import type { OutlineRun } from './outline';
import type { SectionPoint } from './types';

/**
 * The widths of a ring frame along its edge: which of the bottom, sides and under-deck widths each stretch of
 * the outline takes, and where the width changes along a smooth stretch, the taper that carries it over
 * (a step would be a notch where the ring takes its load).
 */

/** Girth (mm) over which the ring width changes by 1 mm where it changes along a smooth stretch (our choice, about 14 degrees). */
export const RING_WIDTH_TAPER = 4;

/** Where the bottom width gives way to the sides width along the hull edge. */
export type RingBottomRule =
  /** Up to this moulded girth from the keel (the lowest chine). */
  | { by: 'girth'; girthMm: number }
  /** Up to this height (mm above the baseline). */
  | { by: 'height'; z: number }
  /** Where the edge's normal is within 45 degrees of straight down (a round bilge with no chine). */
  | { by: 'normal' };

/** What the inner edge needs: widths (mm), where the bottom ends, the corner radius (mm) and the top. */
export interface RingSpec {
  bottomMm: number;
  sidesMm: number;
  underDeckMm: number;
  bottom: RingBottomRule;
  cornerRadiusMm: number;
  /** `deck`: the ring is closed under the top line; `open`: the arms end at the top line. */
  top: 'deck' | 'open';
}

/** Which width a stretch takes: 0 bottom, 1 sides, 2 under the deck; `v` is the rule's value there (see `ruleValue`). */
function regionOf(kind: OutlineRun['kind'], first: boolean, v: number): 0 | 1 | 2 {
  if (kind === 'deck') return 2;
  if (kind === 'closure') return first ? 0 : 2;
  return v <= 0 ? 0 : 1;
}

/** The bottom rule's value at a point: negative (or 0) in the bottom, positive up the sides; it changes sign where the bottom ends. */
function ruleValue(spec: RingSpec, girthMm: number, z: number, n: SectionPoint): number {
  const rule = spec.bottom;
  if (rule.by === 'girth') return girthMm - rule.girthMm;
  if (rule.by === 'height') return z - rule.z;
  return n.z + Math.abs(n.y);
}

/**
 * A run with its width (mm) at every point: points put in where the bottom ends (exactly, for a girth or a
 * height; where the normal turns past 45 degrees, for a round bilge) and where each taper ends, so that
 * moving each point in by its own width gives the tapered edge. `first`: the run starts the outline (a
 * closure there is the bottom's).
 */
export function ringRunWidths(run: OutlineRun, first: boolean, spec: RingSpec): { pts: SectionPoint[]; normals: SectionPoint[]; widths: number[] } {
  const widthOf = [spec.bottomMm, spec.sidesMm, spec.underDeckMm];
  const lerpN = (a: SectionPoint, b: SectionPoint, f: number): SectionPoint => {
    const y = a.y + f * (b.y - a.y);
    const z = a.z + f * (b.z - a.z);
    const l = vectorLength(y, z) || 1;
    return { y: y / l, z: z / l };
  };
  // The run's points with the rule's value, and a point put in wherever the value changes sign inside a segment.
  const pts: SectionPoint[] = [];
  const normals: SectionPoint[] = [];
  const values: number[] = [];
  const hullRun = run.kind === 'hull';
  for (let k = 0; k < run.points.length; k++) {
    const p = run.points[k]!;
    const n = run.normals[k]!;
    const v = hullRun ? ruleValue(spec, p.girthMm, p.z, n) : 0;
    if (k > 0 && hullRun) {
      const vp = values[values.length - 1]!;
      if ((vp <= 0) !== (v <= 0) && vp !== v) {
        const q = run.points[k - 1]!;
        const f = vp / (vp - v);
        pts.push({ y: q.y + f * (p.y - q.y), z: q.z + f * (p.z - q.z) });
        normals.push(lerpN(run.normals[k - 1]!, n, f));
        values.push(0);
      }
    }
    // The run's own point (only its y and z are read): a copy of every point was garbage for every face.
    pts.push(p);
    normals.push(n);
    values.push(v);
  }
  const m = pts.length;
  const s = [0];
  for (let k = 1; k < m; k++) s.push(s[k - 1]! + vectorLength(pts[k]!.y - pts[k - 1]!.y, pts[k]!.z - pts[k - 1]!.z));
  // Each segment's region from its middle (its ends may sit on the change).
  const regions: (0 | 1 | 2)[] = [];
  for (let k = 0; k + 1 < m; k++) regions.push(regionOf(run.kind, first, (values[k]! + values[k + 1]!) / 2));
  const changes: { at: number; w0: number; w1: number }[] = [];
  for (let k = 1; k < m - 1; k++) if (regions[k] !== regions[k - 1]) changes.push({ at: s[k]!, w0: widthOf[regions[k - 1]!]!, w1: widthOf[regions[k]!]! });
  const base = regions.length > 0 ? widthOf[regions[0]!]! : spec.sidesMm;
  const widthAt = (x: number): number => {
    let w = base;
    for (const c of changes) {
      const taper = RING_WIDTH_TAPER * Math.abs(c.w0 - c.w1);
      // The taper lies on the narrower side of the change.
      if (c.w0 > c.w1) w = x <= c.at ? w : x >= c.at + taper ? c.w1 : c.w0 + ((x - c.at) / (taper || 1)) * (c.w1 - c.w0);
      else w = x >= c.at ? c.w1 : x <= c.at - taper ? w : c.w0 + ((x - (c.at - taper)) / (taper || 1)) * (c.w1 - c.w0);
    }
    return w;
  };
  // Points put in where each taper ends (where the edge is straight the moved points then lie on the taper).
  const ends = changes.map((c) => {
    const taper = RING_WIDTH_TAPER * Math.abs(c.w0 - c.w1);
    return c.w0 > c.w1 ? Math.min(s[m - 1]!, c.at + taper) : Math.max(0, c.at - taper);
  });
  const outPts: SectionPoint[] = [];
  const outN: SectionPoint[] = [];
  const widths: number[] = [];
  const sorted = ends.sort((a, b) => a - b);
  let c = 0;
  for (let k = 0; k < m; k++) {
    while (k > 0 && c < sorted.length && sorted[c]! < s[k]! - 1e-9) {
      const x = sorted[c++]!;
      if (x <= s[k - 1]! + 1e-9) continue;
      const f = (x - s[k - 1]!) / (s[k]! - s[k - 1]!);
      outPts.push({ y: pts[k - 1]!.y + f * (pts[k]!.y - pts[k - 1]!.y), z: pts[k - 1]!.z + f * (pts[k]!.z - pts[k - 1]!.z) });
      outN.push(lerpN(normals[k - 1]!, normals[k]!, f));
      widths.push(widthAt(x));
    }
    while (c < sorted.length && Math.abs(sorted[c]! - s[k]!) <= 1e-9) c++;
    outPts.push(pts[k]!);
    outN.push(normals[k]!);
    widths.push(widthAt(s[k]!));
  }
  return { pts: outPts, normals: outN, widths };
}

/** Which ring width applies where a notch or limber is cut (mm). */
export function ringWidthAt(spec: RingSpec, against: 'skin' | 'deck', p: { girthMm: number; z: number; ny: number; nz: number }): number {
  if (against === 'deck') return spec.underDeckMm;
  const b = spec.bottom;
  const bottom = b.by === 'girth' ? p.girthMm <= b.girthMm : b.by === 'height' ? p.z <= b.z : p.nz < -Math.abs(p.ny);
  return bottom ? spec.bottomMm : spec.sidesMm;
}
