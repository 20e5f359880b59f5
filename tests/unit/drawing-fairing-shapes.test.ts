import { describe, expect, it } from 'vitest';
import { fairingViewOf } from '../../shared/geometry/fairing';
import { hullBuild } from '../../shared/geometry/hull';
import type { HullLinesInput } from '../../shared/geometry/hull-schema';
import { fairingChoices, fairingOpeningChoice, fairingShapes } from '../../src/features/plan/drawing/fairing-shapes';
import { linesCheck } from '../../src/features/plan/editor/lines-check';

/**
 * Analytic case: a box hull whose sheer heights lie on a parabola, z = 800 + (x - 2000)^2 / 20000, with
 * the cell at St 3 misread 20 mm high. A not-a-knot cubic spline reproduces any cubic exactly (so any
 * parabola), so the line through the other six cells is the parabola itself: the fairness check's
 * leave-one-out (fairness.ts) must find St 3 standing +20 mm off, and the line wanting it at the parabola.
 */
const xs = [0, 600, 1200, 1800, 2400, 3000, 3600];
const parabola = (x: number) => 800 + (x - 2000) ** 2 / 20000;
const BUMP = 20;

function lines(bumped: boolean): HullLinesInput {
  const cells = (f: (x: number, i: number) => { y: number; z: number }) => Object.fromEntries(xs.map((x, i) => [`st${i}`, f(x, i)]));
  return {
    notation: { unit: 'mm', precision: '0.5mm' },
    stations: xs.map((x, i) => ({ id: `st${i}`, name: `St ${i}`, x })),
    lines: [
      { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', knuckle: { fromX: null, toX: null }, cells: cells(() => ({ y: 0, z: 0 })) },
      { id: 'chine', name: 'Chine', kind: 'point', role: 'chine', knuckle: { fromX: null, toX: null }, cells: cells(() => ({ y: 500, z: 0 })) },
      { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', knuckle: { fromX: null, toX: null }, cells: cells((x, i) => ({ y: 500, z: parabola(x) + (bumped && i === 3 ? BUMP : 0) })) },
    ],
    skin: { offsetsTo: 'outside', defaultThicknessMm: 6 },
  };
}

describe('fairingShapes', () => {
  it('opens on a line there is something to see in: a flagged one, else the first that is not flat', () => {
    // Analytic: keel (0, 0), chine (500, 0) and the sheer's half-breadth 500 are constant along the hull;
    // only the sheer's height (the parabola) changes, so it is the first line worth drawing.
    const fair = hullBuild(lines(false));
    const fairView = fairingViewOf(fair, { exaggeration: 10 });
    const opened = fairingOpeningChoice(fairView, fairingChoices(fairView), linesCheck(fair.lines).cellFlags, 1);
    expect([opened?.lineId, opened?.view]).toEqual(['sheer', 'profile']);
    // With St 3 misread, the line opened on is one with that cell flagged.
    const bumped = hullBuild(lines(true));
    const bumpedView = fairingViewOf(bumped, { exaggeration: 10 });
    const flags = linesCheck(bumped.lines).cellFlags;
    const flagged = fairingOpeningChoice(bumpedView, fairingChoices(bumpedView), flags, 1)!;
    expect(fairingShapes(bumpedView, flagged, flags)!.cells.some((c) => c.flag !== null)).toBe(true);
  });

  it('offers every line in each view it has: a point line in plan and in profile', () => {
    const view = fairingViewOf(hullBuild(lines(false)), { exaggeration: 10 });
    const sheer = fairingChoices(view).filter((c) => c.lineId === 'sheer');
    expect(sheer.map((c) => [c.view, c.field])).toEqual([['plan', 'y'], ['profile', 'z']]);
  });

  it('draws the line in its own millimetres whatever the exaggeration: the curve passes through the cells', () => {
    const hull = hullBuild(lines(false));
    for (const k of [1, 20]) {
      const s = fairingShapes(fairingViewOf(hull, { exaggeration: k }), { lineId: 'sheer', piece: 0, view: 'profile' }, new Map())!;
      s.cells.forEach((c, i) => {
        expect(c.at.x).toBe(xs[i]);
        expect(c.at.y).toBeCloseTo(parabola(xs[i]!), 9);
        expect(c.flag).toBeNull();
      });
      // Between the cells too the fitted line is the parabola (not-a-knot reproduces it).
      for (const p of s.curve) expect(p.y).toBeCloseTo(parabola(p.x), 6);
      expect(s.stations).toHaveLength(xs.length);
    }
  });

  it('marks the misread cell with its deviation and where the rest of the line puts it (analytic: +20 mm, on the parabola)', () => {
    const input = lines(true);
    const hull = hullBuild(input);
    const check = linesCheck(hullBuild(input).lines);
    const s = fairingShapes(fairingViewOf(hull, { exaggeration: 10 }), { lineId: 'sheer', piece: 0, view: 'profile' }, check.cellFlags)!;
    const flagged = s.cells.filter((c) => c.flag);
    expect(flagged.map((c) => c.stationName)).toEqual(['St 3']);
    const f = flagged[0]!.flag!;
    expect(f.deviationMm).toBeCloseTo(BUMP, 6);
    expect(f.expected.y).toBeCloseTo(parabola(xs[3]!), 6);
    expect(flagged[0]!.at.y).toBeCloseTo(parabola(xs[3]!) + BUMP, 9);
    // The same line in plan (its half-breadths, all 500) has nothing to flag.
    const plan = fairingShapes(fairingViewOf(hull, { exaggeration: 10 }), { lineId: 'sheer', piece: 0, view: 'plan' }, check.cellFlags)!;
    expect(plan.cells.every((c) => c.flag === null)).toBe(true);
    expect(s.bounds.maxY).toBeCloseTo(Math.max(...xs.map(parabola), parabola(xs[3]!) + BUMP), 6);
  });

  it('gives null for a line the view does not have', () => {
    const view = fairingViewOf(hullBuild(lines(false)));
    expect(fairingShapes(view, { lineId: 'nope', piece: 0, view: 'plan' }, new Map())).toBeNull();
  });
});
