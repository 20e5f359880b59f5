// Keeps node_modules in step with package-lock.json, without needing any npm package.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { run, say } from './sh.mjs';

/**
 * Install the npm dependencies when node_modules is missing or was installed from another lock file.
 * The stamp lives inside node_modules, so deleting node_modules always triggers a fresh install.
 */
export function ensureDependencies(root) {
  const lock = path.join(root, 'package-lock.json');
  const stamp = path.join(root, 'node_modules', '.loftbench-lock.sha256');
  const want = createHash('sha256').update(readFileSync(lock)).digest('hex');
  const have = existsSync(stamp) ? readFileSync(stamp, 'utf8').trim() : null;
  if (have === want) return;
  say(existsSync(path.join(root, 'node_modules')) ? 'package-lock.json changed: reinstalling npm dependencies (npm ci)...' : 'Installing npm dependencies (npm ci)...');
  run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
  writeFileSync(stamp, `${want}\n`);
}
