import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { configFromEnv } from '../../server/config';
import { mailLinkBase } from '../../server/mail/links';
import { createMailer, mailerOf } from '../../server/mail/mailer';
import { agentOf, routesOf, testServer, uniqueEmail, type TestServer } from './support';
import { mailTo, onlyMailTo } from './mailbox';

let server: TestServer;
beforeAll(() => {
  server = testServer();
});
afterAll(() => server.close());

/** A loopback port with nothing listening on it (opened, read, closed). */
async function closedPort(): Promise<number> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
  const { port } = probe.address() as AddressInfo;
  await new Promise((resolve) => probe.close(resolve));
  return port;
}

describe('the mailer', () => {
  it('sends over SMTP to the server the configuration names (here the local fake), and the message reads back whole', async () => {
    const to = uniqueEmail('mail');
    await mailerOf(server.app).send({ to, subject: 'Bevel table for frame 3 – ready', text: 'Frame 3: 12.5° at the chine.\nSecond line.' });

    const [received] = await mailTo(to);
    expect(received!.summary.envelopeTo).toEqual([to]);
    expect(received!.summary.envelopeFrom).toBe('no-reply@loftbench.invalid');
    const mail = received!.parsed;
    expect(mail.subject).toBe('Bevel table for frame 3 – ready');
    expect(mail.text?.trim()).toBe('Frame 3: 12.5° at the chine.\nSecond line.');
    expect(mail.from?.value).toEqual([{ name: 'Loftbench', address: 'no-reply@loftbench.invalid' }]);
    expect(mail.to && !Array.isArray(mail.to) ? mail.to.text : '').toBe(to);
  });

  it('sendLater sends after the call returns, and settled() waits for it', async () => {
    const to = uniqueEmail('later');
    const mailer = mailerOf(server.app);
    mailer.sendLater({ to, subject: 'Later', text: 'sent in the background' });
    await mailer.settled();
    expect((await onlyMailTo(to)).subject).toBe('Later');
  });

  it('answers 502 when the SMTP server cannot be reached, and 503 when none is configured', async () => {
    const base = configFromEnv(process.env);
    const unreachable = createMailer({ ...base.mail, smtp: { host: '127.0.0.1', port: await closedPort(), secure: false, user: null, password: null } }, 'silent');
    await expect(unreachable.send({ to: uniqueEmail(), subject: 'x', text: 'x' })).rejects.toMatchObject({ status: 502, code: 'mail_not_sent' });
    const none = createMailer({ ...base.mail, smtp: null }, 'silent');
    expect(none.enabled).toBe(false);
    await expect(none.send({ to: uniqueEmail(), subject: 'x', text: 'x' })).rejects.toMatchObject({ status: 503, code: 'mail_not_configured' });
  });
});

describe('GET /api/dev/mail (development only)', () => {
  it('lists what the fake received, newest first, to a caller on this machine', async () => {
    const to = uniqueEmail('devpage');
    await mailerOf(server.app).send({ to, subject: 'For the dev page', text: 'hello' });
    const res = await agentOf(server.app).get('/api/dev/mail');
    expect(res.status).toBe(200);
    const mine = (res.body.messages as { envelopeTo: string[]; subject: string; text: string }[]).filter((m) => m.envelopeTo.includes(to));
    expect(mine).toMatchObject([{ subject: 'For the dev page', text: 'hello\n' }]);
  });

  it('refuses invitations and password links plainly when no mail server is configured', async () => {
    const noMail = testServer({ mail: { ...server.config.mail, smtp: null } });
    try {
      const reset = await agentOf(noMail.app).post('/api/account/password-reset').send({ email: uniqueEmail() });
      expect(reset.status).toBe(503);
      expect(reset.body.error.code).toBe('mail_not_configured');
    } finally {
      await noMail.close();
    }
  });

  it('does not exist in production mode', async () => {
    const production = testServer({ mode: 'production' });
    try {
      expect(routesOf(production.app)).not.toContain('GET /api/dev/mail');
      expect((await agentOf(production.app).get('/api/dev/mail')).status).toBe(404);
    } finally {
      await production.close();
    }
  });
});

describe('mail configuration', () => {
  const env = { LOFTBENCH_DB_PASSWORD: 'x', LOFTBENCH_SESSION_SECRET: 'y'.repeat(32) };

  it('refuses production mail without LOFTBENCH_PUBLIC_URL, naming the variable', () => {
    expect(() => configFromEnv({ ...env, LOFTBENCH_MODE: 'production', LOFTBENCH_SMTP_HOST: 'smtp.example.org' })).toThrow(/LOFTBENCH_PUBLIC_URL/);
    const ok = configFromEnv({ ...env, LOFTBENCH_MODE: 'production', LOFTBENCH_SMTP_HOST: 'smtp.example.org', LOFTBENCH_PUBLIC_URL: 'https://loft.example.org/', LOFTBENCH_MAIL_FAKE_URL: 'http://127.0.0.1:9' });
    expect(ok.mail).toMatchObject({ smtp: { host: 'smtp.example.org', port: 587, secure: false }, publicUrl: 'https://loft.example.org', fakeUrl: null });
  });

  it('has no SMTP server in production unless one is configured (nothing goes anywhere by default)', () => {
    expect(configFromEnv({ ...env, LOFTBENCH_MODE: 'production' }).mail.smtp).toBeNull();
  });

  it('builds links from the configured address, never from the Host header, when one is set', () => {
    const config = { ...configFromEnv({ ...env, LOFTBENCH_MODE: 'production', LOFTBENCH_SMTP_HOST: 'smtp.example.org', LOFTBENCH_PUBLIC_URL: 'https://loft.example.org' }) };
    const forged = { protocol: 'http', get: () => 'evil.example' } as unknown as Parameters<typeof mailLinkBase>[1];
    expect(mailLinkBase(config, forged)).toBe('https://loft.example.org');
    expect(mailLinkBase({ ...config, mode: 'development', mail: { ...config.mail, publicUrl: null } }, forged)).toBe('http://evil.example');
  });
});
