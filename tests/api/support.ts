import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import TestAgent from 'supertest/lib/agent';
import { randomUUID } from 'node:crypto';
import { createApp } from '../../server/app';
import { configFromEnv, type Config } from '../../server/config';
import { createSequelize } from '../../server/db';
import { userCreate } from '../../server/services/users';
import type { SessionUser } from '../../shared/api/auth';

/** The Origin the API tests send: configured as allowed, as a deployment would configure its own. */
export const TEST_ORIGIN = 'http://workshop.loftbench.test';

export interface TestServer {
  app: Express;
  sequelize: Sequelize;
  config: Config;
  close: () => Promise<void>;
}

/**
 * A real app on the real MariaDB that scripts/test.mjs started (its settings come in the environment).
 * Nothing here mocks the database.
 */
export function testServer(overrides: Partial<Config> = {}): TestServer {
  const base = configFromEnv(process.env);
  const config: Config = { ...base, allowedOrigins: [TEST_ORIGIN], logLevel: 'silent', clientDir: null, ...overrides };
  const sequelize = createSequelize(config.db);
  const app = createApp({ config, sequelize });
  return { app, sequelize, config, close: () => sequelize.close() };
}

/** A unique e-mail address for one test. */
export const uniqueEmail = (who = 'person') => `${who}-${randomUUID().slice(0, 8)}@example.test`;

export const TEST_PASSWORD = 'correct horse battery';

/** Create an account directly (bcrypt cost 10, the floor, to keep the suite quick). */
export async function makeUser(who = 'person'): Promise<SessionUser & { password: string }> {
  const email = uniqueEmail(who);
  const user = await userCreate({ email, displayName: `Test ${who}`, password: TEST_PASSWORD }, 10);
  return { ...user, password: TEST_PASSWORD };
}

/** A supertest agent (keeps cookies) that sends the allowed Origin on every request. */
export function agentOf(app: Express): TestAgent {
  return request.agent(app).set('Origin', TEST_ORIGIN);
}

/** An agent signed in as this person. */
export async function signedIn(app: Express, user: { email: string; password: string }): Promise<TestAgent> {
  const agent = agentOf(app);
  const res = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
  if (res.status !== 200) throw new Error(`sign-in failed for ${user.email}: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

interface RouterLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: RouterLayer[] };
}

/** Every route the app has, as `METHOD /path`, read from Express's own router stack. */
export function routesOf(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: RouterLayer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method !== '_all') found.push(`${method.toUpperCase()} ${layer.route.path}`);
        }
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack);
      }
    }
  };
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack);
  return found;
}

/** GET a file as a Buffer in `body` (supertest parses only text and JSON by itself): PDFs, zips, DXFs. */
export const binary = (agent: TestAgent, path: string) =>
  agent.get(path).buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });
