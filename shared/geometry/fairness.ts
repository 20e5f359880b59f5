import type { BuiltHull } from './hull';
import type { FittedLine } from './lines';
import { sectionAt } from './section';
import { type Spline, splineBendingEnergy, splineEvaluate, splineFit, splineTurns, splineValueAt } from './spline';

/**
 * The fairness check: offsets that make a line unfair (usually a misread cell), lines that wave (more
 * than one inflection), and waterlines and buttocks that disagree where they cross.
 *
 * - Cells: each value is compared with the line's curve through the rest of its values (leave one out,
 *   not-a-knot as everywhere). The misread cell is found as the one whose removal most smooths the line
 *   (see `fairnessLeaveOneOut`), flagged and left out, and the line judged again, so one bad cell is
 *   named alone rather than smearing onto its neighbours. An end cell is judged by extrapolation, which is
 *   looser: it gets `endCellFactor` times the tolerance.
 * - Inflections: where the line turns from bending one way to the other, counting only bends that stand
 *   more than `inflectionToleranceMm` off their chord (rounding in the cells makes ripples that do not).
 *   One turn is allowed (a hollow entrance running into a full run); more are flagged.
 * - Crossings: where the waterline's half-breadth along x equals the buttock's, the buttock's height
 *   there should be the waterline's height; the difference, taken normal to the section, is flagged
 *   beyond `crossingToleranceMm`.
 */

/** Default largest distance (mm) of a cell from the curve through the rest of its line: 3 mm, about 1/8 in. */
export const FAIRNESS_CELL_TOLERANCE_MM = 3;
/** End cells are judged by extrapolation: their tolerance is this many times the cell tolerance. */
export const FAIRNESS_END_CELL_FACTOR = 2;
/** Default largest disagreement (mm, normal to the section) between a waterline and a buttock where they cross. */
export const FAIRNESS_CROSSING_TOLERANCE_MM = 3;
/** A bend standing less than this (mm) off its chord is too slight to count toward an inflection. */
export const FAIRNESS_INFLECTION_TOLERANCE_MM = 1;
/** At most this many cells are flagged on one line (past that the whole line needs a look). */
export const FAIRNESS_MAX_FLAGS_PER_LINE = 4;

export interface FairnessOptions {
  cellToleranceMm?: number;
  endCellFactor?: number;
  crossingToleranceMm?: number;
  inflectionToleranceMm?: number;
  maxFlagsPerLine?: number;
}

/** Which of a line's values: a point line has a half-breadth (`y`) and a height (`z`); other lines one `value`. */
export type FairnessField = 'value' | 'y' | 'z';

/** A cell that stands off its line. */
export interface FairnessCellFlag {
  kind: 'cell';
  lineId: string;
  lineName: string;
  stationId: string;
  stationName: string;
  field: FairnessField;
  x: number;
  valueMm: number;
  /** What the rest of the line gives there (mm). */
  expectedMm: number;
  /** value - expected (mm). */
  deviationMm: number;
  message: string;
}

/** A line with more than one inflection. */
export interface FairnessInflectionFlag {
  kind: 'inflections';
  lineId: string;
  lineName: string;
  field: FairnessField;
  count: number;
  /** Where (mm) and the station nearest each. */
  xs: number[];
  stationIds: string[];
  message: string;
}

/** A waterline and a buttock that disagree where they cross. */
export interface FairnessCrossingFlag {
  kind: 'crossing';
  lineId: string;
  lineName: string;
  otherLineId: string;
  otherLineName: string;
  /** x (mm) where the waterline reaches the buttock's half-breadth, and the station nearest it. */
  x: number;
  stationId: string;
  stationName: string;
  /** Buttock height minus waterline height (mm), and that taken normal to the section. */
  heightDifferenceMm: number;
  deviationMm: number;
  message: string;
}

export type FairnessFlag = FairnessCellFlag | FairnessInflectionFlag | FairnessCrossingFlag;

/** Every cell's leave-one-out deviation (mm), for drawing, and the flags. */
export interface FairnessReport {
  flags: FairnessFlag[];
  deviations: { lineId: string; stationId: string; field: FairnessField; deviationMm: number }[];
}

const fmt = (v: number): string => String(Number(v.toFixed(1)));

