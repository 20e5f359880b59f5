import type { Router } from 'express';
import multer from 'multer';
import { copyHullSchema, importOffsetsFieldsSchema, importPlanJsonSchema, renameHullSchema, restoreRevisionSchema, saveDraftSchema, savePlanSchema } from '../../shared/api/plan';
import { planRead } from '../../shared/geometry/plan';
import type { Plan } from '../../shared/geometry/plan-schema';
import { notationSchema } from '../../shared/geometry/notation-schema';
import { AppError, notFound, parseInput } from '../errors';
import { accessOf, hullAccess } from '../http/hull-access';
import { hullArchive, hullCopy, hullRename } from '../services/hulls';
import { offsetsFromCsv, offsetsToCsv } from '../services/offsets-csv';
import { draftDelete, draftGet, draftPut, planResponseJson, planValidated, revisionCached, revisionCompare, revisionList, revisionRestore, revisionSave } from '../services/plans';

/** Largest table of offsets accepted: a big hull's table is tens of kilobytes. */
export const OFFSETS_CSV_MAX_BYTES = 2 * 1024 * 1024;

const csvUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: OFFSETS_CSV_MAX_BYTES, files: 1, fields: 10 } }).single('file');

function idParam(raw: string | string[] | undefined, what: string): number {
  const id = Number(raw);
  if (!Number.isSafeInteger(id) || id <= 0) throw notFound(`No such ${what}`);
  return id;
}

