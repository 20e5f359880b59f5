import { QueryTypes, type Transaction } from 'sequelize';
import type { LibraryDocument, LibraryKind, LibraryRevisionSummary } from '../../shared/api/library';
import { camberSchema } from '../../shared/geometry/camber-schema';
import { camberIssues } from '../../shared/geometry/camber';
import { hullLinesSchema } from '../../shared/geometry/hull-schema';
import { hullIssues } from '../../shared/geometry/hull';
import type { GeometryIssue } from '../../shared/geometry/types';
import { AppError, notFound } from '../errors';
import { LibraryItem, LibraryRevision, LibraryShare } from '../models';
import { normaliseEmail } from './users';

/** The person asking: the Library decides what they see by account and by e-mail (shares are by e-mail). */
export interface Viewer {
  id: number;
  email: string;
}

export const noSuchItem = () => notFound('No such item in the Library');

/** Whether the viewer may see the item: its author, anyone when public, the named people when shared. */
export async function itemVisibleTo(item: LibraryItem, viewer: Viewer, transaction?: Transaction): Promise<boolean> {
  if (item.authorId === viewer.id || item.visibility === 'public') return true;
  if (item.visibility !== 'shared') return false;
  return (await LibraryShare.count({ where: { itemId: item.id, email: normaliseEmail(viewer.email) }, transaction })) > 0;
}

/** The item if the viewer may see it; otherwise 404, as if it did not exist (private items are invisible). */
export async function itemForViewer(itemId: number, viewer: Viewer, transaction?: Transaction): Promise<LibraryItem> {
  const item = await LibraryItem.findByPk(itemId, { transaction });
  if (!item || !(await itemVisibleTo(item, viewer, transaction))) throw noSuchItem();
  return item;
}

/** The item if the viewer wrote it; 404 when they cannot see it, 403 when they can but did not write it. */
export async function itemForAuthor(itemId: number, viewer: Viewer, transaction?: Transaction): Promise<LibraryItem> {
  const item = await itemForViewer(itemId, viewer, transaction);
  if (item.authorId !== viewer.id) throw new AppError(403, 'not_author', 'Only its author can publish revisions of this item or change who sees it');
  return item;
}

export const revisionSummaryOf = (r: LibraryRevision): LibraryRevisionSummary => ({
  id: r.id,
  itemId: r.itemId,
  number: r.number,
  name: r.name,
  notes: r.notes,
  rules: r.rules,
  createdAt: r.createdAt.toISOString(),
});

/** One revision of the item (404 when it is another item's). */
export async function revisionOfItem(item: LibraryItem, revisionId: number, transaction?: Transaction): Promise<LibraryRevision> {
  const revision = await LibraryRevision.findOne({ where: { id: revisionId, itemId: item.id }, transaction });
  if (!revision) throw notFound('No such revision of this item');
  return revision;
}

/** A stored document, validated on the way out as on the way in. */
export function documentOf(kind: LibraryKind, json: string): LibraryDocument {
  const schema = kind === 'camber' ? camberSchema : hullLinesSchema;
  const parsed = schema.safeParse(JSON.parse(json));
  if (!parsed.success) throw new AppError(500, 'corrupt_library_revision', 'A stored Library revision does not validate', undefined, false);
  return parsed.data;
}

function issuePath(prefix: string, issue: GeometryIssue): string {
  const where = issue.lineId ? `lines.${issue.lineId}` : issue.stationId ? `stations.${issue.stationId}` : '';
  return [prefix, where, issue.field ?? ''].filter(Boolean).join('.');
}

/**
 * A document that passed its schema can still be unusable (a custom camber not starting at the full
 * crown, a table with one station, an unfair knot of lines): refuse it with every issue, each at its path.
 */
export function assertDocumentUsable(kind: LibraryKind, document: LibraryDocument, prefix: string): void {
  const issues = kind === 'camber' ? camberIssues(document as ReturnType<typeof camberSchema.parse>) : hullIssues(document);
  if (issues.length === 0) return;
  const list = issues.map((i) => ({ field: issuePath(prefix, i), message: i.message }));
  throw new AppError(400, 'invalid_document', `${list[0]!.field}: ${list[0]!.message}`, list[0]!.field, true, { issues: list });
}

/** How many revisions the item has. */
export async function revisionCountOf(itemId: number, transaction?: Transaction): Promise<number> {
  const [row] = await LibraryRevision.sequelize!.query<{ n: number }>('SELECT COUNT(*) AS n FROM library_revisions WHERE item_id = ?', {
    replacements: [itemId],
    type: QueryTypes.SELECT,
    transaction,
  });
  return Number(row?.n ?? 0);
}
