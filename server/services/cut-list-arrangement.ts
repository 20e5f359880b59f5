import type { z } from 'zod';
import { type ArrangementPiece, type ArrangementResponse, type CutListQuery, type arrangementSaveSchema, sheetLayoutSchema } from '../../shared/api/exports';
import type { CutListPiece } from '../../shared/geometry/drawing';
import { DEFAULT_KERF_MM } from '../../shared/geometry/nesting';
import { DEFAULT_SHEET } from '../../shared/geometry/part-schema';
import { polygonBounds } from '../../shared/geometry/polygon';
import { type SheetLayout, type SheetLayoutPiece, sheetLayoutIssues, sheetLayoutTidied } from '../../shared/geometry/sheet-layout';
import { AppError } from '../errors';
import { type CutListNesting, cutListNesting, cutListNestingOfLayout, pieceId } from '../exports/cut-list';
import { CutListArrangement } from '../models';
import { cutListPieces, type ExportSource } from './exports';
import { withInputErrors } from './export-files';

/**
 * The cut list's arrangement on plywood sheets: the packer's, or the one the builder made by hand on the
 * sheet view and saved for the revision. A save is checked with the same pure rules the sheet view runs
 * (`sheetLayoutIssues`), so no arrangement that breaks them is ever stored; a stored one is checked again
 * against the revision's pieces whenever it is used, and the automatic arrangement is used (with a note)
 * if it no longer fits them or the sheet asked for.
 */

/** The pieces as the layout rules see them, by the cut list's piece id. */
export function layoutPiecesOf(pieces: readonly CutListPiece[]): SheetLayoutPiece[] {
  return pieces.map((p) => ({ id: pieceId(p), widthMm: p.widthMm, heightMm: p.heightMm, plyThicknessMm: p.plyThicknessMm, grain: p.grain ?? null }));
}

/** The packer's nesting as an arrangement the sheet view can change. */
export function layoutOfNesting(nesting: CutListNesting, edgeMarginMm = 0): SheetLayout {
  const first = nesting.groups[0]?.nesting;
  return {
    sheet: first?.sheet ?? { ...DEFAULT_SHEET },
    kerfMm: first?.kerfMm ?? DEFAULT_KERF_MM,
    edgeMarginMm,
    sheets: nesting.groups.flatMap((g) => g.nesting.sheets.map((s) => ({ sheetNo: g.firstSheetNo + s.index, plyThicknessMm: g.plyThicknessMm }))),
    placements: nesting.groups.flatMap((g) => g.nesting.sheets.flatMap((s) => s.placements.map((p) => ({ pieceId: p.id, sheetNo: g.firstSheetNo + s.index, x: p.x, y: p.y, rotated: p.rotated })))),
  };
}

async function savedRow(hullId: number, revisionId: number) {
  return CutListArrangement.findOne({ where: { hullId, revisionId } });
}

/** The saved layout, if one is stored and still reads (validated on load like every stored document). */
function savedLayoutOf(row: CutListArrangement | null): SheetLayout | null {
  if (!row) return null;
  const parsed = sheetLayoutSchema.safeParse(JSON.parse(row.layoutJson));
  return parsed.success ? parsed.data : null;
}

const sameSheet = (layout: SheetLayout, q: CutListQuery): boolean =>
  (q.sheetWidthMm === undefined || q.sheetWidthMm === layout.sheet.widthMm) && (q.sheetLengthMm === undefined || q.sheetLengthMm === layout.sheet.lengthMm) && (q.kerfMm === undefined || q.kerfMm === layout.kerfMm);

/**
 * The nesting the cut list prints for this revision and query: the hand arrangement when one is saved,
 * keeps every rule for the revision's pieces and is for the sheet and kerf asked (or none asked); else the
 * packer's, with a note saying why the hand arrangement was not used.
 */
