#!/usr/bin/env node
// `npm test`: the same setup as npm start, on a throw-away MariaDB instance (temporary data folder, free
// ports), so it never collides with a running `npm start`; then the whole suite (unit, components, API on
// the real database, browser tests in Debian's Chromium); then it stops what it started.
// Extra arguments go to vitest, e.g. `npm test -- --project api`.
import { existsSync, readFileSync, rmSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import { buildClient, root, setUp } from './lib/setup.mjs';
import { ensureDependencies } from './lib/deps.mjs';
import { secret } from './lib/mariadb.mjs';
import { scratchDataRoot } from './lib/scratch.mjs';
import { aptInstall, fail, freePort, run, say, spawnChild, which } from './lib/sh.mjs';

// Static checks first: they need no database and fail in seconds.
ensureDependencies(root);
// LOFTBENCH_SKIP_STATIC=1 skips them for a quick local loop; CI never sets it.
if (!process.env.LOFTBENCH_SKIP_STATIC) try {
  say('Typechecking (tsc --noEmit)...');
  run(process.execPath, ['node_modules/typescript/bin/tsc', '--noEmit', '-p', 'tsconfig.json'], { cwd: root });
  say('Linting, including the direction of imports (eslint)...');
  run(process.execPath, ['node_modules/eslint/bin/eslint.js', '.'], { cwd: root });
} catch (error) {
  fail(`Static checks failed: ${error.message}`);
}

const dataRoot = await scratchDataRoot('loftbench-test-');
const dbPort = await freePort();
const { env, stop } = await setUp({
  dataRoot,
  dbPort,
  database: 'loftbench_test',
  dbPassword: secret(),
  sessionSecret: secret(32),
  mode: 'test',
  // The browser tests sign in as a demo account, as a newcomer would.
  seedDemo: true,
});

const cleanUp = async () => {
  await stop();
  rmSync(dataRoot, { recursive: true, force: true });
};

const clientDir = path.join(dataRoot, 'client');
try {
  if (!which('chromium')) aptInstall(['chromium'], 'Chromium (for the browser tests)');
  // The PDF tests render pages with poppler and measure the calibration square on the image.
  if (!which('pdftoppm')) aptInstall(['poppler-utils'], 'poppler-utils (pdftoppm, for the PDF tests)');
  buildClient(clientDir, env);
} catch (error) {
  // A failed install or build (or Ctrl-C during it) must not leave the database running.
  await cleanUp();
  throw error;
}
const outputDir = path.join(root, 'test-output');
mkdirSync(outputDir, { recursive: true });

say(`Running the test suite (MariaDB on 127.0.0.1:${dbPort}, data in ${dataRoot})`);
const report = path.join(dataRoot, 'vitest.json');
const tests = spawnChild(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...process.argv.slice(2)], {
  cwd: root,
  env: { ...env, LOFTBENCH_CLIENT_DIR: clientDir, LOFTBENCH_TEST_OUTPUT: outputDir, LOFTBENCH_CHROMIUM: which('chromium') },
});
let interrupted = false;
const onSignal = () => {
  interrupted = true;
  tests.child.kill('SIGTERM');
};
process.on('SIGINT', onSignal);
process.on('SIGTERM', onSignal);
const code = await tests.exited;
// One plain closing line, the same whatever reporter a CI reads.
const summary = existsSync(report) ? JSON.parse(readFileSync(report, 'utf8')) : null;
await cleanUp();
say(interrupted ? 'Interrupted.' : code === 0 ? 'All tests passed.' : `Tests failed (exit ${code}).`);
if (summary) process.stdout.write(`${summary.numPassedTests} passed, ${summary.numFailedTests} failed, ${summary.numPendingTests + summary.numTodoTests} skipped\n`);
process.exit(interrupted ? 130 : code);
