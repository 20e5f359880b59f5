import { describe, expect, it } from 'vitest';
// @ts-expect-error clipper-lib 6.4.2 publishes no type declarations; the calls used are typed below.
import ClipperLibUntyped from 'clipper-lib';
import { type Deduction, deductionAt, deductionOf, outlineMirrored } from '../../shared/geometry/deduction';
import type { EdgePoint } from '../../shared/geometry/edge';
import type { HullLinesInput } from '../../shared/geometry/hull-schema';
import { hullBuild } from '../../shared/geometry/hull';
import { type Section, sectionAt } from '../../shared/geometry/section';
import { CHORD_TOLERANCE_MM } from '../../shared/geometry/types';
import { chineHull, evenStations, prismaticHull, range, roundHull, vBottom } from './analytic-hulls';
import { expectClose } from './helpers';

interface IntPoint {
  X: number;
  Y: number;
}
/** clipper-lib 6.4.2 (npm, Angus Johnson's Clipper, a general-purpose polygon clipping and offsetting library). */
const ClipperLib = ClipperLibUntyped as {
  ClipperOffset: new (miterLimit?: number, arcTolerance?: number) => { AddPath(p: IntPoint[], join: number, end: number): void; Execute(out: IntPoint[][], delta: number): void };
  JoinType: { jtMiter: number };
  EndType: { etClosedPolygon: number };
};

const DEG = Math.PI / 180;
const SCALE = 1000; // clipper works in integers: micrometres

/** The moulded section mirrored and closed across the sheer, offset inward by d (mm) with clipper-lib (mitred joins). */
function clipperInset(s: Section, d: number): { y: number; z: number }[] {
  const half = s.vertices.map((v) => ({ y: v.y, z: v.z }));
  const port = half.filter((p) => p.y > 0).map((p) => ({ y: -p.y, z: p.z })).reverse();
  const ring = [...half, ...port].map((p) => ({ X: Math.round(p.y * SCALE), Y: Math.round(p.z * SCALE) }));
  const co = new ClipperLib.ClipperOffset(25, 0.25);
  co.AddPath(ring, ClipperLib.JoinType.jtMiter, ClipperLib.EndType.etClosedPolygon);
  const out: IntPoint[][] = [];
  co.Execute(out, -d * SCALE);
  expect(out.length).toBe(1);
  return out[0]!.map((p) => ({ y: p.X / SCALE, z: p.Y / SCALE }));
}

/** Distance (mm) from p to a polyline (closed if `closed`). */
function distanceTo(p: { y: number; z: number }, pts: readonly { y: number; z: number }[], closed: boolean): number {
  let best = Infinity;
  const n = pts.length;
  for (let i = 0; i < (closed ? n : n - 1); i++) {
    const a = pts[i]!;
    const b = pts[(i + 1) % n]!;
    const vy = b.y - a.y;
    const vz = b.z - a.z;
    const l2 = vy * vy + vz * vz;
    const f = l2 > 0 ? Math.max(0, Math.min(1, ((p.y - a.y) * vy + (p.z - a.z) * vz) / l2)) : 0;
    best = Math.min(best, Math.hypot(p.y - a.y - f * vy, p.z - a.z - f * vz));
  }
  return best;
}

/** Largest distance both ways between our edge and clipper's offset, below `zTop` (clear of the closure at the sheer). */
function clipperDistance(d: Deduction, theirs: { y: number; z: number }[], zTop: number): number {
  let worst = 0;
  for (const p of d.hull) if (p.z < zTop) worst = Math.max(worst, distanceTo(p, theirs, true));
  for (const q of theirs) if (q.y >= 0 && q.z < zTop) worst = Math.max(worst, distanceTo(q, d.hull, false));
  return worst;
}

function radiusErrors(pts: readonly EdgePoint[], zc: number, R: number): number {
  let worst = 0;
  pts.forEach((p, i) => {
    worst = Math.max(worst, Math.abs(Math.hypot(p.y, p.z - zc) - R));
    const q = pts[i - 1];
    if (q) worst = Math.max(worst, Math.abs(Math.hypot((p.y + q.y) / 2, (p.z + q.z) / 2 - zc) - R));
  });
  return worst;
}

