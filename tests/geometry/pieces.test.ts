import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { type LayerJoints, jointingSchema } from '../../shared/geometry/part-schema';
import {
  JOINT_CUT_WIDTH_MM,
  type GirthEdge,
  girthPoint,
  girthRange,
  pieceFitsSheet,
  piecesFittingSheet,
  piecesJointGirths,
  piecesOfLayer,
  piecesOfLayers,
} from '../../shared/geometry/pieces';
import { CLIPPER_SCALE, type Shape, polygonArea, polygonBounds, polygonPerimeter, shapeArea, shapePerimeter } from '../../shared/geometry/polygon';
import { GeometryInputError, type SectionPoint } from '../../shared/geometry/types';
import { expectClose, expectPointClose } from './helpers';

const circle = (r: number, n: number, cz: number): SectionPoint[] =>
  Array.from({ length: n }, (_, i) => ({ y: r * Math.cos((2 * Math.PI * i) / n), z: cz + r * Math.sin((2 * Math.PI * i) / n) }));
const rect = (y0: number, z0: number, w: number, h: number): SectionPoint[] => [{ y: y0, z: z0 }, { y: y0 + w, z: z0 }, { y: y0 + w, z: z0 + h }, { y: y0, z: z0 + h }];
const sumArea = (shapes: Shape[]): number => shapes.reduce((a, s) => a + shapeArea(s), 0);
/** Area clipper-lib may gain or lose by rounding every vertex to its grid: half a unit along every edge. */
const rounding = (s: Shape): number => (shapePerimeter(s) * 0.5) / CLIPPER_SCALE;

// Invented fixtures. A closed ring frame: outer circle R 600 about (0, 700), ring 100 wide.
const ringOuter = circle(600, 360, 700);
const ring: Shape = { outer: ringOuter, holes: [circle(500, 360, 700).reverse()] };
const ringEdge: GirthEdge = { points: ringOuter, closed: true };
// An open (U) frame 1000 wide, 600 high, arms 80 wide, bottom 80 deep; its outer edge port sheer to starboard sheer.
const uShape: Shape = { outer: [{ y: -500, z: 600 }, { y: -500, z: 0 }, { y: 500, z: 0 }, { y: 500, z: 600 }, { y: 420, z: 600 }, { y: 420, z: 80 }, { y: -420, z: 80 }, { y: -420, z: 600 }], holes: [] };
const uEdge: GirthEdge = { points: [{ y: -500, z: 600 }, { y: -500, z: 0 }, { y: 500, z: 0 }, { y: 500, z: 600 }], closed: false };

describe('girthRange and girthPoint', () => {
  it('measure from the lowest centreline crossing, starboard positive', () => {
    // analytic: 500 across the bottom and 600 up each side
    expect(girthRange(uEdge)).toEqual({ minMm: -1100, maxMm: 1100, lengthMm: 2200, closed: false });
    expectPointClose(girthPoint(uEdge, 0)!.point, { y: 0, z: 0 }, 1e-12);
    expectPointClose(girthPoint(uEdge, 700)!.point, { y: 500, z: 200 }, 1e-12);
    expectPointClose(girthPoint(uEdge, -700)!.point, { y: -500, z: 200 }, 1e-12);
    // analytic: into the frame from the starboard side is toward port, from the bottom is up
    expectPointClose(girthPoint(uEdge, 700)!.inward, { y: -1, z: 0 }, 1e-12);
    expectPointClose(girthPoint(uEdge, 100)!.inward, { y: 0, z: 1 }, 1e-12);
    expect(girthPoint(uEdge, 1200)).toBeNull();
    // the same edge given starboard to port reads the same
    expectPointClose(girthPoint({ points: [...uEdge.points].reverse(), closed: false }, 700)!.point, { y: 500, z: 200 }, 1e-12);
  });

  it('go round a closed edge, half the perimeter each way', () => {
    const p = polygonPerimeter(ringOuter);
    const r = girthRange(ringEdge);
    expectClose(r.maxMm, p / 2, 1e-9);
    // analytic: a quarter of the way round from the bottom is the starboard side at the centre's height
    expectPointClose(girthPoint(ringEdge, p / 4)!.point, { y: 600, z: 700 }, 1e-9);
    expectPointClose(girthPoint(ringEdge, -p / 4)!.point, { y: -600, z: 700 }, 1e-9);
    expectPointClose({ ...girthPoint(ringEdge, p / 2)!.point }, { ...girthPoint(ringEdge, -p / 2)!.point }, 1e-9);
  });
});

