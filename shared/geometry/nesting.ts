// The package's "main" is a UMD build under "type": "module", which exports nothing when Node loads it as
// ES module; its ES build is imported by path instead. It has no declarations of its own at that path, so
// the types come from the package's declared entry below.
// @ts-expect-error maxrects-packer 2.7.4 declares types only for its main entry (see above).
import * as maxrectsModule from 'maxrects-packer/dist/maxrects-packer.mjs';
import type { IOption, MaxRectsPacker as MaxRectsPackerType } from 'maxrects-packer';
import { DEFAULT_SHEET, type Sheet } from './part-schema';
import { type Shape, polygonBounds, shapeArea } from './polygon';
import { GeometryInputError, type GeometryIssue, POINT_TOLERANCE_MM } from './types';

/**
 * Pieces arranged on plywood sheets by their bounding boxes, turned a quarter turn where allowed, with a
 * saw kerf between them, using maxrects-packer (the MaxRects bin-packing heuristics, J. Jylanki). Sheet
 * coordinates: x across the sheet's width, y along its length (the face grain), from a corner, mm.
 */

interface PackedRect {
  x: number;
  y: number;
  width: number;
  height: number;
  rot: boolean;
  data: { index: number };
}
interface Packer {
  bins: { rects: PackedRect[] }[];
  addArray(rects: object[]): void;
}
const maxrects = maxrectsModule as {
  MaxRectsPacker: new (width: number, height: number, padding: number, options: IOption) => MaxRectsPackerType & Packer;
  Rectangle: new (width: number, height: number, x: number, y: number, rot: boolean, allowRotation: boolean | undefined) => PackedRect;
  PACKING_LOGIC: { MAX_AREA: number; MAX_EDGE: number };
};

/** Default saw kerf (mm) between pieces: a bandsaw or jigsaw blade with room to cut to the line (our choice). */
export const DEFAULT_KERF_MM = 3;

/**
 * A piece to place: its extent across (`widthMm`, along the section's y) and up (`heightMm`, z), the area
 * it really takes (for the yield; default the box) and its grain: `y` or `z` must run along the sheet's
 * length, null lets the piece turn.
 */
export interface NestingPiece {
  id: string;
  widthMm: number;
  heightMm: number;
  areaMm2?: number;
  grain?: 'y' | 'z' | null;
}

/** Where a piece went: its box's corner on the sheet, its size as placed, and whether it was turned. */
export interface NestedPlacement {
  id: string;
  x: number;
  y: number;
  /** Size as placed: across the sheet (x) and along it (y). */
  widthMm: number;
  lengthMm: number;
  /** True when the piece's own y (across) runs along the sheet's length: a quarter turn. */
  rotated: boolean;
}

/** One sheet of the nesting. */
export interface NestedSheet {
  index: number;
  placements: NestedPlacement[];
  usedAreaMm2: number;
  /** Used area / sheet area, 0 to 1. */
  yield: number;
}

/** The result of `nestingOnSheets`. */
export interface Nesting {
  sheet: Sheet;
  kerfMm: number;
  sheets: NestedSheet[];
  usedAreaMm2: number;
  sheetAreaMm2: number;
  yield: number;
}

/** Options of `nestingOnSheets`. */
export interface NestingOptions {
  sheet?: Sheet;
  kerfMm?: number;
  /** Margin (mm) kept clear at the sheet's edges (a damaged or out-of-square factory edge). */
  edgeMarginMm?: number;
}

/**
 * Pieces on as few sheets as the packer finds (default 1220 x 2440 mm, common practice), at least
 * `kerfMm` apart and `edgeMarginMm` in from the edges. Both MaxRects heuristics the library offers
 * (best area fit, best short side fit) are tried and the one using fewer sheets (then fuller early
 * sheets) kept. Used area counts each piece's `areaMm2`.
 * @throws GeometryInputError for a piece that cannot fit the sheet (either way round, grain allowing)
 *   or a size, kerf or margin that is negative or not finite.
 */