describe('deductionOf: circular cylinder', () => {
  // Analytic: cylinder R = 1000 mm, skin 9 mm plus 1 mm sheathing, offsets to the outside: the frame edge is
  // the circle of radius R - 10. Density as in the section tests (point every 6 degrees or closer).
  // Error budget: 0.05 mm (vertices and chord middles).
  const R = 1000;
  const zc = 1100;
  const lines = roundHull({ xs: evenStations(0, 6000, 10), radius: () => R, centreZ: zc, sheerAngle: 110 * DEG, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100), skinMm: 9, sheathingMm: 1 });
  const hull = hullBuild(lines);

  it('is the circle of radius R - t', () => {
    const d = deductionAt(hull, 2700)!;
    expect(radiusErrors(d.hull, zc, R - 10)).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
    for (const p of d.hull) expectClose(p.setInMm, 10, 1e-9, 'set-in');
    // Analytic: it still meets the centreline square, 10 mm above the keel.
    expect(d.hull[0]).toMatchObject({ y: 0 });
    expectClose(d.hull[0]!.z, zc - R + 10, 1e-9, 'keel');
  });

  it('agrees with clipper-lib offsetting the same section', () => {
    // Source: clipper-lib 6.4.2 (npm) ClipperOffset, mitred joins, on the mirrored section closed across the sheer;
    // bevel zero (a cylinder), so the station-plane set-in is the skin itself. Largest distance within 0.05 mm.
    const s = sectionAt(hull, 2700)!;
    const d = deductionOf(hull, s);
    expect(clipperDistance(d, clipperInset(s, 10), zc + 200)).toBeLessThanOrEqual(0.05);
  });

  it('sets in by the clearance alone when the offsets are to the inside of the skin', () => {
    // Analytic: offsets to the inside of the skin already give the frame line; only the 2 mm clearance remains.
    const inside = hullBuild({ ...lines, skin: { ...lines.skin, offsetsTo: 'inside' } });
    const d = deductionAt(inside, 2700, { filletClearanceMm: 2 })!;
    expect(radiusErrors(d.hull, zc, R - 2)).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
  });
});

describe('deductionOf: cone', () => {
  // Analytic: R(x) = R0 - k x about a fixed centre, k = 0.05, skin t = 9 mm, clearance c = 2 mm. The cone's
  // normal in its meridian plane is (k, 1)/sqrt(1 + k^2). Setting the surface in by (t + c) along that
  // normal moves a point (x, R) to (x - (t + c) k/sqrt(1+k^2), R - (t + c)/sqrt(1+k^2)); substituting, the inner
  // surface is r = R0 - k x - (t + c) sqrt(1 + k^2). Its section is the circle of radius
  // R(x) - (t + c) sqrt(1 + k^2) = R(x) - (t + c)/cos(b), b = atan(k): the skin deduction in the station plane is
  // t / cos(bevel) (Gougeon 2005, p. 184, fig. 16-14). Density and budget as the section test: 0.05 mm.
  const R0 = 1000;
  const k = 0.05;
  const zc = 1100;
  const hull = hullBuild(
    roundHull({ xs: evenStations(0, 6000, 12), radius: (x) => R0 - k * x, centreZ: zc, sheerAngle: 100 * DEG, waterlineZs: range(450, 1200, 50), buttockYs: range(50, 650, 50), skinMm: 9 }),
  );

  it('is the circle of radius R(x) - (t + c) sqrt(1 + k^2), bevelled atan(k) all round', () => {
    for (const x of [500, 3100, 5500]) {
      const d = deductionAt(hull, x, { filletClearanceMm: 2 })!;
      expect(radiusErrors(d.hull, zc, R0 - k * x - 11 * Math.sqrt(1 + k * k)), `x = ${x}`).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
      for (const p of d.hull) expectClose(p.bevel, Math.atan(k), 2e-4, `bevel at girth ${p.girthMm}`);
    }
  });
});

describe('deductionOf: flat-sided hull with flare narrowing along x', () => {
  // Analytic: bottom z = 0 to the chine at yc = 900 - c x, side y = yc + f z (c = 0.08, f = 0.3), bottom panel
  // 12 mm, side panel 9 mm, sheathing 1 mm. The bottom does not move: set in 13 mm. The side moves at
  // c / sqrt(1 + f^2) along its normal, so its bevel b has tan b = c / sqrt(1 + f^2) and it is set in
  // 10 / cos b = 10 sqrt(1 + f^2 + c^2) / sqrt(1 + f^2) along its normal. The inner side line is
  // y = yc + f z - 10 sqrt(1 + f^2 + c^2); the corner is where it meets z = 13. Error budget 1e-6 mm.
  const c = 0.08;
  const f = 0.3;
  const hull = hullBuild(chineHull({ xs: evenStations(0, 5000, 10), chineY: (x) => 900 - c * x, flare: f, sheerZ: 800, waterlineZs: [200, 400, 600], bottomMm: 12, sideMm: 9, sheathingMm: 1 }));

  it('sets each panel in by its own thickness and mitres the chine', () => {
    const x = 2345;
    const d = deductionAt(hull, x)!;
    const yc = 900 - c * x;
    const sideIn = 10 * Math.sqrt(1 + f * f + c * c);
    const corner = d.hull.filter((p) => p.corner && p.z < 100);
    expect(corner).toHaveLength(2);
    for (const p of corner) {
      expectClose(p.y, yc + f * 13 - sideIn, 1e-6, 'corner y');
      expectClose(p.z, 13, 1e-6, 'corner z');
    }
    for (const p of d.hull) {
      const onBottom = Math.abs(p.z - 13) < 1e-6;
      const onSide = Math.abs(p.y - (yc + f * p.z - sideIn)) < 1e-6;
      expect(onBottom || onSide, `(${p.y}, ${p.z})`).toBe(true);
    }
  });
});

