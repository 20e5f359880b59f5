import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
// @ts-expect-error clipper-lib 6.4.2 publishes no type declarations.
import ClipperLibUntyped from 'clipper-lib';
import {
  CLIPPER_SCALE,
  type Shape,
  polygonArea,
  polygonBounds,
  polygonContainsPoint,
  polygonCounterClockwise,
  polygonInsidePolygon,
  polygonIsSimple,
  polygonOffset,
  polygonOrientation,
  polygonPerimeter,
  polygonPointLocation,
  polygonSignedArea,
  polylineDistance,
  polylineLength,
  shapeArea,
  shapeBoolean,
  shapeCornersRounded,
  shapeOffset,
  shapePerimeter,
} from '../../shared/geometry/polygon';
import { GeometryInputError, type SectionPoint } from '../../shared/geometry/types';
import { expectClose } from './helpers';

const ClipperLib = ClipperLibUntyped as { Clipper: { Area(path: { X: number; Y: number }[]): number } };

const rectangle = (y0: number, z0: number, w: number, h: number): SectionPoint[] => [
  { y: y0, z: z0 },
  { y: y0 + w, z: z0 },
  { y: y0 + w, z: z0 + h },
  { y: y0, z: z0 + h },
];
/** A regular n-gon inscribed in a circle of radius r about (cy, cz), counter-clockwise. */
const circle = (r: number, n: number, cy = 0, cz = 0): SectionPoint[] =>
  Array.from({ length: n }, (_, i) => ({ y: cy + r * Math.cos((2 * Math.PI * i) / n), z: cz + r * Math.sin((2 * Math.PI * i) / n) }));
const radiusOf = (p: SectionPoint, cy = 0, cz = 0): number => Math.hypot(p.y - cy, p.z - cz);

/** A convex polygon: 3 to 24 points on a circle at sorted random angles, counter-clockwise. */
const convexPolygon = fc
  .uniqueArray(fc.integer({ min: 0, max: 3599 }), { minLength: 3, maxLength: 24 })
  .chain((angles) => fc.record({ r: fc.double({ min: 50, max: 2000, noNaN: true }), angles: fc.constant(angles.sort((a, b) => a - b)) }))
  .map(({ r, angles }) => angles.map((a) => ({ y: r * Math.cos((a * Math.PI) / 1800), z: r * Math.sin((a * Math.PI) / 1800) })))
  .filter((pts) => polygonSignedArea(pts) > 1);

describe('polygonSignedArea and polygonArea', () => {
  it('give a rectangle its width times height, positive counter-clockwise', () => {
    // analytic
    expectClose(polygonSignedArea(rectangle(10, 20, 300, 200)), 60000, 1e-9);
    expectClose(polygonSignedArea([...rectangle(10, 20, 300, 200)].reverse()), -60000, 1e-9);
    expectClose(polygonArea([...rectangle(10, 20, 300, 200)].reverse()), 60000, 1e-9);
  });

  it('give a regular polygon (n/2) r^2 sin(2 pi / n), tending to pi r^2', () => {
    // analytic
    const r = 500;
    for (const n of [3, 4, 12, 1000]) expectClose(polygonArea(circle(r, n)), (n / 2) * r * r * Math.sin((2 * Math.PI) / n), 1e-6);
    // analytic: circle area, the polygon short by about 2 pi^3 r^2 / (3 n^2)
    expectClose(polygonArea(circle(r, 4000)), Math.PI * r * r - (2 * Math.PI ** 3 * r * r) / (3 * 4000 ** 2), 1e-3);
  });

  it('agree with clipper-lib Clipper.Area on the same loop (reference library)', () => {
    fc.assert(
      fc.property(convexPolygon, (pts) => {
        const path = pts.map((p) => ({ X: Math.round(p.y * CLIPPER_SCALE), Y: Math.round(p.z * CLIPPER_SCALE) }));
        const reference = ClipperLib.Clipper.Area(path) / (CLIPPER_SCALE * CLIPPER_SCALE);
        // Rounding to the clipper grid moves each vertex at most half a micrometre.
        expectClose(polygonSignedArea(pts), reference, polygonPerimeter(pts) * 1e-3);
      }),
    );
  });

  it('are 0 for fewer than three points', () => {
    // analytic
    expect(polygonSignedArea([])).toBe(0);
    expect(polygonSignedArea([{ y: 0, z: 0 }, { y: 1, z: 1 }])).toBe(0);
  });
});

