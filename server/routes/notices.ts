import type { Router } from 'express';
import { notFound } from '../errors';
import { requireUser } from '../http/auth';
import { noticeDismiss, noticesOf } from '../services/notices';

export function registerNoticeRoutes(router: Router) {
  router.get('/api/notices', requireUser, async (req, res) => {
    res.json({ notices: await noticesOf({ id: req.user!.id, email: req.user!.email }) });
  });

  router.post('/api/notices/:noticeId/dismiss', requireUser, async (req, res) => {
    const id = Number(req.params.noticeId);
    if (!/^\d+$/.test(String(req.params.noticeId)) || !Number.isSafeInteger(id) || id <= 0) throw notFound('No such notice');
    await noticeDismiss(req.user!.id, id);
    res.status(204).end();
  });
}
