import { promisify } from 'node:util';
import { constants as zlibConstants, gunzip, gzip } from 'node:zlib';
import { QueryTypes, type Transaction } from 'sequelize';
import { connectorTransaction, type WriteResult } from '../db';
import type { Role } from '../../shared/api/hulls';
import type { DraftResponse, RevisionSummary } from '../../shared/api/plan';
import { planCompare, planChangeSummary, type PlanChange } from '../../shared/geometry/plan-compare';
import { planEmpty, planRead } from '../../shared/geometry/plan';
import { PLAN_SCHEMA_VERSION, type Plan } from '../../shared/geometry/plan-schema';
import { AppError, notFound } from '../errors';
import { Hull, PlanDraft, PlanRevision } from '../models';
import { roleMay } from './access';
import { userByIdCached } from './users';
import { revisionCacheGet, revisionCachePut, revisionPlanGet, revisionPlanPut, type CachedRevision } from './revision-cache';

const gzipPromise = promisify(gzip);
/**
 * Plans are stored gzip'd at the fastest level: on a 50 KB plan it takes a third of the default level's time
 * (0.5 against 1.3 ms here) for a stored document about 15 % larger (10.2 against 8.9 KB), and every save and
 * autosave pays it.
 */
const gzipAsync = (json: string) => gzipPromise(json, { level: zlibConstants.Z_BEST_SPEED });
const gunzipAsync = promisify(gunzip);

interface RevisionRow {
  id: number;
  hull_id: number;
  base_revision_id: number | null;
  author_id: number;
  author_name: string;
  summary: string;
  document_gz: Buffer;
  document_bytes: number;
  created_at: Date;
}

const toSummary = (r: RevisionRow): RevisionSummary => ({
  id: r.id,
  hullId: r.hull_id,
  baseRevisionId: r.base_revision_id,
  authorId: r.author_id,
  authorName: r.author_name,
  summary: r.summary,
  createdAt: new Date(r.created_at).toISOString(),
  bytes: r.document_bytes,
});

function sequelize() {
  return PlanRevision.sequelize!;
}

/** A DATETIME(3) literal in UTC, the time zone Sequelize stores and reads dates in. */
const sqlUtc = (d: Date) => d.toISOString().slice(0, 23).replace('T', ' ');

/** Read a stored document: decompress, upgrade if it is of an older schema, validate. */
async function documentOf(gz: Buffer): Promise<{ json: string; plan: Plan }> {
  const json = (await gunzipAsync(gz)).toString('utf8');
  const read = planRead(JSON.parse(json));
  if (!read.ok) throw new AppError(500, 'corrupt_plan', `A stored plan does not validate: ${read.issues[0]?.field} ${read.issues[0]?.message}`, undefined, false);
  return { json: read.upgradedFrom === null ? json : JSON.stringify(read.plan), plan: read.plan };
}

/** One revision of one hull, from the cache or the database; 404 when the id is not this hull's. */
export async function revisionCached(hullId: number, revisionId: number): Promise<CachedRevision> {
  const hit = revisionCacheGet(revisionId);
  if (hit) {
    if ((JSON.parse(hit.metaJson) as RevisionSummary).hullId !== hullId) throw notFound('No such revision of this hull');
    return hit;
  }
  const rows = await sequelize().query<RevisionRow>(
    `SELECT r.id, r.hull_id, r.base_revision_id, r.author_id, u.display_name AS author_name, r.summary, r.document_gz, r.document_bytes, r.created_at
       FROM plan_revisions r JOIN users u ON u.id = r.author_id WHERE r.id = ? AND r.hull_id = ?`,
    { replacements: [revisionId, hullId], type: QueryTypes.SELECT },
  );
  if (!rows[0]) throw notFound('No such revision of this hull');
  const { json } = await documentOf(rows[0].document_gz);
  const entry = { metaJson: JSON.stringify(toSummary(rows[0])), planJson: json };
  revisionCachePut(revisionId, entry);
  return entry;
}

/** The body of GET .../plan for a revision (null: the hull has no saved plan yet), as a JSON string. */
export async function planResponseJson(hullId: number, revisionId: number | null, unit: 'mm' | 'ftin'): Promise<string> {
  if (revisionId === null) return JSON.stringify({ revision: null, plan: planEmpty(unit) });
  const { metaJson, planJson } = await revisionCached(hullId, revisionId);
  // Concatenated rather than re-serialised: the stored JSON is already exactly what goes out.
  return `{"revision":${metaJson},"plan":${planJson}}`;
}