export async function cutListNestingFor(hullId: number, source: ExportSource, q: CutListQuery = {}): Promise<CutListNesting & { savedAt: Date | null }> {
  const pieces = cutListPieces(source);
  const row = await savedRow(hullId, source.revisionId);
  const saved = savedLayoutOf(row);
  let note: string | null = null;
  if (saved) {
    const issues = sheetLayoutIssues(saved, layoutPiecesOf(pieces));
    if (!sameSheet(saved, q)) note = `The arrangement saved by hand is for ${saved.sheet.widthMm} x ${saved.sheet.lengthMm} mm sheets and a ${saved.kerfMm} mm kerf; this cut list asks for other sizes.`;
    else if (issues.length) note = `The arrangement saved by hand no longer fits this revision's pieces (${issues[0]!.message}).`;
    else return { ...cutListNestingOfLayout(pieces, saved), savedAt: row!.updatedAt };
  }
  const auto = await withInputErrors(() =>
    cutListNesting(pieces, { sheet: { widthMm: q.sheetWidthMm ?? saved?.sheet.widthMm ?? DEFAULT_SHEET.widthMm, lengthMm: q.sheetLengthMm ?? saved?.sheet.lengthMm ?? DEFAULT_SHEET.lengthMm }, kerfMm: q.kerfMm ?? saved?.kerfMm ?? DEFAULT_KERF_MM }),
  );
  return { ...auto, note, savedAt: null };
}

/** A piece for the sheet view: its outline moved so that its box's lower left corner is at 0, 0. */
function arrangementPieceOf(p: CutListPiece): ArrangementPiece {
  const b = p.outline ? polygonBounds(p.outline.outer) : null;
  return {
    id: pieceId(p),
    partName: p.partName,
    layerIndex: p.layerIndex,
    pieceNo: p.pieceNo,
    widthMm: p.widthMm,
    heightMm: p.heightMm,
    plyThicknessMm: p.plyThicknessMm,
    grain: p.grain ?? null,
    outline: b && p.outline ? p.outline.outer.map((q) => ({ y: q.y - b.minY, z: q.z - b.minZ })) : [],
  };
}

/** What the sheet view shows: the arrangement in use (by hand or automatic) and every piece. */
export async function arrangementGet(hullId: number, source: ExportSource): Promise<ArrangementResponse> {
  const nesting = await cutListNestingFor(hullId, source);
  return {
    revisionId: source.revisionId,
    byHand: nesting.byHand,
    savedAt: nesting.savedAt?.toISOString() ?? null,
    note: nesting.note,
    layout: layoutOfNesting(nesting),
    pieces: cutListPieces(source).map(arrangementPieceOf),
  };
}

/**
 * Saves the builder's arrangement for the latest revision, after checking it with `sheetLayoutIssues`
 * against that revision's pieces: a broken rule is a 400 naming the placement and saying which rule,
 * and nothing is written. An arrangement made for an older revision is a 409 (its pieces may differ).
 */
export async function arrangementSave(hullId: number, userId: number, source: ExportSource, input: z.infer<typeof arrangementSaveSchema>): Promise<ArrangementResponse> {
  if (input.revisionId !== source.revisionId) {
    throw new AppError(409, 'stale_revision', `This arrangement was made for revision ${input.revisionId}, but the latest is ${source.revisionId}: its pieces may have changed. Reload the sheet view.`, 'revisionId', true, { latestRevisionId: source.revisionId });
  }
  const issues = sheetLayoutIssues(input.layout, layoutPiecesOf(cutListPieces(source)));
  if (issues.length) {
    throw new AppError(400, 'arrangement_refused', `${issues[0]!.message}; nothing was saved`, `layout.${issues[0]!.field ?? 'placements'}`, true, { issues: issues.map((i) => ({ field: `layout.${i.field ?? 'placements'}`, message: i.message })) });
  }
  const layoutJson = JSON.stringify(sheetLayoutTidied(input.layout));
  // One statement (INSERT ... ON DUPLICATE KEY UPDATE on the hull and revision): two saves at once leave the later, never an error.
  await CutListArrangement.upsert({ hullId, revisionId: source.revisionId, layoutJson, savedBy: userId });
  return arrangementGet(hullId, source);
}

/** Forgets the hand arrangement of the latest revision: the cut list goes back to the packer's. */
export async function arrangementReset(hullId: number, source: ExportSource): Promise<ArrangementResponse> {
  await CutListArrangement.destroy({ where: { hullId, revisionId: source.revisionId } });
  return arrangementGet(hullId, source);
}

/** A stamp that changes whenever the hand arrangement of a revision does (the Downloads index caches by it). */
export async function arrangementStamp(hullId: number, revisionId: number): Promise<string> {
  const row = await CutListArrangement.findOne({ where: { hullId, revisionId }, attributes: ['updatedAt'] });
  return row ? String(row.updatedAt.getTime()) : 'automatic';
}
