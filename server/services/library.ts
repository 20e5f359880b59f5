import { QueryTypes } from 'sequelize';
import type { LibraryDocument, LibraryItemDetail, LibraryItemSummary, LibraryKind, LibraryRevision as LibraryRevisionBody, LibraryRevisionSummary, PublishItemInput, Visibility } from '../../shared/api/library';
import { publishItemSchema, sharingSchema } from '../../shared/api/library';
import { AppError } from '../errors';
import { LibraryItem, LibraryRevision, LibraryShare, User } from '../models';
import { assertDocumentUsable, documentOf, itemForAuthor, itemForViewer, revisionCountOf, revisionOfItem, revisionSummaryOf, type Viewer } from './library-access';
import { noticesRaise, type NoticeMailing } from './notices';
import { normaliseEmail } from './users';

interface ItemRow {
  id: number;
  kind: LibraryKind;
  visibility: Visibility;
  author_id: number;
  author_name: string;
  updated_at: Date;
  revision_count: number;
  r_id: number;
  r_number: number;
  r_name: string;
  r_notes: string;
  r_rules: string;
  r_created_at: Date;
}

const ITEM_SELECT = `
  SELECT i.id, i.kind, i.visibility, i.author_id, u.display_name AS author_name, i.updated_at,
         (SELECT COUNT(*) FROM library_revisions c WHERE c.item_id = i.id) AS revision_count,
         r.id AS r_id, r.number AS r_number, r.name AS r_name, r.notes AS r_notes, r.rules AS r_rules, r.created_at AS r_created_at
    FROM library_items i
    JOIN users u ON u.id = i.author_id
    JOIN library_revisions r ON r.id = i.latest_revision_id`;

