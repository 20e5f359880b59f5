import type { Readable } from 'node:stream';
import { type TemplateDrawing, lengthLabel } from '../../shared/geometry/drawing';
import type { Bounds } from '../../shared/geometry/polygon';
import { type Tile, type TileGrid, type TiledPrintPlan, type TilingOptions, tiledPrintPlan } from '../../shared/geometry/tiling';
import type { SectionPoint } from '../../shared/geometry/types';
import { CAUTIONS } from './cautions';
import { type Doc, dashMm, paragraph, paragraphHeightMm, pdfCollect, pdfDocument, pdfPage, pt, textAt } from './pdf-common';
import { LINE_STYLES, type PreparedDrawing, drawDrawing, drawingPrepared, type PageWindow } from './pdf-drawing';
import { clearSpot, drawInfoBox, drawNeighbourLabels, drawRegistrationMark, drawTrimBorder, infoBoxSizeMm, titleLines } from './pdf-sheet-marks';

/**
 * The tiled PDF at 1:1 for an ordinary printer: a first page with the assembly map and the instructions,
 * then one page per sheet of the tile grid (`shared/geometry/tiling.ts`) that has something on it, in
 * grid order (A1, B1, ..., A2, ...). Every sheet: the drawing at full size in its printable area, the
 * 100 mm check square (and 4 in for an inch hull) with the sheet's name and title, registration marks
 * in the overlaps, the neighbours' names at the edges. One drawing (one ply layer) per file.
 */

/** Called after each page is written: pages written so far, pages in all. */
export type PdfProgress = (done: number, total: number) => void;

/** What the tiled PDF will hold (the shared plan: the Print shop preview computes the same). */
export type TiledPdfPlan = TiledPrintPlan;

/**
 * The plan of a tiled PDF without writing it: `tiledPrintPlan`, which the Print shop preview also runs.
 * @throws GeometryInputError as `tiledPrintPlan`.
 */
export const tiledPdfPlan = (drawing: TemplateDrawing, options: TilingOptions): TiledPdfPlan => tiledPrintPlan(drawing, options);

/** A registration mark: where (drawing mm, as seen) and on which tiles it is drawn. */
export interface RegistrationMark {
  at: SectionPoint;
  tiles: string[];
}

/**
 * Registration marks in the middle of every overlap band between printed neighbours, at a quarter and
 * three quarters along the shared edge, and where four sheets meet. The same drawing point on each sheet,
 * so that the marks lie on each other when the sheets are laid over each other.
 */
export function registrationMarks(grid: TileGrid, printed: readonly Tile[]): RegistrationMark[] {
  const printedNames = new Set(printed.map((t) => t.name));
  const at = (r: number, c: number): Tile | undefined => (r < grid.rows && c < grid.cols ? grid.tiles[r * grid.cols + c] : undefined);
  const o = grid.overlapMm;
  const marks: RegistrationMark[] = [];
  const keep = (p: SectionPoint, tiles: (Tile | undefined)[]): void => {
    const names = tiles.filter((t): t is Tile => !!t && printedNames.has(t.name)).map((t) => t.name);
    if (names.length >= 2) marks.push({ at: p, tiles: names });
  };
  for (let r = 0; r < grid.rows; r++) {
    for (let c = 0; c < grid.cols; c++) {
      const t = at(r, c)!;
      const w = t.window;
      if (c + 1 < grid.cols) for (const f of [0.25, 0.75]) keep({ y: w.maxY - o / 2, z: w.minZ + f * (w.maxZ - w.minZ) }, [t, at(r, c + 1)]);
      if (r + 1 < grid.rows) for (const f of [0.25, 0.75]) keep({ y: w.minY + f * (w.maxY - w.minY), z: w.minZ + o / 2 }, [t, at(r + 1, c)]);
      if (c + 1 < grid.cols && r + 1 < grid.rows) keep({ y: w.maxY - o / 2, z: w.minZ + o / 2 }, [t, at(r, c + 1), at(r + 1, c), at(r + 1, c + 1)]);
    }
  }
  return marks;
}

/**
 * The tiled PDF as a Buffer.
 * @param onProgress called after each page.
 * @throws GeometryInputError as `tiledPdfPlan`.
 */
export async function tiledPdf(drawing: TemplateDrawing, options: TilingOptions, onProgress?: PdfProgress): Promise<Buffer> {
  const plan = tiledPdfPlan(drawing, options);
  const doc = tiledPdfDocument(plan);
  const done = pdfCollect(doc);
  await tiledPdfWrite(doc, plan, onProgress);
  return done;
}

