import { demoPlan } from '../../server/seed/demo-plan';
import { allCrew, crew, editors, everyone, signedInOnly, type Caller } from './matrix-statuses';
import { collaborationMatrix } from './matrix-collaboration';
import { buildLogMatrix } from './matrix-build-log';
import { exportsMatrix } from './matrix-exports';

/**
 * The permission matrix: one row for every route of the app, with the status each kind of caller gets.
 * permission-matrix.test.ts reads the app's routes from Express's router and fails when a route has no
 * row here (or a row names a route that no longer exists), then exercises every cell on the real server.
 */
export { callers, type Caller } from './matrix-statuses';

/** What a row's request needs: a fresh hull with a full crew, and a spare account to add to it. */
export interface MatrixFixture {
  hullId: number;
  /** The hull's one saved revision (the demo plan). */
  revisionId: number;
  helperUserId: number;
  spareEmail: string;
  caller: { email: string; password: string } | null;
  /** Which caller the cell is for, and every signed-in person of the matrix (rows that need another's id). */
  who: Caller;
  people: Record<Exclude<Caller, 'anonymous'>, { id: number; email: string }>;
  /** What the row's `prepare` made for this cell (ids, tokens); empty without one. */
  prepared: Record<string, unknown>;
}

export interface MatrixRow {
  /** Path with real values filled in. */
  path: (f: MatrixFixture) => string;
  body?: (f: MatrixFixture) => unknown;
  expect: Record<Caller, number>;
  /** The request changes who the session belongs to (sign-in, sign-up, sign-out): use a fresh session. */
  freshSession?: boolean;
  /** Multipart upload: fields and files to attach instead of a JSON body. */
  multipart?: (f: MatrixFixture) => { fields?: Record<string, string>; files?: { field: string; name: string; content: Buffer }[] };
  /** Make what the request needs (a Library item, a pin, a token) for this cell, before it is sent. */
  prepare?: (f: MatrixFixture) => Promise<Record<string, unknown>>;
}

/** A change to the lines only, which owner, builder and designer may all make. */
function linesChanged() {
  const plan = demoPlan();
  const keel = plan.lines.lines.find((l) => l.id === 'ln-keel')!;
  (keel.cells as Record<string, { y: number; z: number }>)['st-4'] = { y: 0, z: 44 };
  return plan;
}
const offsetsCsv = 'line,kind,fixed,angle,knuckle,A,B\nStation position,x,,,,0,600\nWL 200,waterline,200,,,300,350\n';

let counter = 0;
const freshEmail = () => `matrix-${Date.now()}-${(counter += 1)}@example.test`;

