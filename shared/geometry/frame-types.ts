import type { BevelMark, BevelSummary, FrameFace } from './bevel';
import type { HullEstimate, PartEstimate } from './estimate';
import type { PartIssue, PartKind } from './part-schema';
import type { Bounds } from './polygon';
import type { SectionPoint } from './types';

/**
 * What `frameOfPart` and `framesOfPlan` return: every transverse part as plain JSON (no classes, no
 * functions), ready for the canvas editor and the exports (tiled PDF, DXF, bevel table, cut list) to use
 * without computing anything again.
 *
 * Coordinates are template coordinates in millimetres: y across (starboard positive), z up. For every part
 * cut in a station plane (x = const) they are the section plane itself (z above the baseline). For a raked
 * transom they are its true (expanded) shape: y as in the hull, z measured along the transom's face from
 * its pivot line, so that z = pivotZ + (height - pivotZ) / cos(rake) (see transom.ts).
 *
 * Loops: a loop is its vertices in order and is closed: the last vertex joins back to the first, which is
 * NOT repeated. Outer loops run counter-clockwise (positive area with y right and z up), holes clockwise.
 * Curves are flattened to within `chordToleranceMm` of the true curve.
 */

/** One piece of material: an outer loop (counter-clockwise) and its holes (clockwise). */
export interface PartRegion {
  outer: SectionPoint[];
  holes: SectionPoint[][];
}

/** A straight cut across a layer (mm, template coordinates). */
export interface PartCut {
  from: SectionPoint;
  to: SectionPoint;
}

/** A layer in pieces (pieces.ts): joints staggered against the neighbouring layers, sheet-sized pieces. */
export interface LayerPiecesGeometry {
  /** Every piece the layer is cut as (all regions of the layer together). */
  pieces: PartRegion[];
  /** The joints between pieces of the layer: girth (mm, along the girth edge, port negative) and the cut. */
  joints: (PartCut & { girthMm: number })[];
  /** Butt joints where a piece larger than the sheet was split, and the butt blocks over them. */
  buttJoints: PartCut[];
  buttBlocks: PartRegion[];
}

/**
 * One layer (lamination) of a part. Layer 0 lies on the marked face; layers are stacked away from it.
 * `regions` is the layer at its near face (the face toward the marked face), `otherFaceRegions` at its far
 * face; each is the outline at its own x (station parts), its own plane (transom) or its own depth with the
 * readings' bevels (measured frames), with notches, limbers and openings cut.
 */
export interface LayerGeometry {
  index: number;
  thicknessMm: number;
  material: 'plywood' | 'timber';
  /** Depths (mm) of the near and far faces from the marked face: nearDepthMm < farDepthMm. */
  nearDepthMm: number;
  farDepthMm: number;
  /**
   * x (mm) of the near and far faces: the station plane each is cut at. For a transom, where the face's
   * plane crosses the pivot height; for a measured frame, the frame's x plus or minus the depth.
   */
  faceX: number;
  otherFaceX: number;
  /** One region for every kind except a pair of half beams (two). */
  regions: PartRegion[];
  otherFaceRegions: PartRegion[];
  /** The larger face (by area): the one to mark and cut to, so that the saw leaves under bevels. */
  largerFace: 'near' | 'far';
  pieces: LayerPiecesGeometry;
}

/** Which side of the centreline a mark lies on. */
export type PartSide = 'port' | 'starboard';

/**
 * A bevel mark on the marked face's edge (bevel.ts `BevelMark`, for the whole siding of the part), with the
 * side it is on and `girthMm` signed: from the centreline, starboard positive, port negative. On the hull
 * edge the girth is along the moulded section from the keel; on the deck edge (`edge: 'deck'`) along the
 * deck from the centreline; on a transom or a measured frame along its own edge.
 */
export interface PartBevelMark extends BevelMark {
  side: PartSide;
  /** The tilt passes the part's saw limit (the part's `bevelMarks.sawTiltLimitRad`). */
  overLimit: boolean;
}

/** A level line drawn across the template. */
export interface PartLevelLine {
  /** Height (mm above the baseline) in the hull. */
  heightMm: number;
  /** Where it is drawn in template coordinates (the same as the height except on a transom). */
  templateZ: number;
  /** Its ends: where it leaves the part's outline (or the part's width when it misses the part). */
  from: SectionPoint;
  to: SectionPoint;
  /** False when the height lies above or below the part (the line is drawn across its width all the same). */
  crossesPart: boolean;
}

