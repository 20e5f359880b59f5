import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cutShapes } from '../../shared/geometry/cut';
import { circleLoop } from '../../shared/geometry/holes';
import { CLIPPER_SCALE, type Shape, polygonIsSimple, polygonPerimeter, polygonSignedArea, shapeArea, shapeBoolean } from '../../shared/geometry/polygon';
import type { SectionPoint } from '../../shared/geometry/types';
import { expectClose } from './helpers';

const rect = (y: number, z: number, w: number, h: number): SectionPoint[] => [{ y: y - w / 2, z: z - h / 2 }, { y: y + w / 2, z: z - h / 2 }, { y: y + w / 2, z: z + h / 2 }, { y: y - w / 2, z: z + h / 2 }];
/** clipper-lib rounds every vertex to 1 micrometre: the area may differ by half a unit along every edge. */
const rounding = (shapes: readonly Shape[]): number => shapes.reduce((a, s) => a + polygonPerimeter(s.outer) + s.holes.reduce((h, l) => h + polygonPerimeter(l), 0), 0) * (0.5 / CLIPPER_SCALE);

// Invented fixtures: a disc of radius 500 (a round section) and a ring of it 80 wide.
const disc: Shape = { outer: circleLoop({ y: 0, z: 600 }, 500, 0.05), holes: [] };
const ring: Shape = { outer: disc.outer, holes: [circleLoop({ y: 0, z: 600 }, 420, 0.05).reverse()] };

describe('cutShapes', () => {
  it('takes bites out of the edge exactly where clipper-lib does (source: clipper-lib 6.4.2 difference)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ a: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), w: fc.double({ min: 5, max: 60, noNaN: true }), d: fc.double({ min: 5, max: 70, noNaN: true }) }), { minLength: 1, maxLength: 6 }),
        (bites) => {
          // Notch-like cutters square to the edge, each reaching 1 mm past it; spread round so they do not overlap.
          const cutters = bites.map((b, i) => {
            const a = b.a / bites.length + (2 * Math.PI * i) / bites.length;
            const c = { y: 500 * Math.cos(a), z: 600 + 500 * Math.sin(a) };
            const n = { y: Math.cos(a), z: Math.sin(a) };
            const t = { y: -n.z, z: n.y };
            const p = (along: number, out: number): SectionPoint => ({ y: c.y + t.y * along + n.y * out, z: c.z + t.z * along + n.z * out });
            return [p(-b.w / 2, 1), p(b.w / 2, 1), p(b.w / 2, -b.d), p(-b.w / 2, -b.d)].reverse();
          });
          for (const c of cutters) if (polygonSignedArea(c) < 0) c.reverse();
          for (const base of [disc, ring]) {
            const ours = cutShapes([base], cutters);
            const theirs = shapeBoolean('difference', [base], cutters.map((outer) => ({ outer, holes: [] })));
            expect(ours.length).toBe(theirs.length);
            const a = ours.reduce((s, x) => s + shapeArea(x), 0);
            const b = theirs.reduce((s, x) => s + shapeArea(x), 0);
            expectClose(a, b, rounding(theirs) + 1e-6, 'area');
            for (const s of ours) expect(polygonIsSimple(s.outer)).toBe(true);
          }
        },
      ),
      { numRuns: 40, seed: 3 },
    );
  });

  it('makes a cutter wholly inside the material a hole, and leaves one outside alone', () => {
    const out = cutShapes([disc], [circleLoop({ y: 0, z: 600 }, 50), rect(2000, 0, 10, 10)]);
    expect(out).toHaveLength(1);
    expect(out[0]!.holes).toHaveLength(1);
    expect(polygonSignedArea(out[0]!.holes[0]!)).toBeLessThan(0);
    expect(out[0]!.outer).toBe(disc.outer);
  });

  it("reads the region's box off its indexed blocks: a cutter just past the widest point is left alone, one on it bites (source: clipper-lib 6.4.2 difference)", () => {
    // The disc's widest point, y = 500, is its first point: the last block's edge back to it must count too.
    let widest = -Infinity;
    for (const p of disc.outer) widest = Math.max(widest, p.y);
    expect(cutShapes([disc], [rect(widest + 2.5, 600, 4, 4)])[0]!.outer).toBe(disc.outer);
    const bite = rect(widest, 600, 4, 4);
    const ours = cutShapes([disc], [bite]);
    const theirs = shapeBoolean('difference', [disc], [{ outer: bite, holes: [] }]);
    expect(ours).toHaveLength(1);
    expectClose(shapeArea(ours[0]!), shapeArea(theirs[0]!), rounding(theirs), 'bite on the widest point');
    expect(shapeArea(ours[0]!)).toBeLessThan(shapeArea(disc));
  });

  it('hands overlapping cutters, and cutters reaching a hole, to clipper-lib', () => {
    // Two overlapping bites, and a bite deeper than the ring (it breaks into the opening).
    const over = cutShapes([disc], [rect(500, 600, 40, 40), rect(500, 620, 40, 40)]);
    const theirs = shapeBoolean('difference', [disc], [rect(500, 600, 40, 40), rect(500, 620, 40, 40)].map((outer) => ({ outer, holes: [] })));
    expectClose(shapeArea(over[0]!), shapeArea(theirs[0]!), 1e-9, 'overlapping');
    // Across the ring from inside the opening (y 410) to outside the edge (y 510): the ring is opened into a C.
    const through = cutShapes([ring], [rect(460, 600, 100, 40)]);
    expect(through).toHaveLength(1);
    expect(through[0]!.holes).toHaveLength(0);
  });
});
