/** Observatories: create/read/patch/delete, the geocentric-distance rule, exact clock-correction MJDs. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type Client } from './helpers/agents';
import { countRows, createUser, uniqueSuffix } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let admin: Client;
let viewer: Client;

// An invented site on the WGS 84 surface: φ = +38.4215°, λ = −112.8473°, h = 1720 m → 6371.641 km
// (the same point as the engine's fictional built-in "harrow-ridge").
const POSITION = { itrf_x_m: -1_943_260.447, itrf_y_m: -4_612_171.913, itrf_z_m: 3_943_274.984 };

beforeAll(async () => {
  t = buildTestApp();
  admin = await signedInClient(t.app, ...(await creds('admin')));
  viewer = await signedInClient(t.app, ...(await creds('viewer')));
});
afterAll(() => t.close());

async function creds(role: 'admin' | 'viewer'): Promise<[string, string]> {
  const u = await createUser(t.knex, role);
  return [u.email, u.password];
}

function post(body: object) {
  return admin.agent.post('/api/observatories').set('x-csrf-token', admin.csrf).send(body);
}

describe('observatories', () => {
  it('creates, lists, reads, patches and deletes an observatory', async () => {
    const code = `o-${uniqueSuffix()}`;
    const created = await post({ code, name: 'Test Fen Dish', ...POSITION, clock_corrections: [{ mjd: '58000', correction_us: 0.5 }] });
    expect(created.status).toBe(201);
    expect(created.body.data).toEqual({ code, name: 'Test Fen Dish', ...POSITION, clock_corrections: [{ mjd: '58000', correction_us: 0.5 }] });

    const list = await viewer.agent.get('/api/observatories').expect(200);
    expect(list.body.data.map((o: { code: string }) => o.code)).toContain(code);

    const patched = await admin.agent
      .patch(`/api/observatories/${code}`)
      .set('x-csrf-token', admin.csrf)
      .send({ name: 'Renamed Dish', clock_corrections: [{ mjd: '58000.5', correction_us: 1 }, { mjd: '58001', correction_us: 2 }] });
    expect(patched.status).toBe(200);
    expect(patched.body.data).toMatchObject({ name: 'Renamed Dish', itrf_x_m: POSITION.itrf_x_m });
    expect(patched.body.data.clock_corrections).toEqual([{ mjd: '58000.5', correction_us: 1 }, { mjd: '58001', correction_us: 2 }]);

    await admin.agent.delete(`/api/observatories/${code}`).set('x-csrf-token', admin.csrf).expect(204);
    const gone = await viewer.agent.get(`/api/observatories/${code}`);
    expect(gone.status).toBe(404);
    expect(gone.body.error.code).toBe('not_found');
    expect(await t.knex('observatory_clock_corrections').whereIn('observatory_id', t.knex('observatories').where({ code }).select('id'))).toEqual([]);
  });

  it('keeps clock-correction MJDs digit for digit (28 fractional digits)', async () => {
    const code = `m-${uniqueSuffix()}`;
    const mjds = ['59000.1', '59000.1234567890123456789012345678', '59001.0000000000000000000000000001'];
    const created = await post({ code, name: 'Digits', ...POSITION, clock_corrections: mjds.map((mjd) => ({ mjd, correction_us: 0 })) });
    expect(created.status).toBe(201);
    expect(created.body.data.clock_corrections.map((p: { mjd: string }) => p.mjd)).toEqual(mjds);
  });

  it('rejects a point that is not 6350–6400 km from the geocentre, saying how far it is', async () => {
    const before = await countRows(t.knex, 'observatories');
    // The same direction in kilometres instead of metres: 6.371641 km from the geocentre.
    const res = await post({ code: `k-${uniqueSuffix()}`, name: 'Kilometres by mistake', itrf_x_m: -1943.260447, itrf_y_m: -4612.171913, itrf_z_m: 3943.274984 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toContain('6.372 km from the geocentre');
    expect(res.body.error.message).toContain('6350–6400 km');
    expect(await countRows(t.knex, 'observatories')).toBe(before);
  });

  it('checks a patch against the same rules (moving the site into the Earth fails)', async () => {
    const code = `p-${uniqueSuffix()}`;
    await post({ code, name: 'Patch target', ...POSITION }).then((r) => expect(r.status).toBe(201));
    const res = await admin.agent.patch(`/api/observatories/${code}`).set('x-csrf-token', admin.csrf).send({ itrf_z_m: 0, itrf_x_m: 100, itrf_y_m: 0 });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toContain('0.100 km from the geocentre');
    const code2 = await admin.agent.patch(`/api/observatories/${code}`).set('x-csrf-token', admin.csrf).send({ code: 'other' });
    expect(code2.status).toBe(400);
    expect(code2.body.error.details).toEqual([{ path: ['code'], message: 'unknown field' }]);
    const unchanged = await viewer.agent.get(`/api/observatories/${code}`).expect(200);
    expect(unchanged.body.data).toMatchObject({ ...POSITION, name: 'Patch target' });
  });

  it('rejects clock corrections out of order, reserved and malformed codes, and duplicates', async () => {
    const before = await countRows(t.knex, 'observatories');
    const unordered = await post({
      code: `c-${uniqueSuffix()}`,
      name: 'Unordered',
      ...POSITION,
      clock_corrections: [{ mjd: '58001', correction_us: 0 }, { mjd: '58001', correction_us: 1 }],
    });
    expect(unordered.status).toBe(400);
    expect(unordered.body.error.details[0].path).toEqual(['clock_corrections', 1, 'mjd']);
    for (const code of ['ssb', 'geocenter', 'A', 'UPPER', 'has space', 'x'.repeat(17)]) {
      const res = await post({ code, name: 'Bad code', ...POSITION });
      expect(res.status, code).toBe(400);
      expect(res.body.error.details[0].path).toEqual(['code']);
    }
    expect(await countRows(t.knex, 'observatories')).toBe(before);
    const code = `d-${uniqueSuffix()}`;
    await post({ code, name: 'First', ...POSITION }).then((r) => expect(r.status).toBe(201));
    const dup = await post({ code, name: 'Second', ...POSITION });
    expect(dup.status).toBe(409);
    expect(dup.body.error.code).toBe('conflict');
  });

  it('answers 404 for patching or deleting an unknown observatory', async () => {
    const a = await admin.agent.patch('/api/observatories/nowhere-at-all').set('x-csrf-token', admin.csrf).send({ name: 'x' });
    const b = await admin.agent.delete('/api/observatories/nowhere-at-all').set('x-csrf-token', admin.csrf);
    expect([a.status, a.body.error.code, b.status, b.body.error.code]).toEqual([404, 'not_found', 404, 'not_found']);
  });
});
