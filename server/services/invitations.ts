import { Op, type Transaction } from 'sequelize';
import type { AcceptInvitationResponse, InvitationPreview, InvitationSummary } from '../../shared/api/collaboration';
import type { Role } from '../../shared/api/hulls';
import { AppError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { invitationMail } from '../mail/messages';
import { Hull, HullMember, Invitation, User } from '../models';
import { mailTokenHash, mailTokenNew } from './mail-tokens';
import { normaliseEmail, userCreate, userById, BCRYPT_COST } from './users';

type InvitationWithInviter = Invitation & { inviter?: User };

const pendingWhere = () => ({ acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } });

const toSummary = (i: InvitationWithInviter): InvitationSummary => ({
  id: i.id,
  email: i.email,
  role: i.role,
  invitedByName: i.inviter?.displayName ?? '',
  createdAt: i.createdAt.toISOString(),
  expiresAt: i.expiresAt.toISOString(),
});

export interface InvitationCreateRequest {
  hullId: number;
  inviterId: number;
  email: string;
  role: Role;
  /** Where the link in the mail starts (mailLinkBase). */
  linkBase: string;
  ttlMs: number;
  mailer: Mailer;
}

/**
 * Invite someone by e-mail. The mail is sent before the answer; if the mail server refuses it the
 * invitation is taken back, so an owner never sees a pending invitation nobody received. A new
 * invitation to the same address replaces any pending one (its link stops working).
 */
export async function invitationCreate(req: InvitationCreateRequest): Promise<InvitationSummary> {
  const email = normaliseEmail(req.email);
  const existing = await User.findOne({ where: { email }, attributes: ['id', 'displayName'] });
  if (existing && (await HullMember.findOne({ where: { hullId: req.hullId, userId: existing.id } }))) {
    throw new AppError(409, 'already_member', `${existing.displayName} is on this crew already`, 'email');
  }
  const hull = await Hull.findByPk(req.hullId, { attributes: ['name'] });
  const inviter = await User.findByPk(req.inviterId, { attributes: ['displayName'] });
  if (!hull || !inviter) throw notFound('No such hull');

  const { token, hash } = mailTokenNew();
  const expiresAt = new Date(Date.now() + req.ttlMs);
  const invitation = await Invitation.create({ hullId: req.hullId, email, role: req.role, tokenHash: hash, invitedBy: req.inviterId, expiresAt });
  try {
    await req.mailer.send(invitationMail({ to: email, inviterName: inviter.displayName, hullName: hull.name, role: req.role, link: `${req.linkBase}/invitation#${token}`, expiresAt }));
  } catch (err) {
    await invitation.destroy();
    throw err;
  }
  await Invitation.update({ revokedAt: new Date() }, { where: { hullId: req.hullId, email, id: { [Op.ne]: invitation.id }, ...pendingWhere() } });
  return toSummary(Object.assign(invitation, { inviter }) as InvitationWithInviter);
}

/** The hull's invitations still waiting for an answer, newest first. */
export async function invitationsPending(hullId: number): Promise<InvitationSummary[]> {
  const rows = (await Invitation.findAll({
    where: { hullId, ...pendingWhere() },
    include: [{ model: User, as: 'inviter', attributes: ['displayName'] }],
    order: [['id', 'DESC']],
  })) as InvitationWithInviter[];
  return rows.map(toSummary);
}

/** Take back a pending invitation: its link stops working. */
export async function invitationRevoke(hullId: number, invitationId: number): Promise<void> {
  const [count] = await Invitation.update({ revokedAt: new Date() }, { where: { id: invitationId, hullId, ...pendingWhere() } });
  if (count !== 1) throw notFound('No pending invitation with this id on this hull');
}

/** Why a link no longer works, in words for the person holding it. */
function usable(invitation: Invitation | null): Invitation {
  if (!invitation) throw new AppError(404, 'invitation_not_found', 'This invitation link is not valid. Check that you opened the whole link from the e-mail.');
  if (invitation.acceptedAt) throw new AppError(410, 'invitation_used', 'This invitation has been used already. If that was you, sign in and you will find the hull in your list.');
  if (invitation.revokedAt) throw new AppError(410, 'invitation_revoked', 'This invitation was taken back (or replaced by a newer one). Ask the hull’s owner to invite you again.');
  if (invitation.expiresAt.getTime() <= Date.now()) throw new AppError(410, 'invitation_expired', 'This invitation has expired. Ask the hull’s owner to invite you again.');
  return invitation;
}

/** What the link is an invitation to (nothing is changed). */
export async function invitationPreview(token: string): Promise<InvitationPreview> {
  const invitation = usable(await Invitation.findOne({ where: { tokenHash: mailTokenHash(token) } }));
  const [hull, inviter] = await Promise.all([Hull.findByPk(invitation.hullId, { attributes: ['name'] }), User.findByPk(invitation.invitedBy, { attributes: ['displayName'] })]);
  return { hullName: hull?.name ?? '', role: invitation.role, email: invitation.email, invitedByName: inviter?.displayName ?? '', expiresAt: invitation.expiresAt.toISOString() };
}

export interface InvitationAcceptRequest {
  token: string;
  /** The signed-in person, if any: the membership goes to them. */
  userId: number | null;
  /** Signed out: make an account on the invited address. */
  newAccount?: { displayName: string; password: string };
  bcryptCost?: number;
}

/**
 * Accept: in one transaction, with the invitation's row locked so a link works exactly once even when
 * two tabs press at the same moment: make the account if asked, add the membership, mark it used.
 * Returns the account (to sign in when it was just made) and the membership.
 */
export async function invitationAccept(req: InvitationAcceptRequest): Promise<AcceptInvitationResponse & { createdUserId: number | null }> {
  const sequelize = Invitation.sequelize!;
  return sequelize.transaction(async (transaction: Transaction) => {
    const invitation = usable(await Invitation.findOne({ where: { tokenHash: mailTokenHash(req.token) }, transaction, lock: transaction.LOCK.UPDATE }));
    let userId = req.userId;
    let createdUserId: number | null = null;
    if (userId === null) {
      if (!req.newAccount) throw new AppError(401, 'not_signed_in', 'Sign in, or make an account, to accept the invitation');
      const user = await userCreate({ email: invitation.email, displayName: req.newAccount.displayName, password: req.newAccount.password }, req.bcryptCost ?? BCRYPT_COST, transaction).catch((err) => {
        if (err instanceof AppError && err.code === 'email_taken') {
          throw new AppError(409, 'email_taken', 'There is already an account with this e-mail address: sign in with it, then open the link again', 'email');
        }
        throw err;
      });
      userId = user.id;
      createdUserId = user.id;
    } else if (!(await userById(userId))) {
      throw new AppError(401, 'not_signed_in', 'Sign in to continue');
    }
    const member = await HullMember.findOne({ where: { hullId: invitation.hullId, userId }, transaction });
    if (!member) await HullMember.create({ hullId: invitation.hullId, userId, role: invitation.role }, { transaction });
    await invitation.update({ acceptedAt: new Date(), acceptedBy: userId }, { transaction });
    return { hullId: invitation.hullId, role: member?.role ?? invitation.role, alreadyMember: member !== null, createdUserId };
  });
}
