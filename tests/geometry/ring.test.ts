import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
// @ts-expect-error clipper-lib 6.4.2 publishes no type declarations; the calls used are typed below.
import ClipperLibUntyped from 'clipper-lib';
import { deductionAt } from '../../shared/geometry/deduction';
import type { EdgePoint } from '../../shared/geometry/edge';
import { hullBuild } from '../../shared/geometry/hull';
import { polygonArea, polygonInsidePolygon, polygonIsSimple } from '../../shared/geometry/polygon';
import { RING_WIDTH_TAPER, type RingSpec, ringEdgeClearance, ringInnerEdge, ringRegion } from '../../shared/geometry/ring';
import { CHORD_TOLERANCE_MM, GeometryInputError, type SectionPoint } from '../../shared/geometry/types';
import { chineHull, evenStations, prismaticHull, range, roundHull, vBottom } from './analytic-hulls';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;
const spec = (over: Partial<RingSpec> = {}): RingSpec => ({ bottomMm: 60, sidesMm: 60, underDeckMm: 60, bottom: { by: 'normal' }, cornerRadiusMm: 0, top: 'deck', ...over });
const dist = (p: SectionPoint, q: SectionPoint): number => Math.hypot(p.y - q.y, p.z - q.z);

describe('ringInnerEdge: circular cylinder', () => {
  // Analytic: cylinder R = 1000 about (0, 1100), skin 9 mm, clearance 2 mm: the frame's edge is the circle
  // R - 11 (deduction.test.ts); a ring w wide is the circle R - 11 - w up to where it meets the top bar,
  // which is the level closure at the sheer (z = 1100 - R cos 110 deg) less w. Budget: the chord tolerance.
  const R = 1000;
  const zc = 1100;
  const hull = hullBuild(roundHull({ xs: evenStations(0, 6000, 10), radius: () => R, centreZ: zc, sheerAngle: 110 * DEG, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100), skinMm: 9 }));
  const half = deductionAt(hull, 2700, { filletClearanceMm: 2 })!.outline;
  const zTop = zc - R * Math.cos(110 * DEG);

  it('is the circle R - t - c - w, and the top bar w below the top, with rounded corners of the stated radius', () => {
    const w = 60;
    const rho = 25;
    const inner = ringInnerEdge(half, spec({ cornerRadiusMm: rho }));
    const Ri = R - 11 - w;
    // Analytic: the rounding circle touches the inner circle (its centre Ri - rho from the hull's centre) and the
    // bar (its centre rho below it).
    const fz = zTop - w - rho;
    const fy = Math.sqrt((Ri - rho) ** 2 - (fz - zc) ** 2);
    let onCircle = 0;
    let onBar = 0;
    let onFillet = 0;
    for (const p of inner) {
      const dc = Math.abs(Math.hypot(p.y, p.z - zc) - Ri);
      const db = Math.abs(p.z - (zTop - w));
      const df = Math.abs(Math.hypot(p.y - fy, p.z - fz) - rho);
      const best = Math.min(dc, db, df);
      expect(best, `(${p.y.toFixed(2)}, ${p.z.toFixed(2)})`).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
      if (best === dc && p.z < fz) onCircle++;
      else if (best === db && p.y < fy) onBar++;
      else onFillet++;
    }
    expect(onCircle).toBeGreaterThan(50);
    expect(onBar).toBeGreaterThan(0);
    expect(onFillet).toBeGreaterThan(2);
    // It starts and ends on the centreline (analytic: bottom of the inner circle, and the bar).
    expectClose(inner[0]!.y, 0, 1e-9, 'start y');
    expectClose(inner[0]!.z, zc - Ri, CHORD_TOLERANCE_MM, 'start z');
    expectClose(inner[inner.length - 1]!.z, zTop - w, 1e-6, 'end z');
  });

  it('agrees with clipper-lib offsetting the outline inward by the width (square corners, no radius)', () => {
    // Source: clipper-lib 6.4.2 (npm) ClipperOffset, mitred joins, on the whole outline: a constant ring width is
    // the inward offset. Largest distance from each of our points to clipper's loop within 0.05 mm.
    const region = ringRegion(half, spec());
    const theirs = clipperInset(region.outer, 60);
    let worst = 0;
    for (const p of region.holes[0]!) worst = Math.max(worst, distanceToLoop(p, theirs));
    expect(worst).toBeLessThanOrEqual(0.05);
    // Analytic sanity of the region: the hole is inside the outer loop, both simple.
    expect(polygonIsSimple(region.outer) && polygonIsSimple(region.holes[0]!)).toBe(true);
    expect(polygonInsidePolygon(region.holes[0]!, region.outer)).toBe(true);
  });

  it('tapers a change of width along a smooth edge over RING_WIDTH_TAPER mm of girth per mm of width', () => {
    // Bottom 90 mm where the normal is within 45 deg of straight down, sides 60 mm (our rule for a round bilge).
    const inner = ringInnerEdge(half, spec({ bottomMm: 90 }));
    const Rf = R - 11;
    const depth = (p: SectionPoint): number => Rf - Math.hypot(p.y, p.z - zc);
    // Analytic: the 45 deg point is at angle 45 deg from straight down; the taper runs 4 x 30 = 120 mm of girth up from it.
    const angleOf = (p: SectionPoint): number => Math.atan2(p.y, zc - p.z);
    const taperEnd = 45 * DEG + (RING_WIDTH_TAPER * 30) / Rf;
    for (const p of inner) {
      const a = angleOf(p);
      if (p.z > zTop - 200) continue;
      if (a < 45 * DEG - 0.001) expectClose(depth(p), 90, CHORD_TOLERANCE_MM, `bottom at ${(a / DEG).toFixed(1)} deg`);
      else if (a > taperEnd + 0.005) expectClose(depth(p), 60, CHORD_TOLERANCE_MM, `side at ${(a / DEG).toFixed(1)} deg`);
      else expect(depth(p)).toBeGreaterThanOrEqual(60 - CHORD_TOLERANCE_MM);
    }
  });

  it('refuses widths that leave no opening', () => {
    // Analytic: a frame about 1980 mm across cannot take a 1000 mm ring each side.
    expect(() => ringRegion(half, spec({ bottomMm: 1000, sidesMm: 1000, underDeckMm: 1000 }))).toThrowError(GeometryInputError);
    try {
      ringRegion(half, spec({ bottomMm: 1000, sidesMm: 1000, underDeckMm: 1000 }));
    } catch (e) {
      expect((e as GeometryInputError).issues[0]!.code).toBe('ring-too-wide');
    }
  });
});

