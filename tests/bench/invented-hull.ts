import type { HullLinesInput } from '../../shared/geometry/hull-schema';

/**
 * An invented hull for benchmarks (and demos): a plausible fair round-bilge hull 7.2 m long, described by
 * formulas and written out as a table of offsets. Invented data: it is fair by construction, and only
 * how long the geometry takes on a table of this size matters.
 *
 * Sections are V-bottomed round-bilge shapes: at height h above the keel the half-breadth is
 * B (1 - (1 - h/D)^2.5), rising from the keel at a finite deadrise (so waterlines die out straight where
 * they meet the keel) to wall-sided at the sheer; half-beam B(x), depth D(x) and sheer height S(x) vary
 * smoothly along the hull (fine bow, transom stern, sheer sweeping up forward).
 * Lines: keel (a knuckle: the V) and sheer (two offsets each), 32 waterlines, 12 buttocks, 4 diagonals:
 * 50 lines, about 40 offsets a station on average (more amidships, fewer at the fine bow).
 */

const L = 7200;
const WATERLINES = 32;
const BUTTOCKS = 12;
const P = 2.5;
const B = (x: number) => 1100 * (0.08 + 0.92 * Math.sin((Math.PI * (x + 300)) / (L + 900)) ** 0.7);
const D = (x: number) => 760 * (0.35 + 0.65 * Math.sin((Math.PI * (x + 600)) / (L + 1600)));
const S = (x: number) => 950 + 300 * ((L * 0.65 - x) / (L * 0.65)) ** 2;
const keelZ = (x: number) => S(x) - D(x);

/** Half-breadth of the section at x at height z (null above the sheer or below the keel). */
function halfBreadth(x: number, z: number): number | null {
  const t = (z - keelZ(x)) / D(x);
  if (t <= 0 || t >= 1) return null;
  return B(x) * (1 - (1 - t) ** P);
}

/** Height of the section at x at half-breadth y (null outside the beam). */
function height(x: number, y: number): number | null {
  const v = y / B(x);
  if (v <= 0 || v >= 1) return null;
  return keelZ(x) + D(x) * (1 - (1 - v) ** (1 / P));
}

/** Distance along a diagonal from (0, originZ) down and out at `angle` to the section (bisection). */
function diagonal(x: number, originZ: number, angle: number): number | null {
  const inside = (t: number) => {
    const y = t * Math.cos(angle);
    const z = originZ - t * Math.sin(angle);
    const w = halfBreadth(x, z);
    return w !== null && y < w;
  };
  if (!inside(1e-6)) return null;
  let lo = 0;
  let hi = 4000;
  for (let k = 0; k < 60; k++) {
    const mid = (lo + hi) / 2;
    if (inside(mid)) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** The invented hull as a table: `stations` stations from bow (x = 0) to transom (x = 7200 mm). */
export function inventedHull(stations = 60): HullLinesInput {
  const xs = Array.from({ length: stations }, (_, i) => (L * i) / (stations - 1));
  const id = (i: number) => `st${i}`;
  const cells = <T,>(f: (x: number) => T | null): Record<string, T | null> => Object.fromEntries(xs.map((x, i) => [id(i), f(x)]));
  const round = (v: number | null) => (v === null ? null : Math.round(v * 10) / 10);
  // Waterlines stay below the lowest sheer (a waterline above it would cross only forward and aft).
  const zLow = Math.min(...xs.map(keelZ));
  const zHigh = Math.min(...xs.map(S));
  const lines: HullLinesInput['lines'] = [
    { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', knuckle: {}, cells: cells((x) => ({ y: 0, z: round(keelZ(x))! })) },
    { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', knuckle: {}, cells: cells((x) => ({ y: round(B(x))!, z: round(S(x))! })) },
  ];
  for (let k = 0; k < WATERLINES; k++) {
    const z = Math.round(zLow + ((k + 1) * (zHigh - zLow)) / (WATERLINES + 1));
    lines.push({ id: `wl${z}`, name: `WL ${z}`, kind: 'waterline', z, cells: cells((x) => round(halfBreadth(x, z))) });
  }
  for (let k = 1; k <= BUTTOCKS; k++) {
    const y = 70 * k;
    lines.push({ id: `bt${y}`, name: `B ${y}`, kind: 'buttock', y, cells: cells((x) => (y < 0.8 * B(x) ? round(height(x, y)) : null)) });
  }
  [25, 40, 55, 70].forEach((deg, k) => {
    const a = (deg * Math.PI) / 180;
    const oz = 1000;
    lines.push({ id: `dg${k}`, name: `D ${k + 1}`, kind: 'diagonal', originZ: oz, angle: a, cells: cells((x) => round(diagonal(x, oz, a))) });
  });
  return {
    notation: {},
    stations: xs.map((x, i) => ({ id: id(i), name: String(i), x })),
    lines,
    skin: { offsetsTo: 'outside', defaultThicknessMm: 9, sheathingMm: 1 },
    deck: { camber: { shape: 'parabola', crown: { kind: 'percent-of-beam', percent: 3 } }, thicknessMm: 9 },
  };
}
