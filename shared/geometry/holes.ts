import { lastOf } from './arrays';
import { vectorLength } from './vector';
import type { Limber, Opening } from './part-schema';
import { type GirthEdge, girthPoints } from './pieces';
import { CHORD_TOLERANCE_MM, type SectionPoint } from './types';

/**
 * The holes cut through a part, as loops in its plane (mm): limber holes centred on the outer edge and
 * openings (circle, rounded rectangle, slot) anywhere in a solid part. Every loop is counter-clockwise with
 * its first point not repeated; arcs are flattened so that no chord strays more than the chord tolerance
 * from the circle.
 */

/** Fewest points on a full circle, so that a tiny hole is still round enough to see. */
export const HOLE_MIN_SEGMENTS = 12;

/**
 * Number of equal chords for an arc of `sweepRad` (rad, >= 0) on radius `radiusMm` so that the sagitta of
 * each, r (1 - cos(step / 2)), stays within `toleranceMm`: step = 2 acos(1 - tol / r).
 */
export function arcSegments(radiusMm: number, sweepRad: number, toleranceMm: number = CHORD_TOLERANCE_MM): number {
  if (!(radiusMm > 0) || !(sweepRad > 0)) return 1;
  const ratio = Math.min(1, Math.max(toleranceMm, 1e-9) / radiusMm);
  const step = 2 * Math.acos(1 - ratio);
  const min = Math.ceil((HOLE_MIN_SEGMENTS * sweepRad) / (2 * Math.PI));
  return Math.max(1, min, Math.ceil(sweepRad / step - 1e-9));
}

/**
 * Points on the arc about `centre` of radius r (mm) from angle a0 through a sweep (rad, signed:
 * positive counter-clockwise), both ends included, within the chord tolerance.
 */
export function arcPoints(centre: SectionPoint, radiusMm: number, a0: number, sweepRad: number, toleranceMm: number = CHORD_TOLERANCE_MM): SectionPoint[] {
  const n = arcSegments(radiusMm, Math.abs(sweepRad), toleranceMm);
  const out: SectionPoint[] = [];
  for (let i = 0; i <= n; i++) {
    const a = a0 + (sweepRad * i) / n;
    out.push({ y: centre.y + radiusMm * Math.cos(a), z: centre.z + radiusMm * Math.sin(a) });
  }
  return out;
}

/**
 * A circle of radius r (mm) about `centre`, counter-clockwise. The chords lie inside the circle; to keep the
 * hole at least as large as asked, the polygon is drawn on the radius whose chords' middles reach r
 * (r / cos(step / 2)), so every point of the cut is between r and r + tolerance from the centre.
 */
export function circleLoop(centre: SectionPoint, radiusMm: number, toleranceMm: number = CHORD_TOLERANCE_MM): SectionPoint[] {
  const n = arcSegments(radiusMm, 2 * Math.PI, toleranceMm);
  const r = radiusMm / Math.cos(Math.PI / n);
  const out: SectionPoint[] = [];
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * i) / n;
    out.push({ y: centre.y + r * Math.cos(a), z: centre.z + r * Math.sin(a) });
  }
  return out;
}

/** A rectangle `widthMm` (y) by `heightMm` (z) about `centre` with corners rounded to `cornerRadiusMm` (capped at half the shorter side). */
export function roundedRectLoop(centre: SectionPoint, widthMm: number, heightMm: number, cornerRadiusMm: number, toleranceMm: number = CHORD_TOLERANCE_MM): SectionPoint[] {
  const hw = widthMm / 2;
  const hh = heightMm / 2;
  const r = Math.max(0, Math.min(cornerRadiusMm, hw, hh));
  if (r <= 0) {
    return [
      { y: centre.y - hw, z: centre.z - hh },
      { y: centre.y + hw, z: centre.z - hh },
      { y: centre.y + hw, z: centre.z + hh },
      { y: centre.y - hw, z: centre.z + hh },
    ];
  }
  const corners: [number, number, number][] = [
    [hw - r, -hh + r, -Math.PI / 2],
    [hw - r, hh - r, 0],
    [-hw + r, hh - r, Math.PI / 2],
    [-hw + r, -hh + r, Math.PI],
  ];
  const out: SectionPoint[] = [];
  for (const [cy, cz, a0] of corners) {
    const arc = arcPoints({ y: centre.y + cy, z: centre.z + cz }, r, a0, Math.PI / 2, toleranceMm);
    for (const p of arc) {
      const q = lastOf(out);
      if (!q || vectorLength(q.y - p.y, q.z - p.z) > 1e-9) out.push(p);
    }
  }
  if (vectorLength(out[0]!.y - out[out.length - 1]!.y, out[0]!.z - out[out.length - 1]!.z) <= 1e-9) out.pop();
  return out;
}

