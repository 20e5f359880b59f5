import type { Line, PointLine, Station } from './hull-schema';
import { type Spline, splineEvaluate, splineFit } from './spline';
import { POINT_TOLERANCE_MM } from './types';

/**
 * The hull's lines as fair curves along x: each line's station values joined by a cubic spline with
 * not-a-knot ends (no curvature forced at the ends; three values give the parabola, two the straight
 * line). A point line (sheer, chine, keel...) is two such curves, half-breadth and height. An empty cell
 * means the line does not cross that station (a waterline above the sheer amidships, present forward and
 * aft): a line with empty cells between its values is fitted in pieces, one for each run of consecutive
 * stations with values, and reaches x only within a piece.
 */

/** A line of the table (or one piece of it, between empty cells) fitted along x. Plain data; built once per hull by `hullBuild`. */
export interface FittedLine {
  id: string;
  /** Which piece of the line, 0 forward-most (lowest x); most lines have only piece 0. */
  piece: number;
  name: string;
  kind: Line['kind'];
  /** Role of a point line; null for waterlines, buttocks and diagonals. */
  role: PointLine['role'] | null;
  /** Height (mm) of a waterline; null otherwise. */
  fixedZ: number | null;
  /** Half-breadth (mm) of a buttock; null otherwise. */
  fixedY: number | null;
  /** A diagonal's origin on the centreline (mm above base) and angle below the horizontal (rad); null otherwise. */
  diagonal: { originZ: number; angle: number } | null;
  /** Where the line is a knuckle (null ends: from the first / to the last station); null when smooth. */
  knuckle: { fromX: number | null; toX: number | null } | null;
  /** First and last x (mm) with a value: the line reaches x in [xMin, xMax]. */
  xMin: number;
  xMax: number;
  /** Stations with a value, in order of x, and their x (mm). */
  stationIds: string[];
  xs: number[];
  /** The line's values along x: half-breadth (waterline, point line), height (buttock), distance (diagonal), mm. */
  values: Spline;
  /** A point line's heights along x (mm); null for the other kinds. */
  heights: Spline | null;
}

/** A line's point in the section at x, and how it moves with x (mm per mm of x). */
export interface LinePoint {
  y: number;
  z: number;
  vy: number;
  vz: number;
}

/**
 * The values of a line at the stations, in order of x (stations must already be sorted by x).
 * Point lines give [y, z] pairs; other lines single numbers. Empty cells are left out.
 */
export function lineStationValues(line: Line, sortedStations: readonly Station[]): { station: Station; value: number; height: number | null }[] {
  const out: { station: Station; value: number; height: number | null }[] = [];
  for (const st of sortedStations) {
    if (line.kind === 'point') {
      const cell = line.cells[st.id];
      if (cell) out.push({ station: st, value: cell.y, height: cell.z });
    } else {
      const cell = line.cells[st.id];
      if (cell !== null && cell !== undefined) out.push({ station: st, value: cell, height: null });
    }
  }
  return out;
}

/**
 * The runs of consecutive stations (sorted by x) at which the line has values, in order of x.
 */
export function linePieces(line: Line, sortedStations: readonly Station[]): { station: Station; value: number; height: number | null }[][] {
  const runs: { station: Station; value: number; height: number | null }[][] = [];
  let run: { station: Station; value: number; height: number | null }[] = [];
  for (const st of sortedStations) {
    const [v] = lineStationValues(line, [st]);
    if (v) run.push(v);
    else if (run.length > 0) {
      runs.push(run);
      run = [];
    }
  }
  if (run.length > 0) runs.push(run);
  return runs;
}

/**
 * Fit one line along x: one FittedLine for each run of consecutive stations with values (none for an
 * empty row, which is ignored). Call with validated input: every run at least two values, stations
 * sorted by x with distinct x.
 */
export function lineFit(line: Line, sortedStations: readonly Station[]): FittedLine[] {
  return linePieces(line, sortedStations).map((vals, piece) => pieceFit(line, vals, piece));
}

function pieceFit(line: Line, vals: { station: Station; value: number; height: number | null }[], piece: number): FittedLine {
  const xs = vals.map((v) => v.station.x);
  const values = splineFit(xs, vals.map((v) => v.value));
  const heights = line.kind === 'point' ? splineFit(xs, vals.map((v) => v.height!)) : null;
  return {
    id: line.id,
    piece,
    name: line.name,
    kind: line.kind,
    role: line.kind === 'point' ? line.role : null,
    fixedZ: line.kind === 'waterline' ? line.z : null,
    fixedY: line.kind === 'buttock' ? line.y : null,
    diagonal: line.kind === 'diagonal' ? { originZ: line.originZ, angle: line.angle } : null,
    knuckle: line.knuckle ? { fromX: line.knuckle.fromX, toX: line.knuckle.toX } : null,
    xMin: xs[0]!,
    xMax: xs[xs.length - 1]!,
    stationIds: vals.map((v) => v.station.id),
    xs,
    values,
    heights,
  };
}

/** Whether the line reaches x (mm), within `toleranceMm` of its first and last station. */
export function lineReaches(line: FittedLine, x: number, toleranceMm: number = POINT_TOLERANCE_MM): boolean {
  return x >= line.xMin - toleranceMm && x <= line.xMax + toleranceMm;
}

/**
 * The line's own value at x (mm): half-breadth of a waterline or point line, height of a buttock,
 * distance along a diagonal. null where the line does not reach x.
 */
export function lineValueAt(line: FittedLine, x: number, toleranceMm: number = POINT_TOLERANCE_MM): number | null {
  if (!lineReaches(line, x, toleranceMm)) return null;
  return splineEvaluate(line.values, clampX(line, x)).value;
}

/**
 * The line's point in the section at x (y, z in mm) and its rate of travel (vy, vz: mm per mm of x)
 * as x increases; null where the line does not reach x.
 */
export function linePointAt(line: FittedLine, x: number, toleranceMm: number = POINT_TOLERANCE_MM): LinePoint | null {
  if (!lineReaches(line, x, toleranceMm)) return null;
  const xc = clampX(line, x);
  const v = splineEvaluate(line.values, xc);
  switch (line.kind) {
    case 'waterline':
      return { y: v.value, z: line.fixedZ!, vy: v.slope, vz: 0 };
    case 'buttock':
      return { y: line.fixedY!, z: v.value, vy: 0, vz: v.slope };
    case 'diagonal': {
      const { originZ, angle } = line.diagonal!;
      const c = Math.cos(angle);
      const s = Math.sin(angle);
      return { y: v.value * c, z: originZ - v.value * s, vy: v.slope * c, vz: -v.slope * s };
    }
    case 'point': {
      const h = splineEvaluate(line.heights!, xc);
      return { y: v.value, z: h.value, vy: v.slope, vz: h.slope };
    }
  }
}

/** Whether the line is a knuckle (a corner of the section) at x (mm). */
export function lineKnuckleAt(line: FittedLine, x: number, toleranceMm: number = POINT_TOLERANCE_MM): boolean {
  if (!line.knuckle) return false;
  const from = line.knuckle.fromX ?? -Infinity;
  const to = line.knuckle.toX ?? Infinity;
  return x >= from - toleranceMm && x <= to + toleranceMm;
}

function clampX(line: FittedLine, x: number): number {
  return x < line.xMin ? line.xMin : x > line.xMax ? line.xMax : x;
}