export function nestingOnSheets(pieces: readonly NestingPiece[], options: NestingOptions = {}): Nesting {
  const sheet = options.sheet ?? DEFAULT_SHEET;
  const kerf = options.kerfMm ?? DEFAULT_KERF_MM;
  const margin = options.edgeMarginMm ?? 0;
  const issues: GeometryIssue[] = [];
  for (const [v, field] of [[sheet.widthMm, 'sheet.widthMm'], [sheet.lengthMm, 'sheet.lengthMm'], [kerf, 'kerfMm'], [margin, 'edgeMarginMm']] as const) {
    if (!Number.isFinite(v) || v < 0 || (field.startsWith('sheet') && v === 0)) issues.push({ code: 'nesting-input', message: `nesting: ${field} must be a finite length${field.startsWith('sheet') ? ' more than 0' : ' of 0 or more'}, found ${v} mm`, field, value: v });
  }
  if (issues.length) throw new GeometryInputError(issues);
  const usableW = sheet.widthMm - 2 * margin;
  const usableL = sheet.lengthMm - 2 * margin;
  pieces.forEach((p, i) => {
    if (!(p.widthMm >= 0 && p.heightMm >= 0 && Number.isFinite(p.widthMm) && Number.isFinite(p.heightMm))) {
      issues.push({ code: 'nesting-piece-size', message: `piece ${p.id}: its size must be finite and not negative, found ${p.widthMm} x ${p.heightMm} mm`, field: `pieces.${i}`, value: p });
      return;
    }
    const tol = POINT_TOLERANCE_MM;
    const upright = p.widthMm <= usableW + tol && p.heightMm <= usableL + tol;
    const turned = p.heightMm <= usableW + tol && p.widthMm <= usableL + tol;
    const fits = p.grain === 'z' ? upright : p.grain === 'y' ? turned : upright || turned;
    if (!fits) {
      const grain = p.grain ? ` with its grain (${p.grain}) along the sheet` : ' either way round';
      issues.push({ code: 'nesting-piece-too-large', message: `piece ${p.id} (${fmt(p.widthMm)} x ${fmt(p.heightMm)} mm) does not fit a ${fmt(sheet.widthMm)} x ${fmt(sheet.lengthMm)} mm sheet${grain}${margin > 0 ? ` inside a ${fmt(margin)} mm margin` : ''}; split it at a butt block first`, field: `pieces.${i}`, value: p.id });
    }
  });
  if (issues.length) throw new GeometryInputError(issues);

  let best: PackedRect[][] | null = null;
  for (const logic of [maxrects.PACKING_LOGIC.MAX_AREA, maxrects.PACKING_LOGIC.MAX_EDGE]) {
    const bins = pack(pieces, usableW, usableL, kerf, logic);
    if (best === null || bins.length < best.length || (bins.length === best.length && fuller(bins, best, pieces))) best = bins;
  }
  const sheetAreaOne = sheet.widthMm * sheet.lengthMm;
  const sheets = (best ?? []).map((rects, index): NestedSheet => {
    const placements = rects.map((r): NestedPlacement => {
      const p = pieces[r.data.index]!;
      // A piece fed in turned (grain y) and not turned again by the packer is turned on the sheet.
      const fedTurned = p.grain === 'y';
      const rotated = fedTurned !== r.rot;
      return { id: p.id, x: r.x + margin, y: r.y + margin, widthMm: rotated ? p.heightMm : p.widthMm, lengthMm: rotated ? p.widthMm : p.heightMm, rotated };
    });
    const usedAreaMm2 = rects.reduce((a, r) => a + areaOf(pieces[r.data.index]!), 0);
    return { index, placements, usedAreaMm2, yield: usedAreaMm2 / sheetAreaOne };
  });
  const usedAreaMm2 = sheets.reduce((a, s) => a + s.usedAreaMm2, 0);
  const sheetAreaMm2 = sheets.length * sheetAreaOne;
  return { sheet, kerfMm: kerf, sheets, usedAreaMm2, sheetAreaMm2, yield: sheetAreaMm2 === 0 ? 0 : usedAreaMm2 / sheetAreaMm2 };
}

const fmt = (v: number): string => String(Number(v.toFixed(1)));
const areaOf = (p: NestingPiece): number => p.areaMm2 ?? p.widthMm * p.heightMm;

function pack(pieces: readonly NestingPiece[], w: number, l: number, kerf: number, logic: number): PackedRect[][] {
  // Padding is kept between rectangles only, not at the sheet's edge, which is what a kerf is.
  const packer = new maxrects.MaxRectsPacker(w, l, kerf, { smart: false, pot: false, square: false, allowRotation: true, border: 0, logic });
  const rects = pieces.map((p, index) => {
    const turned = p.grain === 'y';
    const r = new maxrects.Rectangle(turned ? p.heightMm : p.widthMm, turned ? p.widthMm : p.heightMm, 0, 0, false, p.grain ? false : undefined);
    r.data = { index };
    return r;
  });
  packer.addArray(rects);
  return packer.bins.map((b) => b.rects);
}

/** True when `a`'s sheets are fuller toward the front than `b`'s (the last sheet the emptier: an offcut kept). */
function fuller(a: PackedRect[][], b: PackedRect[][], pieces: readonly NestingPiece[]): boolean {
  const last = (bins: PackedRect[][]): number => (bins[bins.length - 1] ?? []).reduce((s, r) => s + areaOf(pieces[r.data.index]!), 0);
  return last(a) < last(b);
}

/** Nesting pieces from shapes: each shape's bounding box and true area, with its grain. */
export function nestingPiecesOfShapes(shapes: readonly { id: string; shape: Shape; grain?: 'y' | 'z' | null }[]): NestingPiece[] {
  return shapes.map(({ id, shape, grain }) => {
    const b = polygonBounds(shape.outer) ?? { minY: 0, maxY: 0, minZ: 0, maxZ: 0 };
    return { id, widthMm: b.maxY - b.minY, heightMm: b.maxZ - b.minZ, areaMm2: shapeArea(shape), grain: grain ?? null };
  });
}

/**
 * A shape moved to where its placement put it, in sheet coordinates (returned as y = across the sheet,
 * z = along it, so polygon functions apply): its box's corner at (x, y); turned a quarter turn
 * (counter-clockwise, never mirrored) when `rotated`.
 */
export function nestingPlacedShape(shape: Shape, placement: NestedPlacement): Shape {
  const b = polygonBounds(shape.outer) ?? { minY: 0, maxY: 0, minZ: 0, maxZ: 0 };
  const move = (p: { y: number; z: number }): { y: number; z: number } =>
    placement.rotated ? { y: placement.x + (b.maxZ - p.z), z: placement.y + (p.y - b.minY) } : { y: placement.x + (p.y - b.minY), z: placement.y + (p.z - b.minZ) };
  return { outer: shape.outer.map(move), holes: shape.holes.map((h) => h.map(move)) };
}
