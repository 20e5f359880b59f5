import type { Bounds } from './polygon';
import type { GeometryIssue, SectionPoint } from './types';

/**
 * A part's template as the writers need it (PDF, DXF, the Print shop preview): plain JSON, millimetres in
 * the section plane (y across from the centreline, starboard positive; z up from the baseline), angles in
 * degrees because they are only read by people and written to files.
 *
 * The coordinates are those of the section plane whichever face is marked; `drawingAsSeen` turns them into
 * the view of the marked face (mirrored for the forward face, which is looked at from forward), the view
 * every writer prints and cuts. No Node API, no PDF or DXF library here: the browser uses it as it is.
 */

/** Units of the labels and of an inch DXF; the geometry itself is always millimetres. */
export type DrawingUnits = 'mm' | 'in';
/** A face of a frame. */
export type DrawingFace = 'forward' | 'aft';

/**
 * What a path is for: `outer-cut` and `inner-cut` are cut (inner: the inner edge of a ring frame,
 * openings, limbers), `other-face` is the outline of the face away from the pattern (drawn dashed),
 * the rest are lines and marks drawn on the template.
 */
export type DrawingPathRole =
  | 'outer-cut'
  | 'inner-cut'
  | 'other-face'
  | 'centreline'
  | 'level-line'
  | 'waterline'
  | 'set-up-line'
  | 'grain'
  | 'notch'
  | 'mark';

/** Roles whose paths are cut: each must be one closed loop. */
export const CUT_ROLES: readonly DrawingPathRole[] = ['outer-cut', 'inner-cut'];

/**
 * A polyline: vertices in order; `closed` joins the last back to the first (the first point is not
 * repeated). `bulges[i]`, when given, bends segment i (points[i] to points[i + 1], or to points[0] for the
 * closing segment) into a circular arc, DXF style: tan(included angle / 4), positive counter-clockwise
 * (y to the right, z up), 0 straight. A `grain` polyline is drawn as an arrow along its two points.
 */
export interface DrawingPolyline {
  kind: 'polyline';
  role: DrawingPathRole;
  points: SectionPoint[];
  closed: boolean;
  bulges?: number[];
}

/** A full circle (a limber hole, a round opening), mm. */
export interface DrawingCircle {
  kind: 'circle';
  role: DrawingPathRole;
  centre: SectionPoint;
  radiusMm: number;
}

/** A circular arc, counter-clockwise from `startDeg` to `endDeg` (degrees from +y toward +z), mm. */
export interface DrawingArc {
  kind: 'arc';
  role: DrawingPathRole;
  centre: SectionPoint;
  radiusMm: number;
  startDeg: number;
  endDeg: number;
}

export type DrawingPath = DrawingPolyline | DrawingCircle | DrawingArc;

/** What a label says, so that a writer can choose its layer, weight or place. */
export type DrawingLabelPurpose = 'station' | 'face' | 'fillet' | 'line' | 'note';

/**
 * A text label: `anchor` on its baseline (at its start, centre or end per `align`), `heightMm` the height
 * of its capitals, `rotationDeg` counter-clockwise from +y.
 */
export interface DrawingLabel {
  anchor: SectionPoint;
  text: string;
  heightMm: number;
  rotationDeg: number;
  align: 'start' | 'centre' | 'end';
  purpose: DrawingLabelPurpose;
}

/** Which way the saw table (or the blade) tilts, as a person at the saw is told. */
export type BevelTiltDirection = 'toward-centreline' | 'away-from-centreline' | 'none';
/** The words for each tilt direction, as printed. */
export const TILT_DIRECTION_WORDS: Readonly<Record<BevelTiltDirection, string>> = {
  'toward-centreline': 'tilt toward the centreline',
  'away-from-centreline': 'tilt away from the centreline',
  none: 'square',
};

/**
 * A bevel mark on the template: where on the edge (`at`, mm), the unit normal to the edge pointing into
 * the part (`inward`: the tick and the reading are drawn that way), the girth (mm along the edge from the
 * centreline), the saw tilt from square and what a sliding bevel set from the marked face reads (degrees:
 * 90 - tilt under, 90 + tilt standing; common practice), which face is the larger (it goes down on the
 * saw table; null when square) and whether the tilt is past the saw's limit.
 */
