import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bevelAlong } from '../../shared/geometry/bevel';
import { deductionOf } from '../../shared/geometry/deduction';
import { fairingViewOf } from '../../shared/geometry/fairing';
import { fairnessCheck } from '../../shared/geometry/fairness';
import type { HullLinesInput } from '../../shared/geometry/hull-schema';
import { hullBuild, hullIssues } from '../../shared/geometry/hull';
import { sectionAt } from '../../shared/geometry/section';
import { GeometryInputError, type GeometryIssue } from '../../shared/geometry/types';
import { chineHull, ellipticHull, evenStations, range, roundHull } from './analytic-hulls';

/** The issues hullBuild throws with (failing the test if it does not throw a GeometryInputError). */
function issuesOf(input: unknown): GeometryIssue[] {
  try {
    hullBuild(input as HullLinesInput);
  } catch (e) {
    expect(e).toBeInstanceOf(GeometryInputError);
    const issues = (e as GeometryInputError).issues;
    expect(issues.length).toBeGreaterThan(0);
    for (const i of issues) expect(i.message).not.toMatch(/undefined/);
    expect(hullIssues(input)).toEqual(issues);
    return issues;
  }
  throw new Error('expected hullBuild to refuse this hull');
}

const box = (): HullLinesInput => chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: 0.2, sheerZ: 800, waterlineZs: [200, 400, 600], bottomMm: 12, sideMm: 9 });
const cylinder = (): HullLinesInput =>
  roundHull({ xs: evenStations(0, 6000, 10), radius: () => 1000, centreZ: 1100, sheerAngle: (110 * Math.PI) / 180, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100) });
const cellsOf = (h: HullLinesInput, id: string) => h.lines.find((l) => l.id === id)!.cells as Record<string, unknown>;

describe('hullBuild: bad input, each its own clear error', () => {
  it('an empty table', () => {
    expect(issuesOf({ notation: {}, stations: [], lines: [], skin: { defaultThicknessMm: 0 } })[0]).toMatchObject({ code: 'empty-table', field: 'stations' });
    // Stations, but no line has a value.
    const blank = box();
    for (const l of blank.lines) for (const k of Object.keys(l.cells)) (l.cells as Record<string, unknown>)[k] = null;
    expect(issuesOf(blank)[0]).toMatchObject({ code: 'empty-table', field: 'lines' });
  });

  it('one station', () => {
    const h = box();
    h.stations = h.stations.slice(0, 1);
    for (const l of h.lines) l.cells = { st0: (l.cells as Record<string, never>).st0 };
    expect(issuesOf(h)[0]).toMatchObject({ code: 'one-station', stationId: 'st0', field: 'stations', value: 1 });
  });

  it('a chine above the sheer', () => {
    const h = box();
    cellsOf(h, 'chine').st2 = { y: 700, z: 900 }; // the sheer there is at 800
    const [issue] = issuesOf(h);
    expect(issue).toMatchObject({ code: 'chine-above-sheer', lineId: 'chine', stationId: 'st2', field: 'z', value: { y: 700, z: 900 } });
    expect(issue!.message).toMatch(/station 2: Chine .* lies above the sheer Sheer/);
  });

  it('waterline half-breadths giving a section that crosses itself', () => {
    // Waterline 600 of the cylinder is 866.0 mm (sqrt(1000^2 - 500^2)); typed 86.6 it would put the section
    // back near the keel, under waterlines 200 to 500.
    const h = cylinder();
    cellsOf(h, 'wl600').st3 = 86.6;
    const [issue] = issuesOf(h);
    expect(issue).toMatchObject({ code: 'section-crosses-itself', lineId: 'wl600', stationId: 'st3', field: 'halfBreadth', value: 86.6 });
    expect(issue!.message).toMatch(/WL 600 .* out of height order with WL 200, WL 300, WL 400, WL 500/);
  });

  it('a line with a single value', () => {
    const h = box();
    h.lines.push({ id: 'wl700', name: 'WL 700', kind: 'waterline', z: 700, cells: { st4: 740 } });
    expect(issuesOf(h)[0]).toMatchObject({ code: 'line-single-value', lineId: 'wl700', stationId: 'st4', field: 'cells', value: 740 });
  });

  it('a negative thickness', () => {
    const h = box();
    h.skin.panels![1]!.thicknessMm = -9;
    const [issue] = issuesOf(h);
    expect(issue).toMatchObject({ code: 'negative-thickness', field: 'skin.panels[1].thicknessMm', value: -9 });
    expect(issue!.message).toMatch(/-9 mm: a thickness cannot be negative/);
    const d = box();
    d.skin.sheathingMm = -1;
    expect(issuesOf(d)[0]).toMatchObject({ code: 'negative-thickness', field: 'skin.sheathingMm', value: -1 });
  });

  it('a value that is not a number, naming line and station', () => {
    const h = box();
    cellsOf(h, 'wl200').st1 = Number.NaN;
    const [issue] = issuesOf(h);
    expect(issue).toMatchObject({ code: 'invalid-field', lineId: 'wl200', stationId: 'st1', field: 'lines[3].cells.st1' });
    expect(issue!.message).toMatch(/^line WL 200, station 1: /);
  });

  it('two stations at one x, a negative half-breadth, a panel bounded by no such line', () => {
    const a = box();
    a.stations[2]!.x = a.stations[1]!.x;
    expect(issuesOf(a)[0]).toMatchObject({ code: 'duplicate-station-x', stationId: 'st2', field: 'x', value: 600 });
    const b = box();
    cellsOf(b, 'wl400').st3 = -5;
    expect(issuesOf(b)[0]).toMatchObject({ code: 'negative-half-breadth', lineId: 'wl400', stationId: 'st3', value: -5 });
    const c = box();
    c.skin.panels![0]!.toLineId = 'chine-2';
    expect(issuesOf(c)[0]).toMatchObject({ code: 'panel-line-unknown', lineId: 'chine-2', field: 'skin.panels[0].toLineId' });
  });

  it('accepts the good hulls these were made from', () => {
    expect(hullIssues(box())).toEqual([]);
    expect(hullIssues(cylinder())).toEqual([]);
  });
});

