import type { Router } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import { accountSettingsSchema, changePasswordSchema, completePasswordResetSchema, passwordResetTokenSchema, requestPasswordResetSchema } from '../../shared/api/collaboration';
import type { Config } from '../config';
import { AppError, parseInput } from '../errors';
import { requireUser, signOut } from '../http/auth';
import { mailLinkBase } from '../mail/links';
import { mailerOf } from '../mail/mailer';
import { accountPasswordChange, accountSettingsOf, accountSettingsPut } from '../services/account';
import { passwordResetComplete, passwordResetPreview, passwordResetRequest } from '../services/password-reset';

const WINDOW_MS = 15 * 60 * 1000;

/**
 * Reset requests send mail, so they are limited: 5 in 15 minutes per address and e-mail (nobody's inbox
 * is flooded from one place), 30 per address over all e-mails. Same answer either way.
 */
function resetRequestLimits() {
  const handler = () => {
    throw new AppError(429, 'too_many_attempts', 'Too many requests for a password link. Wait a few minutes and try again.');
  };
  const common = { windowMs: WINDOW_MS, standardHeaders: 'draft-8' as const, legacyHeaders: false, handler };
  return [
    rateLimit({ ...common, limit: 30, keyGenerator: (req) => ipKeyGenerator(req.ip ?? '') }),
    rateLimit({ ...common, limit: 5, keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}` }),
  ];
}

export function registerAccountRoutes(router: Router, config: Config) {
  router.post('/api/account/password-reset', ...resetRequestLimits(), async (req, res) => {
    const { email } = parseInput(requestPasswordResetSchema, req.body);
    // Said before anything else, and the same for every address: no mail can be sent at all.
    if (!mailerOf(req.app).enabled) throw new AppError(503, 'mail_not_configured', 'This Loftbench has no mail server set up, so it cannot send a password link. Ask whoever runs it.');
    await passwordResetRequest({ email, linkBase: mailLinkBase(config, req), ttlMs: config.mail.resetTtlMs, mailer: mailerOf(req.app) });
    // The same words whether or not the address has an account.
    res.status(202).json({ message: 'If this e-mail address has a Loftbench account, a link to choose a new password is on its way to it.' });
  });

  router.post('/api/account/password-reset/preview', async (req, res) => {
    const { token } = parseInput(passwordResetTokenSchema, req.body);
    res.json(await passwordResetPreview(token));
  });

  router.post('/api/account/password-reset/complete', async (req, res) => {
    const { token, password } = parseInput(completePasswordResetSchema, req.body);
    const userId = await passwordResetComplete(req.app, token, password);
    // This browser's own session, if it is the same account, ends too (and is not saved again below).
    if (req.user?.id === userId) await signOut(req);
    res.json({ message: 'Your new password is set, and the account is signed out everywhere. Sign in with the new password.' });
  });

  router.get('/api/account/settings', requireUser, async (req, res) => {
    res.json({ settings: await accountSettingsOf(req.user!.id) });
  });

  router.put('/api/account/settings', requireUser, async (req, res) => {
    const input = parseInput(accountSettingsSchema, req.body);
    res.json({ settings: await accountSettingsPut(req.user!.id, input) });
  });

  router.post('/api/account/password', requireUser, async (req, res) => {
    const input = parseInput(changePasswordSchema, req.body);
    await accountPasswordChange(req.app, { userId: req.user!.id, sessionId: req.sessionID, ...input });
    res.json({ message: input.signOutOthers ? 'Your password is changed and every other session of your account has ended.' : 'Your password is changed.' });
  });
}
