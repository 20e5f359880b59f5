/**
 * Invented drawings for the export tests (test data only, never shown to a builder): a ring frame of an
 * invented round-bilge hull with limbers, bevel marks every 50 mm and every kind of line; and analytic
 * shapes (a rectangle, a circle) whose sizes the checks know exactly.
 */
import type { DrawingBevelMark, DrawingPath, DrawingTitle, TemplateDrawing } from '../../shared/geometry/drawing';
import { polygonOffset } from '../../shared/geometry/polygon';
import type { SectionPoint } from '../../shared/geometry/types';

export function titleOf(over: Partial<DrawingTitle> = {}): DrawingTitle {
  return {
    hullName: 'Test hull "Petrel" 5.8 m',
    partName: 'Frame 4',
    partKind: 'ring frame',
    stationName: '4',
    layerIndex: 1,
    layerCount: 2,
    plyThicknessMm: 9,
    face: 'aft',
    revisionId: 'r12',
    date: '2025-03-02',
    units: 'mm',
    filletClearanceMm: 2,
    ...over,
  };
}

/** A rectangle `w` x `h` mm centred on the centreline, bottom at z0, as a closed outer cut, with optional lines. */
export function rectangleDrawing(w: number, h: number, opts: { z0?: number; title?: Partial<DrawingTitle>; lines?: boolean } = {}): TemplateDrawing {
  const z0 = opts.z0 ?? 0;
  const paths: DrawingPath[] = [
    { kind: 'polyline', role: 'outer-cut', closed: true, points: [{ y: -w / 2, z: z0 }, { y: w / 2, z: z0 }, { y: w / 2, z: z0 + h }, { y: -w / 2, z: z0 + h }] },
  ];
  if (opts.lines) {
    paths.push({ kind: 'polyline', role: 'centreline', closed: false, points: [{ y: 0, z: z0 }, { y: 0, z: z0 + h }] });
    paths.push({ kind: 'polyline', role: 'level-line', closed: false, points: [{ y: -w / 2, z: z0 + h / 2 }, { y: w / 2, z: z0 + h / 2 }] });
  }
  return { title: titleOf({ partName: `Rectangle ${w} x ${h}`, partKind: 'bulkhead', ...opts.title }), paths, labels: [], bevelMarks: [], centres: [], checkDimension: { from: { y: -w / 2, z: z0 }, to: { y: w / 2, z: z0 }, lengthMm: w } };
}

/** A circle of radius r centred at (cy, cz) as a cut (for arcs in DXF and bounds). */
export function circleDrawing(r: number, cy = 0, cz = 0): TemplateDrawing {
  return { title: titleOf({ partName: `Disc r${r}`, partKind: 'opening plug' }), paths: [{ kind: 'circle', role: 'outer-cut', centre: { y: cy, z: cz }, radiusMm: r }], labels: [], bevelMarks: [], centres: [], checkDimension: null };
}

/** Options of the invented ring frame. */
export interface RingOptions {
  halfBreadthMm?: number;
  depthMm?: number;
  ringWidthMm?: number;
  /** Points per side of the bilge curve. */
  pointsPerSide?: number;
  title?: Partial<DrawingTitle>;
  /** Shift along y (to make distinct parts). */
  shiftY?: number;
}

/** Keel flat half-width and limbers on it (mm): analytic, so the limber arcs are exact semicircles. */
export const KEEL_FLAT_HALF_MM = 60;
export const LIMBER_RADIUS_MM = 15;
export const LIMBER_CENTRE_Y_MM = 35;

/**
 * The outer edge of an invented round-bilge section, counter-clockwise from the keel: a superellipse bilge
 * each side (|y'/B'|^2.5 + |(D - z)/D|^2.5 = 1 past a flat keel), a parabolic deck camber rising 40 mm,
 * and two limbers cut into the keel flat as semicircles (bulge -1, into the part).
 */
export function ringOuter(o: RingOptions = {}): { points: SectionPoint[]; bulges: number[] } {
  const B = o.halfBreadthMm ?? 900;
  const D = o.depthMm ?? 800;
  const n = o.pointsPerSide ?? 150;
  const p = 2.5;
  const side = (sign: 1 | -1): SectionPoint[] => {
    const pts: SectionPoint[] = [];
    for (let i = 1; i <= n; i++) {
      const t = (i / n) * (Math.PI / 2);
      const y = KEEL_FLAT_HALF_MM + (B - KEEL_FLAT_HALF_MM) * Math.pow(Math.sin(t), 2 / p);
      const z = D - D * Math.pow(Math.cos(t), 2 / p);
      pts.push({ y: sign * y, z });
    }
    return pts;
  };
  const starboard = side(1);
  const port = side(-1).reverse();
  const deck: SectionPoint[] = [];
  const m = 40;
  for (let i = 1; i < m; i++) {
    const y = B - (2 * B * i) / m;
    deck.push({ y, z: D + 40 * (1 - (y / B) ** 2) });
  }
  const c = LIMBER_CENTRE_Y_MM;
  const r = LIMBER_RADIUS_MM;
  const keel: SectionPoint[] = [{ y: -KEEL_FLAT_HALF_MM, z: 0 }, { y: -c - r, z: 0 }, { y: -c + r, z: 0 }, { y: c - r, z: 0 }, { y: c + r, z: 0 }];
  // Keel flat first (left to right), then up the starboard side, across the deck, down the port side.
  const points = [...keel, ...starboard, ...deck, ...port.slice(0, -1)];
  const bulges = points.map(() => 0);
  bulges[1] = -1;
  bulges[3] = -1;
  const shift = o.shiftY ?? 0;
  return { points: points.map((q) => ({ y: q.y + shift, z: q.z })), bulges };
}

