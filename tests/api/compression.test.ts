/** Response compression: large API answers go out gzip-compressed, sign-in and CSRF answers never do. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let viewer: Client;

beforeAll(async () => {
  t = buildTestApp();
  const u = await createUser(t.knex, 'viewer');
  viewer = await signedInClient(t.app, u.email, u.password);
  for (let i = 0; i < 30; i++) await createPulsarRow(t.knex); // a list well above the 1 kB threshold
});
afterAll(() => t.close());

describe('response compression', () => {
  it('gzips a large list for a client that accepts it, and the body still reads the same', async () => {
    const plain = await viewer.agent.get('/api/pulsars').set('accept-encoding', 'identity').expect(200);
    const zipped = await viewer.agent.get('/api/pulsars').set('accept-encoding', 'gzip').expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.body).toEqual(plain.body);
    expect(JSON.stringify(plain.body).length).toBeGreaterThan(1024);
  });

  it('never compresses the auth answers that carry the CSRF token', async () => {
    const csrf = await viewer.agent.get('/api/auth/csrf').set('accept-encoding', 'gzip').expect(200);
    const me = await viewer.agent.get('/api/auth/me').set('accept-encoding', 'gzip').expect(200);
    expect(csrf.headers['content-encoding']).toBeUndefined();
    expect(me.headers['content-encoding']).toBeUndefined();
  });
});
