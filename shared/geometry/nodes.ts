import { lastOf } from './arrays';
import { vectorLength } from './vector';
import { type FittedLine, lineKnuckleAt, linePointAt } from './lines';
import { POINT_TOLERANCE_MM } from './types';

/**
 * The points the lines give in the section at x, ordered from keel to sheer: the raw material of a
 * section. Ordering is by the angle about a pole on the centreline at the height of the highest point,
 * measured from straight down: the keel comes first, the sheer last, tumblehome and hollow garboards
 * keep their order. (A section that winds back on itself as seen from that pole, such as a bulb keel,
 * cannot be ordered this way; its waterlines then come out of height order and validation says so.)
 */

/** Points closer than this (mm) in one section are one point (a waterline and a buttock crossing). */
export const SECTION_MERGE_TOLERANCE_MM = 0.5;
/** Most points a section's nodes are put in order by insertion sort (see `sectionNodesAt`); more go to Array.sort. */
const INSERTION_SORT_MAX = 96;
/** A point within this (mm) of the centreline is on it. */
export const CENTRELINE_TOLERANCE_MM = 0.01;

/** One point of a section: where one or more lines cross the station plane. */
export interface SectionNode {
  /** Half-breadth and height (mm). */
  y: number;
  z: number;
  /** How the point travels along its line as x increases (mm per mm of x). */
  vy: number;
  vz: number;
  /** The lines through this point (more than one where lines cross within the merge tolerance). */
  lineIds: string[];
  /** A corner of the section: a knuckle line passes here. */
  knuckle: boolean;
}

/** The ordered points at x and which of them the section uses. */
export interface SectionNodes {
  /** Every point at x, keel to sheer. */
  all: SectionNode[];
  /** The section runs over all[from..to]: from the keel line (or where it leaves the centreline) to the sheer. */
  from: number;
  to: number;
}

/**
 * The ordered, merged points of the section at x (mm). Points within `mergeToleranceMm` of each other
 * become one (a knuckle keeps its place; others are averaged). Half-breadths a hair below zero (a
 * spline dipping past the centreline near the stem) are taken as on the centreline.
 */
export function sectionNodesAt(
  lines: readonly FittedLine[],
  x: number,
  mergeToleranceMm: number = SECTION_MERGE_TOLERANCE_MM,
  centrelineToleranceMm: number = CENTRELINE_TOLERANCE_MM,
): SectionNodes {
  const pts: { y: number; z: number; vy: number; vz: number; id: string; knuckle: boolean; role: FittedLine['role'] }[] = [];
  for (const line of lines) {
    const p = linePointAt(line, x, POINT_TOLERANCE_MM);
    if (!p) continue;
    const y = p.y <= centrelineToleranceMm ? 0 : p.y;
    pts.push({ y, z: p.z, vy: y === 0 ? 0 : p.vy, vz: p.vz, id: line.id, knuckle: lineKnuckleAt(line, x), role: line.role });
  }
  if (pts.length === 0) return { all: [], from: 0, to: -1 };
  let zp = -Infinity;
  for (const p of pts) if (p.z > zp) zp = p.z;
  const keyed = pts.map((p) => ({ p, phi: Math.atan2(p.y, zp - p.z), r: vectorLength(p.y, zp - p.z) }));
  // By angle, the farther first at the same angle. A section has a few dozen points: there a stable insertion
  // sort, comparing inline, gives the order Array.sort (stable) gives with the same comparison at a fraction of
  // the cost of sort's comparison callback (a tenth of every section's time); above that its quadratic worst
  // case would lose, and sort is used.
  if (keyed.length > INSERTION_SORT_MAX) keyed.sort((a, b) => a.phi - b.phi || b.r - a.r);
  else {
    for (let i = 1; i < keyed.length; i++) {
      const k = keyed[i]!;
      let j = i - 1;
      while (j >= 0 && (keyed[j]!.phi - k.phi || k.r - keyed[j]!.r) > 0) {
        keyed[j + 1] = keyed[j]!;
        j--;
      }
      keyed[j + 1] = k;
    }
  }

  const all: SectionNode[] = [];
  const counts: number[] = [];
  let keel = -1;
  let sheer = -1;
  const tol2 = mergeToleranceMm * mergeToleranceMm;
  for (const { p } of keyed) {
    const last = lastOf(all);
    if (last && (last.y - p.y) ** 2 + (last.z - p.z) ** 2 <= tol2) {
      const k = all.length - 1;
      if (p.knuckle && !last.knuckle) {
        Object.assign(last, { y: p.y, z: p.z, vy: p.vy, vz: p.vz, knuckle: true });
        counts[k] = 1;
      } else if (p.knuckle === last.knuckle) {
        const n = counts[k]!;
        last.y = (last.y * n + p.y) / (n + 1);
        last.z = (last.z * n + p.z) / (n + 1);
        last.vy = (last.vy * n + p.vy) / (n + 1);
        last.vz = (last.vz * n + p.vz) / (n + 1);
        counts[k] = n + 1;
      }
      last.lineIds.push(p.id);
    } else {
      all.push({ y: p.y, z: p.z, vy: p.vy, vz: p.vz, lineIds: [p.id], knuckle: p.knuckle });
      counts.push(1);
    }
    if (p.role === 'keel' && keel < 0) keel = all.length - 1;
    if (p.role === 'sheer') sheer = all.length - 1;
  }
  // The section leaves the centreline at the last of the points on it (below are a stem's or keel's face).
  let lead = -1;
  while (lead + 1 < all.length && all[lead + 1]!.y === 0) lead++;
  const from = Math.max(0, keel, lead);
  const to = sheer >= 0 ? sheer : all.length - 1;
  return { all, from, to };
}
