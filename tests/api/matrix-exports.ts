import { arrangementGet } from '../../server/services/cut-list-arrangement';
import { exportJobStart, exportJobStatus } from '../../server/services/export-jobs';
import { exportSourceOf } from '../../server/services/exports';
import type { MatrixFixture, MatrixRow } from './permission-matrix';
import { allCrew, crew } from './matrix-statuses';

/**
 * Rows of the Print shop, Downloads and cut list arrangement routes. Everyone on the crew may export
 * and so read the arrangement; owner and builder may change it (the `edit-parts` capability: which
 * piece is cut from which sheet is the shop's decision); designer and helper read it only.
 */

/** Whose job a cell asks about: the caller's own (a job is only ever visible to the person who started it). */
const callerId = (f: MatrixFixture): number => (f.who === 'anonymous' ? f.people.owner.id : f.people[f.who].id);

/** A finished job of the caller's, made in-process with a tiny file (what the job makes is tested in exports-jobs.test.ts). */
async function jobMade(f: MatrixFixture): Promise<Record<string, unknown>> {
  const owner = { hullId: f.hullId, userId: callerId(f) };
  const job = exportJobStart(owner, { fileName: 'matrix.pdf', unit: 'pages', total: 1 }, async () => ({ name: 'matrix.pdf', type: 'application/pdf', data: Buffer.from('%PDF-1.3\n') }), () => {});
  while (exportJobStatus(owner.hullId, owner.userId, job.id).state === 'running') await new Promise((r) => setImmediate(r));
  return { jobId: job.id };
}

/** The automatic arrangement of the fixture's revision, to save back unchanged. */
async function layoutMade(f: MatrixFixture): Promise<Record<string, unknown>> {
  const got = await arrangementGet(f.hullId, await exportSourceOf(f.hullId, f.revisionId, 'mm'));
  return { layout: got.layout };
}

export const exportsMatrix: Record<string, MatrixRow> = {
  'GET /api/hulls/:hullId/exports': { path: (f) => `/api/hulls/${f.hullId}/exports`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/parts/:partId/drawing': { path: (f) => `/api/hulls/${f.hullId}/exports/parts/pt-transom/drawing?layer=1`, expect: crew(200, allCrew) },
  'POST /api/hulls/:hullId/exports/jobs': {
    path: (f) => `/api/hulls/${f.hullId}/exports/jobs`,
    body: () => ({ kind: 'tiled-pdf', partId: 'pt-transom', query: { paper: 'a3' } }),
    expect: crew(202, allCrew),
  },
  'GET /api/hulls/:hullId/exports/jobs/:jobId': { path: (f) => `/api/hulls/${f.hullId}/exports/jobs/${f.prepared.jobId as string}`, prepare: jobMade, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/jobs/:jobId/file': { path: (f) => `/api/hulls/${f.hullId}/exports/jobs/${f.prepared.jobId as string}/file`, prepare: jobMade, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/cut-list/arrangement': { path: (f) => `/api/hulls/${f.hullId}/cut-list/arrangement`, expect: crew(200, allCrew) },
  'PUT /api/hulls/:hullId/cut-list/arrangement': {
    path: (f) => `/api/hulls/${f.hullId}/cut-list/arrangement`,
    prepare: layoutMade,
    body: (f) => ({ revisionId: f.revisionId, layout: f.prepared.layout }),
    expect: crew(200, ['owner', 'builder']),
  },
  'DELETE /api/hulls/:hullId/cut-list/arrangement': { path: (f) => `/api/hulls/${f.hullId}/cut-list/arrangement`, expect: crew(200, ['owner', 'builder']) },
};
