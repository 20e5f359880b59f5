import { describe, expect, it } from 'vitest';
import { hullBuild } from '../../shared/geometry/hull';
import { type Section, sectionAt, sectionVertexAtGirth } from '../../shared/geometry/section';
import { CHORD_TOLERANCE_MM } from '../../shared/geometry/types';
import { chineHull, evenStations, prismaticHull, range, roundHull, vBottom } from './analytic-hulls';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;

/** Largest distance (mm) of the section's vertices, and of the middles of its chords, from a circle. */
function circleErrors(s: Section, zc: number, R: number): { vertex: number; chord: number } {
  let vertex = 0;
  let chord = 0;
  s.vertices.forEach((v, i) => {
    vertex = Math.max(vertex, Math.abs(Math.hypot(v.y, v.z - zc) - R));
    const u = s.vertices[i - 1];
    if (u) chord = Math.max(chord, Math.abs(Math.hypot((u.y + v.y) / 2, (u.z + v.z) / 2 - zc) - R));
  });
  return { vertex, chord };
}

describe('sectionAt: circular cylinder', () => {
  // Analytic: a circular cylinder of radius R = 1000 mm about a centre 1100 mm above base, sheer at 110 degrees
  // from straight down (a little tumblehome). Density: stations every 600 mm, waterlines every 100 mm of
  // height, buttocks every 100 mm of half-breadth (a point every 6 degrees or closer). Error budget: vertices
  // within 0.01 mm of the circle, the whole polyline within the 0.05 mm chord tolerance.
  const R = 1000;
  const zc = 1100;
  const hull = hullBuild(
    roundHull({ xs: evenStations(0, 6000, 10), radius: () => R, centreZ: zc, sheerAngle: 110 * DEG, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100) }),
  );

  it('lies on the circle, keel to sheer, at any x', () => {
    for (const x of [0, 1234.5, 3000, 5999]) {
      const s = sectionAt(hull, x)!;
      const e = circleErrors(s, zc, R);
      expect(e.vertex, `vertices at x = ${x}`).toBeLessThanOrEqual(0.01);
      expect(e.chord, `chords at x = ${x}`).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
      // Analytic: the keel is straight below the centre, the sheer at (R sin 110, zc - R cos 110).
      expectClose(s.vertices[0]!.y, 0, 1e-9, 'keel y');
      expectClose(s.vertices[0]!.z, zc - R, 1e-9, 'keel z');
      const last = s.vertices[s.vertices.length - 1]!;
      expectClose(last.y, R * Math.sin(110 * DEG), 1e-6, 'sheer y');
      expectClose(last.z, zc - R * Math.cos(110 * DEG), 1e-6, 'sheer z');
      // Analytic: girth from keel to sheer is the arc R * 110 degrees.
      expectClose(s.girthMm, R * 110 * DEG, 0.05, 'girth');
    }
  });

  it('has radial outward normals, meets the centreline square and does not move along x', () => {
    const s = sectionAt(hull, 2500)!;
    expect(s.squareAtCentreline).toBe(true);
    // Analytic: mirror symmetry, the section crosses the centreline horizontally, normal straight down.
    expectClose(s.vertices[0]!.ny, 0, 1e-12, 'keel normal y');
    expectClose(s.vertices[0]!.nz, -1, 1e-12, 'keel normal z');
    for (const v of s.vertices) {
      // Analytic: the outward normal of a circle is radial.
      expect(Math.hypot(v.ny - v.y / R, v.nz - (v.z - zc) / R)).toBeLessThanOrEqual(1e-3);
      // Analytic: a cylinder does not change along x: no bevel anywhere.
      expect(Math.abs(v.rate)).toBeLessThanOrEqual(1e-9);
    }
  });

  it('returns null beyond the ends of the hull', () => {
    expect(sectionAt(hull, -1)).toBeNull();
    expect(sectionAt(hull, 6001)).toBeNull();
  });
});

