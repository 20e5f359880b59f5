import type { HullLines, Line, Station } from '../../../../shared/geometry/hull-schema';
import type { Section } from '../../../../shared/geometry/section';
import { diagonalDirection, offsetFreedomOf, offsetPointOf, offsetValueFor, type OffsetFreedom, type SectionPlanePoint } from '../editor/offset-actions';
import type { CellValue } from '../editor/cell-actions';
import { boundsOf, type Bounds, type Point } from './viewport';

/**
 * The body plan as plain data: which side of the centreline each station is drawn on, where its offsets
 * lie and how each may move, the reference lines, and snapping. Drawing x is the half-breadth, to the
 * right for forward sections and to the left (negative) for aft ones; drawing y is the height.
 */

/**
 * The side a station's section is drawn on. Rule: a station is forward when it lies on the bow side of
 * midships, midships being halfway between the first and last stations (x grows aft or forward as the
 * hull's `xDirection` says); forward sections go right of the centreline and aft ones left, as the
 * body plan is drawn (common practice). A station within `MIDSHIPS_TOLERANCE_MM` of midships is drawn on
 * both sides, as the midship section commonly is (common practice).
 */
export type BodyPlanSide = 'forward' | 'aft' | 'both';
export const MIDSHIPS_TOLERANCE_MM = 0.5;

export function bodyPlanSideOf(x: number, xMin: number, xMax: number, xDirection: HullLines['xDirection']): BodyPlanSide {
  const mid = (xMin + xMax) / 2;
  if (Math.abs(x - mid) <= MIDSHIPS_TOLERANCE_MM) return 'both';
  const towardBow = xDirection === 'aft' ? x < mid : x > mid;
  return towardBow ? 'forward' : 'aft';
}

export function bodyPlanSides(lines: Pick<HullLines, 'stations' | 'xDirection'>): Map<string, BodyPlanSide> {
  const xs = lines.stations.map((s) => s.x).filter(Number.isFinite);
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs);
  return new Map(lines.stations.map((s) => [s.id, bodyPlanSideOf(s.x, xMin, xMax, lines.xDirection)]));
}

/** The sides a section appears on (the midship section on both). */
export function sidesOf(side: BodyPlanSide): ('forward' | 'aft')[] {
  return side === 'both' ? ['forward', 'aft'] : [side];
}

/** Drawing point (mm) of a section point on a side. */
export function drawingPointOf(p: SectionPlanePoint, side: 'forward' | 'aft'): Point {
  return { x: side === 'aft' ? -p.y : p.y, y: p.z };
}

/** Section point (mm) under a drawing point on a side. */
export function sectionPointOf(p: Point, side: 'forward' | 'aft'): SectionPlanePoint {
  return { y: side === 'aft' ? -p.x : p.x, z: p.y };
}

/** The flattened section as a flat list of drawing coordinates (mm), for a konva Line after mapping. */
export function sectionDrawingPoints(section: Section, side: 'forward' | 'aft'): Point[] {
  return section.vertices.map((v) => drawingPointOf(v, side));
}

/** One offset of a station as the drawing shows and moves it. */
export interface OffsetHandle {
  lineId: string;
  lineName: string;
  stationId: string;
  kind: Line['kind'];
  freedom: OffsetFreedom;
  /** Where it lies (mm). */
  at: SectionPlanePoint;
}

/** Every offset with a value at the station, in the order of the table's lines. */
export function offsetHandlesAt(lines: Pick<HullLines, 'lines'>, stationId: string): OffsetHandle[] {
  const out: OffsetHandle[] = [];
  for (const line of lines.lines) {
    const at = offsetPointOf(line, (line.cells as Record<string, CellValue | undefined>)[stationId]);
    if (at) out.push({ lineId: line.id, lineName: line.name, stationId, kind: line.kind, freedom: offsetFreedomOf(line), at });
  }
  return out;
}

/** Every offset of every station (mm), for snapping to other points. */
export function offsetPointsOf(lines: Pick<HullLines, 'lines' | 'stations'>): { stationId: string; lineId: string; at: SectionPlanePoint }[] {
  const out: { stationId: string; lineId: string; at: SectionPlanePoint }[] = [];
  for (const line of lines.lines) {
    for (const s of lines.stations) {
      const at = offsetPointOf(line, (line.cells as Record<string, CellValue | undefined>)[s.id]);
      if (at) out.push({ stationId: s.id, lineId: line.id, at });
    }
  }
  return out;
}

export interface SnapOptions {
  /** Grid spacing (mm) to snap to; null for no grid. */
  gridMm: number | null;
  /** Other points to line up with; empty for none. */
  points: readonly SectionPlanePoint[];
  /** How near (mm) a point must be to pull the offset to it. */
  toleranceMm: number;
  /** The length the value is rounded to when nothing snaps (mm; the notation's precision). */
  stepMm: number;
}

