import type { HullLinesInput } from '../../shared/geometry/hull-schema';

/**
 * Hulls whose surfaces are known in closed form, written out as tables of offsets (the way a designer
 * would give them), so that what the geometry builds from the table can be checked against the exact
 * surface. Every value in a table comes from the formula; nothing is invented.
 */

type Cells<T> = Record<string, T | null>;
type PointCell = { y: number; z: number };

export interface RoundHullSpec {
  /** Station positions (mm). */
  xs: number[];
  /** Radius of the circular section at x (mm). */
  radius: (x: number) => number;
  /** Height of the circle's centre above base (mm). */
  centreZ: number;
  /** Where the sheer is on the circle: angle at the centre from straight down (rad, below pi). */
  sheerAngle: number;
  waterlineZs: number[];
  buttockYs: number[];
  skinMm?: number;
  sheathingMm?: number;
}

const stationId = (i: number): string => `st${i}`;

function stationsOf(xs: readonly number[]): HullLinesInput['stations'] {
  return xs.map((x, i) => ({ id: stationId(i), name: String(i), x }));
}

function cellsOf<T>(xs: readonly number[], f: (x: number) => T | null): Cells<T> {
  const cells: Cells<T> = {};
  xs.forEach((x, i) => {
    cells[stationId(i)] = f(x);
  });
  return cells;
}

/**
 * A round hull: circular sections of radius `radius(x)` about a centre at height `centreZ` on the
 * centreline, from the keel (straight below the centre) up to the sheer at `sheerAngle` from straight
 * down. Constant radius is a circular cylinder; a radius linear in x is a cone.
 * Waterlines give sqrt(R^2 - (z - zc)^2) where they meet the arc, buttocks zc - sqrt(R^2 - y^2) (the
 * lower crossing), the keel (0, zc - R) and the sheer (R sin a, zc - R cos a).
 */
export function roundHull(spec: RoundHullSpec): HullLinesInput {
  const { xs, radius: R, centreZ: zc, sheerAngle: a } = spec;
  const lines: HullLinesInput['lines'] = [
    { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: cellsOf<PointCell>(xs, (x) => ({ y: 0, z: zc - R(x) })) },
    { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: cellsOf<PointCell>(xs, (x) => ({ y: R(x) * Math.sin(a), z: zc - R(x) * Math.cos(a) })) },
  ];
  for (const z of spec.waterlineZs) {
    lines.push({
      id: `wl${z}`,
      name: `WL ${z}`,
      kind: 'waterline',
      z,
      cells: cellsOf<number>(xs, (x) => {
        const r = R(x);
        const below = zc - r;
        const top = zc - r * Math.cos(a);
        return z > below && z < top ? Math.sqrt(r * r - (z - zc) ** 2) : null;
      }),
    });
  }
  for (const y of spec.buttockYs) {
    lines.push({
      id: `bt${y}`,
      name: `B ${y}`,
      kind: 'buttock',
      y,
      cells: cellsOf<number>(xs, (x) => {
        const r = R(x);
        return y < r * Math.min(1, a >= Math.PI / 2 ? 1 : Math.sin(a)) ? zc - Math.sqrt(r * r - y * y) : null;
      }),
    });
  }
  return {
    notation: {},
    stations: stationsOf(xs),
    lines,
    skin: { offsetsTo: 'outside', defaultThicknessMm: spec.skinMm ?? 0, sheathingMm: spec.sheathingMm ?? 0 },
  };
}

export interface ChineHullSpec {
  xs: number[];
  /** Half-breadth (mm) of the chine at x; the bottom is flat at z = 0 from the centreline to it. */
  chineY: (x: number) => number;
  /** Flare: outward run of the side per mm of rise (tan of the flare angle from vertical). */
  flare: number;
  /** Sheer height (mm above the flat bottom), constant or along x (a sheer with sweep). */
  sheerZ: number | ((x: number) => number);
  /** Waterline heights on the side (mm). */
  waterlineZs?: number[];
  bottomMm?: number;
  sideMm?: number;
  sheathingMm?: number;
  /** Knuckle range of the chine (null ends: the whole length). */
  chineKnuckle?: { fromX: number | null; toX: number | null } | null;
}

