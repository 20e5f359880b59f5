import { describe, expect, it } from 'vitest';
import {
  type TemplateDrawing,
  bevelRowsOf,
  bulgeArc,
  drawingAsSeen,
  drawingBounds,
  drawingIssues,
  drawingPathBounds,
  drawingPathPoints,
  drawingTurned,
  lengthLabel,
} from '../../shared/geometry/drawing';
import { circleDrawing, rectangleDrawing, ringFrameDrawing } from './exports-fixtures';

describe('bulgeArc and bulged paths', () => {
  it('reads a bulge of 1 as a semicircle counter-clockwise', () => {
    // Autodesk DXF Reference (LWPOLYLINE group 42): bulge = tan(included angle / 4); 1 is a semicircle, positive counter-clockwise
    const a = bulgeArc({ y: 0, z: 0 }, { y: 2, z: 0 }, 1)!;
    expect(a.centre.y).toBeCloseTo(1, 12);
    expect(a.centre.z).toBeCloseTo(0, 12);
    expect(a.radiusMm).toBeCloseTo(1, 12);
    expect(a.sweepRad).toBeCloseTo(Math.PI, 12);
    // analytic: counter-clockwise from (0,0) round (1,0) to (2,0) passes below, through (1,-1)
    const pts = drawingPathPoints({ kind: 'polyline', role: 'mark', closed: false, points: [{ y: 0, z: 0 }, { y: 2, z: 0 }], bulges: [1] }, 0.001).points;
    expect(Math.min(...pts.map((p) => p.z))).toBeCloseTo(-1, 5);
    for (const p of pts) expect(Math.hypot(p.y - 1, p.z)).toBeCloseTo(1, 9);
  });

  it('bounds a quarter-circle bulge exactly', () => {
    // analytic: bulge tan(pi/8) from (1,0) to (0,1) is the quarter of the unit circle through (cos 45, sin 45)
    const b = drawingPathBounds({ kind: 'polyline', role: 'mark', closed: false, points: [{ y: 1, z: 0 }, { y: 0, z: 1 }], bulges: [Math.tan(Math.PI / 8)] });
    expect(b.maxY).toBeCloseTo(1, 12);
    expect(b.maxZ).toBeCloseTo(1, 12);
    const semi = drawingPathBounds({ kind: 'polyline', role: 'mark', closed: false, points: [{ y: 1, z: 0 }, { y: -1, z: 0 }], bulges: [1] });
    // analytic: counter-clockwise half circle from (1,0) to (-1,0) reaches z = 1
    expect(semi.maxZ).toBeCloseTo(1, 12);
    expect(semi.minZ).toBeCloseTo(0, 12);
  });

  it('bounds a circle and an arc exactly', () => {
    // analytic
    expect(drawingBounds(circleDrawing(40, 10, 20))).toEqual({ minY: -30, maxY: 50, minZ: -20, maxZ: 60 });
    const arc = drawingPathBounds({ kind: 'arc', role: 'mark', centre: { y: 0, z: 0 }, radiusMm: 10, startDeg: 350, endDeg: 100 });
    expect(arc.maxY).toBeCloseTo(10, 12);
    expect(arc.maxZ).toBeCloseTo(10, 12);
    expect(arc.minY).toBeCloseTo(10 * Math.cos((100 * Math.PI) / 180), 12);
    expect(arc.minZ).toBeCloseTo(10 * Math.sin((-10 * Math.PI) / 180), 12);
  });
});

