import { describe, expect, it } from 'vitest';
import { deductionAt } from '../../shared/geometry/deduction';
import { hullBuild } from '../../shared/geometry/hull';
import { faceToward, layerFaceDepths, layerPiecesOf, markedFaceAuto, outlineGrowth, thicknessDirectionOf } from '../../shared/geometry/layers';
import { jointingSchema } from '../../shared/geometry/part-schema';
import { evenStations, range, roundHull } from './analytic-hulls';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;

describe('thicknessDirectionOf and faceToward', () => {
  it('run the thickness away from the marked face, in whichever way x grows', () => {
    // x aft: the forward face is toward smaller x, so a frame marked on it runs aft (+x).
    expect(thicknessDirectionOf('forward', 'aft')).toBe(1);
    expect(thicknessDirectionOf('aft', 'aft')).toBe(-1);
    expect(thicknessDirectionOf('forward', 'forward')).toBe(-1);
    expect(faceToward(1, 'aft')).toBe('aft');
    expect(faceToward(-1, 'forward')).toBe('aft');
  });

  it('layerFaceDepths stacks the layers from the marked face', () => {
    expect(layerFaceDepths([{ thicknessMm: 9 }, { thicknessMm: 6 }, { thicknessMm: 9 }])).toEqual([0, 9, 15, 24]);
  });
});

describe('outlineGrowth and markedFaceAuto', () => {
  // Analytic: a cone R(x) = 1000 - k x about (0, 1100), sheer on the level of the centre (90 deg from the keel),
  // skin 9 mm: the half outline is a quarter circle of radius r = R - 9 sqrt(1 + k^2) closed level at the
  // sheer. Its area pi r^2 / 4 grows at (pi / 2) r dr/dx = -(pi / 2) r k: the edge's rate integrated along it.
  const k = 0.05;
  const hull = hullBuild(roundHull({ xs: evenStations(0, 6000, 12), radius: (x) => 1000 - k * x, centreZ: 1100, sheerAngle: 90 * DEG, waterlineZs: range(450, 1050, 50), buttockYs: range(50, 650, 50), skinMm: 9 }));

  it('is dA/dx of the outline (derived: the area swept by the edge moving out at its rate)', () => {
    const x = 3000;
    const half = deductionAt(hull, x, { filletClearanceMm: 0 })!.outline;
    const r = 1000 - k * x - 9 * Math.sqrt(1 + k * k);
    expectClose(outlineGrowth(half), -(Math.PI / 2) * r * k, 0.5, 'dA/dx');
  });

  it('marks the face toward the larger section (A. Young 1846: under bevels), the middle on a parallel body', () => {
    const half = deductionAt(hull, 3000)!.outline;
    expect(markedFaceAuto(hull, 3000, half)).toBe('forward');
    // Nothing changes along x: the face toward the middle of the hull (x = 3000) wins.
    const flat = half.map((p) => ({ ...p, rate: 0 }));
    expect(markedFaceAuto(hull, 1000, flat)).toBe('aft');
    expect(markedFaceAuto(hull, 5000, flat)).toBe('forward');
  });
});

describe('layerPiecesOf', () => {
  it('cuts each region of each layer, joints staggered between layers of the same region', () => {
    // Invented: two separate rectangles (a pair of half beams), two layers of two pieces each.
    const rect = (y0: number) => ({ outer: [{ y: y0, z: 0 }, { y: y0 + 800, z: 0 }, { y: y0 + 800, z: 100 }, { y: y0, z: 100 }], holes: [] });
    const regions = [rect(100), rect(-900)];
    const edges = [
      { points: [{ y: 100, z: 0 }, { y: 900, z: 0 }], closed: false },
      { points: [{ y: -900, z: 0 }, { y: -100, z: 0 }], closed: false },
    ];
    const layer = { regions, girthEdges: edges, joints: { by: 'count' as const, pieces: 2 } };
    const out = layerPiecesOf([layer, layer], jointingSchema.parse({ minStaggerMm: 100 }));
    expect(out.map((l) => l.pieces.length)).toEqual([4, 4]);
    expect(out.map((l) => l.joints.length)).toEqual([2, 2]);
    // Per region, the two layers' joints are at least 100 mm apart (pieces.ts's stagger).
    for (let r = 0; r < 2; r++) expect(Math.abs(out[0]!.joints[r]!.from.y - out[1]!.joints[r]!.from.y)).toBeGreaterThanOrEqual(100 - 1e-9);
  });
});
