import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { HullMember } from '../../server/models';
import { hullCreate } from '../../server/services/hulls';
import { revisionSave } from '../../server/services/plans';
import { demoPlan } from '../../server/seed/demo-plan';
import { callers, matrix, type Caller, type MatrixFixture } from './permission-matrix';
import { agentOf, makeUser, routesOf, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
const people = {} as Record<Exclude<Caller, 'anonymous'>, Awaited<ReturnType<typeof makeUser>>>;
const agents = {} as Record<Caller, TestAgent>;

beforeAll(async () => {
  server = testServer();
  for (const who of ['owner', 'builder', 'designer', 'helper', 'stranger'] as const) {
    people[who] = await makeUser(who);
    agents[who] = await signedIn(server.app, people[who]);
  }
  agents.anonymous = agentOf(server.app);
});
afterAll(() => server.close());

/** A fresh hull with the full crew, so that no cell depends on what another cell did. */
async function fixture(caller: Caller): Promise<MatrixFixture> {
  const hull = await hullCreate(people.owner.id, { name: 'Matrix hull', units: 'mm', notes: '' });
  for (const role of ['builder', 'designer', 'helper'] as const) {
    await HullMember.create({ hullId: hull.id, userId: people[role].id, role });
  }
  const { revision } = await revisionSave({ hullId: hull.id, units: 'mm', authorId: people.owner.id, role: 'owner', baseRevisionId: null, plan: demoPlan() });
  const spare = await makeUser('spare');
  return { hullId: hull.id, revisionId: revision.id, helperUserId: people.helper.id, spareEmail: spare.email, caller: caller === 'anonymous' ? null : people[caller], who: caller, people, prepared: {} };
}

describe('permission matrix', () => {
  it('has exactly one row for every route of the app', () => {
    const routes = routesOf(server.app).sort();
    expect(routes.length).toBeGreaterThan(5);
    expect(routes.filter((r) => !(r in matrix)), 'routes without a row in tests/api/permission-matrix.ts').toEqual([]);
    expect(Object.keys(matrix).filter((r) => !routes.includes(r)), 'rows for routes that do not exist').toEqual([]);
  });

  for (const [route, row] of Object.entries(matrix)) {
    const method = route.split(' ')[0].toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete';
    for (const caller of callers) {
      it(`${route} as ${caller} → ${row.expect[caller]}`, async () => {
        const f = await fixture(caller);
        if (row.prepare) f.prepared = await row.prepare(f);
        let agent = agents[caller];
        if (row.freshSession) agent = caller === 'anonymous' ? agentOf(server.app) : await signedIn(server.app, people[caller]);
        let req = agent[method](row.path(f));
        if (row.multipart) {
          const parts = row.multipart(f);
          for (const [k, v] of Object.entries(parts.fields ?? {})) req = req.field(k, v);
          for (const file of parts.files ?? []) req = req.attach(file.field, file.content, file.name);
        } else if (row.body) {
          req = req.send(row.body(f) as object);
        }
        const res = await req;
        expect(res.status, JSON.stringify(res.body)).toBe(row.expect[caller]);
      });
    }
  }
});