describe('polygonPerimeter and polylineLength', () => {
  it('measure a rectangle and a regular polygon', () => {
    // analytic
    expectClose(polygonPerimeter(rectangle(0, 0, 300, 200)), 1000, 1e-9);
    // analytic: 2 n r sin(pi / n), tending to 2 pi r
    expectClose(polygonPerimeter(circle(250, 36)), 2 * 36 * 250 * Math.sin(Math.PI / 36), 1e-9);
    expectClose(polygonPerimeter(circle(250, 4000)), 2 * Math.PI * 250, 1e-3);
    // analytic: the open polyline leaves out the closing edge
    expectClose(polylineLength(rectangle(0, 0, 300, 200)), 800, 1e-9);
  });
});

describe('polygonBounds', () => {
  it('is the box of the points, null for none', () => {
    // analytic
    expect(polygonBounds(rectangle(-5, 7, 10, 20))).toEqual({ minY: -5, minZ: 7, maxY: 5, maxZ: 27 });
    expect(polygonBounds([])).toBeNull();
  });
});

describe('polygonOrientation and polygonCounterClockwise', () => {
  it('tell the direction and make any loop counter-clockwise', () => {
    fc.assert(
      fc.property(convexPolygon, (pts) => {
        // analytic: points in increasing angle run counter-clockwise
        expect(polygonOrientation(pts)).toBe('ccw');
        const cw = [...pts].reverse();
        expect(polygonOrientation(cw)).toBe('cw');
        const fixed = polygonCounterClockwise(cw);
        expect(polygonSignedArea(fixed)).toBeGreaterThan(0);
        expectClose(polygonSignedArea(fixed), polygonSignedArea(pts), 1e-6);
      }),
    );
    // analytic: collinear points enclose nothing
    expect(polygonOrientation([{ y: 0, z: 0 }, { y: 1, z: 1 }, { y: 2, z: 2 }])).toBe('degenerate');
  });
});

describe('polygonPointLocation and polygonContainsPoint', () => {
  it('place points inside, outside and on a rectangle', () => {
    const r = rectangle(0, 0, 100, 50);
    // analytic
    expect(polygonPointLocation(r, { y: 50, z: 25 })).toBe('inside');
    expect(polygonPointLocation(r, { y: 150, z: 25 })).toBe('outside');
    expect(polygonPointLocation(r, { y: 100, z: 10 })).toBe('boundary');
    expect(polygonPointLocation(r, { y: 0, z: 0 })).toBe('boundary');
    expect(polygonContainsPoint(r, { y: 100, z: 10 })).toBe(false);
    expect(polygonContainsPoint([...r].reverse(), { y: 1, z: 1 })).toBe(true);
  });

  it('agree with the distance from the centre of a fine circle', () => {
    const r = 300;
    const loop = circle(r, 720);
    const inscribed = r * Math.cos(Math.PI / 720);
    fc.assert(
      fc.property(fc.double({ min: -400, max: 400, noNaN: true }), fc.double({ min: -400, max: 400, noNaN: true }), (y, z) => {
        const d = Math.hypot(y, z);
        fc.pre(Math.abs(d - r) > r - inscribed + 1e-6);
        // analytic: inside the inscribed radius is inside, beyond the circle outside
        expect(polygonContainsPoint(loop, { y, z })).toBe(d < r);
      }),
    );
  });
});

/** Plain O(n^2) reference: any two non-adjacent edges that cross or touch. */
function bruteSimple(pts: SectionPoint[]): boolean {
  const n = pts.length;
  const cross = (a: SectionPoint, b: SectionPoint, c: SectionPoint): number => (b.y - a.y) * (c.z - a.z) - (b.z - a.z) * (c.y - a.y);
  const onSeg = (a: SectionPoint, b: SectionPoint, p: SectionPoint): boolean =>
    cross(a, b, p) === 0 && Math.min(a.y, b.y) <= p.y && p.y <= Math.max(a.y, b.y) && Math.min(a.z, b.z) <= p.z && p.z <= Math.max(a.z, b.z);
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      const [a, b, c, d] = [pts[i]!, pts[(i + 1) % n]!, pts[j]!, pts[(j + 1) % n]!];
      const d1 = cross(a, b, c);
      const d2 = cross(a, b, d);
      const d3 = cross(c, d, a);
      const d4 = cross(c, d, b);
      if (d1 * d2 < 0 && d3 * d4 < 0) return false;
      if (onSeg(a, b, c) || onSeg(a, b, d) || onSeg(c, d, a) || onSeg(c, d, b)) return false;
    }
  }
  return true;
}

