import type { Line, PointLine } from '../../../../shared/geometry/hull-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { idFor } from './ids';
import { arrayMove, withLine, withLines } from './plan-update';

/**
 * What defines a line besides its cells: a waterline's height, a buttock's half-breadth, a diagonal's
 * height on the centreline and angle (radians below the horizontal), a point line's role.
 */
export type LineSpec =
  | { kind: 'waterline'; z: number }
  | { kind: 'buttock'; y: number }
  | { kind: 'diagonal'; originZ: number; angle: number }
  | { kind: 'point'; role: PointLine['role'] };

function specValid(spec: LineSpec): boolean {
  if (spec.kind === 'waterline') return Number.isFinite(spec.z);
  if (spec.kind === 'buttock') return Number.isFinite(spec.y);
  if (spec.kind === 'diagonal') return Number.isFinite(spec.originZ) && Number.isFinite(spec.angle);
  return true;
}

/** Add an empty line at the bottom of the table (or at `index`). Sheer, chine and keel are knuckles by default: corners in every section. */
export function lineAdd(plan: Plan, args: { name: string; spec: LineSpec; index?: number; id?: string }): Plan {
  const name = args.name.trim();
  if (!name || !specValid(args.spec)) return plan;
  return withLines(plan, (lines) => {
    const id = args.id ?? idFor('ln', name, lines.lines.map((l) => l.id));
    const base = { id, name, cells: {} };
    const line: Line =
      args.spec.kind === 'point'
        ? { ...base, kind: 'point', role: args.spec.role, knuckle: args.spec.role === 'other' ? null : { fromX: null, toX: null } }
        : { ...base, ...args.spec, knuckle: null };
    const all = [...lines.lines];
    all.splice(args.index === undefined ? all.length : Math.max(0, Math.min(all.length, args.index)), 0, line);
    return { ...lines, lines: all };
  });
}

/** Rename a line and/or change its fixed value (a waterline's height, a buttock's half-breadth, a diagonal's origin and angle, a point line's role). */
export function lineUpdate(plan: Plan, args: { lineId: string; name?: string; spec?: LineSpec; knuckle?: Line['knuckle'] }): Plan {
  return withLine(plan, args.lineId, (line) => {
    const name = args.name === undefined ? line.name : args.name.trim();
    if (!name) return line;
    let next: Line = { ...line, name };
    if (args.spec) {
      if (args.spec.kind !== line.kind || !specValid(args.spec)) return line;
      next = { ...next, ...args.spec } as Line;
    }
    if (args.knuckle !== undefined) next = { ...next, knuckle: args.knuckle };
    const changed = (Object.keys(next) as (keyof Line)[]).some((k) => next[k] !== line[k]);
    return changed ? next : line;
  });
}

/** Put a line at another place among the rows. */
export function lineReorder(plan: Plan, args: { lineId: string; toIndex: number }): Plan {
  return withLines(plan, (lines) => {
    const all = arrayMove(lines.lines, lines.lines.findIndex((l) => l.id === args.lineId), args.toIndex);
    return all === lines.lines ? lines : { ...lines, lines: [...all] };
  });
}

/**
 * Delete a line with its offsets. Skin panels bounded by it go too (a panel bounded by a line that is not
 * there fails the hull check). Longitudinals placed by it are parts, left for the frames screen to show.
 */
export function lineDelete(plan: Plan, args: { lineId: string }): Plan {
  return withLines(plan, (lines) => {
    if (!lines.lines.some((l) => l.id === args.lineId)) return lines;
    const panels = lines.skin.panels.filter((p) => p.fromLineId !== args.lineId && p.toLineId !== args.lineId);
    return {
      ...lines,
      lines: lines.lines.filter((l) => l.id !== args.lineId),
      skin: panels.length === lines.skin.panels.length ? lines.skin : { ...lines.skin, panels },
    };
  });
}

/** The skin panels that `lineDelete` would remove with the line, for the confirmation to name. */
export function panelsBoundedBy(plan: Plan, lineId: string): string[] {
  return plan.lines.skin.panels.filter((p) => p.fromLineId === lineId || p.toLineId === lineId).map((p) => p.name);
}