export interface DrawingBevelMark {
  markNo: number;
  at: SectionPoint;
  inward: SectionPoint;
  girthMm: number;
  side: 'port' | 'starboard' | 'centreline';
  sawTiltDeg: number;
  slidingBevelDeg: number;
  kind: 'under' | 'standing' | 'square';
  tiltDirection: BevelTiltDirection;
  largerFace: DrawingFace | null;
  overSawLimit: boolean;
}

/** The centre of a notch (for a longitudinal) or of a limber hole, marked with a cross and its label. */
export interface DrawingCentreMark {
  kind: 'notch' | 'limber';
  at: SectionPoint;
  label: string;
}

/** One long dimension to check on the taped-up pattern (and on the cut part): two points and the length (mm). */
export interface DrawingCheckDimension {
  from: SectionPoint;
  to: SectionPoint;
  lengthMm: number;
}

/**
 * The title block. `layerIndex` counts from 1 (the layer on the marked face); `face` is the face this
 * pattern is laid on and marked; `date` is ISO 8601 (yyyy-mm-dd); `units` are those of the labels.
 */
export interface DrawingTitle {
  hullName: string;
  partName: string;
  /** The part's kind in words: "ring frame", "bulkhead", ... */
  partKind: string;
  stationName: string;
  layerIndex: number;
  layerCount: number;
  plyThicknessMm: number;
  face: DrawingFace;
  revisionId: string;
  date: string;
  units: DrawingUnits;
  /** The clearance left for the epoxy fillet (mm), or null when none was left. */
  filletClearanceMm: number | null;
}

/** A part's template for one ply layer. */
export interface TemplateDrawing {
  title: DrawingTitle;
  paths: DrawingPath[];
  labels: DrawingLabel[];
  bevelMarks: DrawingBevelMark[];
  centres: DrawingCentreMark[];
  checkDimension: DrawingCheckDimension | null;
}

/**
 * A piece of plywood in the cut list: one piece of one layer of one part. Sizes are its bounding box in
 * the section plane (mm, y across by z up), area its true area (mm^2), mass kg. `outline`, when given, is
 * drawn on the sheet layout; `grain` as in nesting (which of y or z must run along the sheet, null: free).
 */
export interface CutListPiece {
  partName: string;
  partKind: string;
  layerIndex: number;
  pieceNo: number;
  plyThicknessMm: number;
  widthMm: number;
  heightMm: number;
  areaMm2: number;
  massKg: number;
  grain?: 'y' | 'z' | null;
  outline?: { outer: SectionPoint[]; holes: SectionPoint[][] };
}

/** One row of the bevel table, as read at the saw. Lengths mm, angles degrees. */
export interface BevelRow {
  partName: string;
  stationName: string;
  layerIndex: number;
  markNo: number;
  girthMm: number;
  side: DrawingBevelMark['side'];
  sawTiltDeg: number;
  slidingBevelDeg: number;
  kind: DrawingBevelMark['kind'];
  tiltDirection: BevelTiltDirection;
  /** The face that goes down on the saw table (the larger), null when square. */
  faceDown: DrawingFace | null;
  overSawLimit: boolean;
}

// ---------------------------------------------------------------------------------------------------
// Geometry of paths

/** Default chord tolerance (mm) when an arc is drawn as straight pieces: well under what a print shows. */
export const DRAWING_CHORD_TOLERANCE_MM = 0.01;

const TAU = 2 * Math.PI;
const toRad = (d: number): number => (d * Math.PI) / 180;

/** The circle an arc segment with a bulge lies on: centre, radius, start angle (rad) and signed sweep (rad). */
export function bulgeArc(a: SectionPoint, b: SectionPoint, bulge: number): { centre: SectionPoint; radiusMm: number; startRad: number; sweepRad: number } | null {
  const c = Math.hypot(b.y - a.y, b.z - a.z);
  if (bulge === 0 || c === 0) return null;
  const dy = (b.y - a.y) / c;
  const dz = (b.z - a.z) / c;
  // Centre off the chord's midpoint along its left normal: (c / 2)(1 - bulge^2) / (2 bulge); a positive
  // bulge runs counter-clockwise, so its centre is on the left of the chord.
  const off = ((c / 2) * (1 - bulge * bulge)) / (2 * bulge);
  const centre = { y: (a.y + b.y) / 2 - dz * off, z: (a.z + b.z) / 2 + dy * off };
  const radiusMm = (c * (1 + bulge * bulge)) / (4 * Math.abs(bulge));
  return { centre, radiusMm, startRad: Math.atan2(a.z - centre.z, a.y - centre.y), sweepRad: 4 * Math.atan(bulge) };
}

