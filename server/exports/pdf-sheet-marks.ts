import type { DrawingTitle } from '../../shared/geometry/drawing';
import type { Bounds } from '../../shared/geometry/polygon';
import type { SectionPoint } from '../../shared/geometry/types';
import { type Doc, paragraph, pt, textAt } from './pdf-common';
import { type PreparedDrawing, pageOf, type PageWindow } from './pdf-drawing';

/**
 * What every printed sheet carries besides the drawing: the check square with the sheet's name and title
 * in it, registration marks in the overlaps, the neighbours' names at the edges and the trim border.
 */

/** Side (mm) of the metric check square. */
export const CHECK_SQUARE_MM = 100;
/** Side (mm) of the inch check square: 4 in = 101.6 mm (1 in = 25.4 mm exactly, NIST SP 811). */
export const CHECK_SQUARE_INCH_MM = 4 * 25.4;
/** Colours of the check squares: told apart from the drawing, which is black, and from each other. */
export const CHECK_SQUARE_COLOR = '#1f5fbf';
export const CHECK_SQUARE_INCH_COLOR = '#1e8c3c';
/** Stroke (mm) of the check squares, laid inside the square so that its outside edge is the size. */
export const CHECK_SQUARE_STROKE_MM = 0.5;

/** The words that go with the square. */
export function checkSquareWords(units: DrawingTitle['units']): string {
  const mm = "Measure this square: it must be exactly 100 mm. If not, print at 100 % / actual size, not 'fit to page'.";
  return units === 'in' ? `${mm} The green square must be exactly 4 in. Measure the outside edges.` : `${mm} Measure its outside edges.`;
}

/** Side (mm) of the whole box: the larger square when the hull is in inches. */
export const infoBoxSizeMm = (units: DrawingTitle['units']): number => (units === 'in' ? CHECK_SQUARE_INCH_MM : CHECK_SQUARE_MM);

/** What the box says about the sheet. */
export interface SheetInfo {
  name: string;
  /** "sheet 5 of 12" */
  sequence: string;
  title: DrawingTitle;
}

/** A square stroked inside its edges so that its outside measures `sideMm`. */
function squareInside(doc: Doc, x: number, y: number, sideMm: number, color: string): void {
  const h = CHECK_SQUARE_STROKE_MM / 2;
  doc.lineWidth(pt(CHECK_SQUARE_STROKE_MM)).strokeColor(color).undash().lineJoin('miter');
  doc.rect(pt(x + h), pt(y + h), pt(sideMm - CHECK_SQUARE_STROKE_MM), pt(sideMm - CHECK_SQUARE_STROKE_MM)).stroke();
}

/** The one-line title of a drawing, as it goes on every sheet. */
export function titleLines(t: DrawingTitle): string[] {
  return [
    t.hullName,
    `${t.partName} (${t.partKind}), station ${t.stationName}`,
    `Layer ${t.layerIndex} of ${t.layerCount}, ${t.plyThicknessMm} mm ply`,
    `Pattern for the ${t.face.toUpperCase()} face (mark this face)`,
    `Revision ${t.revisionId}, ${t.date}`,
  ];
}

/**
 * The check square (100 mm; also 4 in for an inch hull, the two sharing their lower left corner) with the
 * sheet's name, title and the words to check it, top-left corner at (x, y) page mm.
 */
export function drawInfoBox(doc: Doc, x: number, y: number, info: SheetInfo, words: 'top' | 'bottom' = 'top'): void {
  const units = info.title.units;
  const side = infoBoxSizeMm(units);
  // Both squares share the lower left corner, so that each is measured from the same two edges.
  if (units === 'in') squareInside(doc, x, y, CHECK_SQUARE_INCH_MM, CHECK_SQUARE_INCH_COLOR);
  const top = y + side - CHECK_SQUARE_MM;
  squareInside(doc, x, top, CHECK_SQUARE_MM, CHECK_SQUARE_COLOR);
  textAt(doc, '100 mm', x + CHECK_SQUARE_MM / 2, words === 'top' ? y + side - 2.2 : top + 4, { capMm: 1.8, align: 'centre', color: CHECK_SQUARE_COLOR, bold: true });
  if (units === 'in') textAt(doc, '4 in', x + CHECK_SQUARE_INCH_MM - 1.6, words === 'top' ? y + side - 2.2 : y + 3.2, { capMm: 1.8, align: 'end', color: CHECK_SQUARE_INCH_COLOR, bold: true });
  // The words fill one half of the square (about 46 mm), the other half is left open.
  const ix = x + 4;
  let iy = words === 'top' ? top + 4 : top + CHECK_SQUARE_MM - 48;
  textAt(doc, info.name, ix, iy + 8, { capMm: 8, bold: true });
  textAt(doc, info.sequence, x + CHECK_SQUARE_MM - 4, iy + 3, { capMm: 2.2, align: 'end' });
  iy += 12.5;
  titleLines(info.title).forEach((line, i) => {
    textAt(doc, line, ix, iy + i * 3.6, { capMm: 2, bold: i === 3 });
  });
  iy += 5 * 3.6 - 1;
  paragraph(doc, checkSquareWords(units), ix, iy, CHECK_SQUARE_MM - 8, { capMm: 2, bold: true });
}

