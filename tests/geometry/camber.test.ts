import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  camberArcRadiusMm,
  camberAtStation,
  camberCrownMm,
  camberHeightAt,
  camberIssues,
  camberPerFootFromPercent,
  camberPercentFromPerFoot,
  camberReferenceHalfBeamMm,
  camberSlopeAt,
} from '../../shared/geometry/camber';
import { type Camber, camberSchema } from '../../shared/geometry/camber-schema';
import { GeometryInputError } from '../../shared/geometry/types';
import { expectClose } from './helpers';

type CamberInput = Parameters<typeof camberSchema.parse>[0];
const camber = (c: CamberInput): Camber => camberSchema.parse(c);

// The REFERENCES.md "Deck camber" case: beam B = 2000 mm, crown h = 50 mm.
const B = 2000;
const H = 50;
const rise = { kind: 'rise', riseMm: H, referenceBeamMm: B } as const;
const parabola = camber({ shape: 'parabola', crown: rise, convention: 'one-pattern' });
const arc = camber({ shape: 'arc', crown: rise, convention: 'one-pattern' });

/** Points of 1 - t^2 at t = 0, 0.1, ... 1, a designer's table of a parabolic camber. */
const parabolaPoints = Array.from({ length: 11 }, (_, i) => ({ t: i / 10, h: 1 - (i / 10) ** 2 }));

/** The issues a call throws, failing the test when it does not throw a GeometryInputError. */
function thrown(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof GeometryInputError) return e.message;
    throw e;
  }
  throw new Error('expected a GeometryInputError');
}

describe('camberPercentFromPerFoot and camberPerFootFromPercent', () => {
  it('convert rise per foot of beam to percent of beam', () => {
    // common practice; arithmetic derived
    expectClose(camberPercentFromPerFoot(1 / 4), 2.083, 0.0005);
    // common practice; arithmetic derived
    expectClose(camberPercentFromPerFoot(3 / 8), 3.125, 1e-12);
    // common practice; arithmetic derived (1/2 in/ft = 1/24)
    expectClose(camberPercentFromPerFoot(1 / 2), 4.167, 0.0005);
    expectClose(camberPercentFromPerFoot(1 / 2), 100 / 24, 1e-12);
  });

  it('are inverses', () => {
    // analytic
    expectClose(camberPerFootFromPercent(3.125), 3 / 8, 1e-12);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 50, noNaN: true }), (p) => {
        expectClose(camberPercentFromPerFoot(camberPerFootFromPercent(p)), p, 1e-12);
      }),
    );
  });
});

describe('camberArcRadiusMm', () => {
  it('gives R = 10025 mm for a 50 mm crown over a 2000 mm beam', () => {
    // derived: R = (1000^2 + 50^2) / (2 x 50)
    expect(camberArcRadiusMm(H, B / 2)).toBe(10025);
  });

  it('is the radius of the circle through the crown and both beam ends', () => {
    // analytic: the centre (0, h - R) is R from (0, h) and from (b, 0)
    fc.assert(
      fc.property(fc.double({ min: 1, max: 5000, noNaN: true }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), (b, ratio) => {
        const h = ratio * b;
        const R = camberArcRadiusMm(h, b);
        expectClose(Math.hypot(b, h - R), R, 1e-9 * R);
      }),
    );
  });

  it('is infinite for a flat deck and refuses negative input', () => {
    // analytic: a straight line is a circle of infinite radius
    expect(camberArcRadiusMm(0, 1000)).toBe(Infinity);
    expect(thrown(() => camberArcRadiusMm(-1, 1000))).toBe('the crown cannot be negative, found -1');
  });
});

