/**
 * Benchmark (reports, never gates): reading the latest plan of a hull with a ~50 KB document through the
 * whole middleware stack with a signed-in session, beside a constant route of the same server behind the
 * same middleware; then saving revisions from 10 concurrent writers. Run by `npm run bench`, which starts
 * a throw-away MariaDB with durable settings (innodb_flush_log_at_trx_commit=1). BENCH_SECONDS sets the length
 * of each run (default 10); BENCH_ONLY=read or BENCH_ONLY=save runs one half, e.g. to profile it.
 */
import autocannon from 'autocannon';
import { fork } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { BenchServerReady } from './plan-http-server';

/**
 * Start the server in its own process (plan-http-server.ts) and wait until it has its hulls and session.
 * BENCH_SERVER_NODE_ARGS adds Node options to that process only, e.g. "--cpu-prof --cpu-prof-dir=/tmp/p"
 * to profile the server (NODE_OPTIONS refuses --cpu-prof, and would profile the load generator too).
 */
async function startServer() {
  const extra = (process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const child = fork(fileURLToPath(new URL('./plan-http-server.ts', import.meta.url)), [], { execArgv: ['--import', 'tsx', ...extra], env: process.env });
  const ready = await new Promise<BenchServerReady>((resolve, reject) => {
    child.once('message', (m) => resolve(m as BenchServerReady));
    child.once('exit', (code) => reject(new Error(`the bench server stopped (exit ${code})`)));
  });
  /** The server process's CPU time so far (user + system), in milliseconds. */
  const cpuMs = () =>
    new Promise<number>((resolve) => {
      child.once('message', (m) => {
        const { cpu } = m as { cpu: NodeJS.CpuUsage };
        resolve((cpu.user + cpu.system) / 1000);
      });
      child.send('cpu');
    });
  return { ready, cpuMs, stop: () => child.disconnect() };
}

function percentile(values: number[], p: number) {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const ONLY = process.env.BENCH_ONLY ?? '';

type CpuMs = () => Promise<number>;

/** Run `work`, which makes `count()` requests, and say how many milliseconds of server CPU each took. */
async function cpuPer<T>(cpuMs: CpuMs, work: () => Promise<T>, count: (r: T) => number): Promise<[T, number]> {
  const before = await cpuMs();
  const result = await work();
  return [result, ((await cpuMs()) - before) / Math.max(1, count(result))];
}

const line = (name: string, [r, cpu]: [autocannon.Result, number]) =>
  `${name.padEnd(36)} ${r.requests.average.toFixed(0).padStart(7)} req/s  p50 ${r.latency.p50} ms  p99 ${r.latency.p99} ms  server CPU ${cpu.toFixed(2)} ms/req  non-2xx ${r.non2xx}  errors ${r.errors}`;

/** 50 connections reading one path with the signed-in cookie; full 200 responses only count. */
async function readRuns(ready: BenchServerReady, cpuMs: CpuMs): Promise<string[]> {
  const { base, cookie } = ready;
  const planBytes = (await (await fetch(`${base}/api/hulls/${ready.readHullId}/plan`, { headers: { cookie } })).text()).length;
  const run = (url: string) => cpuPer(cpuMs, () => autocannon({ url, connections: 50, duration: SECONDS, headers: { cookie } }), (r) => r.requests.total);
  await run(`${base}/bench/constant`); // warm-up of both paths
  // The floor: the same Express, in the same server process, with no middleware at all. Its p99 at 50
  // connections is what this machine allows any Express route, before any of Loftbench's work.
  const bare = await run(`${ready.bareBase}/bare/constant`);
  const constant = await run(`${base}/bench/constant`);
  const read = await run(`${base}/api/hulls/${ready.readHullId}/plan`);
  return [
    `plan read benchmark (50 connections, ${SECONDS} s each, plan response ${planBytes} bytes)`,
    line('bare Express route, no middleware', bare),
    line('constant route', constant),
    line('latest plan', read),
    `plan read / constant route: ${((100 * read[0].requests.average) / constant[0].requests.average).toFixed(1)} %  (target at least 25 %, p99 under 30 ms)`,
  ];
}

/** 10 writers, each chaining revisions on its own hull for SECONDS; the validation floor first. */
async function saveRuns(ready: BenchServerReady, cpuMs: CpuMs): Promise<string[]> {
  return [
    await writerRun(ready, cpuMs, () => '/bench/validate-only', 'save floor: validation only, 10 writers'),
    await writerRun(ready, cpuMs, (hullId) => `/api/hulls/${hullId}/plan/revisions`, 'save revision, 10 writers'),
  ];
}

async function writerRun(ready: BenchServerReady, cpuMs: CpuMs, pathOf: (hullId: number) => string, name: string): Promise<string> {
  const { base, cookie, plan, origin } = ready;
  const writers = ready.writerHullIds.map((hullId) => ({ hullId, base: null as number | null }));
  const latencies: number[] = [];
  const until = Date.now() + SECONDS * 1000;
  let failures = 0;
  const cpuBefore = await cpuMs();
  await Promise.all(
    writers.map(async (w, k) => {
      for (let n = 0; Date.now() < until; n += 1) {
        const p = structuredClone(plan);
        (p.lines.lines[3].cells as Record<string, number>)['st-2'] = 500 + k + n / 1000;
        const t0 = performance.now();
        const res = await fetch(`${base}${pathOf(w.hullId)}`, { method: 'POST', headers: { 'content-type': 'application/json', origin, cookie }, body: JSON.stringify({ baseRevisionId: w.base, plan: p }) });
        const body = await res.json();
        latencies.push(performance.now() - t0);
        if (res.status === 201) w.base = body.revision.id;
        else failures += 1;
      }
    }),
  );
  const cpu = ((await cpuMs()) - cpuBefore) / Math.max(1, latencies.length);
  return `${name}: ${latencies.length} saves, p50 ${percentile(latencies, 50).toFixed(1)} ms, p95 ${percentile(latencies, 95).toFixed(1)} ms, server CPU ${cpu.toFixed(2)} ms/save, failures ${failures}  (target p95 under 50 ms)`;
}

async function main() {
  const { ready, cpuMs, stop } = await startServer();
  const lines = ['', ...(ONLY === 'save' ? [] : await readRuns(ready, cpuMs)), ...(ONLY === 'read' ? [] : await saveRuns(ready, cpuMs)), ''];
  process.stdout.write(lines.join('\n'));
  stop();
}

await main();