describe('piecesOfLayer', () => {
  it('cuts a U frame square across at its joints', () => {
    const { pieces, joints } = piecesOfLayer(uShape, uEdge, [0, 700]);
    // analytic: across the bottom at the centreline, across the starboard arm at 200 up
    expectPointClose(joints[0]!.from, { y: 0, z: 0 }, 1e-9);
    expectPointClose(joints[0]!.to, { y: 0, z: 80 }, 1e-9);
    expectPointClose(joints[1]!.from, { y: 500, z: 200 }, 1e-9);
    expectPointClose(joints[1]!.to, { y: 420, z: 200 }, 1e-9);
    expect(pieces).toHaveLength(3);
    // analytic: the pieces' areas are the layer's less the cut (its width times the cuts' 160 mm)
    expectClose(sumArea(pieces), shapeArea(uShape) - JOINT_CUT_WIDTH_MM * 160, 1e-6);
    const areas = pieces.map(shapeArea).sort((a, b) => a - b);
    // analytic: starboard arm above the joint 80 x 400; port half 500 x 80 + 80 x 520
    expectClose(areas[0]!, 80 * 400, 0.2);
    expectClose(areas[2]!, 500 * 80 + 80 * 520, 0.2);
  });

  it('cuts a closed ring into as many pieces as joints, each from the outside to the hole', () => {
    const p = polygonPerimeter(ringOuter);
    const girths = [-3, -1, 1, 3].map((k) => (k * p) / 8);
    const { pieces, joints } = piecesOfLayer(ring, ringEdge, girths);
    expect(pieces).toHaveLength(4);
    // analytic: each cut crosses the 100 mm ring (the 360-gons' chords sit within 0.023 mm of the circles)
    for (const j of joints) expectClose(Math.hypot(j.to.y - j.from.y, j.to.z - j.from.z), 100, 0.05);
    expectClose(sumArea(pieces), shapeArea(ring) - 4 * 100 * JOINT_CUT_WIDTH_MM, rounding(ring));
    // analytic: a symmetric ring cut at equal girths gives four equal pieces
    for (const s of pieces) expectClose(shapeArea(s), shapeArea(ring) / 4, 0.5);
  });

  it('finds the layer when the edge lies a fillet clearance outside it', () => {
    const shrunk: Shape = { outer: [{ y: -498, z: 600 }, { y: -498, z: 2 }, { y: 498, z: 2 }, { y: 498, z: 600 }, { y: 420, z: 600 }, { y: 420, z: 80 }, { y: -420, z: 80 }, { y: -420, z: 600 }], holes: [] };
    const { joints } = piecesOfLayer(shrunk, uEdge, [0]);
    // analytic: the cut starts where the material does, 2 mm in
    expectPointClose(joints[0]!.from, { y: 0, z: 2 }, 1e-9);
    expect(() => piecesOfLayer(shrunk, uEdge, [0], 1)).toThrow(/does not meet the layer/);
    expect(() => piecesOfLayer(uShape, uEdge, [1500])).toThrow(GeometryInputError);
  });
});

const count = (pieces: number): LayerJoints => ({ by: 'count', pieces });
const stated = (girthsMm: number[]): LayerJoints => ({ by: 'girth', girthsMm });
const gap = (a: number, b: number, period: number | null): number => {
  const d = Math.abs(a - b);
  return period === null ? d : Math.min(d % period, period - (d % period));
};

