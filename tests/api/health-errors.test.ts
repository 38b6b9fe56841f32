/** Health, the error shape of 404/500, security headers, and the demo seed. */
import express from 'express';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Redis } from 'ioredis';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeApp as closeAppOnly } from '../../api/app';
import { loadConfig } from '../../api/config';
import knexFactory from 'knex';
import { knexConfig } from '../../knexfile';
import { seedDemo } from '../../api/db/seed-demo';
import { AppError } from '../../api/errors';
import { errorHandler } from '../../api/middleware/error-handler';
import { anonymousClient, signedInClient } from './helpers/agents';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;

beforeAll(() => {
  t = buildTestApp();
});
afterAll(() => t.close());

describe('GET /api/health', () => {
  it('is 200 with both services up', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    expect(res.body).toEqual({ data: { database: 'ok', redis: 'ok' } });
  });

  it('is 503 service_unavailable within the timeout when Redis does not answer', async () => {
    // Nothing listens on port 1 of loopback; with maxRetriesPerRequest null the PING would wait forever.
    const deadRedis = new Redis({ host: '127.0.0.1', port: 1, maxRetriesPerRequest: null, lazyConnect: true, retryStrategy: () => 200 });
    deadRedis.on('error', () => undefined);
    const down = buildTestApp({ deps: { redis: deadRedis, queue: t.queue } });
    try {
      const started = Date.now();
      const res = await request(down.app).get('/api/health');
      expect(Date.now() - started).toBeLessThan(5_000);
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ error: { code: 'service_unavailable', message: 'redis not answering' }, data: { database: 'ok', redis: 'down' } });
    } finally {
      closeApp(down);
    }
  });
});

/** Closes an app whose queue is borrowed from `t` (closed there). */
function closeApp(app: TestApp): void {
  closeAppOnly(app.app);
  app.redis.disconnect();
  void app.knex.destroy();
}

describe('errors', () => {
  it('answers 500 internal without message or stack when the database refuses the app', async () => {
    const config = loadConfig();
    const quiet = { warn: () => undefined, error: () => undefined, debug: () => undefined, deprecate: () => undefined };
    const badKnex = knexFactory({ ...knexConfig({ ...config, db: { ...config.db, password: 'wrong-password-for-this-test' } }), log: quiet });
    const broken = buildTestApp({ deps: { knex: badKnex } });
    try {
      const res = await request(broken.app).get(`/api/invitations/${'A'.repeat(43)}`); // a public route that queries
      expect(res.status).toBe(500);
      expect(res.body).toEqual({ error: { code: 'internal', message: 'internal error' } });
      expect(res.text).not.toMatch(/denied|wrong-password|stack|\.ts:/i);
      expect(broken.logged.length).toBeGreaterThan(0); // logged on the server side instead
    } finally {
      await broken.close();
    }
  });

  it('keeps AppError codes and hides other errors (the handler on its own)', async () => {
    const logged: unknown[] = [];
    const app = express();
    app.get('/known', () => {
      throw new AppError(409, 'conflict', 'already there', [{ path: ['name'], message: 'taken' }]);
    });
    app.get('/unknown', () => {
      throw new TypeError('secret detail at /srv/app/file.ts:12');
    });
    app.use(errorHandler((_m, err) => logged.push(err)));
    const known = await request(app).get('/known').expect(409);
    expect(known.body).toEqual({ error: { code: 'conflict', message: 'already there', details: [{ path: ['name'], message: 'taken' }] } });
    const hidden = await request(app).get('/unknown').expect(500);
    expect(hidden.body).toEqual({ error: { code: 'internal', message: 'internal error' } });
    expect(logged).toHaveLength(1);
  });

  it('answers unknown API routes and methods with 404 not_found', async () => {
    const { agent, csrf } = await anonymousClient(t.app);
    for (const res of [await agent.get('/api/nothing-here'), await agent.put('/api/health').set('x-csrf-token', csrf)]) {
      expect(res.status).toBe(404);
      expect(res.body).toEqual({ error: { code: 'not_found', message: expect.any(String) } });
    }
  });

  it('sends a strict Content-Security-Policy and no-store on API answers', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    const directives = new Map(csp.split(';').map((d: string) => { const [name, ...values] = d.trim().split(/\s+/); return [name, values]; }));
    expect(directives.get('script-src')).toEqual(["'self'"]); // no inline or foreign scripts
    expect(directives.get('script-src-attr')).toEqual(["'none'"]);
    expect(directives.get('style-src')).toEqual(["'self'", "'unsafe-inline'"]); // Plotly's inline styles, nothing foreign
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('serving the built client', () => {
  it('serves files and index.html for client routes, while /api stays JSON', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'pk-client-'));
    writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>client</title>');
    mkdirSync(path.join(dir, 'assets'));
    writeFileSync(path.join(dir, 'assets', 'app.js'), 'console.log(1)');
    const withClient = buildTestApp({ deps: { clientDir: dir } });
    try {
      const page = await request(withClient.app).get('/pulsars/12').expect(200);
      expect(page.headers['content-type']).toMatch(/^text\/html/);
      expect(page.text).toContain('<title>client</title>');
      const asset = await request(withClient.app).get('/assets/app.js').expect(200);
      expect(asset.headers['content-type']).toMatch(/javascript/);
      const api = await request(withClient.app).get('/api/nope').expect(404);
      expect(api.body.error.code).toBe('not_found');
    } finally {
      await withClient.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('demo seed', () => {
  it('is idempotent and its printed sign-ins work', async () => {
    const first = await seedDemo(t.knex);
    const counts = async () => Promise.all(['users', 'observatories', 'pulsars'].map(async (table) => Number((await t.knex(table).count({ n: '*' }))[0].n)));
    const after1 = await counts();
    const second = await seedDemo(t.knex);
    expect(await counts()).toEqual(after1);
    expect(second).toEqual(first);
    expect(first.users.map((u) => u.role)).toEqual(['viewer', 'observer', 'analyst', 'lead', 'admin']);
    for (const u of first.users) expect(u.password.length).toBeGreaterThanOrEqual(12);
    const analyst = first.users.find((u) => u.role === 'analyst')!;
    const { agent } = await signedInClient(t.app, analyst.email, analyst.password);
    const pulsars = await agent.get('/api/pulsars').expect(200);
    expect(pulsars.body.data.length).toBeGreaterThanOrEqual(3);
    const observatories = await agent.get('/api/observatories').expect(200);
    expect(observatories.body.data.map((o: { code: string }) => o.code)).toEqual(expect.arrayContaining(['harrow-ridge', 'cardenal-plateau']));
  });
});
