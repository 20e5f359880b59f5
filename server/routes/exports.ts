import type { Response, Router } from 'express';
import { cutListQuerySchema, dxfQuerySchema, rollPdfQuerySchema, tiledPdfQuerySchema } from '../../shared/api/exports';
import { PAPER_A3, PAPER_A4, PAPER_LETTER, PAPER_TABLOID, type PaperSize } from '../../shared/geometry/tiling';
import { parseInput } from '../errors';
import { bevelTableCsv, bevelTablePdf, cutListCsv, cutListNesting, cutListPdf, dxfOfDrawings, rollPdf, tiledPdf, zipOf } from '../exports';
import { accessOf, hullAccess } from '../http/hull-access';
import { allBevelRows, allDrawings, builtPart, cutListPieces, exportSourceOf, layerDrawing, type ExportSource } from '../services/exports';

const PAPERS: Record<string, PaperSize> = { a4: PAPER_A4, letter: PAPER_LETTER, a3: PAPER_A3, tabloid: PAPER_TABLOID };

/** File names say the hull, the part and the revision, so a printed sheet can be traced to its source. */
function fileName(source: ExportSource, what: string, ext: string): string {
  const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 50);
  return `${slug(source.hullName) || 'hull'}-${slug(what)}-r${source.revisionId}.${ext}`;
}

function send(res: Response, type: string, name: string, body: Buffer) {
  res.type(type).attachment(name).set('Content-Length', String(body.length)).send(body);
}

async function sourceFor(res: Response) {
  const { hullId, latestRevisionId, units } = accessOf(res);
  return exportSourceOf(hullId, latestRevisionId, units);
}

export function registerExportRoutes(router: Router) {
  router.get('/api/hulls/:hullId/exports/parts/:partId/template.pdf', hullAccess('export'), async (req, res) => {
    const q = parseInput(tiledPdfQuerySchema, req.query);
    const source = await sourceFor(res);
    const part = builtPart(source, String(req.params.partId));
    const paper = q.paper === 'custom' ? { id: 'custom', name: `${q.widthMm} × ${q.heightMm} mm`, widthMm: q.widthMm!, heightMm: q.heightMm! } : PAPERS[q.paper];
    const pdf = await tiledPdf(layerDrawing(source, part, q.layer), { paper, orientation: q.orientation, marginMm: q.marginMm, overlapMm: q.overlapMm });
    send(res, 'application/pdf', fileName(source, `${part.name}-layer-${q.layer}-tiles`, 'pdf'), pdf);
  });

  router.get('/api/hulls/:hullId/exports/parts/:partId/roll.pdf', hullAccess('export'), async (req, res) => {
    const q = parseInput(rollPdfQuerySchema, req.query);
    const source = await sourceFor(res);
    const part = builtPart(source, String(req.params.partId));
    const pdf = await rollPdf(layerDrawing(source, part, q.layer), { rollWidthMm: q.rollWidthMm });
    send(res, 'application/pdf', fileName(source, `${part.name}-layer-${q.layer}-roll`, 'pdf'), pdf);
  });

  router.get('/api/hulls/:hullId/exports/parts/:partId/template.dxf', hullAccess('export'), async (req, res) => {
    const q = parseInput(dxfQuerySchema, req.query);
    const source = await sourceFor(res);
    const part = builtPart(source, String(req.params.partId));
    const drawings = q.layer ? [layerDrawing(source, part, q.layer)] : part.layers.map((_, i) => source.drawing(part, i));
    send(res, 'application/dxf', fileName(source, `${part.name}${q.layer ? `-layer-${q.layer}` : ''}-${q.units}`, 'dxf'), dxfOfDrawings(drawings, { units: q.units }));
  });

  router.get('/api/hulls/:hullId/exports/hull.dxf', hullAccess('export'), async (req, res) => {
    const q = parseInput(dxfQuerySchema, req.query);
    const source = await sourceFor(res);
    send(res, 'application/dxf', fileName(source, `all-parts-${q.units}`, 'dxf'), dxfOfDrawings(allDrawings(source), { units: q.units }));
  });

  router.get('/api/hulls/:hullId/exports/bevels.csv', hullAccess('export'), async (_req, res) => {
    const source = await sourceFor(res);
    send(res, 'text/csv; charset=utf-8', fileName(source, 'bevel-table', 'csv'), bevelTableCsv(allBevelRows(source), { units: source.units }));
  });

  router.get('/api/hulls/:hullId/exports/bevels.pdf', hullAccess('export'), async (_req, res) => {
    const source = await sourceFor(res);
    const pdf = await bevelTablePdf(allBevelRows(source), { hullName: source.hullName, revisionId: String(source.revisionId), date: source.date, units: source.units });
    send(res, 'application/pdf', fileName(source, 'bevel-table', 'pdf'), pdf);
  });

  router.get('/api/hulls/:hullId/exports/cut-list.csv', hullAccess('export'), async (req, res) => {
    const q = parseInput(cutListQuerySchema, req.query);
    const source = await sourceFor(res);
    const pieces = cutListPieces(source);
    const nesting = cutListNesting(pieces, { sheet: { widthMm: q.sheetWidthMm, lengthMm: q.sheetLengthMm }, kerfMm: q.kerfMm });
    send(res, 'text/csv; charset=utf-8', fileName(source, 'cut-list', 'csv'), cutListCsv(pieces, nesting, { units: source.units }));
  });

  router.get('/api/hulls/:hullId/exports/cut-list.pdf', hullAccess('export'), async (req, res) => {
    const q = parseInput(cutListQuerySchema, req.query);
    const source = await sourceFor(res);
    const pdf = await cutListPdf(cutListPieces(source), {
      hullName: source.hullName,
      revisionId: String(source.revisionId),
      date: source.date,
      units: source.units,
      sheet: { widthMm: q.sheetWidthMm, lengthMm: q.sheetLengthMm },
      kerfMm: q.kerfMm,
      totals: { filletVolumeMl: source.frames.estimate.filletMl, glassTapeM: source.frames.estimate.tapeLengthMm / 1000 },
    });
    send(res, 'application/pdf', fileName(source, 'cut-list', 'pdf'), pdf);
  });

  // Everything for the hull in one download: per part and layer the A4 tiles and the DXF, all parts in
  // one DXF, the bevel table and the cut list.
  router.get('/api/hulls/:hullId/exports/all.zip', hullAccess('export'), async (_req, res) => {
    const source = await sourceFor(res);
    const files: { name: string; data: Buffer }[] = [];
    for (const part of source.built) {
      for (let i = 0; i < part.layers.length; i += 1) {
        const d = source.drawing(part, i);
        const base = fileName(source, `${part.name}-layer-${i + 1}`, '').replace(/\.$/, '');
        files.push({ name: `patterns/${base}-a4-tiles.pdf`, data: await tiledPdf(d, { paper: PAPER_A4, orientation: 'portrait' }) });
        files.push({ name: `dxf/${base}-mm.dxf`, data: dxfOfDrawings([d], { units: 'mm' }) });
      }
    }
    files.push({ name: fileName(source, 'all-parts-mm', 'dxf'), data: dxfOfDrawings(allDrawings(source), { units: 'mm' }) });
    files.push({ name: fileName(source, 'bevel-table', 'csv'), data: bevelTableCsv(allBevelRows(source), { units: source.units }) });
    const pieces = cutListPieces(source);
    files.push({ name: fileName(source, 'cut-list', 'csv'), data: cutListCsv(pieces, cutListNesting(pieces), { units: source.units }) });
    send(res, 'application/zip', fileName(source, 'everything', 'zip'), await zipOf(files));
  });
}
