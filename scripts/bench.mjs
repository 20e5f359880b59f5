#!/usr/bin/env node
// `npm run bench`: the benchmarks under tests/bench. They print figures and never pass or fail. The HTTP
// ones run against a throw-away MariaDB with the same durable settings as npm start.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { buildClient, root, setUp, tsxNode } from './lib/setup.mjs';
import { secret } from './lib/mariadb.mjs';
import { scratchDataRoot } from './lib/scratch.mjs';
import { aptInstall, freePort, run, say, which } from './lib/sh.mjs';

const dataRoot = await scratchDataRoot('loftbench-bench-');
const { env, stop } = await setUp({ dataRoot, dbPort: await freePort(), database: 'loftbench_bench', dbPassword: secret(), sessionSecret: secret(32), mode: 'test', seedDemo: false });
try {
  say('Geometry and export benchmarks (vitest bench)...');
  run(process.execPath, ['node_modules/vitest/vitest.mjs', 'bench', '--run', '--project', 'unit'], { cwd: root, env });
  say('HTTP benchmark of the plan read and save...');
  run(process.execPath, [...tsxNode, 'tests/bench/plan-http.ts'], { cwd: root, env });
  say('Browser benchmark of a drag in the body plan (headless Chromium, built client)...');
  if (!which('chromium')) aptInstall(['chromium'], 'Chromium (for the browser benchmark)');
  const clientDir = path.join(dataRoot, 'client');
  buildClient(clientDir, env);
  run(process.execPath, [...tsxNode, 'tests/bench/drawing-drag.ts'], { cwd: root, env: { ...env, LOFTBENCH_CLIENT_DIR: clientDir, LOFTBENCH_CHROMIUM: which('chromium') } });
} finally {
  await stop();
  rmSync(dataRoot, { recursive: true, force: true });
}
