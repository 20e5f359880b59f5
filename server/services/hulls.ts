import type { Transaction } from 'sequelize';
import type { CreateHullInput, HullSummary, Role } from '../../shared/api/hulls';
import { createHullSchema } from '../../shared/api/hulls';
import { notFound } from '../errors';
import { Hull, HullMember } from '../models';

function toSummary(hull: Hull, role: Role): HullSummary {
  return {
    id: hull.id,
    name: hull.name,
    units: hull.units,
    notes: hull.notes,
    role,
    archived: hull.archivedAt !== null && hull.archivedAt !== undefined,
    createdAt: hull.createdAt.toISOString(),
    updatedAt: hull.updatedAt.toISOString(),
  };
}

/** Create a hull with its creator as owner, in one transaction. */
export async function hullCreate(userId: number, input: CreateHullInput, transaction?: Transaction): Promise<HullSummary> {
  const data = createHullSchema.parse(input);
  const sequelize = Hull.sequelize!;
  const run = async (t: Transaction) => {
    const hull = await Hull.create({ name: data.name, units: data.units, notes: data.notes, createdBy: userId }, { transaction: t });
    await HullMember.create({ hullId: hull.id, userId, role: 'owner' }, { transaction: t });
    return toSummary(hull, 'owner');
  };
  return transaction ? run(transaction) : sequelize.transaction(run);
}

/** The hulls a person is on, newest change first. */
export async function hullsOf(userId: number): Promise<HullSummary[]> {
  const memberships = await HullMember.findAll({
    where: { userId },
    include: [{ model: Hull, as: 'hull', required: true }],
  });
  return memberships
    .map((m) => toSummary((m as HullMember & { hull: Hull }).hull, m.role))
    .sort((a, b) => b.updatedAt.localeCompare(a.updatedAt));
}

/** The person's role on a hull, or null when they are not on its crew (callers answer 404, not 403). */
export async function hullRoleOf(hullId: number, userId: number): Promise<Role | null> {
  const member = await HullMember.findOne({ where: { hullId, userId }, attributes: ['role'] });
  return member?.role ?? null;
}

export async function hullSummary(hullId: number, role: Role): Promise<HullSummary> {
  const hull = await Hull.findByPk(hullId);
  if (!hull) throw notFound('No such hull');
  return toSummary(hull, role);
}