describe('sectionAt: cone (round hull tapering linearly along x)', () => {
  // Analytic: radius R(x) = R0 - k x, R0 = 1000 mm, k = 0.05, centre fixed 1100 mm above base: a cone.
  // Its section at x is the circle of radius R(x). The surface moves along the section's normal (radially)
  // at dR/dx = -k per mm of x everywhere, so tan(bevel) = k: bevel = atan(0.05) = 2.862 degrees at every
  // point. (Normal to the cone in the meridian plane: (k, 1)/sqrt(1 + k^2); its angle with the station plane is atan k.)
  // Density: stations every 500 mm, waterlines and buttocks every 50 mm (a point every 5 degrees or closer at
  // R = 700). Error budget: vertices within 0.02 mm of the circle (the lines themselves are square roots in x,
  // interpolated between stations), polyline within 0.05 mm, rate within 2e-4 of -k (0.01 degree of bevel; the
  // lines' slopes are least sure in the end spans).
  const R0 = 1000;
  const k = 0.05;
  const zc = 1100;
  const hull = hullBuild(
    roundHull({ xs: evenStations(0, 6000, 12), radius: (x) => R0 - k * x, centreZ: zc, sheerAngle: 100 * DEG, waterlineZs: range(450, 1200, 50), buttockYs: range(50, 650, 50) }),
  );

  it('is the circle of radius R0 - k x', () => {
    for (const x of [0, 777, 2500, 4321, 6000]) {
      const s = sectionAt(hull, x)!;
      const e = circleErrors(s, zc, R0 - k * x);
      expect(e.vertex, `vertices at x = ${x}`).toBeLessThanOrEqual(0.02);
      expect(e.chord, `chords at x = ${x}`).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
    }
  });

  it('moves inward at k per mm of x all round', () => {
    for (const x of [300, 2500, 5800]) {
      const s = sectionAt(hull, x)!;
      for (const v of s.vertices) expect(Math.abs(v.rate + k), `rate at x = ${x}, girth ${v.girthMm}`).toBeLessThanOrEqual(2e-4);
    }
  });
});

describe('sectionAt: flat-sided hull with flare, narrowing along x', () => {
  // Analytic: flat bottom z = 0 out to the chine at y = 900 - c x (c = 0.08), plane side y = 900 - c x + f z with
  // flare f = 0.3, sheer at z = 800; chine and sheer knuckles, waterlines 200, 400, 600 on the side.
  // The side's normal in the section is (1, -f)/sqrt(1 + f^2); moving x by dx moves the side by -c dx in y, i.e.
  // -c / sqrt(1 + f^2) along its normal; the bottom does not move. Density: 11 stations, 3 waterlines.
  // Error budget: 1e-6 mm (lines and section are straight: the splines reproduce them exactly).
  const c = 0.08;
  const f = 0.3;
  const hull = hullBuild(chineHull({ xs: evenStations(0, 5000, 10), chineY: (x) => 900 - c * x, flare: f, sheerZ: 800, waterlineZs: [200, 400, 600] }));

  it('has a straight bottom and a straight flared side meeting at a corner', () => {
    const x = 2345;
    const s = sectionAt(hull, x)!;
    const yc = 900 - c * x;
    for (const v of s.vertices) {
      const onBottom = Math.abs(v.z) <= 1e-6 && v.y <= yc + 1e-6;
      const onSide = Math.abs(v.y - (yc + f * v.z)) <= 1e-6;
      expect(onBottom || onSide, `(${v.y}, ${v.z}) on the bottom or the side`).toBe(true);
    }
    const corners = s.vertices.filter((v) => v.corner);
    // The chine is a corner: repeated with the bottom's normal (0, -1) and the side's (1, -f)/sqrt(1 + f^2).
    const atChine = corners.filter((v) => Math.abs(v.y - yc) < 1e-6 && Math.abs(v.z) < 1e-6);
    expect(atChine).toHaveLength(2);
    expectClose(atChine[0]!.nz, -1, 1e-9, 'bottom normal');
    expectClose(atChine[1]!.ny, 1 / Math.sqrt(1 + f * f), 1e-9, 'side normal y');
    expectClose(atChine[1]!.nz, -f / Math.sqrt(1 + f * f), 1e-9, 'side normal z');
  });

  it('moves at -c / sqrt(1 + f^2) on the side and not at all on the bottom', () => {
    const s = sectionAt(hull, 1500)!;
    for (const v of s.vertices) {
      const side = s.segments[v.segment]!.run === 1;
      expectClose(v.rate, side ? -c / Math.sqrt(1 + f * f) : 0, 1e-9, `rate at girth ${v.girthMm}`);
    }
  });
});

describe('sectionAt: box section with sharp chines', () => {
  // Analytic: a box, flat bottom at z = 0 to y = 600, vertical side to the sheer at z = 500. Error budget 1e-9 mm.
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: 0, sheerZ: 500, waterlineZs: [100, 250] }));

  it('is the two straight sides with square corners', () => {
    const s = sectionAt(hull, 1000)!;
    const pts = s.vertices.map((v) => [v.y, v.z]);
    expect(pts[0]).toEqual([0, 0]);
    for (const v of s.vertices) expect(Math.abs(v.z) < 1e-9 || Math.abs(v.y - 600) < 1e-9).toBe(true);
    expectClose(s.girthMm, 600 + 500, 1e-9, 'girth');
    expect(s.vertices.filter((v) => v.corner).length).toBe(3); // the chine twice, the sheer once
  });
});

