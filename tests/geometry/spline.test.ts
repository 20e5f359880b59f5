import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
// @ts-expect-error cubic-spline 3.0.3 publishes no type declarations; its one class is typed below.
import CubicSplineUntyped from 'cubic-spline';
import {
  splineCurvatureAt,
  splineFit,
  splineInflections,
  splineSlopeAt,
  splineTurns,
  splineValueAt,
} from '../../shared/geometry/spline';
import { GeometryInputError } from '../../shared/geometry/types';
import { expectClose } from './helpers';

/** cubic-spline (npm, general-purpose natural cubic spline interpolation): new Spline(xs, ys).at(x). */
const CubicSpline = CubicSplineUntyped as new (xs: number[], ys: number[]) => { at(x: number): number };

/** Strictly increasing knots: a start and positive gaps of at least 0.5 (so the systems stay well conditioned). */
const knotsArb = (min: number, max: number) =>
  fc
    .tuple(fc.double({ min: -1000, max: 1000, noNaN: true }), fc.array(fc.double({ min: 0.5, max: 200, noNaN: true }), { minLength: min - 1, maxLength: max - 1 }))
    .map(([x0, gaps]) => gaps.reduce<number[]>((xs, g) => [...xs, xs[xs.length - 1]! + g], [x0]));

describe('splineFit (natural ends)', () => {
  it('reproduces the natural spline through (1,2), (2,3), (3,5)', () => {
    // Source: R. Burden & J. D. Faires, Numerical Analysis, 9th ed., section 3.5, example 1 (from memory; recomputed):
    // S0 = 2 + 0.75(x-1) + 0.25(x-1)^3 on [1,2]; S1 = 3 + 1.5(x-2) + 0.75(x-2)^2 - 0.25(x-2)^3 on [2,3].
    const s = splineFit([1, 2, 3], [2, 3, 5], { start: 'natural', end: 'natural' });
    const S0 = (x: number) => 2 + 0.75 * (x - 1) + 0.25 * (x - 1) ** 3;
    const S1 = (x: number) => 3 + 1.5 * (x - 2) + 0.75 * (x - 2) ** 2 - 0.25 * (x - 2) ** 3;
    for (const x of [1, 1.1, 1.25, 1.5, 1.9, 2]) expectClose(splineValueAt(s, x), S0(x), 1e-12, `S0(${x})`);
    for (const x of [2, 2.3, 2.5, 2.75, 3]) expectClose(splineValueAt(s, x), S1(x), 1e-12, `S1(${x})`);
    // Burden & Faires (as above): the derivatives of S0 and S1, b0 = 0.75, b1 = 1.5, and S1'(3) = 1.5 + 1.5 - 0.75 = 2.25
    expectClose(s.ms[0]!, 0.75, 1e-12, "S'(1)");
    expectClose(s.ms[1]!, 1.5, 1e-12, "S'(2)");
    expectClose(s.ms[2]!, 2.25, 1e-12, "S'(3)");
    // Burden & Faires (as above): natural ends, S''(1) = S''(3) = 0; S''(2) = 2 * 0.75 = 1.5
    expectClose(splineCurvatureAt(s, 1), 0, 1e-12, "S''(1)");
    expectClose(splineCurvatureAt(s, 3), 0, 1e-12, "S''(3)");
    expectClose(splineCurvatureAt(s, 2), 1.5, 1e-12, "S''(2)");
  });

  it('agrees with the cubic-spline npm library on random data', () => {
    // Source: cubic-spline 3.0.3 (npm), a general-purpose natural cubic spline, as the reference library.
    fc.assert(
      fc.property(
        knotsArb(2, 30).chain((xs) =>
          fc.tuple(fc.constant(xs), fc.array(fc.double({ min: -500, max: 500, noNaN: true }), { minLength: xs.length, maxLength: xs.length }), fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 10 })),
        ),
        ([xs, ys, fs]) => {
          const ours = splineFit(xs, ys, { start: 'natural', end: 'natural' });
          const theirs = new CubicSpline(xs, ys);
          const x0 = xs[0]!;
          const x1 = xs[xs.length - 1]!;
          for (const f of fs) {
            const x = x0 + f * (x1 - x0);
            expect(Math.abs(splineValueAt(ours, x) - theirs.at(x))).toBeLessThanOrEqual(1e-7 * (1 + Math.max(...ys.map(Math.abs))));
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('splineFit (not-a-knot ends, the default)', () => {
  it('reproduces any cubic exactly from four or more points', () => {
    // Analytic: a cubic polynomial satisfies the not-a-knot conditions, and the interpolant is unique,
    // so the not-a-knot spline through its values is the cubic itself (de Boor, A Practical Guide to Splines, ch. IV; from memory).
    fc.assert(
      fc.property(knotsArb(4, 20), fc.array(fc.double({ min: -2, max: 2, noNaN: true }), { minLength: 4, maxLength: 4 }), (xs, [a, b, c, d]) => {
        const x0 = xs[0]!;
        const scale = xs[xs.length - 1]! - x0;
        const p = (x: number) => { const u = (x - x0) / scale; return a! + b! * u + c! * u * u + d! * u * u * u; };
        const s = splineFit(xs, xs.map(p));
        for (let i = 0; i <= 40; i++) {
          const x = x0 + (scale * i) / 40;
          expect(Math.abs(splineValueAt(s, x) - p(x))).toBeLessThanOrEqual(1e-9);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('gives the parabola through three points and the line through two', () => {
    // Analytic: with three points not-a-knot leaves one polynomial of degree two; with two, the straight line.
    const par = splineFit([0, 1, 3], [1, 2, 10]); // the values of 1 + x^2
    for (const x of [0, 0.5, 2, 2.9]) expectClose(splineValueAt(par, x), 1 + x * x, 1e-12, `parabola(${x})`);
    const line = splineFit([2, 5], [1, 7]);
    for (const x of [2, 3, 4.5]) expectClose(splineValueAt(line, x), 1 + 2 * (x - 2), 1e-12, `line(${x})`);
    expectClose(splineCurvatureAt(line, 3), 0, 1e-12, 'line curvature');
  });

  it('has a continuous third derivative at the second and last-but-one knots', () => {
    // Analytic: the not-a-knot condition itself; third derivative on a span from its slopes: 6(m0 + m1 - 2 delta) / h^2.
    const xs = [0, 1.5, 2, 4, 5.5, 7];
    const ys = [0, 2, 1, 3, -1, 0.5];
    const s = splineFit(xs, ys);
    const third = (k: number) => {
      const h = xs[k + 1]! - xs[k]!;
      return (6 * (s.ms[k]! + s.ms[k + 1]! - (2 * (ys[k + 1]! - ys[k]!)) / h)) / (h * h);
    };
    expectClose(third(0), third(1), 1e-9, 'at x1');
    expectClose(third(3), third(4), 1e-9, 'at x4');
  });
});

describe('splineFit (stated end slopes)', () => {
  it('reproduces a cubic from its values and its true end slopes', () => {
    // Analytic: the clamped interpolant is unique and the cubic satisfies it.
    const p = (x: number) => 2 - x + 0.5 * x * x - 0.1 * x ** 3;
    const dp = (x: number) => -1 + x - 0.3 * x * x;
    const xs = [0, 1, 2.5, 4];
    const s = splineFit(xs, xs.map(p), { start: { slope: dp(0) }, end: { slope: dp(4) } });
    for (const x of [0.3, 1.7, 3.2]) {
      expectClose(splineValueAt(s, x), p(x), 1e-12, `value(${x})`);
      expectClose(splineSlopeAt(s, x), dp(x), 1e-12, `slope(${x})`);
    }
  });
});

describe('splineFit (bad input)', () => {
  it('rejects knots out of order, a single point and non-finite values with a GeometryInputError', () => {
    expect(() => splineFit([0, 2, 1], [0, 1, 2])).toThrow(GeometryInputError);
    expect(() => splineFit([0], [1])).toThrow(/at least two points/);
    try {
      splineFit([0, 1, 2], [0, Number.NaN, 1]);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(GeometryInputError);
      expect((e as GeometryInputError).issues[0]).toMatchObject({ code: 'spline-not-finite', field: 'xs[1]' });
    }
  });
});

describe('splineInflections', () => {
  it('finds the inflections of a sampled sine and none on a straight line', () => {
    // Analytic: sin x on [0, 3 pi] changes its bend at pi and 2 pi.
    const xs = Array.from({ length: 31 }, (_, i) => (3 * Math.PI * i) / 30);
    const s = splineFit(xs, xs.map(Math.sin));
    const found = splineInflections(s, 1e-3);
    expect(found).toHaveLength(2);
    expectClose(found[0]!, Math.PI, 0.02, 'first inflection');
    expectClose(found[1]!, 2 * Math.PI, 0.02, 'second inflection');
    // Analytic: a straight line has no curvature; float noise stays below the threshold.
    const line = splineFit([0, 1, 2, 3, 4], [0.1, 0.3, 0.5, 0.7, 0.9]);
    expect(splineInflections(line, 1e-9)).toEqual([]);
  });
});

describe('splineTurns', () => {
  it('counts the turns of a wave but not the ripples of rounding', () => {
    // Analytic: 30 sin(x / 500) over [0, 3 pi 500] turns at pi 500 and 2 pi 500; stations every 250 mm.
    const xs = Array.from({ length: 20 }, (_, i) => i * 250);
    const wave = splineFit(xs, xs.map((x) => 30 * Math.sin(x / 500)));
    const turns = splineTurns(wave, 1);
    expect(turns).toHaveLength(2);
    expectClose(turns[0]!, Math.PI * 500, 60, 'first turn');
    expectClose(turns[1]!, 2 * Math.PI * 500, 60, 'second turn');
    // Analytic: a fair convex curve (a parabola) rounded to whole millimetres: its raw second derivative
    // changes sign on the rounding, but no bend stands 1 mm off its chord.
    const bowl = splineFit(xs, xs.map((x) => Math.round(200 + 1e-5 * (x - 2400) ** 2)));
    expect(splineInflections(bowl, 0).length).toBeGreaterThan(1);
    expect(splineTurns(bowl, 1)).toEqual([]);
  });
});
