#!/usr/bin/env node
// `npm start`: set everything up on this machine and serve Loftbench. Demo mode by default (seeds an
// invented hull and three demo accounts into an empty database); LOFTBENCH_MODE=production seeds nothing
// and needs its secrets from the environment.
import path from 'node:path';
import { buildClient, defaultDataRoot, localSecrets, root, setUp, tsxNode } from './lib/setup.mjs';
import { fail, say, spawnChild } from './lib/sh.mjs';

const mode = process.env.LOFTBENCH_MODE === 'production' ? 'production' : 'demo';
let secrets;
if (mode === 'production') {
  const dbPassword = process.env.LOFTBENCH_DB_PASSWORD;
  const sessionSecret = process.env.LOFTBENCH_SESSION_SECRET;
  if (!dbPassword || !sessionSecret || sessionSecret.length < 32) {
    fail('Production mode needs LOFTBENCH_DB_PASSWORD and LOFTBENCH_SESSION_SECRET (at least 32 characters) in the environment.');
  }
  secrets = { dbPassword, sessionSecret };
} else {
  secrets = localSecrets();
}

const { env, stop } = await setUp({
  dataRoot: defaultDataRoot(),
  dbPort: Number(process.env.LOFTBENCH_DB_PORT ?? 3417),
  database: process.env.LOFTBENCH_DB_NAME ?? 'loftbench',
  ...secrets,
  mode,
  seedDemo: mode === 'demo',
});
const clientDir = path.join(root, 'dist');
buildClient(clientDir, env);

const host = process.env.LOFTBENCH_HOST ?? '127.0.0.1';
const port = process.env.LOFTBENCH_PORT ?? '4310';
const server = spawnChild(process.execPath, [...tsxNode, 'server/index.ts'], {
  cwd: root,
  env: { ...env, LOFTBENCH_HOST: host, LOFTBENCH_PORT: port, LOFTBENCH_CLIENT_DIR: clientDir },
});

let stopping = false;
async function shutDown(signal) {
  if (stopping) return;
  stopping = true;
  say(`${signal}: stopping the web server...`);
  server.child.kill('SIGTERM');
  await server.exited;
  await stop();
  say('Stopped. Your data is kept; run npm start again to carry on.');
  process.exit(0);
}
process.on('SIGINT', () => void shutDown('Ctrl-C'));
process.on('SIGTERM', () => void shutDown('SIGTERM'));

const code = await server.exited;
if (!stopping) {
  await stop();
  process.exit(code);
}