/** Where the info box goes: its top-left corner (drawing mm) and which half of it holds the words. */
export interface InfoBoxSpot extends SectionPoint {
  words: 'top' | 'bottom';
}

/** Size (mm) of the cells the clear-spot search looks at. */
const CELL_MM = 5;

/** How much it costs to lay the box over a cell holding each kind of thing (our choice: never over a cut line if it can be helped). */
const COST = { cut: 50, outline: 10, text: 10, line: 2, keepOut: 1000 } as const;

/**
 * Where (drawing mm, top-left corner) a box of `sizeMm` can sit in the window, keeping out of `keepOut`
 * (the overlaps, where a neighbour sheet will lie). What is drawn is rasterised into 5 mm cells, each cell
 * costing by what it holds (a cut line most, a reference line least); the box goes where its upper half
 * (the words, counted three times) and its edges cost least, nearest a corner among equals: the drawing
 * may show through the open lower half. A clear block wins when there is one; otherwise the square's
 * lines are coloured and the drawing's black, so both can still be read.
 */
export function clearSpot(prepared: PreparedDrawing, window: Bounds, keepOut: readonly Bounds[], sizeMm: number): InfoBoxSpot | null {
  const cols = Math.floor((window.maxY - window.minY) / CELL_MM);
  const rows = Math.floor((window.maxZ - window.minZ) / CELL_MM);
  const need = Math.ceil(sizeMm / CELL_MM) + 1;
  if (cols < need || rows < need) return null;
  const occ = new Float64Array(cols * rows);
  const mark = (y: number, z: number, cost: number): void => {
    const c = Math.floor((y - window.minY) / CELL_MM);
    const r = Math.floor((window.maxZ - z) / CELL_MM);
    if (c >= 0 && c < cols && r >= 0 && r < rows && occ[r * cols + c]! < cost) occ[r * cols + c] = cost;
  };
  for (const p of prepared.paths) {
    if (p.bounds.maxY < window.minY || p.bounds.minY > window.maxY || p.bounds.maxZ < window.minZ || p.bounds.minZ > window.maxZ) continue;
    const cost = p.role === 'outer-cut' || p.role === 'inner-cut' ? COST.cut : p.role === 'other-face' || p.role === 'notch' ? COST.outline : COST.line;
    const n = p.points.length;
    const segments = p.closed ? n : n - 1;
    for (let i = 0; i < Math.max(segments, 1); i++) {
      const a = p.points[i]!;
      const b = p.points[(i + 1) % n] ?? a;
      if ((a.y < window.minY && b.y < window.minY) || (a.y > window.maxY && b.y > window.maxY) || (a.z < window.minZ && b.z < window.minZ) || (a.z > window.maxZ && b.z > window.maxZ)) continue;
      const steps = Math.max(1, Math.ceil(Math.hypot(b.y - a.y, b.z - a.z) / (CELL_MM / 2)));
      for (let s = 0; s <= steps; s++) mark(a.y + ((b.y - a.y) * s) / steps, a.z + ((b.z - a.z) * s) / steps, cost);
    }
  }
  const d = prepared.drawing;
  // Text and marks, roughly: a disc round each label, a strip inward from each bevel tick.
  const disc = (p: SectionPoint, r: number): void => {
    for (let y = p.y - r; y <= p.y + r; y += CELL_MM) for (let z = p.z - r; z <= p.z + r; z += CELL_MM) mark(y, z, COST.text);
  };
  const nearWindow = (p: SectionPoint, r: number): boolean => p.y > window.minY - r && p.y < window.maxY + r && p.z > window.minZ - r && p.z < window.maxZ + r;
  for (const l of d.labels) {
    const r = Math.min(60, l.text.length * l.heightMm * 0.7);
    if (nearWindow(l.anchor, r)) disc(l.anchor, r);
  }
  for (const m of d.bevelMarks) if (nearWindow(m.at, 70)) for (let t = 0; t <= 60; t += CELL_MM) disc({ y: m.at.y + m.inward.y * t, z: m.at.z + m.inward.z * t }, 5);
  for (const c of d.centres) if (nearWindow(c.at, 10)) disc(c.at, 10);
  for (const k of keepOut) {
    for (let y = Math.max(k.minY, window.minY); y < Math.min(k.maxY, window.maxY) + CELL_MM; y += CELL_MM) {
      for (let z = Math.max(k.minZ, window.minZ); z < Math.min(k.maxZ, window.maxZ) + CELL_MM; z += CELL_MM) mark(Math.min(y, k.maxY), Math.min(z, k.maxZ), COST.keepOut);
    }
  }
  // Summed-area table: the cost under any block in constant time.
  const W = cols + 1;
  const sat = new Float64Array(W * (rows + 1));
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) sat[(r + 1) * W + c + 1] = occ[r * cols + c]! + sat[r * W + c + 1]! + sat[(r + 1) * W + c]! - sat[r * W + c]!;
  }
  const sum = (r: number, c: number, h: number, w: number): number => sat[(r + h) * W + c + w]! - sat[r * W + c + w]! - sat[(r + h) * W + c]! + sat[r * W + c]!;
  const wordsRows = Math.ceil(need / 2);
  let best: { r: number; c: number; score: number; words: 'top' | 'bottom' } | null = null;
  for (let r = 0; r + need <= rows; r++) {
    for (let c = 0; c + need <= cols; c++) {
      // The words (in the upper or the lower half) must be read; the square's own lines may cross the
      // drawing, which shows through the other half.
      const ring = sum(r, c, need, need) - sum(r + 1, c + 1, need - 2, need - 2);
      const top = sum(r, c, wordsRows, need);
      const bottom = sum(r + need - wordsRows, c, wordsRows, need);
      const corner = Math.min(r, rows - need - r) + Math.min(c, cols - need - c);
      for (const [words, w] of [['top', top], ['bottom', bottom]] as const) {
        const score = (ring + 3 * w) * 1000 + corner + (words === 'bottom' ? 0.5 : 0);
        if (!best || score < best.score) best = { r, c, score, words };
      }
    }
  }
  if (!best) return null;
  // Half a cell in from the block's edge, so the box keeps clear of lines in the cells round it.
  return { y: window.minY + best.c * CELL_MM + CELL_MM / 2, z: window.maxZ - best.r * CELL_MM - CELL_MM / 2, words: best.words };
}

