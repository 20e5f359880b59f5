import { frameOfPart } from '../../../../shared/geometry/frame';
import { hullCheck, type BuiltHull } from '../../../../shared/geometry/hull';
import type { Part } from '../../../../shared/geometry/part-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import type { SectionPoint } from '../../../../shared/geometry/types';
import { partComputeCache, type PartComputed } from './part-compute';

/**
 * The part at a station as the body plan draws it while one of that station's offsets is dragged: the cut
 * outline (outer edge, and the inner edge of a ring frame) of its marked-face layer, the same loops the
 * Part view strokes as "cut edge" and "inner edge" for layer 0 (part-shapes.ts), in section millimetres
 * (y half-breadth, starboard positive; z height) so it lies over the station's section at the same scale.
 */
export interface LivePartOutline {
  partId: string;
  partName: string;
  /** Outer edge of every piece of the layer (closed loops). */
  outer: SectionPoint[][];
  /** Inner edges: the hole of a ring frame, openings (closed loops). */
  inner: SectionPoint[][];
  /** Widest half-breadth (mm) of the outer edge, either side. */
  halfBreadthMm: number;
}

/**
 * The parts the body plan can lay over a station: those named to it, but not a raked transom (its template
 * is an expanded plane that the station's section does not lie in) nor a measured frame (it has no station
 * and is built from its own readings, which no offset drag changes).
 */
export function partsAtStation(plan: Plan, stationId: string): Part[] {
  return plan.parts.parts.filter((p) => p.kind !== 'transom' && p.kind !== 'measured-frame' && p.stationId === stationId);
}

/**
 * The cache of computed parts the drag uses: part-compute.ts's per-part cache, computing only the part
 * itself (frameOfPart, exactly what `partCompute` puts in `result`). The hull's edge bands the Part view
 * also draws are not needed for the cut outline, and on the large hull they cost more than the part does.
 */
export function livePartCache(): (hull: BuiltHull, part: Part, longitudinals: Plan['parts']['longitudinals']) => PartComputed {
  return partComputeCache((hull, part, longitudinals) => ({ result: frameOfPart(hull, part, longitudinals), hullEdges: null }));
}

/** The outline of each part at the station, from a hull built from `plan`'s lines; a part that fails is left out. */
export function livePartOutlinesOf(hull: BuiltHull, plan: Plan, stationId: string, compute: ReturnType<typeof livePartCache>): LivePartOutline[] {
  const out: LivePartOutline[] = [];
  for (const part of partsAtStation(plan, stationId)) {
    const computed = compute(hull, part, plan.parts.longitudinals);
    if (!computed.result.ok) continue;
    const layer = computed.result.part.layers[0];
    if (!layer) continue;
    const outer = layer.regions.map((r) => r.outer);
    const inner = layer.regions.flatMap((r) => r.holes);
    const widths = outer.flat().map((p) => Math.abs(p.y)).filter(Number.isFinite);
    if (widths.length === 0) continue;
    out.push({ partId: part.id, partName: part.name, outer, inner, halfBreadthMm: Math.max(...widths) });
  }
  return out;
}

/**
 * The outlines for the plan as it is being dragged: the whole hull is built again from the dragged lines
 * (the same `hullCheck` the Drawing screen builds the Part view's hull with, so the part is the one the Part
 * view will show once the drag ends). Null when those lines do not build a hull.
 */
export function draggedPartOutlines(plan: Plan, stationId: string, compute: ReturnType<typeof livePartCache>): LivePartOutline[] | null {
  if (partsAtStation(plan, stationId).length === 0) return [];
  const built = hullCheck(plan.lines);
  return built.ok ? livePartOutlinesOf(built.hull, plan, stationId, compute) : null;
}

/** Widest half-breadth of the outlines (mm), or null with none: what the drawing reports for tests to read. */
export function outlinesHalfBreadth(outlines: readonly LivePartOutline[]): number | null {
  return outlines.length === 0 ? null : Math.max(...outlines.map((o) => o.halfBreadthMm));
}

/**
 * When the next part computation may start during a drag; never while one is pending (at most one in flight).
 *
 * In a worker (`offThread`) the page's thread only sends the plan and draws the answer, so the next one
 * starts on the first frame after the last came back.
 *
 * On the page's thread (no worker), building the hull and the part blocks the drag: measured on the demo
 * hull's ring frame 12 to 60 ms, on the large benchmark hull about 12 ms for the hull and as much again or
 * more for a ring frame, several frames against the 2-3 ms a section frame takes. So:
 * - when the last one was cheap (under `CHEAP_PART_MS`), at most every other frame, so the section's own
 *   frames always get the frame between;
 * - when it was dear, or its cost is not known yet, only once the pointer has rested `REST_MS`: a steady
 *   drag stays smooth (a 25 ms block every other frame would drop every other frame whatever the rate), and
 *   the part catches up the moment the hand pauses.
 */
export const CHEAP_PART_MS = 6;
export const REST_MS = 50;

export interface LivePartClock {
  pending: boolean;
  /** The computation runs in a worker, not on the page's thread. */
  offThread: boolean;
  /** Frames drawn since the last part computation started (Infinity when none has this drag). */
  framesSince: number;
  /** How long the last part computation took on the page's thread (ms), or null before the first. */
  lastCostMs: number | null;
  /** Time since the last pointer move (ms). */
  restedMs: number;
}

export function livePartDue(c: LivePartClock): boolean {
  if (c.pending) return false;
  // A pointer that has stopped draws no more frames: the rest lets the part catch up with it either way.
  if (c.restedMs >= REST_MS) return true;
  if (c.offThread) return c.framesSince >= 1;
  return c.lastCostMs !== null && c.lastCostMs < CHEAP_PART_MS && c.framesSince >= 2;
}