describe('camberCrownMm', () => {
  it('gives percent / 100 x beam for a percent-of-beam crown', () => {
    // derived: 2.5 % of 2000 mm
    expectClose(camberCrownMm(camber({ crown: { kind: 'percent-of-beam', percent: 2.5 } }), 2000), 50, 1e-12);
  });

  it('gives inches per foot x feet of beam for a per-foot crown', () => {
    // common practice; arithmetic derived: 1/4 in/ft over an 8 ft (2438.4 mm) beam is 2 in = 50.8 mm
    expectClose(camberCrownMm(camber({ crown: { kind: 'per-foot', inchesPerFoot: 0.25 } }), 2438.4), 50.8, 1e-9);
  });

  it('gives the rise over the reference beam itself', () => {
    // analytic: the rise is given at that beam
    expectClose(camberCrownMm(parabola, B), H, 1e-12);
    expectClose(camberCrownMm(arc, B), H, 1e-9);
  });

  it('gives h (b / B)^2 for a parabola at a smaller beam', () => {
    // derived: b = 1000 mm takes 50 x (1000 / 2000)^2 = 12.5 mm
    expectClose(camberCrownMm(parabola, 1000), 12.5, 1e-12);
  });

  it('gives the sagitta of the same circle for an arc at a smaller beam', () => {
    // analytic: R - sqrt(R^2 - c^2) with R = 10025 mm, half-chord c = 500 mm
    const R = 10025;
    expectClose(camberCrownMm(arc, 1000), R - Math.sqrt(R * R - 500 * 500), 1e-9);
  });

  it('refuses a custom rise beyond its reference beam, and a negative beam', () => {
    const custom = camber({ shape: 'custom', points: parabolaPoints, crown: rise });
    expect(thrown(() => camberCrownMm(custom, 2100))).toContain('a designer\'s curve cannot be extended past its edge');
    expect(thrown(() => camberCrownMm(parabola, -5))).toBe('the beam cannot be negative, found -5');
  });
});

describe('camberReferenceHalfBeamMm', () => {
  it('is half the rise reference beam, else the hull widest half-beam', () => {
    // analytic: definitions
    expect(camberReferenceHalfBeamMm(parabola, 1234)).toBe(1000);
    expect(camberReferenceHalfBeamMm(camber({ crown: { kind: 'percent-of-beam', percent: 2 } }), 1234)).toBe(1234);
    expect(thrown(() => camberReferenceHalfBeamMm(camber({ crown: { kind: 'per-foot', inchesPerFoot: 0.25 } }), 0))).toBe(
      "the hull's widest half-beam must be more than 0",
    );
  });
});