describe('ringInnerEdge: flat bottom and flared sides', () => {
  // Analytic: bottom z = 0 to the chine y = 600, side y = 600 + f z (f = 0.2) to the sheer at z = 500, bottom skin
  // 12 mm, side 9 mm, clearance 2 mm, prismatic (bevel 0). The frame's bottom edge is z = 14, its side
  // y - f z = 600 - 11 sqrt(1 + f^2), its top the level line z = 500. The ring: bottom 90 mm (up to the chine),
  // sides 60 mm, under the top 40 mm, corners rounded to 20 mm: each inner line is its outer line moved in by
  // its width, and each rounding circle's centre is where the lines moved in by width + 20 meet.
  const f = 0.2;
  const k = Math.sqrt(1 + f * f);
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: f, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 }));
  const half = deductionAt(hull, 1500, { filletClearanceMm: 2 })!.outline;
  const s = spec({ bottomMm: 90, sidesMm: 60, underDeckMm: 40, bottom: { by: 'girth', girthMm: 600 }, cornerRadiusMm: 20 });
  const bottomZ = (extra: number): number => 14 + 90 + extra;
  const topZ = (extra: number): number => 500 - 40 - extra;
  const sideC = (extra: number): number => 600 - 11 * k - (60 + extra) * k; // y - f z = sideC
  const meet = (zLine: number, extra: number): SectionPoint => ({ y: sideC(extra) + f * zLine, z: zLine });

  it('sets each stretch in by its own width and rounds the corners where the lines meet', () => {
    const inner = ringInnerEdge(half, s);
    const lowCentre = meet(bottomZ(20), 20);
    const highCentre = meet(topZ(20), 20);
    for (const p of inner) {
      const d = Math.min(
        Math.abs(p.z - bottomZ(0)),
        Math.abs(p.z - topZ(0)),
        Math.abs(p.y - f * p.z - sideC(0)) / k,
        Math.abs(dist(p, lowCentre) - 20),
        Math.abs(dist(p, highCentre) - 20),
      );
      expect(d, `(${p.y.toFixed(3)}, ${p.z.toFixed(3)})`).toBeLessThanOrEqual(1e-6 + CHORD_TOLERANCE_MM);
    }
    // Analytic: the rounding touches the bottom line at the foot of its centre, and the side line at its foot.
    expect(inner.some((p) => dist(p, { y: lowCentre.y, z: bottomZ(0) }) < 1e-6)).toBe(true);
    const n = { y: 1 / k, z: -f / k };
    expect(inner.some((p) => dist(p, { y: lowCentre.y + 20 * n.y, z: lowCentre.z + 20 * n.z }) < 1e-6)).toBe(true);
  });

  it('opens the top (arms to the top line) as one U-shaped loop', () => {
    const region = ringRegion(half, { ...s, top: 'open' });
    expect(region.holes).toHaveLength(0);
    expect(polygonIsSimple(region.outer)).toBe(true);
    // Analytic: the arms end at the top line, between the frame's side and the inner side line there.
    const top = region.outer.filter((p) => Math.abs(p.z - 500) < 1e-6 && p.y > 0).map((p) => p.y);
    expectClose(Math.max(...top), 600 - 11 * k + f * 500, 1e-6, 'outer end of the arm');
    expectClose(Math.min(...top), sideC(0) + f * 500, 1e-6, 'inner end of the arm');
    // Analytic: the open ring is the closed one without its top bar, the strip 40 mm deep under the top line
    // between the inner side lines (y = sideC + f z each side), and without the two roundings of the opening's
    // top corners. A corner of angle a rounded to radius r fills r^2 (cot(a / 2) - (pi - a) / 2); here the
    // side leans out by atan(f), so a = 90 deg - atan(f). Budget: the arcs' chords, 5 mm^2.
    const closed = ringRegion(half, s);
    const bar = 2 * (40 * sideC(0) + (f * (500 ** 2 - 460 ** 2)) / 2);
    const a = Math.PI / 2 - Math.atan(f);
    const rounding = 20 * 20 * (1 / Math.tan(a / 2) - (Math.PI - a) / 2);
    const ringArea = polygonArea(closed.outer) - polygonArea(closed.holes[0]!);
    expectClose(ringArea - polygonArea(region.outer), bar + 2 * rounding, 5, 'bar and roundings');
  });
});

