import { camberAtStation, camberReferenceHalfBeamMm, type StationCamber } from './camber';
import { type EdgePoint, edgeSkinMm } from './edge';
import type { BuiltHull } from './hull';
import { linePointAt, lineReaches } from './lines';
import type { Section } from './section';
import { CHORD_TOLERANCE_MM } from './types';

/**
 * The deck line at a station: the top of the deck across the hull, at the sheer's height at the beam
 * ends and rising by the camber toward the centreline, and its underside (the deck thickness, plus the
 * fillet clearance, set in normal to the deck). The deck's fore-and-aft slope comes from the sheer's
 * sweep (and, on a scaled camber, the changing beam); it gives the deck edge's bevel exactly as the
 * skin's movement gives the hull edge's: rate = dZ/dx times the normal's upward part.
 */

/** Step (mm of x) for the deck's fore-and-aft slope by central difference. */
export const DECK_SLOPE_STEP_MM = 1;

/** The deck at a station. */
export interface DeckLine {
  x: number;
  /** Half-beam (mm) the camber is taken over at this station. */
  halfBeamMm: number;
  /** Top of the deck from the centreline out to the sheer (normals up). */
  top: EdgePoint[];
  /** Underside from the centreline out to beyond the hull edge (normals up, bevels of the deck edge). */
  underside: EdgePoint[];
}

/**
 * The deck line of the section's station, or null when the hull has no deck or the sheer does not reach x.
 * `clearanceMm` is added to the deck thickness (normal to the deck), like the fillet clearance at the skin.
 */
export function deckLineAt(hull: BuiltHull, section: Section, clearanceMm: number = 0, toleranceMm: number = CHORD_TOLERANCE_MM): DeckLine | null {
  const deck = hull.lines.deck;
  const x = section.x;
  const sheer = hull.fitted.find((f) => f.id === hull.sheerLineId && lineReaches(f, x));
  if (!deck || !sheer) return null;
  const skinAtSheer = section.segments.length > 0 ? edgeSkinMm(hull, section.segments[section.segments.length - 1]!.panel) : 0;
  const inboard = deck.beamAt === 'inside-clamp' ? skinAtSheer + deck.clampWidthMm : 0;
  const at = (xx: number): { ys: number; zs: number; hb: number } | null => {
    const p = linePointAt(sheer, xx);
    return p ? { ys: p.y, zs: p.z, hb: Math.max(0, p.y - inboard) } : null;
  };
  const here = at(x);
  if (!here) return null;
  const fore = at(Math.min(x + DECK_SLOPE_STEP_MM, sheer.xMax));
  const aft = at(Math.max(x - DECK_SLOPE_STEP_MM, sheer.xMin));
  const dx = Math.min(x + DECK_SLOPE_STEP_MM, sheer.xMax) - Math.max(x - DECK_SLOPE_STEP_MM, sheer.xMin);
  // The pattern's half-beam: the hull's widest (sampled along the sheer), and never narrower than the
  // beams read here (a sampled maximum can fall a hair short of the true one).
  const widest = Math.max(hull.maxSheerHalfBeamMm! - inboard, here.hb, fore?.hb ?? 0, aft?.hb ?? 0, 1e-6);
  const ref = camberReferenceHalfBeamMm(deck.camber, widest);
  // Each of the three stations' camber checked and built once, then sampled at every half-breadth.
  const cambers = new Map<{ hb: number }, StationCamber>();
  const camberOf = (s: { hb: number }): StationCamber => {
    let c = cambers.get(s);
    if (!c) cambers.set(s, (c = camberAtStation(deck.camber, s.hb, ref)));
    return c;
  };
  const heightOf = (s: { zs: number; hb: number }, y: number): number => {
    if (s.hb <= 0) return s.zs;
    if (y <= s.hb) return s.zs + camberOf(s).heightAt(y);
    // Outboard of the beam (inside the clamp): the curve's end tangent carries on to the side.
    return s.zs + camberOf(s).slopeAt(s.hb) * (y - s.hb);
  };
  const slopeOf = (s: { hb: number }, y: number): number => (s.hb <= 0 ? 0 : camberOf(s).slopeAt(Math.min(y, s.hb)));

  // Reach a little past the sheer so the underside is sure to meet the hull edge.
  const yEnd = here.ys * 1.02 + 5;
  // The sampling has the height at every sample already: returned beside it, so each is worked out once
  // (every camber height validates the camber, and the deck line is drawn on every face of every part).
  const { ys, zs } = deckSamples((y) => heightOf(here, y), 0, yEnd, toleranceMm);
  const t = deck.thicknessMm + clearanceMm;
  const top: EdgePoint[] = [];
  const underside: EdgePoint[] = [];
  let girth = 0;
  ys.forEach((y, k) => {
    const z = zs[k]!;
    const m = slopeOf(here, y);
    const len = Math.sqrt(1 + m * m);
    const ny = -m / len;
    const nz = 1 / len;
    const dZdx = fore && aft && dx > 0 ? (heightOf(fore, y) - heightOf(aft, y)) / dx : 0;
    const rate = dZdx * nz;
    const setIn = t * Math.sqrt(1 + rate * rate);
    if (k > 0) girth += Math.sqrt((y - ys[k - 1]!) ** 2 + (z - zs[k - 1]!) ** 2);
    const bevel = Math.atan(Math.abs(rate));
    // Literals, not a shared part spread into each (V8's slow path for spreads).
    top.push({ y, z, setInMm: 0, ny, nz, rate, bevel, girthMm: girth, edge: 'deck', corner: false });
    underside.push({ y: y - ny * setIn, z: z - nz * setIn, setInMm: setIn, ny, nz, rate, bevel, girthMm: girth, edge: 'deck', corner: false });
  });
  // Keep the underside starting on the centreline (the normal there is vertical, but be exact).
  underside[0]!.y = 0;
  return { x, halfBeamMm: here.hb, top, underside };
}

/**
 * Half-breadths `ys` from y0 to y1 at which the deck curve is within `tol` (mm) of its chords (midpoint test,
 * at least 8 spans), with the height `zs` (mm) at each: f is called once per half-breadth (a span's start is
 * the last one's end, the same number), which a map of heights keyed by half-breadth did at several times the cost.
 */
function deckSamples(f: (y: number) => number, y0: number, y1: number, tol: number): { ys: number[]; zs: number[] } {
  const ys: number[] = [y0];
  const f0 = f(y0);
  const zs: number[] = [f0];
  const span = (a: number, fa: number, b: number, fb: number, depth: number): void => {
    const m = (a + b) / 2;
    const fm = f(m);
    if (depth < 16 && Math.abs(fm - (fa + fb) / 2) > tol) {
      span(a, fa, m, fm, depth + 1);
      span(m, fm, b, fb, depth + 1);
    } else {
      ys.push(b);
      zs.push(fb);
    }
  };
  const n = 8;
  let fa = f0;
  for (let i = 0; i < n; i++) {
    const a = y0 + ((y1 - y0) * i) / n;
    const b = y0 + ((y1 - y0) * (i + 1)) / n;
    const fb = f(b);
    span(a, fa, b, fb, 0);
    fa = fb;
  }
  return { ys, zs };
}
