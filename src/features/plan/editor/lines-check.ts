import type { HullLines } from '../../../../shared/geometry/hull-schema';
import { fairnessCheck, type FairnessFlag } from '../../../../shared/geometry/fairness';
import { hullCheck } from '../../../../shared/geometry/hull';
import type { GeometryIssue } from '../../../../shared/geometry/types';
import { cellKey, type CellField } from './types';

/** A cell the fairness check flagged: how far it stands off the line through its neighbours, and why. */
export interface CellFlag {
  deviationMm: number;
  message: string;
}

export interface LinesCheck {
  /** The lines this result is for (the check runs a moment after the last edit). */
  lines: HullLines | null;
  /** Why the hull cannot be built from the table; empty when it can. */
  issues: GeometryIssue[];
  /** Flags on single cells, by line id then `cellKey`. */
  cellFlags: Map<string, Map<string, CellFlag>>;
  /** Flags on whole lines: more than one change of bend, a waterline and a buttock that disagree. */
  lineFlags: FairnessFlag[];
}

export const emptyCheck: LinesCheck = { lines: null, issues: [], cellFlags: new Map(), lineFlags: [] };

/** Check the hull and run the fairness check on its lines; never throws (a failure becomes an issue). */
export function linesCheck(lines: HullLines): LinesCheck {
  const built = hullCheck(lines);
  if (!built.ok) return { lines, issues: built.issues, cellFlags: new Map(), lineFlags: [] };
  try {
    const report = fairnessCheck(built.hull);
    const cellFlags = new Map<string, Map<string, CellFlag>>();
    const lineFlags: FairnessFlag[] = [];
    for (const flag of report.flags) {
      if (flag.kind !== 'cell') {
        lineFlags.push(flag);
        continue;
      }
      const byLine = cellFlags.get(flag.lineId) ?? new Map<string, CellFlag>();
      byLine.set(cellKey(flag.stationId, flag.field as CellField), { deviationMm: flag.deviationMm, message: flag.message });
      cellFlags.set(flag.lineId, byLine);
    }
    return { lines, issues: [], cellFlags, lineFlags };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    return { lines, issues: [{ code: 'fairness-failed', message: `The fairness check could not run on these lines: ${message}` }], cellFlags: new Map(), lineFlags: [] };
  }
}

