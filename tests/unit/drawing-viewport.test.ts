import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { boundsOf, boundsUnion, fitViewport, measureBetween, panBy, toHull, toScreen, zoomAbout, type Viewport } from '../../src/features/plan/drawing/viewport';

const finite = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const viewports = fc.record({ scale: finite(0.001, 40), offsetX: finite(-5000, 5000), offsetY: finite(-5000, 5000), yScale: finite(0.5, 50) });
const points = fc.record({ x: finite(-20000, 20000), y: finite(-20000, 20000) });

describe('toScreen and toHull', () => {
  it('maps by hand-worked cases with y up in the hull and down on screen', () => {
    // analytic: 0.5 px per mm, hull (0,0) at screen (100, 300): (200 mm, 400 mm) is 100 px right, 200 px up
    const v: Viewport = { scale: 0.5, offsetX: 100, offsetY: 300 };
    expect(toScreen(v, { x: 200, y: 400 })).toEqual({ x: 200, y: 100 });
    expect(toHull(v, { x: 200, y: 100 })).toEqual({ x: 200, y: 400 });
    // analytic: a vertical exaggeration of 10 multiplies heights only
    expect(toScreen({ ...v, yScale: 10 }, { x: 200, y: 4 })).toEqual({ x: 200, y: 280 });
  });

  it('round-trips any point through screen and back (analytic: the maps are inverse affine maps)', () => {
    fc.assert(
      fc.property(viewports, points, (v, p) => {
        const back = toHull(v, toScreen(v, p));
        expect(back.x).toBeCloseTo(p.x, 6);
        expect(back.y).toBeCloseTo(p.y, 6);
      }),
    );
  });
});

describe('fitViewport', () => {
  it('fits a wide drawing to the width, centred, by a hand-worked case', () => {
    // analytic: 1000 × 200 mm into 540 × 400 px less 20 px margins: 500/1000 = 0.5 px/mm (height would allow 1.8)
    const v = fitViewport({ minX: 0, minY: 0, maxX: 1000, maxY: 200 }, { width: 540, height: 400 }, 20);
    expect(v.scale).toBeCloseTo(0.5, 12);
    expect(toScreen(v, { x: 0, y: 0 })).toEqual({ x: 20, y: 250 });
    expect(toScreen(v, { x: 1000, y: 200 })).toEqual({ x: 520, y: 150 });
  });

  it('keeps any bounds inside the margin and centred, touching the margin on one axis', () => {
    fc.assert(
      fc.property(
        points,
        finite(1, 20000),
        finite(1, 20000),
        finite(100, 3000),
        finite(100, 3000),
        finite(0, 40),
        finite(1, 30),
        (p, w, h, width, height, margin, yScale) => {
          const b = { minX: p.x, minY: p.y, maxX: p.x + w, maxY: p.y + h };
          const v = fitViewport(b, { width, height }, margin, yScale);
          const lo = toScreen(v, { x: b.minX, y: b.maxY });
          const hi = toScreen(v, { x: b.maxX, y: b.minY });
          const eps = 1e-6 * Math.max(width, height);
          expect(lo.x).toBeGreaterThanOrEqual(margin - eps);
          expect(lo.y).toBeGreaterThanOrEqual(margin - eps);
          expect(hi.x).toBeLessThanOrEqual(width - margin + eps);
          expect(hi.y).toBeLessThanOrEqual(height - margin + eps);
          expect((lo.x + hi.x) / 2).toBeCloseTo(width / 2, 6);
          expect((lo.y + hi.y) / 2).toBeCloseTo(height / 2, 6);
          // as large as fits: one axis fills the room between the margins
          const fillX = (hi.x - lo.x) / (width - 2 * margin);
          const fillY = (hi.y - lo.y) / (height - 2 * margin);
          expect(Math.max(fillX, fillY)).toBeCloseTo(1, 6);
        },
      ),
    );
  });

  it('gives a drawing of one point a finite scale instead of dividing by zero', () => {
    const v = fitViewport({ minX: 5, minY: 5, maxX: 5, maxY: 5 }, { width: 400, height: 400 }, 20);
    expect(Number.isFinite(v.scale)).toBe(true);
    expect(toScreen(v, { x: 5, y: 5 })).toEqual({ x: 200, y: 200 });
  });
});

