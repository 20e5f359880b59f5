import { describe, expect, it } from 'vitest';
import { boxHull } from '../geometry/analytic-hulls';
import { frameOfPart } from '../../shared/geometry/frame';
import type { PartGeometry } from '../../shared/geometry/frame-types';
import { hullBuild, type BuiltHull } from '../../shared/geometry/hull';
import type { HullLinesInput } from '../../shared/geometry/hull-schema';
import { partSchema, type Part, type PartInput } from '../../shared/geometry/part-schema';
import { polygonSignedArea } from '../../shared/geometry/polygon';
import { partCompute, partComputeCache, partInputKey } from '../../src/features/plan/drawing/part-compute';
import { labelsThinned, partShapes, type PartShapes } from '../../src/features/plan/drawing/part-shapes';

/**
 * Analytic case: a prismatic box hull, the same flat-bottomed, wall-sided section at every station
 * (keel on the centreline at z = 0, a chine knuckle at half-breadth 500 on the baseline, the sheer
 * 400 mm straight above it), 6 mm skin outside the offsets, no deck. A bulkhead in it is the box less the
 * skin and the fillet clearance, closed level across at the sheer (deduction.ts), so its outline is the
 * rectangle y in [-(500 - 6 - c), 500 - 6 - c], z in [6 + c, 400]; every bevel is square (the surface does
 * not move along x). The bands are L-shaped strips whose areas follow from the widths.
 */
const boxLines: HullLinesInput = boxHull();

function cells(p: { y: number; z: number }) {
  return Object.fromEntries([0, 1, 2, 3, 4].map((i) => [`st${i}`, p]));
}

const SKIN = 6;
const CLEARANCE = 2;
const mm = (v: number) => `${v.toFixed(1)} mm`;

function bulkhead(over: Partial<PartInput> = {}): Part {
  return partSchema.parse({ id: 'bh', name: 'Bulkhead 2', kind: 'bulkhead', stationId: 'st2', thicknessMm: 12, layers: [{ thicknessMm: 12 }], filletClearanceMm: CLEARANCE, markedFace: 'aft', ...over } as PartInput);
}

function built(hull: BuiltHull, part: Part): PartGeometry {
  const r = frameOfPart(hull, part);
  if (!r.ok) throw new Error(r.issues.map((i) => i.message).join('; '));
  return r.part;
}

const styled = (s: PartShapes, style: string) => s.polylines.filter((p) => p.style === style);
const areaOf = (pts: { x: number; y: number }[]) => Math.abs(polygonSignedArea(pts.map((p) => ({ y: p.x, z: p.y }))));

