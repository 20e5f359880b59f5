import type { Sequelize } from 'sequelize';
import { Hull, initHull } from './hull';
import { HullMember, initHullMember } from './hull-member';
import { PlanDraft, initPlanDraft } from './plan-draft';
import { PlanRevision, initPlanRevision } from './plan-revision';
import { Session, initSession } from './session';
import { User, initUser } from './user';

/** Define every model and, in this one place, their associations. */
export function initModels(sequelize: Sequelize) {
  initUser(sequelize);
  initHull(sequelize);
  initHullMember(sequelize);
  initSession(sequelize);
  initPlanRevision(sequelize);
  initPlanDraft(sequelize);

  HullMember.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  HullMember.belongsTo(Hull, { foreignKey: 'hullId', as: 'hull' });
  Hull.hasMany(HullMember, { foreignKey: 'hullId', as: 'members' });
  User.hasMany(HullMember, { foreignKey: 'userId', as: 'memberships' });
  PlanRevision.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  return { User, Hull, HullMember, Session, PlanRevision, PlanDraft };
}

export { Hull, HullMember, PlanDraft, PlanRevision, Session, User };
