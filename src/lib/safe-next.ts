/**
 * Where to go after signing in. Only a path on this site is accepted, so a crafted link cannot send a
 * person elsewhere (`//host` and `/\host` are other sites to a browser).
 */
export function safeNext(next: string | null | undefined, fallback = '/hulls'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next === '/sign-in' || next.startsWith('/sign-in?') || next === '/sign-up' || next.startsWith('/sign-up?')) return fallback;
  return next;
}

/** The sign-in address that brings the person back to `path` afterwards. */
export function signInPath(path: string): string {
  return path === '/' || path === '' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(path)}`;
}
