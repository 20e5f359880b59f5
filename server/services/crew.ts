import type { CrewMember, Role } from '../../shared/api/hulls';
import { AppError, notFound } from '../errors';
import { HullMember, User } from '../models';
import { userByEmail } from './users';

type MemberWithUser = HullMember & { user: User };

const toCrewMember = (m: MemberWithUser): CrewMember => ({ userId: m.userId, email: m.user.email, displayName: m.user.displayName, role: m.role });

/** The crew of a hull, owners first, then by name. */
export async function crewOf(hullId: number): Promise<CrewMember[]> {
  const rows = (await HullMember.findAll({ where: { hullId }, include: [{ model: User, as: 'user', required: true }] })) as MemberWithUser[];
  const order: Record<Role, number> = { owner: 0, builder: 1, designer: 2, helper: 3 };
  return rows.map(toCrewMember).sort((a, b) => order[a.role] - order[b.role] || a.displayName.localeCompare(b.displayName));
}

/** Add an existing account to the crew by e-mail. */
export async function crewAdd(hullId: number, email: string, role: Role): Promise<CrewMember> {
  const user = await userByEmail(email);
  if (!user) throw new AppError(404, 'no_such_account', 'Nobody has a Loftbench account with this e-mail address', 'email');
  const [member, created] = await HullMember.findOrCreate({ where: { hullId, userId: user.id }, defaults: { hullId, userId: user.id, role } });
  if (!created) throw new AppError(409, 'already_member', `${user.displayName} is on this crew already (as ${member.role})`, 'email');
  return { userId: user.id, email: user.email, displayName: user.displayName, role };
}

async function ownersLeftWithout(hullId: number, userId: number): Promise<number> {
  const owners = await HullMember.findAll({ where: { hullId, role: 'owner' }, attributes: ['userId'] });
  return owners.filter((o) => o.userId !== userId).length;
}

/** Change a member's role; the last owner cannot stop being one. */
export async function crewChangeRole(hullId: number, userId: number, role: Role): Promise<CrewMember> {
  const sequelize = HullMember.sequelize!;
  return sequelize.transaction(async (transaction) => {
    const member = (await HullMember.findOne({ where: { hullId, userId }, include: [{ model: User, as: 'user' }], transaction, lock: transaction.LOCK.UPDATE })) as MemberWithUser | null;
    if (!member) throw notFound('That person is not on this crew');
    if (member.role === 'owner' && role !== 'owner' && (await ownersLeftWithout(hullId, userId)) === 0) {
      throw new AppError(409, 'last_owner', 'A hull needs at least one owner: make someone else owner first', 'role');
    }
    await member.update({ role }, { transaction });
    return toCrewMember(member);
  });
}

/** Take a member off the crew; the last owner cannot be removed. */
export async function crewRemove(hullId: number, userId: number): Promise<void> {
  const member = await HullMember.findOne({ where: { hullId, userId } });
  if (!member) throw notFound('That person is not on this crew');
  if (member.role === 'owner' && (await ownersLeftWithout(hullId, userId)) === 0) {
    throw new AppError(409, 'last_owner', 'A hull needs at least one owner: make someone else owner first');
  }
  await member.destroy();
}
