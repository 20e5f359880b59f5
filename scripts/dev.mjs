#!/usr/bin/env node
// `npm run dev`: the API (restarting on change) behind the Vite dev server, on the same database as npm start.
import { defaultDataRoot, localSecrets, root, setUp, tsxNode } from './lib/setup.mjs';
import { say, spawnChild } from './lib/sh.mjs';

const { env, stop } = await setUp({
  dataRoot: defaultDataRoot(),
  dbPort: Number(process.env.LOFTBENCH_DB_PORT ?? 3417),
  database: process.env.LOFTBENCH_DB_NAME ?? 'loftbench',
  ...localSecrets(),
  mode: 'development',
  seedDemo: true,
});
const apiPort = process.env.LOFTBENCH_PORT ?? '4310';
const devPort = process.env.LOFTBENCH_DEV_PORT ?? '5173';
const childEnv = { ...env, LOFTBENCH_PORT: apiPort, LOFTBENCH_DEV_PORT: devPort, LOFTBENCH_ALLOWED_ORIGINS: `http://127.0.0.1:${devPort},http://localhost:${devPort}` };
const api = spawnChild(process.execPath, [...tsxNode, 'watch', '--clear-screen=false', 'server/index.ts'], { cwd: root, env: childEnv });
const web = spawnChild(process.execPath, ['node_modules/vite/bin/vite.js'], { cwd: root, env: childEnv });
say(`Open http://127.0.0.1:${devPort}/ (API on port ${apiPort})`);

let stopping = false;
async function shutDown() {
  if (stopping) return;
  stopping = true;
  api.child.kill('SIGTERM');
  web.child.kill('SIGTERM');
  await Promise.all([api.exited, web.exited]);
  await stop();
  process.exit(0);
}
process.on('SIGINT', () => void shutDown());
process.on('SIGTERM', () => void shutDown());
await Promise.race([api.exited, web.exited]);
await shutDown();
