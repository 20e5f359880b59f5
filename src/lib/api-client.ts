import type { ApiErrorBody } from '../../shared/api/hulls';

/** One problem with one input, as the server reports it (`field` is a dotted path such as `email`). */
export interface FieldIssue {
  field: string;
  message: string;
}

/**
 * Every failed API call becomes one of these. `status` is the HTTP status (0 when the server could not be
 * reached), `code` the server's machine-readable code, `field` the input the server blames, if any.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly field: string | undefined;
  readonly issues: FieldIssue[];
  /** Everything else the server put in `error` (a 409's `latestRevision`, an import's bad `cells`...). */
  readonly details: Record<string, unknown>;

  constructor(init: { status: number; code: string; message: string; field?: string; issues?: FieldIssue[]; details?: Record<string, unknown> }) {
    super(init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.field = init.field;
    this.issues = init.issues ?? [];
    this.details = init.details ?? {};
  }
}

/** How the client gets what only the app layer knows: the CSRF token (from the cached session) and where to send a signed-out person. */
export interface ApiClientConfig {
  /** The `csrfToken` of `GET /api/session`; `fresh` asks for a new fetch instead of the cached one. */
  getCsrfToken: (options: { fresh: boolean }) => Promise<string>;
  /** Called when a request comes back 401 (except where the call opted out, as sign-in does). */
  onUnauthorized: () => void;
}

let config: ApiClientConfig | null = null;

/** Wires the client to the app's query cache and router; `src/app/provider.tsx` calls this once per app. */
export function configureApiClient(next: ApiClientConfig): void {
  config = next;
}

function requireConfig(): ApiClientConfig {
  if (!config) throw new Error('configureApiClient() must run before the first API call');
  return config;
}

export interface RequestOptions {
  signal?: AbortSignal;
  /** Sign-in answers 401 for a wrong password; that must show on the form, not bounce to the sign-in page. */
  redirectOnUnauthorized?: boolean;
  /** Let the request outlive the page: the autosave sent as the tab is hidden or closed. */
  keepalive?: boolean;
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

const networkMessage = 'Loftbench could not reach its server. Check the connection, then try again.';

function isApiErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === 'object' && error !== null && typeof (error as { code?: unknown }).code === 'string';
}

/** Turns a failed response into an ApiError, whether or not its body has the server's error shape. */
export async function toApiError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await response.json();
  } catch {
    // A proxy or a crash can answer with HTML or nothing; the status alone must then do.
  }
  if (isApiErrorBody(body)) {
    const { code, message, field, issues, ...details } = body.error as ApiErrorBody['error'] & Record<string, unknown>;
    return new ApiError({
      details,
      status: response.status,
      code,
      message: typeof message === 'string' && message ? message : `The server refused the request (${code}).`,
      field: typeof field === 'string' ? field : undefined,
      issues: Array.isArray(issues) ? issues.filter((i) => typeof i?.field === 'string' && typeof i?.message === 'string') : [],
    });
  }
  return new ApiError({
    status: response.status,
    code: `http_${response.status}`,
    message: response.status >= 500 ? 'The server had a problem. Try again in a moment.' : `The server answered ${response.status}.`,
  });
}

/** The server's answer to a missing or stale X-CSRF-Token (`missing_origin` when there was no Origin either). */
function isCsrfFailure(error: ApiError): boolean {
  return error.status === 403 && /csrf|missing_origin/i.test(error.code);
}

async function send(method: Method, path: string, body: unknown, options: RequestOptions, csrfToken: string | null): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // A form (a file upload) sets its own multipart Content-Type with the boundary; JSON is said outright.
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (csrfToken !== null) headers['X-CSRF-Token'] = csrfToken;
  try {
    return await fetch(path, {
      method,
      headers,
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      credentials: 'same-origin',
      signal: options.signal,
      ...(options.keepalive ? { keepalive: true } : {}),
    });
  } catch (cause) {
    if (options.signal?.aborted) throw cause;
    throw new ApiError({ status: 0, code: 'network', message: networkMessage });
  }
}

async function request<T>(method: Method, path: string, body: unknown, options: RequestOptions = {}): Promise<T> {
  const { getCsrfToken, onUnauthorized } = requireConfig();
  const changesState = method !== 'GET';
  let response = await send(method, path, body, options, changesState ? await getCsrfToken({ fresh: false }) : null);
  let error = response.ok ? null : await toApiError(response);

  // A token can go stale when the server renews the session; fetch a new one and try once more.
  if (changesState && error && isCsrfFailure(error)) {
    response = await send(method, path, body, options, await getCsrfToken({ fresh: true }));
    error = response.ok ? null : await toApiError(response);
  }

  if (error) {
    if (error.status === 401 && options.redirectOnUnauthorized !== false) onUnauthorized();
    throw error;
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

/** JSON over fetch, same origin, with the session cookie and (on every state-changing call) the CSRF token. */
export const api = {
  get: <T>(path: string, options?: RequestOptions) => request<T>('GET', path, undefined, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, body, options),
  /** A multipart form (file uploads): sent as it is, the browser choosing the boundary. */
  postForm: <T>(path: string, form: FormData, options?: RequestOptions) => request<T>('POST', path, form, options),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', path, body, options),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PUT', path, body, options),
  delete: <T>(path: string, options?: RequestOptions) => request<T>('DELETE', path, undefined, options),
};

/** Plain words for an error of any kind, for places that have no better message of their own. */
export function describeError(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return 'Something went wrong in the app. Reload the page and try again.';
}
