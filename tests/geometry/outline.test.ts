import { describe, expect, it } from 'vitest';
import { deductionAt } from '../../shared/geometry/deduction';
import { hullBuild } from '../../shared/geometry/hull';
import { edgeRunsBelow, hullEdgeOpen, loopMirrored, negated, outlineContactRuns, outlineEdgeLength, outlineRuns } from '../../shared/geometry/outline';
import { polygonSignedArea } from '../../shared/geometry/polygon';
import { chineHull, evenStations } from './analytic-hulls';
import { expectClose } from './helpers';

describe('outline runs and loops', () => {
  // Analytic: flat bottom to the chine at y = 600, side y = 600 + 0.2 z to the sheer at 500; no skin, no deck:
  // the half outline is keel (0, 0), chine (600, 0), up the side through the waterlines to the sheer (700, 500),
  // then level back to (0, 500).
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0.2, sheerZ: 500, waterlineZs: [100, 300] }));
  const half = deductionAt(hull, 1500)!.outline;

  it('splits the half outline at its corners: bottom, side, top', () => {
    const runs = outlineRuns(half);
    expect(runs.map((r) => r.kind)).toEqual(['hull', 'hull', 'closure']);
    expect(runs[0]!.points.map((p) => [p.y, p.z])).toEqual([[0, 0], [600, 0]]);
    // Straight runs take their segment's outward normal: down for the bottom, out and down for the side, up for the top.
    expect(runs[0]!.normals[0]).toEqual({ y: 0, z: -1 });
    expectClose(runs[1]!.normals[0]!.y, 1 / Math.sqrt(1.04), 1e-12, 'side normal y');
    expectClose(runs[1]!.normals[0]!.z, -0.2 / Math.sqrt(1.04), 1e-12, 'side normal z');
    expect(runs[2]!.normals[0]).toEqual({ y: 0, z: 1 });
  });

  it('mirrors a half into a counter-clockwise loop without doubling the centreline points', () => {
    const loop = loopMirrored(half);
    // The corners come twice (once with each side's normal) and the waterlines at 100 and 300 are points of the side.
    const side = [[600, 0], [620, 100], [660, 300], [700, 500]];
    const port = [[700, 500], ...[...side].reverse(), [600, 0]].map(([y, z]) => [-y!, z!]);
    const expected = [[0, 0], [600, 0], ...side, [700, 500], [0, 500], ...port];
    expect(loop.map((p) => [p.y, p.z].map((v) => Number(v.toFixed(9))))).toEqual(expected);
    expect(polygonSignedArea(loop)).toBeGreaterThan(0);
    expect(Object.is(negated(0), -0)).toBe(false);
  });

  it('gives the edge against the skin from port to starboard, and its length', () => {
    const edge = hullEdgeOpen(half);
    expect(edge[0]).toEqual({ y: -700, z: 500 });
    expect(edge[edge.length - 1]).toEqual({ y: 700, z: 500 });
    // Analytic: 600 + sqrt(100^2 + 500^2) each side.
    expectClose(outlineEdgeLength(half, ['hull']), 600 + Math.hypot(100, 500), 1e-9, 'length');
    const runs = outlineContactRuns(half);
    expect(runs.deck).toEqual([]);
    expect(runs.hull.length).toBeGreaterThan(2);
  });

  it('edgeRunsBelow cuts an edge where it crosses a level', () => {
    const below = edgeRunsBelow(outlineContactRuns(half).hull, (p) => p.z, 250);
    expect(below).toHaveLength(1);
    const last = below[0]![below[0]!.length - 1]!;
    // Analytic: the side at z = 250 is at y = 600 + 50.
    expectClose(last.z, 250, 1e-9, 'cut height');
    expectClose(last.y, 650, 1e-9, 'cut half-breadth');
  });
});
