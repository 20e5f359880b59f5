import {
  type DrawingPath,
  type DrawingPathRole,
  type TemplateDrawing,
  arcSweep,
  degreesLabel,
  drawingAsSeen,
  drawingBounds,
  drawingIssues,
  drawingPathBounds,
  lengthLabel,
} from '../../shared/geometry/drawing';
import type { Bounds } from '../../shared/geometry/polygon';
import { GeometryInputError, type SectionPoint } from '../../shared/geometry/types';

/**
 * DXF of one or more template drawings, for a CNC router or a laser: each drawing as seen looking at its
 * marked face, laid side by side without overlap when there are several. Written as text here, not by
 * makerjs: makerjs 0.19.2 `exporter.toDXF` writes a chained loop as an old-style POLYLINE/VERTEX/SEQEND
 * (with `usePOLYLINE`) or as loose LINEs (without), never an LWPOLYLINE; it writes no $ACADVER, no
 * handles or subclass markers (which an LWPOLYLINE needs: ezdxf refuses one without its AcDbPolyline
 * marker), and a LAYER table only for layers given a colour; its chain finder may also start a loop at
 * another vertex or join loops that touch. So the file is written here as a plain DXF R2000 (AC1015),
 * with only LWPOLYLINE, LINE, CIRCLE, ARC and TEXT entities, each with its handle and owner.
 *
 * Layers: OUTER_CUT and INNER_CUT (one closed LWPOLYLINE or CIRCLE per cut loop, nothing else),
 * OTHER_FACE (the other face's outline), MARKS (reference lines, grain, notches, marks, bevel ticks,
 * centre crosses, the check dimension), TEXT (every word). `$INSUNITS` 4 (mm) or 1 (in) per the Autodesk
 * DXF Reference, HEADER section; an inch file is written in inches (1 in = 25.4 mm exactly, NIST SP 811).
 */

export type DxfUnits = 'mm' | 'in';

/** The DXF layer names. */
export const DXF_LAYERS = { outerCut: 'OUTER_CUT', innerCut: 'INNER_CUT', otherFace: 'OTHER_FACE', marks: 'MARKS', text: 'TEXT' } as const;

/** Options of `dxfOfDrawings`. */
export interface DxfOptions {
  units: DxfUnits;
  /** Clear space (mm) between drawings laid side by side. */
  gapMm?: number;
}

/** Default clear space (mm) between parts laid side by side (our choice). */
export const DXF_DEFAULT_GAP_MM = 50;
/** Two vertices closer than this (mm) are one: no zero-length segment is written. */
const SAME_POINT_MM = 1e-6;
/** Capital height (mm) of the words the writer adds (bevel readings, title). */
const DXF_TEXT_MM = 4;
const DXF_TITLE_MM = 6;

const layerOf = (role: DrawingPathRole): string =>
  role === 'outer-cut' ? DXF_LAYERS.outerCut : role === 'inner-cut' ? DXF_LAYERS.innerCut : role === 'other-face' ? DXF_LAYERS.otherFace : DXF_LAYERS.marks;

/** Where each drawing went: its shift (mm, added to the as-seen coordinates) and its footprint. */
export interface DxfPlacement {
  partName: string;
  layerIndex: number;
  shiftY: number;
  shiftZ: number;
  /** Footprint (mm, in the file's frame before any inch scaling): lines, words and title. */
  footprint: Bounds;
}

/** The DXF text and where each drawing was put. */
export interface DxfResult {
  text: string;
  placements: DxfPlacement[];
}

/**
 * A DXF file of the drawings (one part's layer, one part's layers, or every part of a hull), as a Buffer
 * (ASCII). Drawings are laid left to right in the order given, bottoms level, `gapMm` apart.
 * @throws GeometryInputError when a drawing has issues (`drawingIssues`) or no lines.
 */
