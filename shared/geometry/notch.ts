import { vectorLength } from './vector';
import type { DeckLine } from './deck';
import { edgeSkinMm } from './edge';
import type { BuiltHull } from './hull';
import type { Longitudinal } from './part-schema';
import { type Section, sectionVertexAtGirth } from './section';
import type { SectionPoint } from './types';

/**
 * Notches for the longitudinals (stringers, clamps, chine logs, hogs, carlins) where they cross a part.
 *
 * A longitudinal is found in each section by its placement rule (on a line, at a height, a girth or a
 * half-breadth), on the moulded section (against the skin) or the deck's top (against the deck). There it
 * lies on the inside of the skin: its outer face at the skin's thickness, its inner face its depth further
 * in, both normal to the surface, so in the station plane each is the thickness times sqrt(1 + rate^2) (the
 * t / cos(bevel) of the skin deduction, Gougeon 2005, fig. 16-14). The notch is that rectangle: sides along
 * the section's normal (normal to the skin), floor at the inner face, open past the part's edge.
 *
 * Its width along the edge: the longitudinal's width divided by the cosine of the angle at which it crosses
 * the part. In the skin's tangent plane, with tau the section's tangent and n its outward normal, the
 * longitudinal runs along x as dP/dx = a tau + r n (a: how fast it moves along the girth, r = rate: how fast
 * the surface moves out). The plane's trace is along tau; the surface direction square to it is
 * e1 = (1, r n) / sqrt(1 + r^2); the longitudinal's direction (1, a tau + r n) makes the angle phi with e1,
 * tan(phi) = a / sqrt(1 + r^2); a strip of width W then covers W / cos(phi) of the trace. Derived.
 */

/** A longitudinal found in one section. */
export interface LongitudinalPlace {
  x: number;
  against: 'skin' | 'deck';
  /** Girth (mm) of the place: along the moulded section from the keel, or along the deck from the centreline. */
  girthMm: number;
  /** The moulded point (outside of the skin, top of the deck), its outward normal and its tangent (increasing girth). */
  point: SectionPoint;
  normal: SectionPoint;
  tangent: SectionPoint;
  /** Outward normal movement of the surface per mm of x there. */
  rate: number;
  /** Skin (or deck) thickness (mm) the longitudinal lies inside of, normal to the surface. */
  coverMm: number;
}

/** Why a longitudinal is not in a section: the message names the longitudinal and what it missed. */
export interface LongitudinalMiss {
  missed: string;
}

/** The girth (mm) of section node `i` (its first vertex), or null. */
function nodeGirth(section: Section, i: number): number | null {
  for (const v of section.vertices) if (v.t === 0 && section.segments[v.segment]!.fromNode === i) return v.girthMm;
  return i === section.nodes.length - 1 ? section.girthMm : null;
}

/** Girth (mm) where the section first reaches `value` of a coordinate, walking up from the keel; null if never. */
function girthWhere(section: Section, coord: 'y' | 'z', value: number): number | null {
  const v = section.vertices;
  for (let k = 1; k < v.length; k++) {
    const a = v[k - 1]![coord];
    const b = v[k]![coord];
    if ((a - value) * (b - value) <= 0 && a !== b) return v[k - 1]!.girthMm + ((value - a) / (b - a)) * (v[k]!.girthMm - v[k - 1]!.girthMm);
    if (a === value) return v[k - 1]!.girthMm;
  }
  return null;
}

