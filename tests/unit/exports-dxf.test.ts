import { describe, expect, it } from 'vitest';
import DxfParser from 'dxf-parser';
import makerjs from 'makerjs';
import { DXF_LAYERS, dxfOfDrawings, dxfText, dxfWrite } from '../../server/exports/dxf';
import { type TemplateDrawing, bulgeArc, drawingAsSeen, drawingBounds } from '../../shared/geometry/drawing';
import type { Bounds } from '../../shared/geometry/polygon';
import { circleDrawing, rectangleDrawing, ringFrameDrawing, titleOf } from './exports-fixtures';

interface Vertex {
  x: number;
  y: number;
  bulge?: number;
}
interface Entity {
  type: string;
  layer: string;
  vertices?: Vertex[];
  shape?: boolean;
  center?: { x: number; y: number };
  radius?: number;
  text?: string;
  startPoint?: { x: number; y: number };
}
interface Parsed {
  header: Record<string, unknown>;
  entities: Entity[];
}

/** The file read back with dxf-parser 1.1.2 (a general-purpose DXF reader from the npm registry). */
const parse = (buf: Buffer): Parsed => new DxfParser().parseSync(buf.toString('latin1')) as unknown as Parsed;

const CUT = [DXF_LAYERS.outerCut, DXF_LAYERS.innerCut] as string[];

/** Extents of entities as read back: polyline vertices and their bulged arcs, circles, lines. */
function extentsOf(entities: Entity[]): Bounds {
  const b: Bounds = { minY: Infinity, minZ: Infinity, maxY: -Infinity, maxZ: -Infinity };
  const grow = (y: number, z: number): void => {
    b.minY = Math.min(b.minY, y);
    b.maxY = Math.max(b.maxY, y);
    b.minZ = Math.min(b.minZ, z);
    b.maxZ = Math.max(b.maxZ, z);
  };
  for (const e of entities) {
    if (e.type === 'TEXT') grow(e.startPoint!.x, e.startPoint!.y);
    if (e.type === 'CIRCLE') {
      grow(e.center!.x - e.radius!, e.center!.y - e.radius!);
      grow(e.center!.x + e.radius!, e.center!.y + e.radius!);
    }
    if (e.type === 'LWPOLYLINE' || e.type === 'LINE') {
      const v = e.vertices!;
      v.forEach((p, i) => {
        grow(p.x, p.y);
        const q = v[(i + 1) % v.length]!;
        if (p.bulge && (i + 1 < v.length || e.shape)) {
          // Sample the bulged arc densely (independent of the writer's exact bounds).
          const arc = bulgeArc({ y: p.x, z: p.y }, { y: q.x, z: q.y }, p.bulge)!;
          for (let k = 0; k <= 2000; k++) {
            const t = arc.startRad + (arc.sweepRad * k) / 2000;
            grow(arc.centre.y + arc.radiusMm * Math.cos(t), arc.centre.z + arc.radiusMm * Math.sin(t));
          }
        }
      });
    }
  }
  return b;
}

const mixed = (): TemplateDrawing[] => [ringFrameDrawing(), circleDrawing(40), rectangleDrawing(300, 200, { lines: true })];