/** Number of chords so that an arc of `radiusMm` over `sweepRad` stays within `toleranceMm` of its chords. */
function chordCount(radiusMm: number, sweepRad: number, toleranceMm: number): number {
  const t = Math.min(toleranceMm, radiusMm);
  const step = 2 * Math.acos(1 - t / radiusMm);
  return Math.max(1, Math.ceil(Math.abs(sweepRad) / (step > 0 ? step : 1e-3)));
}

function arcPoints(centre: SectionPoint, r: number, startRad: number, sweepRad: number, toleranceMm: number, withStart: boolean): SectionPoint[] {
  const n = chordCount(r, sweepRad, toleranceMm);
  const out: SectionPoint[] = [];
  for (let i = withStart ? 0 : 1; i <= n; i++) {
    const t = startRad + (sweepRad * i) / n;
    out.push({ y: centre.y + r * Math.cos(t), z: centre.z + r * Math.sin(t) });
  }
  return out;
}

/**
 * A path as straight pieces: its points in order and whether the last joins the first. Arcs (and bulged
 * segments) are divided so that no chord strays more than `toleranceMm` from the true arc.
 */
export function drawingPathPoints(path: DrawingPath, toleranceMm: number = DRAWING_CHORD_TOLERANCE_MM): { points: SectionPoint[]; closed: boolean } {
  if (path.kind === 'circle') {
    const pts = arcPoints(path.centre, path.radiusMm, 0, TAU, toleranceMm, true);
    pts.pop();
    return { points: pts, closed: true };
  }
  if (path.kind === 'arc') {
    const start = toRad(path.startDeg);
    return { points: arcPoints(path.centre, path.radiusMm, start, arcSweep(path.startDeg, path.endDeg), toleranceMm, true), closed: false };
  }
  const bulges = path.bulges;
  if (!bulges || bulges.every((b) => b === 0)) return { points: path.points, closed: path.closed };
  const out: SectionPoint[] = [];
  const n = path.points.length;
  const segments = path.closed ? n : n - 1;
  for (let i = 0; i < segments; i++) {
    const a = path.points[i]!;
    const b = path.points[(i + 1) % n]!;
    if (i === 0) out.push(a);
    const arc = bulgeArc(a, b, bulges[i] ?? 0);
    if (arc) out.push(...arcPoints(arc.centre, arc.radiusMm, arc.startRad, arc.sweepRad, toleranceMm, false));
    else out.push(b);
  }
  // A closed path came back to its first point: that point is implied, not repeated.
  if (path.closed) out.pop();
  return { points: out, closed: path.closed };
}

/** Counter-clockwise sweep (rad, in (0, 2 pi]) of an arc from `startDeg` to `endDeg`. */
export function arcSweep(startDeg: number, endDeg: number): number {
  let s = toRad(endDeg - startDeg) % TAU;
  if (s <= 0) s += TAU;
  return s;
}

/** Grow `b` by the exact extremes of an arc (centre, radius, start, signed sweep). */
function growByArc(b: Bounds, centre: SectionPoint, r: number, startRad: number, sweepRad: number): void {
  const grow = (t: number): void => {
    const y = centre.y + r * Math.cos(t);
    const z = centre.z + r * Math.sin(t);
    b.minY = Math.min(b.minY, y);
    b.maxY = Math.max(b.maxY, y);
    b.minZ = Math.min(b.minZ, z);
    b.maxZ = Math.max(b.maxZ, z);
  };
  const lo = sweepRad >= 0 ? startRad : startRad + sweepRad;
  const hi = sweepRad >= 0 ? startRad + sweepRad : startRad;
  grow(lo);
  grow(hi);
  // The arc reaches a quadrant point (0, 90, 180, 270 degrees) when that angle lies within its sweep.
  for (let k = Math.ceil(lo / (Math.PI / 2)); k * (Math.PI / 2) <= hi; k++) grow(k * (Math.PI / 2));
}

