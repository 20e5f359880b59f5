// A private MariaDB instance for Loftbench: its own data folder (outside the checkout), its own port on
// 127.0.0.1 and its own socket, so it never touches a system database and cleaning the checkout can
// never delete a plan. Uses only the Debian mariadb-server package's programs.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync, chmodSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn, spawnSync } from 'node:child_process';
import { aptInstall, fail, isRoot, say, sleep, which } from './sh.mjs';

/** Make sure the MariaDB server programs are installed, installing Debian's package when they are not. */
export function ensureMariadbInstalled() {
  if (!which('mariadbd') || !which('mariadb-install-db') || !which('mariadb')) {
    aptInstall(['mariadb-server', 'mariadb-client'], 'MariaDB (mariadbd)');
  }
  for (const program of ['mariadbd', 'mariadb-install-db', 'mariadb-admin', 'mariadb']) {
    if (!which(program)) fail(`${program} is still missing after installing mariadb-server; check the apt-get output above.`);
  }
}

/** A random secret of URL-safe characters. */
export const secret = (bytes = 24) => randomBytes(bytes).toString('base64url');

/**
 * Where an instance keeps its files. The socket goes under the system temp folder because a Unix socket
 * path may not exceed about 100 bytes, and a data folder can be deep.
 */
export function instancePaths(dataRoot, port) {
  const uid = typeof process.getuid === 'function' ? process.getuid() : 0;
  return {
    dataRoot,
    dataDir: path.join(dataRoot, 'mariadb'),
    pidFile: path.join(dataRoot, 'mariadbd.pid'),
    logFile: path.join(dataRoot, 'mariadbd.err'),
    adminFile: path.join(dataRoot, 'admin.json'),
    socket: path.join(os.tmpdir(), `loftbench-${uid}-${port}.sock`),
    port,
  };
}

function adminEnv(password) {
  return { ...process.env, MYSQL_PWD: password ?? '' };
}

function client(paths, password, sql) {
  return spawnSync('mariadb', ['--no-defaults', `--socket=${paths.socket}`, '-uroot', '--batch', '-e', sql], {
    encoding: 'utf8',
    env: adminEnv(password),
  });
}

async function waitUntilAnswering(paths, password, child) {
  for (let i = 0; i < 300; i += 1) {
    const ping = spawnSync(
      'mariadb-admin',
      ['--no-defaults', '--protocol=TCP', '-h127.0.0.1', `-P${paths.port}`, '-uroot', '--connect-timeout=2', 'ping'],
      { encoding: 'utf8', env: adminEnv(password) },
    );
    // "mysqld is alive" or an access-denied answer both mean the server is up and answering.
    if (ping.status === 0 || /Access denied/.test(ping.stderr ?? '')) return;
    if (child && child.exitCode !== null) break;
    await sleep(100);
  }
  const log = existsSync(paths.logFile) ? readFileSync(paths.logFile, 'utf8').split('\n').slice(-15).join('\n') : '(no log)';
  fail(`MariaDB did not start on 127.0.0.1:${paths.port}. Last lines of ${paths.logFile}:\n${log}`);
}

function runningPid(paths) {
  if (!existsSync(paths.pidFile)) return null;
  const pid = Number(readFileSync(paths.pidFile, 'utf8').trim());
  if (!Number.isInteger(pid) || pid <= 0) return null;
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

/**
 * Initialise (first run only) and start the instance, or reuse it when it is already running from an
 * earlier start. Returns the admin password and whether this call started the server (and so must stop it).
 */
export async function startInstance(paths) {
  mkdirSync(paths.dataRoot, { recursive: true, mode: 0o700 });
  let admin = existsSync(paths.adminFile) ? JSON.parse(readFileSync(paths.adminFile, 'utf8')) : null;
  const fresh = !existsSync(path.join(paths.dataDir, 'mysql'));
  if (fresh) {
    say(`Creating a new MariaDB data folder in ${paths.dataDir}`);
    rmSync(paths.dataDir, { recursive: true, force: true });
    mkdirSync(paths.dataDir, { recursive: true, mode: 0o700 });
    const args = ['--no-defaults', `--datadir=${paths.dataDir}`, '--auth-root-authentication-method=normal', '--skip-test-db'];
    if (isRoot()) args.splice(2, 0, '--user=root');
    const init = spawnSync('mariadb-install-db', args, { encoding: 'utf8' });
    if (init.status !== 0) fail(`mariadb-install-db failed:\n${init.stdout}\n${init.stderr}`);
    admin = null;
  }

  const already = runningPid(paths);
  let child = null;
  if (already) {
    say(`MariaDB is already running (pid ${already}) on 127.0.0.1:${paths.port}: reusing it`);
  } else {
    rmSync(paths.socket, { force: true });
    const args = [
      '--no-defaults',
      `--datadir=${paths.dataDir}`,
      '--bind-address=127.0.0.1',
      `--port=${paths.port}`,
      `--socket=${paths.socket}`,
      `--pid-file=${paths.pidFile}`,
      `--log-error=${paths.logFile}`,
      '--skip-name-resolve',
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      // Durable commits: every committed revision is on disk before the save answers.
      '--innodb-flush-log-at-trx-commit=1',
      '--sync-binlog=1',
      '--innodb-doublewrite=1',
      '--max-connections=200',
    ];
    if (isRoot()) args.splice(1, 0, '--user=root');
    // Own process group: Ctrl-C reaches our script, which then shuts the server down in order.
    child = spawn('mariadbd', args, { stdio: 'ignore', detached: true });
    child.unref();
  }
  await waitUntilAnswering(paths, admin?.password, child);

  if (!admin) {
    // The freshly initialised root has no password: give it one at once, kept beside the data.
    const password = secret();
    const r = client(paths, '', `ALTER USER 'root'@'localhost' IDENTIFIED BY '${password}'; FLUSH PRIVILEGES;`);
    if (r.status !== 0) fail(`Could not secure the new MariaDB instance: ${r.stderr}`);
    admin = { password };
    writeFileSync(paths.adminFile, JSON.stringify(admin, null, 2));
    chmodSync(paths.adminFile, 0o600);
  }
  return { adminPassword: admin.password, startedHere: !already };
}

/**
 * Create the database and the application's own account (idempotent). The password is set on every
 * start so that a lost local secrets file is repaired rather than locking the app out.
 */
export function prepareDatabase(paths, adminPassword, { database, user, password }) {
  const sql = [
    `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    `CREATE USER IF NOT EXISTS '${user}'@'127.0.0.1' IDENTIFIED BY '${password}'`,
    `ALTER USER '${user}'@'127.0.0.1' IDENTIFIED BY '${password}'`,
    `GRANT ALL PRIVILEGES ON \`${database}\`.* TO '${user}'@'127.0.0.1'`,
    'FLUSH PRIVILEGES',
  ].join('; ');
  const r = client(paths, adminPassword, sql);
  if (r.status !== 0) fail(`Could not create the database ${database}: ${r.stderr}`);
}

/** Shut the instance down cleanly and wait until its process is gone. */
export async function stopInstance(paths, adminPassword) {
  const pid = runningPid(paths);
  spawnSync('mariadb-admin', ['--no-defaults', `--socket=${paths.socket}`, '-uroot', 'shutdown'], { env: adminEnv(adminPassword), stdio: 'ignore' });
  for (let i = 0; i < 300 && pid; i += 1) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    await sleep(100);
  }
  if (pid) {
    try {
      process.kill(pid, 'SIGTERM');
    } catch {
      /* already gone */
    }
  }
}
