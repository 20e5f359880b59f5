// Throw-away data folders for `npm test` and `npm run bench`, and the clean-up of ones a killed run left.
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { say } from './sh.mjs';

const OWNER_FILE = 'owner.pid';
/** A folder without an owner file younger than this may be one another run has just made. */
const UNMARKED_GRACE_MS = 10 * 60 * 1000;

function alive(pid) {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: the process exists but is someone else's.
    return err.code === 'EPERM';
  }
}

const pidIn = (file) => (existsSync(file) ? Number(readFileSync(file, 'utf8').trim()) : null);

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/**
 * A new folder under the system temp folder, marked with this process's id. First, folders with the same
 * prefix whose run is gone (killed, or stopped before its clean-up) are removed, and a MariaDB still running
 * in one is stopped: each holds about 100 MB and the server a few hundred more. A folder whose run is alive
 * is left alone, so two runs side by side (a fresh-clone test beside a local one) do not disturb each other;
 * so is an unmarked one with a server running, since nothing says whose it is.
 */
export async function scratchDataRoot(prefix) {
  const tmp = os.tmpdir();
  for (const name of readdirSync(tmp)) {
    if (!name.startsWith(prefix)) continue;
    const dir = path.join(tmp, name);
    const owner = pidIn(path.join(dir, OWNER_FILE));
    const server = pidIn(path.join(dir, 'mariadbd.pid'));
    const serving = server !== null && alive(server);
    if (owner !== null && alive(owner)) continue;
    // Unmarked (made by an older checkout, or this instant by another run): only when plainly abandoned.
    if (owner === null && (serving || Date.now() - statSync(dir).mtimeMs < UNMARKED_GRACE_MS)) continue;
    if (serving) {
      say(`Stopping the MariaDB (pid ${server}) a stopped run left in ${dir}`);
      try {
        process.kill(server, 'SIGTERM');
      } catch {
        /* gone meanwhile */
      }
      for (let i = 0; i < 100 && alive(server); i += 1) await sleep(100);
    }
    rmSync(dir, { recursive: true, force: true });
  }
  const dir = mkdtempSync(path.join(tmp, prefix));
  writeFileSync(path.join(dir, OWNER_FILE), String(process.pid));
  return dir;
}
