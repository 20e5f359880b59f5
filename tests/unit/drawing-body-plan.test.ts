import { describe, expect, it } from 'vitest';
import { hullBuild } from '../../shared/geometry/hull';
import { hullLinesSchema, type Line } from '../../shared/geometry/hull-schema';
import { sectionAt } from '../../shared/geometry/section';
import { bodyPlanSideOf, bodyPlanSides, offsetHandlesAt, offsetHandlesByGirth, offsetNudge, offsetOnSection, offsetSnap, referenceLinesOf } from '../../src/features/plan/drawing/body-plan';
import { createSectionCache, stationNeighbourhood, stationSectionKey, stationSectionOf } from '../../src/features/plan/drawing/station-section';
import { offsetDelete, offsetMove, offsetPointOf, offsetValueFor } from '../../src/features/plan/editor/offset-actions';
import { inventedHull } from '../bench/invented-hull';
import { plan } from './plan-editor-fixtures';

const line = (p: ReturnType<typeof plan>, id: string) => p.lines.lines.find((l) => l.id === id)!;
const diagonal: Line = { id: 'dg', name: 'D 1', kind: 'diagonal', originZ: 1000, angle: Math.PI / 4, knuckle: null, cells: { 'st-1': 100 } };

describe('offsetMove', () => {
  it('takes only the half-breadth of a waterline point dragged anywhere, and leaves the rest of the plan as it was', () => {
    const p = plan();
    const next = offsetMove(p, { lineId: 'ln-wl', stationId: 'st-2', to: { y: 512.3, z: 999 } });
    expect(line(next, 'ln-wl').cells).toEqual({ 'st-1': 300, 'st-2': 512.3, 'st-3': 500 });
    // structural sharing: the lines not touched, the stations and the parts are the same objects
    expect(line(next, 'ln-bt')).toBe(line(p, 'ln-bt'));
    expect(next.lines.stations).toBe(p.lines.stations);
    expect(next.parts).toBe(p.parts);
    expect(p.lines.lines[0]!.cells['st-2']).toBe(450);
  });

  it('takes only the height of a buttock point, both values of a point line, rounded to the step', () => {
    const p = plan();
    expect(line(offsetMove(p, { lineId: 'ln-bt', stationId: 'st-1', to: { y: 900, z: 371.26 }, stepMm: 0.5 }), 'ln-bt').cells['st-1']).toBe(371.5);
    expect(line(offsetMove(p, { lineId: 'ln-chine', stationId: 'st-2', to: { y: 321.2, z: 240.9 }, stepMm: 1 }), 'ln-chine').cells['st-2']).toEqual({ y: 321, z: 241 });
  });

  it('projects onto a diagonal: the distance along it to the nearest point (analytic: 45°, (100, 900) is 100√2 from (0, 1000))', () => {
    expect(offsetValueFor(diagonal, { y: 100, z: 900 })).toBeCloseTo(100 * Math.SQRT2, 6);
    // a point off the diagonal: its projection. (200, 1000) projects to t = 200 cos45° = 141.42
    expect(offsetValueFor(diagonal, { y: 200, z: 1000 })).toBeCloseTo(141.421356, 5);
    expect(offsetPointOf(diagonal, 100 * Math.SQRT2)).toEqual({ y: expect.closeTo(100, 9), z: expect.closeTo(900, 9) });
  });

  it('stops half-breadths and distances at the centreline, and ignores a point that is not a number', () => {
    const p = plan();
    expect(line(offsetMove(p, { lineId: 'ln-wl', stationId: 'st-1', to: { y: -40, z: 300 } }), 'ln-wl').cells['st-1']).toBe(0);
    expect(offsetValueFor(diagonal, { y: -50, z: 1100 })).toBe(0);
    expect(offsetMove(p, { lineId: 'ln-wl', stationId: 'st-1', to: { y: Number.NaN, z: 300 } })).toBe(p);
    expect(offsetMove(p, { lineId: 'nope', stationId: 'st-1', to: { y: 1, z: 1 } })).toBe(p);
    expect(offsetMove(p, { lineId: 'ln-wl', stationId: 'st-9', to: { y: 1, z: 1 } })).toBe(p);
  });

  it('deletes a point, and deleting an empty cell changes nothing', () => {
    const p = plan();
    expect(line(offsetDelete(p, { lineId: 'ln-bt', stationId: 'st-2' }), 'ln-bt').cells['st-2']).toBeNull();
    expect(offsetDelete(p, { lineId: 'ln-chine', stationId: 'st-2' })).toBe(p);
  });
});

describe('bodyPlanSideOf', () => {
  it('puts stations on the bow side of midships on the right, the rest on the left, midships on both', () => {
    // common practice: forward sections right of the centreline, aft left
    expect(bodyPlanSideOf(100, 0, 1000, 'aft')).toBe('forward');
    expect(bodyPlanSideOf(900, 0, 1000, 'aft')).toBe('aft');
    expect(bodyPlanSideOf(100, 0, 1000, 'forward')).toBe('aft');
    expect(bodyPlanSideOf(500, 0, 1000, 'aft')).toBe('both');
    const sides = bodyPlanSides(plan().lines);
    expect([...sides.values()]).toEqual(['forward', 'both', 'aft']);
  });
});

