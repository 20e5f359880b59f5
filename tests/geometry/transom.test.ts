import { describe, expect, it } from 'vitest';
import { frameOfPart } from '../../shared/geometry/frame';
import { hullBuild } from '../../shared/geometry/hull';
import { polygonArea } from '../../shared/geometry/polygon';
import { hullExtended, transomExpanded } from '../../shared/geometry/transom';
import { sectionAt } from '../../shared/geometry/section';
import { chineHull, evenStations } from './analytic-hulls';
import { built, expectAllFinite, expectProperRegions, partOf } from './frame-fixtures';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;

// The true shape of a flat transom raked theta from the vertical (derived, as in transom.ts): its plane through
// the pivot line (x = xs, z = pivotZ) is x = xs + (z - pivotZ) tan(theta). A point of it at height z is
// (z - pivotZ) above the pivot line and (z - pivotZ) tan(theta) aft of it, so (z - pivotZ) sqrt(1 + tan^2) =
// (z - pivotZ) / cos(theta) from it along the face: the template's height is pivotZ + (z - pivotZ) / cos(theta).
const trueZ = (z: number, pivotZ: number, theta: number): number => pivotZ + (z - pivotZ) / Math.cos(theta);

describe('transom: a box cut by a raked plane', () => {
  // Analytic: flat bottom z = 0, vertical sides y = +-600, sheer at 500, bottom 12 mm, sides 9 mm, clearance
  // 2 mm: the inside of the skin is z = 14 and y = +-589; the top is the level line at the sheer, 500.
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 }));
  const theta = 15 * DEG;
  const part = partOf({ id: 't', name: 'Transom', kind: 'transom', stationId: 'st3', thicknessMm: 18, layers: [{ thicknessMm: 18 }], rakeRad: theta, pivotZ: 0, markedFace: 'aft' });
  const g = built(frameOfPart(hull, part));

  it('is the rectangle 2 x 589 wide and (500 - 14) / cos(theta) high', () => {
    expect(g.plane).toBe('transom-expanded');
    const outer = g.layers[0]!.regions[0]!.outer;
    const bottom = trueZ(14, 0, theta);
    const top = trueZ(500, 0, theta);
    for (const p of outer) expect(Math.min(Math.abs(p.z - bottom), Math.abs(p.z - top), Math.abs(Math.abs(p.y) - 589)), `(${p.y}, ${p.z})`).toBeLessThanOrEqual(1e-6);
    expectClose(polygonArea(outer), 2 * 589 * (top - bottom), 1e-3, 'area');
    expectProperRegions(g.layers[0]!.regions, 'transom');
    expectAllFinite(g);
  });

  it('bevels its bottom edge by the rake and leaves its sides square', () => {
    // Analytic: the bottom is level, the transom leans theta from the vertical: the edge on the bottom is cut at
    // theta from square; the sides are square to the transom's plane. The marked face is the aft one and the
    // transom runs forward from it, where its bottom edge reaches further down: the far face is the larger there.
    const bottomMarks = g.bevelMarks.filter((m) => Math.abs(m.z - trueZ(14, 0, theta)) < 1e-6 && !m.corner);
    expect(bottomMarks.length).toBeGreaterThan(10);
    for (const m of bottomMarks) {
      expectClose(m.bevelDeg, 15, 1e-6, `bottom at girth ${m.girthMm}`);
      expect(m.kind).toBe('standing');
      expectClose(m.removedMm, 18 * Math.tan(theta), 1e-6, 's tan b');
    }
    const sideMarks = g.bevelMarks.filter((m) => Math.abs(Math.abs(m.y) - 589) < 1e-6 && !m.corner);
    expect(sideMarks.length).toBeGreaterThan(10);
    for (const m of sideMarks) expect(m.kind).toBe('square');
  });

  it('puts the other face 18 mm along the normal: its pivot line at x - 18 / cos(theta), its bottom 18 tan(theta) lower', () => {
    expectClose(g.otherFaceX, 1500 - 18 / Math.cos(theta), 1e-9, 'other face x');
    const far = g.layers[0]!.otherFaceRegions[0]!.outer;
    const lowest = Math.min(...far.map((p) => p.z));
    expectClose(lowest, trueZ(14, 0, theta) - 18 * Math.tan(theta), 1e-6, 'far face bottom');
  });

  it('draws the level line and the design waterline at their true heights on the transom', () => {
    const dwl = hullBuild({ ...chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 }), designWaterlineZ: 250 });
    const t = built(frameOfPart(dwl, part));
    expect(t.marks.designWaterline!.heightMm).toBe(250);
    expectClose(t.marks.designWaterline!.templateZ, trueZ(250, 0, theta), 1e-9, 'DWL on the template');
    expectClose(t.marks.designWaterline!.to.y, 589, 1e-6, 'DWL across to the side');
    expect(t.marks.levelLine.heightMm).toBe(250);
  });
});