describe('ringInnerEdge: V bottom', () => {
  it('meets its mirror on the centreline, rounded to the radius', () => {
    // Analytic: deadrise bottom from the keel (0, 0) up to the chine (800, 300), vertical side to the sheer at 800.
    // No skin, no clearance. The bottom's inner line moved in by 80 mm meets the centreline; the rounding circle
    // of radius 30 has its centre on the centreline, 80 + 30 mm in from the bottom line.
    const xs = evenStations(0, 2000, 4);
    const hull = hullBuild(prismaticHull({ xs, points: vBottom(800, 800).map((p) => ({ ...p, knuckle: { fromX: null, toX: null } })), skinMm: 0 }));
    const half = deductionAt(hull, 1000)!.outline;
    const inner = ringInnerEdge(half, spec({ bottomMm: 80, sidesMm: 60, underDeckMm: 60, bottom: { by: 'girth', girthMm: Math.hypot(800, 300) }, cornerRadiusMm: 30 }));
    const L = Math.hypot(800, 300);
    // Bottom line 300 y - 800 z = 0, normal (300, -800)/L outward; centre of the rounding at y = 0: -800 z = -(110) L.
    const centreZ = (110 * L) / 800;
    expectClose(inner[0]!.y, 0, 1e-9, 'on the centreline');
    expectClose(inner[0]!.z, centreZ - 30, 1e-6, 'lowest point of the rounding');
    for (const p of inner.slice(0, 5)) expectClose(dist(p, { y: 0, z: centreZ }), 30, CHORD_TOLERANCE_MM, 'on the rounding');
  });
});

