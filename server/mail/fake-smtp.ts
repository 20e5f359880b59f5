import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { FakeMailMessage } from '../../shared/api/collaboration';

/**
 * The local stand-in for an SMTP relay, for development and the tests (never production): a real SMTP
 * server (smtp-server) on 127.0.0.1 that accepts every message and keeps it in memory, and a small HTTP
 * side on 127.0.0.1 that lists what arrived (GET /messages) and hands out each raw message
 * (GET /messages/:id.eml). The scripts start it (scripts/lib/mail-fake.mjs) and read the two ports from
 * the one JSON line it prints when it is listening.
 *
 * A message is stored before the SMTP server answers 250 to its DATA, so by the time nodemailer's
 * sendMail() resolves, the message can be read back here: tests need no waiting.
 */

const KEEP = 2000;

interface Stored {
  summary: FakeMailMessage;
  raw: Buffer;
}

const stored: Stored[] = [];
let nextId = 1;

async function keep(raw: Buffer, envelope: { from: string; to: string[] }): Promise<void> {
  const parsed = await simpleParser(raw);
  const address = (a: typeof parsed.to) => (Array.isArray(a) ? a.map((x) => x.text).join(', ') : (a?.text ?? ''));
  stored.push({
    raw,
    summary: {
      id: nextId++,
      receivedAt: new Date().toISOString(),
      envelopeFrom: envelope.from,
      envelopeTo: envelope.to,
      from: address(parsed.from),
      to: address(parsed.to),
      subject: parsed.subject ?? '',
      text: parsed.text ?? '',
    },
  });
  if (stored.length > KEEP) stored.splice(0, stored.length - KEEP);
}

const smtp = new SMTPServer({
  banner: 'Loftbench local fake SMTP (nothing leaves this machine)',
  // Loopback only and no real secrets cross it: no TLS, no authentication.
  disabledCommands: ['STARTTLS', 'AUTH'],
  authOptional: true,
  logger: false,
  size: 10 * 1024 * 1024,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on('data', (chunk: Buffer) => chunks.push(chunk));
    stream.on('end', () => {
      const envelope = {
        from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
        to: session.envelope.rcptTo.map((r) => r.address),
      };
      keep(Buffer.concat(chunks), envelope).then(
        () => callback(),
        (err: Error) => callback(err),
      );
    });
  },
});

function answer(res: ServerResponse, status: number, type: string, body: string | Buffer) {
  res.writeHead(status, { 'Content-Type': type, 'Cache-Control': 'no-store' });
  res.end(body);
}

const http = createServer((req: IncomingMessage, res: ServerResponse) => {
  const url = new URL(req.url ?? '/', 'http://127.0.0.1');
  if (req.method === 'GET' && url.pathname === '/messages') {
    const to = url.searchParams.get('to')?.toLowerCase();
    const list = stored
      .map((s) => s.summary)
      .filter((m) => !to || m.envelopeTo.some((a) => a.toLowerCase() === to))
      .reverse();
    return answer(res, 200, 'application/json', JSON.stringify({ messages: list }));
  }
  const raw = /^\/messages\/(\d+)\.eml$/.exec(url.pathname);
  if (req.method === 'GET' && raw) {
    const found = stored.find((s) => s.summary.id === Number(raw[1]));
    return found ? answer(res, 200, 'message/rfc822', found.raw) : answer(res, 404, 'text/plain', 'no such message');
  }
  return answer(res, 404, 'text/plain', 'not found');
});

await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', resolve));
await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve));
const smtpPort = (smtp.server.address() as AddressInfo).port;
const httpPort = (http.address() as AddressInfo).port;
process.stdout.write(`${JSON.stringify({ smtpPort, httpPort })}\n`);

function stop() {
  http.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
// The scripts hold the other end of stdin: when they are gone (even killed), so is the fake.
process.stdin.on('end', stop);
process.stdin.resume();
