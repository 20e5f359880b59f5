#!/usr/bin/env node
// `npm run backup`: a consistent dump of the Loftbench database (mariadb-dump --single-transaction) into
// the data folder's backups/ (or the path given as the first argument). The instance must be running
// (npm start in another terminal) or is started for the dump and stopped again.
import { createWriteStream, mkdirSync } from 'node:fs';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { ensureMariadbInstalled, instancePaths, startInstance, stopInstance } from './lib/mariadb.mjs';
import { defaultDataRoot } from './lib/setup.mjs';
import { fail, say } from './lib/sh.mjs';

ensureMariadbInstalled();
const dataRoot = defaultDataRoot();
const paths = instancePaths(dataRoot, Number(process.env.LOFTBENCH_DB_PORT ?? 3417));
const database = process.env.LOFTBENCH_DB_NAME ?? 'loftbench';
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const target = path.resolve(process.argv[2] ?? path.join(dataRoot, 'backups', `loftbench-${stamp}.sql`));
mkdirSync(path.dirname(target), { recursive: true });

const { adminPassword, startedHere } = await startInstance(paths);
const dump = spawn(
  'mariadb-dump',
  ['--no-defaults', `--socket=${paths.socket}`, '-uroot', '--single-transaction', '--routines', '--triggers', '--databases', database],
  { env: { ...process.env, MYSQL_PWD: adminPassword }, stdio: ['ignore', 'pipe', 'inherit'] },
);
dump.stdout.pipe(createWriteStream(target));
const code = await new Promise((resolve) => dump.on('exit', resolve));
if (startedHere) await stopInstance(paths, adminPassword);
if (code !== 0) fail(`mariadb-dump failed (exit ${code}); nothing usable was written to ${target}`);
say(`Backup written to ${target}`);