interface IntPoint {
  X: number;
  Y: number;
}
const ClipperLib = ClipperLibUntyped as {
  ClipperOffset: new (miterLimit?: number, arcTolerance?: number) => { AddPath(p: IntPoint[], join: number, end: number): void; Execute(out: IntPoint[][], delta: number): void };
  JoinType: { jtMiter: number };
  EndType: { etClosedPolygon: number };
};

/** clipper-lib's inward offset (mitred) of a loop, the largest result. */
function clipperInset(loop: readonly SectionPoint[], d: number): SectionPoint[] {
  const co = new ClipperLib.ClipperOffset(50, 0.01);
  co.AddPath(loop.map((p) => ({ X: Math.round(p.y * 1000), Y: Math.round(p.z * 1000) })), ClipperLib.JoinType.jtMiter, ClipperLib.EndType.etClosedPolygon);
  const out: IntPoint[][] = [];
  co.Execute(out, -d * 1000);
  const loops = out.map((path) => path.map((p) => ({ y: p.X / 1000, z: p.Y / 1000 })));
  return loops.sort((a, b) => polygonArea(b) - polygonArea(a))[0]!;
}

function distanceToLoop(p: SectionPoint, loop: readonly SectionPoint[]): number {
  let best = Infinity;
  for (let i = 0; i < loop.length; i++) {
    const a = loop[i]!;
    const b = loop[(i + 1) % loop.length]!;
    const vy = b.y - a.y;
    const vz = b.z - a.z;
    const l2 = vy * vy + vz * vz;
    const t = l2 > 0 ? Math.max(0, Math.min(1, ((p.y - a.y) * vy + (p.z - a.z) * vz) / l2)) : 0;
    best = Math.min(best, Math.hypot(p.y - a.y - t * vy, p.z - a.z - t * vz));
  }
  return best;
}

