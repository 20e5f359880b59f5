import type { Application } from 'express';
import type { AccountSettings } from '../../shared/api/collaboration';
import { AppError } from '../errors';
import { endSessionsOf } from '../http/auth';
import { AccountSetting } from '../models';
import { BCRYPT_COST, userPasswordMatches, userSetPassword } from './users';

/** A person's settings (the defaults when they never changed any). */
export async function accountSettingsOf(userId: number): Promise<AccountSettings> {
  const row = await AccountSetting.findByPk(userId);
  return { noticeMail: row?.noticeMail ?? false };
}

export async function accountSettingsPut(userId: number, settings: AccountSettings): Promise<AccountSettings> {
  await AccountSetting.upsert({ userId, noticeMail: settings.noticeMail });
  return accountSettingsOf(userId);
}

/** Change one's password, proving the present one; optionally end every other session of the account. */
export async function accountPasswordChange(
  app: Application,
  req: { userId: number; sessionId: string; currentPassword: string; newPassword: string; signOutOthers: boolean },
  cost = BCRYPT_COST,
): Promise<void> {
  if (!(await userPasswordMatches(req.userId, req.currentPassword))) {
    throw new AppError(400, 'wrong_password', 'That is not your present password', 'currentPassword');
  }
  await userSetPassword(req.userId, req.newPassword, cost);
  if (req.signOutOthers) await endSessionsOf(app, req.userId, req.sessionId);
}
