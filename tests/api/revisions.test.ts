/**
 * Model revisions through the API: engine validation with error paths, the
 * pulsar-name rule, parent links, immutability (service and database), and
 * release / withdrawal by leads only, audit-logged.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { writeModelFile } from '../../worker/timing/model/write-model-file';
import { demoModelJson } from '../worker/fit-run-fixtures';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let analyst: Client;
let lead: Client;
let leadId: number;
let pulsar: { id: number; name: string };

beforeAll(async () => {
  t = buildTestApp();
  const a = await createUser(t.knex, 'analyst');
  const l = await createUser(t.knex, 'lead');
  leadId = l.id;
  analyst = await signedInClient(t.app, a.email, a.password);
  lead = await signedInClient(t.app, l.email, l.password);
  pulsar = await createPulsarRow(t.knex);
});
afterAll(() => t.close());

/** audit_log.details: JSON text or an already parsed object, depending on the driver's column type. */
const detailsOf = (d: unknown): Record<string, unknown> => (typeof d === 'string' ? JSON.parse(d) : d) as Record<string, unknown>;

async function saveRevision(client: Client, body: Record<string, unknown>, pulsarId = pulsar.id) {
  return client.agent.post(`/api/pulsars/${pulsarId}/revisions`).set('x-csrf-token', client.csrf).send(body);
}

