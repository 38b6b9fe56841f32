/** Sign-in, sign-out, sessions (MariaDB store), CSRF, rate limits, enumeration and fixation. */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { anonymousClient, fetchCsrf, sessionCookie, signedInClient } from './helpers/agents';
import { countRows, createUser, uniqueEmail, type CreatedUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let analyst: CreatedUser;
let inactive: CreatedUser;

beforeAll(async () => {
  t = buildTestApp();
  analyst = await createUser(t.knex, 'analyst');
  inactive = await createUser(t.knex, 'observer', { active: false });
});
afterAll(() => t.close());

describe('sign-in and sign-out', () => {
  it('signs in, reports the user and permissions, and signs out', async () => {
    const { agent, csrf } = await signedInClient(t.app, analyst.email.toUpperCase(), analyst.password);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.data.user).toMatchObject({ id: analyst.id, email: analyst.email, role: 'analyst' });
    expect(me.body.data.permissions).toContain('pulsars:create');
    expect(me.body.data.permissions).not.toContain('users:manage');
    expect(me.body.data.user).not.toHaveProperty('passwordHash');

    const sessionsBefore = await countRows(t.knex, 'sessions');
    await agent.post('/api/auth/sign-out').set('x-csrf-token', csrf).expect(204);
    expect(await countRows(t.knex, 'sessions')).toBe(sessionsBefore - 1); // destroyed, not just emptied
    const after = await agent.get('/api/auth/me').expect(401);
    expect(after.body.error.code).toBe('not_signed_in');
  });

  it('gives the same 401 for an unknown e-mail, a wrong password and a deactivated account', async () => {
    const { agent, csrf } = await anonymousClient(t.app);
    const attempts = [
      { email: uniqueEmail('nobody'), password: analyst.password },
      { email: analyst.email, password: 'not the password at all' },
      { email: inactive.email, password: inactive.password },
    ];
    const answers = [];
    for (const body of attempts) {
      const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send(body);
      answers.push({ status: res.status, body: res.body });
    }
    expect(answers[0]).toEqual({ status: 401, body: { error: { code: 'invalid_credentials', message: expect.any(String) } } });
    expect(answers[1]).toEqual(answers[0]);
    expect(answers[2]).toEqual(answers[0]);
  });

  it('changes the session id on sign-in (no fixation)', async () => {
    const agent = request.agent(t.app);
    const csrfRes = await agent.get('/api/auth/csrf').expect(200);
    const before = sessionCookie(csrfRes);
    expect(before).toBeDefined();
    const signIn = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', csrfRes.body.data.token)
      .send({ email: analyst.email, password: analyst.password })
      .expect(200);
    const after = sessionCookie(signIn);
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    // The old session id no longer signs anyone in.
    const stale = await request(t.app).get('/api/auth/me').set('Cookie', before!);
    expect(stale.status).toBe(401);
  });

  it('sets an httpOnly, SameSite=Lax session cookie that the server rolls forward', async () => {
    const res = await request(t.app).get('/api/auth/csrf').expect(200);
    const cookie = ((res.headers['set-cookie'] as unknown as string[]) ?? []).find((c) => c.startsWith('pk.sid='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Expires=/i);
    expect(cookie).not.toMatch(/Secure/i); // the test profile is not behind TLS
  });

  it('signs a deactivated user out at once', async () => {
    const user = await createUser(t.knex, 'viewer');
    const { agent } = await signedInClient(t.app, user.email, user.password);
    await agent.get('/api/auth/me').expect(200);
    await t.knex('users').where({ id: user.id }).update({ active: false });
    await agent.get('/api/auth/me').expect(401);
  });
});

describe('sessions live in MariaDB', () => {
  it('keeps a session across an API restart (a new app with new connections)', async () => {
    const { agent } = await signedInClient(t.app, analyst.email, analyst.password);
    const cookie = (agent as unknown as { jar: { getCookie(name: string, opts: object): { value: string } | undefined } }).jar.getCookie(
      'pk.sid',
      { domain: '127.0.0.1', path: '/', secure: false, script: false },
    );
    expect(cookie).toBeDefined();
    const restarted = buildTestApp();
    try {
      const me = await request(restarted.app).get('/api/auth/me').set('Cookie', `pk.sid=${cookie!.value}`).expect(200);
      expect(me.body.data.user.id).toBe(analyst.id);
    } finally {
      await restarted.close();
    }
  });
});

describe('CSRF', () => {
  it('rejects a state-changing request without a token or with a wrong one, changing nothing', async () => {
    const { agent, csrf } = await signedInClient(t.app, analyst.email, analyst.password);
    const before = await countRows(t.knex, 'pulsars');
    const body = { name: 'CsrfProbe1', raHms: '01:00:00', decDms: '+01:00:00' };
    for (const token of [undefined, 'x'.repeat(64), `${csrf.slice(0, -1)}0`]) {
      const req = agent.post('/api/pulsars').send(body);
      const res = await (token === undefined ? req : req.set('x-csrf-token', token));
      expect(res.status).toBe(403);
      expect(res.body).toEqual({ error: { code: 'csrf_invalid', message: expect.any(String) } });
    }
    expect(await countRows(t.knex, 'pulsars')).toBe(before);
    // The same request with the right token goes through.
    await agent.post('/api/pulsars').set('x-csrf-token', csrf).send(body).expect(201);
    await t.knex('pulsars').where({ name: body.name }).del();
  });

  it('does not accept another session’s token', async () => {
    const mine = await signedInClient(t.app, analyst.email, analyst.password);
    const other = await anonymousClient(t.app);
    const res = await mine.agent.post('/api/auth/sign-out').set('x-csrf-token', other.csrf);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    await mine.agent.get('/api/auth/me').expect(200);
  });

  it('rejects sign-in without a token', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: analyst.email, password: analyst.password });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
  });

  it('hands out a new token after sign-in (the session was regenerated)', async () => {
    const { agent, csrf } = await anonymousClient(t.app);
    await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: analyst.email, password: analyst.password }).expect(200);
    const stale = await agent.post('/api/auth/sign-out').set('x-csrf-token', csrf);
    expect(stale.body.error?.code).toBe('csrf_invalid');
    const fresh = await fetchCsrf(agent);
    expect(fresh).not.toBe(csrf);
    await agent.post('/api/auth/sign-out').set('x-csrf-token', fresh).expect(204);
  });
});