describe('transom: a linearly flared hull narrowing aft', () => {
  // Analytic: chine y = 700 - 0.05 x on a flat bottom, side y = 700 - 0.05 x + 0.25 z (a plane), sheer at z = 600;
  // bottom 12 mm, side 9 mm, clearance 2 mm. The inside of the side is that plane moved in 11 mm along its normal
  // (0.05, 1, -0.25) / sqrt(1.065): y = 700 - 0.05 x + 0.25 z - 11 sqrt(1.065). On the transom's plane,
  // x = 1500 + (z - 100) tan(12 deg) (pivot at 100 mm), so the side's line there is a function of z alone.
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 6), chineY: (x) => 700 - 0.05 * x, flare: 0.25, sheerZ: 600, waterlineZs: [100, 300, 500], bottomMm: 12, sideMm: 9 }));
  const theta = 12 * DEG;
  const pivot = 100;
  const sideY = (z: number): number => 700 - 0.05 * (1500 + (z - pivot) * Math.tan(theta)) + 0.25 * z - 11 * Math.sqrt(1.065);

  it('follows the side plane, the bottom and the sheer, expanded to true heights', () => {
    const ex = transomExpanded(hull, { x: 1500, pivotZ: pivot, rakeRad: theta, xDirection: 'aft' }, [0], 2);
    const half = ex.faces[0]!;
    const zOf = (v: number): number => pivot + (v - pivot) * Math.cos(theta);
    let side = 0;
    for (const p of half) {
      const z = zOf(p.z);
      const d = Math.min(Math.abs(z - 14), Math.abs(z - 600), Math.abs(p.y - sideY(z)), p.y);
      expect(d, `(${p.y}, ${p.z})`).toBeLessThanOrEqual(1e-6);
      if (Math.abs(p.y - sideY(z)) <= 1e-6 && z > 15 && z < 599) side++;
    }
    expect(side).toBeGreaterThan(0);
    // Analytic corners: the side meets the bottom (z = 14) and the top (z = 600).
    expect(half.some((p) => Math.abs(zOf(p.z) - 14) < 1e-6 && Math.abs(p.y - sideY(14)) < 1e-6)).toBe(true);
    expect(half.some((p) => Math.abs(zOf(p.z) - 600) < 1e-6 && Math.abs(p.y - sideY(600)) < 1e-6)).toBe(true);
    expect(ex.linesExtendedMm).toBe(0);
  });
});

describe('transom: past the end of the lines', () => {
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0.1, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 }));

  it('carries the lines on (by at most half the end spacing) to reach a transom raked aft of the last station', () => {
    // The top of a transom on the last station (x = 3000) raked 15 deg reaches 500 tan 15 = 134 mm aft of it.
    const part = partOf({ id: 't', name: 'Transom', kind: 'transom', stationId: 'st6', thicknessMm: 18, layers: [{ thicknessMm: 18 }], rakeRad: 15 * DEG, pivotZ: 0, markedFace: 'aft' });
    const g = built(frameOfPart(hull, part));
    expect(g.transom!.linesExtendedMm).toBeGreaterThan(134);
    expect(g.transom!.linesExtendedMm).toBeLessThan(250);
    expect(g.warnings.map((w) => w.code)).toContain('transom-beyond-lines');
    // Analytic (prismatic, straight lines carried on straight): still the trapezoid of the section.
    const outer = g.layers[0]!.regions[0]!.outer;
    expectClose(Math.max(...outer.map((p) => p.z)), trueZ(500, 0, 15 * DEG), 1e-6, 'top');
  });

  it('refuses a rake that would need the lines carried on further', () => {
    const part = partOf({ id: 't', name: 'Transom', kind: 'transom', stationId: 'st6', thicknessMm: 18, layers: [{ thicknessMm: 18 }], rakeRad: 40 * DEG, pivotZ: 0, markedFace: 'aft' });
    const r = frameOfPart(hull, part);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues[0]).toMatchObject({ code: 'hull-does-not-reach', field: 'rakeRad', partId: 't' });
      expect(r.issues[0]!.message).toMatch(/^part "Transom" \(t\): the raked transom reaches x = \d+\.\d mm, \d+\.\d mm past the end of the lines; they may be carried on by at most 250\.0 mm/);
    }
  });

  it('hullExtended carries only the lines that reach the end stations', () => {
    const ext = hullExtended(hull, 100);
    expect(ext.xMax).toBe(3100);
    expect(ext.fitted.every((f) => f.xMax === 3100 && f.xMin === -100)).toBe(true);
    // Analytic: the straight chine carried on stays where it was (prismatic).
    const s = sectionAt(ext, 3080)!;
    expectClose(s.nodes.find((n) => n.lineIds.includes('chine'))!.y, 600, 1e-9, 'chine carried on');
    expect(sectionAt(hull, 3080)).toBeNull();
  });
});
