import type { Request, Router } from 'express';
import type { FakeMailMessage } from '../../shared/api/collaboration';
import type { Config } from '../config';
import { AppError, notFound } from '../errors';

const LOOPBACK = /^(127\.\d+\.\d+\.\d+|::1|::ffff:127\.\d+\.\d+\.\d+)$/;

/** A caller on this machine, and (behind a proxy) a client on this machine too. */
function fromThisMachine(req: Request, config: Config): boolean {
  const peer = req.socket.remoteAddress ?? '';
  return LOOPBACK.test(peer) && (!config.trustProxy || LOOPBACK.test(req.ip ?? ''));
}

/**
 * Development only (createApp registers it outside production): the mail the local fake SMTP server
 * received, newest first, for the /dev/mail page. Answered only to callers on this machine, since
 * the messages hold sign-in links: a tablet on the workshop network sees 404.
 */
export function registerDevMailRoutes(router: Router, config: Config) {
  router.get('/api/dev/mail', async (req, res) => {
    if (!fromThisMachine(req, config)) throw notFound('No such API route');
    const fake = config.mail.fakeUrl;
    if (!fake) throw new AppError(404, 'no_mail_fake', 'Mail goes to a real SMTP server here, not to the local fake: there is nothing to show');
    let body: { messages: FakeMailMessage[] };
    try {
      const answer = await fetch(`${fake}/messages`);
      if (!answer.ok) throw new Error(`status ${answer.status}`);
      body = (await answer.json()) as { messages: FakeMailMessage[] };
    } catch {
      throw new AppError(502, 'mail_fake_unreachable', 'The local fake SMTP server does not answer. Is npm start (or npm run dev) still running?');
    }
    res.json({ messages: body.messages.slice(0, 200) });
  });
}