describe('camberHeightAt', () => {
  it('matches the parabola check values', () => {
    // derived: REFERENCES.md deck camber, B = 2000, h = 50, parabola
    const at = (t: number) => camberHeightAt(parabola, t * 1000, 1000, 1000) / H;
    expectClose(at(0.25), 0.9375, 1e-12);
    expectClose(at(0.5), 0.75, 1e-12);
    expectClose(at(0.75), 0.4375, 1e-12);
    expectClose(at(0), 1, 1e-12);
    expectClose(at(1), 0, 1e-12);
  });

  it('matches the circular arc check values (R = 10025 mm)', () => {
    // derived: REFERENCES.md deck camber, circular arc through the same three points
    const at = (t: number) => camberHeightAt(arc, t * 1000, 1000, 1000) / H;
    expectClose(at(0.25), 0.93765, 5e-6);
    expectClose(at(0.5), 0.75047, 5e-6);
    expectClose(at(0.75), 0.43812, 5e-6);
    expectClose(at(0), 1, 1e-12);
    expectClose(at(1), 0, 1e-9);
  });

  it('puts every arc point on the circle of radius (b^2 + h^2) / 2h', () => {
    // analytic: arc closed form, centre at (0, h - R)
    const R = (1000 ** 2 + H ** 2) / (2 * H);
    for (let y = -1000; y <= 1000; y += 50) {
      const z = camberHeightAt(arc, y, 1000, 1000);
      expectClose(Math.hypot(y, z - (H - R)), R, 1e-8);
    }
  });

  it('gives a 1000 mm beam a 12.5 mm rise from one parabolic pattern', () => {
    // derived; HAER Guidelines section 4.3 for the beam mould: rise h (b / B)^2 = 50 x (1/2)^2
    expectClose(camberHeightAt(parabola, 0, 500, 1000), 12.5, 1e-12);
    const percent = camber({ shape: 'parabola', crown: { kind: 'percent-of-beam', percent: 2.5 }, convention: 'one-pattern' });
    const ref = camberReferenceHalfBeamMm(percent, 1000);
    // derived: 2.5 % of the widest beam 2000 mm is the same 50 mm crown
    expectClose(camberHeightAt(percent, 0, 500, ref), 12.5, 1e-12);
    // derived: each station takes the middle part of the same curve, H(y) - H(b)
    expectClose(camberHeightAt(percent, 250, 500, ref), H * (1 - 0.25 ** 2) - H * (1 - 0.5 ** 2), 1e-12);
  });

  it('scales a percent crown to each beam with the scaled convention', () => {
    const scaled = camber({ shape: 'parabola', crown: { kind: 'percent-of-beam', percent: 2.5 }, convention: 'scaled' });
    // derived: 2.5 % of 1000 mm = 25 mm at the centreline, 25 x (1 - 0.5^2) halfway out
    expectClose(camberHeightAt(scaled, 0, 500, 1000), 25, 1e-12);
    expectClose(camberHeightAt(scaled, 250, 500, 1000), 18.75, 1e-12);
  });

  it('is the same for both conventions with a rise crown on a parabola or an arc', () => {
    // derived: h (b/B)^2 (1 - (y/b)^2) = h (b^2 - y^2) / B^2 = H(y) - H(b); a circle's chord cut is the same circle
    for (const c of [parabola, arc]) {
      const scaled = { ...c, convention: 'scaled' as const };
      for (const y of [0, 100, 333, 599]) expectClose(camberHeightAt(scaled, y, 600, 1000), camberHeightAt(c, y, 600, 1000), 1e-9);
    }
  });

  it('passes a custom curve through the designer\'s points, and close to the curve they were taken from', () => {
    const custom = camber({ shape: 'custom', points: parabolaPoints, crown: rise, convention: 'one-pattern' });
    // analytic: an interpolant passes through its data
    for (const p of parabolaPoints) expectClose(camberHeightAt(custom, p.t * 1000, 1000, 1000), H * p.h, 1e-9);
    // derived: points of 1 - t^2 every 0.1; a monotone cubic through them stays within 0.1 % of the crown (largest seen 0.074 %)
    for (let t = 0; t <= 1; t += 0.01) expectClose(camberHeightAt(custom, t * 1000, 1000, 1000), H * (1 - t * t), 0.001 * H);
  });

  it('takes the middle part of a custom pattern with one-pattern', () => {
    const custom = camber({ shape: 'custom', points: parabolaPoints, crown: rise, convention: 'one-pattern' });
    // derived: H(y) - H(b) read at the designer's points t = 0.2 and 0.5
    expectClose(camberHeightAt(custom, 200, 500, 1000), H * (0.96 - 0.75), 1e-9);
  });

  it('lets a station a hair wider than a one-pattern reference take the pattern, clamped to its edge', () => {
    // derived: a sheer spline bulging 0.05 mm past the widest station (as a fair table does between
    // stations) takes the pattern as at its own beam: the same heights as a station exactly as wide.
    for (const y of [0, 300, 700]) expectClose(camberHeightAt(parabola, y, 1000.05, 1000), camberHeightAt(parabola, y, 1000, 1000), 1e-9);
    expectClose(camberHeightAt(parabola, 1000.05, 1000.05, 1000), 0, 1e-9);
  });

  it('refuses the errors a person can make, saying what is wrong', () => {
    // Station wider than the pattern it is cut from.
    expect(thrown(() => camberHeightAt(parabola, 0, 1100, 1000))).toContain(
      "the station's half-beam of 1100 mm is wider than the camber pattern's half-beam of 1000 mm",
    );
    // A half-breadth off the deck.
    expect(thrown(() => camberHeightAt(parabola, 600, 500, 1000))).toBe(
      'half-breadth 600 mm is outside the deck at this station, whose half-beam is 500 mm',
    );
    // A negative crown (built by hand: the schema would refuse it first).
    const negative = { ...parabola, crown: { kind: 'percent-of-beam', percent: -2 } } as Camber;
    expect(thrown(() => camberHeightAt(negative, 0, 500, 1000))).toBe('the crown (percent of beam) cannot be negative, found -2');
    // An arc of half a circle.
    const half = camber({ shape: 'arc', crown: { kind: 'percent-of-beam', percent: 50 } });
    expect(thrown(() => camberHeightAt(half, 0, 500, 1000))).toContain('a circular-arc camber needs a crown less than half the beam');
    // Not finite.
    expect(thrown(() => camberHeightAt(parabola, Number.NaN, 500, 1000))).toBe('the half-breadth must be a finite number, found NaN');
  });

  it('takes a half-breadth within tolerance of the beam end as the end', () => {
    // analytic: zero at the beam end; the default tolerance is 1e-6 mm
    expect(camberHeightAt(parabola, 500 + 5e-7, 500, 1000)).toBe(0);
    expect(() => camberHeightAt(parabola, 500.01, 500, 1000)).toThrow(GeometryInputError);
    expect(camberHeightAt(parabola, 500.01, 500, 1000, 0.1)).toBe(0);
  });
});

