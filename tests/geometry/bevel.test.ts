import { describe, expect, it } from 'vitest';
import {
  type FrameSiding,
  bevelAlong,
  bevelFromMove,
  bevelMarkOf,
  bevelMoveAcross,
  bevelStationPlaneThickness,
  bevelSummaryOf,
  bevelUnderFace,
} from '../../shared/geometry/bevel';
import { deductionAt } from '../../shared/geometry/deduction';
import type { EdgePoint } from '../../shared/geometry/edge';
import { hullBuild } from '../../shared/geometry/hull';
import { degToRad, radToDeg } from '../../shared/geometry/types';
import { chineHull, ellipticHull, evenStations, range, roundHull } from './analytic-hulls';
import { expectClose } from './helpers';

const point = (rate: number): EdgePoint => ({ y: 100, z: 200, ny: 1, nz: 0, rate, bevel: Math.atan(Math.abs(rate)), girthMm: 0, setInMm: 0, edge: 'hull', corner: false });

describe('bevelFromMove / bevelMoveAcross (the bevel board)', () => {
  it('gives tan(bevel) = d / L for stations L = 600 mm apart', () => {
    // Source: Gougeon 2005, p. 183, fig. 16-12 (bevel board, tan(bevel) = d / L); derived check values for L = 600 mm.
    const cases: [number, number][] = [
      [52.49, 5],
      [105.8, 10],
      [160.77, 15],
      [218.38, 20],
    ];
    for (const [d, b] of cases) {
      // The d values are rounded to 0.01 mm: 0.005 mm in 600 is under 0.001 degree.
      expectClose(radToDeg(bevelFromMove(d, 600)), b, 0.001, `d = ${d}`);
      expectClose(bevelMoveAcross(degToRad(b), 600), d, 0.005, `b = ${b}`);
    }
  });

  it('removes s tan(b) of wood across a siding s', () => {
    // Derived (REFERENCES.md): s = 18 mm at 17 degrees removes 5.50 mm.
    expectClose(bevelMoveAcross(degToRad(17), 18), 5.5, 0.005, 'wood removed');
    expectClose(bevelMarkOf(point(Math.tan(degToRad(17))), { markedFace: 'aft', sidingMm: 18, xDirection: 'aft' }).removedMm, 5.5, 0.005, 'mark');
  });
});

describe('bevelStationPlaneThickness', () => {
  it('is what the deduction sets the skin in by at every point of a bevelled frame', () => {
    // Source: Gougeon 2005, p. 184, fig. 16-14: skin deduction in the station plane is t / cos(bevel).
    // Analytic hull: round sections of radius R(x) = 1000 - 1e-4 (x - 3000)^2; skin 9 mm.
    const hull = hullBuild(roundHull({ xs: evenStations(1500, 4500, 12), radius: (x) => 1000 - 1e-4 * (x - 3000) ** 2, centreZ: 1100, sheerAngle: 100 * (Math.PI / 180), waterlineZs: range(500, 1200, 50), buttockYs: range(50, 600, 50), skinMm: 9 }));
    const d = deductionAt(hull, 2000)!;
    for (const p of d.hull) expectClose(p.setInMm, bevelStationPlaneThickness(9, p.bevel), 1e-9, `girth ${p.girthMm}`);
    // Analytic: t / cos(b) with tan(b) = 0.2 is 9 sqrt(1.04).
    expectClose(bevelStationPlaneThickness(9, Math.atan(0.2)), 9 * Math.sqrt(1.04), 1e-12, 't / cos b');
  });
});

