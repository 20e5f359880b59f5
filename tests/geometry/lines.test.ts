import { describe, expect, it } from 'vitest';
import { hullLinesSchema, type HullLinesInput } from '../../shared/geometry/hull-schema';
import { hullBuild } from '../../shared/geometry/hull';
import { lineFit, lineKnuckleAt, linePointAt, lineReaches, lineValueAt } from '../../shared/geometry/lines';
import { sectionAt } from '../../shared/geometry/section';
import { expectClose } from './helpers';

const stations = [0, 500, 1000, 1500, 2000].map((x, i) => ({ id: `st${i}`, name: String(i), x }));

function table(lines: HullLinesInput['lines']): HullLinesInput {
  return { notation: {}, stations, lines, skin: { defaultThicknessMm: 0 } };
}

describe('lineFit / lineValueAt', () => {
  it('runs a fair curve through the station values and stops at the last one', () => {
    // Analytic: values of the cubic 100 + 0.2 x - 1e-4 x^2 + 2e-8 x^3 at five stations; not-a-knot reproduces it.
    const f = (x: number) => 100 + 0.2 * x - 1e-4 * x * x + 2e-8 * x ** 3;
    const parsed = hullLinesSchema.parse(table([{ id: 'wl', name: 'WL', kind: 'waterline', z: 300, cells: Object.fromEntries(stations.map((s) => [s.id, f(s.x)])) }]));
    const [line] = lineFit(parsed.lines[0]!, parsed.stations);
    for (const x of [0, 123, 777, 1999]) expectClose(lineValueAt(line!, x)!, f(x), 1e-9, `x = ${x}`);
    expect(lineValueAt(line!, -0.5)).toBeNull();
    expect(lineValueAt(line!, 2000.5)).toBeNull();
  });

  it('fits a line with an empty cell between its values in two pieces, absent between them', () => {
    // A waterline above the sheer amidships: values forward and aft, none at station 2.
    const parsed = hullLinesSchema.parse(table([{ id: 'wl', name: 'WL', kind: 'waterline', z: 300, cells: { st0: 200, st1: 250, st2: null, st3: 260, st4: 210 } }]));
    const pieces = lineFit(parsed.lines[0]!, parsed.stations);
    expect(pieces.map((p) => [p.piece, p.xMin, p.xMax])).toEqual([
      [0, 0, 500],
      [1, 1500, 2000],
    ]);
    expect(pieces.some((p) => lineReaches(p, 1000))).toBe(false);
  });
});

describe('linePointAt', () => {
  it('puts a diagonal offset on its diagonal and moves it along it', () => {
    // Analytic: a diagonal from (0, 800) at 30 degrees below horizontal, offsets 400 + 0.1 x (straight in x):
    // the point is d (cos 30, -sin 30) from the origin, moving at 0.1 (cos 30, -sin 30) per mm of x.
    const a = Math.PI / 6;
    const parsed = hullLinesSchema.parse(table([{ id: 'd', name: 'D', kind: 'diagonal', originZ: 800, angle: a, cells: Object.fromEntries(stations.map((s) => [s.id, 400 + 0.1 * s.x])) }]));
    const [line] = lineFit(parsed.lines[0]!, parsed.stations);
    const p = linePointAt(line!, 1234)!;
    const d = 400 + 123.4;
    expectClose(p.y, d * Math.cos(a), 1e-9, 'y');
    expectClose(p.z, 800 - d * Math.sin(a), 1e-9, 'z');
    expectClose(p.vy, 0.1 * Math.cos(a), 1e-12, 'vy');
    expectClose(p.vz, -0.1 * Math.sin(a), 1e-12, 'vz');
  });
});

describe('lineKnuckleAt', () => {
  it('is a knuckle only between its start and end', () => {
    const parsed = hullLinesSchema.parse(
      table([{ id: 'c', name: 'Chine', kind: 'point', role: 'chine', knuckle: { fromX: 500, toX: 1500 }, cells: Object.fromEntries(stations.map((s) => [s.id, { y: 600, z: 100 }])) }]),
    );
    const [line] = lineFit(parsed.lines[0]!, parsed.stations);
    expect([0, 499, 500, 1000, 1500, 1501].map((x) => lineKnuckleAt(line!, x))).toEqual([false, false, true, true, true, false]);
  });
});

describe('a hull whose waterline ends short of the bow', () => {
  it('leaves the waterline out of the sections it does not reach', () => {
    const h = hullBuild(
      table([
        { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: Object.fromEntries(stations.map((s) => [s.id, { y: 0, z: 0 }])) },
        { id: 'wl', name: 'WL 200', kind: 'waterline', z: 200, cells: { st2: 400, st3: 500, st4: 520 } },
        { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: Object.fromEntries(stations.map((s) => [s.id, { y: 600, z: 500 }])) },
      ]),
    );
    expect(sectionAt(h, 700)!.nodes.flatMap((n) => n.lineIds)).toEqual(['keel', 'sheer']);
    expect(sectionAt(h, 1700)!.nodes.flatMap((n) => n.lineIds)).toEqual(['keel', 'wl', 'sheer']);
  });
});