/** Points along a closed polyline every `step` mm of length, with the inward (left, for counter-clockwise) normal. */
function alongLoop(points: SectionPoint[], step: number): { at: SectionPoint; inward: SectionPoint; girth: number }[] {
  const out: { at: SectionPoint; inward: SectionPoint; girth: number }[] = [];
  let acc = 0;
  let next = step;
  for (let i = 0; i < points.length; i++) {
    const a = points[i]!;
    const b = points[(i + 1) % points.length]!;
    const len = Math.hypot(b.y - a.y, b.z - a.z);
    while (len > 0 && next <= acc + len) {
      const dy = (b.y - a.y) / len;
      const dz = (b.z - a.z) / len;
      out.push({ at: { y: a.y + dy * (next - acc), z: a.z + dz * (next - acc) }, inward: { y: -dz, z: dy }, girth: next });
      next += step;
    }
    acc += len;
  }
  return out;
}

/**
 * The invented ring frame (about 300 points on its outer edge with the default options): outer cut with
 * two limbers, inner cut 70 mm inside (clipper-lib offset), the other face dashed, centreline, level
 * line, design waterline, set-up line, grain arrow, labels, bevel marks every 50 mm of girth up both
 * sides, limber centres and a check dimension across the sheer.
 */
export function ringFrameDrawing(o: RingOptions = {}): TemplateDrawing {
  const B = o.halfBreadthMm ?? 900;
  const D = o.depthMm ?? 800;
  const ring = o.ringWidthMm ?? 70;
  const shift = o.shiftY ?? 0;
  const outer = ringOuter(o);
  // The inner edge from the outer edge without the limbers (they are small notches, not the ring's shape).
  const plain = ringOuter({ ...o, shiftY: 0 }).points;
  const inner = polygonOffset(plain, -ring, 0.05)[0]!.outer.map((q) => ({ y: q.y + shift, z: q.z }));
  const otherFace = ringOuter({ ...o, halfBreadthMm: B - 8, shiftY: shift }).points;
  const S = (y: number): number => y + shift;
  const paths: DrawingPath[] = [
    { kind: 'polyline', role: 'outer-cut', closed: true, points: outer.points, bulges: outer.bulges },
    { kind: 'polyline', role: 'inner-cut', closed: true, points: inner },
    { kind: 'polyline', role: 'other-face', closed: true, points: otherFace },
    { kind: 'polyline', role: 'centreline', closed: false, points: [{ y: S(0), z: -30 }, { y: S(0), z: D + 80 }] },
    { kind: 'polyline', role: 'level-line', closed: false, points: [{ y: S(-B - 30), z: 600 }, { y: S(B + 30), z: 600 }] },
    { kind: 'polyline', role: 'waterline', closed: false, points: [{ y: S(-B - 30), z: 350 }, { y: S(B + 30), z: 350 }] },
    { kind: 'polyline', role: 'set-up-line', closed: false, points: [{ y: S(-B - 30), z: D + 60 }, { y: S(B + 30), z: D + 60 }] },
    { kind: 'polyline', role: 'grain', closed: false, points: [{ y: S(-250), z: D - 25 }, { y: S(250), z: D - 25 }] },
  ];
  // Bevel marks every 50 mm of girth along the bilge, both sides (the keel flat and the deck have none).
  const marks: DrawingBevelMark[] = [];
  let no = 1;
  const perimeter = outer.points.reduce((acc, a, i) => {
    const b = outer.points[(i + 1) % outer.points.length]!;
    return acc + Math.hypot(b.y - a.y, b.z - a.z);
  }, 0);
  for (const q of alongLoop(outer.points, 50)) {
    if (Math.abs(q.at.z) < 1 || q.at.z > D - 1) continue;
    const y = q.at.y - shift;
    const frac = q.at.z / D;
    const tilt = Number((3 + 44 * frac * frac).toFixed(1));
    marks.push({
      markNo: no++,
      at: q.at,
      inward: q.inward,
      // The loop starts at the port end of the keel flat, KEEL_FLAT_HALF_MM from the centreline.
      girthMm: y > 0 ? q.girth - KEEL_FLAT_HALF_MM : perimeter - q.girth + KEEL_FLAT_HALF_MM,
      side: y > 0 ? 'starboard' : 'port',
      sawTiltDeg: tilt,
      slidingBevelDeg: Number((90 - tilt).toFixed(1)),
      kind: 'under',
      tiltDirection: frac < 0.5 ? 'toward-centreline' : 'away-from-centreline',
      largerFace: 'aft',
      overSawLimit: tilt > 45,
    });
  }
  return {
    title: titleOf(o.title),
    paths,
    labels: [
      { anchor: { y: S(0), z: 430 }, text: 'STATION 4', heightMm: 12, rotationDeg: 0, align: 'centre', purpose: 'station' },
      { anchor: { y: S(0), z: 405 }, text: 'AFT FACE (marked)', heightMm: 6, rotationDeg: 0, align: 'centre', purpose: 'face' },
      { anchor: { y: S(0), z: 385 }, text: '2 mm fillet clearance taken off the edge', heightMm: 3, rotationDeg: 0, align: 'centre', purpose: 'fillet' },
      { anchor: { y: S(-B + 110), z: 354 }, text: 'DWL', heightMm: 3, rotationDeg: 0, align: 'start', purpose: 'line' },
      { anchor: { y: S(-B + 110), z: 604 }, text: 'LEVEL LINE 600', heightMm: 3, rotationDeg: 0, align: 'start', purpose: 'line' },
      { anchor: { y: S(-B + 110), z: D + 64 }, text: 'SET-UP LINE', heightMm: 3, rotationDeg: 0, align: 'start', purpose: 'line' },
      { anchor: { y: S(4), z: 150 }, text: 'CL', heightMm: 3, rotationDeg: 90, align: 'start', purpose: 'line' },
      { anchor: { y: S(0), z: D - 15 }, text: 'GRAIN', heightMm: 3, rotationDeg: 0, align: 'centre', purpose: 'note' },
    ],
    bevelMarks: marks,
    centres: [
      { kind: 'limber', at: { y: S(-LIMBER_CENTRE_Y_MM), z: 0 }, label: `r ${LIMBER_RADIUS_MM}` },
      { kind: 'limber', at: { y: S(LIMBER_CENTRE_Y_MM), z: 0 }, label: `r ${LIMBER_RADIUS_MM}` },
    ],
    checkDimension: { from: { y: S(-B), z: D }, to: { y: S(B), z: D }, lengthMm: 2 * B },
  };
}