const emptyBounds = (): Bounds => ({ minY: Infinity, minZ: Infinity, maxY: -Infinity, maxZ: -Infinity });

/** Exact bounding box (mm) of one path, arcs and bulges included. */
export function drawingPathBounds(path: DrawingPath): Bounds {
  const b = emptyBounds();
  if (path.kind === 'circle') {
    return { minY: path.centre.y - path.radiusMm, maxY: path.centre.y + path.radiusMm, minZ: path.centre.z - path.radiusMm, maxZ: path.centre.z + path.radiusMm };
  }
  if (path.kind === 'arc') {
    growByArc(b, path.centre, path.radiusMm, toRad(path.startDeg), arcSweep(path.startDeg, path.endDeg));
    return b;
  }
  const n = path.points.length;
  for (const p of path.points) {
    b.minY = Math.min(b.minY, p.y);
    b.maxY = Math.max(b.maxY, p.y);
    b.minZ = Math.min(b.minZ, p.z);
    b.maxZ = Math.max(b.maxZ, p.z);
  }
  const segments = path.closed ? n : n - 1;
  for (let i = 0; path.bulges && i < segments; i++) {
    const arc = bulgeArc(path.points[i]!, path.points[(i + 1) % n]!, path.bulges[i] ?? 0);
    if (arc) growByArc(b, arc.centre, arc.radiusMm, arc.startRad, arc.sweepRad);
  }
  return b;
}

/**
 * Bounding box (mm) of a drawing's paths (all roles, or those in `roles`), or null when it has none.
 * Labels are not counted: the extents are those of the lines, which is what is cut and tiled.
 */
export function drawingBounds(drawing: Pick<TemplateDrawing, 'paths'>, roles?: readonly DrawingPathRole[]): Bounds | null {
  const b = emptyBounds();
  for (const p of drawing.paths) {
    if (roles && !roles.includes(p.role)) continue;
    const q = drawingPathBounds(p);
    b.minY = Math.min(b.minY, q.minY);
    b.maxY = Math.max(b.maxY, q.maxY);
    b.minZ = Math.min(b.minZ, q.minZ);
    b.maxZ = Math.max(b.maxZ, q.maxZ);
  }
  return Number.isFinite(b.minY) ? b : null;
}

// ---------------------------------------------------------------------------------------------------
// Views

type PointMap = (p: SectionPoint) => SectionPoint;

function drawingMapped(d: TemplateDrawing, map: PointMap, mirror: boolean, turnDeg: number): TemplateDrawing {
  const dir = (v: SectionPoint): SectionPoint => {
    const o = map({ y: 0, z: 0 });
    const t = map(v);
    return { y: t.y - o.y, z: t.z - o.z };
  };
  const angle = (a: number): number => (mirror ? 180 - a : a) + turnDeg;
  const paths = d.paths.map((p): DrawingPath => {
    if (p.kind === 'circle') return { ...p, centre: map(p.centre) };
    if (p.kind === 'arc') {
      // A mirror turns a counter-clockwise arc clockwise: swap its ends to keep it counter-clockwise.
      return mirror ? { ...p, centre: map(p.centre), startDeg: angle(p.endDeg), endDeg: angle(p.startDeg) } : { ...p, centre: map(p.centre), startDeg: angle(p.startDeg), endDeg: angle(p.endDeg) };
    }
    const out: DrawingPolyline = { ...p, points: p.points.map(map) };
    if (p.bulges) out.bulges = mirror ? p.bulges.map((b) => -b) : [...p.bulges];
    return out;
  });
  const labels = d.labels.map((l): DrawingLabel => {
    // Text is never mirrored: a mirrored label keeps reading left to right, so it runs the other way from
    // its anchor, and its alignment swaps ends.
    const rotationDeg = mirror ? -l.rotationDeg + turnDeg : l.rotationDeg + turnDeg;
    const align = mirror ? (l.align === 'start' ? 'end' : l.align === 'end' ? 'start' : 'centre') : l.align;
    return { ...l, anchor: map(l.anchor), rotationDeg, align };
  });
  return {
    title: d.title,
    paths,
    labels,
    bevelMarks: d.bevelMarks.map((m) => ({ ...m, at: map(m.at), inward: dir(m.inward) })),
    centres: d.centres.map((c) => ({ ...c, at: map(c.at) })),
    checkDimension: d.checkDimension ? { ...d.checkDimension, from: map(d.checkDimension.from), to: map(d.checkDimension.to) } : null,
  };
}