/** A notch for a longitudinal on the marked face. */
export interface NotchGeometry {
  longitudinalId: string;
  name: string;
  side: PartSide | 'centreline';
  /** Centre of the notch on the skin (or deck) side: the moulded point, set in by the skin. */
  centre: SectionPoint;
  /** Width along the edge (mm): the longitudinal's width / cos(crossing angle). */
  widthMm: number;
  /** Depth (mm) of the notch floor below the part's edge, measured in the station plane. */
  depthMm: number;
  /** Angle (rad) between the longitudinal and the normal to the part's plane, in the skin's tangent plane. */
  crossingAngleRad: number;
  against: 'skin' | 'deck';
}

/** A limber hole on the marked face. */
export interface LimberGeometry {
  side: PartSide;
  centre: SectionPoint;
  radiusMm: number;
  /** Girth (mm) along the outer edge from the centreline, starboard positive. */
  girthMm: number;
}

/** Reference marks for the template of the marked face. */
export interface PartTemplateMarks {
  /** The centreline from below the part to above it (y = 0). */
  centreline: PartCut;
  /** The level reference line: the part's own, else the design waterline where it crosses, else mid-height. */
  levelLine: PartLevelLine;
  /** The design waterline (`lines.designWaterlineZ`), or null when the hull has none. */
  designWaterline: PartLevelLine | null;
  /** The set-up line (`marks.setUpLineZ` of the part), or null. */
  setUpLine: PartLevelLine | null;
  stationName: string | null;
  /** e.g. "Frame 3, St 3, forward face". */
  faceLabel: string;
  markedFace: FrameFace;
  /** The face grain of the ply, an arrow across the part (null: no preference). */
  grain: (PartCut & { direction: 'y' | 'z' }) | null;
  notchCentres: SectionPoint[];
  limberCentres: SectionPoint[];
}

/** One long dimension to check the taped-up template against: the widest level line across the part. */
export interface CheckDimension {
  from: SectionPoint;
  to: SectionPoint;
  lengthMm: number;
}

/** How the transom was cut and expanded (null for every other kind). */
export interface TransomInfo {
  rakeRad: number;
  pivotZ: number;
  /** Lines carried on past the hull's last (or first) station to reach the transom, mm of x; 0 when not needed. */
  linesExtendedMm: number;
}

/** A part worked out. */
export interface PartGeometry {
  partId: string;
  name: string;
  kind: PartKind;
  stationId: string | null;
  stationName: string | null;
  markedFace: FrameFace;
  /** Whether the marked face was stated or chosen (`auto`: toward the larger section). */
  markedFaceFrom: 'stated' | 'auto';
  /** x (mm) of the marked face and the other face (see `LayerGeometry.faceX`). */
  markedFaceX: number;
  otherFaceX: number;
  /** +1 when the part's thickness runs from the marked face toward larger x, -1 toward smaller x. */
  thicknessDirection: 1 | -1;
  thicknessMm: number;
  /** Template coordinates: a station plane, the transom's expanded plane, or a measured frame's plane. */
  plane: 'station' | 'transom-expanded' | 'measured';
  transom: TransomInfo | null;
  chordToleranceMm: number;
  /** Box (mm) of the marked face's outline, for fitting the drawing. */
  bounds: Bounds;
  /** Layer 0 lies on the marked face. */
  layers: LayerGeometry[];
  /** Along the edges against the skin and the deck, port and starboard, in order of signed girth per edge. */
  bevelMarks: PartBevelMark[];
  bevelSummary: BevelSummary & { overLimit: number; sawTiltLimitRad: number };
  notches: NotchGeometry[];
  limbers: LimberGeometry[];
  marks: PartTemplateMarks;
  checkDimension: CheckDimension | null;
  estimate: PartEstimate;
  /** Things the builder should know that did not stop the part (a tilt past the saw, a flipped face...). */
  warnings: PartIssue[];
}

/** The outcome for one part: its geometry, or the issues that stopped it (each naming the part and field). */
export type PartResult =
  | { ok: true; partId: string; part: PartGeometry }
  | { ok: false; partId: string; name: string; kind: PartKind; issues: PartIssue[] };

/** Every part of a plan. */
export interface PlanFrames {
  /** Problems with the hull's lines: while there are any, no part is built (each part then fails with them). */
  hullIssues: PartIssue[];
  /** Problems across parts (duplicate ids, references to lines or longitudinals that do not exist). */
  planIssues: PartIssue[];
  /** One result per part, in the plan's order. */
  parts: PartResult[];
  /** Totals over the parts that were built. */
  estimate: HullEstimate;
}
