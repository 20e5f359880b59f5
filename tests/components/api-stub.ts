import { vi } from 'vitest';

/** One request the app made, as the stubbed fetch saw it. */
export interface RecordedCall {
  method: string;
  path: string;
  search: string;
  headers: Record<string, string>;
  credentials: RequestCredentials | undefined;
  body: unknown;
}

export interface Reply {
  status?: number;
  body?: unknown;
}

/** `'GET /api/hulls'` → a reply, or a function of the request giving one (for answers that change). */
/** A reply, or a function of the call giving one; a promise of one holds the answer back until it settles. */
export type Handlers = Record<string, Reply | ((call: RecordedCall) => Reply | Promise<Reply>)>;

let unexpected: string[] = [];

/**
 * Answers every signed-in page asks for whatever the test is about, unless the test stubs them itself:
 * the header's notices indicator reads GET /api/notices on every page.
 */
const defaults: Handlers = { 'GET /api/notices': { body: { notices: [] } } };

export function takeUnexpectedCalls(): string[] {
  const taken = unexpected;
  unexpected = [];
  return taken;
}

function jsonResponse(status: number, body: unknown): Response {
  if (status === 204) return new Response(null, { status });
  return new Response(JSON.stringify(body ?? {}), { status, headers: { 'Content-Type': 'application/json' } });
}

/** Replaces `fetch` with answers shaped like the Loftbench API's, and records every request. */
export function stubApi(handlers: Handlers) {
  const calls: RecordedCall[] = [];
  const fetchStub = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const href = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const url = new URL(href, 'http://loftbench.test');
    const method = (init.method ?? 'GET').toUpperCase();
    const call: RecordedCall = {
      method,
      path: url.pathname,
      search: url.search,
      // Header names are case-insensitive; keep them lower-case so tests compare one spelling.
      headers: Object.fromEntries([...new Headers(init.headers).entries()].map(([name, value]) => [name.toLowerCase(), value])),
      credentials: init.credentials,
      body: typeof init.body === 'string' ? JSON.parse(init.body) : undefined,
    };
    calls.push(call);
    const handler = handlers[`${method} ${url.pathname}`] ?? defaults[`${method} ${url.pathname}`];
    if (!handler) {
      unexpected.push(`${method} ${url.pathname}`);
      return jsonResponse(500, { error: { code: 'no_stub', message: `No stub for ${method} ${url.pathname}` } });
    }
    const reply = typeof handler === 'function' ? await handler(call) : handler;
    return jsonResponse(reply.status ?? 200, reply.body);
  });
  vi.stubGlobal('fetch', fetchStub);

  return {
    calls,
    /** The requests that change something (everything but GET). */
    writes: () => calls.filter((call) => call.method !== 'GET'),
    count: (method: string, path: string) => calls.filter((call) => call.method === method && call.path === path).length,
  };
}

/** The server's one error shape. */
export function apiError(status: number, code: string, message: string, extra: { field?: string; issues?: { field: string; message: string }[] } = {}): Reply {
  return { status, body: { error: { code, message, ...extra } } };
}