/**
 * True when the view of the marked face is the section plane mirrored: the forward face is looked at
 * from forward (looking aft), where starboard (+y) is on the left.
 */
export function drawingViewMirrored(title: Pick<DrawingTitle, 'face'>): boolean {
  return title.face === 'forward';
}

/**
 * The drawing as seen looking at its marked face, the view every writer prints and cuts: the section plane
 * as it is for the aft face, mirrored across the centreline (y to -y) for the forward face. Labels keep
 * reading left to right.
 */
export function drawingAsSeen(d: TemplateDrawing): TemplateDrawing {
  if (!drawingViewMirrored(d.title)) return d;
  return drawingMapped(d, (p) => ({ y: -p.y, z: p.z }), true, 0);
}

/** The drawing turned a quarter turn counter-clockwise about the origin (to lie along a roll of paper). */
export function drawingTurned(d: TemplateDrawing): TemplateDrawing {
  return drawingMapped(d, (p) => ({ y: -p.z, z: p.y }), false, 90);
}

// ---------------------------------------------------------------------------------------------------
// Checks and words

/** How far a check dimension's stated length may differ from the distance between its points (mm). */
export const CHECK_DIMENSION_TOLERANCE_MM = 0.05;

/**
 * Everything that would make a drawing unfit to print or cut (empty when fit): numbers not finite, a cut
 * path that is not one closed loop, a polyline with too few points or bulges that do not match its
 * segments, a radius not more than 0, a check dimension whose length is not the distance between its
 * points, a layer outside 1..count.
 */