/** Where `lg` crosses the section at its x, or why it does not. Against the deck, `deck` is the deck line there. */
export function longitudinalPlaceAt(hull: BuiltHull, section: Section, deck: DeckLine | null, lg: Longitudinal): LongitudinalPlace | LongitudinalMiss {
  const p = lg.placement;
  if (lg.against === 'deck') {
    if (!deck || !hull.lines.deck) return { missed: `longitudinal "${lg.name}" (${lg.id}) lies under the deck, but the hull has no deck` };
    const top = deck.top;
    let k = -1;
    let f = 0;
    for (let i = 1; i < top.length && k < 0; i++) {
      const a = top[i - 1]!;
      const b = top[i]!;
      const va = p.by === 'girth' ? a.girthMm : a.y;
      const vb = p.by === 'girth' ? b.girthMm : b.y;
      const want = p.by === 'girth' ? p.girthMm : p.by === 'half-breadth' ? p.y : NaN;
      if (want >= va && want <= vb && vb > va) [k, f] = [i - 1, (want - va) / (vb - va)];
    }
    if (p.by !== 'girth' && p.by !== 'half-breadth') return { missed: `longitudinal "${lg.name}" (${lg.id}) lies under the deck: place it by half-breadth or girth` };
    if (k < 0) return { missed: `longitudinal "${lg.name}" (${lg.id}) at ${p.by === 'girth' ? `girth ${p.girthMm}` : `half-breadth ${p.y}`} mm is outside the deck at x = ${section.x.toFixed(1)} mm` };
    const a = top[k]!;
    const b = top[k + 1]!;
    const ny = a.ny + f * (b.ny - a.ny);
    const nz = a.nz + f * (b.nz - a.nz);
    const nl = vectorLength(ny, nz) || 1;
    return {
      x: section.x,
      against: 'deck',
      girthMm: a.girthMm + f * (b.girthMm - a.girthMm),
      point: { y: a.y + f * (b.y - a.y), z: a.z + f * (b.z - a.z) },
      normal: { y: ny / nl, z: nz / nl },
      tangent: { y: nz / nl, z: -ny / nl },
      rate: a.rate + f * (b.rate - a.rate),
      coverMm: hull.lines.deck.thicknessMm,
    };
  }
  let g: number | null;
  if (p.by === 'girth') g = p.girthMm;
  else if (p.by === 'height') g = girthWhere(section, 'z', p.z);
  else if (p.by === 'half-breadth') g = girthWhere(section, 'y', p.y);
  else {
    const i = section.nodes.findIndex((n) => n.lineIds.includes(p.lineId));
    const at = i < 0 ? null : nodeGirth(section, i);
    g = at === null ? null : at + p.girthOffsetMm;
  }
  const what = p.by === 'line' ? `line ${p.lineId}${p.girthOffsetMm ? ` ${p.girthOffsetMm > 0 ? '+' : ''}${p.girthOffsetMm} mm` : ''}` : p.by === 'girth' ? `girth ${p.girthMm} mm` : p.by === 'height' ? `height ${p.z} mm` : `half-breadth ${p.y} mm`;
  if (g === null || g < -1e-9 || g > section.girthMm + 1e-9) {
    return { missed: `longitudinal "${lg.name}" (${lg.id}) at ${what} is not on the section at x = ${section.x.toFixed(1)} mm (girth 0 to ${section.girthMm.toFixed(1)} mm)` };
  }
  const v = sectionVertexAtGirth(section, g);
  if (lg.sides === 'centreline' && section.startsOnCentreline) {
    // On the centreline (a hog, a keel batten): square to it, sides plumb, whatever the deadrise of a V keel;
    // the skin there, measured plumb, is its thickness over the cosine of the deadrise (|nz| of the normal).
    const k0 = section.vertices[0]!;
    const skin = edgeSkinMm(hull, section.segments[k0.segment]!.panel);
    return { x: section.x, against: 'skin', girthMm: 0, point: { y: 0, z: k0.z }, normal: { y: 0, z: -1 }, tangent: { y: 1, z: 0 }, rate: k0.rate, coverMm: skin / Math.max(Math.abs(k0.nz), 1e-3) };
  }
  return {
    x: section.x,
    against: 'skin',
    girthMm: v.girthMm,
    point: { y: v.y, z: v.z },
    normal: { y: v.ny, z: v.nz },
    tangent: { y: -v.nz, z: v.ny },
    rate: v.rate,
    coverMm: edgeSkinMm(hull, section.segments[v.segment]!.panel),
  };
}

