/**
 * Every route × every role (and anonymous): allowed or denied exactly as the
 * expectation table below says. The table is written out by hand from
 * docs/api.md, independently of api/auth/permissions.ts, and the test fails
 * if the app has a route the table does not list (or the other way round),
 * or an Express route that bypassed the registry.
 */
import type { Application } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../../api/auth/permissions';
import { routesOf } from '../../api/routes/route-table';
import { anonymousClient, signedInClient, type Client } from './helpers/agents';
import { createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

type Who = 'anonymous' | Role;
const EVERYONE: Who[] = ['anonymous', ...ROLES];
const SIGNED_IN: Who[] = [...ROLES];
const ANALYST_UP: Who[] = ['analyst', 'lead', 'admin'];
const ADMIN: Who[] = ['admin'];

/** Who may call each route (docs/api.md "who" column), with a harmless path to call it on. */
const EXPECTED: Record<string, { allowed: Who[]; url: string; endsSession?: true }> = {
  'GET /api/health': { allowed: EVERYONE, url: '/api/health' },
  'GET /api/auth/csrf': { allowed: EVERYONE, url: '/api/auth/csrf' },
  'POST /api/auth/sign-in': { allowed: EVERYONE, url: '/api/auth/sign-in' },
  'POST /api/auth/sign-out': { allowed: SIGNED_IN, url: '/api/auth/sign-out', endsSession: true },
  'GET /api/auth/me': { allowed: SIGNED_IN, url: '/api/auth/me' },
  'POST /api/auth/password-reset': { allowed: EVERYONE, url: '/api/auth/password-reset' },
  'POST /api/auth/password-reset/complete': { allowed: EVERYONE, url: '/api/auth/password-reset/complete' },
  'GET /api/invitations/:token': { allowed: EVERYONE, url: '/api/invitations/unknown-token' },
  'POST /api/invitations/:token/accept': { allowed: EVERYONE, url: '/api/invitations/unknown-token/accept' },
  'GET /api/users': { allowed: ADMIN, url: '/api/users' },
  'POST /api/users/invitations': { allowed: ADMIN, url: '/api/users/invitations' },
  'PATCH /api/users/:id': { allowed: ADMIN, url: '/api/users/2147480000' },
  'GET /api/outbox': { allowed: ADMIN, url: '/api/outbox' },
  'GET /api/observatories': { allowed: SIGNED_IN, url: '/api/observatories' },
  'POST /api/observatories': { allowed: ADMIN, url: '/api/observatories' },
  'GET /api/observatories/:code': { allowed: SIGNED_IN, url: '/api/observatories/no-such-site' },
  'PATCH /api/observatories/:code': { allowed: ADMIN, url: '/api/observatories/no-such-site' },
  'DELETE /api/observatories/:code': { allowed: ADMIN, url: '/api/observatories/no-such-site' },
  'GET /api/pulsars': { allowed: SIGNED_IN, url: '/api/pulsars' },
  'POST /api/pulsars': { allowed: ANALYST_UP, url: '/api/pulsars' },
  'GET /api/pulsars/:id': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000' },
  'POST /api/pulsars/:id/statistics-jobs': { allowed: ANALYST_UP, url: '/api/pulsars/2147480000/statistics-jobs' },
  'GET /api/jobs/:id': { allowed: SIGNED_IN, url: '/api/jobs/no-such-job' },
  'POST /api/pulsars/:id/toa-batches': { allowed: ['observer', 'analyst', 'lead', 'admin'], url: '/api/pulsars/2147480000/toa-batches' },
  'GET /api/pulsars/:id/toa-batches': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/toa-batches' },
  'DELETE /api/toa-batches/:id': { allowed: ['lead', 'admin'], url: '/api/toa-batches/2147480000' },
  'GET /api/pulsars/:id/toas': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/toas' },
  'POST /api/pulsars/:id/exclusions': { allowed: ANALYST_UP, url: '/api/pulsars/2147480000/exclusions' },
  'POST /api/pulsars/:id/exclusions/restore': { allowed: ANALYST_UP, url: '/api/pulsars/2147480000/exclusions/restore' },
  'GET /api/pulsars/:id/exclusions': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/exclusions' },
  'GET /api/pulsars/:id/revisions': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/revisions' },
  'POST /api/pulsars/:id/revisions': { allowed: ANALYST_UP, url: '/api/pulsars/2147480000/revisions' },
  'GET /api/revisions/:id': { allowed: SIGNED_IN, url: '/api/revisions/2147480000' },
  'POST /api/revisions/:id/release': { allowed: ['lead', 'admin'], url: '/api/revisions/2147480000/release' },
  'POST /api/revisions/:id/withdraw-release': { allowed: ['lead', 'admin'], url: '/api/revisions/2147480000/withdraw-release' },
  'POST /api/pulsars/:id/fit-runs': { allowed: ANALYST_UP, url: '/api/pulsars/2147480000/fit-runs' },
  'GET /api/pulsars/:id/fit-runs': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/fit-runs' },
  'GET /api/fit-runs/:id': { allowed: SIGNED_IN, url: '/api/fit-runs/2147480000' },
  'GET /api/fit-runs/:id/residuals': { allowed: SIGNED_IN, url: '/api/fit-runs/2147480000/residuals' },
  'GET /api/fit-runs/:id/explorer': { allowed: SIGNED_IN, url: '/api/fit-runs/2147480000/explorer' },
  'GET /api/fit-runs/:id/fitted-model': { allowed: SIGNED_IN, url: '/api/fit-runs/2147480000/fitted-model' },
  'POST /api/fit-runs/:id/cancel': { allowed: ANALYST_UP, url: '/api/fit-runs/2147480000/cancel' },
  'POST /api/pulsars/:id/search-runs': { allowed: ANALYST_UP, url: '/api/pulsars/2147480000/search-runs' },
  'GET /api/pulsars/:id/search-runs': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/search-runs' },
  'GET /api/search-runs/:id': { allowed: SIGNED_IN, url: '/api/search-runs/2147480000' },
  'GET /api/search-runs/:id/periodograms': { allowed: SIGNED_IN, url: '/api/search-runs/2147480000/periodograms' },
  'POST /api/search-runs/:id/cancel': { allowed: ANALYST_UP, url: '/api/search-runs/2147480000/cancel' },
  'POST /api/search-runs/:id/save-revision': { allowed: ANALYST_UP, url: '/api/search-runs/2147480000/save-revision' },
  'POST /api/campaigns': { allowed: ['lead', 'admin'], url: '/api/campaigns' },
  'GET /api/campaigns': { allowed: SIGNED_IN, url: '/api/campaigns' },
  'GET /api/campaigns/:id': { allowed: SIGNED_IN, url: '/api/campaigns/2147480000' },
  'POST /api/campaigns/:id/cancel': { allowed: ['lead', 'admin'], url: '/api/campaigns/2147480000/cancel' },
  'PUT /api/campaigns/:id/notification': { allowed: SIGNED_IN, url: '/api/campaigns/2147480000/notification' },
  'GET /api/notifications': { allowed: SIGNED_IN, url: '/api/notifications' },
  'PUT /api/pulsars/:id/notification': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/notification' },
  'GET /api/pulsars/:id/fit-comparison': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/fit-comparison?runs=2147480000,2147480001' },
  'POST /api/pulsars/:id/comparisons': { allowed: ['lead', 'admin'], url: '/api/pulsars/2147480000/comparisons' },
  'GET /api/pulsars/:id/comparisons': { allowed: SIGNED_IN, url: '/api/pulsars/2147480000/comparisons' },
  'GET /api/comparisons/:id': { allowed: SIGNED_IN, url: '/api/comparisons/2147480000' },
  'GET /api/pulsars/:id/audit-log': { allowed: ANALYST_UP, url: '/api/pulsars/2147480000/audit-log' },
};

// The registry is filled while an app is built: a throwaway app lists it when the tests are collected.
const probe = buildTestApp();
await probe.app.locals.sessionStore.ready;
const REGISTERED = routesOf(probe.app).map((r) => `${r.method.toUpperCase()} ${r.path}`);
await probe.close();

let t: TestApp;
const users = new Map<Role, { email: string; password: string }>();
const clients = new Map<Who, Client>();

beforeAll(async () => {
  t = buildTestApp();
  for (const role of ROLES) {
    const user = await createUser(t.knex, role);
    users.set(role, user);
    clients.set(role, await signedInClient(t.app, user.email, user.password));
  }
});

/** The shared signed-in client, or a fresh session for a route that ends it. */
async function clientFor(who: Who, endsSession: boolean): Promise<Client> {
  if (who === 'anonymous') return anonymousClient(t.app);
  if (!endsSession) return clients.get(who)!;
  const user = users.get(who)!;
  return signedInClient(t.app, user.email, user.password);
}
afterAll(() => t.close());

/** Every route Express knows, straight from the router stack (not from the registry). */
function expressRoutes(app: Application): string[] {
  const stack = (app as unknown as { router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] } }).router.stack;
  return stack.flatMap((layer) =>
    layer.route ? Object.keys(layer.route.methods).filter((m) => m !== '_all').map((m) => `${m.toUpperCase()} ${layer.route!.path}`) : [],
  );
}