describe('creating revisions', () => {
  it('stores the model exactly as the engine re-writes it, with author and message', async () => {
    const model = demoModelJson(pulsar.name);
    const res = await saveRevision(analyst, { model, message: 'first model' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const data = res.body.data;
    expect(data).toMatchObject({ pulsarId: pulsar.id, parentId: null, message: 'first model', releasedAt: null, author: { displayName: 'Test analyst' } });
    expect(data.model).toEqual(writeModelFile(readModelFile(model)));
    const stored = await t.knex('model_revisions').where({ id: data.id }).first('model_json');
    expect(JSON.parse(stored.model_json)).toEqual(data.model);
    const again = await analyst.agent.get(`/api/revisions/${data.id}`).expect(200);
    expect(again.body.data.model).toEqual(data.model);
  });

  it('reports an unknown key of the model by its path under model', async () => {
    const model = demoModelJson(pulsar.name) as { companions: Record<string, unknown>[] };
    model.companions[0].period_dayz = 3;
    const res = await saveRevision(analyst, { model, message: 'typo' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details).toContainEqual({ path: ['model', 'companions', 0, 'period_dayz'], message: 'unknown key' });
  });

  it('reports a solve_for entry that names no parameter, by its index', async () => {
    const model = { ...demoModelJson(pulsar.name), solve_for: ['spin.frequency_hz', 'companions[zz].period_days'] };
    const res = await saveRevision(analyst, { model, message: 'bad solve_for' });
    expect(res.status).toBe(400);
    const detail = res.body.error.details.find((d: { path: unknown[] }) => d.path.join('/') === 'model/solve_for/1');
    expect(detail, JSON.stringify(res.body.error.details)).toBeDefined();
    expect(detail.message).toContain('companions[zz].period_days');
  });

  it('refuses a model that names another pulsar', async () => {
    const res = await saveRevision(analyst, { model: demoModelJson('J0000+0000'), message: 'wrong pulsar' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toEqual(['model', 'pulsar']);
  });

  it('refuses an empty message and a body without a model', async () => {
    const res = await saveRevision(analyst, { message: '   ' });
    expect(res.status).toBe(400);
    const paths = res.body.error.details.map((d: { path: unknown[] }) => d.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['model', 'message']));
  });

  it('links a parent of the same pulsar and refuses one of another pulsar', async () => {
    const model = demoModelJson(pulsar.name);
    const parent = (await saveRevision(analyst, { model, message: 'parent' })).body.data;
    const child = await saveRevision(analyst, { model, message: 'child', parentId: parent.id });
    expect(child.status).toBe(201);
    expect(child.body.data.parentId).toBe(parent.id);

    const other = await createPulsarRow(t.knex);
    const foreign = (await saveRevision(analyst, { model: demoModelJson(other.name), message: 'other' }, other.id)).body.data;
    const bad = await saveRevision(analyst, { model, message: 'bad parent', parentId: foreign.id });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toEqual(['parentId']);
  });

  it('lists a pulsar’s revisions newest first, and 404s for an unknown pulsar', async () => {
    const list = await analyst.agent.get(`/api/pulsars/${pulsar.id}/revisions`).expect(200);
    const ids = list.body.data.map((r: { id: number }) => r.id);
    expect(ids.length).toBeGreaterThanOrEqual(3);
    expect(ids).toEqual([...ids].sort((a: number, b: number) => b - a));
    expect(list.body.data[0]).not.toHaveProperty('model');
    await analyst.agent.get('/api/pulsars/2147480000/revisions').expect(404);
    await analyst.agent.get('/api/revisions/2147480000').expect(404);
  });
});

describe('immutability', () => {
  it('has no route that changes a revision, and the database refuses a change of model or message', async () => {
    const created = (await saveRevision(analyst, { model: demoModelJson(pulsar.name), message: 'fixed forever' })).body.data;
    const patch = await analyst.agent.patch(`/api/revisions/${created.id}`).set('x-csrf-token', analyst.csrf).send({ message: 'changed' });
    expect(patch.status).toBe(404);
    await expect(t.knex('model_revisions').where({ id: created.id }).update({ message: 'changed' })).rejects.toThrow(/immutable/);
    await expect(t.knex('model_revisions').where({ id: created.id }).update({ model_json: '{}' })).rejects.toThrow(/immutable/);
    const row = await t.knex('model_revisions').where({ id: created.id }).first();
    expect(row.message).toBe('fixed forever');
    expect(JSON.parse(row.model_json)).toEqual(created.model);
  });
});

describe('release', () => {
  it('is refused to an analyst (403) and done by a lead, audit-logged, only once', async () => {
    const created = (await saveRevision(analyst, { model: demoModelJson(pulsar.name), message: 'candidate' })).body.data;
    const url = `/api/revisions/${created.id}/release`;
    const denied = await analyst.agent.post(url).set('x-csrf-token', analyst.csrf).send({ note: 'please' });
    expect(denied.status).toBe(403);

    const released = await lead.agent.post(url).set('x-csrf-token', lead.csrf).send({ note: 'timing release 1' });
    expect(released.status, JSON.stringify(released.body)).toBe(200);
    expect(released.body.data).toMatchObject({ id: created.id, releaseNote: 'timing release 1', releasedBy: { id: leadId } });
    expect(released.body.data.releasedAt).not.toBeNull();

    const twice = await lead.agent.post(url).set('x-csrf-token', lead.csrf).send({ note: 'again' });
    expect(twice.status).toBe(409);

    const audit = await t.knex('audit_log').where({ action: 'revision.release', user_id: leadId, pulsar_id: pulsar.id });
    expect(audit.map((r) => detailsOf(r.details).revisionId)).toContain(created.id);

    const stored = await t.knex('model_revisions').where({ id: created.id }).first();
    expect(stored.message).toBe('candidate');
    expect(JSON.parse(stored.model_json)).toEqual(created.model);
  });

  it('can be withdrawn by a lead (audit-logged), not by an analyst; withdrawing twice is 409', async () => {
    const created = (await saveRevision(analyst, { model: demoModelJson(pulsar.name), message: 'to withdraw' })).body.data;
    await lead.agent.post(`/api/revisions/${created.id}/release`).set('x-csrf-token', lead.csrf).send({ note: 'r' }).expect(200);
    const url = `/api/revisions/${created.id}/withdraw-release`;
    expect((await analyst.agent.post(url).set('x-csrf-token', analyst.csrf).send({})).status).toBe(403);
    const withdrawn = await lead.agent.post(url).set('x-csrf-token', lead.csrf).send({});
    expect(withdrawn.status).toBe(200);
    expect(withdrawn.body.data).toMatchObject({ releasedAt: null, releasedBy: null, releaseNote: null, message: 'to withdraw' });
    expect((await lead.agent.post(url).set('x-csrf-token', lead.csrf).send({})).status).toBe(409);
    const audit = await t.knex('audit_log').where({ action: 'revision.withdraw-release', pulsar_id: pulsar.id });
    expect(audit.map((r) => detailsOf(r.details).revisionId)).toContain(created.id);
  });

  it('needs a note', async () => {
    const created = (await saveRevision(analyst, { model: demoModelJson(pulsar.name), message: 'no note' })).body.data;
    const res = await lead.agent.post(`/api/revisions/${created.id}/release`).set('x-csrf-token', lead.csrf).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toEqual(['note']);
  });
});