describe('drawingAsSeen', () => {
  it('keeps the aft face as drawn and mirrors the forward face across the centreline', () => {
    const aft = ringFrameDrawing();
    expect(drawingAsSeen(aft)).toBe(aft);
    const fwd = ringFrameDrawing({ title: { face: 'forward' } });
    const seen = drawingAsSeen(fwd);
    // analytic: looking at the forward face from forward, starboard (+y) is on the left: y becomes -y
    const p0 = (fwd.paths[0] as { points: { y: number; z: number }[] }).points[5]!;
    const q0 = (seen.paths[0] as { points: { y: number; z: number }[] }).points[5]!;
    expect(q0).toEqual({ y: -p0.y, z: p0.z });
    // a mirror reverses a loop, so its bulges change sign (their arcs still bend the same way in the part)
    expect((seen.paths[0] as { bulges: number[] }).bulges[1]).toBe(1);
    // labels are not mirrored: a left-aligned label becomes right-aligned, its rotation reversed
    const l = fwd.labels.find((x) => x.align === 'start' && x.rotationDeg === 90)!;
    const m = seen.labels[fwd.labels.indexOf(l)]!;
    expect([m.align, m.rotationDeg, m.anchor.y]).toEqual(['end', -90, -l.anchor.y]);
    expect(seen.bevelMarks[0]!.inward).toEqual({ y: -fwd.bevelMarks[0]!.inward.y, z: fwd.bevelMarks[0]!.inward.z });
    // the bounds mirror too (analytic)
    const b = drawingBounds(fwd)!;
    const c = drawingBounds(seen)!;
    expect(c.minY).toBeCloseTo(-b.maxY, 9);
    expect(c.maxY).toBeCloseTo(-b.minY, 9);
  });

  it('keeps an arc counter-clockwise and on the mirrored side', () => {
    const d: TemplateDrawing = { ...circleDrawing(1), paths: [{ kind: 'arc', role: 'mark', centre: { y: 5, z: 0 }, radiusMm: 2, startDeg: 0, endDeg: 90 }], title: { ...circleDrawing(1).title, face: 'forward' } };
    const p = drawingAsSeen(d).paths[0]!;
    // analytic: the quarter from +y to +z, mirrored, runs from +z (90) to -y (180), centre at y = -5
    expect(p).toMatchObject({ kind: 'arc', centre: { y: -5, z: 0 }, startDeg: 90, endDeg: 180 });
  });
});

describe('drawingTurned', () => {
  it('turns everything a quarter turn counter-clockwise', () => {
    const d = rectangleDrawing(300, 100);
    const t = drawingTurned(d);
    // analytic: (y, z) -> (-z, y); a 300 x 100 rectangle becomes 100 x 300
    const b = drawingBounds(t)!;
    expect([b.minY, b.maxY + 0, b.minZ, b.maxZ]).toEqual([-100, 0, -150, 150]);
  });
});

describe('drawingIssues', () => {
  it('passes the fixtures and finds an open cut, a wrong check dimension and bulges that do not match', () => {
    expect(drawingIssues(ringFrameDrawing())).toEqual([]);
    const d = rectangleDrawing(300, 100);
    const bad: TemplateDrawing = {
      ...d,
      paths: [{ kind: 'polyline', role: 'outer-cut', closed: false, points: [{ y: 0, z: 0 }, { y: 1, z: 0 }, { y: 1, z: 1 }], bulges: [0] }],
      checkDimension: { from: { y: 0, z: 0 }, to: { y: 300, z: 0 }, lengthMm: 300.2 },
    };
    expect(drawingIssues(bad).map((i) => i.code).sort()).toEqual(['drawing-bulges', 'drawing-check-dimension', 'drawing-cut-open']);
  });
});

describe('lengthLabel', () => {
  it('prints millimetres to 0.1 and inches to the nearest 1/32 reduced', () => {
    // NIST SP 811: 1 in = 25.4 mm exactly. 1234.5 mm = 48.6024 in = 48 19/32 in to the nearest 1/32.
    expect(lengthLabel(1234.5, 'mm')).toBe('1234.5 mm');
    expect(lengthLabel(1234.5, 'in')).toBe('48 19/32 in');
    expect(lengthLabel(25.4, 'in')).toBe('1 in');
    expect(lengthLabel(12.7, 'in')).toBe('1/2 in');
    expect(lengthLabel(-19.05, 'in')).toBe('-3/4 in');
  });
});

describe('bevelRowsOf', () => {
  it('lists every mark in order with the face down', () => {
    const d = ringFrameDrawing();
    const rows = bevelRowsOf(d);
    expect(rows).toHaveLength(d.bevelMarks.length);
    expect(rows[3]).toMatchObject({ partName: 'Frame 4', layerIndex: 1, markNo: 4, faceDown: 'aft', sawTiltDeg: d.bevelMarks[3]!.sawTiltDeg });
  });
});
