import { describe, expect, it } from 'vitest';
import type { HullLinesInput } from '../../shared/geometry/hull-schema';
import { hullBuild } from '../../shared/geometry/hull';
import { sectionNodesAt } from '../../shared/geometry/nodes';
import { sectionAt } from '../../shared/geometry/section';

const xs = [0, 1000, 2000];
const same = <T,>(v: T) => Object.fromEntries(xs.map((_, i) => [`st${i}`, v]));
const table = (lines: HullLinesInput['lines']): HullLinesInput => ({ notation: {}, stations: xs.map((x, i) => ({ id: `st${i}`, name: String(i), x })), lines, skin: { defaultThicknessMm: 0 } });
const wl = (z: number, y: number) => ({ id: `wl${z}`, name: `WL ${z}`, kind: 'waterline' as const, z, cells: same(y) });

describe('sectionNodesAt: order from keel to sheer', () => {
  it('keeps a wineglass section (keel, hollow garboard, bilge, sheer) in order', () => {
    // A keel 80 mm wide standing 300 mm below the hull, the garboard flaring out in a hollow, then the bilge.
    const h = hullBuild(
      table([
        { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: same({ y: 0, z: 0 }) },
        wl(100, 40), wl(200, 40), wl(300, 40), wl(350, 80), wl(400, 200), wl(450, 400), wl(500, 600), wl(600, 800), wl(800, 900),
        { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: same({ y: 920, z: 1000 }) },
      ]),
    );
    const { all, from, to } = sectionNodesAt(h.fitted, 1000);
    expect(all.map((n) => n.lineIds[0])).toEqual(['keel', 'wl100', 'wl200', 'wl300', 'wl350', 'wl400', 'wl450', 'wl500', 'wl600', 'wl800', 'sheer']);
    expect([from, to]).toEqual([0, 10]);
  });

  it('keeps tumblehome: the widest point before the sheer', () => {
    const h = hullBuild(table([{ id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: same({ y: 0, z: 0 }) }, wl(300, 700), wl(600, 900), wl(800, 880), { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: same({ y: 850, z: 900 }) }]));
    expect(sectionNodesAt(h.fitted, 500).all.map((n) => n.lineIds[0])).toEqual(['keel', 'wl300', 'wl600', 'wl800', 'sheer']);
  });
});

describe('sectionNodesAt: merging', () => {
  it('makes one point of a waterline and a buttock crossing within the merge tolerance, a knuckle keeping its place', () => {
    const h = hullBuild(
      table([
        { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: same({ y: 0, z: 0 }) },
        { id: 'b', name: 'B 300', kind: 'buttock', y: 300, cells: same(100.2) },
        wl(100, 300),
        { id: 'chine', name: 'Chine', kind: 'point', role: 'chine', knuckle: {}, cells: same({ y: 600, z: 300 }) },
        wl(300, 600.3),
        { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: same({ y: 700, z: 800 }) },
      ]),
    );
    const { all } = sectionNodesAt(h.fitted, 1000);
    expect(all.map((n) => n.lineIds.sort())).toEqual([['keel'], ['b', 'wl100'], ['chine', 'wl300'], ['sheer']]);
    // Averaged where neither is a knuckle; the knuckle's own place where one is.
    expect(all[1]).toMatchObject({ y: 300, z: 100.1, knuckle: false });
    expect(all[2]).toMatchObject({ y: 600, z: 300, knuckle: true });
  });
});

describe('sectionAt at the stem', () => {
  it('has no section where every line is on the centreline', () => {
    // The stem's station: keel, waterlines and sheer all at half-breadth 0 there.
    const h = hullBuild(
      table([
        { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: { st0: { y: 0, z: 100 }, st1: { y: 0, z: 0 }, st2: { y: 0, z: 0 } } },
        { id: 'wl300', name: 'WL 300', kind: 'waterline', z: 300, cells: { st0: 0, st1: 500, st2: 600 } },
        { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: { st0: { y: 0, z: 900 }, st1: { y: 700, z: 800 }, st2: { y: 750, z: 780 } } },
      ]),
    );
    expect(sectionAt(h, 0)).toBeNull();
    const s = sectionAt(h, 1000)!;
    expect(s.nodes.map((n) => n.lineIds[0])).toEqual(['keel', 'wl300', 'sheer']);
  });
});

describe('sectionNodesAt: order whatever order the lines are given in', () => {
  // Analytic case: a round section (half-breadth growing with height), its waterlines listed scrambled: keel to sheer is by
  // height. Below nodes.ts INSERTION_SORT_MAX points an insertion sort orders them, above it Array.sort.
  const section = (count: number) => {
    const heights = Array.from({ length: count }, (_, k) => 10 + (k * 980) / count);
    const scrambled = heights.map((_, k) => heights[(k * 7) % count]!);
    return hullBuild(
      table([
        { id: 'sheer', name: 'Sheer', kind: 'point', role: 'sheer', cells: same({ y: 1000, z: 1000 }) },
        ...scrambled.map((z) => ({ id: `wl${z}`, name: `WL ${z}`, kind: 'waterline' as const, z, cells: same(1000 * Math.sqrt(z / 1000)) })),
        { id: 'keel', name: 'Keel', kind: 'point', role: 'keel', cells: same({ y: 0, z: 0 }) },
      ]),
    );
  };
  it.each([40, 150])('puts %i scrambled waterlines in order of height (insertion sort for 40, Array.sort for 150)', (count) => {
    const { all, from, to } = sectionNodesAt(section(count).fitted, 1000);
    const z = all.map((n) => n.z);
    expect(all[0]!.lineIds).toEqual(['keel']);
    expect(all[all.length - 1]!.lineIds).toEqual(['sheer']);
    expect(z.every((v, i) => i === 0 || v > z[i - 1]!)).toBe(true);
    expect([from, to]).toEqual([0, count + 1]);
  });
});
