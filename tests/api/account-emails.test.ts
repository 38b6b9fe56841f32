/**
 * Invitation and password-reset flows end to end: the e-mail goes through
 * nodemailer to the in-process SMTP sink, the test reads the link from the
 * captured message (table and GET /api/outbox) and follows it.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sha256Hex } from '../../api/auth/tokens';
import { startSmtpSink, type SmtpSink } from '../../api/mail/smtp-sink';
import { anonymousClient, signedInClient, type Client } from './helpers/agents';
import { countRows, createUser, uniqueEmail, type CreatedUser } from './helpers/factories';
import { lastMailId, tokenFromLink, waitForMail } from './helpers/outbox';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let sink: SmtpSink;
let admin: CreatedUser;
let adminClient: Client;

beforeAll(async () => {
  t = buildTestApp();
  sink = await startSmtpSink({ knex: t.knex, host: t.config.mail.host, port: t.config.mail.port });
  admin = await createUser(t.knex, 'admin');
  adminClient = await signedInClient(t.app, admin.email, admin.password);
});
afterAll(async () => {
  await sink.close();
  await t.close();
});

async function invite(email: string, role: string) {
  return adminClient.agent.post('/api/users/invitations').set('x-csrf-token', adminClient.csrf).send({ email, role });
}

describe('invitations', () => {
  it('e-mails a link that opens the invitation and creates a signed-in account once', async () => {
    const email = uniqueEmail('invitee');
    const created = await invite(email, 'observer');
    expect(created.status).toBe(201);
    expect(created.body.data).toMatchObject({ email, role: 'observer' });
    const expiresInDays = (Date.parse(created.body.data.expiresAt) - Date.now()) / 86_400_000;
    expect(expiresInDays).toBeGreaterThan(6.99);
    expect(expiresInDays).toBeLessThanOrEqual(7);

    const mail = await waitForMail(t.knex, email);
    expect(mail.subject).toBe('Your invitation to Pulsekeeper');
    const token = tokenFromLink(mail.text_body!, t.config.api.publicUrl, 'invitations');
    expect(mail.html_body).toContain(`${t.config.api.publicUrl}/invitations/${token}`);
    // Only the hash is stored.
    const row = await t.knex('invitations').where({ email }).first();
    expect(row.token_sha256).toBe(sha256Hex(token));
    expect(JSON.stringify(row)).not.toContain(token);

    // The outbox shows the same message to admins.
    const outbox = await adminClient.agent.get('/api/outbox').expect(200);
    expect(outbox.body.data[0]).toMatchObject({ to: email, subject: mail.subject });
    expect(outbox.body.data[0].text).toContain(token);

    const invitee = await anonymousClient(t.app);
    const shown = await invitee.agent.get(`/api/invitations/${token}`).expect(200);
    expect(shown.body.data).toEqual({ email, role: 'observer' });

    const accepted = await invitee.agent
      .post(`/api/invitations/${token}/accept`)
      .set('x-csrf-token', invitee.csrf)
      .send({ displayName: 'New Observer', password: 'a long enough password' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.data.user).toMatchObject({ email, role: 'observer', displayName: 'New Observer' });
    const me = await invitee.agent.get('/api/auth/me').expect(200);
    expect(me.body.data.user.email).toBe(email);

    // Single use: the link is dead now.
    const again = await request(t.app).get(`/api/invitations/${token}`);
    expect(again.status).toBe(404);
    expect(again.body.error.code).toBe('not_found');
    const other = await anonymousClient(t.app);
    const reuse = await other.agent
      .post(`/api/invitations/${token}/accept`)
      .set('x-csrf-token', other.csrf)
      .send({ displayName: 'Second Try', password: 'another long password' });
    expect(reuse.status).toBe(404);

    // The new account signs in with its password.
    await signedInClient(t.app, email, 'a long enough password');
  });

  it('rejects an expired invitation and passwords under 12 characters', async () => {
    const email = uniqueEmail('late');
    await invite(email, 'viewer').then((r) => expect(r.status).toBe(201));
    const token = tokenFromLink((await waitForMail(t.knex, email)).text_body!, t.config.api.publicUrl, 'invitations');
    const invitee = await anonymousClient(t.app);

    const short = await invitee.agent.post(`/api/invitations/${token}/accept`).set('x-csrf-token', invitee.csrf).send({ displayName: 'X', password: 'elevenchars' });
    expect(short.status).toBe(400);
    expect(short.body.error.code).toBe('validation_failed');
    expect(short.body.error.details).toEqual([{ path: ['password'], message: 'must be at least 12 characters' }]);

    await t.knex('invitations').where({ email }).update({ expires_at: new Date(Date.now() - 1000) });
    await request(t.app).get(`/api/invitations/${token}`).expect(404);
    const usersBefore = await countRows(t.knex, 'users');
    const late = await invitee.agent
      .post(`/api/invitations/${token}/accept`)
      .set('x-csrf-token', invitee.csrf)
      .send({ displayName: 'Too Late', password: 'a long enough password' });
    expect(late.status).toBe(404);
    expect(await countRows(t.knex, 'users')).toBe(usersBefore);
  });

  it('refuses to invite an address that already has an account', async () => {
    const res = await invite(admin.email, 'viewer');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
  });

  it('answers 404 for a token that never existed', async () => {
    const res = await request(t.app).get(`/api/invitations/${'A'.repeat(43)}`);
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: expect.any(String) } });
  });
});

describe('the SMTP sink', () => {
  it('captures non-ASCII subjects and bodies intact (encoded words, quoted-printable, base64)', async () => {
    const { createMailer } = await import('../../api/mail/mailer');
    const mailer = createMailer(t.config.mail);
    const to = uniqueEmail('sink');
    const subject = 'Ünïcödé — pulsar timing ✓ ' + 'long '.repeat(20).trim();
    const text = `Grüße aus dem Moor: ${'x'.repeat(100)} = 1 + 1\nzweite Zeile ✓`;
    const html = '<p>Grüße <b>✓</b></p>';
    try {
      await mailer.send({ to, subject, text, html });
    } finally {
      mailer.close();
    }
    const row = await waitForMail(t.knex, to);
    expect(row.subject).toBe(subject);
    expect(row.text_body).toBe(text);
    expect(row.html_body).toBe(html);
  });
});

describe('password reset', () => {
  it('e-mails a 1-hour single-use link; completing it sets the password, signs in and ends other sessions', async () => {
    const user = await createUser(t.knex, 'analyst');
    const elsewhere = await signedInClient(t.app, user.email, user.password);
    const before = await lastMailId(t.knex);

    const client = await anonymousClient(t.app);
    const asked = await client.agent.post('/api/auth/password-reset').set('x-csrf-token', client.csrf).send({ email: user.email });
    expect(asked.status).toBe(202);
    expect(asked.body).toEqual({ data: { sent: true } });

    const mail = await waitForMail(t.knex, user.email, before);
    expect(mail.subject).toBe('Reset your Pulsekeeper password');
    const token = tokenFromLink(mail.text_body!, t.config.api.publicUrl, 'reset-password');
    const reset = await t.knex('password_resets').where({ token_sha256: sha256Hex(token) }).first();
    const lifetimeMin = (reset.expires_at.getTime() - reset.created_at.getTime()) / 60_000;
    expect(lifetimeMin).toBeGreaterThan(59.9);
    expect(lifetimeMin).toBeLessThan(60.1);

    const done = await client.agent
      .post('/api/auth/password-reset/complete')
      .set('x-csrf-token', client.csrf)
      .send({ token, password: 'my brand new password' });
    expect(done.status).toBe(200);
    expect(done.body.data.user.email).toBe(user.email);
    await client.agent.get('/api/auth/me').expect(200);
    await elsewhere.agent.get('/api/auth/me').expect(401); // the other session was ended

    // Old password no longer works; the new one does.
    const probe = await anonymousClient(t.app);
    await probe.agent.post('/api/auth/sign-in').set('x-csrf-token', probe.csrf).send({ email: user.email, password: user.password }).expect(401);
    await signedInClient(t.app, user.email, 'my brand new password');

    // Single use.
    const again = await anonymousClient(t.app);
    const reuse = await again.agent
      .post('/api/auth/password-reset/complete')
      .set('x-csrf-token', again.csrf)
      .send({ token, password: 'yet another password' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error).toMatchObject({ code: 'validation_failed', details: [{ path: ['token'] }] });
  });

  it('does not use an expired link', async () => {
    const user = await createUser(t.knex, 'viewer');
    const before = await lastMailId(t.knex);
    const client = await anonymousClient(t.app);
    await client.agent.post('/api/auth/password-reset').set('x-csrf-token', client.csrf).send({ email: user.email }).expect(202);
    const token = tokenFromLink((await waitForMail(t.knex, user.email, before)).text_body!, t.config.api.publicUrl, 'reset-password');
    await t.knex('password_resets').where({ token_sha256: sha256Hex(token) }).update({ expires_at: new Date(Date.now() - 1000) });
    const res = await client.agent
      .post('/api/auth/password-reset/complete')
      .set('x-csrf-token', client.csrf)
      .send({ token, password: 'my brand new password' });
    expect(res.status).toBe(400);
    const row = await t.knex('users').where({ id: user.id }).first();
    await signedInClient(t.app, user.email, user.password); // unchanged
    expect(row.password_hash).toMatch(/^\$argon2id\$/);
  });

  it('answers an unknown address exactly like a known one and sends nothing', async () => {
    const client = await anonymousClient(t.app);
    const known = await createUser(t.knex, 'viewer');
    const unknownEmail = uniqueEmail('ghost');
    const a = await client.agent.post('/api/auth/password-reset').set('x-csrf-token', client.csrf).send({ email: unknownEmail });
    const b = await client.agent.post('/api/auth/password-reset').set('x-csrf-token', client.csrf).send({ email: known.email });
    expect({ status: a.status, body: a.body }).toEqual({ status: b.status, body: b.body });
    await waitForMail(t.knex, known.email); // the known one's mail arrives …
    expect(await t.knex('captured_emails').where({ to_addresses: unknownEmail }).first()).toBeUndefined(); // … the unknown gets none
  });
});
