import { describe, expect, it } from 'vitest';
import type { EdgePoint } from '../../shared/geometry/edge';
import { bevelMarksAlong, bevelMarksSummary, checkDimensionOf, levelLineOf, templateMarksOf } from '../../shared/geometry/marks';
import type { SectionPoint } from '../../shared/geometry/types';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;
const edgePt = (y: number, z: number, girthMm: number, rate: number, corner = false): EdgePoint => ({ y, z, ny: 0, nz: -1, rate, bevel: Math.atan(Math.abs(rate)), girthMm, setInMm: 0, edge: 'hull', corner });
const frame = { markedFace: 'forward' as const, sidingMm: 18, xDirection: 'aft' as const };

describe('bevelMarksAlong', () => {
  // Invented edge: a straight bottom 0 to 230 mm of girth whose rate runs from 0.1 to 0.333 (a bevel from
  // 5.7 to 18.4 deg), its end a corner.
  const run = [edgePt(0, 0, 0, 0.1), edgePt(230, 0, 230, 0.1 + (230 * 0.233) / 230, true)];

  it('marks every N mm of girth from the centreline, and the far end', () => {
    const marks = bevelMarksAlong([{ points: run, side: 'starboard' }], frame, 50, 45 * DEG);
    expect(marks.map((m) => m.girthMm)).toEqual([0, 50, 100, 150, 200, 230]);
    // Linear along the edge (the points are within the chord tolerance of the curve): rate 0.1 + 0.233 g / 230.
    for (const m of marks) expectClose(Math.tan(m.bevel), 0.1 + (0.233 * m.girthMm) / 230, 1e-12, `at ${m.girthMm}`);
    // bevel.ts: the surface grows toward +x (rate > 0) and the marked face is forward with x aft: the far face
    // (toward +x) is larger, a standing bevel.
    expect(marks.every((m) => m.kind === 'standing' && m.side === 'starboard')).toBe(true);
  });

  it('signs the port side negative and flags tilts past the saw limit', () => {
    const port = run.map((p) => ({ ...p, y: -p.y }));
    const marks = bevelMarksAlong([{ points: port, side: 'port' }], frame, 50, 15 * DEG);
    expect(marks.map((m) => m.girthMm)).toEqual([0, -50, -100, -150, -200, -230]);
    // Analytic: tan 15 deg = 0.268, reached at g = (0.268 - 0.1) 230 / 0.233 = 165.8 mm.
    expect(marks.map((m) => m.overLimit)).toEqual([false, false, false, false, true, true]);
    expect(bevelMarksSummary(marks, 15 * DEG)).toMatchObject({ overLimit: 2, standing: 6, mixed: false });
  });

  it('leaves out marks inside a notch or limber (that edge is cut away)', () => {
    const notch: SectionPoint[] = [{ y: 80, z: -5 }, { y: 120, z: -5 }, { y: 120, z: 20 }, { y: 80, z: 20 }];
    const marks = bevelMarksAlong([{ points: run, side: 'starboard' }], frame, 50, 45 * DEG, [notch]);
    expect(marks.map((m) => m.girthMm)).toEqual([0, 50, 150, 200, 230]);
  });
});

describe('template marks and the check dimension', () => {
  // Invented outline: a trapezoid 1000 wide at the bottom (z = 0), 1400 wide at the top (z = 600).
  const outer = [{ y: -500, z: 0 }, { y: 500, z: 0 }, { y: 700, z: 600 }, { y: -700, z: 600 }];
  const regions = [{ outer, holes: [] }];
  const bounds = { minY: -700, maxY: 700, minZ: 0, maxZ: 600 };

  it('the check dimension is the widest level line, half-breadth to half-breadth (analytic: 1400 at the top)', () => {
    expect(checkDimensionOf(regions)).toEqual({ from: { y: -700, z: 600 }, to: { y: 700, z: 600 }, lengthMm: 1400 });
  });

  it('a level line runs across the part where it crosses it (analytic: 1000 + 400 z / 600 wide)', () => {
    const l = levelLineOf(regions, bounds, 300, 300);
    expectClose(l.to.y - l.from.y, 1200, 1e-9, 'width at 300');
    expect(l.crossesPart).toBe(true);
    expect(levelLineOf(regions, bounds, 900, 900)).toMatchObject({ crossesPart: false, from: { y: -700 }, to: { y: 700 } });
  });

  it('uses the design waterline as the level line when it crosses the part, else the mid-height', () => {
    const base = { regions, bounds, templateZ: (h: number) => h, levelLineZ: null, setUpLineZ: 50, grain: 'z' as const, stationName: 'St 4', partName: 'Frame 4', markedFace: 'aft' as const, notchCentres: [], limberCentres: [] };
    const withDwl = templateMarksOf({ ...base, designWaterlineZ: 250 });
    expect(withDwl.levelLine.heightMm).toBe(250);
    expect(withDwl.designWaterline!.heightMm).toBe(250);
    expect(withDwl.setUpLine!.heightMm).toBe(50);
    expect(withDwl.faceLabel).toBe('Frame 4, St 4, aft face');
    expect(withDwl.centreline).toEqual({ from: { y: 0, z: -50 }, to: { y: 0, z: 650 } });
    expect(withDwl.grain).toEqual({ direction: 'z', from: { y: 0, z: 225 }, to: { y: 0, z: 375 } });
    const above = templateMarksOf({ ...base, designWaterlineZ: 2000 });
    expect(above.levelLine.heightMm).toBe(300);
    expect(above.designWaterline!.crossesPart).toBe(false);
    const own = templateMarksOf({ ...base, designWaterlineZ: 250, levelLineZ: 120 });
    expect(own.levelLine.heightMm).toBe(120);
  });
});