/** Every number inside a value (objects, arrays) is finite. */
function allFinite(v: unknown, path = ''): string | null {
  if (typeof v === 'number') return Number.isFinite(v) ? null : `${path} = ${v}`;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const bad = allFinite(v[i], `${path}[${i}]`);
      if (bad) return bad;
    }
    return null;
  }
  if (v && typeof v === 'object') {
    for (const [k, w] of Object.entries(v)) {
      if (k === 'lines') continue; // the input itself
      const bad = allFinite(w, `${path}.${k}`);
      if (bad) return bad;
    }
  }
  return null;
}

/** Random plausible hulls: elliptic round-bilge or flared hard-chine (its chine knuckled from a random x), random stations, lines, skin, deck. */
const hullArb: fc.Arbitrary<HullLinesInput> = fc
  .record({
    round: fc.boolean(),
    n: fc.integer({ min: 2, max: 12 }),
    spacing: fc.double({ min: 150, max: 900, noNaN: true }),
    beam: fc.double({ min: 300, max: 1500, noNaN: true }),
    taper: fc.double({ min: 0, max: 0.5, noNaN: true }),
    depth: fc.double({ min: 150, max: 1200, noNaN: true }),
    flare: fc.double({ min: -0.2, max: 0.7, noNaN: true }),
    wl: fc.integer({ min: 0, max: 12 }),
    bt: fc.integer({ min: 0, max: 8 }),
    skin: fc.double({ min: 0, max: 25, noNaN: true }),
    inside: fc.boolean(),
    knuckleFrom: fc.option(fc.double({ min: 0, max: 1, noNaN: true })),
    deck: fc.option(fc.record({ percent: fc.double({ min: 0, max: 6, noNaN: true }), scaled: fc.boolean(), arc: fc.boolean(), t: fc.double({ min: 0, max: 20, noNaN: true }) })),
  })
  .map((p) => {
    const xs = Array.from({ length: p.n }, (_, i) => i * p.spacing);
    const L = xs[xs.length - 1]! || 1;
    const B = (x: number) => p.beam * (1 - p.taper * Math.sin((Math.PI * x) / L) ** 2);
    const wls = Array.from({ length: p.wl }, (_, i) => Number((1000 - p.depth + ((i + 0.5) * p.depth) / (p.wl + 0.5)).toFixed(3)));
    const minB = p.beam * (1 - p.taper);
    const bts = Array.from({ length: p.bt }, (_, i) => Number((((i + 1) * 0.8 * minB) / (p.bt + 1)).toFixed(3)));
    const h = p.round
      ? ellipticHull({ xs, halfBeam: B, depth: p.depth, sheerZ: 1000, waterlineZs: wls, buttockYs: bts })
      : chineHull({
          xs,
          chineY: B,
          // Tumblehome no deeper than half the narrowest chine beam: more would carry the sheer across the
          // centreline, which is not a valid hull (hullBuild rightly refuses it), not a case for this property.
          flare: Math.max(p.flare, (-0.5 * minB) / p.depth),
          sheerZ: p.depth,
          waterlineZs: wls.map((z) => Number((z - 1000 + p.depth).toFixed(3))).filter((z) => z > 0 && z < p.depth),
          bottomMm: p.skin,
          sideMm: p.skin / 2,
          chineKnuckle: { fromX: p.knuckleFrom === null ? null : p.knuckleFrom * L, toX: null },
        });
    h.skin = { ...h.skin, defaultThicknessMm: p.skin, offsetsTo: p.inside ? 'inside' : 'outside' };
    if (p.deck) {
      h.deck = {
        camber: { shape: p.deck.arc ? 'arc' : 'parabola', crown: { kind: 'percent-of-beam', percent: p.deck.percent }, convention: p.deck.scaled ? 'scaled' : 'one-pattern' },
        thicknessMm: p.deck.t,
      };
    }
    return h;
  });

describe('hullBuild and what is built on it: no NaN on random valid hulls', () => {
  it('builds every random hull and gives finite sections, deductions, bevels, fairness and views', () => {
    // Property (fast-check): plausible random hulls from the analytic families above.
    fc.assert(
      fc.property(hullArb, fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 4 }), fc.double({ min: 0, max: 3, noNaN: true }), (lines, fs, clearance) => {
        const hull = hullBuild(lines);
        for (const f of fs) {
          const x = hull.xMin + f * (hull.xMax - hull.xMin);
          const s = sectionAt(hull, x);
          expect(s).not.toBeNull();
          expect(allFinite(s)).toBeNull();
          const d = deductionOf(hull, s!, { filletClearanceMm: clearance });
          expect(allFinite(d)).toBeNull();
          expect(d.outline.length).toBeGreaterThan(2);
          expect(allFinite(bevelAlong(d.hull, { markedFace: 'aft', sidingMm: 18, xDirection: 'aft' }))).toBeNull();
        }
        expect(allFinite(fairnessCheck(hull))).toBeNull();
        expect(allFinite(fairingViewOf(hull))).toBeNull();
      }),
      { numRuns: 60 },
    );
  });
});