export const matrix: Record<string, MatrixRow> = {
  'GET /api/health': { path: () => '/api/health', expect: everyone(200) },
  'GET /api/session': { path: () => '/api/session', expect: everyone(200) },
  'POST /api/auth/sign-up': {
    path: () => '/api/auth/sign-up',
    body: () => ({ email: freshEmail(), displayName: 'Matrix', password: 'matrix password' }),
    expect: everyone(201),
    freshSession: true,
  },
  'POST /api/auth/sign-in': {
    path: () => '/api/auth/sign-in',
    // Anonymous callers sign in as the spare account; members sign in again as themselves.
    body: (f) => (f.caller ? { email: f.caller.email, password: f.caller.password } : { email: f.spareEmail, password: 'correct horse battery' }),
    expect: everyone(200),
    freshSession: true,
  },
  'POST /api/auth/sign-out': { path: () => '/api/auth/sign-out', expect: everyone(204), freshSession: true },
  'GET /api/hulls': { path: () => '/api/hulls', expect: signedInOnly(200) },
  'POST /api/hulls': { path: () => '/api/hulls', body: () => ({ name: 'Matrix hull', units: 'mm' }), expect: signedInOnly(201) },
  'GET /api/hulls/:hullId': { path: (f) => `/api/hulls/${f.hullId}`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/crew': { path: (f) => `/api/hulls/${f.hullId}/crew`, expect: crew(200, allCrew) },
  'POST /api/hulls/:hullId/crew': {
    path: (f) => `/api/hulls/${f.hullId}/crew`,
    body: (f) => ({ email: f.spareEmail, role: 'helper' }),
    expect: crew(201, ['owner']),
  },
  'PATCH /api/hulls/:hullId/crew/:userId': {
    path: (f) => `/api/hulls/${f.hullId}/crew/${f.helperUserId}`,
    body: () => ({ role: 'builder' }),
    expect: crew(200, ['owner']),
  },
  'DELETE /api/hulls/:hullId/crew/:userId': { path: (f) => `/api/hulls/${f.hullId}/crew/${f.helperUserId}`, expect: crew(204, ['owner']) },

  'PATCH /api/hulls/:hullId': { path: (f) => `/api/hulls/${f.hullId}`, body: () => ({ name: 'Renamed' }), expect: crew(200, ['owner', 'builder']) },
  'POST /api/hulls/:hullId/archive': { path: (f) => `/api/hulls/${f.hullId}/archive`, expect: crew(200, ['owner']) },
  'POST /api/hulls/:hullId/unarchive': { path: (f) => `/api/hulls/${f.hullId}/unarchive`, expect: crew(200, ['owner']) },
  'POST /api/hulls/:hullId/copy': { path: (f) => `/api/hulls/${f.hullId}/copy`, body: () => ({ name: 'My copy' }), expect: crew(201, editors) },
  'GET /api/hulls/:hullId/plan': { path: (f) => `/api/hulls/${f.hullId}/plan`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/plan/draft': { path: (f) => `/api/hulls/${f.hullId}/plan/draft`, expect: crew(200, allCrew) },
  'PUT /api/hulls/:hullId/plan/draft': {
    path: (f) => `/api/hulls/${f.hullId}/plan/draft`,
    body: (f) => ({ baseRevisionId: f.revisionId, plan: linesChanged() }),
    expect: crew(200, editors),
  },
  'DELETE /api/hulls/:hullId/plan/draft': { path: (f) => `/api/hulls/${f.hullId}/plan/draft`, expect: crew(204, editors) },
  'GET /api/hulls/:hullId/plan/revisions': { path: (f) => `/api/hulls/${f.hullId}/plan/revisions`, expect: crew(200, allCrew) },
  'POST /api/hulls/:hullId/plan/revisions': {
    path: (f) => `/api/hulls/${f.hullId}/plan/revisions`,
    body: (f) => ({ baseRevisionId: f.revisionId, plan: linesChanged() }),
    expect: crew(201, editors),
  },
  'GET /api/hulls/:hullId/plan/revisions/:revisionId': { path: (f) => `/api/hulls/${f.hullId}/plan/revisions/${f.revisionId}`, expect: crew(200, allCrew) },
  'POST /api/hulls/:hullId/plan/revisions/:revisionId/restore': {
    path: (f) => `/api/hulls/${f.hullId}/plan/revisions/${f.revisionId}/restore`,
    body: (f) => ({ baseRevisionId: f.revisionId }),
    expect: crew(201, editors),
  },
  'GET /api/hulls/:hullId/plan/compare': { path: (f) => `/api/hulls/${f.hullId}/plan/compare?from=${f.revisionId}&to=${f.revisionId}`, expect: crew(200, allCrew) },
  'POST /api/hulls/:hullId/plan/import/offsets': {
    path: (f) => `/api/hulls/${f.hullId}/plan/import/offsets`,
    multipart: (f) => ({ fields: { baseRevisionId: String(f.revisionId), unit: 'mm' }, files: [{ field: 'file', name: 'offsets.csv', content: Buffer.from(offsetsCsv) }] }),
    expect: crew(201, editors),
  },
  'POST /api/hulls/:hullId/plan/import/json': {
    path: (f) => `/api/hulls/${f.hullId}/plan/import/json`,
    body: (f) => ({ baseRevisionId: f.revisionId, document: linesChanged() }),
    expect: crew(201, editors),
  },
  'GET /api/hulls/:hullId/plan/export/offsets.csv': { path: (f) => `/api/hulls/${f.hullId}/plan/export/offsets.csv`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/parts': { path: (f) => `/api/hulls/${f.hullId}/parts`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/parts/:partId': { path: (f) => `/api/hulls/${f.hullId}/parts/pt-frame-3`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/parts/:partId/template.pdf': { path: (f) => `/api/hulls/${f.hullId}/exports/parts/pt-bulkhead-5/template.pdf?paper=a3`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/parts/:partId/roll.pdf': { path: (f) => `/api/hulls/${f.hullId}/exports/parts/pt-bulkhead-5/roll.pdf`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/parts/:partId/template.dxf': { path: (f) => `/api/hulls/${f.hullId}/exports/parts/pt-frame-3/template.dxf`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/hull.dxf': { path: (f) => `/api/hulls/${f.hullId}/exports/hull.dxf?units=in`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/bevels.csv': { path: (f) => `/api/hulls/${f.hullId}/exports/bevels.csv`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/bevels.pdf': { path: (f) => `/api/hulls/${f.hullId}/exports/bevels.pdf`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/cut-list.csv': { path: (f) => `/api/hulls/${f.hullId}/exports/cut-list.csv`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/cut-list.pdf': { path: (f) => `/api/hulls/${f.hullId}/exports/cut-list.pdf`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/exports/all.zip': { path: (f) => `/api/hulls/${f.hullId}/exports/all.zip`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/plan/export/plan.json': { path: (f) => `/api/hulls/${f.hullId}/plan/export/plan.json`, expect: crew(200, allCrew) },
  ...collaborationMatrix,
  ...buildLogMatrix,
  ...exportsMatrix,
};