describe('route registry', () => {
  it('lists exactly the routes of the expectation table', () => {
    const registered = routesOf(t.app).map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect([...registered].sort()).toEqual(Object.keys(EXPECTED).sort());
  });

  it('holds every route Express serves (nothing mounted around the registry)', () => {
    const registered = routesOf(t.app).map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(expressRoutes(t.app).sort()).toEqual([...registered].sort());
  });
});

describe.each(REGISTERED)('%s', (key) => {
  it.each(EVERYONE)('as %s', async (who) => {
    const expected = EXPECTED[key];
    expect(expected, `no expectation for ${key}`).toBeDefined();
    const [method, path] = key.split(' ');
    const client = await clientFor(who, expected.endsSession === true);
    const call = client.agent[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](expected.url).set('x-csrf-token', client.csrf);
    const res = method === 'GET' ? await call : await call.send({});
    if (expected.allowed.includes(who)) {
      expect([401, 403], `${who} ${key} → ${res.status} ${JSON.stringify(res.body)}`).not.toContain(res.status);
    } else {
      const code = who === 'anonymous' ? 'not_signed_in' : 'forbidden';
      expect({ status: res.status, code: res.body.error?.code }, `${who} ${path}`).toEqual({ status: who === 'anonymous' ? 401 : 403, code });
    }
  });
});