export function drawingIssues(d: TemplateDrawing): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  const bad = (p: SectionPoint): boolean => !Number.isFinite(p.y) || !Number.isFinite(p.z);
  const add = (code: string, message: string, field: string, value?: unknown): void => {
    issues.push({ code, message: `${d.title.partName}: ${message}`, field, value });
  };
  d.paths.forEach((p, i) => {
    const field = `paths.${i}`;
    const cut = CUT_ROLES.includes(p.role);
    if (p.kind === 'polyline') {
      if (p.points.some(bad)) add('drawing-not-finite', `a point of path ${i} (${p.role}) is not finite`, field);
      const need = p.closed ? 3 : 2;
      if (p.points.length < need) add('drawing-path-points', `path ${i} (${p.role}) has ${p.points.length} points, a ${p.closed ? 'closed' : 'open'} path needs ${need}`, field);
      const segments = p.closed ? p.points.length : p.points.length - 1;
      if (p.bulges && (p.bulges.length !== segments || p.bulges.some((b) => !Number.isFinite(b)))) add('drawing-bulges', `path ${i} (${p.role}) has ${p.bulges.length} bulges for ${segments} segments`, field);
      if (cut && !p.closed) add('drawing-cut-open', `cut path ${i} (${p.role}) is open: a cut must be one closed loop`, field);
    } else {
      if (bad(p.centre) || !Number.isFinite(p.radiusMm)) add('drawing-not-finite', `path ${i} (${p.role}) has a centre or radius that is not finite`, field);
      if (!(p.radiusMm > 0)) add('drawing-radius', `path ${i} (${p.role}) has radius ${p.radiusMm} mm: it must be more than 0`, field);
      if (p.kind === 'arc' && (!Number.isFinite(p.startDeg) || !Number.isFinite(p.endDeg))) add('drawing-not-finite', `arc ${i} has an angle that is not finite`, field);
      if (p.kind === 'arc' && cut) add('drawing-cut-open', `cut path ${i} (${p.role}) is an open arc: a cut must be one closed loop`, field);
    }
  });
  d.labels.forEach((l, i) => {
    if (bad(l.anchor) || !(l.heightMm > 0) || !Number.isFinite(l.rotationDeg)) add('drawing-label', `label ${i} ("${l.text}") needs a finite anchor and rotation and a height more than 0`, `labels.${i}`);
  });
  d.bevelMarks.forEach((m, i) => {
    const len = Math.hypot(m.inward.y, m.inward.z);
    if (bad(m.at) || Math.abs(len - 1) > 1e-3) add('drawing-bevel-mark', `bevel mark ${m.markNo} needs a finite point and a unit inward normal (length ${len})`, `bevelMarks.${i}`);
    if (![m.girthMm, m.sawTiltDeg, m.slidingBevelDeg].every(Number.isFinite)) add('drawing-not-finite', `bevel mark ${m.markNo} has a number that is not finite`, `bevelMarks.${i}`);
  });
  d.centres.forEach((c, i) => {
    if (bad(c.at)) add('drawing-not-finite', `the ${c.kind} centre "${c.label}" is not finite`, `centres.${i}`);
  });
  const cd = d.checkDimension;
  if (cd) {
    const dist = Math.hypot(cd.to.y - cd.from.y, cd.to.z - cd.from.z);
    if (bad(cd.from) || bad(cd.to) || !(Math.abs(dist - cd.lengthMm) <= CHECK_DIMENSION_TOLERANCE_MM)) {
      add('drawing-check-dimension', `the check dimension says ${cd.lengthMm} mm but its points are ${Number(dist.toFixed(3))} mm apart`, 'checkDimension', cd.lengthMm);
    }
  }
  const t = d.title;
  if (!(Number.isInteger(t.layerIndex) && Number.isInteger(t.layerCount) && t.layerIndex >= 1 && t.layerIndex <= t.layerCount)) add('drawing-layer', `layer ${t.layerIndex} of ${t.layerCount} is not a layer of the part`, 'title.layerIndex', t.layerIndex);
  if (!(t.plyThicknessMm > 0)) add('drawing-ply', `the ply thickness must be more than 0 mm, found ${t.plyThicknessMm}`, 'title.plyThicknessMm', t.plyThicknessMm);
  return issues;
}

const MM_PER_INCH = 25.4;

/**
 * A length as printed: millimetres to 0.1 mm ("1234.5 mm"), or inches to the nearest 1/32 in reduced
 * ("48 19/32 in", "-3/4 in"), as a rule reads.
 */
export function lengthLabel(lengthMm: number, units: DrawingUnits): string {
  if (units === 'mm') return `${(Math.round(lengthMm * 10) / 10).toFixed(1)} mm`;
  const sign = lengthMm < 0 ? '-' : '';
  const n32 = Math.round((Math.abs(lengthMm) / MM_PER_INCH) * 32);
  const whole = Math.floor(n32 / 32);
  let num = n32 % 32;
  let den = 32;
  while (num > 0 && num % 2 === 0) {
    num /= 2;
    den /= 2;
  }
  if (num === 0) return `${sign}${whole} in`;
  return whole === 0 ? `${sign}${num}/${den} in` : `${sign}${whole} ${num}/${den} in`;
}

/** An angle as printed: degrees to 0.1 ("12.5°"). */
export function degreesLabel(deg: number): string {
  return `${(Math.round(deg * 10) / 10).toFixed(1)}°`;
}

/** The bevel table rows of a drawing, in mark order. */
export function bevelRowsOf(d: TemplateDrawing): BevelRow[] {
  return [...d.bevelMarks]
    .sort((a, b) => a.markNo - b.markNo)
    .map((m) => ({
      partName: d.title.partName,
      stationName: d.title.stationName,
      layerIndex: d.title.layerIndex,
      markNo: m.markNo,
      girthMm: m.girthMm,
      side: m.side,
      sawTiltDeg: m.sawTiltDeg,
      slidingBevelDeg: m.slidingBevelDeg,
      kind: m.kind,
      tiltDirection: m.tiltDirection,
      faceDown: m.largerFace,
      overSawLimit: m.overSawLimit,
    }));
}
