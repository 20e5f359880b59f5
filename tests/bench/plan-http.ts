/**
 * Benchmark (reports, never gates): reading the latest plan of a hull with a ~50 KB document through the
 * whole middleware stack with a signed-in session, beside a constant route of the same server behind the
 * same middleware; then saving revisions from 10 concurrent writers. Run by `npm run bench`, which starts
 * a throw-away MariaDB with durable settings (innodb_flush_log_at_trx_commit=1).
 */
import autocannon from 'autocannon';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { configFromEnv } from '../../server/config';
import { createSequelize } from '../../server/db';
import { requireUser } from '../../server/http/auth';
import { hullCreate } from '../../server/services/hulls';
import { revisionSave } from '../../server/services/plans';
import { userCreate } from '../../server/services/users';
import { demoPlan } from '../../server/seed/demo-plan';
import type { Plan } from '../../shared/geometry/plan-schema';

const ORIGIN = 'http://bench.loftbench.test';
const config = { ...configFromEnv(process.env), allowedOrigins: [ORIGIN], logLevel: 'silent', clientDir: null };
const sequelize = createSequelize(config.db);
const app = createApp({ config, sequelize });
// The constant route goes through exactly the same middleware (helmet, logging, JSON, session, passport,
// origin check, the signed-in guard) as the plan read.
app.get('/bench/constant', requireUser, (_req, res) => {
  res.json({ ok: true });
});

/** A plan of about 50 KB: the demo lines with many more waterlines. */
function bigPlan(): Plan {
  const plan = demoPlan();
  for (let i = 0; plan.lines.lines.length < 400 && JSON.stringify(plan).length < 50_000; i += 1) {
    plan.lines.lines.push({ id: `ln-wl-${i}`, name: `WL ${200 + i * 10}`, kind: 'waterline', z: 200 + i * 10, knuckle: null, cells: Object.fromEntries(plan.lines.stations.map((s, k) => [s.id, 400 + i + k * 3.25])) });
  }
  return plan;
}

function percentile(values: number[], p: number) {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

async function main() {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const user = await userCreate({ email: `bench-${Date.now()}@example.test`, displayName: 'Bench', password: 'bench password 1' }, 10);
  const hull = await hullCreate(user.id, { name: 'Bench hull', units: 'mm', notes: '' });
  const plan = bigPlan();
  await revisionSave({ hullId: hull.id, units: 'mm', authorId: user.id, role: 'owner', baseRevisionId: null, plan });
  const login = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json', origin: ORIGIN }, body: JSON.stringify({ email: user.email, password: 'bench password 1' }) });
  const cookie = login.headers.get('set-cookie')!.split(';')[0];
  const planBytes = (await (await fetch(`${base}/api/hulls/${hull.id}/plan`, { headers: { cookie } })).text()).length;

  const run = (path: string) =>
    autocannon({ url: `${base}${path}`, connections: 50, duration: Number(process.env.BENCH_SECONDS ?? 10), headers: { cookie } });
  await run('/bench/constant'); // warm-up of both paths
  const constant = await run('/bench/constant');
  const read = await run(`/api/hulls/${hull.id}/plan`);

  // Saves: 10 writers, each on its own hull so each chains its revisions without conflicts.
  const writers = await Promise.all(
    Array.from({ length: 10 }, async (_, w) => {
      const h = await hullCreate(user.id, { name: `Bench save ${w}`, units: 'mm', notes: '' });
      return { hullId: h.id, base: null as number | null };
    }),
  );
  const latencies: number[] = [];
  const until = Date.now() + Number(process.env.BENCH_SECONDS ?? 10) * 1000;
  let failures = 0;
  await Promise.all(
    writers.map(async (w, k) => {
      for (let n = 0; Date.now() < until; n += 1) {
        const p = structuredClone(plan);
        (p.lines.lines[3].cells as Record<string, number>)['st-2'] = 500 + k + n / 1000;
        const t0 = performance.now();
        const res = await fetch(`${base}/api/hulls/${w.hullId}/plan/revisions`, { method: 'POST', headers: { 'content-type': 'application/json', origin: ORIGIN, cookie }, body: JSON.stringify({ baseRevisionId: w.base, plan: p }) });
        const body = await res.json();
        latencies.push(performance.now() - t0);
        if (res.status === 201) w.base = body.revision.id;
        else failures += 1;
      }
    }),
  );

  const line = (name: string, r: autocannon.Result) =>
    `${name.padEnd(28)} ${r.requests.average.toFixed(0).padStart(7)} req/s  p50 ${r.latency.p50} ms  p99 ${r.latency.p99} ms  non-2xx ${r.non2xx}  errors ${r.errors}`;
  process.stdout.write(
    [
      '',
      `plan read benchmark (50 connections, ${process.env.BENCH_SECONDS ?? 10} s each, plan response ${planBytes} bytes)`,
      line('constant route', constant),
      line('latest plan', read),
      `plan read / constant route: ${((100 * read.requests.average) / constant.requests.average).toFixed(1)} %  (target at least 25 %, p99 under 30 ms)`,
      `save revision, 10 writers: ${latencies.length} saves, p50 ${percentile(latencies, 50).toFixed(1)} ms, p95 ${percentile(latencies, 95).toFixed(1)} ms, failures ${failures}  (target p95 under 50 ms)`,
      '',
    ].join('\n'),
  );
  server.close();
  await sequelize.close();
}

await main();