describe('deductionOf: compared with clipper-lib where the bevel is zero', () => {
  it('matches on a box section with sharp chines (mitred corners)', () => {
    // Source: clipper-lib 6.4.2 (npm) ClipperOffset, jtMiter. Analytic box, prismatic: bevel zero everywhere.
    const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: 0.2, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 12 }));
    const s = sectionAt(hull, 1500)!;
    expect(clipperDistance(deductionOf(hull, s), clipperInset(s, 12), 500 - 60)).toBeLessThanOrEqual(0.05);
  });

  it('matches where the set-in is larger than the radius of the turn (the offset loop is cut out)', () => {
    // Source: clipper-lib 6.4.2 (npm) ClipperOffset. A prismatic section (invented shape, analytic circle arcs):
    // flat bottom to y = 300, a 6 mm radius turn of the bilge, a vertical side; skin 15 mm, so the inward offset
    // of the turn folds back and must be cut where it crosses itself.
    const xs = evenStations(0, 2000, 4);
    const cells = <T,>(v: T) => Object.fromEntries(xs.map((_, i) => [`st${i}`, v]));
    const r = 6;
    const arc = [15, 30, 45, 60, 75].map((a) => ({ y: 300 + r * Math.sin(a * DEG), z: r - r * Math.cos(a * DEG) }));
    const lines: HullLinesInput = {
      notation: {},
      stations: xs.map((x, i) => ({ id: `st${i}`, name: String(i), x })),
      lines: [
        { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: cells({ y: 0, z: 0 }) },
        ...[100, 200, 290].map((y) => ({ id: `b${y}`, name: `B ${y}`, kind: 'buttock' as const, y, cells: cells(0) })),
        ...arc.map((p, i) => ({ id: `a${i}`, name: `Turn ${i}`, kind: 'point' as const, role: 'other' as const, cells: cells(p) })),
        ...[16, 100, 200, 300].map((z) => ({ id: `w${z}`, name: `WL ${z}`, kind: 'waterline' as const, z, cells: cells(300 + r) })),
        { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: cells({ y: 300 + r, z: 400 }) },
      ],
      skin: { defaultThicknessMm: 15 },
    };
    const hull = hullBuild(lines);
    const s = sectionAt(hull, 1000)!;
    const d = deductionOf(hull, s);
    expect(clipperDistance(d, clipperInset(s, 15), 400 - 60)).toBeLessThanOrEqual(0.05);
    // No piece of the edge runs backward after the cut.
    for (let i = 1; i < d.hull.length; i++) expect(d.hull[i]!.girthMm).toBeGreaterThanOrEqual(d.hull[i - 1]!.girthMm);
  });
});

describe('deductionOf: V bottom', () => {
  it('starts on the centreline where the two sides of the V meet', () => {
    // Analytic: keel knuckle at (0, 0), bottom straight to the chine (800, 300); set in t = 10 along the normal
    // (300, -800)/L: the inner bottom 300 y - 800 z = -10 L meets the centreline at z = 10 L / 800.
    const xs = evenStations(0, 2000, 4);
    const hull = hullBuild(prismaticHull({ xs, points: vBottom(900, 900), skinMm: 10 }));
    const d = deductionAt(hull, 700)!;
    expectClose(d.hull[0]!.y, 0, 1e-9, 'on the centreline');
    expectClose(d.hull[0]!.z, (10 * Math.hypot(800, 300)) / 800, 1e-6, 'height');
  });
});

describe('outlineMirrored', () => {
  it('closes the frame symmetric about the centreline', () => {
    const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: 0.2, sheerZ: 500, bottomMm: 12, sideMm: 9 }));
    const d = deductionAt(hull, 1000)!;
    const full = outlineMirrored(d.outline);
    // Analytic: every point off the centreline has its mirror image.
    for (const p of full) expect(full.some((q) => Math.abs(q.y + p.y) < 1e-9 && Math.abs(q.z - p.z) < 1e-9)).toBe(true);
    // Analytic: shoelace area of the frame = 2 x the half outline's area, positive (counter-clockwise, y right, z up).
    let area = 0;
    for (let i = 0; i < full.length; i++) {
      const a = full[i]!;
      const b = full[(i + 1) % full.length]!;
      area += (a.y * b.z - b.y * a.z) / 2;
    }
    // The half outline is a trapezoid: bottom at z = 12 out to the inner side, up to the sheer height z = 500, level back.
    const yAt = (z: number) => 600 + 0.2 * z - 9 * Math.sqrt(1 + 0.04);
    expectClose(area, 2 * ((yAt(12) + yAt(500)) / 2) * (500 - 12), 1e-3, 'area');
  });
});
