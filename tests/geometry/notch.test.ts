import { describe, expect, it } from 'vitest';
import { deckLineAt } from '../../shared/geometry/deck';
import { hullBuild } from '../../shared/geometry/hull';
import { type LongitudinalPlace, longitudinalCovers, longitudinalPlaceAt, notchCrossingAngle, notchesOfPlace } from '../../shared/geometry/notch';
import { polygonArea, polygonSignedArea } from '../../shared/geometry/polygon';
import { sectionAt } from '../../shared/geometry/section';
import { chineHull, evenStations, range, roundHull } from './analytic-hulls';
import { longitudinalOf } from './frame-fixtures';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;
const place = (r: LongitudinalPlace | { missed: string }): LongitudinalPlace => {
  if ('missed' in r) expect.fail(r.missed);
  return r as LongitudinalPlace;
};

describe('longitudinalPlaceAt and notchCrossingAngle: a stringer at a fixed height on a cone', () => {
  // Analytic: circles of radius R(x) = 1000 - k x about (0, 1100), k = 0.05. A stringer at height z lies at
  // y = sqrt(R^2 - (z - zc)^2), and as x grows it moves along y at dy/dx = -k R / y. On the section's tangent
  // tau = (-(z - zc), y) / R that is a = k (z - zc) / y, and the surface moves out at r = -k (notch.ts):
  // tan(phi) = a / sqrt(1 + r^2) = k (z - zc) / (y sqrt(1 + k^2)). Lines as in the section tests.
  const k = 0.05;
  const zc = 1100;
  const R = (x: number): number => 1000 - k * x;
  const hull = hullBuild(roundHull({ xs: evenStations(0, 6000, 12), radius: R, centreZ: zc, sheerAngle: 100 * DEG, waterlineZs: range(450, 1200, 50), buttockYs: range(50, 650, 50), skinMm: 9 }));
  const lg = longitudinalOf({ id: 's', name: 'Stringer', kind: 'stringer', placement: { by: 'height', z: 700 }, widthMm: 40, depthMm: 20 });

  it('finds it at its height and crossing at the angle the closed form gives', () => {
    const x0 = 3000;
    const x1 = 3018;
    const a = place(longitudinalPlaceAt(hull, sectionAt(hull, x0)!, null, lg));
    const b = place(longitudinalPlaceAt(hull, sectionAt(hull, x1)!, null, lg));
    expectClose(a.point.z, 700, 1e-6, 'height');
    expectClose(a.point.y, Math.sqrt(R(x0) ** 2 - 400 ** 2), 0.01, 'half-breadth');
    expectClose(a.rate, -k, 1e-4, 'rate');
    expect(a.coverMm).toBe(9);
    // The angle between two faces 18 mm apart is the closed form at their middle (a chord of the run).
    const xm = (x0 + x1) / 2;
    const ym = Math.sqrt(R(xm) ** 2 - 400 ** 2);
    const expected = Math.atan(Math.abs((k * (700 - zc)) / (ym * Math.sqrt(1 + k * k))));
    expectClose(notchCrossingAngle(a, b), expected, 2e-4, 'crossing angle');
    expect(notchCrossingAngle(a, a)).toBe(0);
  });

  it('cuts a notch W / cos(phi) wide, its floor (t + d) sqrt(1 + r^2) in from the moulded line', () => {
    const a = place(longitudinalPlaceAt(hull, sectionAt(hull, 3000)!, null, lg));
    const phi = 0.03;
    const [star, port] = notchesOfPlace(lg, a, phi, 2);
    expect(star!.side).toBe('starboard');
    expect(port!.side).toBe('port');
    const kk = Math.sqrt(1 + a.rate * a.rate);
    expectClose(star!.widthMm, 40 / Math.cos(phi), 1e-12, 'width');
    expectClose(star!.depthMm, 18 * kk, 1e-12, 'depth below the edge');
    expectClose(star!.floorMm, 29 * kk, 1e-12, 'floor below the moulded line');
    // Analytic: the cutter is the rectangle width x (floor + 1 mm overrun), counter-clockwise; the port one its mirror.
    expectClose(polygonArea(star!.loop), star!.widthMm * (star!.floorMm + 1), 1e-6, 'cutter area');
    expect(polygonSignedArea(star!.loop)).toBeGreaterThan(0);
    expect(polygonSignedArea(port!.loop)).toBeGreaterThan(0);
    expectClose(port!.centre.y, -star!.centre.y, 1e-12, 'mirror');
    // A longitudinal no deeper than the clearance needs no notch.
    expect(notchesOfPlace(longitudinalOf({ ...lg, depthMm: 2 }), a, 0, 2)).toEqual([]);
  });

  it('says why a longitudinal is not on a section', () => {
    const high = longitudinalOf({ ...lg, placement: { by: 'height', z: 5000 } });
    const r = longitudinalPlaceAt(hull, sectionAt(hull, 3000)!, null, high);
    expect(r).toEqual({ missed: expect.stringMatching(/^longitudinal "Stringer" \(s\) at height 5000 mm is not on the section at x = 3000\.0 mm/) });
  });
});

