import { hullCheck, type BuiltHull } from '../../../../shared/geometry/hull';
import type { HullLines, Line } from '../../../../shared/geometry/hull-schema';
import { lineFit } from '../../../../shared/geometry/lines';
import { sectionAt, type Section } from '../../../../shared/geometry/section';

/**
 * One station's section without fitting the whole hull, for the drawing while a point is dragged. The
 * shape of the section at a station is fixed by the offsets at that station alone (every line's spline
 * passes through its cells, and the section is fitted through those points), so a table of the station
 * and its two neighbours gives the same section as the whole table does: a 60-station hull is fitted in
 * tens of milliseconds, three stations in about one.
 */

/** The table cut down to the station and its neighbours, keeping only the lines that have a value at the station. */
export function stationNeighbourhood(lines: HullLines, stationId: string): HullLines | null {
  const sorted = [...lines.stations].sort((a, b) => a.x - b.x);
  const at = sorted.findIndex((s) => s.id === stationId);
  if (at < 0) return null;
  const kept = sorted.slice(Math.max(0, at - 1), at + 2);
  const keep = (line: Line): Line => {
    const cells = line.cells as Record<string, unknown>;
    const has = cells[stationId] !== null && cells[stationId] !== undefined;
    // A line with no value here adds no point to this section; its values at the neighbours alone could
    // look like a line of one value, which the hull check refuses.
    const next: Record<string, unknown> = {};
    if (has) for (const s of kept) if (s.id in cells) next[s.id] = cells[s.id];
    return { ...line, cells: next } as Line;
  };
  return { ...lines, stations: kept, lines: lines.lines.map(keep) };
}

/**
 * The section at one station from its neighbourhood; null where the hull check refuses it or there is no
 * section. `trusted`: the table passed the hull check but for a changed value in cells that stay filled
 * (a drag), so the lines are fitted without checking them again, which is most of the time it takes.
 */
export function stationSectionOf(lines: HullLines, stationId: string, options: { trusted?: boolean } = {}): Section | null {
  const station = lines.stations.find((s) => s.id === stationId);
  const near = stationNeighbourhood(lines, stationId);
  if (!station || !near) return null;
  try {
    if (options.trusted) {
      const stations = near.stations;
      const hull: BuiltHull = {
        lines: near,
        stations,
        fitted: near.lines.flatMap((l) => lineFit(l, stations)),
        xMin: stations[0]!.x,
        xMax: stations[stations.length - 1]!.x,
        // Not used by sectionAt: the deck's beam and camber are the part's business, not the section's.
        sheerLineId: null,
        maxSheerHalfBeamMm: null,
      };
      return sectionAt(hull, station.x);
    }
    const built = hullCheck(near);
    return built.ok ? sectionAt(built.hull, station.x) : null;
  } catch {
    return null;
  }
}

/**
 * What a station's section is made from, as a string: its x, and for every line its kind, its fixed
 * height, half-breadth or diagonal, its knuckle and its value at the station. Equal keys, equal sections.
 */
export function stationSectionKey(lines: HullLines, stationId: string): string {
  const station = lines.stations.find((s) => s.id === stationId);
  const parts: unknown[] = [station?.x ?? null];
  for (const line of lines.lines) {
    const fixed = line.kind === 'waterline' ? line.z : line.kind === 'buttock' ? line.y : line.kind === 'diagonal' ? [line.originZ, line.angle] : line.role;
    parts.push([line.id, line.kind, fixed, line.knuckle, (line.cells as Record<string, unknown>)[stationId] ?? null]);
  }
  return JSON.stringify(parts);
}

/**
 * A cache of sections by station: a section is worked out again only when what it is made from changes
 * (a drag at one station leaves every other station's section as it was). With the whole hull built it
 * is cut from that; without, from the station's neighbourhood.
 */
export function createSectionCache(): (lines: HullLines, stationId: string, hull: BuiltHull | null) => Section | null {
  const byStation = new Map<string, { key: string; section: Section | null }>();
  return (lines, stationId, hull) => {
    const key = stationSectionKey(lines, stationId);
    const hit = byStation.get(stationId);
    if (hit && hit.key === key) return hit.section;
    const station = lines.stations.find((s) => s.id === stationId);
    let section: Section | null = null;
    if (hull && station && hull.lines.stations.some((s) => s.id === stationId && s.x === station.x)) {
      try {
        section = sectionAt(hull, station.x);
      } catch {
        section = null;
      }
    } else {
      section = stationSectionOf(lines, stationId);
    }
    byStation.set(stationId, { key, section });
    return section;
  };
}
