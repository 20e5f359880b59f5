import type { Sheet } from './part-schema';
import type { GeometryIssue } from './types';

/**
 * A cut list's pieces arranged on plywood sheets, as the builder leaves it after moving pieces by hand,
 * and the rules every arrangement must keep: each piece once, on a sheet of its own ply thickness, inside
 * the sheet (less the edge margin), its grain along the sheet when it has one, and at least a saw kerf
 * clear of every other piece on that sheet. Pieces are placed by their bounding boxes, as `nesting.ts`
 * places them. Sheet coordinates as in nesting.ts: x across the sheet's width, y along its length (the
 * face grain), from a corner, mm. The sheet view checks every move with these functions and the server
 * checks every save with the same ones.
 */

/** How far (mm) a box may pass a rule before it counts: what a saw and a pencil line cannot tell apart. */
export const SHEET_LAYOUT_TOLERANCE_MM = 0.01;

/** A piece to place: its box across (`widthMm`) and up (`heightMm`) as drawn, its ply and its grain (`y`/`z` along the sheet's length, null: either). */
export interface SheetLayoutPiece {
  id: string;
  widthMm: number;
  heightMm: number;
  plyThicknessMm: number;
  grain: 'y' | 'z' | null;
}

/** Where one piece lies: which sheet (from 1), its box's corner (mm), and whether it is turned a quarter turn. */
export interface SheetLayoutPlacement {
  pieceId: string;
  sheetNo: number;
  x: number;
  y: number;
  rotated: boolean;
}

/** One sheet of the arrangement: its number (from 1) and the ply it is. */
export interface SheetLayoutSheet {
  sheetNo: number;
  plyThicknessMm: number;
}

/** A whole arrangement: the sheet size, the kerf and edge margin kept, the sheets and where every piece lies. */
export interface SheetLayout {
  sheet: Sheet;
  kerfMm: number;
  edgeMarginMm: number;
  sheets: SheetLayoutSheet[];
  placements: SheetLayoutPlacement[];
}