describe('camberIssues', () => {
  const custom = (points: { t: number; h: number }[]) => camber({ shape: 'custom', points, crown: rise });

  it('finds nothing wrong with a good curve', () => {
    expect(camberIssues(custom(parabolaPoints))).toEqual([]);
    expect(camberIssues(arc)).toEqual([]);
  });

  it('names points out of order, repeated t, and wrong ends', () => {
    const unsorted = camberIssues(custom([{ t: 0, h: 1 }, { t: 0.6, h: 0.5 }, { t: 0.4, h: 0.7 }, { t: 1, h: 0 }]));
    expect(unsorted.map((i) => i.message)).toEqual([
      "custom camber points must run in order of t from the centreline (0) to the beam's edge (1): point 3 (t = 0.4) comes after point 2 (t = 0.6)",
    ]);
    expect(unsorted[0]!.field).toBe('points[2].t');

    const duplicate = camberIssues(custom([{ t: 0, h: 1 }, { t: 0.5, h: 0.7 }, { t: 0.5, h: 0.6 }, { t: 1, h: 0 }]));
    expect(duplicate.map((i) => i.message)).toEqual(['custom camber points 2 and 3 have the same t = 0.5; each t may appear only once']);

    const start = camberIssues(custom([{ t: 0, h: 0.9 }, { t: 1, h: 0 }]));
    expect(start.map((i) => i.message)).toEqual([
      'a custom camber curve starts at the centreline with the full crown, t = 0 and h = 1; its first point is t = 0, h = 0.9',
    ]);

    const end = camberIssues(custom([{ t: 0, h: 1 }, { t: 0.9, h: 0.1 }]));
    expect(end.map((i) => i.code)).toEqual(['camber-points-end']);
    expect(end[0]!.message).toContain('its last point is t = 0.9, h = 0.1');

    expect(camberIssues(custom([{ t: 0, h: 1 }]))[0]!.message).toBe(
      'a custom camber curve needs at least two points, (t = 0, h = 1) and (t = 1, h = 0); it has 1',
    );
  });

  it('makes the height functions throw the same messages', () => {
    const bad = custom([{ t: 0, h: 0.9 }, { t: 1, h: 0 }]);
    expect(thrown(() => camberHeightAt(bad, 0, 500, 1000))).toContain('a custom camber curve starts at the centreline');
    expect(thrown(() => camberSlopeAt(bad, 0, 500, 1000))).toContain('a custom camber curve starts at the centreline');
    expect(thrown(() => camberCrownMm(bad, 1000))).toContain('a custom camber curve starts at the centreline');
  });
});

