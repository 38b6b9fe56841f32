/**
 * Hostile and malformed input: every bad request gets the one error shape and
 * changes nothing (row counts before/after); text that looks like SQL or HTML
 * is stored and returned verbatim as JSON.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type Client } from './helpers/agents';
import { countRows, createUser, uniqueSuffix } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let admin: Client;

const SITE = { itrf_x_m: 1_834_824.441, itrf_y_m: -4_618_803.782, itrf_z_m: -3_985_155.132 }; // 6370.352 km (an invented point)

beforeAll(async () => {
  t = buildTestApp();
  const user = await createUser(t.knex, 'admin');
  admin = await signedInClient(t.app, user.email, user.password);
});
afterAll(() => t.close());

function expectErrorShape(res: { status: number; body: unknown; headers: Record<string, string> }, status: number, code: string) {
  expect(res.status).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  const body = res.body as { error: Record<string, unknown> };
  expect(Object.keys(body)).toEqual(['error']);
  expect(body.error.code).toBe(code);
  expect(typeof body.error.message).toBe('string');
  expect(JSON.stringify(body)).not.toMatch(/\bat .*\.ts:\d+/); // no stack frames
}

describe('malformed requests', () => {
  it('answers 400 invalid_json for a body that is not JSON', async () => {
    const before = await countRows(t.knex, 'pulsars');
    const res = await admin.agent
      .post('/api/pulsars')
      .set('x-csrf-token', admin.csrf)
      .set('Content-Type', 'application/json')
      .send('{"name": "J0000+0000", "raHms": ');
    expectErrorShape(res, 400, 'invalid_json');
    expect(await countRows(t.knex, 'pulsars')).toBe(before);
  });

  it('answers 413 payload_too_large above 1 MB', async () => {
    const before = await countRows(t.knex, 'observatories');
    const res = await admin.agent
      .post('/api/observatories')
      .set('x-csrf-token', admin.csrf)
      .send({ code: 'huge', name: 'x'.repeat(1_100_000), ...SITE });
    expectErrorShape(res, 413, 'payload_too_large');
    expect(await countRows(t.knex, 'observatories')).toBe(before);
  });

  it('answers 400 validation_failed with paths for wrong types', async () => {
    const before = await countRows(t.knex, 'pulsars');
    const res = await admin.agent.post('/api/pulsars').set('x-csrf-token', admin.csrf).send({ name: 42, raHms: ['x'], decDms: null });
    expectErrorShape(res, 400, 'validation_failed');
    const paths = (res.body.error.details as { path: string[] }[]).map((d) => d.path.join('.'));
    expect(paths.sort()).toEqual(['decDms', 'name', 'raHms']);
    expect(await countRows(t.knex, 'pulsars')).toBe(before);
  });

  it('rejects unknown fields, naming each', async () => {
    const before = await countRows(t.knex, 'pulsars');
    const res = await admin.agent
      .post('/api/pulsars')
      .set('x-csrf-token', admin.csrf)
      .send({ name: `U${uniqueSuffix()}`, raHms: '01:02:03', decDms: '+04:05:06', isAdmin: true, created_by: 1 });
    expectErrorShape(res, 400, 'validation_failed');
    expect(res.body.error.details).toEqual([
      { path: ['isAdmin'], message: 'unknown field' },
      { path: ['created_by'], message: 'unknown field' },
    ]);
    expect(await countRows(t.knex, 'pulsars')).toBe(before);
  });

  it('rejects an invalid role in a user update and leaves the user as is', async () => {
    const victim = await createUser(t.knex, 'viewer');
    const res = await admin.agent.patch(`/api/users/${victim.id}`).set('x-csrf-token', admin.csrf).send({ role: 'superuser' });
    expectErrorShape(res, 400, 'validation_failed');
    expect(res.body.error.details[0].path).toEqual(['role']);
    expect((await t.knex('users').where({ id: victim.id }).first()).role).toBe('viewer');
  });

  it('rejects a non-numeric id in the path', async () => {
    const res = await admin.agent.get('/api/pulsars/abc');
    expectErrorShape(res, 400, 'validation_failed');
    expect(res.body.error.details[0].path).toEqual(['params', 'id']);
  });

  it('rejects out-of-range sexagesimal positions', async () => {
    for (const body of [
      { raHms: '24:00:00', decDms: '+00:00:00' },
      { raHms: '12:60:00', decDms: '+00:00:00' },
      { raHms: '12:00:00', decDms: '+90:00:00.1' },
      { raHms: '12:00:00', decDms: '-91:00:00' },
      { raHms: '12h00m00s', decDms: '+10:00:00' },
    ]) {
      const res = await admin.agent.post('/api/pulsars').set('x-csrf-token', admin.csrf).send({ name: `S${uniqueSuffix()}`, ...body });
      expectErrorShape(res, 400, 'validation_failed');
    }
  });
});

describe('text that looks like code', () => {
  const SQL = "'; DROP TABLE users; --";
  const HTML = '<script>alert(1)</script>';

  it('stores SQL-looking and HTML-looking names verbatim and returns them as JSON', async () => {
    const usersBefore = await countRows(t.knex, 'users');
    const code = `x${uniqueSuffix()}`;
    const name = `${SQL} ${HTML} "quoted" \\ ünïcode`;
    const created = await admin.agent.post('/api/observatories').set('x-csrf-token', admin.csrf).send({ code, name, ...SITE });
    expect(created.status).toBe(201);
    expect(created.headers['content-type']).toMatch(/^application\/json/);
    expect(created.body.data.name).toBe(name);

    const read = await admin.agent.get(`/api/observatories/${code}`).expect(200);
    expect(read.headers['content-type']).toMatch(/^application\/json/);
    expect(read.headers['x-content-type-options']).toBe('nosniff');
    expect(read.body.data.name).toBe(name);
    expect((await t.knex('observatories').where({ code }).first()).name).toBe(name);
    expect(await countRows(t.knex, 'users')).toBe(usersBefore); // the users table is still there
  });

  it('treats a SQL-looking e-mail at sign-in as an ordinary wrong address', async () => {
    const res = await admin.agent.post('/api/auth/sign-in').set('x-csrf-token', admin.csrf).send({ email: `x' OR '1'='1`, password: SQL });
    expectErrorShape(res, 401, 'invalid_credentials');
  });

  it('answers unknown paths with 404 in the error shape, also for HTML-looking paths', async () => {
    const res = await admin.agent.get(`/api/${encodeURIComponent(HTML)}`);
    expectErrorShape(res, 404, 'not_found');
    expect(res.text).not.toContain('<script>');
  });
});
