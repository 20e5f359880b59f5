import type { HullLines, Line, PointLine, Station } from './hull-schema';
import type { Notation } from './notation-schema';
import { lengthFormat, lengthParse } from './notation';
import { degToRad, radToDeg } from './types';

/**
 * The table of offsets as rows and columns of text (a CSV file, a block pasted from a spreadsheet), and
 * back. Layout, one row per line and one column per station:
 *
 *     line,kind,fixed,angle,knuckle,St 0,St 1,St 2
 *     Station position,x,,,,0,600,1200
 *     WL 300,waterline,300,,,210,455,512
 *     Buttock 200,buttock,200,,,,180,95
 *     Diagonal A,diagonal,600,35,,410,560,640
 *     Sheer,sheer height,,,yes,980,905,870
 *     Sheer,sheer half-breadth,,,yes,320,610,700
 *
 * - `fixed` is the waterline's height, the buttock's half-breadth, the diagonal's height on the centreline;
 *   `angle` is the diagonal's angle below the horizontal in degrees.
 * - Point lines (sheer, chine, keel, point) take two rows of the same name: `<role> height` and
 *   `<role> half-breadth`.
 * - `knuckle` is `yes` for a line that is a corner in every section.
 * - Lengths are read in the notation chosen for the import (never guessed); empty cells are empty offsets.
 */

/** A bad cell: 1-based row and column of the table, the header of that column, what is wrong. */
export interface OffsetsTableIssue {
  row: number;
  column: number;
  columnName: string;
  field: string;
  value: string;
  message: string;
}

export type OffsetsTableRead = { ok: true; stations: Station[]; lines: Line[] } | { ok: false; issues: OffsetsTableIssue[] };

const FIXED_COLUMNS = ['line', 'kind', 'fixed', 'angle', 'knuckle'] as const;
const POINT_ROLES = { sheer: 'sheer', chine: 'chine', keel: 'keel', point: 'other' } as const;

function slug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 40) || 'x';
}

/** Ids kept by name from the plan being replaced, so parts and history still point at the same stations. */
function idMaker(prefix: string, existing: Map<string, string>) {
  const used = new Set(existing.values());
  return (name: string) => {
    const kept = existing.get(name);
    if (kept) return kept;
    let id = `${prefix}-${slug(name)}`;
    for (let n = 2; used.has(id); n += 1) id = `${prefix}-${slug(name)}-${n}`;
    used.add(id);
    return id;
  };
}

/**
 * Read a table of offsets from rows of text. Every bad cell is reported (row, column, value, reason);
 * the result is all or nothing. `previous` supplies the ids of stations and lines kept by name.
 */