/**
 * The angle (rad, >= 0) at which a longitudinal crosses the part's plane, from its places in two sections
 * (`a` the one the notch is cut in): tan(phi) = a / sqrt(1 + r^2), a its movement along the girth per mm
 * of x, r the surface's rate (see the file's note). 0 when both places are at the same x.
 */
export function notchCrossingAngle(a: LongitudinalPlace, b: LongitudinalPlace): number {
  const dx = b.x - a.x;
  if (Math.abs(dx) < 1e-9) return 0;
  const along = ((b.point.y - a.point.y) * a.tangent.y + (b.point.z - a.point.z) * a.tangent.z) / dx;
  return Math.atan(Math.abs(along) / Math.sqrt(1 + a.rate * a.rate));
}

/** A notch in one face, as cut. */
export interface NotchCut {
  longitudinalId: string;
  name: string;
  side: 'port' | 'starboard' | 'centreline';
  against: 'skin' | 'deck';
  /** Middle of the notch floor's outer end: the moulded point set in by the skin (where the longitudinal's outer face is). */
  centre: SectionPoint;
  widthMm: number;
  /** Floor below the part's edge (mm), in the station plane: (depth - clearance) sqrt(1 + rate^2). */
  depthMm: number;
  /** Floor below the moulded line (mm), in the station plane. */
  floorMm: number;
  crossingAngleRad: number;
  /** The cutter: counter-clockwise, reaching `NOTCH_OVERRUN_MM` past the moulded line so it opens through the edge. */
  loop: SectionPoint[];
}

/** How far (mm) past the moulded line a notch's cutter reaches, so that it surely opens through the part's edge. */
export const NOTCH_OVERRUN_MM = 1;

/**
 * The notches one longitudinal cuts in a face: the starboard one and its mirror (`sides: both`), or one on
 * the centreline. `clearanceMm` is the part's gap to the skin (the notch depth is measured from the part's
 * edge, which stands that far in). A longitudinal no deeper than the clearance needs no notch: empty.
 */
export function notchesOfPlace(lg: Longitudinal, place: LongitudinalPlace, crossingAngleRad: number, clearanceMm: number): NotchCut[] {
  const k = Math.sqrt(1 + place.rate * place.rate);
  const depthMm = (lg.depthMm - clearanceMm) * k;
  if (depthMm <= 0) return [];
  const w = lg.widthMm / Math.cos(crossingAngleRad);
  const { point: m, normal: n, tangent: t } = place;
  const floorMm = (place.coverMm + lg.depthMm) * k;
  const outerMm = -NOTCH_OVERRUN_MM;
  const pt = (along: number, inward: number): SectionPoint => ({ y: m.y + t.y * along - n.y * inward, z: m.z + t.z * along - n.z * inward });
  // Counter-clockwise (t along increasing girth, n outward, the inside to the left of t).
  const loop = [pt(-w / 2, outerMm), pt(w / 2, outerMm), pt(w / 2, floorMm), pt(-w / 2, floorMm)];
  const centre = pt(0, place.coverMm * k);
  // Built field by field: spreading a shared base into each takes V8's slow path (outline.ts, edgePointMirrored).
  const cut = (side: NotchCut['side'], c: SectionPoint, l: SectionPoint[]): NotchCut => ({ longitudinalId: lg.id, name: lg.name, against: place.against, widthMm: w, depthMm, floorMm, crossingAngleRad, side, centre: c, loop: l });
  const onCl = lg.sides === 'centreline';
  const star = cut(onCl ? 'centreline' : 'starboard', centre, loop);
  if (onCl) return [star];
  return [star, cut('port', { y: -centre.y, z: centre.z }, loop.map((p) => ({ y: -p.y, z: p.z })).reverse())];
}

/** Whether a longitudinal runs through x (mm): within its fromX and toX (null: to the end of the hull). */
export function longitudinalCovers(lg: Longitudinal, x: number): boolean {
  return (lg.fromX === null || x >= lg.fromX - 1e-9) && (lg.toX === null || x <= lg.toX + 1e-9);
}
