import { describe, expect, it } from 'vitest';
import { beamDepthAt, beamOutline } from '../../shared/geometry/beam';
import { deductionAt } from '../../shared/geometry/deduction';
import { hullBuild } from '../../shared/geometry/hull';
import { polygonArea, polygonIsSimple } from '../../shared/geometry/polygon';
import { GeometryInputError } from '../../shared/geometry/types';
import { chineHull, evenStations } from './analytic-hulls';
import { expectClose } from './helpers';

describe('beamDepthAt', () => {
  it('holds the moulded depth to the start of the taper, then falls straight to the end depth', () => {
    const spec = { mouldedDepthMm: 80, taper: { endDepthMm: 40, fromFraction: 0.25 } };
    // Analytic: half-beam 800, taper from 200 to 800.
    expect([0, 200, 500, 800, -500].map((y) => beamDepthAt(spec, y, 800))).toEqual([80, 80, 60, 40, 60]);
    expect(beamDepthAt({ mouldedDepthMm: 80, taper: null }, 700, 800)).toBe(80);
  });
});

describe('beamOutline on a deck that is level (no camber): rectangles against a flared side', () => {
  // Analytic: a flat deck (no rise) at the sheer z = 500, 9 mm thick, no clearance, side y = 600 + 0.2 z, no
  // skin: the beam's top is z = 491, its bottom z = 491 - D, its ends on the side line.
  const lines = chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0.2, sheerZ: 500, waterlineZs: [100, 300] });
  const hull = hullBuild({ ...lines, deck: { camber: { shape: 'parabola', crown: { kind: 'rise', riseMm: 0, referenceBeamMm: 2000 } }, thicknessMm: 9 } });
  const half = deductionAt(hull, 1500)!.outline;
  const sideY = (z: number): number => 600 + 0.2 * z;

  it('is the trapezoid between the top, the bottom and the two sides', () => {
    const b = beamOutline(half, { mouldedDepthMm: 50, taper: null, inboardYMm: null, sides: 'both' });
    expect(b.regions).toHaveLength(1);
    const outer = b.regions[0]!.outer;
    expect(polygonIsSimple(outer)).toBe(true);
    for (const p of outer) expect(Math.min(Math.abs(p.z - 491), Math.abs(p.z - 441), Math.abs(Math.abs(p.y) - sideY(p.z)))).toBeLessThanOrEqual(1e-6);
    // Analytic: trapezoid of height 50 with parallel sides 2 sideY(491) and 2 sideY(441).
    expectClose(polygonArea(outer), 50 * (sideY(491) + sideY(441)), 1e-6, 'area');
    expectClose(b.halfBeamMm, sideY(491), 1e-6, 'half-beam');
  });

  it('a pair of half beams ends plumb at the inboard half-breadth', () => {
    const b = beamOutline(half, { mouldedDepthMm: 50, taper: null, inboardYMm: 250, sides: 'both' });
    expect(b.regions).toHaveLength(2);
    for (const r of b.regions) {
      // Analytic: each is the trapezoid from y = 250 out to the side.
      expectClose(polygonArea(r.outer), 50 * ((sideY(491) + sideY(441)) / 2 - 250), 1e-6, 'area');
      expect(polygonIsSimple(r.outer)).toBe(true);
    }
    const one = beamOutline(half, { mouldedDepthMm: 50, taper: null, inboardYMm: 250, sides: 'port' });
    expect(one.regions).toHaveLength(1);
    expect(one.regions[0]!.outer.every((p) => p.y < 0)).toBe(true);
  });

  it('refuses an inboard end outside the side, and a bottom that never meets the side', () => {
    expect(() => beamOutline(half, { mouldedDepthMm: 50, taper: null, inboardYMm: 900, sides: 'both' })).toThrowError(GeometryInputError);
    try {
      beamOutline(half, { mouldedDepthMm: 50, taper: null, inboardYMm: 900, sides: 'both' });
    } catch (e) {
      expect((e as GeometryInputError).issues[0]).toMatchObject({ code: 'half-beam-end-outside', field: 'inboardEnd', value: 900 });
    }
    // The bottom of a beam deeper than the frame: 600 mm below the top is below the keel.
    expect(() => beamOutline(half, { mouldedDepthMm: 600, taper: null, inboardYMm: null, sides: 'both' })).toThrowError(/never meets the hull edge/);
  });
});