describe('polygonIsSimple', () => {
  it('accepts a square and a 2000-point circle, rejects a bow tie', () => {
    // analytic
    expect(polygonIsSimple(rectangle(0, 0, 10, 10))).toBe(true);
    expect(polygonIsSimple(circle(1000, 2000))).toBe(true);
    expect(polygonIsSimple([{ y: 0, z: 0 }, { y: 10, z: 10 }, { y: 10, z: 0 }, { y: 0, z: 10 }])).toBe(false);
  });

  it('finds one vertex of a 2000-point circle pulled across the far side', () => {
    // analytic: the vertex at angle 0 moved to y = -2000 makes its two edges cross the circle
    const loop = circle(1000, 2000);
    loop[0] = { y: -2000, z: 0 };
    expect(polygonIsSimple(loop)).toBe(false);
  });

  it('rejects an edge that doubles back over its neighbour and a loop touching itself at a vertex', () => {
    // analytic: a spike out and back along the same line
    expect(polygonIsSimple([{ y: 0, z: 0 }, { y: 10, z: 0 }, { y: 20, z: 0 }, { y: 15, z: 0 }, { y: 10, z: 10 }])).toBe(false);
    // analytic: vertex (5, 0) lies on the edge from (0, 0) to (10, 0)... as a figure eight pinched at one point
    expect(polygonIsSimple([{ y: 0, z: 0 }, { y: 10, z: 0 }, { y: 10, z: 10 }, { y: 5, z: 0 }, { y: 0, z: 10 }])).toBe(false);
  });

  it('ignores repeated points but needs three distinct ones', () => {
    // analytic
    expect(polygonIsSimple([{ y: 0, z: 0 }, { y: 0, z: 0 }, { y: 10, z: 0 }, { y: 10, z: 10 }])).toBe(true);
    expect(polygonIsSimple([{ y: 0, z: 0 }, { y: 10, z: 0 }, { y: 0, z: 0 }])).toBe(false);
  });

  it('agrees with a plain all-pairs check on random loops (analytic reference in the test)', () => {
    const pt = fc.record({ y: fc.integer({ min: -50, max: 50 }), z: fc.integer({ min: -50, max: 50 }) });
    fc.assert(
      fc.property(fc.uniqueArray(pt, { minLength: 4, maxLength: 14, selector: (p) => `${p.y},${p.z}` }), (pts) => {
        fc.pre(polygonSignedArea(pts) !== 0);
        // integer points: a gap that is not a touch is at least 1/150 mm, far above the 1e-9 tolerance
        expect(polygonIsSimple(pts, 1e-9)).toBe(bruteSimple(pts));
      }),
      { numRuns: 500 },
    );
  });
});

describe('polygonInsidePolygon', () => {
  const outer = rectangle(0, 0, 100, 100);
  it('holds for a loop strictly inside, not for one crossing, touching or enclosing', () => {
    // analytic
    expect(polygonInsidePolygon(rectangle(10, 10, 20, 20), outer)).toBe(true);
    expect(polygonInsidePolygon(rectangle(90, 10, 20, 20), outer)).toBe(false);
    expect(polygonInsidePolygon(rectangle(0, 10, 20, 20), outer)).toBe(false);
    expect(polygonInsidePolygon(outer, rectangle(10, 10, 20, 20))).toBe(false);
  });

  it('sees an edge leaving a concave outer loop between two inside vertices', () => {
    // analytic: a U whose notch the inner triangle's top edge spans
    const u = [{ y: 0, z: 0 }, { y: 100, z: 0 }, { y: 100, z: 100 }, { y: 60, z: 100 }, { y: 60, z: 20 }, { y: 40, z: 20 }, { y: 40, z: 100 }, { y: 0, z: 100 }];
    expect(polygonInsidePolygon([{ y: 50, z: 10 }, { y: 80, z: 90 }, { y: 20, z: 90 }], u)).toBe(false);
  });
});