export function registerPlanRoutes(router: Router) {
  router.patch('/api/hulls/:hullId', hullAccess('edit-parts'), async (req, res) => {
    const { name } = parseInput(renameHullSchema, req.body);
    res.json({ hull: await hullRename(accessOf(res), name) });
  });

  router.post('/api/hulls/:hullId/archive', hullAccess('manage-crew'), async (_req, res) => {
    res.json({ hull: await hullArchive(accessOf(res), true) });
  });

  router.post('/api/hulls/:hullId/unarchive', hullAccess('manage-crew'), async (_req, res) => {
    res.json({ hull: await hullArchive(accessOf(res), false) });
  });

  router.post('/api/hulls/:hullId/copy', hullAccess('edit-lines'), async (req, res) => {
    const input = parseInput(copyHullSchema, req.body);
    res.status(201).json({ hull: await hullCopy(accessOf(res), req.user!.id, input.name, input.plan as Plan | undefined) });
  });

  // The hot read: one membership query, then the revision's JSON from the cache, sent as it is.
  router.get('/api/hulls/:hullId/plan', hullAccess('read'), async (req, res) => {
    const { hullId, latestRevisionId, units } = accessOf(res);
    res.set('ETag', `"${latestRevisionId ?? 0}"`).set('Cache-Control', 'private, no-cache');
    if (req.fresh) return void res.status(304).end();
    res.type('application/json').send(await planResponseJson(hullId, latestRevisionId, units));
  });

  router.get('/api/hulls/:hullId/plan/draft', hullAccess('read'), async (req, res) => {
    res.json(await draftGet(accessOf(res).hullId, req.user!.id));
  });

  router.put('/api/hulls/:hullId/plan/draft', hullAccess('edit-lines'), async (req, res) => {
    const input = parseInput(saveDraftSchema, req.body);
    const access = accessOf(res);
    res.json({ draft: await draftPut({ ...access, userId: req.user!.id, baseRevisionId: input.baseRevisionId, plan: input.plan }) });
  });

  router.delete('/api/hulls/:hullId/plan/draft', hullAccess('edit-lines'), async (req, res) => {
    await draftDelete(accessOf(res).hullId, req.user!.id);
    res.status(204).end();
  });

  router.get('/api/hulls/:hullId/plan/revisions', hullAccess('read'), async (_req, res) => {
    res.json({ revisions: await revisionList(accessOf(res).hullId) });
  });

  router.post('/api/hulls/:hullId/plan/revisions', hullAccess('edit-lines'), async (req, res) => {
    const input = parseInput(savePlanSchema, req.body);
    const access = accessOf(res);
    const saved = await revisionSave({ ...access, authorId: req.user!.id, baseRevisionId: input.baseRevisionId, plan: input.plan, summary: input.summary });
    res.status(201).set('ETag', `"${saved.revision.id}"`).json(saved);
  });

  router.get('/api/hulls/:hullId/plan/revisions/:revisionId', hullAccess('read'), async (req, res) => {
    const revisionId = idParam(req.params.revisionId, 'revision');
    const { metaJson, planJson } = await revisionCached(accessOf(res).hullId, revisionId);
    res.set('ETag', `"${revisionId}"`).type('application/json').send(`{"revision":${metaJson},"plan":${planJson}}`);
  });

  router.post('/api/hulls/:hullId/plan/revisions/:revisionId/restore', hullAccess('edit-lines'), async (req, res) => {
    const { baseRevisionId } = parseInput(restoreRevisionSchema, req.body);
    const access = accessOf(res);
    const saved = await revisionRestore({ ...access, authorId: req.user!.id, baseRevisionId, revisionId: idParam(req.params.revisionId, 'revision') });
    res.status(201).json(saved);
  });

  router.get('/api/hulls/:hullId/plan/compare', hullAccess('read'), async (req, res) => {
    const from = idParam(String(req.query.from ?? ''), 'revision');
    const to = idParam(String(req.query.to ?? ''), 'revision');
    res.json({ from, to, changes: await revisionCompare(accessOf(res).hullId, from, to, accessOf(res).units) });
  });

  router.post('/api/hulls/:hullId/plan/import/offsets', hullAccess('edit-lines'), async (req, res) => {
    await new Promise<void>((resolve, reject) =>
      csvUpload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
          return reject(new AppError(413, 'file_too_large', `The file is larger than ${OFFSETS_CSV_MAX_BYTES / 1024 / 1024} MB; a table of offsets is far smaller. Nothing was imported.`, 'file'));
        }
        if (err instanceof multer.MulterError) return reject(new AppError(400, 'bad_upload', `Upload refused: ${err.message}`, err.field ?? 'file'));
        if (err) return reject(err);
        resolve();
      }),
    );
    if (!req.file) throw new AppError(400, 'no_file', 'Choose a CSV file of offsets to import', 'file');
    const fields = parseInput(importOffsetsFieldsSchema, req.body);
    const access = accessOf(res);
    const base = JSON.parse(await planResponseJson(access.hullId, fields.baseRevisionId, access.units)).plan as Plan;
    const notation = notationSchema.parse({ ...base.lines.notation, unit: fields.unit, decimalComma: fields.decimalComma, sixteenthMarks: fields.sixteenthMarks });
    const table = offsetsFromCsv(req.file.buffer, notation, base.lines);
    const plan = planValidated({ ...base, lines: { ...base.lines, stations: table.stations, lines: table.lines, notation: base.lines.stations.length ? base.lines.notation : notation } });
    const summary = `Imported offsets from ${req.file.originalname} (${table.lines.length} lines, ${table.stations.length} stations)`;
    const saved = await revisionSave({ ...access, authorId: req.user!.id, baseRevisionId: fields.baseRevisionId, plan, summary });
    res.status(201).json(saved);
  });

  router.post('/api/hulls/:hullId/plan/import/json', hullAccess('edit-lines'), async (req, res) => {
    const input = parseInput(importPlanJsonSchema, req.body);
    const read = planRead(input.document);
    if (!read.ok) throw new AppError(400, 'invalid_plan', `Nothing was imported: ${read.issues[0].field}: ${read.issues[0].message}`, `document.${read.issues[0].field}`, true, { issues: read.issues });
    const access = accessOf(res);
    const saved = await revisionSave({ ...access, authorId: req.user!.id, baseRevisionId: input.baseRevisionId, plan: read.plan, summary: 'Imported a plan from JSON' });
    res.status(201).json(saved);
  });

  router.get('/api/hulls/:hullId/plan/export/offsets.csv', hullAccess('export'), async (req, res) => {
    const { hullId, latestRevisionId, units } = accessOf(res);
    const plan = JSON.parse(await planResponseJson(hullId, latestRevisionId, units)).plan as Plan;
    const unit = req.query.unit === 'ftin' || req.query.unit === 'in' ? req.query.unit : plan.lines.notation.unit;
    const notation = notationSchema.parse({ ...plan.lines.notation, unit, precision: unit === 'mm' ? '0.1mm' : '1/32in' });
    res.type('text/csv; charset=utf-8').attachment(`hull-${hullId}-offsets-r${latestRevisionId ?? 0}.csv`).send(offsetsToCsv(plan.lines, notation));
  });

  router.get('/api/hulls/:hullId/plan/export/plan.json', hullAccess('export'), async (_req, res) => {
    const { hullId, latestRevisionId, units } = accessOf(res);
    const body = JSON.parse(await planResponseJson(hullId, latestRevisionId, units));
    res.attachment(`hull-${hullId}-plan-r${latestRevisionId ?? 0}.json`).json(body.plan);
  });
}
