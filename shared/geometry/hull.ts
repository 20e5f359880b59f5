import { type HullLines, type HullLinesInput, type Line, type Station, hullLinesSchema } from './hull-schema';
import { camberHeightAt, camberIssues, camberReferenceHalfBeamMm } from './camber';
import { type FittedLine, lineFit, linePieces, lineReaches, lineValueAt } from './lines';
import { SECTION_MERGE_TOLERANCE_MM, sectionNodesAt } from './nodes';
import { splineValueAt } from './spline';
import { GeometryInputError, type GeometryIssue } from './types';

/**
 * A hull's lines checked and fitted once: everything `sectionAt` needs, as plain data. The editor
 * rebuilds it when the table changes, not on every pointer move.
 */
export interface BuiltHull {
  /** The lines as parsed (defaults filled in). */
  lines: HullLines;
  /** Stations in order of x. */
  stations: Station[];
  /** Every line fitted along x, one entry per piece between empty cells (empty rows are left out). */
  fitted: FittedLine[];
  /** First and last station x (mm). */
  xMin: number;
  xMax: number;
  /** The sheer line's id, or null when the table has none. */
  sheerLineId: string | null;
  /** Widest half-breadth of the sheer (mm, sampled along x), or null without a sheer: the camber pattern's beam. */
  maxSheerHalfBeamMm: number | null;
}

/** Height disorder (mm) between waterlines in one section that counts as the section doubling back. */
export const WATERLINE_ORDER_TOLERANCE_MM = 0.5;

/**
 * Check and fit a hull's lines.
 * @throws GeometryInputError with every issue found (each naming line, station, field and value).
 */
export function hullBuild(input: HullLinesInput | HullLines): BuiltHull {
  const result = hullCheck(input);
  if (!result.ok) throw new GeometryInputError(result.issues);
  return result.hull;
}

/** Everything wrong with a hull's lines (empty when `hullBuild` would succeed). */
export function hullIssues(input: unknown): GeometryIssue[] {
  const result = hullCheck(input);
  return result.ok ? [] : result.issues;
}

/** `hullBuild` without throwing: the built hull or the issues. */
export function hullCheck(input: unknown): { ok: true; hull: BuiltHull } | { ok: false; issues: GeometryIssue[] } {
  const parsed = hullLinesSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: parsed.error.issues.map((i) => zodIssue(input, i.path, i.message)) };
  const lines = parsed.data;
  const issues = tableIssues(lines);
  if (issues.length > 0) return { ok: false, issues };
  const stations = [...lines.stations].sort((a, b) => a.x - b.x);
  const fitted: FittedLine[] = [];
  for (const line of lines.lines) fitted.push(...lineFit(line, stations));
  const sectionIssues = stationSectionIssues(lines, stations, fitted);
  if (sectionIssues.length > 0) return { ok: false, issues: sectionIssues };
  const sheers = fitted.filter((f) => f.role === 'sheer');
  const sheer = sheers[0] ?? null;
  const deckIssues = sheer ? deckCamberIssues(lines, stations, sheers) : [];
  if (deckIssues.length > 0) return { ok: false, issues: deckIssues };
  return {
    ok: true,
    hull: {
      lines,
      stations,
      fitted,
      xMin: stations[0]!.x,
      xMax: stations[stations.length - 1]!.x,
      sheerLineId: sheer?.id ?? null,
      maxSheerHalfBeamMm: sheer ? Math.max(...sheers.map(maxOf)) : null,
    },
  };
}

/** Widest value of a line, from its stations and 8 samples a span (a sheer's widest point lies between stations). */
function maxOf(line: FittedLine): number {
  let best = -Infinity;
  for (let k = 0; k < line.xs.length - 1; k++) {
    for (let i = 0; i <= 8; i++) {
      const x = line.xs[k]! + ((line.xs[k + 1]! - line.xs[k]!) * i) / 8;
      best = Math.max(best, splineValueAt(line.values, x));
    }
  }
  return best;
}

/**
 * Whether the deck's camber can be drawn at every station: the camber itself, and (one pattern) a
 * pattern at least as wide as every station's beam. Each issue gains the station it was found at.
 */
