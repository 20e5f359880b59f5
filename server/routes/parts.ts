import type { Router } from 'express';
import { notFound } from '../errors';
import { accessOf, hullAccess } from '../http/hull-access';
import { partResult, partsSummary } from '../services/parts';

/** `?revision=N` asks for the parts of an older revision; without it, the latest. */
function revisionOf(query: unknown, latest: number | null): number | null {
  const raw = (query as { revision?: unknown }).revision;
  if (raw === undefined) return latest;
  const id = Number(raw);
  if (!Number.isSafeInteger(id) || id <= 0) throw notFound('No such revision');
  return id;
}

export function registerPartRoutes(router: Router) {
  router.get('/api/hulls/:hullId/parts', hullAccess('read'), async (req, res) => {
    const { hullId, latestRevisionId, units } = accessOf(res);
    res.json(await partsSummary(hullId, revisionOf(req.query, latestRevisionId), units));
  });

  router.get('/api/hulls/:hullId/parts/:partId', hullAccess('read'), async (req, res) => {
    const { hullId, latestRevisionId, units } = accessOf(res);
    const revisionId = revisionOf(req.query, latestRevisionId);
    res.json({ revisionId, result: await partResult(hullId, revisionId, units, String(req.params.partId)) });
  });
}
