import type { EdgePoint } from './edge';
import { edgePointLerp, loopMirrored } from './outline';
import type { Shape } from './polygon';
import { polylineSegmentsCross } from './polyline';
import { GeometryInputError, type SectionPoint } from './types';

/**
 * Deck beams and half beams cut from a station's outline (deduction.ts half outline): the top is the deck's
 * underside there (the camber less the deck thickness and the fillet clearance, normal to the deck), the
 * bottom is the top lowered by the moulded depth, measured plumb (straight down in the station plane, the
 * way a beam's depth is marked off its cambered top), and the ends follow the hull edge from the top corner
 * down to where the bottom meets it. A taper makes the depth fall straight from `mouldedDepthMm` at
 * `fromFraction` of the half-beam to `endDepthMm` at the side.
 */

/** What a beam needs besides the outline. */
export interface BeamSpec {
  mouldedDepthMm: number;
  taper: { endDepthMm: number; fromFraction: number } | null;
  /** Half beam: half-breadth (mm) of its inboard end; null for a full deck beam. */
  inboardYMm: number | null;
  sides: 'both' | 'port' | 'starboard';
}

/** A beam worked out: its regions (one, or two for a pair of half beams) and the starboard edges against the deck and the hull. */
export interface BeamOutline {
  regions: Shape[];
  /** Starboard: the top from the centreline (or the inboard end) out, and the end against the hull from the bottom up. */
  deckEdge: EdgePoint[];
  endEdge: EdgePoint[];
  /** The top edge from port to starboard: the girth edge joints are measured along. */
  topEdge: SectionPoint[];
  /** Half-breadth (mm) of the top corner, where the deck's underside meets the hull edge. */
  halfBeamMm: number;
}

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

/** Depth (mm) of the beam at half-breadth y (mm) for a beam whose top corner is at half-breadth hb (mm). */
export function beamDepthAt(spec: Pick<BeamSpec, 'mouldedDepthMm' | 'taper'>, y: number, hb: number): number {
  const t = spec.taper;
  if (!t || hb <= 0) return spec.mouldedDepthMm;
  const from = t.fromFraction * hb;
  const a = Math.abs(y);
  if (a <= from) return spec.mouldedDepthMm;
  const f = Math.min(1, (a - from) / (hb - from));
  return spec.mouldedDepthMm + f * (t.endDepthMm - spec.mouldedDepthMm);
}

/**
 * The beam (or pair of half beams) in a half outline that has a top line (deck underside, or the level
 * line at the sheer where the hull has no deck).
 * @throws GeometryInputError when the outline has no hull edge, the inboard end lies outside the beam,
 *   or the bottom of the beam never meets the hull edge.
 */
export function beamOutline(half: readonly EdgePoint[], spec: BeamSpec): BeamOutline {
  let lastHull = -1;
  half.forEach((p, i) => {
    if (p.edge === 'hull') lastHull = i;
  });
  if (lastHull < 1 || lastHull >= half.length - 1) fail('beam-no-edge', 'stationId', null, 'the outline has no hull edge and top line for a beam');
  // Top from the centreline out to the top corner; the hull edge from the corner downward.
  const top = half.slice(lastHull + 1).reverse();
  const corner = top[top.length - 1]!;
  const hb = corner.y;
  const hullDown = half.slice(0, lastHull + 1).reverse();
  const yEnd = spec.inboardYMm ?? 0;
  if (spec.inboardYMm !== null && !(yEnd < hb)) {
    fail('half-beam-end-outside', 'inboardEnd', yEnd, `the half beam's inboard end at half-breadth ${yEnd.toFixed(1)} mm is at or outboard of the side (${hb.toFixed(1)} mm) at this station`);
  }
  // The top from the inboard end out (a point put in at the end, and at the start of the taper).
  const cuts = [yEnd, ...(spec.taper ? [spec.taper.fromFraction * hb] : [])].filter((y) => y > 0 && y < hb);
  const topOut: EdgePoint[] = [];
  for (let i = 0; i < top.length; i++) {
    const p = top[i]!;
    const q = top[i - 1];
    if (q) for (const c of cuts) if (q.y < c && p.y > c) topOut.push(edgePointLerp(q, p, (c - q.y) / (p.y - q.y)));
    topOut.push(p);
  }
  const deckEdge = topOut.filter((p) => p.y >= yEnd - 1e-9);
  // Bottom: each top point lowered by the depth there, carried on past the corner so it is sure to meet the side.
  const bottom: SectionPoint[] = deckEdge.map((p) => ({ y: p.y, z: p.z - beamDepthAt(spec, p.y, hb) }));
  const b1 = bottom[bottom.length - 1]!;
  const b0 = bottom[bottom.length - 2] ?? { y: b1.y - 1, z: b1.z };
  const len = Math.hypot(b1.y - b0.y, b1.z - b0.z) || 1;
  const reach = 10 * spec.mouldedDepthMm + 100;
  bottom.push({ y: b1.y + ((b1.y - b0.y) / len) * reach, z: b1.z + ((b1.z - b0.z) / len) * reach });
  let meet: { i: number; j: number; s: number; u: number } | null = null;
  for (let j = 0; j + 1 < hullDown.length && !meet; j++) {
    for (let i = 0; i + 1 < bottom.length && !meet; i++) {
      const hit = polylineSegmentsCross(bottom[i]!, bottom[i + 1]!, hullDown[j]!, hullDown[j + 1]!);
      if (hit) meet = { i, j, s: hit.s, u: hit.u };
    }
  }
  if (!meet) return fail('beam-misses-side', 'mouldedDepthMm', spec.mouldedDepthMm, `the bottom of the beam, ${spec.mouldedDepthMm} mm below its top, never meets the hull edge`);
  const m = meet!;
  const x = edgePointLerp(hullDown[m.j]!, hullDown[m.j + 1]!, m.u);
  const endEdge = [x, ...hullDown.slice(0, m.j + 1).reverse()];
  // Starboard loop, counter-clockwise: along the bottom outward, up the end, back along the top.
  const star: SectionPoint[] = [
    ...bottom.slice(0, m.i + 1),
    { y: x.y, z: x.z },
    ...endEdge.slice(1).map((p) => ({ y: p.y, z: p.z })),
    ...deckEdge
      .slice(0, -1)
      .reverse()
      .map((p) => ({ y: p.y, z: p.z })),
  ];
  const mirror = (loop: SectionPoint[]): SectionPoint[] => loop.map((p) => ({ y: -p.y, z: p.z })).reverse();
  let regions: Shape[];
  if (spec.inboardYMm === null) {
    // A full beam: the starboard loop runs from the centreline at the bottom to the centreline at the top.
    regions = [{ outer: loopMirrored(star), holes: [] }];
  } else {
    const sides = spec.sides === 'both' ? ['starboard', 'port'] : [spec.sides];
    regions = sides.map((s) => ({ outer: s === 'starboard' ? star : mirror(star), holes: [] }));
  }
  const topLine = deckEdge.map((p) => ({ y: p.y, z: p.z }));
  const topEdge = spec.inboardYMm === null ? [...topLine.filter((p) => p.y > 1e-9).map((p) => ({ y: -p.y, z: p.z })).reverse(), ...topLine] : topLine;
  return { regions, deckEdge, endEdge, topEdge, halfBeamMm: hb };
}
