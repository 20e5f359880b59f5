import type { Plan } from '../../../../shared/geometry/plan-schema';
import { withLine } from './plan-update';

/** What one cell holds: a length (mm) for a waterline, buttock or diagonal; a half-breadth and a height for a point line; null when empty. */
export type CellValue = number | { y: number; z: number } | null;

export interface CellWrite {
  lineId: string;
  stationId: string;
  value: CellValue;
}

function sameCell(a: CellValue | undefined, b: CellValue): boolean {
  if (a === undefined) return b === null;
  if (a === null || b === null || typeof a === 'number' || typeof b === 'number') return a === b;
  return a.y === b.y && a.z === b.z;
}

/**
 * Set one cell. A point line takes `{ y, z }` or null, the other kinds a number or null; a value of the
 * wrong shape for its line, or a station the plan does not have, leaves the plan as it was.
 */
export function cellSet(plan: Plan, write: CellWrite): Plan {
  if (!plan.lines.stations.some((s) => s.id === write.stationId)) return plan;
  return withLine(plan, write.lineId, (line) => {
    const { value } = write;
    if (value !== null && (line.kind === 'point') !== (typeof value === 'object')) return line;
    if (typeof value === 'number' && !Number.isFinite(value)) return line;
    if (value !== null && typeof value === 'object' && !(Number.isFinite(value.y) && Number.isFinite(value.z))) return line;
    const cells = line.cells as Record<string, CellValue>;
    if (sameCell(cells[write.stationId], value)) return line;
    return { ...line, cells: { ...cells, [write.stationId]: value } } as typeof line;
  });
}

/** Set a block of cells at once (a paste): one new plan, one undo entry. */
export function cellsSet(plan: Plan, args: { writes: readonly CellWrite[] }): Plan {
  return args.writes.reduce(cellSet, plan);
}