/** A slot: overall `lengthMm` along the angle `angleRad` from the horizontal, `widthMm` across, round ends. */
export function slotLoop(centre: SectionPoint, lengthMm: number, widthMm: number, angleRad: number, toleranceMm: number = CHORD_TOLERANCE_MM): SectionPoint[] {
  const r = widthMm / 2;
  const half = Math.max(0, lengthMm / 2 - r);
  const c = Math.cos(angleRad);
  const s = Math.sin(angleRad);
  const a = { y: centre.y + half * c, z: centre.z + half * s };
  const b = { y: centre.y - half * c, z: centre.z - half * s };
  if (half === 0) return circleLoop(centre, r, toleranceMm);
  const end1 = arcPoints(a, r, angleRad - Math.PI / 2, Math.PI, toleranceMm);
  const end2 = arcPoints(b, r, angleRad + Math.PI / 2, Math.PI, toleranceMm);
  return [...end1, ...end2];
}

/** The loop (or two, mirrored) an opening cuts, counter-clockwise, in the part's plane. */
export function openingLoops(opening: Opening, toleranceMm: number = CHORD_TOLERANCE_MM): SectionPoint[][] {
  const at = (y: number): SectionPoint[] => {
    const c = { y, z: opening.z };
    if (opening.shape === 'circle') return circleLoop(c, opening.radiusMm, toleranceMm);
    if (opening.shape === 'rectangle') return roundedRectLoop(c, opening.widthMm, opening.heightMm, opening.cornerRadiusMm, toleranceMm);
    // The mirror of a slot at angle a is at pi - a.
    return slotLoop(c, opening.lengthMm, opening.widthMm, y === opening.y ? opening.angleRad : Math.PI - opening.angleRad, toleranceMm);
  };
  const out = [at(opening.y)];
  if (opening.mirror && Math.abs(opening.y) > 1e-9) out.push(at(-opening.y));
  return out;
}

/** Where a limber hole goes: its centre on the outer edge and its girth (signed, starboard positive). */
export interface LimberPlace {
  side: 'port' | 'starboard';
  girthMm: number;
  centre: SectionPoint;
  radiusMm: number;
  loop: SectionPoint[];
}

/**
 * The limber holes of a part: each centred on `edge` (the outer edge from port to starboard, girths from
 * its lowest centreline crossing, pieces.ts) at the limber's girth, port at minus that girth; null for a
 * limber whose girth lies off the edge.
 */
export function limberPlaces(limber: Limber, edge: GirthEdge, toleranceMm: number = CHORD_TOLERANCE_MM): (LimberPlace | null)[] {
  const sides: ('port' | 'starboard')[] = limber.sides === 'both' ? ['port', 'starboard'] : [limber.sides];
  const girths = sides.map((side) => (side === 'port' ? -limber.girthMm : limber.girthMm));
  const at = girthPoints(edge, girths);
  return sides.map((side, k) => {
    const p = at[k]!;
    if (p === null) return null;
    return { side, girthMm: girths[k]!, centre: p.point, radiusMm: limber.radiusMm, loop: circleLoop(p.point, limber.radiusMm, toleranceMm) };
  });
}