describe('piecesJointGirths', () => {
  it('shifts the next layer\'s joints off the last by the minimum stagger', () => {
    const g = piecesJointGirths([{ edge: uEdge, joints: count(2) }, { edge: uEdge, joints: count(2) }], 150);
    // analytic: two pieces of equal girth join at the keel; the next layer's joint moves 150 mm
    expect(g[0]).toEqual([0]);
    expect(g[1]).toEqual([150]);
  });

  it('places a ring\'s pieces at equal girths, one joint per piece', () => {
    const p = polygonPerimeter(ringOuter);
    const g = piecesJointGirths([{ edge: ringEdge, joints: count(4) }, { edge: ringEdge, joints: count(1) }], 100);
    // analytic: n joints of a closed ring, centred so the pattern is symmetric
    [-3, -1, 1, 3].forEach((k, i) => expectClose(g[0]![i]!, (k * p) / 8, 1e-9));
    expect(g[1]).toEqual([]);
  });

  it('keeps every pair of neighbouring layers at least the minimum apart, or says it cannot', () => {
    const layer = fc.record({ closed: fc.boolean(), pieces: fc.integer({ min: 1, max: 6 }) });
    fc.assert(
      fc.property(fc.array(layer, { minLength: 2, maxLength: 5 }), fc.double({ min: 0, max: 250, noNaN: true }), (spec, m) => {
        const layers = spec.map((s) => ({ edge: s.closed ? ringEdge : uEdge, joints: count(s.pieces) }));
        let g: number[][];
        try {
          g = piecesJointGirths(layers, m);
        } catch (e) {
          expect(e).toBeInstanceOf(GeometryInputError);
          expect((e as GeometryInputError).issues[0]!.code).toBe('joint-stagger');
          return;
        }
        spec.forEach((s, i) => expect(g[i]).toHaveLength(s.closed ? (s.pieces < 2 ? 0 : s.pieces) : s.pieces - 1));
        for (let i = 0; i + 1 < g.length; i++) {
          const period = spec[i]!.closed ? polygonPerimeter(ringOuter) : null;
          for (const a of g[i]!) for (const b of g[i + 1]!) expect(gap(a, b, period)).toBeGreaterThanOrEqual(m - 1e-6);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('reports a stagger that cannot be met, and stated joints too close', () => {
    // analytic: joints every 100 mm from -600 to 600 leave no room within half a piece (550 mm) of the keel
    const dense = stated([-600, -500, -400, -300, -200, -100, 0, 100, 200, 300, 400, 500, 600]);
    expect(() => piecesJointGirths([{ edge: uEdge, joints: dense }, { edge: uEdge, joints: count(2) }], 150)).toThrow(/layer 2: no placing of 2 pieces/);
    // analytic: with joints only to +-300 the keel joint moves 450 mm, to 150 mm past the last
    const fewer = piecesJointGirths([{ edge: uEdge, joints: stated([-300, -200, -100, 0, 100, 200, 300]) }, { edge: uEdge, joints: count(2) }], 150);
    expect(fewer[1]).toEqual([450]);
    expect(() => piecesJointGirths([{ edge: uEdge, joints: stated([0]) }, { edge: uEdge, joints: stated([100]) }], 150)).toThrow(/closer than the minimum stagger of 150 mm/);
    expect(() => piecesJointGirths([{ edge: uEdge, joints: stated([2000]) }], 150)).toThrow(/off the edge/);
  });
});

describe('piecesFittingSheet and pieceFitsSheet', () => {
  const sheet = { widthMm: 1220, lengthMm: 2440 };

  it('splits a 3000 mm strip once, at a butt block, into pieces that fit', () => {
    const strip: Shape = { outer: rect(0, 0, 3000, 400), holes: [] };
    expect(pieceFitsSheet(strip, sheet)).toBe(false);
    const out = piecesFittingSheet([strip], sheet, 100);
    // analytic: 3000 along the sheet's 2440 length needs two pieces of 1500
    expect(out.pieces).toHaveLength(2);
    for (const p of out.pieces) {
      expect(pieceFitsSheet(p, sheet)).toBe(true);
      const b = polygonBounds(p.outer)!;
      expectClose(b.maxY - b.minY, 1500, 1e-3);
    }
    expectClose(sumArea(out.pieces), 3000 * 400, 1e-3);
    expect(out.buttJoints).toHaveLength(1);
    expectPointClose(out.buttJoints[0]!.from, { y: 1500, z: 0 }, 1e-9);
    expectPointClose(out.buttJoints[0]!.to, { y: 1500, z: 400 }, 1e-9);
    // analytic: the block is 100 wide across the 400 mm joint
    expectClose(shapeArea(out.buttBlocks[0]!), 100 * 400, 1e-3);
  });

  it('leaves pieces that fit either way round alone', () => {
    const turned: Shape = { outer: rect(0, 0, 2400, 1200), holes: [] };
    expect(pieceFitsSheet(turned, sheet)).toBe(true);
    expect(piecesFittingSheet([turned], sheet).pieces).toEqual([turned]);
  });

  it('splits a large ring into pieces that all fit and add up to it', () => {
    const big: Shape = { outer: circle(1400, 720, 1500), holes: [circle(1300, 720, 1500).reverse()] };
    const out = piecesFittingSheet([big], sheet, 120);
    for (const p of out.pieces) expect(pieceFitsSheet(p, sheet)).toBe(true);
    // analytic (polygon area): the slabs share their edges exactly; only clipper's rounding of the ring is lost
    expectClose(sumArea(out.pieces), shapeArea(big), rounding(big));
    expect(out.buttBlocks.length).toBeGreaterThan(0);
    for (const b of out.buttBlocks) expect(polygonArea(b.outer)).toBeGreaterThan(0);
  });
});

describe('piecesOfLayers', () => {
  it('staggers, cuts and fits every layer of a part', () => {
    const jointing = jointingSchema.parse({ minStaggerMm: 150 });
    const layers = [{ shape: uShape, edge: uEdge, joints: count(2) }, { shape: uShape, edge: uEdge, joints: count(2) }];
    const out = piecesOfLayers(layers, jointing);
    expect(out.map((l) => l.joints.map((j) => j.girthMm))).toEqual([[0], [150]]);
    // analytic: the second layer's joint at girth 150 is across the bottom at y = 150
    expectPointClose(out[1]!.joints[0]!.from, { y: 150, z: 0 }, 1e-9);
    for (const l of out) {
      expect(l.pieces).toHaveLength(2);
      expectClose(sumArea(l.pieces), shapeArea(uShape) - 80 * JOINT_CUT_WIDTH_MM, 1e-6);
      expect(l.buttJoints).toEqual([]);
    }
  });
});
