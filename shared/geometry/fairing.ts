import { curveFlattenCoords } from './curve';
import type { BuiltHull } from './hull';
import type { FittedLine } from './lines';
import { type Spline, splineEvaluate, splineTurns } from './spline';
import { CHORD_TOLERANCE_MM } from './types';
import { FAIRNESS_INFLECTION_TOLERANCE_MM } from './fairness';

/**
 * The lines as the fairing view draws them: each line's values against x, in plan (half-breadths:
 * waterlines, point lines' y, diagonals' distances) or profile (heights: buttocks, point lines' z), with
 * the values stretched by an exaggeration so that an unfair run shows. Plain data in view millimetres:
 * x as is, value times the exaggeration. The editor turns these into pixels.
 */

/** Default vertical exaggeration of the fairing view. */
export const FAIRING_EXAGGERATION = 5;

/** Which drawing a curve belongs to. */
export type FairingViewName = 'plan' | 'profile';

/** One line in one view. */
export interface FairingCurve {
  lineId: string;
  /** Which piece of the line (a line with empty cells between its values is drawn in pieces). */
  piece: number;
  lineName: string;
  kind: FittedLine['kind'];
  view: FairingViewName;
  /** The flattened curve: x (mm) and value times exaggeration (view mm), within the chord tolerance in view mm. */
  points: { x: number; v: number }[];
  /** The table's cells on it (x, exaggerated value) and their stations. */
  cells: { stationId: string; x: number; v: number }[];
  /** x (mm) of the line's inflections (turns between bends that matter, as the fairness check counts them). */
  inflectionXs: number[];
}

/** The fairing view's data. */
export interface FairingView {
  exaggeration: number;
  stations: { id: string; name: string; x: number }[];
  plan: FairingCurve[];
  profile: FairingCurve[];
}

export interface FairingOptions {
  exaggeration?: number;
  /** Chord tolerance in view mm (after exaggeration). */
  chordToleranceMm?: number;
  /** Bends standing less than this (mm) off their chord are not counted as turns (see the fairness check). */
  inflectionToleranceMm?: number;
}

/** Build the fairing view of every line of the hull. */
export function fairingViewOf(hull: BuiltHull, options: FairingOptions = {}): FairingView {
  const k = options.exaggeration ?? FAIRING_EXAGGERATION;
  const tol = options.chordToleranceMm ?? CHORD_TOLERANCE_MM;
  const bend = options.inflectionToleranceMm ?? FAIRNESS_INFLECTION_TOLERANCE_MM;
  const plan: FairingCurve[] = [];
  const profile: FairingCurve[] = [];
  for (const line of hull.fitted) {
    const curve = (view: FairingViewName, s: Spline): FairingCurve => ({
      lineId: line.id,
      piece: line.piece,
      lineName: line.name,
      kind: line.kind,
      view,
      points: fairingPolyline(s, k, tol),
      cells: s.xs.map((x, i) => ({ stationId: line.stationIds[i]!, x, v: s.ys[i]! * k })),
      inflectionXs: splineTurns(s, bend),
    });
    if (line.kind === 'buttock') profile.push(curve('profile', line.values));
    else plan.push(curve('plan', line.values));
    if (line.heights) profile.push(curve('profile', line.heights));
  }
  return { exaggeration: k, stations: hull.stations.map((s) => ({ id: s.id, name: s.name, x: s.x })), plan, profile };
}

/**
 * A spline y(x) flattened in the view plane (x, k y): each span is the Bezier with control points a third
 * of the span in, on the end tangents, cut adaptively to `tol` view mm.
 */
export function fairingPolyline(s: Spline, k: number, tol: number = CHORD_TOLERANCE_MM): { x: number; v: number }[] {
  const out: { x: number; v: number }[] = [{ x: s.xs[0]!, v: s.ys[0]! * k }];
  for (let i = 0; i < s.xs.length - 1; i++) {
    const x0 = s.xs[i]!;
    const x1 = s.xs[i + 1]!;
    const h = (x1 - x0) / 3;
    const y0 = s.ys[i]! * k;
    const y1 = s.ys[i + 1]! * k;
    const c = [x0, y0, x0 + h, y0 + h * s.ms[i]! * k, x1 - h, y1 - h * s.ms[i + 1]! * k, x1, y1] as const;
    for (const t of curveFlattenCoords(c, tol)) {
      const x = x0 + t * (x1 - x0);
      out.push({ x, v: splineEvaluate(s, x).value * k });
    }
    out.push({ x: x1, v: y1 });
  }
  return out;
}
