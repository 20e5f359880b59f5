import { simpleParser, type ParsedMail } from 'mailparser';
import type { FakeMailMessage } from '../../shared/api/collaboration';

/**
 * Reading back what the server really sent over SMTP: the local fake SMTP server that scripts/test.mjs
 * started keeps every message; these fetch them from its loopback HTTP side and parse the raw message
 * with mailparser, as a mail client would.
 */
export function fakeMailUrl(): string {
  const url = process.env.LOFTBENCH_MAIL_FAKE_URL;
  if (!url) throw new Error('LOFTBENCH_MAIL_FAKE_URL is not set: run the API tests through npm test (scripts/test.mjs), which starts the fake SMTP server');
  return url;
}

export interface ReceivedMail {
  summary: FakeMailMessage;
  parsed: ParsedMail;
}

/** Every message the fake received for this address (SMTP envelope recipient), newest first. */
export async function mailTo(address: string): Promise<ReceivedMail[]> {
  const list = (await (await fetch(`${fakeMailUrl()}/messages?to=${encodeURIComponent(address)}`)).json()) as { messages: FakeMailMessage[] };
  return Promise.all(
    list.messages.map(async (summary) => {
      const raw = Buffer.from(await (await fetch(`${fakeMailUrl()}/messages/${summary.id}.eml`)).arrayBuffer());
      return { summary, parsed: await simpleParser(raw) };
    }),
  );
}

/** The one message for this address; fails when there is none or more than one. */
export async function onlyMailTo(address: string): Promise<ParsedMail> {
  const mails = await mailTo(address);
  if (mails.length !== 1) throw new Error(`expected exactly one message to ${address}, found ${mails.length}`);
  return mails[0]!.parsed;
}

/** The link to `path` in the message's text and the token after its '#'. */
export function linkIn(mail: ParsedMail, path: '/invitation' | '/reset-password'): { url: URL; token: string } {
  const text = mail.text ?? '';
  const match = new RegExp(`https?://[^\\s]+${path}#([A-Za-z0-9_-]+)`).exec(text);
  if (!match) throw new Error(`no ${path} link in the message: ${text}`);
  return { url: new URL(match[0]), token: match[1]! };
}