/** Radius (mm) of the registration mark's circle; its cross is twice as long each way. */
export const REGISTRATION_RADIUS_MM = 3;

/** A registration mark (circle and cross) centred on a drawing point. */
export function drawRegistrationMark(doc: Doc, w: PageWindow, at: SectionPoint): void {
  const p = pageOf(w, at);
  const r = REGISTRATION_RADIUS_MM;
  doc.lineWidth(pt(0.15)).strokeColor('black').undash();
  doc.circle(pt(p.x), pt(p.y), pt(r)).stroke();
  doc.moveTo(pt(p.x - 2 * r), pt(p.y)).lineTo(pt(p.x + 2 * r), pt(p.y)).moveTo(pt(p.x), pt(p.y - 2 * r)).lineTo(pt(p.x), pt(p.y + 2 * r)).stroke();
}

/** A small filled triangle pointing out of the sheet (page mm). */
function pointer(doc: Doc, x: number, y: number, dx: number, dy: number): void {
  const s = 2.2;
  doc
    .moveTo(pt(x + dx * s), pt(y + dy * s))
    .lineTo(pt(x - dy * s * 0.8), pt(y + dx * s * 0.8))
    .lineTo(pt(x + dy * s * 0.8), pt(y - dx * s * 0.8))
    .closePath()
    .fill('#444444');
}

/** A neighbour at one edge: its name and whether it is printed. */
export interface EdgeNeighbour {
  name: string;
  printed: boolean;
}

/**
 * The neighbours' names at the middle of each edge of the printable area, with a pointer toward them; a
 * neighbour left out (nothing on it) is said to be so, so that nobody looks for it.
 */
export function drawNeighbourLabels(doc: Doc, w: { leftMm: number; topMm: number; widthMm: number; heightMm: number }, n: { left: EdgeNeighbour | null; right: EdgeNeighbour | null; above: EdgeNeighbour | null; below: EdgeNeighbour | null }): void {
  const say = (e: EdgeNeighbour): string => (e.printed ? `${e.name}` : `${e.name} (empty, not printed)`);
  const cx = w.leftMm + w.widthMm / 2;
  const cy = w.topMm + w.heightMm / 2;
  const style = { capMm: 2.6, bold: true, color: '#444444' };
  if (n.left) {
    pointer(doc, w.leftMm + 2.5, cy, -1, 0);
    textAt(doc, say(n.left), w.leftMm + 5, cy + 1.3, style);
  }
  if (n.right) {
    pointer(doc, w.leftMm + w.widthMm - 2.5, cy, 1, 0);
    textAt(doc, say(n.right), w.leftMm + w.widthMm - 5, cy + 1.3, { ...style, align: 'end' });
  }
  if (n.above) {
    pointer(doc, cx, w.topMm + 2.5, 0, -1);
    textAt(doc, say(n.above), cx, w.topMm + 8.5, { ...style, align: 'centre' });
  }
  if (n.below) {
    pointer(doc, cx, w.topMm + w.heightMm - 2.5, 0, 1);
    textAt(doc, say(n.below), cx, w.topMm + w.heightMm - 5.5, { ...style, align: 'centre' });
  }
}

/** The thin grey border of the printable area: the line to trim along. */
export function drawTrimBorder(doc: Doc, w: { leftMm: number; topMm: number; widthMm: number; heightMm: number }): void {
  doc.lineWidth(pt(0.1)).strokeColor('#999999').undash();
  doc.rect(pt(w.leftMm), pt(w.topMm), pt(w.widthMm), pt(w.heightMm)).stroke();
}