describe('longitudinalPlaceAt: by line, girth, half-breadth, and under the deck', () => {
  // Analytic: flat bottom z = 0 to the chine at y = 600, side y = 600 + 0.2 z, sheer at 500; bottom 12 mm, side 9 mm.
  const lines = chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0.2, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 });
  const hull = hullBuild({ ...lines, deck: { camber: { shape: 'parabola', crown: { kind: 'rise', riseMm: 40, referenceBeamMm: 1600 } }, thicknessMm: 9 } });
  const s = sectionAt(hull, 1500)!;

  it('a line: the chine plus a girth offset up the side', () => {
    const r = place(longitudinalPlaceAt(hull, s, null, longitudinalOf({ id: 'c', name: 'Chine log', kind: 'stringer', placement: { by: 'line', lineId: 'chine', girthOffsetMm: 51 }, widthMm: 30, depthMm: 20 })));
    // Analytic: 51 mm up a side leaning 0.2 out per mm of rise is 51 / sqrt(1.04) up and 0.2 of that out.
    expectClose(r.point.z, 51 / Math.sqrt(1.04), 1e-9, 'height');
    expectClose(r.point.y, 600 + (0.2 * 51) / Math.sqrt(1.04), 1e-9, 'half-breadth');
    expect(r.coverMm).toBe(9);
    expectClose(r.girthMm, 651, 1e-9, 'girth');
  });

  it('a girth along the bottom and a half-breadth: the same place', () => {
    const byGirth = place(longitudinalPlaceAt(hull, s, null, longitudinalOf({ id: 'g', name: 'G', kind: 'stringer', placement: { by: 'girth', girthMm: 250 }, widthMm: 30, depthMm: 20 })));
    const byY = place(longitudinalPlaceAt(hull, s, null, longitudinalOf({ id: 'y', name: 'Y', kind: 'stringer', placement: { by: 'half-breadth', y: 250 }, widthMm: 30, depthMm: 20 })));
    expect(byGirth.point).toEqual({ y: 250, z: 0 });
    expectClose(byY.point.y, 250, 1e-9, 'y');
    expect(byGirth.coverMm).toBe(12);
    expectClose(byGirth.normal.z, -1, 1e-12, 'normal down');
  });

  it('a carlin under the deck: on the deck line at its half-breadth, inside the deck thickness', () => {
    const deck = deckLineAt(hull, s);
    const carlin = longitudinalOf({ id: 'k', name: 'Carlin', kind: 'carlin', placement: { by: 'half-breadth', y: 300 }, widthMm: 40, depthMm: 50, against: 'deck' });
    const r = place(longitudinalPlaceAt(hull, s, deck, carlin));
    // Analytic: one-pattern parabola, 40 mm over 1600 mm, station half-beam 700: z = 500 + 40 (700^2 - y^2) / 800^2.
    expectClose(r.point.z, 500 + (40 * (700 ** 2 - 300 ** 2)) / 800 ** 2, 0.05, 'deck height');
    expect(r.against).toBe('deck');
    expect(r.coverMm).toBe(9);
    expect(r.normal.z).toBeGreaterThan(0.99);
    expect(longitudinalPlaceAt(hull, s, deck, longitudinalOf({ ...carlin, placement: { by: 'height', z: 400 } }))).toEqual({ missed: expect.stringMatching(/place it by half-breadth or girth/) });
  });

  it('longitudinalCovers: within its x range, open ends to the hull ends', () => {
    const lg = longitudinalOf({ id: 'c', name: 'C', kind: 'clamp', placement: { by: 'girth', girthMm: 10 }, widthMm: 30, depthMm: 20, fromX: 500, toX: null });
    expect([longitudinalCovers(lg, 499), longitudinalCovers(lg, 500), longitudinalCovers(lg, 1e6)]).toEqual([false, true, true]);
  });
});