export interface SnapResult {
  /** Where the offset goes (mm), on its line's direction. */
  at: SectionPlanePoint;
  value: CellValue;
  snapped: 'point' | 'grid' | null;
}

/**
 * Where a dragged offset goes for the pointer at `to` (mm): onto its line's direction; then lined up with
 * the nearest other point within the tolerance (the same half-breadth for a waterline point, the same
 * height for a buttock point, the same distance along for a diagonal, the point itself for a point
 * line); else on the grid when one is set; else rounded to the notation's precision.
 */
export function offsetSnap(line: Line, to: SectionPlanePoint, options: SnapOptions): SnapResult {
  const freedom = offsetFreedomOf(line);
  // The coordinate the cell measures, and the point for a value of it.
  const measure = (p: SectionPlanePoint): number => {
    if (freedom === 'across') return p.y;
    if (freedom === 'up') return p.z;
    if (line.kind === 'diagonal') {
      const d = diagonalDirection(line);
      return p.y * d.y + (p.z - line.originZ) * d.z;
    }
    return 0;
  };
  const result = (value: CellValue, snapped: SnapResult['snapped']): SnapResult => ({ at: offsetPointOf(line, value)!, value, snapped });

  if (freedom === 'free') {
    let best: SectionPlanePoint | null = null;
    let bestD = options.toleranceMm;
    for (const p of options.points) {
      const d = Math.hypot(p.y - to.y, p.z - to.z);
      if (d <= bestD) {
        best = p;
        bestD = d;
      }
    }
    if (best) return result(offsetValueFor(line, best), 'point');
    if (options.gridMm) return result(offsetValueFor(line, to, options.gridMm), 'grid');
    return result(offsetValueFor(line, to, options.stepMm), null);
  }

  const want = measure(to);
  let best: number | null = null;
  let bestD = options.toleranceMm;
  for (const p of options.points) {
    const m = measure(p);
    if (Math.abs(m - want) <= bestD) {
      best = m;
      bestD = Math.abs(m - want);
    }
  }
  const onLine = (m: number): SectionPlanePoint => offsetPointOf(line, m) ?? to;
  if (best !== null) return result(offsetValueFor(line, onLine(best)), 'point');
  if (options.gridMm) return result(offsetValueFor(line, onLine(want), options.gridMm), 'grid');
  return result(offsetValueFor(line, onLine(want), options.stepMm), null);
}

/** Snapping options that snap to nothing: the point goes exactly where it is pushed (on its line's direction). */
const NO_SNAP: SnapOptions = { gridMm: null, points: [], toleranceMm: 0, stepMm: 0 };

/**
 * Where an offset goes when a key pushes it one step (mm) toward `toward` (a unit direction in the section
 * plane): the drag's own rule (`offsetSnap`) takes the push onto the line's direction, and a push at a
 * slant to that direction (an arrow key on a diagonal point) is lengthened to a whole step along it. A push
 * square to the direction (up on a waterline point) leaves the point where it is, as does the centreline.
 */
export function offsetNudge(line: Line, at: SectionPlanePoint, toward: SectionPlanePoint, stepMm: number): SnapResult {
  const first = offsetSnap(line, { y: at.y + toward.y * stepMm, z: at.z + toward.z * stepMm }, NO_SNAP);
  const moved = Math.hypot(first.at.y - at.y, first.at.z - at.z);
  if (moved < 1e-9 || Math.abs(moved - stepMm) < 1e-9) return first;
  const k = stepMm / moved;
  return offsetSnap(line, { y: at.y + (first.at.y - at.y) * k, z: at.z + (first.at.z - at.z) * k }, NO_SNAP);
}

/**
 * A station's offsets in girth order, keel to sheer, as its section's points run (lines crossing at one
 * point keep the table's order among them); offsets the section does not pass through, or all of them
 * when there is no section, follow in the table's order.
 */
export function offsetHandlesByGirth(handles: readonly OffsetHandle[], section: Pick<Section, 'nodes'> | null): OffsetHandle[] {
  const place = new Map<string, number>();
  section?.nodes.forEach((node, i) => {
    for (const id of node.lineIds) if (!place.has(id)) place.set(id, i);
  });
  return handles
    .map((handle, i) => ({ handle, i, girth: place.get(handle.lineId) ?? Infinity }))
    .sort((a, b) => (a.girth === b.girth ? a.i - b.i : a.girth - b.girth))
    .map((h) => h.handle);
}

/** What an offset's cell measures, as the side table and the drawing's announcements word it; a point line's cell is two lengths. */
export const OFFSET_MEASURE_WORDS: Record<Line['kind'], string> = { waterline: 'half-breadth', buttock: 'height', diagonal: 'along the diagonal', point: '' };