/**
 * The tiled PDF as a stream for a large drawing: pages are written one per turn of the event loop, so the
 * response can send each as it is made; errors are emitted on the stream.
 * @throws GeometryInputError as `tiledPdfPlan` (before anything is streamed).
 */
export function tiledPdfStream(drawing: TemplateDrawing, options: TilingOptions, onProgress?: PdfProgress): Readable {
  const plan = tiledPdfPlan(drawing, options);
  const doc = tiledPdfDocument(plan);
  tiledPdfWrite(doc, plan, onProgress).catch((e: unknown) => doc.emit('error', e));
  return doc;
}

function tiledPdfDocument(plan: TiledPdfPlan): Doc {
  const t = plan.seen.title;
  return pdfDocument({ title: `${t.hullName}: ${t.partName}, layer ${t.layerIndex} of ${t.layerCount} (full size, tiled)`, subject: 'Full-size pattern, tiled for printing at actual size', date: t.date });
}

async function tiledPdfWrite(doc: Doc, plan: TiledPdfPlan, onProgress: PdfProgress | undefined): Promise<void> {
  const prepared = drawingPrepared(plan.seen);
  const total = plan.introPages + plan.printed.length;
  const marks = registrationMarks(plan.grid, plan.printed);
  const printedNames = new Set(plan.printed.map((t) => t.name));
  pdfPage(doc, plan.grid.pageWidthMm, plan.grid.pageHeightMm);
  drawAssemblyPage(doc, prepared, plan);
  onProgress?.(1, total);
  for (let i = 0; i < plan.printed.length; i++) {
    // One page per turn of the event loop: a stream drains between pages and progress is seen.
    await new Promise<void>((resolve) => setImmediate(resolve));
    pdfPage(doc, plan.grid.pageWidthMm, plan.grid.pageHeightMm);
    drawTilePage(doc, prepared, plan, plan.printed[i]!, i, marks, printedNames);
    onProgress?.(plan.introPages + i + 1, total);
  }
  doc.end();
}

/** Where a tile's window goes on its page: its printable area, at full size. */
function tileWindow(grid: TileGrid, tile: Tile): PageWindow {
  return { window: tile.window, leftMm: grid.marginMm, topMm: grid.marginMm, scale: 1 };
}

function drawTilePage(doc: Doc, prepared: PreparedDrawing, plan: TiledPdfPlan, tile: Tile, index: number, marks: RegistrationMark[], printedNames: Set<string>): void {
  const grid = plan.grid;
  const w = tileWindow(grid, tile);
  drawDrawing(doc, prepared, w);
  const area = { leftMm: grid.marginMm, topMm: grid.marginMm, widthMm: grid.printableWidthMm, heightMm: grid.printableHeightMm };
  doc.save();
  doc.rect(pt(area.leftMm), pt(area.topMm), pt(area.widthMm), pt(area.heightMm)).clip();
  for (const m of marks) if (m.tiles.includes(tile.name)) drawRegistrationMark(doc, w, m.at);
  doc.restore();
  drawTrimBorder(doc, area);
  const edge = (name: string | null) => (name ? { name, printed: printedNames.has(name) } : null);
  const n = tile.neighbours;
  drawNeighbourLabels(doc, area, { left: edge(n.left), right: edge(n.right), above: edge(n.above), below: edge(n.below) });
  const win = tile.window;
  const o = grid.overlapMm;
  // Keep the square out of the overlaps (a neighbour will lie on them) and off the neighbours' names.
  const band = Math.max(o, 12);
  const keepOut: Bounds[] = [];
  if (n.left) keepOut.push({ ...win, maxY: win.minY + band });
  if (n.right) keepOut.push({ ...win, minY: win.maxY - band });
  if (n.above) keepOut.push({ ...win, minZ: win.maxZ - band });
  if (n.below) keepOut.push({ ...win, maxZ: win.minZ + band });
  const size = infoBoxSizeMm(plan.seen.title.units);
  const spot = clearSpot(prepared, win, keepOut, size) ?? { y: win.minY + 3, z: win.maxZ - 3, words: 'top' as const };
  drawInfoBox(doc, grid.marginMm + (spot.y - win.minY), grid.marginMm + (win.maxZ - spot.z), {
    name: tile.name,
    sequence: `sheet ${index + 1} of ${plan.printed.length}`,
    title: plan.seen.title,
  }, spot.words);
}

