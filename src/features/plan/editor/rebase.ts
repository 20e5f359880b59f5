import { planCompare, type PlanChange } from '../../../../shared/geometry/plan-compare';
import { planSchema, type Plan } from '../../../../shared/geometry/plan-schema';
import { jsonEqual } from './plan-update';

/**
 * "Reload the latest and reapply my change": after a 409, the person's changes (planCompare between the
 * revision they started from and their draft) are applied onto the revision someone else saved since.
 *
 * planCompare's paths name cells, stations, lines and parts by id and settings leaf by leaf. They are
 * applied at a grain that keeps the plan valid: a cell, a station's or line's field, a part's field, a
 * setting; an array (skin panels, a part's layers) or a value whose kind changed (a crown given another
 * way, a knuckle turned on) is taken whole from the draft. Where the other person changed the same thing
 * to something else, the draft's value wins and the clash is listed so the person can look at it.
 */

export interface RebaseClash {
  label: string;
  mine: unknown;
  theirs: unknown;
}

export type RebaseResult =
  | { ok: true; plan: Plan; applied: PlanChange[]; clashes: RebaseClash[] }
  | { ok: false; message: string; applied: PlanChange[] };

type Json = Record<string, unknown>;
type Entity = { id: string };

const discriminators = ['kind', 'by', 'shape'] as const;