function deckCamberIssues(h: HullLines, stations: readonly Station[], sheers: readonly FittedLine[]): GeometryIssue[] {
  const deck = h.deck;
  if (!deck) return [];
  const own = camberIssues(deck.camber);
  if (own.length > 0) return own.map((i) => ({ ...i, field: `deck.camber.${i.field ?? ''}`.replace(/\.$/, '') }));
  const widest = Math.max(...sheers.map(maxOf));
  for (const st of stations) {
    const sheer = sheers.find((f) => lineReaches(f, st.x));
    const hb = sheer ? lineValueAt(sheer, st.x) : null;
    if (!sheer || hb === null) continue;
    try {
      const ref = camberReferenceHalfBeamMm(deck.camber, Math.max(widest, hb));
      camberHeightAt(deck.camber, 0, hb, ref);
    } catch (e) {
      if (!(e instanceof GeometryInputError)) throw e;
      return e.issues.map((i) => ({ ...i, stationId: st.id, lineId: sheer.id, message: `station ${st.name}: deck camber: ${i.message}` }));
    }
  }
  try {
    // The widest beam may fall between stations: the pattern must serve it too.
    camberHeightAt(deck.camber, 0, widest, camberReferenceHalfBeamMm(deck.camber, widest));
  } catch (e) {
    if (!(e instanceof GeometryInputError)) throw e;
    return e.issues.map((i) => ({ ...i, lineId: sheers[0]!.id, message: `at the widest beam (half-beam ${fmt(widest)} mm): deck camber: ${i.message}` }));
  }
  return [];
}

const fmt = (v: number): string => String(Number(v.toFixed(2)));

function zodIssue(input: unknown, path: readonly PropertyKey[], message: string): GeometryIssue {
  const field = path.map((p, i) => (typeof p === 'number' ? `[${p}]` : `${i > 0 ? '.' : ''}${String(p)}`)).join('');
  let value: unknown = input;
  for (const p of path) value = value !== null && typeof value === 'object' ? (value as Record<PropertyKey, unknown>)[p] : undefined;
  const root = input as { lines?: { id?: unknown; name?: unknown }[]; stations?: { id?: unknown; name?: unknown }[] } | null;
  const issue: GeometryIssue = { code: 'invalid-field', message: `${field || 'the hull'}: ${message}`, field, value };
  if (path[0] === 'lines' && typeof path[1] === 'number') {
    const line = root?.lines?.[path[1]];
    if (typeof line?.id === 'string') issue.lineId = line.id;
    if (path[2] === 'cells' && typeof path[3] === 'string') issue.stationId = path[3];
    const st = Array.isArray(root?.stations) ? root.stations.find((s) => s?.id === issue.stationId) : undefined;
    const stName = typeof st?.name === 'string' ? st.name : issue.stationId;
    if (typeof line?.name === 'string') issue.message = `line ${line.name}${issue.stationId ? `, station ${stName}` : ''}: ${field}: ${message}`;
  }
  if (path[0] === 'stations' && typeof path[1] === 'number') {
    const st = root?.stations?.[path[1]];
    if (typeof st?.id === 'string') issue.stationId = st.id;
  }
  if (typeof value === 'number' && value < 0 && /thickness|sheathing|clampWidth/i.test(String(path[path.length - 1]))) {
    issue.code = 'negative-thickness';
    issue.message = `${field} is ${fmt(value)} mm: a thickness cannot be negative`;
  }
  return issue;
}

