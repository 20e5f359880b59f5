import { vectorLength } from './vector';
import type { FrameFace } from './bevel';
import type { EdgePoint } from './edge';
import type { LayerPiecesGeometry, PartRegion } from './frame-types';
import type { BuiltHull } from './hull';
import type { Jointing, Layer, LayerJoints } from './part-schema';
import { type GirthEdge, piecesOfLayers } from './pieces';
import type { Shape } from './polygon';

/**
 * How a part's thickness is laid out: which face is marked (on the station line), which way along x the
 * layers stack from it, the depth of every face, and each layer cut into pieces with joints staggered
 * against its neighbours.
 */

/** +1 when the other face lies toward larger x from the marked face. */
export type ThicknessDirection = 1 | -1;

/**
 * Which way the part's thickness runs from the marked face: toward larger x when the marked face is the one
 * toward smaller x. (The same sense as bevel.ts uses for the other face.)
 */
export function thicknessDirectionOf(markedFace: FrameFace, xDirection: 'aft' | 'forward'): ThicknessDirection {
  const towardMinusX: FrameFace = xDirection === 'aft' ? 'forward' : 'aft';
  return markedFace === towardMinusX ? 1 : -1;
}

/** The face toward larger x (+1) or smaller x (-1). */
export function faceToward(direction: ThicknessDirection, xDirection: 'aft' | 'forward'): FrameFace {
  const towardPlusX: FrameFace = xDirection === 'aft' ? 'aft' : 'forward';
  const towardMinusX: FrameFace = xDirection === 'aft' ? 'forward' : 'aft';
  return direction > 0 ? towardPlusX : towardMinusX;
}

/**
 * How fast the frame's outline grows with x (mm^2 per mm): the outward rate of its edge integrated along
 * it, dA/dx = integral of rate ds over the half outline (the area swept by an edge moving out at rate per
 * mm of x). Positive: the hull is larger toward larger x. Derived.
 */
export function outlineGrowth(half: readonly EdgePoint[]): number {
  let sum = 0;
  for (let i = 1; i < half.length; i++) {
    const a = half[i - 1]!;
    const b = half[i]!;
    if (a.edge === 'closure' || b.edge === 'closure') continue;
    sum += ((a.rate + b.rate) / 2) * vectorLength(b.y - a.y, b.z - a.z);
  }
  return sum;
}

/**
 * The marked face `auto` chooses: the face toward the larger section, so the thickness runs toward the
 * smaller one and the bevels come out under (A. Young 1846; REFERENCES.md). Where the outline does not
 * change with x (a parallel body), the face toward the middle of the hull's length.
 */
export function markedFaceAuto(hull: BuiltHull, x: number, half: readonly EdgePoint[], toleranceMm2PerMm = 1e-6): FrameFace {
  const g = outlineGrowth(half);
  const towardLarger: ThicknessDirection = Math.abs(g) > toleranceMm2PerMm ? (g > 0 ? 1 : -1) : x <= (hull.xMin + hull.xMax) / 2 ? 1 : -1;
  return faceToward(towardLarger, hull.lines.xDirection);
}

/** Depths (mm) of every face from the marked face: 0, then the far face of each layer in turn. */
export function layerFaceDepths(layers: readonly Pick<Layer, 'thicknessMm'>[]): number[] {
  const out = [0];
  for (const l of layers) out.push(out[out.length - 1]! + l.thicknessMm);
  return out;
}

const toRegion = (s: Shape): PartRegion => ({ outer: s.outer, holes: s.holes });

/**
 * Each layer in pieces (pieces.ts `piecesOfLayers`), region by region (a pair of half beams has two):
 * `layers[k].regions[r]` with `girthEdges[r]`, joints staggered between neighbouring layers of the same region.
 * @throws GeometryInputError from pieces.ts (a joint off the edge, no stagger possible, a joint missing the layer).
 */
export function layerPiecesOf(
  layers: readonly { regions: Shape[]; girthEdges: GirthEdge[]; joints: LayerJoints }[],
  jointing: Jointing,
): LayerPiecesGeometry[] {
  const out: LayerPiecesGeometry[] = layers.map(() => ({ pieces: [], joints: [], buttJoints: [], buttBlocks: [] }));
  const regionCount = Math.min(...layers.map((l) => l.regions.length));
  for (let r = 0; r < regionCount; r++) {
    const cut = piecesOfLayers(
      layers.map((l) => ({ shape: l.regions[r]!, edge: l.girthEdges[r] ?? l.girthEdges[0]!, joints: l.joints })),
      jointing,
    );
    cut.forEach((c, k) => {
      const o = out[k]!;
      o.pieces.push(...c.pieces.map(toRegion));
      o.joints.push(...c.joints.map((j) => ({ girthMm: j.girthMm, from: j.from, to: j.to })));
      o.buttJoints.push(...c.buttJoints);
      o.buttBlocks.push(...c.buttBlocks.map(toRegion));
    });
  }
  return out;
}