describe('offsetHandlesAt and referenceLinesOf', () => {
  it('places each offset in the section plane with the freedom its cell gives', () => {
    const handles = offsetHandlesAt(plan().lines, 'st-1');
    expect(handles.map((h) => [h.lineId, h.freedom, h.at])).toEqual([
      ['ln-wl', 'across', { y: 300, z: 300 }],
      ['ln-bt', 'up', { y: 200, z: 400 }],
      ['ln-chine', 'free', { y: 300, z: 250 }],
    ]);
    expect(offsetHandlesAt(plan().lines, 'st-3').map((h) => h.lineId)).toEqual(['ln-wl']);
  });

  it('draws a diagonal from its origin to the edge it meets first, on both sides', () => {
    const [d] = referenceLinesOf({ lines: [diagonal] }, { minX: -500, minY: 0, maxX: 500, maxY: 1200 });
    // analytic: at 45° from (0, 1000) the side x = 500 comes (at z = 500) before the bottom z = 0
    expect(d!.pieces[0]![1].x).toBeCloseTo(500, 9);
    expect(d!.pieces[0]![1].y).toBeCloseTo(500, 9);
    expect(d!.pieces[1]![1].x).toBeCloseTo(-500, 9);
  });
});

describe('offsetSnap', () => {
  const wl = line(plan(), 'ln-wl');
  const chine = line(plan(), 'ln-chine');
  const base = { gridMm: null, points: [], toleranceMm: 5, stepMm: 0.5 };

  it('lines a waterline point up with the half-breadth of a point nearby, whatever its height', () => {
    const r = offsetSnap(wl, { y: 303, z: 280 }, { ...base, points: [{ y: 300, z: 250 }, { y: 340, z: 300 }] });
    expect(r).toEqual({ value: 300, at: { y: 300, z: 300 }, snapped: 'point' });
  });

  it('falls to the grid, then to the precision, when no point is near', () => {
    expect(offsetSnap(wl, { y: 313, z: 0 }, { ...base, gridMm: 10 }).value).toBe(310);
    expect(offsetSnap(wl, { y: 313.3, z: 0 }, base)).toEqual({ value: 313.5, at: { y: 313.5, z: 300 }, snapped: null });
  });

  it('pulls a point line point onto another point within the tolerance, else leaves both values free', () => {
    expect(offsetSnap(chine, { y: 398, z: 202 }, { ...base, points: [{ y: 400, z: 200 }] }).value).toEqual({ y: 400, z: 200 });
    expect(offsetSnap(chine, { y: 390, z: 210 }, { ...base, points: [{ y: 400, z: 200 }] }).value).toEqual({ y: 390, z: 210 });
  });
});

describe('offsetNudge (an arrow key on a chosen point)', () => {
  const wl = line(plan(), 'ln-wl');
  const bt = line(plan(), 'ln-bt');
  const chine = line(plan(), 'ln-chine');
  const right = { y: 1, z: 0 };
  const up = { y: 0, z: 1 };

  it('moves a waterline point across by exactly the step and not at all up, a buttock point up and not across', () => {
    expect(offsetNudge(wl, { y: 450, z: 300 }, right, 10)).toMatchObject({ value: 460, at: { y: 460, z: 300 } });
    expect(offsetNudge(wl, { y: 450, z: 300 }, { y: -1, z: 0 }, 1).value).toBe(449);
    expect(offsetNudge(wl, { y: 450, z: 300 }, up, 10).value).toBe(450);
    expect(offsetNudge(bt, { y: 200, z: 250 }, up, 1.5875).value).toBeCloseTo(251.5875, 6);
    expect(offsetNudge(bt, { y: 200, z: 250 }, right, 10).value).toBe(250);
  });

  it('moves a point line point either way, and stops every offset at the centreline', () => {
    expect(offsetNudge(chine, { y: 300, z: 250 }, up, 10).value).toEqual({ y: 300, z: 260 });
    expect(offsetNudge(chine, { y: 300, z: 250 }, right, 10).value).toEqual({ y: 310, z: 250 });
    expect(offsetNudge(wl, { y: 0.5, z: 300 }, { y: -1, z: 0 }, 1).value).toBe(0);
    expect(offsetNudge(chine, { y: 0, z: 250 }, { y: -1, z: 0 }, 10).value).toEqual({ y: 0, z: 250 });
  });

  it('moves a diagonal point a whole step along the diagonal for a slanting arrow (analytic: 45°, 10 mm along from 100)', () => {
    const from = { y: 100 * Math.SQRT1_2, z: 1000 - 100 * Math.SQRT1_2 };
    // Right and down both lead outboard along a 45° diagonal that runs out and down; up leads inboard.
    expect(offsetNudge(diagonal, from, right, 10).value).toBeCloseTo(110, 6);
    expect(offsetNudge(diagonal, from, { y: 0, z: -1 }, 10).value).toBeCloseTo(110, 6);
    expect(offsetNudge(diagonal, from, up, 10).value).toBeCloseTo(90, 6);
    // A level diagonal (angle 0) is square to up: the point stays.
    const level = { ...diagonal, angle: 0 } as Line;
    expect(offsetNudge(level, { y: 100, z: 1000 }, up, 10).value).toBeCloseTo(100, 9);
  });
});

