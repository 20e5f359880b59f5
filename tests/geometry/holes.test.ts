import { describe, expect, it } from 'vitest';
import { arcPoints, arcSegments, circleLoop, limberPlaces, openingLoops, roundedRectLoop, slotLoop } from '../../shared/geometry/holes';
import { limberSchema, openingSchema } from '../../shared/geometry/part-schema';
import { polygonArea, polygonIsSimple, polygonSignedArea } from '../../shared/geometry/polygon';
import { CHORD_TOLERANCE_MM, type SectionPoint } from '../../shared/geometry/types';
import { expectClose, expectPointClose } from './helpers';

const distances = (loop: readonly SectionPoint[], c: SectionPoint): { min: number; max: number } => {
  let min = Infinity;
  let max = 0;
  loop.forEach((p, i) => {
    const q = loop[(i + 1) % loop.length]!;
    const mid = { y: (p.y + q.y) / 2, z: (p.z + q.z) / 2 };
    for (const v of [p, mid]) {
      const d = Math.hypot(v.y - c.y, v.z - c.z);
      [min, max] = [Math.min(min, d), Math.max(max, d)];
    }
  });
  return { min, max };
};

describe('arcSegments and circleLoop', () => {
  it('keeps every chord within the tolerance of the circle: sagitta r (1 - cos(step / 2))', () => {
    for (const r of [5, 20, 150, 2000]) {
      const n = arcSegments(r, 2 * Math.PI);
      // Analytic: the sagitta of each chord of a circle of radius r is r (1 - cos(pi / n)).
      expect(r * (1 - Math.cos(Math.PI / n)), `r = ${r}`).toBeLessThanOrEqual(CHORD_TOLERANCE_MM + 1e-12);
      expect(r * (1 - Math.cos(Math.PI / (n - 1))), `r = ${r}, one fewer`).toBeGreaterThan(CHORD_TOLERANCE_MM * 0.99);
    }
  });

  it('draws a hole no smaller than asked: chords touch the radius, points within the tolerance outside it', () => {
    const c = { y: 30, z: -40 };
    const loop = circleLoop(c, 20);
    const d = distances(loop, c);
    expectClose(d.min, 20, 1e-9, 'chord middles on the circle');
    expect(d.max - 20).toBeLessThanOrEqual(CHORD_TOLERANCE_MM * 1.01);
    expect(polygonSignedArea(loop)).toBeGreaterThan(0);
    // Analytic: the area lies between pi r^2 and that of the circle through the points.
    expect(polygonArea(loop)).toBeGreaterThan(Math.PI * 400);
    expect(polygonArea(loop)).toBeLessThan(Math.PI * d.max ** 2);
  });

  it('arcPoints runs from a0 through the sweep, both ends on the circle', () => {
    const pts = arcPoints({ y: 0, z: 0 }, 10, 0, Math.PI / 2);
    expectPointClose(pts[0]!, { y: 10, z: 0 }, 1e-12);
    expectPointClose(pts[pts.length - 1]!, { y: 0, z: 10 }, 1e-12);
  });
});

describe('openings', () => {
  it('a rounded rectangle has area w h - (4 - pi) r^2 (analytic), within the chords', () => {
    const loop = roundedRectLoop({ y: 0, z: 500 }, 300, 200, 40);
    expectClose(polygonArea(loop), 300 * 200 - (4 - Math.PI) * 1600, 4 * 40 * (Math.PI / 2) * CHORD_TOLERANCE_MM, 'area');
    expect(polygonIsSimple(loop) && polygonSignedArea(loop) > 0).toBe(true);
    expect(roundedRectLoop({ y: 0, z: 0 }, 300, 200, 0)).toHaveLength(4);
  });

  it('a slot has area pi r^2 + 2 r (L - 2 r) (analytic), turned to its angle', () => {
    const loop = slotLoop({ y: 100, z: 100 }, 200, 50, Math.PI / 2);
    expectClose(polygonArea(loop), Math.PI * 625 + 50 * 150, 2 * Math.PI * 25 * CHORD_TOLERANCE_MM, 'area');
    // Analytic: stood on end, it reaches 100 mm up and down from its centre (its round ends drawn as chords
    // within the tolerance inside the arc) and 25 mm across.
    const zs = loop.map((p) => p.z);
    expectClose(Math.max(...zs), 200, CHORD_TOLERANCE_MM, 'top');
    expectClose(Math.min(...zs), 0, CHORD_TOLERANCE_MM, 'bottom');
    expectClose(Math.max(...loop.map((p) => p.y)), 125, 1e-9, 'side');
  });

  it('mirrors an opening across the centreline when asked (a slot at angle a becomes pi - a)', () => {
    const o = openingSchema.parse({ shape: 'slot', y: 200, z: 300, lengthMm: 120, widthMm: 30, angleRad: 0.3, mirror: true });
    const [a, b] = openingLoops(o);
    expect(b).toBeDefined();
    for (const p of a!) expect(b!.some((q) => Math.hypot(q.y + p.y, q.z - p.z) < 1e-9)).toBe(true);
    const single = openingSchema.parse({ shape: 'circle', y: 0, z: 300, radiusMm: 50, mirror: true });
    expect(openingLoops(single)).toHaveLength(1);
  });
});

describe('limberPlaces', () => {
  it('centres each limber on the edge at its girth from the lowest centreline crossing', () => {
    // Analytic: a U edge from (-500, 600) down to (-500, 0), across to (500, 0), up to (500, 600).
    const edge = { points: [{ y: -500, z: 600 }, { y: -500, z: 0 }, { y: 500, z: 0 }, { y: 500, z: 600 }], closed: false };
    const places = limberPlaces(limberSchema.parse({ girthMm: 600, radiusMm: 15 }), edge);
    expect(places.map((p) => [p!.side, p!.girthMm, p!.centre.y, p!.centre.z])).toEqual([
      ['port', -600, -500, 100],
      ['starboard', 600, 500, 100],
    ]);
    expect(limberPlaces(limberSchema.parse({ girthMm: 5000, radiusMm: 15, sides: 'starboard' }), edge)).toEqual([null]);
  });
});