export function dxfOfDrawings(drawings: readonly TemplateDrawing[], options: DxfOptions): Buffer {
  return Buffer.from(dxfWrite(drawings, options).text, 'latin1');
}

/** As `dxfOfDrawings`, with the placements (for tests and for a caller that labels the parts). */
export function dxfWrite(drawings: readonly TemplateDrawing[], options: DxfOptions): DxfResult {
  const issues = drawings.flatMap(drawingIssues);
  if (issues.length) throw new GeometryInputError(issues);
  const k = options.units === 'in' ? 1 / 25.4 : 1;
  const gap = options.gapMm ?? DXF_DEFAULT_GAP_MM;
  const w = new DxfEntities(k);
  const placements: DxfPlacement[] = [];
  let cursor = 0;
  for (const drawing of drawings) {
    const seen = drawingAsSeen(drawing);
    const b = drawingBounds(seen);
    if (!b) throw new GeometryInputError([{ code: 'drawing-empty', message: `${drawing.title.partName}: the drawing has no lines to write`, field: 'paths' }]);
    const title = titleText(seen);
    const titleW = Math.max(...title.map((t) => approxTextWidth(t, DXF_TITLE_MM)));
    const shiftY = cursor - b.minY;
    const shiftZ = -b.minZ;
    const footprint: Bounds = { minY: cursor, maxY: cursor + Math.max(b.maxY - b.minY, titleW), minZ: -DXF_TITLE_MM * 2 * title.length - 10, maxZ: b.maxZ - b.minZ };
    writeDrawing(w, seen, shiftY, shiftZ, title);
    placements.push({ partName: drawing.title.partName, layerIndex: drawing.title.layerIndex, shiftY, shiftZ, footprint });
    cursor = footprint.maxY + gap;
  }
  return { text: dxfDocument(w, options.units), placements };
}

/** Width (mm) a line of DXF text takes at most: readers' fonts differ, so a generous 0.9 of the height per character. */
const approxTextWidth = (text: string, heightMm: number): number => text.length * heightMm * 0.9;

function titleText(d: TemplateDrawing): string[] {
  const t = d.title;
  return [
    `${t.hullName}: ${t.partName} (${t.partKind}), station ${t.stationName}`,
    `layer ${t.layerIndex} of ${t.layerCount}, ${t.plyThicknessMm} mm ply, ${t.face} face up (seen looking at it)`,
    `revision ${t.revisionId}, ${t.date}; units ${t.units}`,
  ];
}

function writeDrawing(w: DxfEntities, d: TemplateDrawing, sy: number, sz: number, title: string[]): void {
  const at = (p: SectionPoint): SectionPoint => ({ y: p.y + sy, z: p.z + sz });
  for (const p of d.paths) w.path(p, layerOf(p.role), at);
  for (const p of d.paths) if (p.role === 'grain' && p.kind === 'polyline' && p.points.length >= 2) grainHeads(w, at(p.points[0]!), at(p.points[p.points.length - 1]!));
  for (const m of d.bevelMarks) {
    const a = at(m.at);
    const tick = 8;
    const b = { y: a.y + m.inward.y * tick, z: a.z + m.inward.z * tick };
    w.line(a, b, DXF_LAYERS.marks);
    const reading = m.kind === 'square' ? `${m.markNo} square` : `${m.markNo} ${degreesLabel(m.sawTiltDeg)} ${m.kind}${m.overSawLimit ? ' PAST SAW LIMIT' : ''}`;
    let rot = (Math.atan2(m.inward.z, m.inward.y) * 180) / Math.PI;
    const readable = m.inward.y >= -1e-9;
    if (!readable) rot += 180;
    const start = { y: a.y + m.inward.y * (tick + 2), z: a.z + m.inward.z * (tick + 2) };
    w.text(reading, start, DXF_TEXT_MM, rot, readable ? 'start' : 'end');
  }
  for (const c of d.centres) {
    const p = at(c.at);
    w.line({ y: p.y - 3, z: p.z }, { y: p.y + 3, z: p.z }, DXF_LAYERS.marks);
    w.line({ y: p.y, z: p.z - 3 }, { y: p.y, z: p.z + 3 }, DXF_LAYERS.marks);
    w.text(`${c.kind} ${c.label}`, { y: p.y + 4, z: p.z + 1 }, DXF_TEXT_MM * 0.6, 0, 'start');
  }
  const cd = d.checkDimension;
  if (cd) {
    const a = at(cd.from);
    const b = at(cd.to);
    w.line(a, b, DXF_LAYERS.marks);
    let rot = (Math.atan2(b.z - a.z, b.y - a.y) * 180) / Math.PI;
    if (rot > 90) rot -= 180;
    if (rot < -90) rot += 180;
    const mid = { y: (a.y + b.y) / 2, z: (a.z + b.z) / 2 + 2 };
    w.text(`CHECK ${lengthLabel(cd.lengthMm, d.title.units)}`, mid, DXF_TEXT_MM, rot, 'centre');
  }
  for (const l of d.labels) w.text(l.text, at(l.anchor), l.heightMm, l.rotationDeg, l.align);
  title.forEach((line, i) => w.text(line, { y: sy + drawingLeft(d), z: -10 - i * DXF_TITLE_MM * 1.8 }, DXF_TITLE_MM, 0, 'start'));
}

