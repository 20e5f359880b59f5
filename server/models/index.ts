import type { Sequelize } from 'sequelize';
import { Hull, initHull } from './hull';
import { HullMember, initHullMember } from './hull-member';
import { PlanDraft, initPlanDraft } from './plan-draft';
import { PlanRevision, initPlanRevision } from './plan-revision';
import { Session, initSession } from './session';
import { User, initUser } from './user';
import { AccountSetting, initAccountSetting } from './account-setting';
import { Invitation, initInvitation } from './invitation';
import { LibraryItem, initLibraryItem } from './library-item';
import { LibraryNotice, initLibraryNotice } from './library-notice';
import { LibraryPin, initLibraryPin } from './library-pin';
import { LibraryRevision, initLibraryRevision } from './library-revision';
import { LibraryShare, initLibraryShare } from './library-share';
import { PasswordReset, initPasswordReset } from './password-reset';
import { BuildEventRow, BuildPhotoRow, BuildSetting, initBuildLog } from './build-log';
import { CutListArrangement, initCutListArrangement } from './cut-list-arrangement';

/** Define every model and, in this one place, their associations. */
export function initModels(sequelize: Sequelize) {
  initUser(sequelize);
  initHull(sequelize);
  initHullMember(sequelize);
  initSession(sequelize);
  initPlanRevision(sequelize);
  initPlanDraft(sequelize);
  initInvitation(sequelize);
  initPasswordReset(sequelize);
  initAccountSetting(sequelize);
  initLibraryItem(sequelize);
  initLibraryRevision(sequelize);
  initLibraryShare(sequelize);
  initLibraryPin(sequelize);
  initLibraryNotice(sequelize);
  initBuildLog(sequelize);
  initCutListArrangement(sequelize);

  HullMember.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  HullMember.belongsTo(Hull, { foreignKey: 'hullId', as: 'hull' });
  Hull.hasMany(HullMember, { foreignKey: 'hullId', as: 'members' });
  User.hasMany(HullMember, { foreignKey: 'userId', as: 'memberships' });
  PlanRevision.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  Invitation.belongsTo(Hull, { foreignKey: 'hullId', as: 'hull' });
  Invitation.belongsTo(User, { foreignKey: 'invitedBy', as: 'inviter' });
  LibraryItem.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  LibraryItem.hasMany(LibraryRevision, { foreignKey: 'itemId', as: 'revisions' });
  LibraryItem.hasMany(LibraryShare, { foreignKey: 'itemId', as: 'shares' });
  LibraryRevision.belongsTo(LibraryItem, { foreignKey: 'itemId', as: 'item' });
  LibraryPin.belongsTo(Hull, { foreignKey: 'hullId', as: 'hull' });
  LibraryPin.belongsTo(LibraryItem, { foreignKey: 'itemId', as: 'item' });
  LibraryPin.belongsTo(LibraryRevision, { foreignKey: 'revisionId', as: 'revision' });
  LibraryPin.belongsTo(User, { foreignKey: 'pinnedBy', as: 'pinner' });
  LibraryNotice.belongsTo(LibraryPin, { foreignKey: 'pinId', as: 'pin' });
  LibraryNotice.belongsTo(LibraryRevision, { foreignKey: 'revisionId', as: 'revision' });
  BuildEventRow.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  BuildPhotoRow.belongsTo(User, { foreignKey: 'uploaderId', as: 'uploader' });
  CutListArrangement.belongsTo(User, { foreignKey: 'savedBy', as: 'saver' });
  return { User, Hull, HullMember, Session, PlanRevision, PlanDraft };
}

export { Hull, HullMember, PlanDraft, PlanRevision, Session, User };
export { AccountSetting, Invitation, LibraryItem, LibraryNotice, LibraryPin, LibraryRevision, LibraryShare, PasswordReset };
export { BuildEventRow, BuildPhotoRow, BuildSetting };
export { CutListArrangement };
