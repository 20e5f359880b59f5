import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import type { Config } from '../config';
import { AppError } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The session's anti-forgery token, made on first use. */
export function csrfTokenOf(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = randomBytes(24).toString('base64url');
  return req.session.csrfToken;
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/**
 * Cross-site request forgery guard for every state-changing request (sign-in and uploads included).
 * A browser always sends Origin on such requests: it must be the page's own origin or a configured one.
 * A request without Origin (a script, an old client) must carry the session's token in X-CSRF-Token.
 */
export function originCheck(config: Config): RequestHandler {
  const allowed = new Set(config.allowedOrigins);
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.get('origin');
    if (origin) {
      const own = `${req.protocol}://${req.get('host')}`;
      if (origin === own || allowed.has(origin)) return next();
      return next(new AppError(403, 'foreign_origin', `Requests from ${origin} are not accepted`));
    }
    const token = req.get('x-csrf-token');
    if (token && req.session?.csrfToken && sameToken(token, req.session.csrfToken)) return next();
    return next(new AppError(403, 'missing_origin', 'This request has no Origin header and no valid X-CSRF-Token'));
  };
}