/** Problems visible in the table itself, before any curve is fitted. */
function tableIssues(h: HullLines): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  const filled = h.lines.filter((l) => Object.values(l.cells).some((c) => c !== null && c !== undefined));
  if (h.stations.length === 0 || filled.length === 0) {
    return [{ code: 'empty-table', message: 'the table of offsets is empty: it needs stations and at least one line with values', field: h.stations.length === 0 ? 'stations' : 'lines', value: h.stations.length === 0 ? h.stations.length : h.lines.length }];
  }
  if (h.stations.length === 1) {
    const st = h.stations[0]!;
    return [{ code: 'one-station', message: `the table has only one station (${st.name}): a line along the hull needs at least two`, stationId: st.id, field: 'stations', value: 1 }];
  }
  const stationIds = new Map<string, Station>();
  const byX = new Map<number, Station>();
  for (const st of h.stations) {
    if (stationIds.has(st.id)) issues.push({ code: 'duplicate-station-id', message: `two stations share the id ${st.id}`, stationId: st.id, field: 'id', value: st.id });
    stationIds.set(st.id, st);
    const twin = byX.get(st.x);
    if (twin) issues.push({ code: 'duplicate-station-x', message: `stations ${twin.name} and ${st.name} are both at x = ${fmt(st.x)} mm`, stationId: st.id, field: 'x', value: st.x });
    byX.set(st.x, st);
  }
  const lineIds = new Set<string>();
  for (const line of h.lines) {
    if (lineIds.has(line.id)) issues.push({ code: 'duplicate-line-id', message: `two lines share the id ${line.id}`, lineId: line.id, field: 'id', value: line.id });
    lineIds.add(line.id);
    issues.push(...lineIssues(line, stationIds));
  }
  if (issues.length === 0) {
    const sorted = [...h.stations].sort((a, b) => a.x - b.x);
    for (const line of h.lines) {
      const pieces = linePieces(line, sorted);
      const total = pieces.reduce((n, p) => n + p.length, 0);
      for (const p of pieces) {
        if (p.length !== 1 || total === 1) continue;
        const { station, value, height } = p[0]!;
        issues.push({
          code: 'line-single-value',
          message: `line ${line.name} has a value at station ${station.name} with empty cells either side: a line needs at least two neighbouring values to run along the hull (fill in its neighbour or clear it)`,
          lineId: line.id,
          stationId: station.id,
          field: 'cells',
          value: height === null ? value : { y: value, z: height },
        });
      }
    }
  }
  for (const role of ['sheer', 'keel'] as const) {
    const withRole = filled.filter((l) => l.kind === 'point' && l.role === role);
    if (withRole.length > 1) {
      issues.push({ code: `duplicate-${role}`, message: `the table has ${withRole.length} ${role} lines (${withRole.map((l) => l.name).join(', ')}); a hull has one`, lineId: withRole[1]!.id, field: 'role', value: role });
    }
  }
  h.skin.panels.forEach((p, i) => {
    for (const key of ['fromLineId', 'toLineId'] as const) {
      const id = p[key];
      if (id === null) continue;
      const line = h.lines.find((l) => l.id === id);
      if (!line || line.kind !== 'point') {
        issues.push({ code: 'panel-line-unknown', message: `skin panel ${p.name} is bounded by ${id}, which is not a point line of this hull (sheer, chine, keel or other)`, lineId: id, field: `skin.panels[${i}].${key}`, value: id });
      }
    }
  });
  if (h.deck && !filled.some((l) => l.kind === 'point' && l.role === 'sheer')) {
    issues.push({ code: 'deck-needs-sheer', message: 'the deck is cut to the sheer, but the table has no sheer line with values', field: 'deck', value: null });
  }
  return issues;
}

function lineIssues(line: Line, stations: Map<string, Station>): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  let count = 0;
  for (const [stationId, cell] of Object.entries(line.cells)) {
    if (cell === null || cell === undefined) continue;
    count++;
    const st = stations.get(stationId);
    const where = `line ${line.name}, station ${st?.name ?? stationId}`;
    if (!st) {
      issues.push({ code: 'unknown-station', message: `line ${line.name} has a value for station ${stationId}, which is not in the table`, lineId: line.id, stationId, field: `cells.${stationId}`, value: cell });
      continue;
    }
    const halfBreadth = line.kind === 'point' ? (cell as { y: number }).y : line.kind === 'waterline' ? (cell as number) : null;
    if (halfBreadth !== null && halfBreadth < 0) {
      issues.push({ code: 'negative-half-breadth', message: `${where}: half-breadth ${fmt(halfBreadth)} mm is negative; half-breadths are measured out from the centreline`, lineId: line.id, stationId, field: line.kind === 'point' ? 'y' : 'halfBreadth', value: halfBreadth });
    }
    if (line.kind === 'diagonal' && (cell as number) < 0) {
      issues.push({ code: 'negative-diagonal', message: `${where}: diagonal offset ${fmt(cell as number)} mm is negative; it is measured along the diagonal from the centreline`, lineId: line.id, stationId, field: 'distance', value: cell });
    }
  }
  if (count === 1) {
    const only = Object.entries(line.cells).find(([, c]) => c !== null && c !== undefined)!;
    issues.push({ code: 'line-single-value', message: `line ${line.name} has a value at only one station (${stations.get(only[0])?.name ?? only[0]}): a line needs at least two to run along the hull`, lineId: line.id, stationId: only[0], field: 'cells', value: only[1] });
  }
  if (line.kind === 'buttock' && line.y < 0) {
    issues.push({ code: 'negative-half-breadth', message: `buttock ${line.name} is at half-breadth ${fmt(line.y)} mm; buttocks lie out from the centreline`, lineId: line.id, field: 'y', value: line.y });
  }
  if (line.kind === 'diagonal' && Math.abs(line.angle) > Math.PI / 2) {
    issues.push({ code: 'diagonal-angle', message: `diagonal ${line.name} has angle ${fmt(line.angle)} rad; it must go outboard, within a right angle of the horizontal`, lineId: line.id, field: 'angle', value: line.angle });
  }
  const k = line.knuckle;
  if (k && k.fromX !== null && k.toX !== null && k.fromX > k.toX) {
    issues.push({ code: 'knuckle-range', message: `line ${line.name} is a knuckle from x = ${fmt(k.fromX)} to x = ${fmt(k.toX)} mm: the start is after the end`, lineId: line.id, field: 'knuckle', value: k });
  }
  return issues;
}

