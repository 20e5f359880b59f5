import Papa from 'papaparse';
import type { CutListPiece, DrawingUnits } from '../../shared/geometry/drawing';
import { type Nesting, type NestedPlacement, type NestedSheet, type NestingPiece, nestingOnSheets, nestingPlacedShape } from '../../shared/geometry/nesting';
import { type SheetLayout, sheetPieceSize } from '../../shared/geometry/sheet-layout';
import { DEFAULT_SHEET, type Sheet } from '../../shared/geometry/part-schema';
import type { SectionPoint } from '../../shared/geometry/types';
import { CAUTION_SAWS, CAUTION_STRUCTURE } from './cautions';
import { csvBuffer } from './csv';
import { type Doc, paragraph, pdfBuffer, pdfDocument, pdfPage, pt, textAt } from './pdf-common';
import { PdfTable, type TableColumn } from './pdf-table';

/**
 * The cut list and material: every piece of every layer of every part with its size and ply, the
 * pieces arranged on plywood sheets (nesting.ts: maxrects-packer on bounding boxes, turned where the
 * grain allows, a saw kerf apart), one sheet-layout page per sheet, and the totals: sheets, yield,
 * mass, fillet volume and glass tape (the last two passed in by the caller). PDF and CSV.
 * Pieces of different ply thickness never share a sheet: each thickness is nested on its own.
 */

/** Totals the caller works out (estimate.ts): fillet volume (ml) and glass tape (m). */
export interface CutListTotals {
  filletVolumeMl: number;
  glassTapeM: number;
}

export interface CutListOptions {
  hullName: string;
  revisionId: string;
  date: string;
  units: DrawingUnits;
  sheet?: Sheet;
  kerfMm?: number;
  edgeMarginMm?: number;
  totals: CutListTotals;
  /** The arrangement to print (a hand arrangement, `cutListNestingOfLayout`); without it, the automatic one. */
  nesting?: CutListNesting;
}

/** One thickness of ply, nested. Sheet numbers run on across thicknesses from 1. */
export interface CutListGroup {
  plyThicknessMm: number;
  nesting: Nesting;
  firstSheetNo: number;
}

/** The nesting of a cut list, one group per ply thickness (thinnest first). */
export interface CutListNesting {
  groups: CutListGroup[];
  /** Sheet number (from 1) of each piece, by `pieceId`. */
  sheetOf: Map<string, number>;
  /** Where each piece went, by `pieceId`. */
  placementOf: Map<string, NestedPlacement>;
  /** True when the builder arranged the pieces on the sheet view; false: the packer did. */
  byHand: boolean;
  /** Said on the cut list: why the automatic arrangement is used though one was saved by hand. */
  note: string | null;
}

/** A piece's id in the nesting: part, layer and piece number (unique in a cut list). */
export const pieceId = (p: Pick<CutListPiece, 'partName' | 'layerIndex' | 'pieceNo'>): string => `${p.partName} / layer ${p.layerIndex} / piece ${p.pieceNo}`;

/**
 * The pieces nested on sheets, each ply thickness apart.
 * @throws GeometryInputError (from nestingOnSheets) for a piece that does not fit the sheet.
 */
export function cutListNesting(pieces: readonly CutListPiece[], options: Pick<CutListOptions, 'sheet' | 'kerfMm' | 'edgeMarginMm'> = {}): CutListNesting {
  const thicknesses = [...new Set(pieces.map((p) => p.plyThicknessMm))].sort((a, b) => a - b);
  const groups: CutListGroup[] = [];
  const sheetOf = new Map<string, number>();
  const placementOf = new Map<string, NestedPlacement>();
  let next = 1;
  for (const t of thicknesses) {
    const mine = pieces.filter((p) => p.plyThicknessMm === t);
    const input: NestingPiece[] = mine.map((p) => ({ id: pieceId(p), widthMm: p.widthMm, heightMm: p.heightMm, areaMm2: p.areaMm2, grain: p.grain ?? null }));
    const nesting = nestingOnSheets(input, { sheet: options.sheet ?? DEFAULT_SHEET, kerfMm: options.kerfMm, edgeMarginMm: options.edgeMarginMm });
    nesting.sheets.forEach((s) => {
      for (const pl of s.placements) {
        sheetOf.set(pl.id, next + s.index);
        placementOf.set(pl.id, pl);
      }
    });
    groups.push({ plyThicknessMm: t, nesting, firstSheetNo: next });
    next += nesting.sheets.length;
  }
  return { groups, sheetOf, placementOf, byHand: false, note: null };
}

