/** Administrators manage accounts: list, change roles, deactivate; the acting admin cannot lock themselves out. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type Client } from './helpers/agents';
import { createUser, type CreatedUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let admin: CreatedUser;
let adminClient: Client;

beforeAll(async () => {
  t = buildTestApp();
  admin = await createUser(t.knex, 'admin');
  adminClient = await signedInClient(t.app, admin.email, admin.password);
});
afterAll(() => t.close());

function patch(id: number, body: object) {
  return adminClient.agent.patch(`/api/users/${id}`).set('x-csrf-token', adminClient.csrf).send(body);
}

describe('user management', () => {
  it('lists accounts without password hashes', async () => {
    const res = await adminClient.agent.get('/api/users').expect(200);
    const me = res.body.data.find((u: { id: number }) => u.id === admin.id);
    expect(me).toEqual({ id: admin.id, email: admin.email, displayName: 'Test admin', role: 'admin', active: true, createdAt: expect.any(String) });
    expect(JSON.stringify(res.body)).not.toContain('argon2');
  });

  it('changes a role, and the new permissions apply to the running session', async () => {
    const user = await createUser(t.knex, 'viewer');
    const client = await signedInClient(t.app, user.email, user.password);
    const denied = await client.agent.post('/api/pulsars').set('x-csrf-token', client.csrf).send({ name: 'RoleProbe', raHms: '01:00:00', decDms: '+01:00:00' });
    expect(denied.status).toBe(403);

    const changed = await patch(user.id, { role: 'analyst' });
    expect(changed.status).toBe(200);
    expect(changed.body.data).toMatchObject({ id: user.id, role: 'analyst', active: true });
    const me = await client.agent.get('/api/auth/me').expect(200);
    expect(me.body.data.permissions).toContain('pulsars:create');
  });

  it('deactivates an account: its session stops and it cannot sign in', async () => {
    const user = await createUser(t.knex, 'observer');
    const client = await signedInClient(t.app, user.email, user.password);
    expect((await patch(user.id, { active: false })).body.data.active).toBe(false);
    await client.agent.get('/api/auth/me').expect(401);
    const retry = await client.agent.post('/api/auth/sign-in').set('x-csrf-token', (await client.agent.get('/api/auth/csrf')).body.data.token).send({ email: user.email, password: user.password });
    expect(retry.status).toBe(401);
    expect((await patch(user.id, { active: true })).body.data.active).toBe(true);
  });

  it('refuses to let admins demote or deactivate themselves', async () => {
    for (const body of [{ role: 'lead' }, { active: false }]) {
      const res = await patch(admin.id, body);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('conflict');
    }
    const row = await t.knex('users').where({ id: admin.id }).first();
    expect([row.role, Boolean(row.active)]).toEqual(['admin', true]);
    expect((await patch(admin.id, { role: 'admin' })).status).toBe(200); // a no-op is fine
  });

  it('answers 404 for an unknown user', async () => {
    const res = await patch(2147480000, { role: 'viewer' });
    expect([res.status, res.body.error.code]).toEqual([404, 'not_found']);
  });
});
