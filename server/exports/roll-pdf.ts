import { type TemplateDrawing, drawingAsSeen, drawingBounds, drawingIssues, drawingTurned } from '../../shared/geometry/drawing';
import { DEFAULT_TILE_PADDING_MM, type PaperSize, type Tile, type TileGrid, type TileLeaveOut, tileGrid, tilesWithContent } from '../../shared/geometry/tiling';
import { GeometryInputError } from '../../shared/geometry/types';
import { CAUTIONS } from './cautions';
import { type Doc, paragraph, pdfCollect, pdfDocument, pdfPage, pt, textAt } from './pdf-common';
import { type PreparedDrawing, drawDrawing, drawingPrepared, type PageWindow } from './pdf-drawing';
import { CHECK_SQUARE_INCH_MM, drawInfoBox, drawNeighbourLabels, drawRegistrationMark, drawTrimBorder, titleLines } from './pdf-sheet-marks';
import { type PdfProgress, registrationMarks } from './tiled-pdf';

/**
 * The one-sheet PDF for a copy shop or a plotter: one page as wide as the roll and as long as the part
 * needs, with a title band across its top (check square, title, instructions, cautions). A PDF page may
 * be at most 14,400 units, 200 in = 5080 mm, unless UserUnit is set (ISO 32000-1, 8.3.2); UserUnit is
 * not honoured by every RIP, so a part longer than that is split into several roll-length pages that
 * overlap, with registration marks, each within the limit. A part wider than the roll but shorter than
 * it is turned a quarter turn to lie along the roll; one too big either way is also split across.
 */

/** Longest page (mm) without UserUnit: 14,400 / 72 in (ISO 32000-1, 8.3.2). */
export const PDF_MAX_PAGE_MM = (14400 / 72) * 25.4;
/** Roll widths offered (mm), shared with the Print shop. */
export { ROLL_WIDTHS_MM } from '../../shared/api/exports';
/** Height (mm) of the title band at the top of each roll page. */
export const ROLL_BAND_MM = 118;

/** Options of the roll PDF. */
export interface RollPdfOptions {
  rollWidthMm: number;
  /** Margin (mm) the plotter cannot print in, all round. */
  marginMm?: number;
  /** Overlap (mm) between pages when a part is split. */
  overlapMm?: number;
  paddingMm?: number;
  /** Longest page (mm); at most PDF_MAX_PAGE_MM. */
  maxPageLengthMm?: number;
  /** `auto`: turn the part along the roll only when it is wider than the roll and that makes it fit. */
  turn?: 'auto' | 'never' | 'always';
  leaveOut?: TileLeaveOut;
}

/** What the roll PDF will hold. */
export interface RollPdfPlan {
  seen: TemplateDrawing;
  turned: boolean;
  grid: TileGrid;
  printed: Tile[];
  pageWidthMm: number;
  pageLengthMm: number;
  marginMm: number;
}

const DEFAULT_ROLL_MARGIN_MM = 10;
const DEFAULT_ROLL_OVERLAP_MM = 25;

/**
 * The plan of a roll PDF: turned or not, how many pages across and along, each page's length.
 * @throws GeometryInputError for a drawing with issues, a roll too narrow for the title band, or a
 *   page length past the PDF limit.
 */
export function rollPdfPlan(drawing: TemplateDrawing, options: RollPdfOptions): RollPdfPlan {
  const issues = drawingIssues(drawing);
  if (issues.length) throw new GeometryInputError(issues);
  const m = options.marginMm ?? DEFAULT_ROLL_MARGIN_MM;
  const o = options.overlapMm ?? DEFAULT_ROLL_OVERLAP_MM;
  const pad = options.paddingMm ?? DEFAULT_TILE_PADDING_MM;
  const maxLen = options.maxPageLengthMm ?? PDF_MAX_PAGE_MM;
  const W = options.rollWidthMm;
  if (!(W - 2 * m >= 300)) throw new GeometryInputError([{ code: 'roll-narrow', message: `a roll ${W} mm wide with ${m} mm margins leaves less than the 300 mm the title band needs`, field: 'rollWidthMm', value: W }]);
  if (!(maxLen <= PDF_MAX_PAGE_MM + 1e-9 && maxLen > ROLL_BAND_MM + 2 * m + 2 * o)) {
    throw new GeometryInputError([{ code: 'roll-length', message: `the longest page must be more than the title band and at most ${PDF_MAX_PAGE_MM} mm (200 in, ISO 32000-1), found ${maxLen} mm`, field: 'maxPageLengthMm', value: maxLen }]);
  }
  const asSeen = drawingAsSeen(drawing);
  const b0 = drawingBounds(asSeen);
  if (!b0) throw new GeometryInputError([{ code: 'drawing-empty', message: `${drawing.title.partName}: the drawing has no lines to print`, field: 'paths' }]);
  const usable = W - 2 * m;
  const wide = b0.maxY - b0.minY + 2 * pad;
  const tall = b0.maxZ - b0.minZ + 2 * pad;
  const turn = options.turn ?? 'auto';
  const turned = turn === 'always' || (turn === 'auto' && wide > usable && (tall <= usable || Math.ceil(tall / usable) < Math.ceil(wide / usable)));
  const seen = turned ? drawingTurned(asSeen) : asSeen;
  const b = drawingBounds(seen)!;
  const height = b.maxZ - b.minZ + 2 * pad;
  const maxWindow = maxLen - 2 * m - ROLL_BAND_MM;
  // As few pages along as the limit allows, all of one length, so that nothing is wasted on the last.
  const rows = Math.max(1, Math.ceil((height - o) / (maxWindow - o) - 1e-9));
  const windowH = rows === 1 ? height : (height + (rows - 1) * o) / rows;
  const paper: PaperSize = { id: 'roll', name: `roll ${W} mm`, widthMm: W, heightMm: windowH + 2 * m };
  const grid = tileGrid(b, { paper, orientation: 'portrait', marginMm: m, overlapMm: o, paddingMm: pad });
  return { seen, turned, grid, printed: tilesWithContent(grid, seen, options.leaveOut), pageWidthMm: W, pageLengthMm: windowH + 2 * m + ROLL_BAND_MM, marginMm: m };
}