function isObject(v: unknown): v is Json {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Descend into `segments` while both sides are objects of the same kind; the path of the grain to copy. */
function grainOf(source: unknown, target: unknown, segments: readonly string[]): string[] {
  const grain: string[] = [];
  let s = source;
  let t = target;
  for (const seg of segments) {
    grain.push(seg);
    const ns = isObject(s) ? s[seg] : undefined;
    const nt = isObject(t) ? t[seg] : undefined;
    const sameKind = isObject(ns) && isObject(nt) && discriminators.every((d) => ns[d] === nt[d]);
    if (!sameKind) break;
    s = ns;
    t = nt;
  }
  return grain;
}

function valueAt(root: unknown, path: readonly string[]): unknown {
  let v = root;
  for (const seg of path) v = isObject(v) ? v[seg] : undefined;
  return v;
}

function setAt(root: Json, path: readonly string[], value: unknown): void {
  let v: Json = root;
  for (const seg of path.slice(0, -1)) {
    if (!isObject(v[seg])) v[seg] = {};
    v = v[seg] as Json;
  }
  const last = path[path.length - 1]!;
  if (value === undefined) delete v[last];
  else v[last] = structuredClone(value);
}

/** The id at the start of `rest` among `ids` (ids may hold dots, so the longest match wins), and what follows it. */
function splitId(rest: string, ids: Iterable<string>): { id: string; tail: string[] } | null {
  let best: string | null = null;
  for (const id of ids) {
    if ((rest === id || rest.startsWith(`${id}.`)) && (best === null || id.length > best.length)) best = id;
  }
  if (best === null) return null;
  const tail = rest.slice(best.length + 1);
  return { id: best, tail: tail ? tail.split('.') : [] };
}

interface Located {
  list: 'stations' | 'lines' | 'parts' | 'longitudinals' | 'settings';
  id: string | null;
  /** Within the entity (or the lines' settings): empty for a whole entity added or removed. */
  tail: string[];
}

function listOf(plan: Plan, list: Located['list']): Entity[] {
  if (list === 'stations') return plan.lines.stations;
  if (list === 'lines') return plan.lines.lines;
  if (list === 'parts') return plan.parts.parts;
  if (list === 'longitudinals') return plan.parts.longitudinals;
  return [];
}

function locate(change: PlanChange, plans: readonly Plan[]): Located | null {
  const prefixes: [string, Located['list']][] = [
    ['lines.stations.', 'stations'],
    ['lines.lines.', 'lines'],
    ['parts.parts.', 'parts'],
    ['parts.longitudinals.', 'longitudinals'],
  ];
  for (const [prefix, list] of prefixes) {
    if (!change.path.startsWith(prefix)) continue;
    const ids = new Set(plans.flatMap((p) => listOf(p, list).map((e) => e.id)));
    const found = splitId(change.path.slice(prefix.length), ids);
    return found ? { list, id: found.id, tail: found.tail } : null;
  }
  if (change.path.startsWith('lines.')) return { list: 'settings', id: null, tail: change.path.slice('lines.'.length).split('.') };
  return null;
}

function entityIn(plan: Plan | Json, list: Located['list'], id: string | null): Json | undefined {
  if (list === 'settings') return (plan as Plan).lines as unknown as Json;
  return (listOf(plan as Plan, list) as unknown as Json[]).find((e) => e.id === id);
}

/** The grain a change touches, as a key, and the path of the grain within its entity. */
function grainKey(loc: Located, source: Plan, target: Plan): { key: string; path: string[] } {
  if (loc.tail.length === 0) return { key: `${loc.list}:${loc.id}`, path: [] };
  if (loc.list === 'lines' && loc.tail[0] === 'cells') {
    const path = ['cells', loc.tail.slice(1).join('.')];
    return { key: `${loc.list}:${loc.id}:${path.join('\u0000')}`, path };
  }
  const s = entityIn(source, loc.list, loc.id);
  const t = entityIn(target, loc.list, loc.id);
  // A part whose kind changed is taken whole: its fields belong to its kind.
  if (loc.list === 'parts' && s && t && s.kind !== t.kind) return { key: `${loc.list}:${loc.id}:*`, path: [] };
  const path = grainOf(s, t, loc.tail);
  return { key: `${loc.list}:${loc.id}:${path.join('\u0000')}`, path };
}

function mutableList(plan: Json, list: Located['list']): Json[] {
  const lines = plan.lines as Json;
  const parts = plan.parts as Json;
  if (list === 'stations') return lines.stations as Json[];
  if (list === 'lines') return lines.lines as Json[];
  if (list === 'parts') return parts.parts as Json[];
  return parts.longitudinals as Json[];
}

function removeStationCells(plan: Json, stationId: string) {
  for (const line of mutableList(plan, 'lines')) delete (line.cells as Json)[stationId];
}

/** Ids of `mine` in its order, then any others of `out` in theirs. */
function orderLike(items: Json[], mineIds: string[]): Json[] {
  const byId = new Map(items.map((e) => [e.id as string, e]));
  const ordered = mineIds.filter((id) => byId.has(id)).map((id) => byId.get(id)!);
  return [...ordered, ...items.filter((e) => !mineIds.includes(e.id as string))];
}

export function planRebase(base: Plan, mine: Plan, latest: Plan): RebaseResult {
  const applied = planCompare(base, mine);
  const theirs = planCompare(base, latest);
  const out = structuredClone(latest) as unknown as Json;
  const plans = [base, mine, latest];
  const mineGrains = new Set<string>();

  for (const change of applied) {
    const loc = locate(change, plans);
    if (!loc) continue;
    const { key, path } = grainKey(loc, mine, latest);
    mineGrains.add(key);
    const source = entityIn(mine, loc.list, loc.id);
    if (loc.list === 'settings') {
      setAt(out.lines as Json, path, valueAt(source, path));
      continue;
    }
    const list = mutableList(out, loc.list);
    const index = list.findIndex((e) => e.id === loc.id);
    if (path.length === 0) {
      if (!source) {
        if (index >= 0) list.splice(index, 1);
        if (loc.list === 'stations') removeStationCells(out, loc.id!);
      } else if (index >= 0) {
        list[index] = structuredClone(source);
      } else if (loc.list === 'stations') {
        const at = list.findIndex((s) => (s.x as number) > (source.x as number));
        list.splice(at < 0 ? list.length : at, 0, structuredClone(source));
      } else {
        list.push(structuredClone(source));
      }
      continue;
    }
    // A field of something the other person deleted has nowhere to go.
    if (index < 0 || !source) continue;
    if (loc.list === 'lines' && path[0] === 'cells') {
      const stationId = path[1]!;
      const stationKept = mutableList(out, 'stations').some((s) => s.id === stationId);
      if (stationKept) (list[index]!.cells as Json)[stationId] = structuredClone((source.cells as Json)[stationId] ?? null);
      continue;
    }
    setAt(list[index]!, path, valueAt(source, path));
  }

  // Row and column order is not a change planCompare lists; a reorder in the draft is kept all the same.
  // Only a real reorder counts: adding or removing an item leaves the others' order as it was.
  for (const list of ['lines', 'stations'] as const) {
    const mineIds = listOf(mine, list).map((e) => e.id);
    const baseIds = listOf(base, list).map((e) => e.id);
    const common = (ids: string[], other: string[]) => ids.filter((id) => other.includes(id));
    if (!jsonEqual(common(baseIds, mineIds), common(mineIds, baseIds))) (out.lines as Json)[list] = orderLike(mutableList(out, list), mineIds);
  }

  const clashes: RebaseClash[] = [];
  const seen = new Set<string>();
  for (const change of theirs) {
    const loc = locate(change, plans);
    if (!loc) continue;
    const { key, path } = grainKey(loc, mine, latest);
    if (!mineGrains.has(key) || seen.has(key)) continue;
    seen.add(key);
    const mineValue = path.length ? valueAt(entityIn(mine, loc.list, loc.id), path) : entityIn(mine, loc.list, loc.id);
    const theirValue = path.length ? valueAt(entityIn(latest, loc.list, loc.id), path) : entityIn(latest, loc.list, loc.id);
    if (!jsonEqual(mineValue, theirValue)) clashes.push({ label: change.label, mine: mineValue ?? null, theirs: theirValue ?? null });
  }

  const parsed = planSchema.safeParse(out);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return { ok: false, message: `Your changes do not fit on the latest revision (${issue?.path.join('.')}: ${issue?.message}). Save yours as a copy of the hull instead.`, applied };
  }
  return { ok: true, plan: parsed.data, applied, clashes };
}
