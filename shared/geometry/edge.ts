import type { BuiltHull } from './hull';

/**
 * A frame's edge as plain data: the points the next stage (frames, notches, layers, templates) is built
 * from, each with its outward normal and its bevel.
 */

/** One point of a frame's edge in the section plane (mm). */
export interface EdgePoint {
  y: number;
  z: number;
  /** Unit outward normal (toward the skin, or up through the deck); (0, 0) on a closure. */
  ny: number;
  nz: number;
  /** Outward normal movement of the surface per mm of x, signed (+: the hull grows as x grows). */
  rate: number;
  /** Angle from square (rad, >= 0): atan(|rate|). */
  bevel: number;
  /** Girth (mm) of the point it came from: along the moulded section from the keel, or along the deck from the centreline. */
  girthMm: number;
  /** How far (mm) the point is set in from the moulded line (or the deck's top), in the station plane. */
  setInMm: number;
  /** Which edge: against the hull skin, under the deck, or a straight closure to the centreline. */
  edge: 'hull' | 'deck' | 'closure';
  /** A corner of the edge (repeated, once with each side's normal and bevel). */
  corner: boolean;
}

/**
 * The edge point moved to (y, z), a corner or not, its other fields those of p. Built field by field: a
 * spread that overrides or adds keys can take V8's slow path, several microseconds an object.
 */
export function edgePointMoved(p: EdgePoint, y: number, z: number, corner: boolean): EdgePoint {
  return { y, z, ny: p.ny, nz: p.nz, rate: p.rate, bevel: p.bevel, girthMm: p.girthMm, setInMm: p.setInMm, edge: p.edge, corner };
}

/**
 * The skin (mm) to deduct on a segment of a section: its panel's thickness (`panel` an index into the
 * hull's skin panels, -1 for the default), plus sheathing, when the offsets are to the outside of the
 * skin; 0 when they are to the inside.
 */
export function edgeSkinMm(hull: BuiltHull, panel: number): number {
  const skin = hull.lines.skin;
  if (skin.offsetsTo === 'inside') return 0;
  const t = panel >= 0 ? skin.panels[panel]!.thicknessMm : skin.defaultThicknessMm;
  return t + skin.sheathingMm;
}