describe('partShapes', () => {
  const hull = hullBuild(boxLines);
  const part = bulkhead();
  const { result, hullEdges } = partCompute(hull, part, []);
  const geometry = result.ok ? result.part : null;

  it('draws the cut edge as the layer outline, seen from aft unmirrored, and the box less skin and clearance (analytic)', () => {
    const s = partShapes(geometry!, hullEdges, { lengthText: mm });
    expect(s.mirrored).toBe(false);
    expect(s.starboardSign).toBe(1);
    const [cut] = styled(s, 'cut-edge');
    const half = 500 - SKIN - CLEARANCE;
    const xs = cut!.points.map((p) => p.x);
    const ys = cut!.points.map((p) => p.y);
    expect(Math.min(...xs)).toBeCloseTo(-half, 3);
    expect(Math.max(...xs)).toBeCloseTo(half, 3);
    expect(Math.min(...ys)).toBeCloseTo(SKIN + CLEARANCE, 3);
    expect(Math.max(...ys)).toBeCloseTo(400, 3);
    expect(cut!.points).toEqual(geometry!.layers[0]!.regions[0]!.outer.map((p) => ({ x: p.y, y: p.z })));
    expect(styled(s, 'other-face')).toHaveLength(1);
    expect(s.notDrawn).toBe(0);
  });

  it('mirrors the whole drawing for a forward marked face (drawing.ts: the forward face is seen from forward)', () => {
    const fwd = built(hull, bulkhead({ markedFace: 'forward' }));
    const s = partShapes(fwd, hullEdges, { lengthText: mm });
    expect(s.mirrored).toBe(true);
    expect(s.starboardSign).toBe(-1);
    expect(styled(s, 'cut-edge')[0]!.points).toEqual(fwd.layers[0]!.regions[0]!.outer.map((p) => ({ x: -p.y, y: p.z })));
    expect(s.viewWords).toContain('starboard on the left');
  });

  it('shades the skin and the fillet clearance as bands of the analytic areas, both sides', () => {
    const s = partShapes(geometry!, hullEdges, { lengthText: mm });
    const skin = styled(s, 'skin-band');
    const fillet = styled(s, 'fillet-band');
    expect(skin).toHaveLength(2);
    expect(fillet).toHaveLength(2);
    // Skin strip: 500 x 6 along the bottom and 6 x (400 - 6) up the side.
    const skinArea = 500 * SKIN + SKIN * (400 - SKIN);
    // Clearance strip inside it: (500 - 6) x 2 and 2 x (400 - 6 - 2).
    const filletArea = (500 - SKIN) * CLEARANCE + CLEARANCE * (400 - SKIN - CLEARANCE);
    for (const band of skin) expect(areaOf(band.points)).toBeCloseTo(skinArea, 0);
    for (const band of fillet) expect(areaOf(band.points)).toBeCloseTo(filletArea, 0);
  });

  it('draws the reference lines with their heights and the square bevels with their readings', () => {
    const s = partShapes(geometry!, hullEdges, { lengthText: mm });
    expect(styled(s, 'centreline')).toHaveLength(1);
    expect(styled(s, 'waterline')).toHaveLength(1);
    // The level reference line defaults to the design waterline where it crosses (frame-types.ts): one label for both.
    expect(s.labels.filter((l) => l.style === 'line').map((l) => l.text)).toEqual(['Level line on the DWL 200.0 mm above base']);
    const own = partShapes(built(hull, bulkhead({ marks: { levelLineZ: 300, setUpLineZ: 50, grain: null } })), hullEdges, { lengthText: mm });
    expect(own.labels.filter((l) => l.style === 'line').map((l) => l.text)).toEqual(['Level line 300.0 mm above base', 'DWL 200.0 mm', 'Set-up line 50.0 mm']);
    expect(styled(own, 'set-up-line')).toHaveLength(1);
    expect(s.bevels.length).toBe(geometry!.bevelMarks.length);
    expect(s.bevels.length).toBeGreaterThan(0);
    // A prism does not change along x, so its bevels are all square.
    for (const b of s.bevels) {
      expect(b.sawTiltDeg).toBeCloseTo(0, 6);
      expect(b.text).toBe('0.0°');
      expect(Math.hypot(b.inward.x, b.inward.y)).toBeCloseTo(1, 9);
    }
    expect(s.overLimit.count).toBe(0);
  });

  it('adds the overall width and height and the check dimension only when asked', () => {
    expect(partShapes(geometry!, hullEdges, { lengthText: mm }).labels.some((l) => l.style === 'dimension')).toBe(false);
    const s = partShapes(geometry!, hullEdges, { lengthText: mm, dimensions: true });
    const words = s.labels.filter((l) => l.style === 'dimension').map((l) => l.text);
    const width = 2 * (500 - SKIN - CLEARANCE);
    // The check dimension is the widest level line across the part: here the whole width at the DWL.
    expect(words).toEqual([`Overall width ${mm(width)}`, `Overall height ${mm(400 - SKIN - CLEARANCE)}`, `Check ${mm(width)}`]);
  });

  it('flags a bevel past the saw limit in plain words', () => {
    // A flaring hull: the half-breadths grow 0.5 mm per mm of x, a tilt of atan(0.5) = 26.6 degrees, past a 20 degree limit.
    const flare: HullLinesInput = {
      ...boxLines,
      lines: [
        { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', knuckle: { fromX: null, toX: null }, cells: cells({ y: 0, z: 0 }) },
        { id: 'chine', name: 'Chine', kind: 'point', role: 'chine', knuckle: { fromX: null, toX: null }, cells: Object.fromEntries([0, 1, 2, 3, 4].map((i) => [`st${i}`, { y: 300 + 500 * i, z: 0 }])) },
        { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', knuckle: { fromX: null, toX: null }, cells: Object.fromEntries([0, 1, 2, 3, 4].map((i) => [`st${i}`, { y: 300 + 500 * i, z: 400 }])) },
      ],
    };
    const g = built(hullBuild(flare), bulkhead({ bevelMarks: { everyMm: 50, sawTiltLimitRad: (20 * Math.PI) / 180 } }));
    const s = partShapes(g, null, { lengthText: mm });
    const over = s.bevels.filter((b) => b.overLimit);
    expect(over.length).toBe(g.bevelSummary.overLimit);
    expect(over.length).toBeGreaterThan(0);
    expect(s.overLimit.limitDeg).toBeCloseTo(20, 9);
    expect(s.overLimit.maxDeg).toBeCloseTo((Math.atan(0.5) * 180) / Math.PI, 1);
    for (const b of over) expect(b.text).toMatch(/past saw limit$/);
  });

  it('leaves out a line with a point that is not a number and counts it, rather than drawing NaN', () => {
    const broken: PartGeometry = { ...geometry!, layers: geometry!.layers.map((l) => ({ ...l, otherFaceRegions: [{ outer: [{ y: 0, z: 0 }, { y: Number.NaN, z: 5 }, { y: 5, z: 5 }], holes: [] }] })) };
    const s = partShapes(broken, null, { lengthText: mm });
    expect(styled(s, 'other-face')).toHaveLength(0);
    expect(s.notDrawn).toBe(1);
    for (const p of s.polylines.flatMap((l) => l.points)) expect(Number.isFinite(p.x) && Number.isFinite(p.y)).toBe(true);
  });
});

describe('labelsThinned', () => {
  it('keeps labels at least the gap apart, in order, and always the ones it must', () => {
    const items = [0, 10, 30, 45, 100].map((x, i) => ({ i, x, must: i === 1 }));
    const kept = labelsThinned(items, (t) => ({ x: t.x, y: 0 }), 25, (t) => t.must);
    // 10 is kept (must); 0 is within 25 of it, 30 is 20 from it: both dropped; 45 is 35 from 10: kept; 100 kept.
    expect(kept.map((k) => k.x)).toEqual([10, 45, 100]);
  });
});

describe('partInputKey and partComputeCache', () => {
  const hull = hullBuild(boxLines);
  const part = bulkhead();

  it('computes a part once for the same input and again when its own input changes', () => {
    let runs = 0;
    const cached = partComputeCache((h, p, l) => {
      runs += 1;
      return partCompute(h, p, l);
    });
    const first = cached(hull, part, []);
    expect(cached(hullBuild(boxLines), bulkhead(), [])).toBe(first);
    expect(runs).toBe(1);
    const thicker = cached(hull, bulkhead({ thicknessMm: 18, layers: [{ thicknessMm: 18 }] }), []);
    expect(thicker).not.toBe(first);
    expect(runs).toBe(2);
  });

  it('leaves out lines that do not reach the part, and then the part is the same as worked out afresh', () => {
    // A waterline on the wall between St 3 and St 4 only: at St 1 it is not in the section at all.
    const withWaterline = (atSt4: number): BuiltHull =>
      hullBuild({ ...boxLines, lines: [...boxLines.lines, { id: 'wl', name: 'WL 200', kind: 'waterline', z: 200, cells: { st3: 500, st4: atSt4 } }] });
    const before = withWaterline(500);
    const after = withWaterline(500.4);
    const atSt1 = bulkhead({ stationId: 'st1' });
    const atSt4 = bulkhead({ stationId: 'st4', markedFace: 'forward' });
    expect(partInputKey(after, atSt1, [])).toBe(partInputKey(before, atSt1, []));
    expect(JSON.stringify(frameOfPart(after, atSt1))).toBe(JSON.stringify(frameOfPart(before, atSt1)));
    expect(partInputKey(after, atSt4, [])).not.toBe(partInputKey(before, atSt4, []));
  });
});