/**
 * The nesting of an arrangement made by hand (already checked with `sheetLayoutIssues` and tidied by
 * `sheetLayoutTidied`: sheets numbered from 1, thinnest ply first, none empty), in the shape the writers print.
 */
export function cutListNestingOfLayout(pieces: readonly CutListPiece[], layout: SheetLayout): CutListNesting {
  const byId = new Map(pieces.map((p) => [pieceId(p), p]));
  const sheetOf = new Map<string, number>();
  const placementOf = new Map<string, NestedPlacement>();
  const sheetArea = layout.sheet.widthMm * layout.sheet.lengthMm;
  const groups: CutListGroup[] = [];
  const sheets = [...layout.sheets].sort((a, b) => a.sheetNo - b.sheetNo);
  for (const t of [...new Set(sheets.map((s) => s.plyThicknessMm))].sort((a, b) => a - b)) {
    const mine = sheets.filter((s) => s.plyThicknessMm === t);
    const nestedSheets: NestedSheet[] = mine.map((s, index) => {
      const placements = layout.placements.filter((pl) => pl.sheetNo === s.sheetNo).map((pl): NestedPlacement => {
        const size = sheetPieceSize(byId.get(pl.pieceId) ?? { widthMm: 0, heightMm: 0 }, pl.rotated);
        const placed = { id: pl.pieceId, x: pl.x, y: pl.y, widthMm: size.acrossMm, lengthMm: size.alongMm, rotated: pl.rotated };
        sheetOf.set(pl.pieceId, s.sheetNo);
        placementOf.set(pl.pieceId, placed);
        return placed;
      });
      const usedAreaMm2 = placements.reduce((a, pl) => a + (byId.get(pl.id)?.areaMm2 ?? 0), 0);
      return { index, placements, usedAreaMm2, yield: usedAreaMm2 / sheetArea };
    });
    const usedAreaMm2 = nestedSheets.reduce((a, s) => a + s.usedAreaMm2, 0);
    const nesting: Nesting = { sheet: layout.sheet, kerfMm: layout.kerfMm, sheets: nestedSheets, usedAreaMm2, sheetAreaMm2: nestedSheets.length * sheetArea, yield: nestedSheets.length ? usedAreaMm2 / (nestedSheets.length * sheetArea) : 0 };
    groups.push({ plyThicknessMm: t, nesting, firstSheetNo: mine[0]!.sheetNo });
  }
  return { groups, sheetOf, placementOf, byHand: true, note: null };
}

const len = (mm: number, units: DrawingUnits): string => (units === 'mm' ? mm.toFixed(0) : (mm / 25.4).toFixed(2));
const unitWord = (units: DrawingUnits): string => (units === 'mm' ? 'mm' : 'in');

/** Mass (kg) of all the pieces. */
export const cutListMassKg = (pieces: readonly CutListPiece[]): number => pieces.reduce((s, p) => s + p.massKg, 0);

/** The cut list as CSV (UTF-8 with a byte-order mark): one row per piece with its sheet and place on it (totals are in the PDF). */
export function cutListCsv(pieces: readonly CutListPiece[], nesting: CutListNesting, options: Pick<CutListOptions, 'units'>): Buffer {
  const u = unitWord(options.units);
  const fields = ['part', 'kind', 'layer', 'piece', 'ply_mm', `width_${u}`, `height_${u}`, 'area_m2', 'mass_kg', 'sheet', `sheet_x_${u}`, `sheet_y_${u}`, 'turned', 'arranged'];
  const arranged = nesting.byHand ? 'by hand' : 'automatically';
  const data = pieces.map((p) => {
    const id = pieceId(p);
    const pl = nesting.placementOf.get(id);
    return [p.partName, p.partKind, p.layerIndex, p.pieceNo, p.plyThicknessMm, len(p.widthMm, options.units), len(p.heightMm, options.units), (p.areaMm2 / 1e6).toFixed(3), p.massKg.toFixed(2), nesting.sheetOf.get(id) ?? '', pl ? len(pl.x, options.units) : '', pl ? len(pl.y, options.units) : '', pl ? (pl.rotated ? 'yes' : 'no') : '', arranged];
  });
  return csvBuffer(Papa.unparse({ fields, data }, { newline: '\r\n' }));
}

const A4 = { widthMm: 210, heightMm: 297 };
const MARGIN = 12;

