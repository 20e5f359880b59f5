import { describe, expect, it } from 'vitest';
import { boxHull } from '../geometry/analytic-hulls';
import { hullBuild } from '../../shared/geometry/hull';
import type { HullLinesInput } from '../../shared/geometry/hull-schema';
import { planSchema, PLAN_SCHEMA_VERSION, type Plan } from '../../shared/geometry/plan-schema';
import { partCompute } from '../../src/features/plan/drawing/part-compute';
import {
  CHEAP_PART_MS,
  draggedPartOutlines,
  livePartCache,
  livePartDue,
  livePartOutlinesOf,
  outlinesHalfBreadth,
  partsAtStation,
  REST_MS,
} from '../../src/features/plan/drawing/live-part';
import { offsetMove } from '../../src/features/plan/editor/offset-actions';

/**
 * Analytic case (as in drawing-part-shapes.test.ts): a prismatic box hull, flat bottom and wall sides, the
 * chine knuckle at half-breadth 500 on the baseline and the sheer 400 mm straight above it, 6 mm skin
 * outside the offsets. A bulkhead in it is the box less the skin and the 2 mm fillet clearance, so its
 * widest half-breadth is 500 - 6 - 2 = 492 mm.
 */
const boxLines: HullLinesInput = boxHull();

const common = { stationId: 'st2', thicknessMm: 12, layers: [{ thicknessMm: 12 }], filletClearanceMm: 2, markedFace: 'aft' };
const plan: Plan = planSchema.parse({
  schemaVersion: PLAN_SCHEMA_VERSION,
  lines: boxLines,
  parts: {
    longitudinals: [],
    parts: [
      { id: 'bh', name: 'Bulkhead 2', kind: 'bulkhead', ...common },
      { id: 'rf', name: 'Frame 2', kind: 'ring-frame', ...common, ringWidth: { bottomMm: 80, sidesMm: 60, underDeckMm: 60 } },
      { id: 'bh3', name: 'Bulkhead 3', kind: 'bulkhead', ...common, stationId: 'st3' },
    ],
  },
});

describe('the part at a dragged station', () => {
  it('takes the parts named to the station, and only those', () => {
    expect(partsAtStation(plan, 'st2').map((p) => p.id)).toEqual(['bh', 'rf']);
    expect(partsAtStation(plan, 'st3').map((p) => p.id)).toEqual(['bh3']);
    expect(partsAtStation(plan, 'st1')).toEqual([]);
  });

  it('draws the bulkhead as the box less skin and clearance (analytic), and the ring frame with an inner edge inside its outer edge', () => {
    const outlines = livePartOutlinesOf(hullBuild(plan.lines), plan, 'st2', livePartCache());
    const [bh, rf] = outlines;
    expect(bh!.partId).toBe('bh');
    expect(bh!.halfBreadthMm).toBeCloseTo(492, 3);
    expect(bh!.inner).toEqual([]);
    expect(rf!.partId).toBe('rf');
    expect(rf!.inner.length).toBeGreaterThan(0);
    // analytic: the ring's inner edge stands its side width (60 mm) in from the outer edge
    const innerWidest = Math.max(...rf!.inner.flat().map((p) => Math.abs(p.y)));
    expect(innerWidest).toBeCloseTo(rf!.halfBreadthMm - 60, 0);
    expect(outlinesHalfBreadth(outlines)).toBeCloseTo(492, 3);
    expect(outlinesHalfBreadth([])).toBeNull();
  });

  it('follows a dragged offset: the outline is the one the Part view computes for the plan with the dragged value', () => {
    // The chine at St 2 dragged out to 560 mm: the bottom of the section widens there.
    const dragged = offsetMove(plan, { lineId: 'chine', stationId: 'st2', to: { y: 560, z: 0 } });
    expect(dragged).not.toBe(plan);
    const outlines = draggedPartOutlines(dragged, 'st2', livePartCache())!;
    const bh = outlines.find((o) => o.partId === 'bh')!;
    expect(bh.halfBreadthMm).toBeGreaterThan(492 + 30);
    // The same loops as part-compute.ts gives the Part view for that plan (its cut edge and inner edge, layer 0).
    for (const o of outlines) {
      const part = dragged.parts.parts.find((p) => p.id === o.partId)!;
      const { result } = partCompute(hullBuild(dragged.lines), part, dragged.parts.longitudinals);
      if (!result.ok) throw new Error('part not built');
      expect(o.outer).toEqual(result.part.layers[0]!.regions.map((r) => r.outer));
      expect(o.inner).toEqual(result.part.layers[0]!.regions.flatMap((r) => r.holes));
    }
    // A station without parts costs no hull build at all.
    expect(draggedPartOutlines(dragged, 'st1', livePartCache())).toEqual([]);
  });

  it('builds nothing when the dragged lines make no hull', () => {
    // The sheer dragged below the chine: the section doubles back, which the hull check refuses.
    const bad = offsetMove(plan, { lineId: 'sheer', stationId: 'st2', to: { y: 500, z: -300 } });
    expect(draggedPartOutlines(bad, 'st2', livePartCache())).toBeNull();
  });

  it('throttles in a worker: one at a time, the first frame after the last came back', () => {
    const clock = { pending: false, offThread: true, framesSince: 1, lastCostMs: null, restedMs: 0 };
    expect(livePartDue(clock)).toBe(true);
    expect(livePartDue({ ...clock, pending: true })).toBe(false);
    expect(livePartDue({ ...clock, framesSince: 0 })).toBe(false);
    expect(livePartDue({ ...clock, framesSince: 0, restedMs: REST_MS })).toBe(true);
  });

  it('throttles on the page thread: one at a time, every other frame when cheap, after a rest when dear or unknown', () => {
    const clock = { pending: false, offThread: false, framesSince: 2, lastCostMs: 1, restedMs: 0 };
    expect(livePartDue(clock)).toBe(true);
    expect(livePartDue({ ...clock, pending: true, restedMs: REST_MS })).toBe(false);
    expect(livePartDue({ ...clock, framesSince: 1 })).toBe(false);
    expect(livePartDue({ ...clock, framesSince: 1, restedMs: REST_MS })).toBe(true);
    expect(livePartDue({ ...clock, lastCostMs: CHEAP_PART_MS + 10 })).toBe(false);
    expect(livePartDue({ ...clock, lastCostMs: CHEAP_PART_MS + 10, restedMs: REST_MS })).toBe(true);
    expect(livePartDue({ ...clock, lastCostMs: null, framesSince: Infinity })).toBe(false);
    expect(livePartDue({ ...clock, lastCostMs: null, restedMs: REST_MS + 1 })).toBe(true);
  });
});
