// The setup that `npm start`, `npm run dev` and `npm test` share: dependencies, MariaDB, the database and
// its account, then migrations (and the demo data when asked).
import { existsSync, readFileSync, writeFileSync, chmodSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './deps.mjs';
import { ensureMariadbInstalled, instancePaths, prepareDatabase, secret, startInstance, stopInstance } from './mariadb.mjs';
import { startMailFake } from './mail-fake.mjs';
import { fail, run, say } from './sh.mjs';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const tsxNode = ['--import', 'tsx'];

/** The per-user data folder: outside the checkout, so `git clean` can never take a plan with it. */
export function defaultDataRoot() {
  if (process.env.LOFTBENCH_DATA_DIR) return path.resolve(process.env.LOFTBENCH_DATA_DIR);
  const base = process.env.XDG_DATA_HOME || path.join(os.homedir(), '.local', 'share');
  return path.join(base, 'loftbench');
}

/**
 * Secrets generated once for this checkout and kept in a file git ignores. The database account's
 * password is re-applied at each start, so losing the file only costs the signed-in sessions.
 */
export function localSecrets() {
  const file = path.join(root, '.loftbench.local.json');
  if (existsSync(file)) {
    const saved = JSON.parse(readFileSync(file, 'utf8'));
    if (saved.dbPassword && saved.sessionSecret) return saved;
  }
  const fresh = { dbPassword: secret(), sessionSecret: secret(32) };
  writeFileSync(file, `${JSON.stringify(fresh, null, 2)}\n`);
  chmodSync(file, 0o600);
  say('Generated a database password and a session secret in .loftbench.local.json (git ignores it)');
  return fresh;
}

/**
 * Bring up everything the server needs and return the environment to start it with, and a function that
 * stops what this call started.
 */
export async function setUp({ dataRoot, dbPort, database, dbPassword, sessionSecret, mode, seedDemo }) {
  ensureDependencies(root);
  ensureMariadbInstalled();
  const paths = instancePaths(dataRoot, dbPort);
  const { adminPassword, startedHere } = await startInstance(paths);
  const user = 'loftbench';
  prepareDatabase(paths, adminPassword, { database, user, password: dbPassword });
  const env = {
    ...process.env,
    LOFTBENCH_MODE: mode,
    LOFTBENCH_DB_HOST: '127.0.0.1',
    LOFTBENCH_DB_PORT: String(dbPort),
    LOFTBENCH_DB_NAME: database,
    LOFTBENCH_DB_USER: user,
    LOFTBENCH_DB_PASSWORD: dbPassword,
    LOFTBENCH_SESSION_SECRET: sessionSecret,
    LOFTBENCH_DATA_DIR: dataRoot,
  };
  say('Running database migrations' + (seedDemo ? ' and seeding the demo data if the database is empty' : ''));
  try {
    run(process.execPath, [...tsxNode, 'server/cli/prepare.ts', ...(seedDemo ? ['--seed-demo'] : [])], { cwd: root, env });
  } catch (error) {
    if (startedHere) await stopInstance(paths, adminPassword);
    fail(`Preparing the database failed: ${error.message}`);
  }
  // Outside production, mail goes to a local fake SMTP server unless a real one is configured; the
  // tests always use a fake of their own, whatever the environment says.
  let mailFake = null;
  if (mode === 'test' || (mode !== 'production' && !process.env.LOFTBENCH_SMTP_HOST)) {
    mailFake = await startMailFake(root);
    for (const key of ['LOFTBENCH_SMTP_USER', 'LOFTBENCH_SMTP_PASSWORD', 'LOFTBENCH_PUBLIC_URL']) delete env[key];
    Object.assign(env, mailFake.env);
    say(`Mail goes to a local fake SMTP server on 127.0.0.1:${mailFake.ports.smtpPort} (nothing leaves this machine); read it at /dev/mail`);
  }
  const stop = async () => {
    await mailFake?.stop();
    if (startedHere) {
      say('Stopping MariaDB...');
      await stopInstance(paths, adminPassword);
    }
  };
  return { env, paths, adminPassword, stop };
}

/** Build the client with Vite into outDir. */
export function buildClient(outDir, env) {
  say('Building the client (vite build)...');
  run(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn', '--outDir', outDir], { cwd: root, env });
}
