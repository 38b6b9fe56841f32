import { vi } from 'vitest';

/** One request the client made, as the fake server saw it. */
export interface RecordedCall {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
}
export interface Reply {
  status: number;
  body?: unknown;
}
export type Handler = Reply | ((call: RecordedCall, params: Record<string, string>) => Reply);

/** `{ data }` success body, as the API sends it (docs/api.md). */
export const ok = (data: unknown, status = 200): Reply => ({ status, body: { data } });
/** `{ error: { code, message, details } }` failure body, as the API sends it (docs/api.md). */
export const fail = (status: number, code: string, message: string, details?: { path: (string | number)[]; message: string }[]): Reply => ({
  status,
  body: { error: { code, message, ...(details ? { details } : {}) } },
});
export const noContent = (): Reply => ({ status: 204 });

function matchPattern(pattern: string, path: string): Record<string, string> | null {
  const p = pattern.split('/');
  const a = path.split('/');
  if (p.length !== a.length) return null;
  const params: Record<string, string> = {};
  for (let i = 0; i < p.length; i++) {
    if (p[i].startsWith(':')) params[p[i].slice(1)] = decodeURIComponent(a[i]);
    else if (p[i] !== a[i]) return null;
  }
  return params;
}

/**
 * Replaces global fetch with a fake API. `routes` maps "METHOD /api/path/:param" to a reply or a
 * function of the call. Unknown routes answer 404 `not_found` and are listed in `unhandled`.
 */
export function mockApi(routes: Record<string, Handler>) {
  const calls: RecordedCall[] = [];
  const unhandled: string[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(String(input), 'http://localhost');
    const method = (init?.method ?? 'GET').toUpperCase();
    const headers = Object.fromEntries(new Headers(init?.headers).entries());
    const body = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    const call: RecordedCall = { method, path: url.pathname, headers, body };
    calls.push(call);
    let reply: Reply | undefined;
    for (const [key, handler] of Object.entries(routes)) {
      const [routeMethod, pattern] = key.split(' ');
      const params = routeMethod === method ? matchPattern(pattern, url.pathname) : null;
      if (params) {
        reply = typeof handler === 'function' ? handler(call, params) : handler;
        break;
      }
    }
    if (!reply) {
      unhandled.push(`${method} ${url.pathname}`);
      reply = fail(404, 'not_found', 'no such route in the test');
    }
    return new Response(reply.body === undefined ? null : JSON.stringify(reply.body), {
      status: reply.status,
      headers: reply.body === undefined ? {} : { 'content-type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  const callsTo = (method: string, path: string) => calls.filter((c) => c.method === method && c.path === path);
  return { fetchMock, calls, unhandled, callsTo };
}

export const VIEWER_ME = {
  user: { id: '7', email: 'vera@example.org', displayName: 'Vera Viewer', role: 'viewer' },
  permissions: ['observatories:read', 'pulsars:read', 'jobs:read'],
};
export const ADMIN_ME = {
  user: { id: '1', email: 'ada@example.org', displayName: 'Ada Admin', role: 'admin' },
  permissions: [
    'users:manage',
    'outbox:read',
    'observatories:manage',
    'observatories:read',
    'pulsars:read',
    'pulsars:create',
    'jobs:start',
    'jobs:read',
  ],
};