/** The first page: title, the instruction to print at actual size, the assembly map, how to assemble, the legend and the cautions. */
function drawAssemblyPage(doc: Doc, prepared: PreparedDrawing, plan: TiledPdfPlan): void {
  const { grid, seen, printed } = plan;
  const t = seen.title;
  const m = grid.marginMm + 2;
  const W = grid.pageWidthMm - 2 * m;
  let y = m + 6;
  textAt(doc, `Full-size pattern: ${t.partName}`, m, y, { capMm: 5, bold: true });
  y += 6;
  textAt(doc, titleLines(t).join('  |  '), m, y, { capMm: 2.1 });
  y += 4;

  // The one instruction that matters most, boxed.
  const boxTop = y;
  y += 2.5;
  textAt(doc, 'PRINT AT ACTUAL SIZE (100 %)', m + 3, y + 4, { capMm: 4, bold: true, color: '#b00000' });
  y += 7;
  y += paragraph(doc, `Turn off 'fit to page', 'shrink to fit' and any scaling in the print dialogue. Print pages 2 to ${printed.length + 1}. Every sheet carries a 100 mm check square${t.units === 'in' ? ' and a 4 in square' : ''}: measure it before cutting.`, m + 3, y, W - 6, { capMm: 2.2 });
  y += 2;
  doc.lineWidth(pt(0.6)).strokeColor('#b00000').undash().rect(pt(m), pt(boxTop), pt(W), pt(y - boxTop)).stroke();
  y += 4;

  // Text under the map, in two columns: measure it first, so the map takes what is left.
  const colW = (W - 6) / 2;
  const left = assemblySteps(plan);
  const right = legendAndNotes(plan);
  const heightOf = (paras: Para[]): number => paras.reduce((h, p) => h + measure(doc, p, colW) + 1.2, 0);
  const textH = Math.max(heightOf(left), heightOf(right));
  const mapBottomRoom = grid.pageHeightMm - m - textH - 12;
  const mapH = Math.max(40, mapBottomRoom - y);
  drawAssemblyMap(doc, prepared, plan, { leftMm: m, topMm: y, widthMm: W, heightMm: mapH });
  y += mapH + 8;
  let yl = y;
  for (const p of left) yl += write(doc, p, m, yl, colW) + 1.2;
  let yr = y;
  for (const p of right) yr += write(doc, p, m + colW + 6, yr, colW) + 1.2;
}

interface Para {
  text: string;
  capMm: number;
  bold?: boolean;
  /** A line sample in this role's style before the text (the legend). */
  role?: keyof typeof LINE_STYLES;
}

const LEGEND_SAMPLE_MM = 14;

function measure(doc: Doc, p: Para, width: number): number {
  return paragraphHeightMm(doc, p.text, p.role ? width - LEGEND_SAMPLE_MM - 2 : width, p);
}

function write(doc: Doc, p: Para, x: number, y: number, width: number): number {
  if (p.role) {
    const s = LINE_STYLES[p.role];
    doc.lineWidth(pt(s.widthMm)).strokeColor('black');
    dashMm(doc, s.dashMm);
    doc.moveTo(pt(x), pt(y + p.capMm * 0.7)).lineTo(pt(x + LEGEND_SAMPLE_MM), pt(y + p.capMm * 0.7)).stroke();
    doc.undash();
    return paragraph(doc, p.text, x + LEGEND_SAMPLE_MM + 2, y, width - LEGEND_SAMPLE_MM - 2, p);
  }
  return paragraph(doc, p.text, x, y, width, p);
}

function assemblySteps(plan: TiledPdfPlan): Para[] {
  const { grid, printed } = plan;
  const left = grid.tiles.filter((t) => !printed.includes(t));
  const o = grid.overlapMm;
  return [
    { text: 'Print, check, assemble', capMm: 2.6, bold: true },
    { text: `1. Print every sheet at actual size (100 %). On each, measure the check square: it must be exactly 100 mm. If not, fix the print settings and print again: do not cut from a sheet that is off.`, capMm: 2 },
    { text: `2. Sheets are named by column (letters, from the left) and row (numbers, from the top), as on the map. Their neighbours are named at each edge.`, capMm: 2 },
    { text: `3. Trim each sheet along the thin grey border on its left and top edges, lay it over its neighbours so that they overlap by ${o} mm and the circle-and-cross registration marks lie exactly on each other, and tape.`, capMm: 2 },
    { text: `4. Check the taped pattern: the CHECK dimension on the drawing, and that the lines run on across every join.`, capMm: 2 },
    { text: `Sheets: ${grid.cols} across by ${grid.rows} down, ${printed.length} printed (${printed.map((t) => t.name).join(', ')}).${left.length ? ` Left out, with nothing on them: ${left.map((t) => t.name).join(', ')}.` : ''}`, capMm: 2 },
  ];
}

