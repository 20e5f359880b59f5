import type { Application } from 'express';
import { AppError } from '../errors';
import { endSessionsOf } from '../http/auth';
import type { Mailer } from '../mail/mailer';
import { passwordResetMail } from '../mail/messages';
import { PasswordReset, User } from '../models';
import { mailTokenHash, mailTokenNew } from './mail-tokens';
import { BCRYPT_COST, normaliseEmail, userSetPassword } from './users';

/**
 * Ask for a reset link. The answer is the same whether or not the address has an account, and the mail
 * goes out after the answer (sendLater), so neither the words nor the time of the answer tell.
 */
export async function passwordResetRequest(req: { email: string; linkBase: string; ttlMs: number; mailer: Mailer }): Promise<void> {
  const user = await User.findOne({ where: { email: normaliseEmail(req.email) }, attributes: ['id', 'email'] });
  if (!user) return;
  const { token, hash } = mailTokenNew();
  const expiresAt = new Date(Date.now() + req.ttlMs);
  await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt });
  req.mailer.sendLater(passwordResetMail({ to: user.email, link: `${req.linkBase}/reset-password#${token}`, expiresAt }));
}

function usable(reset: PasswordReset | null): PasswordReset {
  if (!reset) throw new AppError(404, 'reset_not_found', 'This password link is not valid. Check that you opened the whole link from the e-mail, or ask for a new one.');
  if (reset.usedAt) throw new AppError(410, 'reset_used', 'This password link has been used already. Ask for a new one if you need to.');
  if (reset.expiresAt.getTime() <= Date.now()) throw new AppError(410, 'reset_expired', 'This password link has expired. Ask for a new one.');
  return reset;
}

/** Whose password the link would reset (nothing is changed). */
export async function passwordResetPreview(token: string): Promise<{ email: string }> {
  const reset = usable(await PasswordReset.findOne({ where: { tokenHash: mailTokenHash(token) } }));
  const user = await User.findByPk(reset.userId, { attributes: ['email'] });
  return { email: user?.email ?? '' };
}

/**
 * Set the new password: with the link's row locked, so it works once; every other reset link of the
 * account stops working too. Then every session of the account ends (rows and caches). Returns the account's id.
 */
export async function passwordResetComplete(app: Application, token: string, password: string, cost = BCRYPT_COST): Promise<number> {
  const sequelize = PasswordReset.sequelize!;
  const userId = await sequelize.transaction(async (transaction) => {
    const reset = usable(await PasswordReset.findOne({ where: { tokenHash: mailTokenHash(token) }, transaction, lock: transaction.LOCK.UPDATE }));
    await userSetPassword(reset.userId, password, cost, transaction);
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: reset.userId, usedAt: null }, transaction });
    return reset.userId;
  });
  await endSessionsOf(app, userId);
  return userId;
}
