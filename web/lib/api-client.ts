import { env } from '../config/env';

/** One field problem from the API's `error.details`, e.g. `{ path: ['raHms'], message: '…' }`. */
export interface ApiIssue {
  path: (string | number)[];
  message: string;
}

/**
 * Every failed API call becomes an ApiError: `status` is the HTTP status (0 when the server could
 * not be reached), `code` the API's stable snake_case code (docs/api.md), `details` the field issues.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: ApiIssue[];

  constructor(status: number, code: string, message: string, details: ApiIssue[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
const UNSAFE_METHODS: ReadonlySet<Method> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

// These calls regenerate the server session, so the CSRF token bound to the old session dies with it.
const SESSION_ROTATING_PATHS: RegExp[] = [
  /^\/auth\/sign-in$/,
  /^\/auth\/sign-out$/,
  /^\/auth\/password-reset\/complete$/,
  /^\/invitations\/[^/]+\/accept$/,
];

let csrfToken: string | null = null;
let csrfTokenRequest: Promise<string> | null = null;

/** Forgets the cached CSRF token; the next unsafe request fetches a fresh one. */
export function resetCsrfToken(): void {
  csrfToken = null;
  csrfTokenRequest = null;
}

/** The session's CSRF token (cached; concurrent callers share one request). Exported for the upload helper. */
export async function getCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  // Concurrent mutations share one token request.
  csrfTokenRequest ??= send<{ token: string }>('GET', '/auth/csrf').then(
    ({ token }) => {
      csrfToken = token;
      csrfTokenRequest = null;
      return token;
    },
    (error: unknown) => {
      csrfTokenRequest = null;
      throw error;
    },
  );
  return csrfTokenRequest;
}

function issuesFrom(raw: unknown): ApiIssue[] {
  if (!Array.isArray(raw)) return [];
  return raw
    .filter((d): d is { path: unknown; message: unknown } => typeof d === 'object' && d !== null)
    .map((d) => ({
      path: Array.isArray(d.path) ? d.path.filter((p) => typeof p === 'string' || typeof p === 'number') : [],
      message: typeof d.message === 'string' ? d.message : String(d.message ?? ''),
    }));
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

/** Turns a failed response's parsed body into an ApiError. Exported for the upload helper. */
export function errorFromBody(status: number, body: unknown): ApiError {
  const error = (body as { error?: { code?: unknown; message?: unknown; details?: unknown } } | undefined)?.error;
  if (error && typeof error.code === 'string') {
    const message = typeof error.message === 'string' ? error.message : error.code;
    return new ApiError(status, error.code, message, issuesFrom(error.details));
  }
  return new ApiError(status, 'unexpected_response', `The server answered ${status} without an error description`);
}

async function send<T>(method: Method, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(`${env.apiBaseUrl}${path}`, {
      method,
      credentials: 'same-origin',
      headers: {
        accept: 'application/json',
        ...(body === undefined ? {} : { 'content-type': 'application/json' }),
        ...headers,
      },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network_error', 'The server could not be reached. Check your connection and try again.');
  }
  if (response.status === 204) return undefined as T;
  const parsed = await readJson(response);
  if (!response.ok) throw errorFromBody(response.status, parsed);
  if (parsed === undefined) return undefined as T;
  if (typeof parsed !== 'object' || parsed === null || !('data' in parsed)) {
    throw new ApiError(response.status, 'unexpected_response', 'The server answered without a data field');
  }
  return (parsed as { data: T }).data;
}

/**
 * Calls `/api${path}` and resolves with the unwrapped `data` (undefined for 204).
 * Unsafe methods carry the session's CSRF token (fetched lazily, cached) in `x-csrf-token`;
 * a 403 `csrf_invalid` refreshes the token and retries exactly once.
 */
export async function apiRequest<T>(method: Method, path: string, body?: unknown): Promise<T> {
  if (!UNSAFE_METHODS.has(method)) return send<T>(method, path, body);
  const attempt = async () => send<T>(method, path, body, { 'x-csrf-token': await getCsrfToken() });
  let result: T;
  try {
    result = await attempt();
  } catch (error) {
    if (!(error instanceof ApiError && error.status === 403 && error.code === 'csrf_invalid')) throw error;
    resetCsrfToken();
    result = await attempt();
  }
  if (SESSION_ROTATING_PATHS.some((re) => re.test(path))) resetCsrfToken();
  return result;
}

export const api = {
  get: <T>(path: string) => apiRequest<T>('GET', path),
  post: <T>(path: string, body?: unknown) => apiRequest<T>('POST', path, body),
  put: <T>(path: string, body?: unknown) => apiRequest<T>('PUT', path, body),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>('PATCH', path, body),
  delete: <T = void>(path: string) => apiRequest<T>('DELETE', path),
};
