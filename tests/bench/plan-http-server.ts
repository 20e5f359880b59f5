/**
 * The server side of tests/bench/plan-http.ts, in a process of its own: the load generator must not share
 * the event loop it is measuring (in one process, autocannon's own request and response handling took
 * about half of the thread, and every figure measured both). Builds the app exactly as server/index.ts
 * does, adds the constant route, makes the hulls and the signed-in session, and tells the parent over IPC.
 */
import express from 'express';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { configFromEnv } from '../../server/config';
import { createSequelize } from '../../server/db';
import { requireUser } from '../../server/http/auth';
import { parseInput } from '../../server/errors';
import { savePlanSchema } from '../../shared/api/plan';
import { hullCreate } from '../../server/services/hulls';
import { revisionSave } from '../../server/services/plans';
import { userCreate } from '../../server/services/users';
import { demoPlan } from '../../server/seed/demo-plan';
import type { Plan } from '../../shared/geometry/plan-schema';

const BENCH_ORIGIN = 'http://bench.loftbench.test';

/** What the server process tells the load generator once it is ready. */
export interface BenchServerReady {
  base: string;
  /** A bare Express app in this process, no middleware: the floor the bench compares against. */
  bareBase: string;
  /** The Origin the server accepts changing requests from. */
  origin: string;
  cookie: string;
  readHullId: number;
  writerHullIds: number[];
  plan: Plan;
}

/** A plan of about 50 KB: the demo lines with many more waterlines. */
function bigPlan(): Plan {
  const plan = demoPlan();
  for (let i = 0; plan.lines.lines.length < 400 && JSON.stringify(plan).length < 50_000; i += 1) {
    plan.lines.lines.push({ id: `ln-wl-${i}`, name: `WL ${200 + i * 10}`, kind: 'waterline', z: 200 + i * 10, knuckle: null, cells: Object.fromEntries(plan.lines.stations.map((s, k) => [s.id, 400 + i + k * 3.25])) });
  }
  return plan;
}

async function main() {
  const config = { ...configFromEnv(process.env), allowedOrigins: [BENCH_ORIGIN], logLevel: 'silent', clientDir: null };
  const sequelize = createSequelize(config.db);
  const app = createApp({ config, sequelize });
  // The constant route goes through exactly the same middleware (helmet, logging, JSON, session, passport,
  // origin check, the signed-in guard) as the plan read.
  app.get('/bench/constant', requireUser, (_req, res) => {
    res.json({ ok: true });
  });
  // The floor of a save: the same middleware and the same validation of the body as the save route, then
  // nothing (no comparison, no compression, no database).
  app.post('/bench/validate-only', requireUser, (req, res) => {
    parseInput(savePlanSchema, req.body);
    res.status(201).json({ revision: { id: null } });
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const bare = express();
  bare.get('/bare/constant', (_req, res) => {
    res.json({ ok: true });
  });
  const bareServer = bare.listen(0, '127.0.0.1');
  await new Promise((r) => bareServer.once('listening', r));
  const bareBase = `http://127.0.0.1:${(bareServer.address() as AddressInfo).port}`;

  const user = await userCreate({ email: `bench-${Date.now()}@example.test`, displayName: 'Bench', password: 'bench password 1' }, 10);
  const hull = await hullCreate(user.id, { name: 'Bench hull', units: 'mm', notes: '' });
  const plan = bigPlan();
  await revisionSave({ hullId: hull.id, units: 'mm', authorId: user.id, role: 'owner', baseRevisionId: null, plan });
  // Saves: 10 writers, each on its own hull so each chains its revisions without conflicts.
  const writerHullIds: number[] = [];
  for (let w = 0; w < 10; w++) writerHullIds.push((await hullCreate(user.id, { name: `Bench save ${w}`, units: 'mm', notes: '' })).id);
  const login = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json', origin: BENCH_ORIGIN }, body: JSON.stringify({ email: user.email, password: 'bench password 1' }) });
  const cookie = login.headers.get('set-cookie')!.split(';')[0]!;

  const ready: BenchServerReady = { base, bareBase, origin: BENCH_ORIGIN, cookie, readHullId: hull.id, writerHullIds, plan };
  // The load generator asks for this process's CPU time around each run: CPU per request is the figure that
  // does not depend on what else the machine's two cores are doing.
  process.on('message', (m) => {
    if (m === 'cpu') process.send!({ cpu: process.cpuUsage() });
  });
  process.send!(ready);
  process.on('disconnect', () => {
    server.close();
    bareServer.close();
    void sequelize.close().finally(() => process.exit(0));
  });
}

await main();
