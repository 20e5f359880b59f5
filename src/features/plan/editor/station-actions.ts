import type { Line } from '../../../../shared/geometry/hull-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { idFor } from './ids';
import { arrayMove, withLines } from './plan-update';

/** Add a station at x (mm). It goes in order of x among the stations, which is how the table reads. */
export function stationAdd(plan: Plan, args: { name: string; x: number; id?: string }): Plan {
  const name = args.name.trim();
  if (!name || !Number.isFinite(args.x)) return plan;
  return withLines(plan, (lines) => {
    const id = args.id ?? idFor('st', name, lines.stations.map((s) => s.id));
    const stations = [...lines.stations];
    const at = stations.findIndex((s) => s.x > args.x);
    stations.splice(at < 0 ? stations.length : at, 0, { id, name, x: args.x });
    return { ...lines, stations };
  });
}

function stationChange(plan: Plan, stationId: string, change: { name?: string; x?: number }): Plan {
  return withLines(plan, (lines) => {
    const index = lines.stations.findIndex((s) => s.id === stationId);
    const station = lines.stations[index];
    if (!station) return lines;
    const next = { ...station, ...change };
    if (next.name === station.name && next.x === station.x) return lines;
    const stations = [...lines.stations];
    stations[index] = next;
    return { ...lines, stations };
  });
}

export function stationRename(plan: Plan, args: { stationId: string; name: string }): Plan {
  const name = args.name.trim();
  return name ? stationChange(plan, args.stationId, { name }) : plan;
}

/** Move a station along the hull (its x, mm). Its offsets move with it: cells are keyed by station id. */
export function stationMove(plan: Plan, args: { stationId: string; x: number }): Plan {
  return Number.isFinite(args.x) ? stationChange(plan, args.stationId, { x: args.x }) : plan;
}

/** Put a station at another place among the columns. */
export function stationReorder(plan: Plan, args: { stationId: string; toIndex: number }): Plan {
  return withLines(plan, (lines) => {
    const stations = arrayMove(lines.stations, lines.stations.findIndex((s) => s.id === args.stationId), args.toIndex);
    return stations === lines.stations ? lines : { ...lines, stations: [...stations] };
  });
}

/** Put the columns in order of x. */
export function stationsSortByX(plan: Plan): Plan {
  return withLines(plan, (lines) => {
    const sorted = [...lines.stations].sort((a, b) => a.x - b.x);
    return sorted.every((s, i) => s === lines.stations[i]) ? lines : { ...lines, stations: sorted };
  });
}

/**
 * Delete a station and its offsets in every line (a value left for a station that is gone would make the
 * hull check fail). Parts at the station are the frames screen's to move; they are left as they are.
 */
export function stationDelete(plan: Plan, args: { stationId: string }): Plan {
  return withLines(plan, (lines) => {
    if (!lines.stations.some((s) => s.id === args.stationId)) return lines;
    const withoutCell = (line: Line): Line => {
      if (!(args.stationId in line.cells)) return line;
      const { [args.stationId]: _gone, ...cells } = line.cells as Record<string, unknown>;
      return { ...line, cells } as Line;
    };
    return { ...lines, stations: lines.stations.filter((s) => s.id !== args.stationId), lines: lines.lines.map(withoutCell) };
  });
}
