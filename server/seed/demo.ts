import type { Sequelize } from 'sequelize';
import { HullMember } from '../models';
import { hullCreate } from '../services/hulls';
import { revisionSave } from '../services/plans';
import { demoPlan } from './demo-plan';
import { userCreate } from '../services/users';
import { demoAccounts, demoHull } from './demo-accounts';

/** Seed the demo: three accounts and one hull owned by the builder, with the helper and designer on its crew, and its plan. */
export async function seedDemo(sequelize: Sequelize) {
  const users: { id: number }[] = [];
  for (const account of demoAccounts) users.push(await userCreate(account));
  await sequelize.transaction(async (transaction) => {
    const hull = await hullCreate(users[0].id, demoHull, transaction);
    for (let i = 1; i < demoAccounts.length; i += 1) {
      await HullMember.create({ hullId: hull.id, userId: users[i].id, role: demoAccounts[i].role }, { transaction });
    }
    await revisionSave({ hullId: hull.id, units: hull.units, authorId: users[0].id, role: 'owner', baseRevisionId: null, plan: demoPlan(), summary: 'Demo plan: lines of the invented skiff, three parts' }, transaction);
  });
}