describe('bevelMarkOf / bevelAlong: under and standing', () => {
  // Analytic: round hull, R(x) = 1000 - 1e-4 (x - 3000)^2 from x = 1500 to 4500, largest section at x = 3000 (x
  // increasing aft, from the bow). The circle's normal is radial, so the surface moves along it at
  // R'(x) = -2e-4 (x - 3000): at x = 2000 it grows aftward at 0.2 (bevel atan 0.2 = 11.31 degrees), at x = 4000
  // it shrinks at 0.2. Density: stations every 250 mm, waterlines and buttocks every 50 mm. Error budget: 0.02
  // degree of bevel (the lines' slopes along x, from splines through stations 250 mm apart, are good to about 3e-4).
  // Source: A. Young, Nautical Dictionary, 1846 (under: acute angle at the marked face, which is the larger;
  // standing: obtuse); marking each frame on its face toward the largest section gives under bevels throughout.
  // A sliding bevel reads 90 - b under, 90 + b standing (common practice).
  const hull = hullBuild(roundHull({ xs: evenStations(1500, 4500, 12), radius: (x) => 1000 - 1e-4 * (x - 3000) ** 2, centreZ: 1100, sheerAngle: 100 * (Math.PI / 180), waterlineZs: range(500, 1200, 50), buttockYs: range(50, 600, 50) }));
  const b = radToDeg(Math.atan(0.2));
  const frame = (markedFace: 'forward' | 'aft', xDirection: 'aft' | 'forward' = 'aft'): FrameSiding => ({ markedFace, sidingMm: 18, xDirection });
  const check = (x: number, f: FrameSiding, kind: 'under' | 'standing', larger: 'forward' | 'aft') => {
    const marks = bevelAlong(deductionAt(hull, x)!.hull, f);
    expect(marks.length).toBeGreaterThan(40);
    for (const m of marks) {
      expect(m.kind, `x = ${x}, girth ${m.girthMm}`).toBe(kind);
      expectClose(m.bevelDeg, b, 0.02, 'bevel');
      expectClose(m.slidingBevelDeg, kind === 'under' ? 90 - b : 90 + b, 0.02, 'sliding bevel');
      expect(m.largerFace).toBe(larger);
      expect(m.faceDown).toBe(larger);
      expectClose(m.removedMm, 18 * 0.2, 0.01, 'wood removed'); // 18 x 3e-4 at most
    }
    expect(bevelSummaryOf(marks).mixed).toBe(false);
  };

  it('forward of the largest section: under when marked on the aft face, standing on the forward face', () => {
    check(2000, frame('aft'), 'under', 'aft');
    check(2000, frame('forward'), 'standing', 'aft');
  });

  it('aft of the largest section: under when marked on the forward face, standing on the aft face', () => {
    check(4000, frame('forward'), 'under', 'forward');
    check(4000, frame('aft'), 'standing', 'forward');
  });

  it('turns round when x increases forward', () => {
    // The same table read with x increasing forward: the largest section is now forward of x = 2000.
    check(2000, frame('forward', 'forward'), 'under', 'forward');
    expect(bevelUnderFace(0.3, 'aft')).toBe('aft');
    expect(bevelUnderFace(0.3, 'forward')).toBe('forward');
  });

  it('marks every 25 mm of girth', () => {
    const marks = bevelAlong(deductionAt(hull, 2000)!.hull, frame('aft'));
    for (let i = 1; i < marks.length - 1; i++) expectClose(marks[i]!.girthMm - marks[i - 1]!.girthMm, 25, 1e-9, 'spacing');
  });
});

describe('bevelSummaryOf: a frame that mixes under and standing', () => {
  it('reports a frame whose bottom grows aft while its topsides narrow', () => {
    // Analytic: elliptic sections, half-beam 900 - 0.05 x narrowing aft, depth 600 + 0.05 x deepening aft: the
    // keel moves out (down) at 0.05 per mm of x while the side at the sheer moves in at 0.05.
    const hull = hullBuild(ellipticHull({ xs: evenStations(0, 4000, 8), halfBeam: (x) => 900 - 0.05 * x, depth: (x) => 600 + 0.05 * x, sheerZ: 1000, waterlineZs: range(500, 950, 50), buttockYs: range(50, 600, 50) }));
    const marks = bevelAlong(deductionAt(hull, 2000)!.hull, { markedFace: 'aft', sidingMm: 18, xDirection: 'aft' });
    const summary = bevelSummaryOf(marks);
    expect(summary.mixed).toBe(true);
    expect(summary.under).toBeGreaterThan(0);
    expect(summary.standing).toBeGreaterThan(0);
    // Analytic: at the keel the bevel is atan(0.05) (ellipse normal straight down), at the sheer atan(0.05) too.
    expectClose(marks[0]!.bevelDeg, radToDeg(Math.atan(0.05)), 0.01, 'keel bevel');
    expectClose(marks[marks.length - 1]!.bevelDeg, radToDeg(Math.atan(0.05)), 0.01, 'sheer bevel');
    expect(marks[0]!.kind).not.toBe(marks[marks.length - 1]!.kind);
  });
});

describe('bevelAlong: corners and square edges', () => {
  it('puts the marks of an edge that starts part-way round on whole multiples of the spacing', () => {
    // Analytic: a straight edge from girth 30 to 260 mm with marks every 50 mm: its ends, and 50 ... 250.
    const edge: EdgePoint[] = [30, 100, 180, 260].map((g) => ({ ...point(0), y: g, girthMm: g }));
    const marks = bevelAlong(edge, { markedFace: 'aft', sidingMm: 18, xDirection: 'aft' }, 50);
    expect(marks.map((m) => m.girthMm)).toEqual([30, 50, 100, 150, 200, 250, 260]);
    // and one from girth 0 starts on 0 with no extra mark
    const fromZero = bevelAlong(edge.map((p) => ({ ...p, girthMm: p.girthMm - 30 })), { markedFace: 'aft', sidingMm: 18, xDirection: 'aft' }, 50);
    expect(fromZero.map((m) => m.girthMm)).toEqual([0, 50, 100, 150, 200, 230]);
  });

  it('marks both sides of a chine and calls a prismatic hull square', () => {
    // Analytic: a prismatic box (no change along x): every bevel is square; the chine is marked on both sides.
    const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: 0, sheerZ: 500, bottomMm: 12, sideMm: 9 }));
    const marks = bevelAlong(deductionAt(hull, 1000)!.hull, { markedFace: 'aft', sidingMm: 18, xDirection: 'aft' });
    expect(marks.every((m) => m.kind === 'square' && m.slidingBevelDeg === 90 && m.largerFace === null)).toBe(true);
    expect(marks.filter((m) => m.corner)).toHaveLength(3);
  });
});