function legendAndNotes(plan: TiledPdfPlan): Para[] {
  const d = plan.seen;
  const t = d.title;
  const roles = new Set(d.paths.map((p) => p.role));
  const out: Para[] = [{ text: 'On the pattern', capMm: 2.6, bold: true }];
  for (const role of Object.keys(LINE_STYLES) as (keyof typeof LINE_STYLES)[]) if (roles.has(role)) out.push({ text: LINE_STYLES[role].legend, capMm: 1.9, role });
  if (d.bevelMarks.length) out.push({ text: 'Bevel marks: a tick into the part, then the saw tilt from square, under or standing, what a sliding bevel set from the marked face reads, which way to tilt, and the face to put down on the saw table (the larger face).', capMm: 1.9 });
  if (t.filletClearanceMm !== null) out.push({ text: `A ${lengthLabel(t.filletClearanceMm, t.units)} clearance for the epoxy fillet is already taken off the edge: cut to the line.`, capMm: 1.9 });
  out.push({ text: `Drawn as seen looking at the ${t.face} face: ${t.face === 'forward' ? 'starboard on the left, port on the right' : 'port on the left, starboard on the right'}.`, capMm: 1.9 });
  out.push({ text: 'Cautions', capMm: 2.6, bold: true });
  for (const c of CAUTIONS) out.push({ text: c, capMm: 1.8 });
  return out;
}

/** The drawing reduced to fit the box, with the tile grid over it: printed sheets outlined and named, empty ones greyed. */
function drawAssemblyMap(doc: Doc, prepared: PreparedDrawing, plan: TiledPdfPlan, box: { leftMm: number; topMm: number; widthMm: number; heightMm: number }): void {
  const { grid, printed } = plan;
  const c = grid.covered;
  const scale = Math.min(box.widthMm / (c.maxY - c.minY), box.heightMm / (c.maxZ - c.minZ));
  const wMm = (c.maxY - c.minY) * scale;
  const hMm = (c.maxZ - c.minZ) * scale;
  const left = box.leftMm + (box.widthMm - wMm) / 2;
  const top = box.topMm;
  const o = grid.overlapMm;
  // Each sheet's own cell: the grid split at the middle of every overlap.
  const cellOf = (tile: Tile): Bounds => ({
    minY: tile.col === 0 ? c.minY : tile.window.minY + o / 2,
    maxY: tile.col === grid.cols - 1 ? c.maxY : tile.window.maxY - o / 2,
    maxZ: tile.row === 0 ? c.maxZ : tile.window.maxZ - o / 2,
    minZ: tile.row === grid.rows - 1 ? c.minZ : tile.window.minZ + o / 2,
  });
  const toPage = (b: Bounds) => ({ x: left + (b.minY - c.minY) * scale, y: top + (c.maxZ - b.maxZ) * scale, w: (b.maxY - b.minY) * scale, h: (b.maxZ - b.minZ) * scale });
  for (const tile of grid.tiles) {
    if (printed.includes(tile)) continue;
    const r = toPage(cellOf(tile));
    doc.rect(pt(r.x), pt(r.y), pt(r.w), pt(r.h)).fill('#e4e4e4');
  }
  drawDrawing(doc, prepared, { window: c, leftMm: left, topMm: top, scale }, { linesOnly: true });
  doc.lineWidth(pt(0.25)).strokeColor('#1f5fbf').undash();
  for (const tile of grid.tiles) {
    const r = toPage(cellOf(tile));
    doc.rect(pt(r.x), pt(r.y), pt(r.w), pt(r.h)).stroke();
  }
  for (const tile of grid.tiles) {
    const r = toPage(cellOf(tile));
    const isPrinted = printed.includes(tile);
    const cap = Math.max(1.4, Math.min(5, r.h / 4, r.w / 5));
    textAt(doc, tile.name, r.x + r.w / 2, r.y + r.h / 2 + cap / 2, { capMm: cap, bold: true, align: 'centre', color: isPrinted ? '#1f5fbf' : '#9a9a9a' });
    if (isPrinted) textAt(doc, `p. ${plan.introPages + printed.indexOf(tile) + 1}`, r.x + r.w / 2, r.y + r.h / 2 + cap / 2 + cap * 0.9, { capMm: cap * 0.45, align: 'centre', color: '#1f5fbf' });
  }
  const ratio = 1 / scale;
  textAt(doc, `Assembly map, reduced about 1:${ratio >= 10 ? ratio.toFixed(0) : ratio.toFixed(1)}: do not measure it. Grey: sheets left out (nothing on them). Sheets overlap by ${o} mm.`, box.leftMm, top + hMm + 4, { capMm: 1.9 });
}
