import type { Response, Router } from 'express';
import { arrangementSaveSchema, cutListQuerySchema, dxfQuerySchema, exportJobStartSchema, rollPdfQuerySchema, tiledPdfQuerySchema, tilingOfQuery, type PartDrawingResponse } from '../../shared/api/exports';
import { parseInput } from '../errors';
import { tiledPdfPlan } from '../exports';
import { accessOf, hullAccess } from '../http/hull-access';
import { arrangementGet, arrangementReset, arrangementSave, cutListNestingFor } from '../services/cut-list-arrangement';
import {
  bevelsCsvFile,
  bevelsPdfFile,
  cutListCsvFile,
  cutListPdfFile,
  exportFileName,
  type ExportFile,
  hullDxfFile,
  partDxfFile,
  rollPdfFile,
  tiledPdfFile,
  tiledPdfFileName,
  withInputErrors,
  zipFileCount,
  zipFileOf,
} from '../services/export-files';
import { exportIndexOf } from '../services/export-index';
import { exportJobFile, exportJobStart, exportJobStatus } from '../services/export-jobs';
import { builtPart, exportSourceOf, layerDrawing } from '../services/exports';

function send(res: Response, file: ExportFile) {
  res.type(file.type).attachment(file.name).set('Content-Length', String(file.data.length)).send(file.data);
}

async function sourceFor(res: Response) {
  const { hullId, latestRevisionId, units } = accessOf(res);
  return exportSourceOf(hullId, latestRevisionId, units);
}

export function registerExportRoutes(router: Router) {
  router.get('/api/hulls/:hullId/exports', hullAccess('export'), async (_req, res) => {
    res.json(await exportIndexOf(accessOf(res).hullId, await sourceFor(res)));
  });

  // The drawing of one layer as the writers see it: the Print shop lays the tile grid over it with the
  // same shared function the PDF writer uses, so the preview is the file.
  router.get('/api/hulls/:hullId/exports/parts/:partId/drawing', hullAccess('export'), async (req, res) => {
    const q = parseInput(dxfQuerySchema.pick({ layer: true }), req.query);
    const source = await sourceFor(res);
    const drawing = layerDrawing(source, builtPart(source, String(req.params.partId)), q.layer ?? 1);
    res.json({ revisionId: source.revisionId, drawing } satisfies PartDrawingResponse);
  });

  router.get('/api/hulls/:hullId/exports/parts/:partId/template.pdf', hullAccess('export'), async (req, res) => {
    const q = parseInput(tiledPdfQuerySchema, req.query);
    const source = await sourceFor(res);
    send(res, await tiledPdfFile(source, builtPart(source, String(req.params.partId)), q));
  });

  router.get('/api/hulls/:hullId/exports/parts/:partId/roll.pdf', hullAccess('export'), async (req, res) => {
    const q = parseInput(rollPdfQuerySchema, req.query);
    const source = await sourceFor(res);
    send(res, await rollPdfFile(source, builtPart(source, String(req.params.partId)), q));
  });

  router.get('/api/hulls/:hullId/exports/parts/:partId/template.dxf', hullAccess('export'), async (req, res) => {
    const q = parseInput(dxfQuerySchema, req.query);
    const source = await sourceFor(res);
    send(res, partDxfFile(source, builtPart(source, String(req.params.partId)), q));
  });

  router.get('/api/hulls/:hullId/exports/hull.dxf', hullAccess('export'), async (req, res) => {
    send(res, hullDxfFile(await sourceFor(res), parseInput(dxfQuerySchema, req.query)));
  });

  router.get('/api/hulls/:hullId/exports/bevels.csv', hullAccess('export'), async (_req, res) => {
    send(res, bevelsCsvFile(await sourceFor(res)));
  });

  router.get('/api/hulls/:hullId/exports/bevels.pdf', hullAccess('export'), async (_req, res) => {
    send(res, await bevelsPdfFile(await sourceFor(res)));
  });

  router.get('/api/hulls/:hullId/exports/cut-list.csv', hullAccess('export'), async (req, res) => {
    const q = parseInput(cutListQuerySchema, req.query);
    const source = await sourceFor(res);
    send(res, cutListCsvFile(source, await cutListNestingFor(accessOf(res).hullId, source, q)));
  });

  router.get('/api/hulls/:hullId/exports/cut-list.pdf', hullAccess('export'), async (req, res) => {
    const q = parseInput(cutListQuerySchema, req.query);
    const source = await sourceFor(res);
    send(res, await cutListPdfFile(source, await cutListNestingFor(accessOf(res).hullId, source, q)));
  });

  router.get('/api/hulls/:hullId/exports/all.zip', hullAccess('export'), async (_req, res) => {
    const source = await sourceFor(res);
    send(res, await zipFileOf(source, await cutListNestingFor(accessOf(res).hullId, source)));
  });

  // Exports made in the background with their progress (services/export-jobs.ts says why).
  router.post('/api/hulls/:hullId/exports/jobs', hullAccess('export'), async (req, res) => {
    const input = parseInput(exportJobStartSchema, req.body);
    const { hullId } = accessOf(res);
    const owner = { hullId, userId: req.user!.id };
    const onFault = (err: unknown) => req.log?.error({ err }, 'export job failed');
    const source = await sourceFor(res);
    if (input.kind === 'zip') {
      const nesting = await cutListNestingFor(hullId, source);
      const plan = { fileName: exportFileName(source, 'everything', 'zip'), unit: 'files' as const, total: zipFileCount(source) };
      res.status(202).json({ job: exportJobStart(owner, plan, (progress) => zipFileOf(source, nesting, progress), onFault) });
      return;
    }
    const part = builtPart(source, input.partId);
    const q = input.query;
    // Planned now, so a paper too small or a part that cannot be drawn is refused by this request, not later.
    const printPlan = await withInputErrors(() => tiledPdfPlan(layerDrawing(source, part, q.layer), tilingOfQuery(q)));
    const plan = { fileName: tiledPdfFileName(source, part, q), unit: 'pages' as const, total: printPlan.introPages + printPlan.printed.length };
    res.status(202).json({ job: exportJobStart(owner, plan, (progress) => tiledPdfFile(source, part, q, progress), onFault) });
  });

  router.get('/api/hulls/:hullId/exports/jobs/:jobId', hullAccess('export'), async (req, res) => {
    res.json({ job: exportJobStatus(accessOf(res).hullId, req.user!.id, String(req.params.jobId)) });
  });

  router.get('/api/hulls/:hullId/exports/jobs/:jobId/file', hullAccess('export'), async (req, res) => {
    send(res, exportJobFile(accessOf(res).hullId, req.user!.id, String(req.params.jobId)));
  });

  // The cut list arranged by hand: everyone who may export reads it; owner and builder change it (the
  // capability of changing parts: what is cut from which sheet is the shop's decision, not the designer's).
  router.get('/api/hulls/:hullId/cut-list/arrangement', hullAccess('export'), async (_req, res) => {
    res.json(await arrangementGet(accessOf(res).hullId, await sourceFor(res)));
  });

  router.put('/api/hulls/:hullId/cut-list/arrangement', hullAccess('edit-parts'), async (req, res) => {
    const input = parseInput(arrangementSaveSchema, req.body);
    res.json(await arrangementSave(accessOf(res).hullId, req.user!.id, await sourceFor(res), input));
  });

  router.delete('/api/hulls/:hullId/cut-list/arrangement', hullAccess('edit-parts'), async (_req, res) => {
    res.json(await arrangementReset(accessOf(res).hullId, await sourceFor(res)));
  });
}