describe('camberSlopeAt', () => {
  it('is -2hy/b^2 on a parabola: -0.1 at the side of the check case', () => {
    // analytic: d/dy of h (1 - (y/b)^2)
    expectClose(camberSlopeAt(parabola, 1000, 1000, 1000), -0.1, 1e-12);
    expectClose(camberSlopeAt(parabola, -500, 1000, 1000), 0.05, 1e-12);
    expect(camberSlopeAt(parabola, 0, 1000, 1000)).toBe(0);
  });

  it('is -y / sqrt(R^2 - y^2) on the arc', () => {
    // analytic: the circle's tangent, R = 10025 mm
    const R = 10025;
    for (const y of [0, 250, 500, 1000]) expectClose(camberSlopeAt(arc, y, 1000, 1000), -y / Math.sqrt(R * R - y * y), 1e-12);
  });

  it('is 0 at the centreline of a custom curve (no ridge)', () => {
    // derived: the monotone cubic of the curve mirrored about the centreline has slope 0 there
    const custom = camber({ shape: 'custom', points: [{ t: 0, h: 1 }, { t: 0.5, h: 0.8 }, { t: 1, h: 0 }], crown: rise });
    expect(camberSlopeAt(custom, 0, 1000, 1000)).toBe(0);
  });
});

describe('camber properties', () => {
  const shape = fc.constantFrom('arc', 'parabola', 'custom') as fc.Arbitrary<'arc' | 'parabola' | 'custom'>;
  const crown = fc.oneof(
    fc.record({ kind: fc.constant('rise' as const), riseMm: fc.double({ min: 0, max: 300, noNaN: true }), referenceBeamMm: fc.constant(3000) }),
    fc.record({ kind: fc.constant('percent-of-beam' as const), percent: fc.double({ min: 0, max: 10, noNaN: true }) }),
    fc.record({ kind: fc.constant('per-foot' as const), inchesPerFoot: fc.double({ min: 0, max: 1.5, noNaN: true }) }),
  );
  // A designer's monotone table: decreasing h from 1 to 0 at increasing t.
  const monotonePoints = fc
    .uniqueArray(fc.double({ min: 0.01, max: 0.99, noNaN: true }), { minLength: 0, maxLength: 6 })
    .chain((ts) => {
      const sorted = [...ts].sort((a, b) => a - b);
      return fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: sorted.length, maxLength: sorted.length }).map((hs) => {
        const desc = [...hs].sort((a, b) => b - a);
        return [{ t: 0, h: 1 }, ...sorted.map((t, i) => ({ t, h: desc[i]! })), { t: 1, h: 0 }];
      });
    });
  const anyCamber = fc
    .record({ shape, crown, points: monotonePoints, convention: fc.constantFrom('one-pattern', 'scaled') })
    .map((c) => camber(c as CamberInput));
  // Reference half-beam 1500 mm (the rise crowns are given over 3000 mm), a station inside it, a y on its deck.
  const station = fc.double({ min: 0, max: 1, noNaN: true }).map((f) => f * 1500);
  const fraction = fc.double({ min: -1, max: 1, noNaN: true });

  it('is finite, zero at the beam ends, symmetric, highest at the centreline for arc and parabola', () => {
    // analytic: properties of the construction
    fc.assert(
      fc.property(anyCamber, station, fraction, (c, bs, f) => {
        const y = f * bs;
        const z = camberHeightAt(c, y, bs, 1500);
        expect(Number.isFinite(z)).toBe(true);
        expect(Number.isFinite(camberSlopeAt(c, y, bs, 1500))).toBe(true);
        expectClose(camberHeightAt(c, bs, bs, 1500), 0, 1e-9);
        expectClose(camberHeightAt(c, -bs, bs, 1500), 0, 1e-9);
        expectClose(camberHeightAt(c, -y, bs, 1500), z, 1e-9);
        expect(z).toBeGreaterThanOrEqual(-1e-9);
        if (c.shape !== 'custom') expect(camberHeightAt(c, 0, bs, 1500)).toBeGreaterThanOrEqual(z - 1e-9);
      }),
      { numRuns: 500 },
    );
  });

  it('stays within the crown and falls toward the side for a monotone custom table', () => {
    // published (from memory): F. N. Fritsch & R. E. Carlson, Monotone piecewise cubic interpolation,
    // SIAM J. Numer. Anal. 17 (1980): with these derivatives the cubic is monotone where the data are
    fc.assert(
      fc.property(monotonePoints, (points) => {
        const c = camber({ shape: 'custom', points, crown: { kind: 'rise', riseMm: H, referenceBeamMm: 3000 } });
        let previous = Infinity;
        for (let y = 0; y <= 1500; y += 25) {
          const z = camberHeightAt(c, y, 1500, 1500);
          expect(z).toBeLessThanOrEqual(previous + 1e-9);
          expect(z).toBeGreaterThanOrEqual(-1e-9);
          expect(z).toBeLessThanOrEqual(H + 1e-9);
          previous = z;
        }
      }),
      { numRuns: 300 },
    );
  });

  it('has the slope of its own height (central difference)', () => {
    // analytic: dz/dy ~ (z(y + d) - z(y - d)) / 2d for a smooth curve away from the custom knots
    fc.assert(
      fc.property(anyCamber, fc.double({ min: 300, max: 1500, noNaN: true }), fc.double({ min: -0.9, max: 0.9, noNaN: true }), (c, bs, f) => {
        const y = f * bs;
        const d = 1e-3;
        const numeric = (camberHeightAt(c, y + d, bs, 1500) - camberHeightAt(c, y - d, bs, 1500)) / (2 * d);
        expectClose(camberSlopeAt(c, y, bs, 1500), numeric, 1e-5);
      }),
      { numRuns: 500 },
    );
  });
});