export function offsetsTableRead(rows: readonly (readonly string[])[], notation: Notation, previous?: Pick<HullLines, 'stations' | 'lines'>): OffsetsTableRead {
  const issues: OffsetsTableIssue[] = [];
  const cleaned = rows.map((r) => r.map((c) => (c ?? '').trim())).filter((r) => r.some((c) => c !== ''));
  const header = cleaned[0] ?? [];
  const colName = (c: number) => header[c] ?? `column ${c + 1}`;
  const issue = (row: number, column: number, field: string, value: string, message: string) => issues.push({ row: row + 1, column: column + 1, columnName: colName(column), field, value, message });

  if (cleaned.length < 3) {
    return { ok: false, issues: [{ row: 1, column: 1, columnName: header[0] ?? '', field: 'table', value: '', message: `the table needs a header row, a station-position row and at least one line (found ${cleaned.length} rows)` }] };
  }
  FIXED_COLUMNS.forEach((name, c) => {
    if ((header[c] ?? '').toLowerCase() !== name) issue(0, c, 'header', header[c] ?? '', `column ${c + 1} must be headed "${name}" (the layout is: ${FIXED_COLUMNS.join(', ')}, then one column per station)`);
  });
  const stationNames = header.slice(FIXED_COLUMNS.length);
  if (stationNames.length < 2) issue(0, FIXED_COLUMNS.length, 'header', '', 'at least two station columns are needed');
  const seen = new Set<string>();
  stationNames.forEach((name, i) => {
    const c = i + FIXED_COLUMNS.length;
    if (!name) issue(0, c, 'station', name, 'every station column needs a name');
    else if (seen.has(name)) issue(0, c, 'station', name, `station "${name}" appears twice`);
    seen.add(name);
  });
  if (issues.length) return { ok: false, issues };

  const length = (r: number, c: number, field: string, text: string, required: boolean): number | null => {
    if (text === '') {
      if (required) issue(r, c, field, text, `${field} is required`);
      return null;
    }
    const parsed = lengthParse(text, notation);
    if (parsed === null) return null;
    if (!parsed.ok) {
      issue(r, c, field, text, parsed.message);
      return null;
    }
    return parsed.mm;
  };

  const stationId = idMaker('st', new Map((previous?.stations ?? []).map((s) => [s.name, s.id])));
  const lineId = idMaker('ln', new Map((previous?.lines ?? []).map((l) => [l.name, l.id])));
  const stationRow = cleaned.findIndex((r, i) => i > 0 && (r[1] ?? '').toLowerCase() === 'x');
  if (stationRow < 0) {
    issue(1, 1, 'kind', cleaned[1]?.[1] ?? '', 'one row must have kind "x" and give each station\'s position');
    return { ok: false, issues };
  }
  const stations: Station[] = stationNames.map((name, i) => ({
    id: stationId(name),
    name,
    x: length(stationRow, i + FIXED_COLUMNS.length, `position of ${name}`, cleaned[stationRow][i + FIXED_COLUMNS.length] ?? '', true) ?? 0,
  }));
  for (let i = 1; i < stations.length; i += 1) {
    if (stations[i].x <= stations[i - 1].x && issues.length === 0) {
      issue(stationRow, i + FIXED_COLUMNS.length, `position of ${stations[i].name}`, cleaned[stationRow][i + FIXED_COLUMNS.length], `stations must be in order of increasing x: ${stations[i].name} is not beyond ${stations[i - 1].name}`);
    }
  }

  const lines: Line[] = [];
  const pointLines = new Map<string, { line: PointLine; heights: boolean; breadths: boolean; row: number }>();
  cleaned.forEach((r, rowIndex) => {
    if (rowIndex === 0 || rowIndex === stationRow) return;
    const [name, kindText, fixedText, angleText, knuckleText] = r;
    const kind = (kindText ?? '').toLowerCase().replace(/\s+/g, ' ');
    if (!name) issue(rowIndex, 0, 'line', '', 'every row needs the line\'s name');
    const knuckle = (knuckleText ?? '').toLowerCase();
    if (!['', 'yes', 'no'].includes(knuckle)) issue(rowIndex, 4, 'knuckle', knuckleText, 'knuckle must be "yes", "no" or empty');
    const knuckleValue = knuckle === 'yes' ? { fromX: null, toX: null } : null;
    const cellsOf = (field: string) => {
      const cells: Record<string, number | null> = {};
      stations.forEach((s, i) => {
        cells[s.id] = length(rowIndex, i + FIXED_COLUMNS.length, `${field} at ${s.name}`, r[i + FIXED_COLUMNS.length] ?? '', false);
      });
      return cells;
    };
    if (kind === 'waterline' || kind === 'buttock' || kind === 'diagonal') {
      const fixed = length(rowIndex, 2, 'fixed', fixedText ?? '', true) ?? 0;
      const field = kind === 'waterline' ? 'half-breadth' : kind === 'buttock' ? 'height' : 'distance';
      const base = { id: lineId(name), name, knuckle: knuckleValue, cells: cellsOf(field) };
      if (kind === 'waterline') lines.push({ ...base, kind, z: fixed });
      else if (kind === 'buttock') lines.push({ ...base, kind, y: fixed });
      else {
        const angle = Number((angleText ?? '').replace(',', '.'));
        if (angleText === '' || !Number.isFinite(angle) || angle <= -90 || angle >= 90) issue(rowIndex, 3, 'angle', angleText ?? '', 'a diagonal needs its angle below the horizontal in degrees (between -90 and 90)');
        lines.push({ ...base, kind, originZ: fixed, angle: degToRad(Number.isFinite(angle) ? angle : 0) });
      }
      return;
    }
    const match = /^(sheer|chine|keel|point) (height|half-breadth)$/.exec(kind);
    if (!match) {
      issue(rowIndex, 1, 'kind', kindText ?? '', 'kind must be x, waterline, buttock, diagonal, or sheer/chine/keel/point followed by "height" or "half-breadth"');
      return;
    }
    const role = POINT_ROLES[match[1] as keyof typeof POINT_ROLES];
    const key = `${name}\u0000${role}`;
    let entry = pointLines.get(key);
    if (!entry) {
      entry = { line: { id: lineId(name), name, kind: 'point', role, knuckle: knuckleValue, cells: {} }, heights: false, breadths: false, row: rowIndex };
      pointLines.set(key, entry);
      lines.push(entry.line);
    }
    if (knuckleValue) entry.line.knuckle = knuckleValue;
    const isHeight = match[2] === 'height';
    if ((isHeight && entry.heights) || (!isHeight && entry.breadths)) issue(rowIndex, 1, 'kind', kindText ?? '', `"${name}" has two ${match[2]} rows`);
    if (isHeight) entry.heights = true;
    else entry.breadths = true;
    const values = cellsOf(isHeight ? 'height' : 'half-breadth');
    for (const s of stations) {
      const prev = (entry.line.cells[s.id] ?? { y: null, z: null }) as { y: number | null; z: number | null };
      entry.line.cells[s.id] = (isHeight ? { ...prev, z: values[s.id] } : { ...prev, y: values[s.id] }) as { y: number; z: number };
    }
  });
  for (const entry of pointLines.values()) {
    if (!entry.heights || !entry.breadths) {
      issue(entry.row, 1, 'kind', entry.line.name, `"${entry.line.name}" needs both a height row and a half-breadth row`);
      continue;
    }
    stations.forEach((s, i) => {
      const cell = entry.line.cells[s.id] as { y: number | null; z: number | null };
      if (cell.y === null && cell.z === null) entry.line.cells[s.id] = null;
      else if (cell.y === null || cell.z === null) issue(entry.row, i + FIXED_COLUMNS.length, `${entry.line.name} at ${s.name}`, '', `"${entry.line.name}" at ${s.name} has a ${cell.y === null ? 'height but no half-breadth' : 'half-breadth but no height'}`);
    });
  }
  if (issues.length) return { ok: false, issues };
  return { ok: true, stations, lines };
}

