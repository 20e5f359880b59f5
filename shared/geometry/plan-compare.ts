import type { Plan } from './plan-schema';
import type { Line } from './hull-schema';

/**
 * One difference between two plans, in words a builder reads: which cell of which line at which station,
 * which setting, which part. `area` says which half of the plan it belongs to (permissions differ).
 */
export interface PlanChange {
  area: 'lines' | 'parts';
  kind: 'cell' | 'station' | 'line' | 'setting' | 'part' | 'longitudinal';
  /** Dotted path into the plan document. */
  path: string;
  /** Plain-words description, e.g. `WL 300 at St 4`. */
  label: string;
  before: unknown;
  after: unknown;
}

type Json = unknown;

/** Leaves of a JSON value as path → value (arrays by index), for settings compared field by field. */
function leaves(value: Json, prefix: string, out: Map<string, Json>): Map<string, Json> {
  if (value !== null && typeof value === 'object') {
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value as Record<string, Json>);
    if (entries.length === 0) out.set(prefix, Array.isArray(value) ? [] : {});
    for (const [k, v] of entries) leaves(v, prefix ? `${prefix}.${k}` : k, out);
  } else {
    out.set(prefix, value);
  }
  return out;
}

/**
 * Equal as JSON documents: what JSON.stringify would write for both, compared without writing it (on a save
 * that was two serialisations of the whole plan). A property holding `undefined` counts as absent, as
 * JSON.stringify leaves it out; the order of an object's keys does not matter, since it means nothing in the
 * plan. Plans are JSON data: no NaN, no Infinity, no cycles.
 */
function same(a: Json, b: Json): boolean {
  if (a === b) return true;
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a)) {
    const bs = b as Json[];
    if (a.length !== bs.length) return false;
    for (let i = 0; i < a.length; i++) if (!same(a[i] ?? null, bs[i] ?? null)) return false;
    return true;
  }
  const ao = a as Record<string, Json>;
  const bo = b as Record<string, Json>;
  let defined = 0;
  for (const k in ao) {
    if (ao[k] === undefined) continue;
    defined++;
    if (!same(ao[k], bo[k])) return false;
  }
  for (const k in bo) if (bo[k] !== undefined) defined--;
  return defined === 0;
}

function compareLeaves(area: PlanChange['area'], kind: PlanChange['kind'], prefix: string, label: string, a: Json, b: Json, out: PlanChange[]) {
  const before = leaves(a, prefix, new Map());
  const after = leaves(b, prefix, new Map());
  for (const path of new Set([...before.keys(), ...after.keys()])) {
    const x = before.get(path);
    const y = after.get(path);
    if (!same(x, y)) out.push({ area, kind, path, label: `${label} ${path.slice(prefix.length + 1) || ''}`.trim(), before: x ?? null, after: y ?? null });
  }
}

function byId<T extends { id: string }>(items: readonly T[]): Map<string, T> {
  return new Map(items.map((i) => [i.id, i]));
}

function lineSettings(line: Line): Omit<Line, 'cells'> {
  const { cells: _cells, ...rest } = line;
  return rest;
}

