import { Op, QueryTypes } from 'sequelize';
import type { LibraryKind, Notice } from '../../shared/api/library';
import type { Mailer } from '../mail/mailer';
import { noticeMail } from '../mail/messages';
import { AccountSetting, Hull, HullMember, LibraryItem, LibraryNotice, LibraryPin, LibraryRevision, User } from '../models';
import { itemVisibleTo, type Viewer } from './library-access';
import { normaliseEmail } from './users';
import { notFound } from '../errors';

/** How a publication reaches people by mail: the mailer and where the links in it start. */
export interface NoticeMailing {
  mailer: Mailer;
  linkBase: string;
}

/**
 * A newer revision was published: every hull pinning an older revision of the item tells each of its
 * crew who may see the item (one notice per person and pin, raised again if they had dismissed an older
 * one), and mails those who asked for it. Returns how many notices were raised.
 */
export async function noticesRaise(item: LibraryItem, revision: LibraryRevision, authorName: string, mailing: NoticeMailing): Promise<number> {
  const pins = (await LibraryPin.findAll({
    where: { itemId: item.id, revisionId: { [Op.ne]: revision.id } },
    include: [
      { model: Hull, as: 'hull', attributes: ['name'] },
      { model: LibraryRevision, as: 'revision', attributes: ['number'] },
    ],
  })) as (LibraryPin & { hull: Hull; revision: LibraryRevision })[];
  let raised = 0;
  for (const pin of pins) {
    if (pin.revision.number >= revision.number) continue;
    const crew = (await HullMember.findAll({ where: { hullId: pin.hullId }, include: [{ model: User, as: 'user', attributes: ['id', 'email'] }] })) as (HullMember & { user: User })[];
    for (const member of crew) {
      if (!(await itemVisibleTo(item, { id: member.user.id, email: member.user.email }))) continue;
      await LibraryNotice.sequelize!.query(
        `INSERT INTO library_notices (user_id, pin_id, revision_id, dismissed_at, created_at, updated_at) VALUES (?, ?, ?, NULL, NOW(3), NOW(3))
         ON DUPLICATE KEY UPDATE revision_id = VALUES(revision_id), dismissed_at = NULL, created_at = NOW(3), updated_at = NOW(3)`,
        { replacements: [member.user.id, pin.id, revision.id] },
      );
      raised += 1;
      const settings = await AccountSetting.findByPk(member.user.id);
      if (settings?.noticeMail) {
        mailing.mailer.sendLater(
          noticeMail({ to: member.user.email, hullName: pin.hull.name, itemName: revision.name, authorName, pinnedNumber: pin.revision.number, newNumber: revision.number, link: `${mailing.linkBase}/notices` }),
        );
      }
    }
  }
  return raised;
}

interface NoticeRow {
  id: number;
  created_at: Date;
  pin_id: number;
  hull_id: number;
  hull_name: string;
  item_id: number;
  kind: LibraryKind;
  author_name: string;
  pinned_number: number;
  new_id: number;
  new_number: number;
  new_name: string;
}

/**
 * The person's open notices, newest first: only while they are on the hull's crew, may still see the
 * item, and the hull still pins an older revision than the one the notice is about.
 */
export async function noticesOf(viewer: Viewer): Promise<Notice[]> {
  const rows = await LibraryNotice.sequelize!.query<NoticeRow>(
    `SELECT n.id, n.created_at, p.id AS pin_id, p.hull_id, h.name AS hull_name, p.item_id, i.kind, u.display_name AS author_name,
            pr.number AS pinned_number, nr.id AS new_id, nr.number AS new_number, nr.name AS new_name
       FROM library_notices n
       JOIN library_pins p ON p.id = n.pin_id
       JOIN hulls h ON h.id = p.hull_id
       JOIN hull_members m ON m.hull_id = p.hull_id AND m.user_id = n.user_id
       JOIN library_items i ON i.id = p.item_id
       JOIN users u ON u.id = i.author_id
       JOIN library_revisions pr ON pr.id = p.revision_id
       JOIN library_revisions nr ON nr.id = n.revision_id
      WHERE n.user_id = ? AND n.dismissed_at IS NULL AND nr.number > pr.number
        AND (i.author_id = ? OR i.visibility = 'public'
             OR (i.visibility = 'shared' AND EXISTS (SELECT 1 FROM library_shares s WHERE s.item_id = i.id AND s.email = ?)))
      ORDER BY n.created_at DESC, n.id DESC`,
    { replacements: [viewer.id, viewer.id, normaliseEmail(viewer.email)], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    hullId: r.hull_id,
    hullName: r.hull_name,
    pinId: r.pin_id,
    itemId: r.item_id,
    itemName: r.new_name,
    kind: r.kind,
    authorName: r.author_name,
    pinnedRevisionNumber: r.pinned_number,
    newRevisionId: r.new_id,
    newRevisionNumber: r.new_number,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}

/** Stay on the pinned revision: the notice goes away (until an even newer revision is published). */
export async function noticeDismiss(userId: number, noticeId: number): Promise<void> {
  const [count] = await LibraryNotice.update({ dismissedAt: new Date() }, { where: { id: noticeId, userId, dismissedAt: null } });
  if (count !== 1) throw notFound('No such notice');
}

/** The hull moved (or took another item): its notices about this pin are answered for everyone. */
export async function noticesResolve(pinId: number): Promise<void> {
  await LibraryNotice.destroy({ where: { pinId } });
}
