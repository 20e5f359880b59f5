import type { Application } from 'express';
import nodemailer, { type Transporter } from 'nodemailer';
import pino from 'pino';
import type { MailConfig } from '../config';
import { AppError } from '../errors';

/** One plain-text message to one person. */
export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

/**
 * Outgoing mail over SMTP (nodemailer): to the SMTP server of the configuration, which outside
 * production is the local fake the scripts started. Nothing is sent anywhere else.
 */
export interface Mailer {
  /** An SMTP server is configured. */
  readonly enabled: boolean;
  /** Send now and wait for the SMTP server to accept it; an AppError (502, or 503 with no SMTP server) if not. */
  send(message: MailMessage): Promise<void>;
  /**
   * Send without making the request wait: for mail whose sending must not show in the answer's timing
   * (a reset for an address that may or may not have an account) or that goes to many people (notices).
   * A failure is logged, never thrown.
   */
  sendLater(message: MailMessage): void;
  /** Resolves when every sendLater so far has finished (the tests wait on it instead of on a clock). */
  settled(): Promise<void>;
}

export function createMailer(config: MailConfig, logLevel: string): Mailer {
  const log = pino({ level: logLevel, name: 'mail' });
  const smtp = config.smtp;
  const transport: Transporter | null = smtp
    ? nodemailer.createTransport({
        host: smtp.host,
        port: smtp.port,
        secure: smtp.secure,
        auth: smtp.user ? { user: smtp.user, pass: smtp.password ?? '' } : undefined,
        connectionTimeout: 15_000,
        greetingTimeout: 15_000,
        socketTimeout: 30_000,
      })
    : null;
  const pending = new Set<Promise<void>>();

  async function send(message: MailMessage): Promise<void> {
    if (!transport) throw new AppError(503, 'mail_not_configured', 'This Loftbench has no mail server set up, so it cannot send e-mail. Ask whoever runs it to set LOFTBENCH_SMTP_HOST.');
    try {
      await transport.sendMail({ from: config.from, to: message.to, subject: message.subject, text: message.text });
    } catch (err) {
      log.error({ err, to: message.to, subject: message.subject }, 'mail not sent');
      throw new AppError(502, 'mail_not_sent', 'The mail server did not take the message. Nothing was sent; try again in a moment.');
    }
  }

  return {
    enabled: transport !== null,
    send,
    sendLater(message) {
      const job = send(message).catch(() => {
        // Logged by send(); a background message has nobody to tell.
      });
      pending.add(job);
      void job.finally(() => pending.delete(job));
    },
    async settled() {
      while (pending.size > 0) await Promise.all([...pending]);
    },
  };
}

/** The app's mailer (createApp puts it in app.locals). */
export function mailerOf(app: Application): Mailer {
  return app.locals.mailer as Mailer;
}
