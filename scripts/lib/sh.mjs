// Small process helpers for the setup scripts. Plain Node: these run before node_modules exists.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import net from 'node:net';

/** Print a setup step the way every script does. */
export function say(message) {
  process.stdout.write(`[loftbench] ${message}\n`);
}

/** Stop with a message a person can act on. */
export function fail(message) {
  process.stderr.write(`[loftbench] ${message}\n`);
  process.exit(1);
}

/** Run a command to completion, inheriting the terminal; throws with the command line when it fails. */
export function run(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { stdio: 'inherit', ...options });
  if (result.error) throw result.error;
  if (result.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited with ${result.status}`);
  return result;
}

/** Run a command and return its stdout, or null when it fails. */
export function capture(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { encoding: 'utf8', ...options });
  if (result.error || result.status !== 0) return null;
  return result.stdout;
}

/** Find an executable on PATH or in the sbin folders Debian puts servers in. */
export function which(name) {
  const dirs = [...(process.env.PATH ?? '').split(':'), '/usr/sbin', '/usr/bin', '/sbin', '/usr/local/sbin', '/usr/local/bin'];
  for (const dir of dirs) {
    if (dir && existsSync(`${dir}/${name}`)) return `${dir}/${name}`;
  }
  return null;
}

/** True when running as root (apt-get can then install what is missing). */
export function isRoot() {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

let aptUpdated = false;
/** Install Debian packages non-interactively, running `apt-get update` once first. */
export function aptInstall(packages, why) {
  if (!isRoot()) {
    fail(
      `${why} is not installed, and installing it needs root.\n` +
        `  Run:  sudo apt-get update && sudo apt-get install -y ${packages.join(' ')}\n` +
        `  then run this command again.`,
    );
  }
  say(`${why} is not installed: installing ${packages.join(', ')} from Debian's packages (apt-get)...`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    run('apt-get', ['update', '-q'], { env });
    aptUpdated = true;
  }
  run('apt-get', ['install', '-y', '-q', '--no-install-recommends', ...packages], { env });
}

/** A TCP port on 127.0.0.1 that nothing listens on right now. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

/** True when something accepts connections on host:port. */
export function portOpen(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** Start a long-running child that shares the terminal; resolves its exit code when it ends. */
export function spawnChild(cmd, args, options = {}) {
  const child = spawn(cmd, args, { stdio: 'inherit', ...options });
  const exited = new Promise((resolve) => child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0))));
  return { child, exited };
}
