// Starts the local fake SMTP server (server/mail/fake-smtp.ts) for npm start, npm run dev and npm test:
// outside production every message Loftbench sends goes there and nowhere else. Needs node_modules
// (smtp-server, mailparser, tsx), so it is started after the dependencies are installed.
import { spawn } from 'node:child_process';
import { createInterface } from 'node:readline';

/**
 * Start the fake and wait for the one line in which it reports its two loopback ports. Returns the
 * environment the server needs to send to it and the development mail page needs to read it, and a stop().
 */
export async function startMailFake(root) {
  // stdin stays a pipe: the fake ends itself when this process goes, however it goes.
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/mail/fake-smtp.ts'], { cwd: root, stdio: ['pipe', 'pipe', 'inherit'] });
  const exited = new Promise((resolve) => child.on('exit', resolve));
  const ports = await new Promise((resolve, reject) => {
    const lines = createInterface({ input: child.stdout });
    lines.once('line', (line) => {
      try {
        resolve(JSON.parse(line));
      } catch (error) {
        reject(new Error(`the fake SMTP server said something unexpected: ${line} (${error.message})`));
      }
    });
    child.once('exit', (code) => reject(new Error(`the fake SMTP server stopped at start (exit ${code})`)));
  });
  return {
    env: {
      LOFTBENCH_SMTP_HOST: '127.0.0.1',
      LOFTBENCH_SMTP_PORT: String(ports.smtpPort),
      LOFTBENCH_SMTP_SECURE: '0',
      LOFTBENCH_MAIL_FAKE_URL: `http://127.0.0.1:${ports.httpPort}`,
    },
    ports,
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}