/**
 * The roll PDF as a Buffer: one page per printed tile of the roll grid (usually one).
 * @throws GeometryInputError as `rollPdfPlan`.
 */
export async function rollPdf(drawing: TemplateDrawing, options: RollPdfOptions, onProgress?: PdfProgress): Promise<Buffer> {
  const plan = rollPdfPlan(drawing, options);
  const t = plan.seen.title;
  const doc = pdfDocument({ title: `${t.hullName}: ${t.partName}, layer ${t.layerIndex} of ${t.layerCount} (full size, roll ${plan.pageWidthMm} mm)`, subject: 'Full-size pattern on one roll sheet', date: t.date });
  const done = pdfCollect(doc);
  const prepared = drawingPrepared(plan.seen);
  const marks = registrationMarks(plan.grid, plan.printed);
  const printedNames = new Set(plan.printed.map((x) => x.name));
  for (let i = 0; i < plan.printed.length; i++) {
    if (i > 0) await new Promise<void>((resolve) => setImmediate(resolve));
    pdfPage(doc, plan.pageWidthMm, plan.pageLengthMm);
    drawRollPage(doc, prepared, plan, plan.printed[i]!, i, marks, printedNames);
    onProgress?.(i + 1, plan.printed.length);
  }
  doc.end();
  return done;
}

function drawRollPage(doc: Doc, prepared: PreparedDrawing, plan: RollPdfPlan, tile: Tile, index: number, marks: ReturnType<typeof registrationMarks>, printedNames: Set<string>): void {
  const m = plan.marginMm;
  const g = plan.grid;
  const top = m + ROLL_BAND_MM;
  const w: PageWindow = { window: tile.window, leftMm: m, topMm: top, scale: 1 };
  drawDrawing(doc, prepared, w);
  const area = { leftMm: m, topMm: top, widthMm: g.printableWidthMm, heightMm: g.printableHeightMm };
  doc.save();
  doc.rect(pt(area.leftMm), pt(area.topMm), pt(area.widthMm), pt(area.heightMm)).clip();
  for (const r of marks) if (r.tiles.includes(tile.name)) drawRegistrationMark(doc, w, r.at);
  doc.restore();
  const split = plan.printed.length > 1;
  if (split) {
    drawTrimBorder(doc, area);
    const edge = (name: string | null) => (name ? { name, printed: printedNames.has(name) } : null);
    const n = tile.neighbours;
    drawNeighbourLabels(doc, area, { left: edge(n.left), right: edge(n.right), above: edge(n.above), below: edge(n.below) });
  }
  // The title band: the check square at the left, the words beside it.
  const t = plan.seen.title;
  const sequence = split ? `page ${index + 1} of ${plan.printed.length}` : 'one sheet';
  drawInfoBox(doc, m + 4, m + 4, { name: split ? tile.name : t.stationName, sequence, title: t });
  const x = m + 4 + (t.units === 'in' ? CHECK_SQUARE_INCH_MM : 100) + 8;
  const colW = Math.min(180, (plan.pageWidthMm - m - 4 - x) / 2 - 4);
  let y = m + 10;
  textAt(doc, `Full-size pattern: ${t.partName}`, x, y, { capMm: 5, bold: true });
  y += 6;
  textAt(doc, titleLines(t).join('  |  '), x, y, { capMm: 2.1 });
  y += 8;
  textAt(doc, 'PRINT AT ACTUAL SIZE (100 %), NOT SCALED TO FIT THE ROLL', x, y, { capMm: 3.5, bold: true, color: '#b00000' });
  y += 5;
  const how = [
    `Roll ${plan.pageWidthMm} mm wide, page ${plan.pageLengthMm.toFixed(1)} mm long. Check the 100 mm square${t.units === 'in' ? ' and the 4 in square' : ''} before cutting.`,
    plan.turned ? 'The part is turned a quarter turn to lie along the roll: its words turn with it.' : '',
    split
      ? `The part is split into ${plan.printed.length} pages (${g.cols} across, ${g.rows} along) to keep each page within the PDF limit of 5080 mm (200 in) or the roll's width. Trim along the grey border, lay the pages over each other by ${g.overlapMm} mm with the registration marks on each other, and tape.`
      : 'The whole part is on this one page.',
  ].filter(Boolean);
  let yl = y;
  for (const h of how) yl += paragraph(doc, h, x, yl, colW, { capMm: 2.2 }) + 1.5;
  let yr = y - 5;
  const x2 = x + colW + 8;
  if (x2 + 60 < plan.pageWidthMm - m) {
    textAt(doc, 'Cautions', x2, yr + 3, { capMm: 2.6, bold: true });
    yr += 5;
    for (const c of CAUTIONS) yr += paragraph(doc, c, x2, yr, colW, { capMm: 1.8 }) + 1;
  } else {
    for (const c of CAUTIONS) yl += paragraph(doc, c, x, yl, colW, { capMm: 1.8 }) + 1;
  }
  doc.lineWidth(pt(0.2)).strokeColor('#999999').undash();
  doc.moveTo(pt(m), pt(top - 2)).lineTo(pt(plan.pageWidthMm - m), pt(top - 2)).stroke();
}
