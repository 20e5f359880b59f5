/**
 * Benchmark (reports, never gates): reading the latest plan of a hull with a ~50 KB document through the
 * whole middleware stack with a signed-in session, beside a constant route of the same server behind the
 * same middleware; then saving revisions from 10 concurrent writers. Run by `npm run bench`, which starts
 * a throw-away MariaDB with durable settings (innodb_flush_log_at_trx_commit=1).
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
  return { ready, stop: () => child.disconnect() };
}

function percentile(values: number[], p: number) {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

async function main() {
  const { ready, stop } = await startServer();
  const { base, cookie, plan, origin } = ready;
  const planBytes = (await (await fetch(`${base}/api/hulls/${ready.readHullId}/plan`, { headers: { cookie } })).text()).length;

  const run = (path: string) =>
    autocannon({ url: `${base}${path}`, connections: 50, duration: Number(process.env.BENCH_SECONDS ?? 10), headers: { cookie } });
  await run('/bench/constant'); // warm-up of both paths
  const constant = await run('/bench/constant');
  const read = await run(`/api/hulls/${ready.readHullId}/plan`);

  const writers = ready.writerHullIds.map((hullId) => ({ hullId, base: null as number | null }));
  const latencies: number[] = [];
  const until = Date.now() + Number(process.env.BENCH_SECONDS ?? 10) * 1000;
  let failures = 0;
  await Promise.all(
    writers.map(async (w, k) => {
      for (let n = 0; Date.now() < until; n += 1) {
        const p = structuredClone(plan);
        (p.lines.lines[3].cells as Record<string, number>)['st-2'] = 500 + k + n / 1000;
        const t0 = performance.now();
        const res = await fetch(`${base}/api/hulls/${w.hullId}/plan/revisions`, { method: 'POST', headers: { 'content-type': 'application/json', origin, cookie }, body: JSON.stringify({ baseRevisionId: w.base, plan: p }) });
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
  stop();
}

await main();
