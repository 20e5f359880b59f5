import { describe, expect, it } from 'vitest';
import { type FairnessCellFlag, type FairnessCrossingFlag, fairnessCheck, fairnessLeaveOneOut } from '../../shared/geometry/fairness';
import type { HullLinesInput } from '../../shared/geometry/hull-schema';
import { hullBuild } from '../../shared/geometry/hull';
import { splineFit, splineInflections, splineValueAt } from '../../shared/geometry/spline';
import { ellipticHull, evenStations, range } from './analytic-hulls';
import { expectClose } from './helpers';

// Analytic fair hull: elliptic sections y^2/B(x)^2 + (z - 1000)^2/600^2 = 1 with half-beam
// B(x) = B0 sin(pi (x + 2000) / 10000) over x = 0..6000 (fullest amidships), 11 stations 600 mm apart,
// waterlines 420 and 500..950 every 50, buttocks 50 and 100. B0 is chosen so that waterline 700 is exactly
// 393.7 mm (1-3-4: 1 ft 3 4/8 in) at station 3: B0 = 393.7 / (sin(0.38 pi) sqrt(0.75)).
const B0 = 393.7 / (Math.sin(0.38 * Math.PI) * Math.sqrt(0.75));
const fairLines = (): HullLinesInput =>
  ellipticHull({ xs: evenStations(0, 6000, 10), halfBeam: (x) => B0 * Math.sin((Math.PI * (x + 2000)) / 10000), depth: 600, sheerZ: 1000, waterlineZs: [420, ...range(500, 950, 50)], buttockYs: [50, 100] });

function setCell(lines: HullLinesInput, lineId: string, stationId: string, value: number): void {
  const line = lines.lines.find((l) => l.id === lineId)!;
  (line.cells as Record<string, number>)[stationId] = value;
}

describe('fairnessCheck: a fair hull', () => {
  it('flags nothing', () => {
    // Analytic hull above: every line is a smooth function of x, sampled exactly.
    const report = fairnessCheck(hullBuild(fairLines()));
    expect(report.flags).toEqual([]);
    // And the check is looking: every cell has its leave-one-out deviation, all small.
    expect(report.deviations.length).toBeGreaterThan(150);
    for (const d of report.deviations) expect(Math.abs(d.deviationMm)).toBeLessThan(3);
  });
});

describe('fairnessCheck: a fair hull written to the nearest millimetre', () => {
  it('flags nothing: rounding the cells is not unfairness', () => {
    // Analytic hull above, every cell rounded to 1 mm as a metric table gives it (up to 0.5 mm off the curve).
    const lines = fairLines();
    for (const l of lines.lines) {
      for (const [k, v] of Object.entries(l.cells)) {
        if (typeof v === 'number') setCell(lines, l.id, k, Math.round(v));
        else if (v && typeof v === 'object') (l.cells as Record<string, unknown>)[k] = { y: Math.round(v.y), z: Math.round(v.z) };
      }
    }
    expect(fairnessCheck(hullBuild(lines)).flags).toEqual([]);
  });
});

describe('fairnessCheck: a misread offset', () => {
  it('names the line and station of 1-4-3 typed for 1-3-4', () => {
    // Common practice: feet-inches-eighths, 1-3-4 = 1 ft 3 4/8 in = 393.7 mm; its digits swapped, 1-4-3 =
    // 1 ft 4 3/8 in = 419.1 mm (arithmetic derived, 1 in = 25.4 mm exactly). Put in waterline 700 at station 3.
    const lines = fairLines();
    expectClose((lines.lines.find((l) => l.id === 'wl700')!.cells as Record<string, number>).st3!, 393.7, 1e-9, 'the true cell');
    setCell(lines, 'wl700', 'st3', 419.1);
    const report = fairnessCheck(hullBuild(lines));
    const cells = report.flags.filter((f): f is FairnessCellFlag => f.kind === 'cell');
    expect(cells).toHaveLength(1);
    expect(cells[0]).toMatchObject({ lineId: 'wl700', lineName: 'WL 700', stationId: 'st3', stationName: '3', field: 'value', valueMm: 419.1 });
    // The rest of the line says what belongs there: 393.7, so the cell stands 25.4 mm off (budget 0.1 mm).
    expectClose(cells[0]!.expectedMm, 393.7, 0.1, 'expected');
    expectClose(cells[0]!.deviationMm, 25.4, 0.1, 'deviation');
    expect(cells[0]!.message).toMatch(/WL 700 at station 3/);
  });

  it('finds the misread cell rather than its neighbours, even though their own deviations are larger', () => {
    // Analytic: the line above alone. A spike makes the curve through the others swing, so its neighbours'
    // leave-one-out deviations grow (near the end far beyond the spike's own); the smoothing test names the spike.
    const xs = evenStations(0, 6000, 10);
    const ys = xs.map((x) => B0 * Math.sin((Math.PI * (x + 2000)) / 10000) * Math.sqrt(0.75));
    ys[3] = 419.1;
    const naive = xs.map((x, i) => {
      const keep = xs.map((_, j) => j).filter((j) => j !== i);
      const fit = splineFit(keep.map((j) => xs[j]!), keep.map((j) => ys[j]!));
      return Math.abs(ys[i]! - splineValueAt(fit, x));
    });
    expect(Math.max(naive[0]!, naive[1]!)).toBeGreaterThan(naive[3]!);
    const r = fairnessLeaveOneOut(xs, ys);
    expect(r.flagged).toEqual([3]);
  });
});

