import { deckLineAt } from '../../../../shared/geometry/deck';
import { deductionOf } from '../../../../shared/geometry/deduction';
import { frameOfPart } from '../../../../shared/geometry/frame';
import { measuredEdgeCleared } from '../../../../shared/geometry/frame-measured';
import type { PartGeometry, PartResult } from '../../../../shared/geometry/frame-types';
import type { BuiltHull } from '../../../../shared/geometry/hull';
import type { Spline } from '../../../../shared/geometry/spline';
import { measuredFrameOutline } from '../../../../shared/geometry/measured';
import type { Longitudinal, Part } from '../../../../shared/geometry/part-schema';
import { sectionAt } from '../../../../shared/geometry/section';
import { GeometryInputError, type SectionPoint } from '../../../../shared/geometry/types';
import type { PartHullEdges } from './part-shapes';

/**
 * One part worked out for the Part view, recomputed only when what it is built from changes: the part
 * itself, the longitudinals, the hull's settings and stations, and the lines' spline pieces around the
 * part's station (a drag at another station leaves a part's section input, and so the part, as it was).
 */

/** A part and the hull's own lines at its marked face, as the Part view draws them. */
export interface PartComputed {
  result: PartResult;
  hullEdges: PartHullEdges | null;
}

/** The deck's slope is taken this far (mm of x) either side of a face (deck.ts `DECK_SLOPE_STEP_MM`) and a little more. */
const KEY_REACH_MM = 2;

const splineRows = (s: Spline, lo: number, hi: number): number[][] => {
  const rows: number[][] = [];
  for (let i = 0; i < s.xs.length; i++) {
    // A knot matters when a span it bounds overlaps [lo, hi]: the cubic of a span is fixed by its two ends.
    const spanBefore = i > 0 && s.xs[i - 1]! <= hi && s.xs[i]! >= lo;
    const spanAfter = i + 1 < s.xs.length && s.xs[i]! <= hi && s.xs[i + 1]! >= lo;
    if (spanBefore || spanAfter) rows.push([s.xs[i]!, s.ys[i]!, s.ms[i]!]);
  }
  return rows;
};

/**
 * Everything the part is built from, as one string: equal strings give equal parts. For a station part the
 * lines enter only through their spline pieces within the part's thickness (and the deck slope's reach)
 * of its station; a transom reaches past the hull's end, so it takes the whole lines; a measured frame
 * takes none (it is built from its own readings).
 */
export function partInputKey(hull: BuiltHull, part: Part, longitudinals: readonly Longitudinal[]): string {
  const { lines: _lines, stations: _stations, ...settings } = hull.lines;
  const common = [part, longitudinals, settings, hull.stations, hull.xMin, hull.xMax, hull.sheerLineId, hull.maxSheerHalfBeamMm];
  if (part.kind === 'measured-frame') return JSON.stringify(common);
  const station = hull.stations.find((s) => s.id === part.stationId);
  const whole = part.kind === 'transom' || !station;
  const lo = whole ? -Infinity : station.x - part.thicknessMm - KEY_REACH_MM;
  const hi = whole ? Infinity : station.x + part.thicknessMm + KEY_REACH_MM;
  const lines = hull.fitted
    .filter((f) => whole || (f.xMax >= lo && f.xMin <= hi))
    .map((f) => [f.id, f.piece, f.kind, f.role, f.fixedZ, f.fixedY, f.diagonal, f.knuckle, f.xMin, f.xMax, splineRows(f.values, lo, hi), f.heights ? splineRows(f.heights, lo, hi) : null]);
  return JSON.stringify([...common, lines]);
}

const mirrored = (pts: readonly SectionPoint[]): SectionPoint[] => pts.map((p) => ({ y: -p.y, z: p.z }));

/** Height (mm) of a polyline running outward in y at half-breadth `y`, by straight interpolation. */
function heightAtY(pts: readonly SectionPoint[], y: number): number | null {
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1]!;
    const b = pts[i]!;
    if ((a.y - y) * (b.y - y) <= 0 && a.y !== b.y) return a.z + ((y - a.y) / (b.y - a.y)) * (b.z - a.z);
  }
  return null;
}

/**
 * The moulded section, the inside of the skin and the cut line (skin plus the fillet clearance) at a
 * station part's marked face, both sides, with the deck's top; for a measured frame its readings (the
 * inside of the skin) and the cut line set in by the clearance. Null for a raked transom, whose template is
 * an expanded plane the station's section does not lie in, and wherever the hull has no section.
 */
export function partHullEdgesOf(hull: BuiltHull, part: Part, geometry: PartGeometry): PartHullEdges | null {
  if (part.kind === 'transom') return null;
  if (part.kind === 'measured-frame') {
    try {
      const edge = measuredFrameOutline(part).edge;
      const cut = measuredEdgeCleared(edge, part.filletClearanceMm);
      return { moulded: [], skin: [edge.map(({ y, z }) => ({ y, z }))], cut: [cut.map(({ y, z }) => ({ y, z }))], deckTop: null, camberRiseMm: null };
    } catch (e) {
      if (e instanceof GeometryInputError) return null;
      throw e;
    }
  }
  const section = sectionAt(hull, geometry.markedFaceX, { chordToleranceMm: geometry.chordToleranceMm });
  if (!section) return null;
  const moulded = section.vertices.map(({ y, z }) => ({ y, z }));
  const skin = deductionOf(hull, section, { filletClearanceMm: 0 }).hull.map(({ y, z }) => ({ y, z }));
  const cut = deductionOf(hull, section, { filletClearanceMm: part.filletClearanceMm }).hull.map(({ y, z }) => ({ y, z }));
  const deck = part.kind === 'mould' ? null : deckLineAt(hull, section, 0, geometry.chordToleranceMm);
  let deckTop: SectionPoint[] | null = null;
  let camberRiseMm: number | null = null;
  if (deck) {
    const half = deck.top.filter((p) => p.y <= deck.halfBeamMm + 1e-6).map(({ y, z }) => ({ y, z }));
    deckTop = [...mirrored(half).reverse(), ...half.slice(1)];
    const atBeam = heightAtY(deck.top, deck.halfBeamMm);
    camberRiseMm = atBeam === null ? null : deck.top[0]!.z - atBeam;
  }
  return { moulded: [moulded, mirrored(moulded)], skin: [skin, mirrored(skin)], cut: [cut, mirrored(cut)], deckTop, camberRiseMm };
}

/** Work a part out with its hull edges; never throws (frameOfPart reports its own failures as issues). */
export function partCompute(hull: BuiltHull, part: Part, longitudinals: readonly Longitudinal[]): PartComputed {
  const result = frameOfPart(hull, part, longitudinals);
  if (!result.ok) return { result, hullEdges: null };
  try {
    return { result, hullEdges: partHullEdgesOf(hull, part, result.part) };
  } catch {
    // The bands are a help to the eye, not what is cut: without them the part is still drawn.
    return { result, hullEdges: null };
  }
}

/**
 * A cache of one computed part per part id, keyed by `partInputKey`: asking again with the same input
 * gives the same object back without computing.
 */
export function partComputeCache(compute: typeof partCompute = partCompute) {
  const held = new Map<string, { key: string; value: PartComputed }>();
  return (hull: BuiltHull, part: Part, longitudinals: readonly Longitudinal[]): PartComputed => {
    const key = partInputKey(hull, part, longitudinals);
    const hit = held.get(part.id);
    if (hit && hit.key === key) return hit.value;
    const value = compute(hull, part, longitudinals);
    held.set(part.id, { key, value });
    return value;
  };
}
