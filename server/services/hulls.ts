import { type Transaction } from 'sequelize';
import type { CreateHullInput, HullSummary, HullUnits, Role } from '../../shared/api/hulls';
import { createHullSchema } from '../../shared/api/hulls';
import { notFound } from '../errors';
import type { Plan } from '../../shared/geometry/plan-schema';
import { planResponseJson, revisionSave } from './plans';
import { Hull, HullMember } from '../models';
import { selectRows } from '../db';

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

/** What a request on one hull needs to know: the person's role, the hull's units and its latest revision. */
export interface HullMembership {
  role: Role;
  units: HullUnits;
  latestRevisionId: number | null;
}

/**
 * The person's membership of a hull in one query, or null when they are not on its crew (callers answer
 * 404, not 403). The hot read path of the plan needs nothing else from the database.
 */
export async function hullMembershipOf(hullId: number, userId: number): Promise<HullMembership | null> {
  const rows = await selectRows<{ role: Role; units: HullUnits; latest_revision_id: number | null }>(
    Hull.sequelize!,
    'SELECT m.role, h.units, h.latest_revision_id FROM hull_members m JOIN hulls h ON h.id = m.hull_id WHERE m.hull_id = ? AND m.user_id = ?',
    [hullId, userId],
  );
  const row = rows[0];
  return row ? { role: row.role, units: row.units, latestRevisionId: row.latest_revision_id } : null;
}

export async function hullSummary(hullId: number, role: Role): Promise<HullSummary> {
  const hull = await Hull.findByPk(hullId);
  if (!hull) throw notFound('No such hull');
  return toSummary(hull, role);
}

/** Rename a hull. */
export async function hullRename(access: { hullId: number; role: Role }, name: string): Promise<HullSummary> {
  await Hull.update({ name }, { where: { id: access.hullId } });
  return hullSummary(access.hullId, access.role);
}

/** Archive a hull (kept, listed apart) or bring it back. */
export async function hullArchive(access: { hullId: number; role: Role }, archived: boolean): Promise<HullSummary> {
  await Hull.update({ archivedAt: archived ? new Date() : null }, { where: { id: access.hullId } });
  return hullSummary(access.hullId, access.role);
}

/**
 * A new hull owned by the caller, starting from a plan: the given one (a change that lost a race, kept
 * rather than thrown away) or the source hull's latest.
 */
export async function hullCopy(access: { hullId: number; units: HullUnits; latestRevisionId: number | null }, userId: number, name: string, plan?: Plan): Promise<HullSummary> {
  const source = await Hull.findByPk(access.hullId);
  if (!source) throw notFound('No such hull');
  const startPlan = plan ?? (JSON.parse(await planResponseJson(access.hullId, access.latestRevisionId, access.units)).plan as Plan);
  return Hull.sequelize!.transaction(async (transaction) => {
    const copy = await hullCreate(userId, { name, units: source.units, notes: source.notes }, transaction);
    await revisionSave({ hullId: copy.id, units: copy.units, authorId: userId, role: 'owner', baseRevisionId: null, plan: startPlan, summary: `Copied from ${source.name}` }, transaction);
    return copy;
  });
}
