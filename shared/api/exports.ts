import { z } from 'zod';
import type { TemplateDrawing } from '../geometry/drawing';
import { PAPER_SIZES, type PaperSize, type TilingOptions, paperCustom } from '../geometry/tiling';

/** Query of the tiled PDF: paper, orientation, the margin the printer cannot print in and the overlap (mm). */
export const tiledPdfQuerySchema = z.object({
  paper: z.enum(['a4', 'letter', 'a3', 'tabloid', 'custom']).default('a4'),
  widthMm: z.coerce.number().min(100).max(2000).optional(),
  heightMm: z.coerce.number().min(100).max(5000).optional(),
  orientation: z.enum(['portrait', 'landscape']).default('portrait'),
  marginMm: z.coerce.number().min(0).max(30).default(6.35),
  overlapMm: z.coerce.number().min(0).max(50).default(15),
  /** Ply layer, from 1; without it the first. */
  layer: z.coerce.number().int().min(1).max(16).default(1),
}).refine((q) => q.paper !== 'custom' || (q.widthMm !== undefined && q.heightMm !== undefined), { message: 'a custom paper needs widthMm and heightMm', path: ['widthMm'] });
export type TiledPdfQuery = z.input<typeof tiledPdfQuerySchema>;

/** The paper of a tiled PDF query: a named size, or the custom width and height (stored portrait, `paperCustom`). */
export function paperOfQuery(q: z.infer<typeof tiledPdfQuerySchema>): PaperSize {
  return q.paper === 'custom' ? paperCustom(q.widthMm!, q.heightMm!) : PAPER_SIZES.find((p) => p.id === q.paper)!;
}

/** The tiling of a tiled PDF query: what the writer and the Print shop preview both pass to `tiledPrintPlan`. */
export function tilingOfQuery(q: z.infer<typeof tiledPdfQuerySchema>): TilingOptions {
  return { paper: paperOfQuery(q), orientation: q.orientation, marginMm: q.marginMm, overlapMm: q.overlapMm };
}

/** Roll widths offered (mm): 610, 914 and 1067 (24, 36 and 42 in; common practice). */
export const ROLL_WIDTHS_MM: readonly number[] = [610, 914, 1067];

/** Query of the one-sheet PDF for a copy shop or plotter. */
export const rollPdfQuerySchema = z.object({
  rollWidthMm: z.coerce.number().min(200).max(2000).default(914),
  layer: z.coerce.number().int().min(1).max(16).default(1),
});

/** Query of a DXF: units, and one layer (from 1) or, without it, every layer side by side. */
export const dxfQuerySchema = z.object({
  units: z.enum(['mm', 'in']).default('mm'),
  layer: z.coerce.number().int().min(1).max(16).optional(),
});

/**
 * Query of the cut list: sheet size and saw kerf (mm). Left out, they are those of the arrangement saved by
 * hand for the revision, or 1220 x 2440 mm and 3 mm without one.
 */
export const cutListQuerySchema = z.object({
  sheetWidthMm: z.coerce.number().min(300).max(3000).optional(),
  sheetLengthMm: z.coerce.number().min(300).max(6000).optional(),
  kerfMm: z.coerce.number().min(0).max(10).optional(),
});
export type CutListQuery = z.infer<typeof cutListQuerySchema>;

const lengthMm = (what: string, min: number, max: number) =>
  z.number({ error: `${what} must be a number of millimetres` }).min(min, { error: `${what} must be at least ${min} mm` }).max(max, { error: `${what} must be at most ${max} mm` });

/** A cut list arrangement as the sheet view saves it (`shared/geometry/sheet-layout.ts`). */
export const sheetLayoutSchema = z.object({
  sheet: z.object({ widthMm: lengthMm('the sheet width', 300, 3000), lengthMm: lengthMm('the sheet length', 300, 6000) }),
  kerfMm: lengthMm('the saw kerf', 0, 10),
  edgeMarginMm: lengthMm('the edge margin', 0, 100).default(0),
  sheets: z.array(z.object({ sheetNo: z.number().int().min(1).max(500), plyThicknessMm: z.number().positive().max(100) })).min(1).max(500),
  placements: z
    .array(z.object({ pieceId: z.string().min(1).max(200), sheetNo: z.number().int().min(1).max(500), x: lengthMm('the position across', -10000, 10000), y: lengthMm('the position along', -10000, 10000), rotated: z.boolean() }))
    .max(5000),
});
export type SheetLayoutInput = z.input<typeof sheetLayoutSchema>;

/** PUT .../cut-list/arrangement: the arrangement for the revision it was made from (the latest, else 409). */
export const arrangementSaveSchema = z.object({
  revisionId: z.number().int().positive(),
  layout: sheetLayoutSchema,
});

/** A piece as the sheet view draws it: its box, ply, grain, and its outline with the box's lower left corner at 0, 0 (mm). */
export interface ArrangementPiece {
  id: string;
  partName: string;
  layerIndex: number;
  pieceNo: number;
  widthMm: number;
  heightMm: number;
  plyThicknessMm: number;
  grain: 'y' | 'z' | null;
  outline: { y: number; z: number }[];
}

/** GET .../cut-list/arrangement. `byHand` false: the automatic arrangement (`note` says why when one was saved but no longer fits). */
export interface ArrangementResponse {
  revisionId: number;
  byHand: boolean;
  savedAt: string | null;
  note: string | null;
  layout: {
    sheet: { widthMm: number; lengthMm: number };
    kerfMm: number;
    edgeMarginMm: number;
    sheets: { sheetNo: number; plyThicknessMm: number }[];
    placements: { pieceId: string; sheetNo: number; x: number; y: number; rotated: boolean }[];
  };
  pieces: ArrangementPiece[];
}

/** POST .../exports/jobs: an export that may take more than a second, made in the background with its progress. */
export const exportJobStartSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('tiled-pdf'), partId: z.string().min(1).max(64), query: tiledPdfQuerySchema }),
  z.object({ kind: z.literal('zip') }),
]);
export type ExportJobStart = z.input<typeof exportJobStartSchema>;

/** Where an export job is: `done` of `total` steps (`unit`: pages or files); a failed job says why in the one error shape. */
export interface ExportJobStatus {
  id: string;
  state: 'running' | 'done' | 'failed';
  done: number;
  total: number;
  unit: 'pages' | 'files';
  fileName: string;
  bytes: number | null;
  error: { code: string; message: string; field?: string } | null;
}

/** GET .../exports/parts/:partId/drawing: one layer's template drawing, which the Print shop tiles as the PDF writer does. */
export interface PartDrawingResponse {
  revisionId: number;
  drawing: TemplateDrawing;
}

/** One file of GET .../exports: what it is, where to get it, the revision it is made from and its size in bytes. */
export interface ExportIndexEntry {
  /** The file's name; null when it cannot be made (`problem` says why). */
  name: string | null;
  kind: 'tiled-pdf' | 'roll-pdf' | 'dxf' | 'bevels-csv' | 'bevels-pdf' | 'cut-list-csv' | 'cut-list-pdf' | 'zip';
  label: string;
  href: string;
  revisionId: number;
  bytes: number | null;
  problem: string | null;
  /** For a part's file: which part and layer (the screen makes a tiled PDF through an export job, with progress). */
  partId?: string;
  layer?: number;
}

export interface ExportIndexResponse {
  revisionId: number;
  exports: ExportIndexEntry[];
}