describe('dxfOfDrawings read back with dxf-parser', () => {
  const mmFile = dxfOfDrawings(mixed(), { units: 'mm' });
  const inFile = dxfOfDrawings(mixed(), { units: 'in' });
  const mm = parse(mmFile);
  const inch = parse(inFile);

  it('writes $INSUNITS 4 for millimetres and 1 for inches', () => {
    // Autodesk DXF Reference, HEADER section: $INSUNITS 4 = millimetres, 1 = inches
    expect(mm.header.$INSUNITS).toBe(4);
    expect(inch.header.$INSUNITS).toBe(1);
    expect(mm.header.$ACADVER).toBe('AC1015');
  });

  it('writes one closed entity per cut loop and nothing else on the cut layers', () => {
    const cut = mm.entities.filter((e) => CUT.includes(e.layer));
    // analytic: the ring frame has an outer and an inner loop, the disc one circle, the rectangle one outer loop
    expect(cut).toHaveLength(4);
    for (const e of cut) {
      expect(['LWPOLYLINE', 'CIRCLE']).toContain(e.type);
      if (e.type === 'LWPOLYLINE') expect(e.shape, 'closed flag (group 70 = 1)').toBe(true);
    }
    // Autodesk DXF Reference: TEXT only on TEXT; no SPLINE anywhere; only plain entities
    expect(mm.entities.filter((e) => e.type === 'TEXT' && e.layer !== DXF_LAYERS.text)).toEqual([]);
    expect(new Set(mm.entities.map((e) => e.type))).toEqual(new Set(['LWPOLYLINE', 'LINE', 'CIRCLE', 'TEXT']));
    expect(mmFile.toString('latin1')).not.toMatch(/\r\nSPLINE\r\n/);
  });

  it('closes each profile on its own first point: ends within 0.001 mm, no repeated vertex', () => {
    const d = drawingAsSeen(ringFrameDrawing());
    const placement = dxfWrite(mixed(), { units: 'mm' }).placements[0]!;
    const outer = mm.entities.find((e) => e.layer === DXF_LAYERS.outerCut && e.type === 'LWPOLYLINE')!;
    const src = d.paths[0]! as { points: { y: number; z: number }[]; bulges: number[] };
    expect(outer.vertices).toHaveLength(src.points.length);
    const first = outer.vertices![0]!;
    const last = outer.vertices![outer.vertices!.length - 1]!;
    // analytic: the file's first and last vertices are the drawing's (shifted), the loop closed by its flag
    expect(Math.hypot(first.x - (src.points[0]!.y + placement.shiftY), first.y - (src.points[0]!.z + placement.shiftZ))).toBeLessThan(0.001);
    const lastSrc = src.points[src.points.length - 1]!;
    expect(Math.hypot(last.x - (lastSrc.y + placement.shiftY), last.y - (lastSrc.z + placement.shiftZ))).toBeLessThan(0.001);
    for (const e of mm.entities.filter((x) => x.type === 'LWPOLYLINE')) {
      const v = e.vertices!;
      for (let i = 0; i + 1 < v.length; i++) expect(Math.hypot(v[i + 1]!.x - v[i]!.x, v[i + 1]!.y - v[i]!.y)).toBeGreaterThan(1e-6);
      if (e.shape) expect(Math.hypot(v[0]!.x - v[v.length - 1]!.x, v[0]!.y - v[v.length - 1]!.y)).toBeGreaterThan(1e-6);
    }
    // the limbers come back as bulges of one: semicircles (Autodesk DXF Reference, group 42)
    expect(outer.vertices!.filter((v) => v.bulge !== undefined).map((v) => v.bulge)).toEqual([-1, -1]);
  });

  it('writes no entity twice and no cut segment twice', () => {
    const key = (e: Entity): string => `${e.type}|${e.layer}|${JSON.stringify(e.vertices?.map((v) => [v.x.toFixed(4), v.y.toFixed(4), v.bulge ?? 0]) ?? [e.center, e.radius, e.text])}`;
    const keys = mm.entities.filter((e) => e.type !== 'TEXT').map(key);
    expect(new Set(keys).size).toBe(keys.length);
    const segs = new Set<string>();
    for (const e of mm.entities.filter((x) => CUT.includes(x.layer) && x.type === 'LWPOLYLINE')) {
      const v = e.vertices!;
      for (let i = 0; i < v.length; i++) {
        const a = v[i]!;
        const b = v[(i + 1) % v.length]!;
        const s = [a, b].map((p) => `${p.x.toFixed(4)},${p.y.toFixed(4)}`).sort().join(' ');
        expect(segs.has(s), `segment ${s} written once`).toBe(false);
        segs.add(s);
      }
    }
  });

  it('has each part at the extents of its drawing within 0.01 mm, parts side by side without overlap', () => {
    const { placements } = dxfWrite(mixed(), { units: 'mm' });
    const outers = mm.entities.filter((e) => e.layer === DXF_LAYERS.outerCut);
    mixed().forEach((d, i) => {
      const want = drawingBounds(drawingAsSeen(d), ['outer-cut'])!;
      const got = extentsOf([outers[i]!]);
      const p = placements[i]!;
      // analytic: the outer cut's extents are the drawing's, moved by the placement
      expect(Math.abs(got.minY - (want.minY + p.shiftY))).toBeLessThan(0.01);
      expect(Math.abs(got.maxY - (want.maxY + p.shiftY))).toBeLessThan(0.01);
      expect(Math.abs(got.minZ - (want.minZ + p.shiftZ))).toBeLessThan(0.01);
      expect(Math.abs(got.maxZ - (want.maxZ + p.shiftZ))).toBeLessThan(0.01);
    });
    // analytic: footprints (lines, words, title) do not overlap, nor do the cut outlines
    for (let i = 0; i + 1 < placements.length; i++) expect(placements[i]!.footprint.maxY).toBeLessThan(placements[i + 1]!.footprint.minY);
    const boxes = outers.map((e) => extentsOf([e]));
    for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) expect(boxes[i]!.maxY < boxes[j]!.minY || boxes[j]!.maxY < boxes[i]!.minY).toBe(true);
    // and the header extents are those of every line and text insertion point (Autodesk DXF Reference: $EXTMIN/$EXTMAX)
    const all = extentsOf(mm.entities);
    const min = mm.header.$EXTMIN as { x: number; y: number };
    const max = mm.header.$EXTMAX as { x: number; y: number };
    expect(min.x).toBeCloseTo(all.minY, 2);
    expect(min.y).toBeCloseTo(all.minZ, 2);
    expect(max.x).toBeCloseTo(all.maxY, 2);
    expect(max.y).toBeCloseTo(all.maxZ, 2);
  });

  it('writes the inch file in inches: every coordinate the millimetre one divided by 25.4', () => {
    // NIST SP 811: 1 in = 25.4 mm exactly
    expect(inch.entities).toHaveLength(mm.entities.length);
    mm.entities.forEach((e, i) => {
      const f = inch.entities[i]!;
      expect([f.type, f.layer]).toEqual([e.type, e.layer]);
      (e.vertices ?? []).forEach((v, k) => {
        expect(Math.abs(f.vertices![k]!.x - v.x / 25.4)).toBeLessThan(1e-7);
        expect(Math.abs(f.vertices![k]!.y - v.y / 25.4)).toBeLessThan(1e-7);
        expect(f.vertices![k]!.bulge).toBe(v.bulge);
      });
      if (e.type === 'CIRCLE') expect(Math.abs(f.radius! - e.radius! / 25.4)).toBeLessThan(1e-7);
    });
  });

  it('cuts the forward face as seen from forward: mirrored across the centreline', () => {
    // analytic: a 20 mm hole at y = +100 in a 400 mm square, seen from forward, lies at -100 from the centreline
    const base = rectangleDrawing(400, 400);
    const withHole = (face: 'aft' | 'forward'): TemplateDrawing => ({ ...base, title: { ...base.title, face }, paths: [...base.paths, { kind: 'circle', role: 'inner-cut', centre: { y: 100, z: 200 }, radiusMm: 10 }] });
    for (const [face, y] of [['aft', 100], ['forward', -100]] as const) {
      const r = parse(dxfOfDrawings([withHole(face)], { units: 'mm' }));
      const hole = r.entities.find((e) => e.type === 'CIRCLE')!;
      const sq = extentsOf(r.entities.filter((e) => e.layer === DXF_LAYERS.outerCut));
      expect(hole.center!.x - (sq.minY + sq.maxY) / 2).toBeCloseTo(y, 9);
    }
  });

  it('writes the same loop vertices as makerjs does for the same loop', () => {
    // makerjs 0.19.2 (a general-purpose CAD library) as a second writer: ConnectTheDots + toDXF(usePOLYLINE)
    const d = ringFrameDrawing();
    const loop = (d.paths[1] as { points: { y: number; z: number }[] }).points;
    const model = { models: { loop: Object.assign(new makerjs.models.ConnectTheDots(true, loop.map((p) => [p.y, p.z])), { layer: 'A' }) } };
    const theirs = parse(Buffer.from(makerjs.exporter.toDXF(model, { usePOLYLINE: true, units: makerjs.unitType.Millimeter }), 'latin1'));
    const ours = parse(dxfOfDrawings([{ ...d, paths: [d.paths[1]!] }], { units: 'mm' }));
    const oursLoop = ours.entities.find((e) => e.layer === DXF_LAYERS.innerCut)!;
    const p = dxfWrite([{ ...d, paths: [d.paths[1]!] }], { units: 'mm' }).placements[0]!;
    const theirsLoop = theirs.entities.find((e) => e.type === 'POLYLINE')!;
    const set = (vs: Vertex[], dy: number, dz: number): string[] => vs.map((v) => `${(v.x - dy).toFixed(3)},${(v.y - dz).toFixed(3)}`).sort();
    expect(set(oursLoop.vertices!, p.shiftY, p.shiftZ)).toEqual(set(theirsLoop.vertices!, 0, 0));
    expect(theirs.header.$INSUNITS).toBe(4);
  });

  it('writes names past ASCII as the DXF escape of their code points, the file itself all ASCII', () => {
    const disc = circleDrawing(50);
    const label = (text: string, z: number) => ({ anchor: { y: 0, z }, text, heightMm: 5, rotationDeg: 0, align: 'start' as const, purpose: 'note' as const });
    const d: TemplateDrawing = { ...disc, title: titleOf({ partName: 'Wręga 3', hullName: 'Żuraw' }), labels: [label('Шп 3 — Žebro', 10), label('bevel 5° 😀\u0007', 20)] };
    const file = dxfOfDrawings([d], { units: 'mm' });
    expect([...file].every((b) => b === 10 || b === 13 || (b >= 0x20 && b <= 0x7e))).toBe(true);
    const texts = parse(file).entities.filter((e) => e.type === 'TEXT').map((e) => e.text!);
    // Autodesk DXF Reference (from memory): in a file before R2007 a string carries a character past ASCII as
    // \U+ and four hex digits of its Unicode code point. Unicode: U+0119 is ę, U+017B Ż, U+0428 Ш, U+043F п,
    // U+2014 the em dash, U+017D Ž. Read back with dxf-parser, which hands the string over as written.
    expect(texts).toContain('\\U+0428\\U+043F 3 \\U+2014 \\U+017Debro');
    expect(texts.some((t) => t.includes('Wr\\U+0119ga 3'))).toBe(true);
    expect(texts.some((t) => t.includes('\\U+017Buraw'))).toBe(true);
    // '°' as words; past four hex digits (an emoji) and a control character, a question mark each.
    expect(texts).toContain('bevel 5 deg ??');
    expect(dxfText('\ud800x')).toBe('?x');
  });
});
