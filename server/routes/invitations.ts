import type { Router } from 'express';
import { acceptInvitationSchema, createInvitationSchema, invitationTokenSchema } from '../../shared/api/collaboration';
import type { Config } from '../config';
import { notFound, parseInput } from '../errors';
import { signIn } from '../http/auth';
import { accessOf, hullAccess } from '../http/hull-access';
import { mailLinkBase } from '../mail/links';
import { mailerOf } from '../mail/mailer';
import { invitationAccept, invitationCreate, invitationPreview, invitationRevoke, invitationsPending } from '../services/invitations';
import { userById } from '../services/users';

function idParam(raw: string | string[] | undefined): number {
  const id = Number(raw);
  if (!Number.isSafeInteger(id) || id <= 0) throw notFound('No pending invitation with this id on this hull');
  return id;
}

export function registerInvitationRoutes(router: Router, config: Config) {
  router.get('/api/hulls/:hullId/invitations', hullAccess('manage-crew'), async (_req, res) => {
    res.json({ invitations: await invitationsPending(accessOf(res).hullId) });
  });

  router.post('/api/hulls/:hullId/invitations', hullAccess('manage-crew'), async (req, res) => {
    const input = parseInput(createInvitationSchema, req.body);
    const invitation = await invitationCreate({
      hullId: accessOf(res).hullId,
      inviterId: req.user!.id,
      email: input.email,
      role: input.role,
      linkBase: mailLinkBase(config, req),
      ttlMs: config.mail.invitationTtlMs,
      mailer: mailerOf(req.app),
    });
    res.status(201).json({ invitation });
  });

  router.delete('/api/hulls/:hullId/invitations/:invitationId', hullAccess('manage-crew'), async (req, res) => {
    await invitationRevoke(accessOf(res).hullId, idParam(req.params.invitationId));
    res.status(204).end();
  });

  // The token travels in the body, never in a URL, so it stays out of logs and Referer headers.
  router.post('/api/invitations/preview', async (req, res) => {
    const { token } = parseInput(invitationTokenSchema, req.body);
    res.json({ invitation: await invitationPreview(token) });
  });

  router.post('/api/invitations/accept', async (req, res) => {
    const input = parseInput(acceptInvitationSchema, req.body);
    const accepted = await invitationAccept({ token: input.token, userId: req.user?.id ?? null, newAccount: input.newAccount });
    const { createdUserId, ...body } = accepted;
    if (createdUserId !== null) {
      await signIn(req, (await userById(createdUserId))!);
      return void res.status(201).json(body);
    }
    res.json(body);
  });
}