describe('sectionAt: knuckles that start and end along the hull', () => {
  // Analytic: the flared hull of above, its chine a knuckle only aft of x = 2000 (a chine that dies out forward).
  const hull = hullBuild(
    chineHull({ xs: evenStations(0, 5000, 10), chineY: (x) => 900 - 0.08 * x, flare: 0.3, sheerZ: 800, waterlineZs: [200, 400, 600], chineKnuckle: { fromX: 2000, toX: null } }),
  );

  it('is a corner where the chine is a knuckle and smooth where it is not', () => {
    const aft = sectionAt(hull, 3000)!;
    expect(aft.vertices.some((v) => v.corner && v.z === 0 && v.y > 0)).toBe(true);
    const fwd = sectionAt(hull, 1000)!;
    expect(fwd.vertices.filter((v) => v.corner)).toHaveLength(1); // the sheer only
    // Smooth: the normal turns continuously through the chine; no jump bigger than the flattening allows.
    let worst = 0;
    for (let i = 1; i < fwd.vertices.length; i++) {
      const a = fwd.vertices[i - 1]!;
      const b = fwd.vertices[i]!;
      worst = Math.max(worst, Math.acos(Math.min(1, a.ny * b.ny + a.nz * b.nz)));
    }
    expect(worst).toBeLessThan(10 * DEG);
  });
});

describe('sectionAt: a multi-chine hull whose upper chine dies out forward', () => {
  it('has a corner at each chine where it is a knuckle, the panels between them straight', () => {
    // Analytic: keel (0, 0), lower chine (500, 150), upper chine (800, 450) knuckled aft of x = 1000 only,
    // sheer (900, 800); all constant along x, so every panel between corners is the straight line.
    const xs = evenStations(0, 2000, 4);
    const hull = hullBuild(
      prismaticHull({
        xs,
        points: [
          { id: 'keel', name: 'Keel', role: 'keel', y: 0, z: 0 },
          { id: 'c1', name: 'Lower chine', role: 'chine', y: 500, z: 150 },
          { id: 'c2', name: 'Upper chine', role: 'chine', y: 800, z: 450, knuckle: { fromX: 1000 } },
          { id: 'sheer', name: 'Sheer', role: 'sheer', y: 900, z: 800 },
        ],
        skinMm: 0,
      }),
    );
    const aft = sectionAt(hull, 1500)!;
    const corners = (s: Section) => [...new Set(s.vertices.filter((v) => v.corner).map((v) => `${v.y},${v.z}`))];
    expect(corners(aft)).toEqual(['0,0', '500,150', '800,450', '900,800']);
    // Analytic: straight panels, girth is the sum of the three chords.
    expectClose(aft.girthMm, Math.hypot(500, 150) + Math.hypot(300, 300) + Math.hypot(100, 350), 1e-9, 'girth aft');
    const fwd = sectionAt(hull, 500)!;
    expect(corners(fwd)).toEqual(['0,0', '500,150', '900,800']);
  });
});

describe('sectionAt: a V bottom with a knuckle at the keel', () => {
  // Analytic: keel (0, 0) knuckle, chine at (800, 300) knuckle, side to the sheer at (900, 900): straight lines.
  const xs = evenStations(0, 2000, 4);
  const hull = hullBuild(prismaticHull({ xs, points: vBottom(900, 900), skinMm: 0 }));

  it('leaves the centreline along the bottom, not square to it', () => {
    const s = sectionAt(hull, 500)!;
    expect(s.startsOnCentreline).toBe(true);
    expect(s.squareAtCentreline).toBe(false);
    // Analytic: bottom direction (800, 300)/|.|, outward normal (300, -800)/|.|.
    const L = Math.hypot(800, 300);
    expectClose(s.vertices[0]!.ny, 300 / L, 1e-12, 'keel normal y');
    expectClose(s.vertices[0]!.nz, -800 / L, 1e-12, 'keel normal z');
  });
});

describe('sectionVertexAtGirth', () => {
  it('walks the section by girth', () => {
    // Analytic: the box of above; girth 600 is the chine, 850 is half way up the side.
    const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: 0, sheerZ: 500 }));
    const s = sectionAt(hull, 1000)!;
    const v = sectionVertexAtGirth(s, 850);
    expectClose(v.y, 600, 1e-9, 'y');
    expectClose(v.z, 250, 1e-9, 'z');
    expectClose(sectionVertexAtGirth(s, 300).z, 0, 1e-9, 'bottom');
  });
});