/** Run the fairness check over every line of the hull. */
export function fairnessCheck(hull: BuiltHull, options: FairnessOptions = {}): FairnessReport {
  const o = {
    cell: options.cellToleranceMm ?? FAIRNESS_CELL_TOLERANCE_MM,
    end: options.endCellFactor ?? FAIRNESS_END_CELL_FACTOR,
    crossing: options.crossingToleranceMm ?? FAIRNESS_CROSSING_TOLERANCE_MM,
    bend: options.inflectionToleranceMm ?? FAIRNESS_INFLECTION_TOLERANCE_MM,
    maxFlags: options.maxFlagsPerLine ?? FAIRNESS_MAX_FLAGS_PER_LINE,
  };
  const flags: FairnessFlag[] = [];
  const deviations: FairnessReport['deviations'] = [];
  const names = new Map(hull.stations.map((s) => [s.id, s.name]));
  for (const line of hull.fitted) {
    const comps: [FairnessField, Spline][] = line.kind === 'point' ? [['y', line.values], ['z', line.heights!]] : [['value', line.values]];
    for (const [field, spline] of comps) {
      const r = fairnessLeaveOneOut(spline.xs, spline.ys, o.cell, o.end, o.maxFlags);
      r.deviations.forEach((d, i) => deviations.push({ lineId: line.id, stationId: line.stationIds[i]!, field, deviationMm: d }));
      for (const i of r.flagged) {
        const stationId = line.stationIds[i]!;
        const dev = r.deviations[i]!;
        flags.push({
          kind: 'cell',
          lineId: line.id,
          lineName: line.name,
          stationId,
          stationName: names.get(stationId) ?? stationId,
          field,
          x: spline.xs[i]!,
          valueMm: spline.ys[i]!,
          expectedMm: spline.ys[i]! - dev,
          deviationMm: dev,
          message: `${line.name}${field === 'value' ? '' : ` (${field === 'y' ? 'half-breadth' : 'height'})`} at station ${names.get(stationId) ?? stationId}: ${fmt(spline.ys[i]!)} mm stands ${fmt(Math.abs(dev))} mm ${dev > 0 ? 'above' : 'below'} the line through the other stations (${fmt(spline.ys[i]! - dev)} mm)`,
        });
      }
      const inflections = splineTurns(spline, o.bend);
      if (inflections.length > 1) {
        const stationIds = inflections.map((x) => nearestStation(line, x));
        flags.push({
          kind: 'inflections',
          lineId: line.id,
          lineName: line.name,
          field,
          count: inflections.length,
          xs: inflections,
          stationIds,
          message: `${line.name} changes its bend ${inflections.length} times (near stations ${stationIds.map((id) => names.get(id) ?? id).join(', ')}): a fair line turns at most once`,
        });
      }
    }
  }
  flags.push(...crossingFlags(hull, o.crossing, names));
  return { flags, deviations };
}

/**
 * Leave-one-out deviations of values ys at xs (value minus the curve through the others) and the cells
 * flagged. A misread cell also throws its neighbours' deviations off (the curve through the others still
 * passes through it), often by more than its own near the ends, so the worst deviation does not name
 * it. The culprit is the cell whose removal leaves the line bending least (its spline's bending energy
 * drops most); of the `CANDIDATES` cells whose removal helps most, the first whose own deviation is beyond
 * tolerance is flagged and left out, and the line is judged again, up to `maxFlags` times. Needs at least
 * four values to judge (fewer: nothing is flagged and deviations are 0).
 */
export function fairnessLeaveOneOut(
  xs: readonly number[],
  ys: readonly number[],
  toleranceMm: number = FAIRNESS_CELL_TOLERANCE_MM,
  endCellFactor: number = FAIRNESS_END_CELL_FACTOR,
  maxFlags: number = FAIRNESS_MAX_FLAGS_PER_LINE,
): { deviations: number[]; flagged: number[] } {
  const n = xs.length;
  const deviations = new Array<number>(n).fill(0);
  const flagged: number[] = [];
  if (n < 4) return { deviations, flagged };
  const out = new Set<number>();
  for (let pass = 0; pass <= maxFlags; pass++) {
    const judged: { i: number; energy: number; ratio: number }[] = [];
    for (let i = 0; i < n; i++) {
      const keep: number[] = [];
      for (let j = 0; j < n; j++) if (j !== i && !out.has(j)) keep.push(j);
      if (keep.length < 3) continue;
      const fit = splineFit(keep.map((j) => xs[j]!), keep.map((j) => ys[j]!));
      const dev = ys[i]! - splineValueAt(fit, xs[i]!);
      deviations[i] = dev;
      if (out.has(i)) continue;
      const isEnd = i < keep[0]! || i > keep[keep.length - 1]!;
      judged.push({ i, energy: splineBendingEnergy(fit), ratio: Math.abs(dev) / (toleranceMm * (isEnd ? endCellFactor : 1)) });
    }
    if (pass === maxFlags) break;
    judged.sort((a, b) => a.energy - b.energy);
    const culprit = judged.slice(0, CANDIDATES).find((c) => c.ratio > 1);
    if (!culprit) break;
    out.add(culprit.i);
    flagged.push(culprit.i);
  }
  return { deviations, flagged };
}

