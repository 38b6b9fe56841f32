/** The pulsar list and detail carry the newest fit run and the revision count (docs/api-workflow.md). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let viewer: Client;

beforeAll(async () => {
  t = buildTestApp();
  const user = await createUser(t.knex, 'viewer');
  viewer = await signedInClient(t.app, user.email, user.password);
});
afterAll(() => t.close());

async function addRevision(pulsarId: number): Promise<number> {
  const [id] = await t.knex('model_revisions').insert({ pulsar_id: pulsarId, message: 'test', model_json: '{}' });
  return id;
}

async function addRun(pulsarId: number, revisionId: number, fields: Record<string, unknown>): Promise<number> {
  const [id] = await t.knex('fit_runs').insert({
    pulsar_id: pulsarId, revision_id: revisionId, inputs_hash: 'a'.repeat(64), settings: '{}', ...fields,
  });
  return id;
}

describe('pulsar workflow summary', () => {
  it('is empty for a pulsar without revisions or fits', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const res = await viewer.agent.get(`/api/pulsars/${pulsar.id}`).expect(200);
    expect(res.body.data).toMatchObject({ latestFit: null, revisionCount: 0 });
  });

  it('shows the newest run (whatever its status) and counts revisions, in the list and the detail', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const first = await addRevision(pulsar.id);
    await addRevision(pulsar.id);
    await addRun(pulsar.id, first, { status: 'succeeded', reduced_chi2: 1.04, weighted_rms_us: 0.82, finished_at: new Date('2026-11-30T10:00:00Z') });
    const newest = await addRun(pulsar.id, first, { status: 'running' });
    const detail = await viewer.agent.get(`/api/pulsars/${pulsar.id}`).expect(200);
    expect(detail.body.data.revisionCount).toBe(2);
    expect(detail.body.data.latestFit).toEqual({ id: newest, status: 'running', reducedChi2: null, weightedRmsUs: null, finishedAt: null });
    const list = await viewer.agent.get('/api/pulsars').expect(200);
    const listed = list.body.data.find((p: { id: number }) => p.id === pulsar.id);
    expect(listed.latestFit.id).toBe(newest);
    expect(listed.revisionCount).toBe(2);
  });

  it('reports the statistics of a finished newest run', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const revision = await addRevision(pulsar.id);
    const run = await addRun(pulsar.id, revision, { status: 'succeeded', reduced_chi2: 1.5, weighted_rms_us: 3.25, finished_at: new Date('2026-11-30T10:00:00Z') });
    const res = await viewer.agent.get(`/api/pulsars/${pulsar.id}`).expect(200);
    expect(res.body.data.latestFit).toEqual({ id: run, status: 'succeeded', reducedChi2: 1.5, weightedRmsUs: 3.25, finishedAt: '2026-11-30T10:00:00.000Z' });
  });
});
