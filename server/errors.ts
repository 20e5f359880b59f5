import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError, type ZodType } from 'zod';
import type { ApiErrorBody } from '../shared/api/hulls';

/**
 * The one error type of the server. `expected` errors are the person's to fix (bad input, not found,
 * conflict) and are not logged as faults; anything else is a bug and answers 500 without details.
 */
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly field?: string,
    public readonly expected = status < 500,
    public readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what = 'Not found') => new AppError(404, 'not_found', what);
export const forbidden = (what = 'Your role on this hull does not allow that') => new AppError(403, 'forbidden', what);

function fieldPath(path: PropertyKey[]): string {
  return path.map(String).join('.');
}

/** Validate a request body (or query) with a shared zod schema; a failure is a 400 naming the field. */
export function parseInput<T>(schema: ZodType<T>, input: unknown): T {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw zodToAppError(parsed.error);
}

function zodToAppError(error: ZodError): AppError {
  const issues = error.issues.map((i) => ({ field: fieldPath(i.path), message: i.message }));
  const first = issues[0];
  const where = first?.field ? `${first.field}: ` : '';
  const err = new AppError(400, 'invalid_input', `${where}${first?.message ?? 'invalid input'}`, first?.field || undefined, true, { issues });
  return err;
}

export function errorBody(err: AppError): ApiErrorBody {
  const body: ApiErrorBody = { error: { code: err.code, message: err.message } };
  if (err.field) body.error.field = err.field;
  if (err.extra?.issues) body.error.issues = err.extra.issues as { field: string; message: string }[];
  for (const [k, v] of Object.entries(err.extra ?? {})) if (k !== 'issues') (body.error as Record<string, unknown>)[k] = v;
  return body;
}

/** 404 for any /api route that matched nothing. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No such API route: ${req.method} ${req.path}`));
};

/** The last handler: every error leaves the server in the one JSON shape. */
export const errorHandler: ErrorRequestHandler = (err, req, res, next) => {
  if (res.headersSent) return next(err);
  let appError: AppError;
  if (err instanceof AppError) appError = err;
  else if (err instanceof ZodError) appError = zodToAppError(err);
  else if (err?.type === 'entity.parse.failed') appError = new AppError(400, 'invalid_json', 'The request body is not valid JSON');
  else if (err?.type === 'entity.too.large') appError = new AppError(413, 'too_large', 'The request body is too large');
  else appError = new AppError(500, 'internal', 'Something went wrong on the server; nothing was changed', undefined, false);
  if (!appError.expected) req.log?.error({ err }, 'unexpected error');
  res.status(appError.status).json(errorBody(appError));
};