describe('offsetHandlesByGirth', () => {
  const handles = offsetHandlesAt(plan().lines, 'st-1');

  it('orders the offsets as the section runs, keel to sheer, table order where lines meet, the rest after', () => {
    // The table has WL 300, Buttock 200, Chine; this invented section passes the chine, then the buttock and waterline together.
    const section = { nodes: [{ lineIds: ['ln-chine'] }, { lineIds: ['ln-bt', 'ln-wl'] }] } as never;
    expect(offsetHandlesByGirth(handles, section).map((h) => h.lineId)).toEqual(['ln-chine', 'ln-wl', 'ln-bt']);
    const partial = { nodes: [{ lineIds: ['ln-bt'] }] } as never;
    expect(offsetHandlesByGirth(handles, partial).map((h) => h.lineId)).toEqual(['ln-bt', 'ln-wl', 'ln-chine']);
    expect(offsetHandlesByGirth(handles, null).map((h) => h.lineId)).toEqual(['ln-wl', 'ln-bt', 'ln-chine']);
  });
});

describe('offsetOnSection', () => {
  it('finds where a waterline, a buttock and a diagonal cross a polyline (analytic: the segment (0,0)-(400,400))', () => {
    const section = { vertices: [{ y: 0, z: 0 }, { y: 400, z: 400 }] } as never;
    expect(offsetOnSection({ ...line(plan(), 'ln-wl') }, section)).toBeCloseTo(300, 9);
    expect(offsetOnSection({ ...line(plan(), 'ln-bt') }, section)).toBeCloseTo(200, 9);
    // the 45° diagonal from (0, 1000) meets y = z at (500, 500): off this segment, so none
    expect(offsetOnSection(diagonal, section)).toBeNull();
    // from (0, 400) at 45° down it meets y = z at (200, 200): 200√2 along
    // (values are kept to 6 decimals of a mm)
    expect(offsetOnSection({ ...diagonal, originZ: 400 }, section)).toBeCloseTo(200 * Math.SQRT2, 5);
    expect(offsetOnSection(line(plan(), 'ln-chine'), section)).toBeNull();
  });
});

describe('stationSectionOf', () => {
  const lines = hullLinesSchema.parse(inventedHull(20));

  it('gives the same section as the whole hull at every station (reference: sectionAt on the full hullBuild)', () => {
    const hull = hullBuild(lines);
    for (const s of lines.stations) {
      const whole = sectionAt(hull, s.x);
      for (const near of [stationSectionOf(lines, s.id), stationSectionOf(lines, s.id, { trusted: true })]) {
        expect(near === null).toBe(whole === null);
        if (!whole || !near) continue;
        expect(near.vertices.length).toBe(whole.vertices.length);
        near.vertices.forEach((v, i) => {
          expect(v.y).toBeCloseTo(whole.vertices[i]!.y, 9);
          expect(v.z).toBeCloseTo(whole.vertices[i]!.z, 9);
        });
      }
    }
  });

  it('cuts the table to the station and its neighbours, keeping values only of lines that reach the station', () => {
    const near = stationNeighbourhood(lines, 'st0')!;
    expect(near.stations.map((s) => s.id)).toEqual(['st0', 'st1']);
    const keel = near.lines.find((l) => l.id === 'keel')!;
    expect(Object.keys(keel.cells)).toEqual(['st0', 'st1']);
    expect(stationNeighbourhood(lines, 'nope')).toBeNull();
  });

  it('works a section out again only when that station\'s offsets change', () => {
    const cache = createSectionCache();
    const hull = hullBuild(lines);
    const first = cache(lines, 'st5', hull);
    expect(cache(lines, 'st5', hull)).toBe(first);
    // A new table object with the same offsets (another station edited, say) keeps the section.
    expect(cache({ ...lines, lines: [...lines.lines] }, 'st5', null)).toBe(first);
    const wl = lines.lines.find((l) => l.kind === 'waterline' && l.cells['st5'] != null)!;
    const changed = { ...lines, lines: lines.lines.map((l) => (l === wl ? { ...wl, cells: { ...wl.cells, st5: (wl.cells['st5'] as number) + 30 } } : l)) } as typeof lines;
    expect(stationSectionKey(changed, 'st6')).toBe(stationSectionKey(lines, 'st6'));
    const again = cache(changed, 'st5', null);
    expect(again).not.toBe(first);
    expect(Math.max(...again!.vertices.map((v) => v.y))).toBeGreaterThanOrEqual(Math.max(...first!.vertices.map((v) => v.y)));
  });
});