/** How many of the cells whose removal most smooths a line are looked at for the misread one. */
const CANDIDATES = 3;

function nearestStation(line: FittedLine, x: number): string {
  let best = 0;
  for (let i = 1; i < line.xs.length; i++) if (Math.abs(line.xs[i]! - x) < Math.abs(line.xs[best]! - x)) best = i;
  return line.stationIds[best]!;
}

/** Waterline and buttock crossings that disagree. */
function crossingFlags(hull: BuiltHull, tol: number, names: Map<string, string>): FairnessCrossingFlag[] {
  const flags: FairnessCrossingFlag[] = [];
  const waterlines = hull.fitted.filter((l) => l.kind === 'waterline');
  const buttocks = hull.fitted.filter((l) => l.kind === 'buttock');
  for (const w of waterlines) {
    for (const b of buttocks) {
      for (const x of splineRootsOf(w.values, b.fixedY!, Math.max(w.xMin, b.xMin), Math.min(w.xMax, b.xMax))) {
        const zb = splineValueAt(b.values, x);
        const diff = zb - w.fixedZ!;
        // Taken normal to the section: a buttock meeting a steep side at a glance says little about height.
        // The section is built from the other lines: the two in question would kink it where they disagree.
        const others = { ...hull, fitted: hull.fitted.filter((l) => l.id !== w.id && l.id !== b.id) };
        const section = Math.abs(diff) > tol ? sectionAt(others, x) : null;
        let nz = 1;
        if (section) {
          let best = Infinity;
          for (const v of section.vertices) {
            const d = (v.y - b.fixedY!) ** 2 + (v.z - w.fixedZ!) ** 2;
            if (d < best) {
              best = d;
              nz = Math.abs(v.nz);
            }
          }
        }
        const dev = Math.abs(diff) * nz;
        if (dev <= tol) continue;
        let near = hull.stations[0]!;
        for (const s of hull.stations) if (Math.abs(s.x - x) < Math.abs(near.x - x)) near = s;
        flags.push({
          kind: 'crossing',
          lineId: w.id,
          lineName: w.name,
          otherLineId: b.id,
          otherLineName: b.name,
          x,
          stationId: near.id,
          stationName: names.get(near.id) ?? near.id,
          heightDifferenceMm: diff,
          deviationMm: dev,
          message: `${w.name} and ${b.name} cross near station ${near.name} (x = ${fmt(x)} mm) but disagree by ${fmt(dev)} mm: the buttock is at ${fmt(zb)} mm where the waterline is at ${fmt(w.fixedZ!)} mm`,
        });
      }
    }
  }
  return flags;
}

/** Every x in [x0, x1] where the spline equals `level` (sign changes on 16 samples a span, then bisection). */
function splineRootsOf(s: Spline, level: number, x0: number, x1: number): number[] {
  const roots: number[] = [];
  if (!(x1 > x0)) return roots;
  const f = (x: number): number => splineEvaluate(s, x).value - level;
  const n = Math.max(16, (s.xs.length - 1) * 16);
  let xa = x0;
  let fa = f(xa);
  for (let i = 1; i <= n; i++) {
    const xb = x0 + ((x1 - x0) * i) / n;
    const fb = f(xb);
    if (fa === 0) roots.push(xa);
    else if (fa * fb < 0) {
      let lo = xa;
      let hi = xb;
      let flo = fa;
      for (let k = 0; k < 60; k++) {
        const mid = (lo + hi) / 2;
        const fm = f(mid);
        if (flo * fm <= 0) hi = mid;
        else {
          lo = mid;
          flo = fm;
        }
      }
      roots.push((lo + hi) / 2);
    }
    xa = xb;
    fa = fb;
  }
  return roots;
}