/**
 * Lines that cross where they must not, found in the section at each station: a point beyond the sheer
 * (a chine above the sheer), and waterlines out of height order (the section would double back on itself).
 */
function stationSectionIssues(h: HullLines, stations: readonly Station[], fitted: readonly FittedLine[]): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  const byId = new Map(fitted.map((f) => [f.id, f]));
  const raw = new Map(h.lines.map((l) => [l.id, l]));
  for (const st of stations) {
    const { all, to } = sectionNodesAt(fitted, st.x, SECTION_MERGE_TOLERANCE_MM);
    const sheerNode = all.findIndex((n) => n.lineIds.some((id) => byId.get(id)?.role === 'sheer'));
    if (sheerNode >= 0) {
      const sheer = all[sheerNode]!;
      const sheerName = byId.get(sheer.lineIds.find((id) => byId.get(id)?.role === 'sheer')!)!.name;
      for (let i = to + 1; i < all.length; i++) {
        for (const id of all[i]!.lineIds) {
          const line = byId.get(id)!;
          const p = all[i]!;
          const above = p.z > sheer.z;
          issues.push({
            code: line.role === 'chine' && above ? 'chine-above-sheer' : 'beyond-sheer',
            message: `station ${st.name}: ${line.name} (half-breadth ${fmt(p.y)}, height ${fmt(p.z)} mm) lies ${above ? 'above' : 'outboard of'} the sheer ${sheerName} (half-breadth ${fmt(sheer.y)}, height ${fmt(sheer.z)} mm)`,
            lineId: id,
            stationId: st.id,
            field: cellField(raw.get(id)!, above),
            value: cellValue(raw.get(id)!, st.id),
          });
        }
      }
    }
    // Waterlines in section order must climb. The one out of order with the most others is the misread one.
    const wls: { id: string; z: number; y: number }[] = [];
    for (const node of all) for (const id of node.lineIds) if (byId.get(id)!.kind === 'waterline') wls.push({ id, z: byId.get(id)!.fixedZ!, y: node.y });
    const against = wls.map((a, i) => wls.filter((b, j) => (j > i ? a.z > b.z + WATERLINE_ORDER_TOLERANCE_MM : b.z > a.z + WATERLINE_ORDER_TOLERANCE_MM)));
    let worst = -1;
    against.forEach((list, i) => {
      if (list.length > 0 && (worst < 0 || list.length > against[worst]!.length)) worst = i;
    });
    if (worst >= 0) {
      const w = wls[worst]!;
      const line = byId.get(w.id)!;
      const names = against[worst]!.map((o) => byId.get(o.id)!.name).join(', ');
      issues.push({
        code: 'section-crosses-itself',
        message: `station ${st.name}: the section crosses itself: waterline ${line.name} (height ${fmt(w.z)}, half-breadth ${fmt(w.y)} mm) falls out of height order with ${names} going from keel to sheer; check its half-breadth`,
        lineId: w.id,
        stationId: st.id,
        field: 'halfBreadth',
        value: cellValue(raw.get(w.id)!, st.id),
      });
    }
  }
  return issues;
}

function cellField(line: Line, above: boolean): string {
  if (line.kind === 'point') return above ? 'z' : 'y';
  return line.kind === 'waterline' ? 'halfBreadth' : line.kind === 'buttock' ? 'height' : 'distance';
}

function cellValue(line: Line, stationId: string): unknown {
  return line.cells[stationId] ?? null;
}