describe('camberAtStation', () => {
  // Analytic: the same closed forms as camberHeightAt / camberSlopeAt (checked against REFERENCES.md above),
  // with the camber checked once per station instead of per call; the values must be the same numbers.
  const cambers = [
    parabola,
    arc,
    camber({ shape: 'parabola', crown: { kind: 'percent-of-beam', percent: 2 }, convention: 'scaled' }),
    camber({ shape: 'custom', points: parabolaPoints, crown: rise, convention: 'one-pattern' }),
    camber({ shape: 'arc', crown: { kind: 'per-foot', inchesPerFoot: 0.25 }, convention: 'scaled' }),
  ];
  it('gives exactly the heights and slopes of camberHeightAt and camberSlopeAt', () => {
    fc.assert(
      fc.property(fc.constantFrom(...cambers), fc.double({ min: 100, max: 1000, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), (c, hb, f) => {
        const ref = camberReferenceHalfBeamMm(c, 1000);
        const station = camberAtStation(c, hb, ref);
        const y = f * hb;
        expect(station.heightAt(y)).toBe(camberHeightAt(c, y, hb, ref));
        expect(station.slopeAt(y)).toBe(camberSlopeAt(c, y, hb, ref));
      }),
    );
  });

  it('refuses what camberHeightAt refuses: a station wider than the pattern, a half-breadth off the deck', () => {
    expect(thrown(() => camberAtStation(parabola, 1200, 1000))).toBe(thrown(() => camberHeightAt(parabola, 0, 1200, 1000)));
    const station = camberAtStation(parabola, 800, 1000);
    expect(thrown(() => station.heightAt(900))).toBe(thrown(() => camberHeightAt(parabola, 900, 800, 1000)));
    expect(thrown(() => station.slopeAt(Number.NaN))).toMatch(/finite/);
  });
});
