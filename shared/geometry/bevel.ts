import type { EdgePoint } from './edge';
import { type Degrees, type Radians, deg, degToRad, rad, radToDeg } from './types';

/**
 * Bevels: how far the edge of a frame is cut off square, where the hull surface (or the deck) is oblique
 * to the station plane.
 *
 * The surface moves, normal to the edge in the section plane, by `rate` mm per mm of x. Across a frame
 * of siding s the edge moves by rate x s, so the bevel is atan(rate s / s) = atan(rate): the bevel-board
 * relation tan(bevel) = d / L with d the normal distance between two sections L apart (Gougeon 2005,
 * p. 183, fig. 16-12). Wood removed across the siding: s tan(bevel).
 *
 * Under and standing (A. Young, Nautical Dictionary, 1846): seen from the marked face, an under bevel
 * leaves an acute angle between face and edge (wood comes off the marked face, which is the larger); a
 * standing bevel an obtuse one (the other face is the larger). A sliding bevel set from the marked face
 * reads 90 - b under and 90 + b standing; the saw table tilts b either way (common practice). The cut is
 * made with the larger face down on the table, so the blade leans over the part and the table falls away
 * toward the offcut.
 */

/** Bevels smaller than this (rad; 0.1 degree) are square: no saw is set closer. */
export const BEVEL_SQUARE_TOLERANCE_RAD = degToRad(0.1);
/** Default spacing (mm of girth) of bevel marks along an edge. */
export const BEVEL_MARK_SPACING_MM = 25;

/** A face of a frame. */
export type FrameFace = 'forward' | 'aft';
/** Kind of bevel as seen from the marked face. */
export type BevelKind = 'under' | 'standing' | 'square';

/** How a frame stands: which face carries the pattern, and its siding (thickness fore and aft, mm). */
export interface FrameSiding {
  markedFace: FrameFace;
  sidingMm: number;
  /** Which way the hull's x increases (the hull's `xDirection`). */
  xDirection: 'aft' | 'forward';
}

/** The bevel at one point of a frame's edge, as the saw and the sliding bevel need it. */
export interface BevelMark {
  /** Where on the frame's edge (mm), and the edge's unit outward normal there (toward the offcut). */
  y: number;
  z: number;
  ny: number;
  nz: number;
  girthMm: number;
  edge: EdgePoint['edge'];
  corner: boolean;
  /** Saw-table tilt from square (rad, >= 0) and in degrees. */
  bevel: Radians;
  bevelDeg: Degrees;
  kind: BevelKind;
  /** What a sliding bevel set from the marked face to the edge reads: 90 - b under, 90 + b standing, 90 square. */
  slidingBevelDeg: Degrees;
  markedFace: FrameFace;
  /** The larger face, the one cut to; null when square. */
  largerFace: FrameFace | null;
  /** The face that goes down on the saw table: the larger; null when square. */
  faceDown: FrameFace | null;
  /** Wood (mm) the edge loses across the siding, measured square to it: s tan(b). */
  removedMm: number;
  /** With the larger face down the table tilts down toward the offcut (the blade leans over the part). */
  tableTilt: 'down-toward-offcut';
}

/** Bevel (rad) from how far the surface moves (mm, any sign) across a thickness or spacing (mm, > 0): atan(move / thickness). */
export function bevelFromMove(moveMm: number, thicknessMm: number): Radians {
  return rad(Math.atan(moveMm / thicknessMm));
}

/** How far (mm) the surface moves across a length (mm) at a bevel (rad): length tan(bevel). The bevel board's d, or the wood removed across a siding. */
export function bevelMoveAcross(bevel: number, lengthMm: number): number {
  return lengthMm * Math.tan(bevel);
}

/** A thickness t (mm) normal to the surface, measured in the station plane at a bevel b (rad): t / cos(b). */
export function bevelStationPlaneThickness(thicknessMm: number, bevel: number): number {
  return thicknessMm / Math.cos(bevel);
}

/** Which face of the frame lies toward larger x. */
function otherFaceSign(frame: FrameSiding): 1 | -1 {
  return (frame.markedFace === 'forward') === (frame.xDirection === 'aft') ? 1 : -1;
}

/** The face that gives an under bevel where the surface moves at `rate` (grows toward +x: mark the face toward +x). */
export function bevelUnderFace(rate: number, xDirection: FrameSiding['xDirection']): FrameFace {
  const towardPlusX: FrameFace = xDirection === 'aft' ? 'aft' : 'forward';
  const towardMinusX: FrameFace = xDirection === 'aft' ? 'forward' : 'aft';
  return rate > 0 ? towardPlusX : towardMinusX;
}

