import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import { AppError } from '../errors';

const WINDOW_MS = 15 * 60 * 1000;

function tooMany(): AppError {
  return new AppError(429, 'too_many_attempts', 'Too many failed sign-in attempts. Wait a few minutes and try again.');
}

/**
 * Failed sign-ins are limited per account and address (10 in 15 minutes), and per address over all
 * accounts (50), so guessing one password or sweeping many accounts from one place are both slowed.
 * Successful sign-ins do not count.
 */
export function signInLimits(): RequestHandler[] {
  const handler: RequestHandler = (_req, _res, next) => next(tooMany());
  const perAccount = rateLimit({
    windowMs: WINDOW_MS,
    limit: 10,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler,
  });
  const perAddress = rateLimit({
    windowMs: WINDOW_MS,
    limit: 50,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler,
  });
  return [perAddress, perAccount];
}
