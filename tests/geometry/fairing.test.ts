import { describe, expect, it } from 'vitest';
import { fairingPolyline, fairingViewOf } from '../../shared/geometry/fairing';
import { hullBuild } from '../../shared/geometry/hull';
import { splineFit, splineValueAt } from '../../shared/geometry/spline';
import { CHORD_TOLERANCE_MM } from '../../shared/geometry/types';
import { ellipticHull, evenStations, range } from './analytic-hulls';
import { expectClose } from './helpers';

/** Distance from a point to a polyline. */
function distanceTo(p: { x: number; v: number }, pts: { x: number; v: number }[]): number {
  let best = Infinity;
  for (let i = 0; i < pts.length - 1; i++) {
    const a = pts[i]!;
    const b = pts[i + 1]!;
    const dx = b.x - a.x;
    const dv = b.v - a.v;
    const l2 = dx * dx + dv * dv;
    const f = l2 > 0 ? Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.v - a.v) * dv) / l2)) : 0;
    best = Math.min(best, Math.hypot(p.x - a.x - f * dx, p.v - a.v - f * dv));
  }
  return best;
}

describe('fairingPolyline', () => {
  it('draws the spline stretched by the exaggeration within the chord tolerance', () => {
    // Analytic: the spline itself, evaluated directly and scaled, is the reference.
    const s = splineFit([0, 600, 1200, 1800, 2400], [100, 300, 380, 330, 150]);
    for (const k of [1, 5, 20]) {
      const pts = fairingPolyline(s, k);
      for (let i = 0; i <= 400; i++) {
        const x = (2400 * i) / 400;
        expect(distanceTo({ x, v: k * splineValueAt(s, x) }, pts)).toBeLessThanOrEqual(CHORD_TOLERANCE_MM + 1e-9);
      }
    }
    expect(fairingPolyline(s, 20).length).toBeGreaterThan(fairingPolyline(s, 1).length);
  });
});

describe('fairingViewOf', () => {
  // Analytic hull with a hollow entrance: half-beam 100 + 800 sin^2(0.7 pi x / 6000), one inflection at x = 2142.9.
  const hull = hullBuild(ellipticHull({ xs: evenStations(0, 6000, 12), halfBeam: (x) => 100 + 800 * Math.sin((0.7 * Math.PI * x) / 6000) ** 2, depth: 600, sheerZ: 1000, waterlineZs: range(500, 950, 150), buttockYs: [50] }));

  it('puts half-breadths in plan and heights in profile, the values exaggerated', () => {
    const view = fairingViewOf(hull, { exaggeration: 4 });
    expect(view.plan.map((c) => c.lineId).sort()).toEqual(['keel', 'sheer', 'wl500', 'wl650', 'wl800', 'wl950'].sort());
    expect(view.profile.map((c) => c.lineId).sort()).toEqual(['bt50', 'keel', 'sheer'].sort());
    const wl = view.plan.find((c) => c.lineId === 'wl800')!;
    const raw = hull.fitted.find((l) => l.id === 'wl800')!;
    wl.cells.forEach((c, i) => {
      expect(c.x).toBe(raw.xs[i]);
      expectClose(c.v, 4 * raw.values.ys[i]!, 1e-9, `cell ${c.stationId}`);
    });
    expect(view.stations).toHaveLength(13);
  });

  it('marks the inflection of the hollow entrance', () => {
    const wl = fairingViewOf(hull).plan.find((c) => c.lineId === 'wl800')!;
    expect(wl.inflectionXs).toHaveLength(1);
    expectClose(wl.inflectionXs[0]!, 6000 / 2.8, 30, 'inflection x');
  });
});