/** The cut list PDF: the table of pieces, the totals, then one layout page per sheet. */
export async function cutListPdf(pieces: readonly CutListPiece[], options: CutListOptions): Promise<Buffer> {
  const nesting = options.nesting ?? cutListNesting(pieces, options);
  const sheet = options.nesting?.groups[0]?.nesting.sheet ?? options.sheet ?? DEFAULT_SHEET;
  const doc = pdfDocument({ title: `${options.hullName}: cut list and material`, subject: 'Pieces, plywood sheets and their layout', date: options.date });
  const u = unitWord(options.units);
  const columns: TableColumn[] = [
    { title: 'Part', widthMm: 42 },
    { title: 'Kind', widthMm: 28 },
    { title: 'Layer', widthMm: 12, align: 'end' },
    { title: 'Piece', widthMm: 12, align: 'end' },
    { title: 'Ply mm', widthMm: 15, align: 'end' },
    { title: `W x H ${u}`, widthMm: 32, align: 'end' },
    { title: 'Area m2', widthMm: 17, align: 'end' },
    { title: 'Mass kg', widthMm: 13, align: 'end' },
    { title: 'Sheet', widthMm: 15, align: 'end' },
  ];
  const head = (d: Doc, pageNo: number): number => {
    textAt(d, `Cut list and material: ${options.hullName}`, MARGIN, MARGIN + 6, { capMm: 5, bold: true });
    textAt(d, `Revision ${options.revisionId}, ${options.date}. Page ${pageNo}.`, A4.widthMm - MARGIN, MARGIN + 6, { capMm: 2.4, align: 'end' });
    return MARGIN + 12;
  };
  const table = new PdfTable(doc, { pageWidthMm: A4.widthMm, pageHeightMm: A4.heightMm, marginMm: MARGIN, capMm: 2.6, rowMm: 5.6, onPage: head, bottomMm: A4.heightMm - MARGIN }, columns);
  for (const g of nesting.groups) {
    table.group(`${g.plyThicknessMm} mm ply`);
    for (const p of pieces.filter((q) => q.plyThicknessMm === g.plyThicknessMm)) {
      table.row({ cells: [p.partName, p.partKind, String(p.layerIndex), String(p.pieceNo), String(p.plyThicknessMm), `${len(p.widthMm, options.units)} x ${len(p.heightMm, options.units)}`, (p.areaMm2 / 1e6).toFixed(3), p.massKg.toFixed(2), String(nesting.sheetOf.get(pieceId(p)) ?? '')] });
    }
  }
  // Totals on a page of their own when the table left no room for them.
  let y = table.cursorMm + 8;
  if (y > A4.heightMm - MARGIN - 95) {
    pdfPage(doc, A4.widthMm, A4.heightMm);
    y = head(doc, table.pages + 1);
  }
  textAt(doc, 'Material', MARGIN, y, { capMm: 3.4, bold: true });
  y += 6;
  const sheetWords = `${len(sheet.widthMm, options.units)} x ${len(sheet.lengthMm, options.units)} ${u}`;
  const lines: string[] = [];
  for (const g of nesting.groups) lines.push(`${g.plyThicknessMm} mm ply: ${g.nesting.sheets.length} sheet${g.nesting.sheets.length === 1 ? '' : 's'} of ${sheetWords} (sheet${g.nesting.sheets.length === 1 ? '' : 's'} ${g.firstSheetNo}${g.nesting.sheets.length > 1 ? `-${g.firstSheetNo + g.nesting.sheets.length - 1}` : ''}), yield ${(g.nesting.yield * 100).toFixed(0)} % of the sheet area.`);
  lines.push(`Pieces: ${pieces.length}, mass about ${cutListMassKg(pieces).toFixed(1)} kg in all.`);
  lines.push(`Epoxy fillets: about ${(options.totals.filletVolumeMl / 1000).toFixed(2)} litres of thickened epoxy. Glass tape: about ${options.totals.glassTapeM.toFixed(1)} m.`);
  lines.push(`Saw kerf allowed between pieces: ${nesting.groups[0]?.nesting.kerfMm ?? options.kerfMm ?? 3} mm${options.edgeMarginMm ? `; ${options.edgeMarginMm} mm kept clear at the sheet edges` : ''}. Pieces are placed by their bounding boxes; a piece turned on the sheet is marked so on its layout.`);
  lines.push(nesting.byHand ? 'Arranged by hand on the sheet view, and checked: no two pieces nearer than the kerf, every piece inside its sheet.' : `Arranged automatically by the packer.${nesting.note ? ` ${nesting.note}` : ''}`);
  for (const l of lines) y += paragraph(doc, l, MARGIN, y, A4.widthMm - 2 * MARGIN, { capMm: 2.6 }) + 1.8;
  y += 3;
  for (const c of [CAUTION_SAWS, CAUTION_STRUCTURE]) y += paragraph(doc, c, MARGIN, y, A4.widthMm - 2 * MARGIN, { capMm: 2.1 }) + 1.5;

  for (const g of nesting.groups) for (const s of g.nesting.sheets) sheetPage(doc, pieces, g, s.index, sheet, options);
  return pdfBuffer(doc);
}

