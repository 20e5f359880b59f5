import type { z } from 'zod';
import { type dxfQuerySchema, paperOfQuery, type rollPdfQuerySchema, tiledPdfQuerySchema, tilingOfQuery } from '../../shared/api/exports';
import type { PartGeometry } from '../../shared/geometry/frame-types';
import { GeometryInputError } from '../../shared/geometry/types';
import { AppError } from '../errors';
import { bevelTableCsv, bevelTablePdf, cutListCsv, cutListPdf, dxfOfDrawings, rollPdf, tiledPdf, zipOf, type PdfProgress } from '../exports';
import type { CutListNesting } from '../exports/cut-list';
import { allBevelRows, allDrawings, cutListPieces, layerDrawing, type ExportSource } from './exports';

/**
 * Every file Loftbench exports, made from one revision: the routes send them, the export jobs make them
 * in the background, the zip gathers them and the Downloads index measures them, all through these
 * functions, so a file has one name and the same bytes whichever way it is asked for.
 */

/** A file ready to send: its name (hull, part, revision), its media type and its bytes. */
export interface ExportFile {
  name: string;
  type: string;
  data: Buffer;
}

const PDF = 'application/pdf';
const DXF = 'application/dxf';
const CSV = 'text/csv; charset=utf-8';

/** File names say the hull, the part and the revision, so a printed sheet can be traced to its source. */
export function exportFileName(source: ExportSource, what: string, ext: string): string {
  const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 50);
  return `${slug(source.hullName) || 'hull'}-${slug(what)}-r${source.revisionId}.${ext}`;
}

/**
 * Runs `make`, turning a GeometryInputError (a paper too small for the check square, a part that cannot
 * be drawn) into the one error shape: 400 naming the field of the first issue.
 */
export async function withInputErrors<T>(make: () => T | Promise<T>): Promise<T> {
  try {
    return await make();
  } catch (e) {
    if (e instanceof GeometryInputError) {
      const first = e.issues[0];
      throw new AppError(400, 'invalid_export', e.message, first?.field, true, { issues: e.issues.map((i) => ({ field: i.field ?? '', message: i.message })) });
    }
    throw e;
  }
}

/** The tiled PDF's name: part, layer, paper and orientation, so two printings of one part are told apart. */
export const tiledPdfFileName = (source: ExportSource, part: PartGeometry, q: z.infer<typeof tiledPdfQuerySchema>): string =>
  exportFileName(source, `${part.name}-layer-${q.layer}-${paperOfQuery(q).id}-${q.orientation}-tiles`, 'pdf');

export async function tiledPdfFile(source: ExportSource, part: PartGeometry, q: z.infer<typeof tiledPdfQuerySchema>, onProgress?: PdfProgress): Promise<ExportFile> {
  const drawing = layerDrawing(source, part, q.layer);
  const data = await withInputErrors(() => tiledPdf(drawing, tilingOfQuery(q), onProgress));
  return { name: tiledPdfFileName(source, part, q), type: PDF, data };
}

export async function rollPdfFile(source: ExportSource, part: PartGeometry, q: z.infer<typeof rollPdfQuerySchema>): Promise<ExportFile> {
  const drawing = layerDrawing(source, part, q.layer);
  const data = await withInputErrors(() => rollPdf(drawing, { rollWidthMm: q.rollWidthMm }));
  return { name: exportFileName(source, `${part.name}-layer-${q.layer}-roll`, 'pdf'), type: PDF, data };
}

export function partDxfFile(source: ExportSource, part: PartGeometry, q: z.infer<typeof dxfQuerySchema>): ExportFile {
  const drawings = q.layer ? [layerDrawing(source, part, q.layer)] : part.layers.map((_, i) => source.drawing(part, i));
  return { name: exportFileName(source, `${part.name}${q.layer ? `-layer-${q.layer}` : ''}-${q.units}`, 'dxf'), type: DXF, data: dxfOfDrawings(drawings, { units: q.units }) };
}

export function hullDxfFile(source: ExportSource, q: z.infer<typeof dxfQuerySchema>): ExportFile {
  return { name: exportFileName(source, `all-parts-${q.units}`, 'dxf'), type: DXF, data: dxfOfDrawings(allDrawings(source), { units: q.units }) };
}

export function bevelsCsvFile(source: ExportSource): ExportFile {
  return { name: exportFileName(source, 'bevel-table', 'csv'), type: CSV, data: bevelTableCsv(allBevelRows(source), { units: source.units }) };
}

export async function bevelsPdfFile(source: ExportSource): Promise<ExportFile> {
  const data = await bevelTablePdf(allBevelRows(source), { hullName: source.hullName, revisionId: String(source.revisionId), date: source.date, units: source.units });
  return { name: exportFileName(source, 'bevel-table', 'pdf'), type: PDF, data };
}

export function cutListCsvFile(source: ExportSource, nesting: CutListNesting): ExportFile {
  return { name: exportFileName(source, 'cut-list', 'csv'), type: CSV, data: cutListCsv(cutListPieces(source), nesting, { units: source.units }) };
}

export async function cutListPdfFile(source: ExportSource, nesting: CutListNesting): Promise<ExportFile> {
  const data = await cutListPdf(cutListPieces(source), {
    hullName: source.hullName,
    revisionId: String(source.revisionId),
    date: source.date,
    units: source.units,
    nesting,
    totals: { filletVolumeMl: source.frames.estimate.filletMl, glassTapeM: source.frames.estimate.tapeLengthMm / 1000 },
  });
  return { name: exportFileName(source, 'cut-list', 'pdf'), type: PDF, data };
}

/** Called after each file of the zip is made: files made so far, files in all. */
export type ZipProgress = (done: number, total: number) => void;

/** How many files the zip of a hull holds: per part and layer the A4 tiles and the DXF, then the hull DXF, the bevel table and the cut list. */
export const zipFileCount = (source: ExportSource): number => source.built.reduce((n, p) => n + 2 * p.layers.length, 0) + 3;

/**
 * Everything for the hull in one zip: per part and layer the A4 portrait tiles and the millimetre DXF,
 * all parts in one DXF, the bevel table and the cut list (CSV).
 */
export async function zipFileOf(source: ExportSource, nesting: CutListNesting, onProgress?: ZipProgress): Promise<ExportFile> {
  const total = zipFileCount(source);
  const files: { name: string; data: Buffer }[] = [];
  const add = (name: string, data: Buffer) => {
    files.push({ name, data });
    onProgress?.(files.length, total);
  };
  for (const part of source.built) {
    for (let i = 0; i < part.layers.length; i += 1) {
      const base = exportFileName(source, `${part.name}-layer-${i + 1}`, '').replace(/\.$/, '');
      add(`patterns/${base}-a4-tiles.pdf`, (await tiledPdfFile(source, part, tiledPdfQuerySchema.parse({ layer: i + 1 }))).data);
      add(`dxf/${base}-mm.dxf`, partDxfFile(source, part, { units: 'mm', layer: i + 1 }).data);
    }
  }
  for (const f of [hullDxfFile(source, { units: 'mm' }), bevelsCsvFile(source), cutListCsvFile(source, nesting)]) add(f.name, f.data);
  return { name: exportFileName(source, 'everything', 'zip'), type: 'application/zip', data: await zipOf(files) };
}