const drawingLeft = (d: TemplateDrawing): number => drawingBounds(d)!.minY;

function grainHeads(w: DxfEntities, a: SectionPoint, b: SectionPoint): void {
  const len = Math.hypot(b.y - a.y, b.z - a.z);
  if (len === 0) return;
  const u = { y: (b.y - a.y) / len, z: (b.z - a.z) / len };
  for (const [tip, dir] of [[b, u], [a, { y: -u.y, z: -u.z }]] as const) {
    for (const s of [1, -1]) w.line(tip, { y: tip.y - dir.y * 8 - dir.z * 3 * s, z: tip.z - dir.z * 8 + dir.y * 3 * s }, DXF_LAYERS.marks);
  }
}

/**
 * Text as an R2000 file carries it: the file stays ASCII, and a character past ASCII is written as the DXF's
 * own escape, a backslash, "U+" and its code point in four hex digits, so "Wręga 3" reaches a CAD program as
 * typed rather than as "Wr?ga 3". '°' is written as ' deg', which the simplest router programs (that show an
 * escape as it is) read too. A character past four hex digits (an emoji), a lone surrogate and control characters
 * become "?".
 */
export function dxfText(text: string): string {
  let out = '';
  for (const ch of text.replace(/°/g, ' deg')) {
    const code = ch.codePointAt(0)!;
    if (code >= 0x20 && code <= 0x7e) out += ch;
    else if (code >= 0xa0 && code <= 0xffff && !(code >= 0xd800 && code <= 0xdfff)) out += `\\U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
    else out += '?';
  }
  return out;
}

/** A number as written: up to 8 decimals, no trailing zeros, never "-0". */
function num(v: number): string {
  const s = (Math.round(v * 1e8) / 1e8).toFixed(8).replace(/\.?0+$/, '');
  return s === '-0' ? '0' : s;
}

/** The ENTITIES section being written; entity handles count up from 0x100, above the fixed ones of the tables. */
class DxfEntities {
  readonly lines: string[] = [];
  handle = 0x100;
  readonly ext: Bounds = { minY: Infinity, minZ: Infinity, maxY: -Infinity, maxZ: -Infinity };
  constructor(private readonly k: number) {}

  private grow(p: SectionPoint, r = 0): void {
    this.ext.minY = Math.min(this.ext.minY, p.y - r);
    this.ext.maxY = Math.max(this.ext.maxY, p.y + r);
    this.ext.minZ = Math.min(this.ext.minZ, p.z - r);
    this.ext.maxZ = Math.max(this.ext.maxZ, p.z + r);
  }

  private head(type: string, layer: string, subclass: string): void {
    this.lines.push('0', type, '5', (this.handle++).toString(16).toUpperCase(), '330', MODEL_SPACE_RECORD, '100', 'AcDbEntity', '8', layer, '100', subclass);
  }

  private xy(p: SectionPoint, code = 10): void {
    this.lines.push(String(code), num(p.y * this.k), String(code + 10), num(p.z * this.k));
  }

  line(a: SectionPoint, b: SectionPoint, layer: string): void {
    this.head('LINE', layer, 'AcDbLine');
    this.xy(a, 10);
    this.lines.push('30', '0');
    this.xy(b, 11);
    this.lines.push('31', '0');
    this.grow(a);
    this.grow(b);
  }

  path(p: DrawingPath, layer: string, at: (p: SectionPoint) => SectionPoint): void {
    if (p.kind === 'circle') {
      const c = at(p.centre);
      this.head('CIRCLE', layer, 'AcDbCircle');
      this.xy(c);
      this.lines.push('30', '0', '40', num(p.radiusMm * this.k));
      this.grow(c, p.radiusMm);
      return;
    }
    if (p.kind === 'arc') {
      const c = at(p.centre);
      this.head('ARC', layer, 'AcDbCircle');
      this.xy(c);
      this.lines.push('30', '0', '40', num(p.radiusMm * this.k), '100', 'AcDbArc', '50', num(p.startDeg), '51', num(p.startDeg + (arcSweep(p.startDeg, p.endDeg) * 180) / Math.PI));
      const b = drawingPathBounds({ ...p, centre: c });
      this.grow({ y: b.minY, z: b.minZ });
      this.grow({ y: b.maxY, z: b.maxZ });
      return;
    }
    // One LWPOLYLINE per path, closed by its flag (no repeated first point), without zero-length segments.
    const n = p.points.length;
    const pts: SectionPoint[] = [];
    const bulges: number[] = [];
    for (let i = 0; i < n; i++) {
      const q = at(p.points[i]!);
      const last = pts[pts.length - 1];
      if (last && Math.hypot(q.y - last.y, q.z - last.z) <= SAME_POINT_MM) {
        // A repeated point: the bulge of the segment leaving it now leaves the kept one.
        bulges[bulges.length - 1] = p.bulges?.[i] ?? 0;
        continue;
      }
      pts.push(q);
      bulges.push(p.bulges?.[i] ?? 0);
    }
    if (p.closed && pts.length > 1 && Math.hypot(pts[0]!.y - pts[pts.length - 1]!.y, pts[0]!.z - pts[pts.length - 1]!.z) <= SAME_POINT_MM) {
      pts.pop();
      bulges.pop();
    }
    if (pts.length === 2 && !p.closed && bulges[0] === 0) {
      this.line(pts[0]!, pts[1]!, layer);
      return;
    }
    this.head('LWPOLYLINE', layer, 'AcDbPolyline');
    this.lines.push('90', String(pts.length), '70', p.closed ? '1' : '0', '43', '0');
    pts.forEach((q, i) => {
      this.xy(q);
      if (bulges[i]) this.lines.push('42', num(bulges[i]!));
      this.grow(q);
    });
    // A bulged segment may reach past its end points: grow by the arc's exact box.
    const path: DrawingPath = { kind: 'polyline', role: p.role, closed: p.closed, points: pts, bulges };
    const b = drawingBounds({ paths: [path] });
    if (b) {
      this.grow({ y: b.minY, z: b.minZ });
      this.grow({ y: b.maxY, z: b.maxZ });
    }
  }

  text(text: string, at: SectionPoint, heightMm: number, rotationDeg: number, align: 'start' | 'centre' | 'end'): void {
    const s = dxfText(text);
    if (!s.trim()) return;
    this.head('TEXT', DXF_LAYERS.text, 'AcDbText');
    this.xy(at);
    this.lines.push('30', '0', '40', num(heightMm * this.k), '1', s, '50', num(((rotationDeg % 360) + 360) % 360), '7', 'STANDARD');
    const h = align === 'centre' ? 1 : align === 'end' ? 2 : 0;
    if (h !== 0) {
      this.lines.push('72', String(h));
      this.xy(at, 11);
      this.lines.push('31', '0');
    }
    this.lines.push('100', 'AcDbText');
    this.grow(at);
  }
}

// Fixed handles of the tables and blocks; entities start at 0x100.
const MODEL_SPACE_RECORD = '1F';
const PAPER_SPACE_RECORD = '1B';

/** The whole file round the entities: header, tables, blocks, objects (a plain DXF R2000 skeleton). */
function dxfDocument(w: DxfEntities, units: DxfUnits): string {
  const k = units === 'in' ? 1 / 25.4 : 1;
  const e = Number.isFinite(w.ext.minY) ? w.ext : { minY: 0, minZ: 0, maxY: 0, maxZ: 0 };
  const out: string[] = [];
  const add = (...v: string[]): void => {
    out.push(...v);
  };
  add('0', 'SECTION', '2', 'HEADER');
  add('9', '$ACADVER', '1', 'AC1015');
  add('9', '$DWGCODEPAGE', '3', 'ANSI_1252');
  add('9', '$HANDSEED', '5', w.handle.toString(16).toUpperCase());
  // Autodesk DXF Reference, HEADER: $INSUNITS 4 = millimetres, 1 = inches; $MEASUREMENT 1 metric, 0 imperial.
  add('9', '$INSUNITS', '70', units === 'in' ? '1' : '4');
  add('9', '$MEASUREMENT', '70', units === 'in' ? '0' : '1');
  add('9', '$LUNITS', '70', '2');
  add('9', '$EXTMIN', '10', num(e.minY * k), '20', num(e.minZ * k), '30', '0');
  add('9', '$EXTMAX', '10', num(e.maxY * k), '20', num(e.maxZ * k), '30', '0');
  add('0', 'ENDSEC');
  add('0', 'SECTION', '2', 'CLASSES', '0', 'ENDSEC');
  add('0', 'SECTION', '2', 'TABLES');
  const table = (name: string, handle: string, count: number, entries: () => void, subclass?: string): void => {
    add('0', 'TABLE', '2', name, '5', handle, '330', '0', '100', 'AcDbSymbolTable', '70', String(count));
    if (subclass) add('100', subclass);
    entries();
    add('0', 'ENDTAB');
  };
  const record = (type: string, handle: string, owner: string, subclass: string, name: string, ...rest: string[]): void => {
    add('0', type, '5', handle, '330', owner, '100', 'AcDbSymbolTableRecord', '100', subclass, '2', name, '70', '0', ...rest);
  };
  table('VPORT', '8', 1, () => record('VPORT', '29', '8', 'AcDbViewportTableRecord', '*ACTIVE', '10', '0', '20', '0', '11', '1', '21', '1', '12', num(((e.minY + e.maxY) / 2) * k), '22', num(((e.minZ + e.maxZ) / 2) * k), '40', num(Math.max(1, (e.maxZ - e.minZ) * k * 1.1)), '41', '1.5'));
  table('LTYPE', '5', 4, () => {
    record('LTYPE', '14', '5', 'AcDbLinetypeTableRecord', 'ByBlock', '3', '', '72', '65', '73', '0', '40', '0');
    record('LTYPE', '15', '5', 'AcDbLinetypeTableRecord', 'ByLayer', '3', '', '72', '65', '73', '0', '40', '0');
    record('LTYPE', '16', '5', 'AcDbLinetypeTableRecord', 'Continuous', '3', 'Solid line', '72', '65', '73', '0', '40', '0');
    const dash = 5 * k;
    const gap = 2.5 * k;
    record('LTYPE', '17', '5', 'AcDbLinetypeTableRecord', 'DASHED', '3', 'Dashed __ __ __', '72', '65', '73', '2', '40', num(dash + gap), '49', num(dash), '74', '0', '49', num(-gap), '74', '0');
  });
  const layers: [string, string, string, string][] = [
    ['0', '10', '7', 'Continuous'],
    [DXF_LAYERS.outerCut, '20', '7', 'Continuous'],
    [DXF_LAYERS.innerCut, '21', '4', 'Continuous'],
    [DXF_LAYERS.otherFace, '22', '8', 'DASHED'],
    [DXF_LAYERS.marks, '23', '3', 'Continuous'],
    [DXF_LAYERS.text, '24', '5', 'Continuous'],
  ];
  table('LAYER', '2', layers.length, () => {
    for (const [name, handle, color, lt] of layers) add('0', 'LAYER', '5', handle, '330', '2', '100', 'AcDbSymbolTableRecord', '100', 'AcDbLayerTableRecord', '2', name, '70', '0', '62', color, '6', lt, '370', '-3', '390', '0');
  });
  table('STYLE', '3', 1, () => record('STYLE', '11', '3', 'AcDbTextStyleTableRecord', 'STANDARD', '40', '0', '41', '1', '50', '0', '71', '0', '42', '2.5', '3', 'txt', '4', ''));
  table('VIEW', '6', 0, () => undefined);
  table('UCS', '7', 0, () => undefined);
  table('APPID', '9', 1, () => record('APPID', '12', '9', 'AcDbRegAppTableRecord', 'ACAD'));
  table('DIMSTYLE', 'A', 1, () => add('0', 'DIMSTYLE', '105', '27', '330', 'A', '100', 'AcDbSymbolTableRecord', '100', 'AcDbDimStyleTableRecord', '2', 'STANDARD', '70', '0'), 'AcDbDimStyleTable');
  table('BLOCK_RECORD', '1', 2, () => {
    record('BLOCK_RECORD', MODEL_SPACE_RECORD, '1', 'AcDbBlockTableRecord', '*Model_Space');
    record('BLOCK_RECORD', PAPER_SPACE_RECORD, '1', 'AcDbBlockTableRecord', '*Paper_Space');
  });
  add('0', 'ENDSEC');
  add('0', 'SECTION', '2', 'BLOCKS');
  for (const [name, rec, b, eb] of [['*Model_Space', MODEL_SPACE_RECORD, '2A', '2B'], ['*Paper_Space', PAPER_SPACE_RECORD, '1C', '1D']] as const) {
    add('0', 'BLOCK', '5', b, '330', rec, '100', 'AcDbEntity', '8', '0', '100', 'AcDbBlockBegin', '2', name, '70', '0', '10', '0', '20', '0', '30', '0', '3', name, '1', '');
    add('0', 'ENDBLK', '5', eb, '330', rec, '100', 'AcDbEntity', '8', '0', '100', 'AcDbBlockEnd');
  }
  add('0', 'ENDSEC');
  add('0', 'SECTION', '2', 'ENTITIES');
  // The entities are joined apart: a hull's worth is too many lines to push onto another array at once.
  const head = out.join('\r\n');
  out.length = 0;
  add('0', 'ENDSEC');
  add('0', 'SECTION', '2', 'OBJECTS');
  add('0', 'DICTIONARY', '5', 'C', '330', '0', '100', 'AcDbDictionary', '281', '1', '3', 'ACAD_GROUP', '350', 'D');
  add('0', 'DICTIONARY', '5', 'D', '330', 'C', '100', 'AcDbDictionary', '281', '1');
  add('0', 'ENDSEC');
  add('0', 'EOF');
  return `${head}\r\n${w.lines.length ? `${w.lines.join('\r\n')}\r\n` : ''}${out.join('\r\n')}\r\n`;
}