describe('polylineDistance', () => {
  it('is the distance to the nearest segment, open or closed', () => {
    const line = [{ y: 0, z: 0 }, { y: 100, z: 0 }, { y: 100, z: 100 }];
    // analytic
    expectClose(polylineDistance(line, { y: 50, z: 30 })!, 30, 1e-12);
    expectClose(polylineDistance(line, { y: -30, z: -40 })!, 50, 1e-12);
    // analytic: the closing edge from (100, 100) to (0, 0) passes 14.142 mm from (40, 60)
    expectClose(polylineDistance(line, { y: 40, z: 60 })!, 60, 1e-12);
    expectClose(polylineDistance(line, { y: 40, z: 60 }, true)!, 20 / Math.SQRT2, 1e-12);
    expect(polylineDistance([], { y: 0, z: 0 })).toBeNull();
  });
});

describe('polygonOffset and shapeOffset (clipper-lib ClipperOffset, round joins)', () => {
  it('move a fine circle of radius 100 out to 110 and in to 90', () => {
    const loop = circle(100, 720);
    // analytic: chords of the 720-gon are within 0.001 mm of the circle; clipper rounds to 0.0005 mm
    for (const [delta, r] of [[10, 110], [-10, 90]] as const) {
      const out = polygonOffset(loop, delta);
      expect(out).toHaveLength(1);
      for (const p of out[0]!.outer) expectClose(radiusOf(p), r, 0.003, `offset ${delta}`);
      expectClose(polygonArea(out[0]!.outer), Math.PI * r * r, 2 * Math.PI * r * 0.003);
    }
  });

  it('round a rectangle\'s corners to within the arc tolerance', () => {
    const arcTol = 0.05;
    const rect = rectangle(0, 0, 300, 200);
    const out = polygonOffset(rect, 10, arcTol)[0]!.outer;
    // analytic: every vertex 10 mm from the rectangle; every chord's midpoint no more than the tolerance inside that
    for (let i = 0; i < out.length; i++) {
      const a = out[i]!;
      const b = out[(i + 1) % out.length]!;
      expectClose(polylineDistance(rect, a, true)!, 10, 0.001);
      const mid = polylineDistance(rect, { y: (a.y + b.y) / 2, z: (a.z + b.z) / 2 }, true)!;
      expect(mid).toBeGreaterThanOrEqual(10 - arcTol - 0.001);
    }
    // analytic (Steiner): area + perimeter * d + pi d^2, short of it by at most the arc tolerance along the arcs
    const exact = 300 * 200 + 1000 * 10 + Math.PI * 100;
    const area = polygonArea(out);
    expect(area).toBeLessThanOrEqual(exact + 0.5);
    expect(area).toBeGreaterThanOrEqual(exact - 2 * Math.PI * 10 * arcTol - 0.5);
  });

  it('grow any convex polygon by perimeter * d + pi d^2 (Steiner formula, analytic)', () => {
    fc.assert(
      fc.property(convexPolygon, fc.double({ min: 1, max: 100, noNaN: true }), (pts, d) => {
        const out = polygonOffset(pts, d, 0.01);
        expect(out).toHaveLength(1);
        const exact = polygonArea(pts) + polygonPerimeter(pts) * d + Math.PI * d * d;
        expectClose(polygonArea(out[0]!.outer), exact, 2 * Math.PI * d * 0.01 + polygonPerimeter(pts) * 0.002 + 1);
      }),
      { numRuns: 60 },
    );
  });

  it('narrow a ring from both sides and keep the hole a hole', () => {
    const ring: Shape = { outer: rectangle(0, 0, 400, 400), holes: [[...rectangle(100, 100, 200, 200)].reverse()] };
    const out = shapeOffset([ring], -10);
    expect(out).toHaveLength(1);
    expect(out[0]!.holes).toHaveLength(1);
    // analytic: outer 380 square; hole 220 square with corners rounded to radius 10: 220^2 - (4 - pi) 10^2
    expectClose(polygonArea(out[0]!.outer), 380 * 380, 0.5);
    expectClose(polygonArea(out[0]!.holes[0]!), 220 * 220 - (4 - Math.PI) * 100, 3);
    expect(polygonSignedArea(out[0]!.holes[0]!)).toBeLessThan(0);
  });

  it('split a dumbbell at its narrow bar and remove what is too small', () => {
    // analytic: two 100 squares joined by a bar 4 mm wide; shrinking by 3 closes the bar
    const dumbbell = [{ y: 0, z: 0 }, { y: 100, z: 0 }, { y: 100, z: 48 }, { y: 200, z: 48 }, { y: 200, z: 0 }, { y: 300, z: 0 }, { y: 300, z: 100 }, { y: 200, z: 100 }, { y: 200, z: 52 }, { y: 100, z: 52 }, { y: 100, z: 100 }, { y: 0, z: 100 }];
    const out = polygonOffset(dumbbell, -3);
    expect(out).toHaveLength(2);
    // analytic: each a 94 square plus, where the bar left it, the sliver between the two 3 mm arcs about the
    // bar's corners: the integral of 4 - 2 sqrt(9 - u^2) for u from sqrt(5) to 3 (0.9603 mm^2); the arcs'
    // chords lie inside the arcs, adding at most arc length * tolerance
    const u0 = Math.sqrt(5);
    const integral = (u: number): number => (u / 2) * Math.sqrt(Math.max(0, 9 - u * u)) + 4.5 * Math.asin(u / 3);
    const sliver = 4 * (3 - u0) - 2 * (integral(3) - integral(u0));
    expectClose(sliver, 0.9603, 1e-4);
    for (const s of out) {
      const area = polygonArea(s.outer);
      expect(area).toBeGreaterThanOrEqual(94 * 94 + sliver - 0.01);
      expect(area).toBeLessThanOrEqual(94 * 94 + sliver + 2 * 3 * Math.acos(2 / 3) * 0.05 + 0.01);
    }
    expect(polygonOffset(rectangle(0, 0, 10, 10), -6)).toEqual([]);
  });

  it('refuses points that are not finite', () => {
    expect(() => polygonOffset([{ y: 0, z: 0 }, { y: Number.NaN, z: 0 }, { y: 1, z: 1 }], 1)).toThrow(GeometryInputError);
    expect(() => polygonOffset(rectangle(0, 0, 1, 1), Infinity)).toThrow(/finite distance/);
  });
});