/** The bevel mark of an edge point for a frame standing as `frame`. */
export function bevelMarkOf(p: EdgePoint, frame: FrameSiding, squareTolerance: number = BEVEL_SQUARE_TOLERANCE_RAD): BevelMark {
  const b = Math.atan(Math.abs(p.rate));
  const other: FrameFace = frame.markedFace === 'forward' ? 'aft' : 'forward';
  // The surface at the other face stands out (+) or in (-) from the marked face's edge.
  const move = p.rate * otherFaceSign(frame) * frame.sidingMm;
  const square = b < squareTolerance || p.edge === 'closure';
  const kind: BevelKind = square ? 'square' : move < 0 ? 'under' : 'standing';
  const bd = radToDeg(square ? 0 : b);
  const larger: FrameFace | null = square ? null : kind === 'under' ? frame.markedFace : other;
  return {
    y: p.y,
    z: p.z,
    ny: p.ny,
    nz: p.nz,
    girthMm: p.girthMm,
    edge: p.edge,
    corner: p.corner,
    bevel: rad(square ? 0 : b),
    bevelDeg: bd,
    kind,
    slidingBevelDeg: deg(kind === 'under' ? 90 - bd : kind === 'standing' ? 90 + bd : 90),
    markedFace: frame.markedFace,
    largerFace: larger,
    faceDown: larger,
    removedMm: square ? 0 : frame.sidingMm * Math.tan(b),
    tableTilt: 'down-toward-offcut',
  };
}

/**
 * Bevel marks along one edge (points in order of girth, e.g. a deduction's `hull` or `deck`): at every
 * whole multiple of `spacingMm` of girth (0 included), the first and last points, and both sides of
 * every corner. Between points the edge is
 * interpolated linearly (the points are within the chord tolerance of the curve).
 */
export function bevelAlong(points: readonly EdgePoint[], frame: FrameSiding, spacingMm: number = BEVEL_MARK_SPACING_MM): BevelMark[] {
  const out: BevelMark[] = [];
  if (points.length === 0) return out;
  const step = spacingMm > 0 ? spacingMm : BEVEL_MARK_SPACING_MM;
  const first = points[0]!;
  // The marks fall on whole multiples of the spacing from girth 0, so the marks of an edge that starts
  // part-way round (a deck edge, a floor's top) line up with the table; the edge's first point is marked
  // too, as its last is. The 1e-9 keeps a start at a multiple, reached by rounding, on that multiple.
  let next = Math.ceil(first.girthMm / step - 1e-9) * step;
  if (!first.corner && first.girthMm < next - 1e-9) out.push(bevelMarkOf(first, frame));
  for (let i = 0; i < points.length; i++) {
    const p = points[i]!;
    const q = points[i + 1];
    if (p.corner && p.edge !== 'closure') out.push(bevelMarkOf(p, frame));
    if (!q) break;
    const g0 = p.girthMm;
    const g1 = q.girthMm;
    while (next <= g1 && g1 > g0) {
      if (next >= g0) {
        const f = (next - g0) / (g1 - g0);
        out.push(bevelMarkOf(lerp(p, q, f), frame));
      }
      next += step;
    }
  }
  const last = points[points.length - 1]!;
  if (!last.corner && out[out.length - 1]?.girthMm !== last.girthMm) out.push(bevelMarkOf(last, frame));
  return out;
}

function lerp(a: EdgePoint, b: EdgePoint, f: number): EdgePoint {
  return {
    y: a.y + f * (b.y - a.y),
    z: a.z + f * (b.z - a.z),
    ny: a.ny + f * (b.ny - a.ny),
    nz: a.nz + f * (b.nz - a.nz),
    rate: a.rate + f * (b.rate - a.rate),
    bevel: a.bevel + f * (b.bevel - a.bevel),
    girthMm: a.girthMm + f * (b.girthMm - a.girthMm),
    setInMm: a.setInMm + f * (b.setInMm - a.setInMm),
    edge: a.edge,
    corner: false,
  };
}

/** A frame's bevels summed up: how many of each kind, the largest, and whether it mixes under and standing. */
export interface BevelSummary {
  under: number;
  standing: number;
  square: number;
  /** Under and standing bevels on the same frame: it cannot all be cut from one marked face. */
  mixed: boolean;
  maxBevelDeg: Degrees;
}

/** Summary of a set of bevel marks (a frame mixing under and standing is reported by `mixed`). */
export function bevelSummaryOf(marks: readonly BevelMark[]): BevelSummary {
  let under = 0;
  let standing = 0;
  let square = 0;
  let max = 0;
  for (const m of marks) {
    if (m.kind === 'under') under++;
    else if (m.kind === 'standing') standing++;
    else square++;
    max = Math.max(max, m.bevelDeg);
  }
  return { under, standing, square, mixed: under > 0 && standing > 0, maxBevelDeg: deg(max) };
}
