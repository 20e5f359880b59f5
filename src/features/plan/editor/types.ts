import type { Plan } from '../../../../shared/geometry/plan-schema';

/** Which value of a line's cell: a point line (sheer, chine, keel) has a half-breadth `y` and a height `z`; the others one `value`. */
export type CellField = 'value' | 'y' | 'z';

/** One cell of the table of offsets: a line at a station, and for a point line which of its two values. */
export interface CellRef {
  lineId: string;
  stationId: string;
  field: CellField;
}

/**
 * Text typed into a cell that is not in the plan: a value that does not read as a length (`error`), or one
 * half of a point line's cell waiting for the other half (`incomplete`: the schema holds both or neither).
 */
export interface PendingCell {
  text: string;
  message: string;
  kind: 'error' | 'incomplete';
}

/** Pending cells by line id, then by `cellKey` within the line, so a row can select only its own. */
export type PendingCells = Readonly<Record<string, Readonly<Record<string, PendingCell>>>>;

/** The key of a cell within its line. */
export function cellKey(stationId: string, field: CellField): string {
  return `${stationId}:${field}`;
}

/**
 * One edit of the plan: a pure function from the plan to the new plan, and the words the undo button and
 * the history of edits show for it. Returning the same plan object means "nothing changed".
 */
export interface Edit {
  label: string;
  apply: (plan: Plan) => Plan;
}

/** Build an Edit from a pure action and its arguments. */
export function edit<A>(label: string, action: (plan: Plan, args: A) => Plan, args: A): Edit {
  return { label, apply: (plan) => action(plan, args) };
}