/** Every difference between plan `a` (before) and plan `b` (after). */
export function planCompare(a: Plan, b: Plan): PlanChange[] {
  const out: PlanChange[] = [];
  const stationName = (id: string) => b.lines.stations.find((s) => s.id === id)?.name ?? a.lines.stations.find((s) => s.id === id)?.name ?? id;

  const sa = byId(a.lines.stations);
  const sb = byId(b.lines.stations);
  for (const id of new Set([...sa.keys(), ...sb.keys()])) {
    const x = sa.get(id);
    const y = sb.get(id);
    if (!x || !y) out.push({ area: 'lines', kind: 'station', path: `lines.stations.${id}`, label: `station ${stationName(id)} ${x ? 'removed' : 'added'}`, before: x ?? null, after: y ?? null });
    else if (!same(x, y)) compareLeaves('lines', 'station', `lines.stations.${id}`, `station ${y.name}`, x, y, out);
  }

  const la = byId(a.lines.lines);
  const lb = byId(b.lines.lines);
  for (const id of new Set([...la.keys(), ...lb.keys()])) {
    const x = la.get(id);
    const y = lb.get(id);
    if (!x || !y) {
      out.push({ area: 'lines', kind: 'line', path: `lines.lines.${id}`, label: `line ${(x ?? y)!.name} ${x ? 'removed' : 'added'}`, before: x ?? null, after: y ?? null });
      continue;
    }
    // Most lines are untouched by an edit: one comparison of the whole line skips the field-by-field walk.
    if (same(x, y)) continue;
    compareLeaves('lines', 'line', `lines.lines.${id}`, `line ${y.name}`, lineSettings(x), lineSettings(y), out);
    const cells = new Set([...Object.keys(x.cells), ...Object.keys(y.cells)]);
    for (const stationId of cells) {
      const before = (x.cells as Record<string, Json>)[stationId] ?? null;
      const after = (y.cells as Record<string, Json>)[stationId] ?? null;
      if (!same(before, after)) out.push({ area: 'lines', kind: 'cell', path: `lines.lines.${id}.cells.${stationId}`, label: `${y.name} at ${stationName(stationId)}`, before, after });
    }
  }

  const { stations: _s1, lines: _l1, ...settingsA } = a.lines;
  const { stations: _s2, lines: _l2, ...settingsB } = b.lines;
  compareLeaves('lines', 'setting', 'lines', 'setting', settingsA, settingsB, out);

  const pa = byId(a.parts.parts);
  const pb = byId(b.parts.parts);
  for (const id of new Set([...pa.keys(), ...pb.keys()])) {
    const x = pa.get(id);
    const y = pb.get(id);
    const name = (y ?? x) as { name?: string };
    if (!x || !y) out.push({ area: 'parts', kind: 'part', path: `parts.parts.${id}`, label: `part ${name.name ?? id} ${x ? 'removed' : 'added'}`, before: x ?? null, after: y ?? null });
    else if (!same(x, y)) compareLeaves('parts', 'part', `parts.parts.${id}`, `part ${name.name ?? id}`, x, y, out);
  }
  const ga = byId(a.parts.longitudinals);
  const gb = byId(b.parts.longitudinals);
  for (const id of new Set([...ga.keys(), ...gb.keys()])) {
    const x = ga.get(id);
    const y = gb.get(id);
    const name = (y ?? x) as { name?: string };
    if (!x || !y) out.push({ area: 'parts', kind: 'longitudinal', path: `parts.longitudinals.${id}`, label: `longitudinal ${name.name ?? id} ${x ? 'removed' : 'added'}`, before: x ?? null, after: y ?? null });
    else if (!same(x, y)) compareLeaves('parts', 'longitudinal', `parts.longitudinals.${id}`, `longitudinal ${name.name ?? id}`, x, y, out);
  }
  return out;
}

/** Which halves of the plan differ: the server checks these against the saver's role. */
export function planTouches(a: Plan, b: Plan): { lines: boolean; parts: boolean } {
  return { lines: !same(a.lines, b.lines), parts: !same(a.parts, b.parts) };
}

/** A short summary of the changes for a revision's history line, e.g. "12 cells, 1 station, 2 parts". */
export function planChangeSummary(changes: readonly PlanChange[]): string {
  if (changes.length === 0) return 'No changes';
  const counts = new Map<string, number>();
  for (const c of changes) counts.set(c.kind, (counts.get(c.kind) ?? 0) + 1);
  const words: Record<PlanChange['kind'], [string, string]> = {
    cell: ['offset', 'offsets'],
    station: ['station change', 'station changes'],
    line: ['line change', 'line changes'],
    setting: ['setting', 'settings'],
    part: ['part change', 'part changes'],
    longitudinal: ['longitudinal change', 'longitudinal changes'],
  };
  return [...counts.entries()].map(([k, n]) => `${n} ${words[k as PlanChange['kind']][n === 1 ? 0 : 1]}`).join(', ') + ' changed';
}
