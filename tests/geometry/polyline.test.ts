import { describe, expect, it } from 'vitest';
import { polylineLinesMeet, polylineLoopsTrim, polylineSegmentsCross, polylineTailHeadCross } from '../../shared/geometry/polyline';

const P = (y: number, z: number) => ({ y, z });

describe('polylineSegmentsCross / polylineLinesMeet', () => {
  it('finds where two segments cross and where two lines meet', () => {
    // Analytic: the diagonals of the unit square cross at their middles.
    expect(polylineSegmentsCross(P(0, 0), P(1, 1), P(0, 1), P(1, 0))).toEqual({ s: 0.5, u: 0.5 });
    expect(polylineSegmentsCross(P(0, 0), P(1, 0), P(0, 1), P(1, 1))).toBeNull();
    expect(polylineSegmentsCross(P(0, 0), P(1, 1), P(2, 0), P(3, -5))).toBeNull();
    // Analytic: the line through (0, 2) along (1, 0) meets the line through (3, 0) along (0, 1) at (3, 2).
    const m = polylineLinesMeet(P(0, 2), P(1, 0), P(3, 0), P(0, 1))!;
    expect(m.s).toBeCloseTo(3, 12);
    expect(m.u).toBeCloseTo(2, 12);
    expect(polylineLinesMeet(P(0, 0), P(1, 0), P(0, 1), P(2, 0))).toBeNull();
  });
});

describe('polylineTailHeadCross', () => {
  it('finds the crossing nearest the join of two offset sides', () => {
    // Two sides set in from a square corner at (10, 0): the bottom set in overshoots to y = 12, the side starts at z = -2.
    const a = [P(0, 1), P(5, 1), P(12, 1)];
    const b = [P(9, -2), P(9, 5), P(9, 10)];
    expect(polylineTailHeadCross(a, b, 8)).toMatchObject({ i: 1, j: 0 });
  });
});

describe('polylineLoopsTrim', () => {
  it('cuts the loop out of a polyline that doubles back', () => {
    // A path going right, doubling back in a small loop, then on: the loop between the crossing is dropped.
    const pts = [P(0, 0), P(4, 0), P(6, 0), P(5, 1), P(5, -2), P(8, -2)].map((p, i) => ({ ...p, k: i }));
    // Backward: a segment that runs left (against the path's general direction +y).
    const out = polylineLoopsTrim(pts, (p, q) => q.y < p.y, (p, q, s) => ({ y: p.y + s * (q.y - p.y), z: p.z + s * (q.z - p.z), k: -1 }));
    expect(out.map((p) => [p.y, p.z])).toEqual([
      [0, 0],
      [4, 0],
      [5, 0],
      [5, -2],
      [8, -2],
    ]);
  });
});