/** A placed box in sheet coordinates (mm). */
export interface SheetBox {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** One broken rule, naming the piece (and the other piece, for a clash) and the placement's field. */
export interface SheetLayoutIssue extends GeometryIssue {
  pieceId: string;
  otherPieceId?: string;
}

const fmt = (v: number): string => String(Number(v.toFixed(1)));

/** The size of a piece as placed: across the sheet (x) and along it (y); a quarter turn swaps them. */
export function sheetPieceSize(piece: Pick<SheetLayoutPiece, 'widthMm' | 'heightMm'>, rotated: boolean): { acrossMm: number; alongMm: number } {
  return rotated ? { acrossMm: piece.heightMm, alongMm: piece.widthMm } : { acrossMm: piece.widthMm, alongMm: piece.heightMm };
}

/** The box a placement takes on its sheet (mm). */
export function sheetPieceBox(piece: Pick<SheetLayoutPiece, 'widthMm' | 'heightMm'>, placement: Pick<SheetLayoutPlacement, 'x' | 'y' | 'rotated'>): SheetBox {
  const s = sheetPieceSize(piece, placement.rotated);
  return { x0: placement.x, y0: placement.y, x1: placement.x + s.acrossMm, y1: placement.y + s.alongMm };
}

/**
 * The clear distance (mm) between two boxes: the larger of the gaps across and along, so two boxes that
 * are apart in either direction are that far apart (a straight saw cut fits between them); negative when
 * they overlap, by the smaller of the two overlaps.
 */
export function sheetBoxGap(a: SheetBox, b: SheetBox): number {
  const gapX = Math.max(b.x0 - a.x1, a.x0 - b.x1);
  const gapY = Math.max(b.y0 - a.y1, a.y0 - b.y1);
  return Math.max(gapX, gapY);
}

/** True when the piece may lie this way round: grain `z` (up the drawing) must run along the sheet untouched, grain `y` needs the quarter turn. */
export function sheetGrainAllows(piece: Pick<SheetLayoutPiece, 'grain'>, rotated: boolean): boolean {
  return piece.grain === null || (piece.grain === 'z' ? !rotated : rotated);
}

/**
 * Every rule the arrangement breaks, placement by placement (field `placements.<i>`), in words a builder
 * reads: an unknown or doubled piece, a piece left out, a missing sheet or one of another ply, a box past
 * the sheet's edge (less `edgeMarginMm`), grain across the sheet, and two pieces nearer than the kerf.
 * An empty list means the arrangement can be cut as laid out.
 */
export function sheetLayoutIssues(layout: SheetLayout, pieces: readonly SheetLayoutPiece[], toleranceMm: number = SHEET_LAYOUT_TOLERANCE_MM): SheetLayoutIssue[] {
  const issues: SheetLayoutIssue[] = [];
  const byId = new Map(pieces.map((p) => [p.id, p]));
  const sheets = new Map(layout.sheets.map((s) => [s.sheetNo, s]));
  const seen = new Set<string>();
  const { widthMm: W, lengthMm: L } = layout.sheet;
  const m = layout.edgeMarginMm;
  const boxes: { index: number; piece: SheetLayoutPiece; sheetNo: number; box: SheetBox }[] = [];
  layout.placements.forEach((pl, index) => {
    const field = `placements.${index}`;
    const piece = byId.get(pl.pieceId);
    if (!piece) {
      issues.push({ code: 'layout-unknown-piece', message: `${pl.pieceId} is not a piece of this cut list`, field, value: pl.pieceId, pieceId: pl.pieceId });
      return;
    }
    if (seen.has(pl.pieceId)) {
      issues.push({ code: 'layout-piece-twice', message: `${pl.pieceId} is placed twice`, field, value: pl.pieceId, pieceId: pl.pieceId });
      return;
    }
    seen.add(pl.pieceId);
    if (![pl.x, pl.y].every(Number.isFinite)) {
      issues.push({ code: 'layout-position', message: `${pl.pieceId}: its position must be a finite length, found ${pl.x}, ${pl.y} mm`, field: `${field}.x`, value: [pl.x, pl.y], pieceId: pl.pieceId });
      return;
    }
    const sheet = sheets.get(pl.sheetNo);
    if (!sheet) {
      issues.push({ code: 'layout-no-sheet', message: `${pl.pieceId} is on sheet ${pl.sheetNo}, which the arrangement does not have`, field: `${field}.sheetNo`, value: pl.sheetNo, pieceId: pl.pieceId });
      return;
    }
    if (sheet.plyThicknessMm !== piece.plyThicknessMm) {
      issues.push({ code: 'layout-wrong-ply', message: `${pl.pieceId} is ${fmt(piece.plyThicknessMm)} mm ply; sheet ${pl.sheetNo} is ${fmt(sheet.plyThicknessMm)} mm`, field: `${field}.sheetNo`, value: pl.sheetNo, pieceId: pl.pieceId });
      return;
    }
    if (!sheetGrainAllows(piece, pl.rotated)) {
      issues.push({ code: 'layout-grain', message: `${pl.pieceId} must lie with its grain along the sheet's length: ${piece.grain === 'z' ? 'it cannot be turned' : 'it must be turned'}`, field: `${field}.rotated`, value: pl.rotated, pieceId: pl.pieceId });
    }
    const box = sheetPieceBox(piece, pl);
    const outBy = Math.max(m - box.x0, m - box.y0, box.x1 - (W - m), box.y1 - (L - m));
    if (outBy > toleranceMm) {
      const where = m > 0 ? `inside the ${fmt(m)} mm edge margin of` : 'on';
      issues.push({ code: 'layout-off-sheet', message: `${pl.pieceId} at ${fmt(pl.x)}, ${fmt(pl.y)} mm runs ${fmt(outBy)} mm past the edge: it must lie ${where} the ${fmt(W)} x ${fmt(L)} mm sheet`, field, value: { x: pl.x, y: pl.y }, pieceId: pl.pieceId });
    }
    boxes.push({ index, piece, sheetNo: pl.sheetNo, box });
  });
  for (let i = 0; i < boxes.length; i++) {
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i]!;
      const b = boxes[j]!;
      if (a.sheetNo !== b.sheetNo) continue;
      const gap = sheetBoxGap(a.box, b.box);
      if (gap < layout.kerfMm - toleranceMm) {
        const what = gap < -toleranceMm ? 'overlaps' : `is only ${fmt(Math.max(gap, 0))} mm from`;
        issues.push({ code: 'layout-clash', message: `${b.piece.id} ${what} ${a.piece.id} on sheet ${a.sheetNo}: keep at least the ${fmt(layout.kerfMm)} mm saw kerf between pieces`, field: `placements.${b.index}`, value: gap, pieceId: b.piece.id, otherPieceId: a.piece.id });
      }
    }
  }
  for (const p of pieces) {
    if (!seen.has(p.id)) issues.push({ code: 'layout-piece-missing', message: `${p.id} is not on any sheet`, field: 'placements', value: p.id, pieceId: p.id });
  }
  return issues;
}