describe('zoomAbout', () => {
  it('doubles the scale about a point, by a hand-worked case', () => {
    // analytic: 1 px/mm, origin at (0,0); doubling about screen (100,100) keeps hull (100,-100) there
    const v = zoomAbout({ scale: 1, offsetX: 0, offsetY: 0 }, 2, { x: 100, y: 100 });
    expect(v).toEqual({ scale: 2, offsetX: -100, offsetY: -100 });
    expect(toScreen(v, { x: 100, y: -100 })).toEqual({ x: 100, y: 100 });
  });

  it('keeps the hull point under the cursor fixed for any zoom within the limits', () => {
    fc.assert(
      fc.property(viewports, finite(0.1, 10), fc.record({ x: finite(0, 2000), y: finite(0, 2000) }), (v, factor, cursor) => {
        const before = toHull(v, cursor);
        const z = zoomAbout(v, factor, cursor, { minScale: 1e-6, maxScale: 1e6 });
        expect(z.scale).toBeCloseTo(v.scale * factor, 9);
        const after = toScreen(z, before);
        expect(after.x).toBeCloseTo(cursor.x, 5);
        expect(after.y).toBeCloseTo(cursor.y, 5);
      }),
    );
  });

  it('stops at the limits and ignores a factor that is not a positive number', () => {
    const v: Viewport = { scale: 1, offsetX: 0, offsetY: 0 };
    expect(zoomAbout(v, 100, { x: 0, y: 0 }, { minScale: 0.5, maxScale: 4 }).scale).toBe(4);
    expect(zoomAbout(v, 0.01, { x: 0, y: 0 }, { minScale: 0.5, maxScale: 4 }).scale).toBe(0.5);
    expect(zoomAbout(v, Number.NaN, { x: 0, y: 0 })).toBe(v);
    expect(zoomAbout(v, -2, { x: 0, y: 0 })).toBe(v);
  });
});

describe('panBy, boundsOf, boundsUnion, measureBetween', () => {
  it('pans by screen pixels whatever the scale', () => {
    const v = panBy({ scale: 3, offsetX: 10, offsetY: 20 }, 5, -7);
    expect(v).toEqual({ scale: 3, offsetX: 15, offsetY: 13 });
  });

  it('bounds finite points and skips the rest; none is null', () => {
    expect(boundsOf([{ x: 1, y: 5 }, { x: -2, y: 3 }, { x: Number.NaN, y: 100 }, { x: 4, y: Infinity }])).toEqual({ minX: -2, minY: 3, maxX: 1, maxY: 5 });
    expect(boundsOf([])).toBeNull();
    expect(boundsUnion(null, { minX: 0, minY: 0, maxX: 1, maxY: 1 })).toEqual({ minX: 0, minY: 0, maxX: 1, maxY: 1 });
    expect(boundsUnion({ minX: 0, minY: -1, maxX: 1, maxY: 1 }, { minX: -3, minY: 0, maxX: 0.5, maxY: 4 })).toEqual({ minX: -3, minY: -1, maxX: 1, maxY: 4 });
  });

  it('measures a 3-4-5 triangle and its angle from horizontal', () => {
    // analytic: Pythagoras 3-4-5; atan2(4, 3) = 53.130102°
    const m = measureBetween({ x: 0, y: 0 }, { x: 300, y: 400 });
    expect(m.distanceMm).toBeCloseTo(500, 12);
    expect((m.angleRad * 180) / Math.PI).toBeCloseTo(53.130102, 5);
    expect(measureBetween({ x: 0, y: 0 }, { x: -1, y: 0 }).angleRad).toBeCloseTo(Math.PI, 12);
  });
});