/**
 * A synthetic part of about `segments` segments for the benchmark: the invented ring frame of a size that
 * varies with `index`, its outer edge, inner edge and other face each about a third of the segments.
 */
export function syntheticDrawing(index: number, segments = 2000): TemplateDrawing {
  return ringFrameDrawing({ pointsPerSide: Math.round(segments / 6), halfBreadthMm: 700 + (index % 7) * 60, depthMm: 700 + (index % 5) * 40, title: { partName: `Frame ${index + 1}`, stationName: String(index + 1) } });
}

/** Segments in a drawing's polylines (the benchmark's measure of size). */
export function drawingSegments(d: TemplateDrawing): number {
  return d.paths.reduce((s, p) => s + (p.kind === 'polyline' ? (p.closed ? p.points.length : p.points.length - 1) : 1), 0);
}

/**
 * Cut-list pieces: ring frames of a few sizes (the outline from the invented ring frame, one piece per
 * layer), and rectangular bulkhead pieces in a second ply thickness. Mass from okoume at 450 kg/m^3
 * (REFERENCES.md, Plywood: common practice).
 */
export function cutListPiecesFixture(): import('../../shared/geometry/drawing').CutListPiece[] {
  const out: import('../../shared/geometry/drawing').CutListPiece[] = [];
  for (let f = 0; f < 5; f++) {
    const d = ringFrameDrawing({ halfBreadthMm: 420 + f * 70, depthMm: 500 + f * 30, pointsPerSide: 40 });
    const outer = d.paths[0]!;
    const inner = d.paths[1]!;
    if (outer.kind !== 'polyline' || inner.kind !== 'polyline') throw new Error('fixture');
    const ys = outer.points.map((p) => p.y);
    const zs = outer.points.map((p) => p.z);
    const w = Math.max(...ys) - Math.min(...ys);
    const h = Math.max(...zs) - Math.min(...zs);
    for (let layer = 1; layer <= 2; layer++) {
      const area = w * h * 0.3;
      out.push({ partName: `Frame ${f + 2}`, partKind: 'ring frame', layerIndex: layer, pieceNo: 1, plyThicknessMm: 9, widthMm: w, heightMm: h, areaMm2: area, massKg: (area / 1e6) * 0.009 * 450, grain: null, outline: { outer: outer.points, holes: [inner.points] } });
    }
  }
  for (let b = 0; b < 4; b++) {
    const w = 600 + b * 90;
    const h = 400 + b * 50;
    out.push({ partName: `Bulkhead ${b + 1}`, partKind: 'bulkhead', layerIndex: 1, pieceNo: 1, plyThicknessMm: 12, widthMm: w, heightMm: h, areaMm2: w * h, massKg: ((w * h) / 1e6) * 0.012 * 450, grain: b % 2 ? 'z' : null });
  }
  return out;
}