describe('shapeBoolean, shapeArea and shapePerimeter', () => {
  it('cut a hole and measure the ring net of it (clipper-lib reference for the boolean)', () => {
    const out = shapeBoolean('difference', [{ outer: rectangle(0, 0, 100, 100), holes: [] }], [{ outer: rectangle(20, 20, 60, 60), holes: [] }]);
    expect(out).toHaveLength(1);
    expect(out[0]!.holes).toHaveLength(1);
    // analytic
    expectClose(shapeArea(out[0]!), 10000 - 3600, 1e-6);
    expectClose(shapePerimeter(out[0]!), 400 + 240, 1e-6);
    // analytic: two overlapping squares
    const union = shapeBoolean('union', [{ outer: rectangle(0, 0, 10, 10), holes: [] }], [{ outer: rectangle(5, 5, 10, 10), holes: [] }]);
    expectClose(shapeArea(union[0]!), 175, 1e-6);
    const inter = shapeBoolean('intersection', [{ outer: rectangle(0, 0, 10, 10), holes: [] }], [{ outer: rectangle(5, 5, 10, 10), holes: [] }]);
    expectClose(shapeArea(inter[0]!), 25, 1e-6);
  });
});

describe('shapeCornersRounded', () => {
  it('rounds a square\'s corners, or a ring\'s inner corners, to the radius', () => {
    const square: Shape = { outer: rectangle(0, 0, 100, 100), holes: [] };
    // analytic: each corner loses (1 - pi/4) r^2; the chords sit inside the arcs by at most the tolerance
    const round = shapeCornersRounded([square], 10, 'convex');
    expectClose(shapeArea(round[0]!), 10000 - (4 - Math.PI) * 100, 2 * Math.PI * 10 * 0.05 + 0.1);
    expect(shapeArea(round[0]!)).toBeLessThanOrEqual(10000 - (4 - Math.PI) * 100 + 0.1);
    // analytic: the ring's hole corners filled by the same amount, the outside untouched
    const ring: Shape = { outer: rectangle(0, 0, 400, 400), holes: [[...rectangle(100, 100, 200, 200)].reverse()] };
    const filled = shapeCornersRounded([ring], 25, 'concave');
    expectClose(polygonArea(filled[0]!.outer), 160000, 0.5);
    expectClose(polygonArea(filled[0]!.holes[0]!), 40000 - (4 - Math.PI) * 625, 2 * Math.PI * 25 * 0.05 + 0.5);
    expect(shapeCornersRounded([square], 0, 'convex')[0]!.outer).toHaveLength(4);
    expect(() => shapeCornersRounded([square], -1, 'convex')).toThrow(/corner radius/);
  });
});