/** A reference line of the body plan in drawing mm (both sides of the centreline). */
export interface ReferenceLine {
  lineId: string;
  name: string;
  kind: 'waterline' | 'buttock' | 'diagonal';
  /** Straight pieces as [from, to] pairs, drawing mm. */
  pieces: [Point, Point][];
  /** Where its name goes. */
  labelAt: Point;
}

/**
 * Waterlines across the whole width, buttocks up the whole height on both sides, diagonals from their
 * origin outboard and down on both sides, each to the edge of `extent` (drawing mm).
 */
export function referenceLinesOf(lines: Pick<HullLines, 'lines'>, extent: Bounds): ReferenceLine[] {
  const out: ReferenceLine[] = [];
  for (const line of lines.lines) {
    if (line.kind === 'waterline') {
      out.push({ lineId: line.id, name: line.name, kind: 'waterline', pieces: [[{ x: extent.minX, y: line.z }, { x: extent.maxX, y: line.z }]], labelAt: { x: extent.maxX, y: line.z } });
    } else if (line.kind === 'buttock') {
      out.push({
        lineId: line.id,
        name: line.name,
        kind: 'buttock',
        pieces: [
          [{ x: line.y, y: extent.minY }, { x: line.y, y: extent.maxY }],
          [{ x: -line.y, y: extent.minY }, { x: -line.y, y: extent.maxY }],
        ],
        labelAt: { x: line.y, y: extent.maxY },
      });
    } else if (line.kind === 'diagonal') {
      const d = diagonalDirection(line);
      // As far as it runs inside the extent: to the side or to the bottom, whichever it meets first.
      const toSide = d.y > 1e-9 ? extent.maxX / d.y : Infinity;
      const toBottom = d.z < -1e-9 ? (extent.minY - line.originZ) / d.z : Infinity;
      const t = Math.max(0, Math.min(toSide, toBottom));
      const end = { x: t * d.y, y: line.originZ + t * d.z };
      const origin = { x: 0, y: line.originZ };
      out.push({ lineId: line.id, name: line.name, kind: 'diagonal', pieces: [[origin, end], [origin, { x: -end.x, y: end.y }]], labelAt: end });
    }
  }
  return out;
}

/** The box (drawing mm) holding every section on both sides, with room around it; null with no sections. */
export function bodyPlanBounds(sections: Iterable<Section | null>): Bounds | null {
  const pts: Point[] = [];
  for (const s of sections) {
    if (!s) continue;
    for (const v of s.vertices) {
      pts.push({ x: v.y, y: v.z }, { x: -v.y, y: v.z });
    }
  }
  const b = boundsOf(pts);
  if (!b) return null;
  // A little room so the outermost points and their handles are not on the edge.
  const pad = 0.04 * Math.max(b.maxX - b.minX, b.maxY - b.minY, 1);
  return { minX: b.minX - pad, minY: b.minY - pad, maxX: b.maxX + pad, maxY: b.maxY + pad };
}

/** Stations in order of x, for stepping through them. */
export function stationsInOrder(stations: readonly Station[]): Station[] {
  return [...stations].sort((a, b) => a.x - b.x);
}

/**
 * Where a line crosses a section (mm), as the cell value that puts its offset there: the half-breadth at
 * a waterline's height, the height at a buttock's half-breadth, the distance along a diagonal; the
 * lowest crossing when there are several. null for a point line (its point is not fixed by a crossing)
 * or where the line does not meet the section.
 */
export function offsetOnSection(line: Line, section: Pick<Section, 'vertices'>): number | null {
  if (line.kind === 'point') return null;
  // Signed distance of a section point from the line: zero where they cross.
  const d = diagonalDirection(line.kind === 'diagonal' ? line : { angle: 0 });
  const across = (p: SectionPlanePoint): number =>
    line.kind === 'waterline' ? p.z - line.z : line.kind === 'buttock' ? p.y - line.y : p.y * -d.z + (p.z - line.originZ) * d.y;
  const v = section.vertices;
  let best: SectionPlanePoint | null = null;
  for (let i = 0; i + 1 < v.length; i++) {
    const a = v[i]!;
    const b = v[i + 1]!;
    const fa = across(a);
    const fb = across(b);
    if (fa === 0 && fb === 0) continue;
    if ((fa < 0 && fb < 0) || (fa > 0 && fb > 0)) continue;
    const t = fa / (fa - fb);
    const p = { y: a.y + t * (b.y - a.y), z: a.z + t * (b.z - a.z) };
    if (!best || p.z < best.z) best = p;
  }
  if (!best) return null;
  const value = offsetValueFor(line, best);
  return typeof value === 'number' ? value : null;
}