/** The arrangement with one piece's placement replaced (a drag, a turn): a new value, the old one untouched. */
export function sheetLayoutWith(layout: SheetLayout, placement: SheetLayoutPlacement): SheetLayout {
  return { ...layout, placements: layout.placements.map((p) => (p.pieceId === placement.pieceId ? placement : p)) };
}

/**
 * The arrangement with one more sheet, of the piece's ply, numbered after the last, and where the piece
 * would lie on it: in the corner inside the edge margin, turned as it was. How a builder starts a sheet by
 * hand; a sheet the move leaves empty is dropped when the arrangement is tidied for saving.
 */
export function sheetLayoutNewSheetFor(layout: SheetLayout, piece: Pick<SheetLayoutPiece, 'id' | 'plyThicknessMm'>, rotated: boolean): { layout: SheetLayout; placement: SheetLayoutPlacement } {
  const sheetNo = layout.sheets.reduce((last, s) => Math.max(last, s.sheetNo), 0) + 1;
  return {
    layout: { ...layout, sheets: [...layout.sheets, { sheetNo, plyThicknessMm: piece.plyThicknessMm }] },
    placement: { pieceId: piece.id, sheetNo, x: layout.edgeMarginMm, y: layout.edgeMarginMm, rotated },
  };
}

/**
 * The rules a move would break that concern the moved piece (its own place, its clashes with others):
 * what the sheet view refuses a drag or a turn with. Empty: the move keeps every rule it could break.
 */
export function sheetLayoutMoveIssues(layout: SheetLayout, pieces: readonly SheetLayoutPiece[], placement: SheetLayoutPlacement, toleranceMm: number = SHEET_LAYOUT_TOLERANCE_MM): SheetLayoutIssue[] {
  return sheetLayoutIssues(sheetLayoutWith(layout, placement), pieces, toleranceMm).filter((i) => i.pieceId === placement.pieceId || i.otherPieceId === placement.pieceId);
}

/**
 * The arrangement as it is stored and printed: sheets that hold no piece left out, the others numbered
 * from 1, thinnest ply first and otherwise in their old order, the placements following their sheets.
 */
export function sheetLayoutTidied(layout: SheetLayout): SheetLayout {
  const used = new Set(layout.placements.map((p) => p.sheetNo));
  const kept = layout.sheets.filter((s) => used.has(s.sheetNo)).sort((a, b) => a.plyThicknessMm - b.plyThicknessMm || a.sheetNo - b.sheetNo);
  const renumbered = new Map(kept.map((s, i) => [s.sheetNo, i + 1]));
  return {
    ...layout,
    sheets: kept.map((s, i) => ({ sheetNo: i + 1, plyThicknessMm: s.plyThicknessMm })),
    placements: layout.placements.map((p) => ({ ...p, sheetNo: renumbered.get(p.sheetNo) ?? p.sheetNo })),
  };
}
