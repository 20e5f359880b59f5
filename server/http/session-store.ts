import type session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';

type StoreBase = ReturnType<typeof connectSessionSequelize>;
type Callback<T = unknown> = (err?: unknown, value?: T) => void;

const READ_CACHE_MS = 60_000;

/**
 * The MariaDB session store with a short read cache in front. Every request of a signed-in person reads
 * its session; without the cache that SELECT is most of the cost of a request. Writes and destroys go
 * to the database first and then update the cache, so a session ended here (sign-out, password reset)
 * ends at once in this process; one Express process serves Loftbench, so there is no other cache to
 * keep in step. A session row deleted directly in the database is seen within a minute.
 */
export function cachedSessionStore(Base: StoreBase) {
  const cache = new Map<string, { json: string; at: number }>();
  const remember = (sid: string, data: session.SessionData) => {
    if (cache.size > 50_000) cache.clear();
    cache.set(sid, { json: JSON.stringify(data), at: Date.now() });
  };

  return class CachedSessionStore extends Base {
    get(sid: string, fn: Callback<session.SessionData | null>) {
      const hit = cache.get(sid);
      if (hit && Date.now() - hit.at < READ_CACHE_MS) {
        const data = JSON.parse(hit.json) as session.SessionData;
        const expires = data.cookie?.expires ? new Date(data.cookie.expires).getTime() : Infinity;
        if (expires > Date.now()) return void fn(null, data);
        cache.delete(sid);
      }
      return super.get(sid, (err: unknown, data?: session.SessionData | null) => {
        if (!err && data) remember(sid, data);
        fn(err, data ?? null);
      });
    }

    set(sid: string, data: session.SessionData, fn?: Callback) {
      return super.set(sid, data, (err: unknown) => {
        if (err) cache.delete(sid);
        else remember(sid, data);
        fn?.(err);
      });
    }

    destroy(sid: string, fn?: Callback) {
      cache.delete(sid);
      return super.destroy(sid, (err: unknown) => fn?.(err));
    }

    /** Forget every cached session of one account (their rows are deleted by the caller). */
    forgetUser(userId: number) {
      for (const [sid, entry] of cache) {
        if ((JSON.parse(entry.json) as { passport?: { user?: number } }).passport?.user === userId) cache.delete(sid);
      }
    }
  };
}