const ROLE_WORD: Record<PointLine['role'], string> = { sheer: 'sheer', chine: 'chine', keel: 'keel', other: 'point' };

/** Write the table of offsets as rows of text in the given notation (the layout offsetsTableRead reads). */
export function offsetsTableRows(lines: Pick<HullLines, 'stations' | 'lines'>, notation: Notation): string[][] {
  const stations = [...lines.stations].sort((a, b) => a.x - b.x);
  const fmt = (v: number | null | undefined) => (v === null || v === undefined ? '' : lengthFormat(v, notation));
  const rows: string[][] = [[...FIXED_COLUMNS, ...stations.map((s) => s.name)], ['Station position', 'x', '', '', '', ...stations.map((s) => fmt(s.x))]];
  for (const line of lines.lines) {
    const knuckle = line.knuckle ? 'yes' : '';
    if (line.kind === 'point') {
      const cells = line.cells;
      rows.push([line.name, `${ROLE_WORD[line.role]} height`, '', '', knuckle, ...stations.map((s) => fmt(cells[s.id]?.z))]);
      rows.push([line.name, `${ROLE_WORD[line.role]} half-breadth`, '', '', knuckle, ...stations.map((s) => fmt(cells[s.id]?.y))]);
      continue;
    }
    const fixed = line.kind === 'waterline' ? line.z : line.kind === 'buttock' ? line.y : line.originZ;
    const angle = line.kind === 'diagonal' ? String(Math.round(radToDeg(line.angle) * 1e6) / 1e6) : '';
    const cells = line.cells;
    rows.push([line.name, line.kind, fmt(fixed), angle, knuckle, ...stations.map((s) => fmt(cells[s.id]))]);
  }
  return rows;
}