describe('fairnessCheck: inflections', () => {
  it('does not flag a hollow entrance for its single inflection', () => {
    // Analytic: half-beam 100 + 800 sin^2(0.7 pi x / 6000): hollow (y'' > 0) forward of x = 6000 / 2.8 = 2142.9,
    // full aft of it: one inflection in every waterline.
    const hull = hullBuild(ellipticHull({ xs: evenStations(0, 6000, 12), halfBeam: (x) => 100 + 800 * Math.sin((0.7 * Math.PI * x) / 6000) ** 2, depth: 600, sheerZ: 1000, waterlineZs: range(500, 950, 50), buttockYs: [] }));
    const wl = hull.fitted.find((l) => l.id === 'wl700')!;
    const found = splineInflections(wl.values, 2e-6);
    expect(found).toHaveLength(1);
    expectClose(found[0]!, 6000 / 2.8, 30, 'inflection x');
    expect(fairnessCheck(hull).flags).toEqual([]);
  });

  it('flags a line that waves', () => {
    // Analytic: the fair hull with waterline 800 given a 20 mm wave of 2400 mm length on top (its bend,
    // 20 (2 pi / 2400)^2 = 1.4e-4 per mm, outweighs the hull's own, about 4e-5): it turns several times.
    const lines = fairLines();
    const wl = lines.lines.find((l) => l.id === 'wl800')!;
    const xs = evenStations(0, 6000, 10);
    xs.forEach((x, i) => setCell(lines, 'wl800', `st${i}`, (wl.cells as Record<string, number>)[`st${i}`]! + 20 * Math.sin((2 * Math.PI * x) / 2400)));
    const flags = fairnessCheck(hullBuild(lines)).flags.filter((f) => f.kind === 'inflections');
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ lineId: 'wl800' });
    expect((flags[0] as { count: number }).count).toBeGreaterThan(1);
  });
});

describe('fairnessCheck: waterlines against buttocks', () => {
  it('flags a buttock 8 mm high where it crosses a waterline, naming both and the station', () => {
    // Analytic: buttock 100 lifted 8 mm at every station (fair in itself, wrong against the waterlines). Where
    // waterline 420 reaches half-breadth 100, the ellipse's normal has n_z = -(580/600^2) / |n| and the
    // disagreement normal to the section is 8 |n_z|.
    const lines = fairLines();
    const bt = lines.lines.find((l) => l.id === 'bt100')!;
    for (const [k, v] of Object.entries(bt.cells)) if (typeof v === 'number') setCell(lines, 'bt100', k, v + 8);
    const report = fairnessCheck(hullBuild(lines));
    expect(report.flags.filter((f) => f.kind === 'cell')).toEqual([]);
    const crossings = report.flags.filter((f): f is FairnessCrossingFlag => f.kind === 'crossing');
    expect(crossings.length).toBe(2); // forward and aft of amidships
    for (const c of crossings) {
      expect(c).toMatchObject({ lineId: 'wl420', otherLineId: 'bt100' });
      expectClose(c.heightDifferenceMm, 8, 0.1, 'height difference');
      // The ellipse at (100, 420) with B = 100 / sqrt(1 - (580/600)^2).
      const B = 100 / Math.sqrt(1 - (580 / 600) ** 2);
      const ny = 100 / B ** 2;
      const nz = -580 / 600 ** 2;
      expectClose(c.deviationMm, (8 * Math.abs(nz)) / Math.hypot(ny, nz), 0.1, 'normal disagreement');
    }
    // Analytic: waterline 420 is B(x) sqrt(1 - (580/600)^2); it reaches 100 where sin(pi (x + 2000)/10000) =
    // 100 / (B0 sqrt(1 - (580/600)^2)), and again mirrored about x = 3000. Stations are 600 mm apart.
    const g = Math.sqrt(1 - (580 / 600) ** 2);
    const x1 = (10000 / Math.PI) * Math.asin(100 / (B0 * g)) - 2000;
    const xsAt = crossings.map((c) => c.x).sort((p, q) => p - q);
    expectClose(xsAt[0]!, x1, 1, 'forward crossing');
    expectClose(xsAt[1]!, 6000 - x1, 1, 'aft crossing');
    expect(crossings.map((c) => c.stationId).sort()).toEqual([`st${Math.round(x1 / 600)}`, `st${Math.round((6000 - x1) / 600)}`].sort());
  });
});
