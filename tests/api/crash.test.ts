import { spawn, type ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPlan } from '../../server/seed/demo-plan';
import type { Plan } from '../../shared/geometry/plan-schema';
import { makeUser, testServer, TEST_ORIGIN, type TestServer } from './support';

/**
 * The server is a real process here, killed with SIGKILL while saves are in flight: what answered 2xx
 * must be there after a restart, and the hull's latest pointer must be consistent with the revisions.
 */
let server: TestServer;
let port: number;
beforeAll(async () => {
  server = testServer();
  const net = await import('node:net');
  port = await new Promise<number>((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const p = (s.address() as { port: number }).port;
      s.close(() => resolve(p));
    });
  });
});
afterAll(() => server.close());

function startServer(): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, LOFTBENCH_PORT: String(port), LOFTBENCH_HOST: '127.0.0.1', LOFTBENCH_ALLOWED_ORIGINS: TEST_ORIGIN, LOFTBENCH_CLIENT_DIR: '', LOFTBENCH_LOG_LEVEL: 'silent' },
    stdio: 'ignore',
  });
}

async function untilUp() {
  for (let i = 0; i < 200; i += 1) {
    try {
      if ((await fetch(`http://127.0.0.1:${port}/api/health`)).ok) return;
    } catch {
      /* not yet */
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('server did not come up');
}

const base = () => `http://127.0.0.1:${port}`;

describe('a server killed while saving', () => {
  it('keeps every save that answered 2xx, and a consistent latest revision', async () => {
    const user = await makeUser('crash');
    let child = startServer();
    await untilUp();
    const login = await fetch(`${base()}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json', origin: TEST_ORIGIN }, body: JSON.stringify({ email: user.email, password: user.password }) });
    const cookie = login.headers.get('set-cookie')!.split(';')[0];
    const headers = { 'content-type': 'application/json', origin: TEST_ORIGIN, cookie };
    const hullId = (await (await fetch(`${base()}/api/hulls`, { method: 'POST', headers, body: JSON.stringify({ name: 'Crash hull', units: 'mm' }) })).json()).hull.id as number;

    const acknowledged = new Map<number, Plan>();
    let killed = false;
    // Six writers each keep saving on top of the latest revision they know of, with a distinct change.
    const writer = async (w: number) => {
      let latest: number | null = null;
      for (let n = 0; !killed && n < 400; n += 1) {
        const plan = demoPlan();
        (plan.lines.lines[2].cells as Record<string, { y: number; z: number }>)['st-3'] = { y: 900 + w, z: 790 + n / 100 };
        try {
          const res: Response = await fetch(`${base()}/api/hulls/${hullId}/plan/revisions`, { method: 'POST', headers, body: JSON.stringify({ baseRevisionId: latest, plan }) });
          const body = (await res.json()) as { revision: { id: number }; error: { latestRevisionId: number | null } };
          if (res.status === 201) {
            acknowledged.set(body.revision.id, plan);
            latest = body.revision.id;
          } else if (res.status === 409) latest = body.error.latestRevisionId;
          else throw new Error(`unexpected ${res.status}`);
        } catch (err) {
          if (!killed) throw err;
        }
      }
    };
    const writers = Promise.all(Array.from({ length: 6 }, (_, w) => writer(w)));
    while (acknowledged.size < 15) await new Promise((r) => setTimeout(r, 5));
    child.kill('SIGKILL');
    killed = true;
    await writers;
    expect(acknowledged.size).toBeGreaterThanOrEqual(15);

    child = startServer();
    await untilUp();
    try {
      for (const [id, plan] of acknowledged) {
        const res = await fetch(`${base()}/api/hulls/${hullId}/plan/revisions/${id}`, { headers });
        expect(res.status).toBe(200);
        expect((await res.json()).plan).toEqual(plan);
      }
      const latest = (await (await fetch(`${base()}/api/hulls/${hullId}/plan`, { headers })).json()).revision;
      const all = (await (await fetch(`${base()}/api/hulls/${hullId}/plan/revisions`, { headers })).json()).revisions as { id: number; baseRevisionId: number | null }[];
      // The latest is the newest revision, and following bases from it visits every revision once.
      expect(latest.id).toBe(all[0].id);
      const byId = new Map(all.map((r) => [r.id, r]));
      const chain: number[] = [];
      for (let at: number | null = latest.id; at !== null; at = byId.get(at)!.baseRevisionId) chain.push(at);
      expect(chain.sort((a, b) => a - b)).toEqual(all.map((r) => r.id).sort((a, b) => a - b));
      for (const id of acknowledged.keys()) expect(chain).toContain(id);
    } finally {
      child.kill('SIGTERM');
    }
  });
});