/** A revision's plan, read-only (it may be the shared, frozen copy of the parsed-plan cache). */
async function planOf(hullId: number, revisionId: number | null, unit: 'mm' | 'ftin'): Promise<Readonly<Plan>> {
  if (revisionId === null) return planEmpty(unit);
  // The hull check comes first, on every path: revisionCached answers 404 for another hull's revision.
  const { planJson } = await revisionCached(hullId, revisionId);
  const hit = revisionPlanGet(revisionId) as Plan | undefined;
  if (hit) return hit;
  const plan = JSON.parse(planJson) as Plan;
  revisionPlanPut(revisionId, plan);
  return plan;
}

/** The revisions of a hull, newest first. */
export async function revisionList(hullId: number): Promise<RevisionSummary[]> {
  const rows = await sequelize().query<RevisionRow>(
    `SELECT r.id, r.hull_id, r.base_revision_id, r.author_id, u.display_name AS author_name, r.summary, r.document_bytes, r.created_at
       FROM plan_revisions r JOIN users u ON u.id = r.author_id WHERE r.hull_id = ? ORDER BY r.id DESC`,
    { replacements: [hullId], type: QueryTypes.SELECT },
  );
  return rows.map(toSummary);
}

/** Refuse a change to a half of the plan the role may not edit (DESIGN section 7). */
function assertMayChange(role: Role, changes: readonly PlanChange[]) {
  const touches = { lines: changes.some((c) => c.area === 'lines'), parts: changes.some((c) => c.area === 'parts') };
  if (touches.lines && !roleMay(role, 'edit-lines')) throw new AppError(403, 'lines_not_allowed', `As ${role} you cannot change the lines, offsets or camber`);
  if (touches.parts && !roleMay(role, 'edit-parts')) throw new AppError(403, 'parts_not_allowed', `As ${role} you can change the lines, offsets and camber, but not the parts (frames, layers, longitudinals)`);
}

function staleError(latest: RevisionSummary | null): AppError {
  return new AppError(409, 'stale_revision', 'Someone saved a newer revision of this plan since you opened it. Reload it and reapply your change, or save yours as a copy of the hull.', 'baseRevisionId', true, {
    latestRevisionId: latest?.id ?? null,
    latestRevision: latest,
  });
}

async function latestSummary(hullId: number): Promise<RevisionSummary | null> {
  const hull = await Hull.findByPk(hullId, { attributes: ['latestRevisionId'] });
  if (!hull?.latestRevisionId) return null;
  return JSON.parse((await revisionCached(hullId, hull.latestRevisionId)).metaJson) as RevisionSummary;
}

/** Validate a plan this server built itself (an import), with the field path on failure. */
export function planValidated(candidate: unknown): Plan {
  const read = planRead(candidate);
  if (!read.ok) throw new AppError(400, 'invalid_plan', `plan.${read.issues[0].field}: ${read.issues[0].message}`, `plan.${read.issues[0].field}`, true, { issues: read.issues.map((i) => ({ ...i, field: `plan.${i.field}` })) });
  return read.plan;
}

export interface SaveRequest {
  hullId: number;
  units: 'mm' | 'ftin';
  authorId: number;
  role: Role;
  baseRevisionId: number | null;
  plan: Plan;
  summary?: string;
}

/**
 * Save a plan as a new revision on top of its base. `plan` must already be validated against the schema
 * (the route's parseInput does it for a request body; an import builds its plan through planValidated). The insert and the move of the hull's latest pointer
 * are one transaction, and the move is conditional on the pointer still being the base: of many saves
 * from one base exactly one commits, the others get 409 with the latest revision. Nothing is overwritten.
 */
