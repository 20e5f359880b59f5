import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Bezier } from 'bezier-js';
import {
  type CubicSegment,
  curveBezierJs,
  curveDerivativeAt,
  curveFlattenParams,
  curveFromHermite,
  curvePointAt,
} from '../../shared/geometry/curve';
import { CHORD_TOLERANCE_MM } from '../../shared/geometry/types';
import { expectClose } from './helpers';

const coord = fc.double({ min: -2000, max: 2000, noNaN: true });
const segmentArb: fc.Arbitrary<CubicSegment> = fc
  .array(coord, { minLength: 8, maxLength: 8 })
  .map(([a, b, c, d, e, f, g, h]) => ({ p0: { y: a!, z: b! }, p1: { y: c!, z: d! }, p2: { y: e!, z: f! }, p3: { y: g!, z: h! } }));

/** Distance (mm) from a point to a polyline. */
function distanceToPolyline(p: { y: number; z: number }, pts: { y: number; z: number }[]): number {
  let best = Infinity;
  for (let i = 0; i < pts.length - 1; i++) {
    const a = pts[i]!;
    const b = pts[i + 1]!;
    const vy = b.y - a.y;
    const vz = b.z - a.z;
    const l2 = vy * vy + vz * vz;
    const f = l2 > 0 ? Math.max(0, Math.min(1, ((p.y - a.y) * vy + (p.z - a.z) * vz) / l2)) : 0;
    best = Math.min(best, Math.hypot(p.y - a.y - f * vy, p.z - a.z - f * vz));
  }
  return best;
}

describe('curvePointAt / curveDerivativeAt', () => {
  it('evaluates the cubic as bezier-js does', () => {
    // Source: bezier-js 6 (npm), a general-purpose Bezier library: Bezier.get(t) and Bezier.derivative(t).
    fc.assert(
      fc.property(segmentArb, fc.double({ min: 0, max: 1, noNaN: true }), (s, t) => {
        const ref = new Bezier(s.p0.y, s.p0.z, s.p1.y, s.p1.z, s.p2.y, s.p2.z, s.p3.y, s.p3.z);
        const p = curvePointAt(s, t);
        const q = ref.get(t);
        expect(Math.hypot(p.y - q.x, p.z - q.y)).toBeLessThanOrEqual(1e-9);
        const d = curveDerivativeAt(s, t);
        const dq = ref.derivative(t);
        expect(Math.hypot(d.y - dq.x, d.z - dq.y)).toBeLessThanOrEqual(1e-8);
      }),
      { numRuns: 200 },
    );
  });
});

describe('curveFromHermite', () => {
  it('is the same cubic as the Hermite span it came from', () => {
    // Analytic: cubic Hermite basis h00 = 2u^3 - 3u^2 + 1, h10 = u^3 - 2u^2 + u, h01 = -2u^3 + 3u^2, h11 = u^3 - u^2 on a span of length h.
    const q0 = { y: 1, z: 2 };
    const q1 = { y: 40, z: -5 };
    const d0 = { y: 3, z: 1 };
    const d1 = { y: -1, z: 2 };
    const h = 12;
    const s = curveFromHermite(q0, d0, q1, d1, h);
    for (const u of [0, 0.2, 0.5, 0.8, 1]) {
      const h00 = 2 * u ** 3 - 3 * u ** 2 + 1;
      const h10 = u ** 3 - 2 * u ** 2 + u;
      const h01 = -2 * u ** 3 + 3 * u ** 2;
      const h11 = u ** 3 - u ** 2;
      const p = curvePointAt(s, u);
      expectClose(p.y, h00 * q0.y + h10 * h * d0.y + h01 * q1.y + h11 * h * d1.y, 1e-12, `y(${u})`);
      expectClose(p.z, h00 * q0.z + h10 * h * d0.z + h01 * q1.z + h11 * h * d1.z, 1e-12, `z(${u})`);
    }
  });
});

describe('curveFlattenParams', () => {
  it('keeps every point of the curve within the chord tolerance of the polyline', () => {
    // Source: bezier-js 6 (npm) evaluates the exact curve at 400 parameters (getLUT) as the reference.
    fc.assert(
      fc.property(segmentArb, fc.constantFrom(CHORD_TOLERANCE_MM, 0.5, 0.01), (s, tol) => {
        const ts = [0, ...curveFlattenParams(s, tol), 1];
        for (let i = 1; i < ts.length; i++) expect(ts[i]!).toBeGreaterThan(ts[i - 1]!);
        const poly = ts.map((t) => curvePointAt(s, t));
        for (const p of curveBezierJs(s).getLUT(400)) {
          expect(distanceToPolyline({ y: p.x, z: p.y }, poly)).toBeLessThanOrEqual(tol + 1e-9);
        }
      }),
      { numRuns: 60 },
    );
  });

  it('is adaptive: no cut on a straight segment, more cuts where the curve bends harder', () => {
    // Analytic: a cubic whose control points lie evenly on a line is that line.
    expect(curveFlattenParams({ p0: { y: 0, z: 0 }, p1: { y: 100, z: 50 }, p2: { y: 200, z: 100 }, p3: { y: 300, z: 150 } })).toEqual([]);
    // Analytic: a quarter of a circle of radius R (standard four-point Bezier, k = 0.5523) needs chords of about
    // sqrt(8 R tol): per mm of curve, a radius ten times smaller needs about sqrt(10) times more pieces.
    const quarter = (R: number): CubicSegment => ({ p0: { y: R, z: 0 }, p1: { y: R, z: 0.5523 * R }, p2: { y: 0.5523 * R, z: R }, p3: { y: 0, z: R } });
    const tight = curveFlattenParams(quarter(100)).length + 1;
    const easy = curveFlattenParams(quarter(1000)).length + 1;
    expect(tight / 100).toBeGreaterThan((easy / 1000) * 2);
    // The pieces are no finer than twice what the tolerance needs (the halving can overshoot by at most 2).
    const need = (Math.PI / 2) * 1000 / Math.sqrt(8 * 1000 * CHORD_TOLERANCE_MM);
    expect(easy).toBeLessThanOrEqual(Math.ceil(4 * need));
  });
});

describe('curveBezierJs', () => {
  it('hands the same curve to bezier-js', () => {
    // Source: bezier-js 6 (npm) length() (Legendre-Gauss quadrature) against the flattened polyline's length.
    const s: CubicSegment = { p0: { y: 0, z: 0 }, p1: { y: 100, z: 300 }, p2: { y: 400, z: 300 }, p3: { y: 500, z: 0 } };
    const ts = [0, ...curveFlattenParams(s, 0.001), 1];
    let len = 0;
    for (let i = 1; i < ts.length; i++) {
      const a = curvePointAt(s, ts[i - 1]!);
      const b = curvePointAt(s, ts[i]!);
      len += Math.hypot(b.y - a.y, b.z - a.z);
    }
    expectClose(len, curveBezierJs(s).length(), 0.01, 'length');
  });
});