describe('rate limits', () => {
  it('answers 429 rate_limited after too many failed sign-ins for one e-mail, even with the right password', async () => {
    const limited = buildTestApp({ rateLimits: { signInPerIpAndEmail: 3 } });
    try {
      const { agent, csrf } = await anonymousClient(limited.app);
      for (let i = 0; i < 3; i++) {
        await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: analyst.email, password: 'wrong password here' }).expect(401);
      }
      const blocked = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: analyst.email, password: analyst.password });
      expect(blocked.status).toBe(429);
      expect(blocked.body).toEqual({ error: { code: 'rate_limited', message: expect.any(String) } });
      // Another address from the same IP is not blocked by the per-address limit.
      const other = await createUser(limited.knex, 'viewer');
      await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: other.email, password: other.password }).expect(200);
    } finally {
      await limited.close();
    }
  });

  it('limits all sign-in attempts per IP', async () => {
    const limited = buildTestApp({ rateLimits: { signInPerIp: 2 } });
    try {
      const { agent, csrf } = await anonymousClient(limited.app);
      for (let i = 0; i < 2; i++) {
        await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: uniqueEmail('x'), password: 'whatever123456' }).expect(401);
      }
      const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: uniqueEmail('y'), password: 'whatever123456' });
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });

  it('limits password-reset requests', async () => {
    const limited = buildTestApp({ rateLimits: { passwordResetPerIpAndEmail: 2 } });
    try {
      const { agent, csrf } = await anonymousClient(limited.app);
      const email = uniqueEmail('reset-limit');
      for (let i = 0; i < 2; i++) await agent.post('/api/auth/password-reset').set('x-csrf-token', csrf).send({ email }).expect(202);
      const res = await agent.post('/api/auth/password-reset').set('x-csrf-token', csrf).send({ email });
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });
});