export async function revisionSave(req: SaveRequest, transaction?: Transaction): Promise<{ revision: RevisionSummary; changes: PlanChange[] }> {
  const plan = req.plan;
  const base = await planOf(req.hullId, req.baseRevisionId, req.units).catch((err) => {
    if (err instanceof AppError && err.status === 404) throw new AppError(400, 'no_such_base', `Revision ${req.baseRevisionId} is not a revision of this hull`, 'baseRevisionId');
    throw err;
  });
  const changes = planCompare(base, plan);
  assertMayChange(req.role, changes);
  const summary = (req.summary?.trim() || planChangeSummary(changes)).slice(0, 500);
  const json = JSON.stringify(plan);
  const documentGz = await gzipAsync(json);

  const documentBytes = Buffer.byteLength(json);
  const author = await userByIdCached(req.authorId);
  // Written by us, in UTC as Sequelize reads it back, so the answer can carry it without reading the row.
  const createdAt = new Date();
  let revision: RevisionSummary;
  try {
    revision = await connectorTransaction(sequelize(), transaction, async (connection) => {
      // Sent together and run in this order on one connection. The hull row is locked first: without it, two
      // saves each take a shared lock on it (the foreign-key check of the insert) and then both want it
      // exclusively for the pointer, a deadlock instead of a clean 409. The pointer moves only if it is still
      // the base; LAST_INSERT_ID() is the revision just inserted on this connection.
      const [locked, inserted, moved] = await Promise.all([
        connection.query('SELECT latest_revision_id FROM hulls WHERE id = ? FOR UPDATE', [req.hullId]) as Promise<{ latest_revision_id: number | null }[]>,
        connection.query(
          'INSERT INTO plan_revisions (hull_id, base_revision_id, author_id, summary, schema_version, document_gz, document_bytes, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
          [req.hullId, req.baseRevisionId, req.authorId, summary, PLAN_SCHEMA_VERSION, documentGz, documentBytes, sqlUtc(createdAt)],
        ) as Promise<WriteResult>,
        connection.query('UPDATE hulls SET latest_revision_id = LAST_INSERT_ID(), updated_at = ? WHERE id = ? AND latest_revision_id <=> ?', [sqlUtc(createdAt), req.hullId, req.baseRevisionId]) as Promise<WriteResult>,
        // The saver's draft is now a revision: gone in the same commit.
        connection.query('DELETE FROM plan_drafts WHERE hull_id = ? AND user_id = ?', [req.hullId, req.authorId]),
      ]);
      if (locked[0]?.latest_revision_id !== req.baseRevisionId || moved.affectedRows !== 1) throw staleError(null);
      return {
        id: Number(inserted.insertId),
        hullId: req.hullId,
        baseRevisionId: req.baseRevisionId,
        authorId: req.authorId,
        authorName: author?.displayName ?? '',
        summary,
        createdAt: createdAt.toISOString(),
        bytes: documentBytes,
      };
    });
  } catch (err) {
    if (err instanceof AppError && err.code === 'stale_revision') throw staleError(await latestSummary(req.hullId));
    throw err;
  }
  // Only after the commit: ids of rolled-back inserts are never reused, but an entry must not precede its row.
  revisionCachePut(revision.id, { metaJson: JSON.stringify(revision), planJson: json });
  // Frozen from here on: the next save from this revision compares against this very object.
  revisionPlanPut(revision.id, plan);
  return { revision, changes };
}

/** Restore an older revision as a new revision on top of the latest (the old one stays as it was). */
export async function revisionRestore(req: Omit<SaveRequest, 'plan' | 'summary'> & { revisionId: number }) {
  const old = JSON.parse((await revisionCached(req.hullId, req.revisionId)).planJson) as Plan;
  return revisionSave({ ...req, plan: old, summary: `Restored revision ${req.revisionId}` });
}

/** The changes from revision `from` to revision `to` of one hull. */
export async function revisionCompare(hullId: number, from: number, to: number, units: 'mm' | 'ftin'): Promise<PlanChange[]> {
  return planCompare(await planOf(hullId, from, units), await planOf(hullId, to, units));
}

/** The person's draft of a hull, if any. */
export async function draftGet(hullId: number, userId: number): Promise<DraftResponse> {
  const draft = await PlanDraft.findOne({ where: { hullId, userId } });
  if (!draft) return { draft: null };
  const { plan } = await documentOf(draft.documentGz);
  return { draft: { baseRevisionId: draft.baseRevisionId, plan, updatedAt: draft.updatedAt.toISOString() } };
}

/** Autosave: replace the person's draft (valid against the schema; geometry may still warn). */
export async function draftPut(req: Omit<SaveRequest, 'summary' | 'authorId'> & { userId: number }): Promise<{ updatedAt: string }> {
  const base = await planOf(req.hullId, req.baseRevisionId, req.units);
  assertMayChange(req.role, planCompare(base, req.plan));
  const documentGz = await gzipAsync(JSON.stringify(req.plan));
  await PlanDraft.upsert({ hullId: req.hullId, userId: req.userId, baseRevisionId: req.baseRevisionId, schemaVersion: PLAN_SCHEMA_VERSION, documentGz, updatedAt: new Date() });
  return { updatedAt: new Date().toISOString() };
}

export async function draftDelete(hullId: number, userId: number) {
  await PlanDraft.destroy({ where: { hullId, userId } });
}