/**
 * A hard-chine hull: a flat bottom at z = 0 from the centreline out to the chine, and a plane side
 * y = chineY(x) + flare z up to the sheer at `sheerZ`. With chineY constant and flare 0 it is a box.
 * The bottom and side are panels of their own thickness.
 */
export function chineHull(spec: ChineHullSpec): HullLinesInput {
  const { xs, chineY, flare } = spec;
  const sheerZ = typeof spec.sheerZ === 'number' ? ((h: number) => () => h)(spec.sheerZ) : spec.sheerZ;
  const lines: HullLinesInput['lines'] = [
    { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: cellsOf<PointCell>(xs, () => ({ y: 0, z: 0 })) },
    {
      id: 'chine',
      name: 'Chine',
      kind: 'point',
      role: 'chine',
      knuckle: spec.chineKnuckle === undefined ? { fromX: null, toX: null } : spec.chineKnuckle,
      cells: cellsOf<PointCell>(xs, (x) => ({ y: chineY(x), z: 0 })),
    },
    { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', knuckle: { fromX: null, toX: null }, cells: cellsOf<PointCell>(xs, (x) => ({ y: chineY(x) + flare * sheerZ(x), z: sheerZ(x) })) },
  ];
  for (const z of spec.waterlineZs ?? []) {
    lines.push({ id: `wl${z}`, name: `WL ${z}`, kind: 'waterline', z, cells: cellsOf<number>(xs, (x) => (z < sheerZ(x) ? chineY(x) + flare * z : null)) });
  }
  return {
    notation: {},
    stations: stationsOf(xs),
    lines,
    skin: {
      offsetsTo: 'outside',
      defaultThicknessMm: spec.bottomMm ?? 0,
      sheathingMm: spec.sheathingMm ?? 0,
      panels: [
        { name: 'Bottom', fromLineId: 'keel', toLineId: 'chine', thicknessMm: spec.bottomMm ?? 0 },
        { name: 'Side', fromLineId: 'chine', toLineId: 'sheer', thicknessMm: spec.sideMm ?? 0 },
      ],
    },
  };
}

export interface EllipticHullSpec {
  xs: number[];
  /** Half-beam (mm) at x: the section is a half ellipse of this half-width. */
  halfBeam: (x: number) => number;
  /** Depth (mm) of the ellipse below the sheer, constant or along x. */
  depth: number | ((x: number) => number);
  /** Sheer height (mm above base), constant: the ellipse's centre. */
  sheerZ: number;
  waterlineZs: number[];
  buttockYs: number[];
}

/**
 * A round hull of elliptic sections: y^2/B(x)^2 + (z - S)^2/D^2 = 1 below the sheer height S, the sheer
 * at (B(x), S). Waterlines are B(x) sqrt(1 - ((z - S)/D)^2): each is the half-beam curve scaled, so a
 * chosen half-beam curve (fair, or with a hollow entrance) sets every waterline's shape.
 */
export function ellipticHull(spec: EllipticHullSpec): HullLinesInput {
  const { xs, halfBeam: B, sheerZ: S } = spec;
  const D = typeof spec.depth === 'number' ? ((d: number) => () => d)(spec.depth) : spec.depth;
  const lines: HullLinesInput['lines'] = [
    { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: cellsOf<PointCell>(xs, (x) => ({ y: 0, z: S - D(x) })) },
    { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: cellsOf<PointCell>(xs, (x) => ({ y: B(x), z: S })) },
  ];
  for (const z of spec.waterlineZs) {
    lines.push({ id: `wl${z}`, name: `WL ${z}`, kind: 'waterline', z, cells: cellsOf<number>(xs, (x) => (z > S - D(x) && z < S ? B(x) * Math.sqrt(1 - ((z - S) / D(x)) ** 2) : null)) });
  }
  for (const y of spec.buttockYs) {
    lines.push({
      id: `bt${y}`,
      name: `B ${y}`,
      kind: 'buttock',
      y,
      cells: cellsOf<number>(xs, (x) => (y < B(x) ? S - D(x) * Math.sqrt(1 - (y / B(x)) ** 2) : null)),
    });
  }
  return { notation: {}, stations: stationsOf(xs), lines, skin: { offsetsTo: 'outside', defaultThicknessMm: 0 } };
}

/** n + 1 evenly spaced stations from x0 to x1 (mm). */
export function evenStations(x0: number, x1: number, n: number): number[] {
  return Array.from({ length: n + 1 }, (_, i) => x0 + ((x1 - x0) * i) / n);
}

/** Values from a to b (inclusive) every step. */
export function range(a: number, b: number, step: number): number[] {
  const out: number[] = [];
  for (let v = a; v <= b + 1e-9; v += step) out.push(Number(v.toFixed(6)));
  return out;
}

export interface PrismaticPoint {
  id: string;
  name: string;
  role: 'keel' | 'chine' | 'sheer' | 'other';
  /** Half-breadth and height of the point at every station (mm). */
  y: number;
  z: number;
  /** The line's knuckle, as the table gives it ({} = a knuckle all along). */
  knuckle?: { fromX?: number | null; toX?: number | null };
}

/**
 * A prismatic hard-chine hull: the same section at every station, straight panels between point lines
 * that are knuckles (unless a point says otherwise), skin `skinMm` thick. Every panel is then the straight
 * line between its two corners, at any x, so sections, deductions and frames can be checked by hand.
 */
export function prismaticHull(spec: { xs: number[]; points: PrismaticPoint[]; skinMm: number }): HullLinesInput {
  const cells = (p: PointCell): Cells<PointCell> => Object.fromEntries(spec.xs.map((_, i) => [`st${i}`, p]));
  return {
    notation: {},
    stations: spec.xs.map((x, i) => ({ id: `st${i}`, name: String(i), x })),
    lines: spec.points.map((p) => ({ id: p.id, name: p.name, kind: 'point' as const, role: p.role, knuckle: p.knuckle ?? {}, cells: cells({ y: p.y, z: p.z }) })),
    skin: { defaultThicknessMm: spec.skinMm },
  };
}

/** The V-bottom of the knuckle tests: keel (0, 0), a straight deadrise to the chine (800, 300), the sheer at (sheerY, sheerZ). */
export function vBottom(sheerY: number, sheerZ: number): PrismaticPoint[] {
  return [
    { id: 'keel', name: 'Keel', role: 'keel', y: 0, z: 0 },
    { id: 'chine', name: 'Chine', role: 'chine', y: 800, z: 300 },
    { id: 'sheer', name: 'Sheer', role: 'sheer', y: sheerY, z: sheerZ },
  ];
}

/**
 * The box of the drawing tests: a prismatic section with the keel at (0, 0), a square chine at (500, 0) and
 * the sheer straight above it at (500, 400), stations every 1000 mm from 0 to 4000 named "St 0" to "St 4",
 * 6 mm skin outside the offsets, the design waterline at 200 mm. Its deducted section is a rectangle.
 */
export function boxHull(): HullLinesInput {
  const hull = prismaticHull({
    xs: [0, 1000, 2000, 3000, 4000],
    points: [
      { id: 'keel', name: 'Keel', role: 'keel', y: 0, z: 0 },
      { id: 'chine', name: 'Chine', role: 'chine', y: 500, z: 0 },
      { id: 'sheer', name: 'Sheer', role: 'sheer', y: 500, z: 400 },
    ],
    skinMm: 6,
  });
  return { ...hull, notation: { unit: 'mm', precision: '0.5mm' }, stations: hull.stations.map((s, i) => ({ ...s, name: `St ${i}` })), designWaterlineZ: 200 };
}