/**
 * One sheet's layout on A4 portrait: the sheet to scale standing up, its length (the face grain) up the
 * page, so that a piece is drawn the way up it lies on the sheet; each piece's outline (or its box) and name.
 */
function sheetPage(doc: Doc, pieces: readonly CutListPiece[], g: CutListGroup, index: number, sheet: Sheet, options: CutListOptions): void {
  const W = A4.widthMm;
  const H = A4.heightMm;
  pdfPage(doc, W, H);
  const s = g.nesting.sheets[index]!;
  const no = g.firstSheetNo + index;
  const u = unitWord(options.units);
  textAt(doc, `Sheet ${no}: ${g.plyThicknessMm} mm ply, ${len(sheet.widthMm, options.units)} x ${len(sheet.lengthMm, options.units)} ${u}`, MARGIN, MARGIN + 5, { capMm: 4, bold: true });
  paragraph(doc, `${options.hullName}, revision ${options.revisionId}. ${s.placements.length} pieces, yield ${(s.yield * 100).toFixed(0)} % of the sheet. A layout, not a pattern: cut each piece from its full-size pattern. Positions are of each piece's box from the lower left corner of the sheet (across, along).`, MARGIN, MARGIN + 9, W - 2 * MARGIN, { capMm: 2.1 });
  const boxW = W - 2 * MARGIN;
  const boxH = H - 2 * MARGIN - 30;
  const k = Math.min(boxW / sheet.widthMm, boxH / sheet.lengthMm);
  const left = MARGIN + (boxW - sheet.widthMm * k) / 2;
  const bottom = MARGIN + 24 + sheet.lengthMm * k;
  // Sheet x across the page from the left, sheet y up the page from the bottom.
  const at = (x: number, y: number): { px: number; py: number } => ({ px: left + x * k, py: bottom - y * k });
  doc.lineWidth(pt(0.5)).strokeColor('black').undash().rect(pt(left), pt(bottom - sheet.lengthMm * k), pt(sheet.widthMm * k), pt(sheet.lengthMm * k)).stroke();
  textAt(doc, `face grain up the ${len(sheet.lengthMm, options.units)} ${u} length`, left + sheet.widthMm * k + 2, bottom - (sheet.lengthMm * k) / 2, { capMm: 2, rotationDeg: 90, align: 'centre', color: '#555555' });
  const byId = new Map(pieces.map((p) => [pieceId(p), p]));
  for (const pl of s.placements) {
    const p = byId.get(pl.id);
    const a = at(pl.x, pl.y);
    const b = at(pl.x + pl.widthMm, pl.y + pl.lengthMm);
    doc.lineWidth(pt(0.15)).strokeColor('#1f5fbf').dash(pt(1), { space: pt(1) });
    doc.rect(pt(a.px), pt(b.py), pt(b.px - a.px), pt(a.py - b.py)).stroke();
    doc.undash();
    if (p?.outline) {
      const placed = nestingPlacedShape(p.outline, pl);
      doc.lineWidth(pt(0.3)).strokeColor('black');
      for (const loop of [placed.outer, ...placed.holes]) polygon(doc, loop.map((q: SectionPoint) => at(q.y, q.z)));
    }
    const cx = (a.px + b.px) / 2;
    const cy = (a.py + b.py) / 2;
    const label = p ? `${p.partName} L${p.layerIndex} #${p.pieceNo}${pl.rotated ? ' (turned)' : ''}` : pl.id;
    const cap = Math.max(1.2, Math.min(2.4, ((b.px - a.px) / Math.max(label.length, 1)) * 1.3));
    textAt(doc, label, cx, cy, { capMm: cap, bold: true, align: 'centre' });
    textAt(doc, `${len(pl.widthMm, options.units)} x ${len(pl.lengthMm, options.units)} at ${len(pl.x, options.units)}, ${len(pl.y, options.units)}`, cx, cy + cap * 1.8, { capMm: cap * 0.75, align: 'centre', color: '#333333' });
  }
}

function polygon(doc: Doc, pts: { px: number; py: number }[]): void {
  if (pts.length < 2) return;
  doc.moveTo(pt(pts[0]!.px), pt(pts[0]!.py));
  for (let i = 1; i < pts.length; i++) doc.lineTo(pt(pts[i]!.px), pt(pts[i]!.py));
  doc.closePath().stroke();
}