describe('ringEdgeClearance', () => {
  const edge = (pts: readonly SectionPoint[]): EdgePoint[] => pts.map((q) => ({ y: q.y, z: q.z, ny: 0, nz: 0, rate: 0, bevel: 0, girthMm: 0, setInMm: 0, edge: 'hull', corner: false }));
  // Analytic: the distance from a point to a segment, taken over every pair (no blocks), is what the search
  // by blocks of points and segments must find whenever it is below the limit; points and runs at random,
  // some runs long and sparse, some short and dense, limits from well below to well above the segment lengths.
  const segmentDistance = (p: SectionPoint, a: SectionPoint, b: SectionPoint): number => {
    const vy = b.y - a.y;
    const vz = b.z - a.z;
    const l2 = vy * vy + vz * vz;
    const t = l2 > 0 ? Math.max(0, Math.min(1, ((p.y - a.y) * vy + (p.z - a.z) * vz) / l2)) : 0;
    return Math.hypot(p.y - a.y - t * vy, p.z - a.z - t * vz);
  };
  const pt = fc.record({ y: fc.double({ min: -2000, max: 2000, noNaN: true }), z: fc.double({ min: -500, max: 3000, noNaN: true }) });
  const step = fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }));
  const near = fc.record({ run: fc.nat(), k: fc.nat(), t: fc.double({ min: 0, max: 1, noNaN: true }), dy: fc.double({ min: -1, max: 1, noNaN: true }), dz: fc.double({ min: -1, max: 1, noNaN: true }) });
  it('finds a segment in each of the eight directions around the point', () => {
    // Analytic: a point between two far corner runs and one short run 80 mm off it toward each of the eight
    // directions in turn; the limit 100 mm.
    const asRun = (pts: SectionPoint[]): { points: ReturnType<typeof edge> } => ({ points: edge(pts) });
    const p = { y: 550, z: 550 };
    for (const [di, dj] of [[-1, -1], [-1, 0], [-1, 1], [0, -1], [0, 1], [1, -1], [1, 0], [1, 1]] as const) {
      const l = Math.hypot(di, dj);
      const q = { y: p.y + (80 * di) / l, z: p.z + (80 * dj) / l };
      const runs = [asRun([{ y: 0, z: 0 }, { y: 1, z: 0 }]), asRun([{ y: 1200, z: 1200 }, { y: 1201, z: 1200 }]), asRun([q, { y: q.y + 1e-3 * dj, z: q.z - 1e-3 * di }])];
      expectClose(ringEdgeClearance([p], runs, 100).d, 80, 1e-6, `run toward (${di}, ${dj})`);
    }
  });

  it('looks past the blocks of points and segments that are far apart, at the first point nearest', () => {
    // Analytic: a straight run along z = 0 from y = 0 to 1000 mm in 10 mm steps (many blocks of segments)
    // and points 60 mm above it every 10 mm (many blocks of points): every point is 60 mm off, the first
    // one named. One point dropped to 30 mm, far along: 30 mm, at that point (the blocks far from it passed over).
    const run = { points: edge(range(0, 1000, 10).map((y) => ({ y, z: 0 }))) };
    const points = range(5, 905, 10).map((y) => ({ y, z: 60 }));
    const even = ringEdgeClearance(points, [run], 100);
    expectClose(even.d, 60, 1e-9, 'every point 60 mm off');
    expect(even.p).toBe(points[0]);
    const low = points.map((p, k) => (k === 70 ? { y: p.y, z: 30 } : p));
    const got = ringEdgeClearance(low, [run], 100);
    expectClose(got.d, 30, 1e-9, 'the dropped point');
    expect(got.p).toBe(low[70]);
    expect(ringEdgeClearance(points, [run], 50)).toEqual({ d: 50, p: points[0] });
  });

  it('finds the least distance below the limit exactly as a test of every pair does', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(pt, fc.array(step, { minLength: 1, maxLength: 30 })), { minLength: 1, maxLength: 4 }), fc.double({ min: 0.5, max: 1500, noNaN: true }), fc.array(near, { minLength: 1, maxLength: 40 }), (walks, limit, around) => {
        // Runs as walks from a start, each step up to the limit long: a run's segments fill cells of their own,
        // so a point's nearest segment is often in a cell beside its own.
        const runs = walks.map(([start, steps]) => {
          // Starts within a few limits of each other, so the cells are the limit wide (not the spread / 512).
          const r = [{ y: start.y * 0.005 * limit, z: start.z * 0.005 * limit }];
          for (const [u, v] of steps) r.push({ y: r[r.length - 1]!.y + limit * u, z: r[r.length - 1]!.z + limit * v });
          return r;
        });
        // Most points within about the limit of some segment, in every direction (the cells beside a point's own).
        const points = around.map((o) => {
          const r = runs[o.run % runs.length]!;
          const k = o.k % (r.length - 1);
          return { y: r[k]!.y + o.t * (r[k + 1]!.y - r[k]!.y) + 1.5 * limit * o.dy, z: r[k]!.z + o.t * (r[k + 1]!.z - r[k]!.z) + 1.5 * limit * o.dz };
        });
        let best = limit;
        for (const p of points) for (const r of runs) for (let k = 0; k + 1 < r.length; k++) best = Math.min(best, segmentDistance(p, r[k]!, r[k + 1]!));
        const got = ringEdgeClearance(points, runs.map((r) => ({ points: edge(r) })), limit);
        expectClose(got.d, best, 1e-9 * Math.max(1, best), 'least distance');
        if (best < limit) {
          let at = Infinity;
          for (const r of runs) for (let k = 0; k + 1 < r.length; k++) at = Math.min(at, segmentDistance(got.p, r[k]!, r[k + 1]!));
          expectClose(at, best, 1e-9 * Math.max(1, best), 'the point it names');
        }
      }),
      { numRuns: 300, seed: 11 },
    );
  });
});