function toSummary(row: ItemRow, viewer: Viewer): LibraryItemSummary {
  return {
    id: row.id,
    kind: row.kind,
    visibility: row.visibility,
    authorId: row.author_id,
    authorName: row.author_name,
    mine: row.author_id === viewer.id,
    latest: { id: row.r_id, itemId: row.id, number: row.r_number, name: row.r_name, notes: row.r_notes, rules: row.r_rules, createdAt: new Date(row.r_created_at).toISOString() },
    revisionCount: Number(row.revision_count),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

/** Everything in the Library the viewer may see: their own, what is shared with their e-mail, what is public. Newest change first. */
export async function libraryList(viewer: Viewer): Promise<LibraryItemSummary[]> {
  const rows = await LibraryItem.sequelize!.query<ItemRow>(
    `${ITEM_SELECT}
      WHERE i.author_id = ? OR i.visibility = 'public'
         OR (i.visibility = 'shared' AND EXISTS (SELECT 1 FROM library_shares s WHERE s.item_id = i.id AND s.email = ?))
      ORDER BY i.updated_at DESC, i.id DESC`,
    { replacements: [viewer.id, normaliseEmail(viewer.email)], type: QueryTypes.SELECT },
  );
  return rows.map((r) => toSummary(r, viewer));
}

async function summaryOf(itemId: number, viewer: Viewer): Promise<LibraryItemSummary> {
  const [row] = await LibraryItem.sequelize!.query<ItemRow>(`${ITEM_SELECT} WHERE i.id = ?`, { replacements: [itemId], type: QueryTypes.SELECT });
  return toSummary(row!, viewer);
}

/** Publish a new item with its first revision. */
export async function libraryPublish(viewer: Viewer, input: PublishItemInput): Promise<LibraryItemDetail> {
  const data = publishItemSchema.parse(input);
  assertDocumentUsable(data.kind, data.revision.document, 'revision.document');
  const itemId = await LibraryItem.sequelize!.transaction(async (transaction) => {
    const item = await LibraryItem.create({ authorId: viewer.id, kind: data.kind, visibility: data.sharing.visibility }, { transaction });
    const revision = await LibraryRevision.create(
      { itemId: item.id, number: 1, name: data.revision.name, notes: data.revision.notes, rules: data.revision.rules, documentJson: JSON.stringify(data.revision.document) },
      { transaction },
    );
    await item.update({ latestRevisionId: revision.id }, { transaction });
    if (data.sharing.shareWith.length) await LibraryShare.bulkCreate(data.sharing.shareWith.map((email) => ({ itemId: item.id, email })), { transaction });
    return item.id;
  });
  return libraryDetail(viewer, itemId);
}

/** One item with its revisions, newest first, and the latest revision's curve or lines. */
export async function libraryDetail(viewer: Viewer, itemId: number): Promise<LibraryItemDetail> {
  const item = await itemForViewer(itemId, viewer);
  const [summary, revisions, shares] = await Promise.all([
    summaryOf(item.id, viewer),
    LibraryRevision.findAll({ where: { itemId: item.id }, order: [['number', 'DESC']] }),
    item.authorId === viewer.id ? LibraryShare.findAll({ where: { itemId: item.id }, order: [['email', 'ASC']] }) : Promise.resolve(null),
  ]);
  const latest = revisions[0]!;
  return {
    ...summary,
    revisions: revisions.map(revisionSummaryOf),
    latestDocument: documentOf(item.kind, latest.documentJson),
    shareWith: shares ? shares.map((s) => s.email) : null,
  };
}

/** One revision with its document. */
export async function libraryRevisionGet(viewer: Viewer, itemId: number, revisionId: number): Promise<LibraryRevisionBody> {
  const item = await itemForViewer(itemId, viewer);
  const revision = await revisionOfItem(item, revisionId);
  return { ...revisionSummaryOf(revision), kind: item.kind, document: documentOf(item.kind, revision.documentJson) };
}

export interface ReviseRequest {
  baseRevisionId: number;
  name: string;
  notes: string;
  rules: string;
  document: LibraryDocument;
}

/**
 * Publish a new revision on top of `baseRevisionId`. The item row is locked, so of two publications from
 * one base exactly one is made and the other is 409 with the latest. Earlier revisions stay as they were.
 * Then every hull that pins an older revision raises a notice for its crew.
 */
export async function libraryRevise(viewer: Viewer, itemId: number, input: ReviseRequest, mailing: NoticeMailing): Promise<{ revision: LibraryRevisionSummary; noticesRaised: number }> {
  const revision = await LibraryItem.sequelize!.transaction(async (transaction) => {
    const item = await itemForAuthor(itemId, viewer, transaction);
    const [locked] = await LibraryItem.sequelize!.query<{ latest_revision_id: number }>('SELECT latest_revision_id FROM library_items WHERE id = ? FOR UPDATE', {
      replacements: [item.id],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (locked?.latest_revision_id !== input.baseRevisionId) {
      const latest = await LibraryRevision.findByPk(locked!.latest_revision_id, { transaction });
      throw new AppError(409, 'stale_revision', 'A newer revision of this item was published since you opened it. Reload it and make your change again.', 'baseRevisionId', true, {
        latestRevisionId: latest?.id ?? null,
        latestRevision: latest ? revisionSummaryOf(latest) : null,
      });
    }
    assertDocumentUsable(item.kind, input.document, 'document');
    const number = (await revisionCountOf(item.id, transaction)) + 1;
    const created = await LibraryRevision.create(
      { itemId: item.id, number, name: input.name, notes: input.notes, rules: input.rules, documentJson: JSON.stringify(input.document) },
      { transaction },
    );
    await item.update({ latestRevisionId: created.id, updatedAt: new Date() }, { transaction });
    return created;
  });
  const item = (await LibraryItem.findByPk(itemId))!;
  const author = await User.findByPk(viewer.id, { attributes: ['displayName'] });
  const noticesRaised = await noticesRaise(item, revision, author?.displayName ?? '', mailing);
  return { revision: revisionSummaryOf(revision), noticesRaised };
}

/** Change who may see an item. Revisions are untouched. */
export async function librarySharingUpdate(viewer: Viewer, itemId: number, sharing: unknown): Promise<LibraryItemDetail> {
  const data = sharingSchema.parse(sharing);
  await LibraryItem.sequelize!.transaction(async (transaction) => {
    const item = await itemForAuthor(itemId, viewer, transaction);
    await item.update({ visibility: data.visibility, updatedAt: new Date() }, { transaction });
    await LibraryShare.destroy({ where: { itemId: item.id }, transaction });
    if (data.shareWith.length) await LibraryShare.bulkCreate(data.shareWith.map((email) => ({ itemId: item.id, email })), { transaction });
  });
  return libraryDetail(viewer, itemId);
}
