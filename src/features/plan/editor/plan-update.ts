import type { HullLines, Line } from '../../../../shared/geometry/hull-schema';
import type { Parts } from '../../../../shared/geometry/part-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';

/**
 * Small immutable-update helpers: each returns a new plan sharing every unchanged branch with the old one,
 * so an undo entry costs only the path that changed and a table row can tell by reference whether its
 * line changed.
 */

export function withLines(plan: Plan, update: (lines: HullLines) => HullLines): Plan {
  const next = update(plan.lines);
  return next === plan.lines ? plan : { ...plan, lines: next };
}

export function withParts(plan: Plan, update: (parts: Parts) => Parts): Plan {
  const next = update(plan.parts);
  return next === plan.parts ? plan : { ...plan, parts: next };
}

/** Replace the line with `lineId` by `update(line)`; the plan unchanged when there is no such line or nothing changed. */
export function withLine(plan: Plan, lineId: string, update: (line: Line) => Line): Plan {
  return withLines(plan, (lines) => {
    const index = lines.lines.findIndex((l) => l.id === lineId);
    if (index < 0) return lines;
    const next = update(lines.lines[index]!);
    if (next === lines.lines[index]) return lines;
    const all = [...lines.lines];
    all[index] = next;
    return { ...lines, lines: all };
  });
}

/** Move the item at `from` to `to` (both clamped); the same array when nothing moves. */
export function arrayMove<T>(items: readonly T[], from: number, to: number): T[] | readonly T[] {
  const target = Math.max(0, Math.min(items.length - 1, to));
  if (from < 0 || from >= items.length || from === target) return items;
  const next = [...items];
  const [moved] = next.splice(from, 1);
  next.splice(target, 0, moved!);
  return next;
}

/** Structural equality of plain JSON values (plans hold nothing else). */
export function jsonEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a)) {
    const bb = b as unknown[];
    return a.length === bb.length && a.every((v, i) => jsonEqual(v, bb[i]));
  }
  const ka = Object.keys(a as object).filter((k) => (a as Record<string, unknown>)[k] !== undefined);
  const kb = Object.keys(b as object).filter((k) => (b as Record<string, unknown>)[k] !== undefined);
  return ka.length === kb.length && ka.every((k) => jsonEqual((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
}
