/**
 * Campaign routes without a worker: starting one stores it and queues its
 * `campaign` job, the list and detail show it, cancelling cancels its queued
 * fit runs, and the bad-input paths answer with the documented codes.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAMPAIGN_JOB_TYPE } from '../../api/contracts/queues';
import { campaignJobId } from '../../api/services/campaigns/create-campaign';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser, type CreatedUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let lead: CreatedUser;
let leadClient: Client;
let viewerClient: Client;
const createdCampaignIds: number[] = [];

beforeAll(async () => {
  t = buildTestApp();
  lead = await createUser(t.knex, 'lead');
  leadClient = await signedInClient(t.app, lead.email, lead.password);
  const viewer = await createUser(t.knex, 'viewer');
  viewerClient = await signedInClient(t.app, viewer.email, viewer.password);
});

afterAll(async () => {
  // No worker runs in this file: remove the queued campaign jobs so a later worker test does not pick them up.
  for (const id of createdCampaignIds) await (await t.queue.getJob(campaignJobId(id)))?.remove().catch(() => undefined);
  await t.close();
});

async function startCampaign(body: Record<string, unknown>) {
  const res = await leadClient.agent.post('/api/campaigns').set('x-csrf-token', leadClient.csrf).send(body);
  if (res.status === 202) createdCampaignIds.push(res.body.data.id);
  return res;
}

describe('POST /api/campaigns', () => {
  it('stores the campaign as queued and queues one campaign job for it', async () => {
    const a = await createPulsarRow(t.knex);
    const b = await createPulsarRow(t.knex);
    const res = await startCampaign({ name: 'Yearly refit', pulsarIds: [b.id, a.id, a.id], revisionChoice: 'released' });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const campaign = res.body.data;
    expect(campaign).toMatchObject({
      name: 'Yearly refit',
      createdBy: { id: lead.id, displayName: 'Test lead' },
      revisionChoice: 'released',
      recompute: false,
      pulsarSelection: [Math.min(a.id, b.id), Math.max(a.id, b.id)],
      status: 'queued',
      progress: { percent: 0, stage: 'queued', done: 0, total: 0 },
      runs: [],
      summary: null,
      finishedAt: null,
    });
    const job = await t.queue.getJob(campaignJobId(campaign.id));
    expect(job?.name).toBe(CAMPAIGN_JOB_TYPE);
    expect(job?.data).toEqual({ campaignId: campaign.id });
  });

  it("accepts 'all' and subscribes the creator when notifyMe is set", async () => {
    const res = await startCampaign({ name: 'Everything', pulsarIds: 'all', revisionChoice: 'latest', notifyMe: true });
    expect(res.status).toBe(202);
    expect(res.body.data.pulsarSelection).toBe('all');
    const mine = await leadClient.agent.get('/api/notifications').expect(200);
    expect(mine.body.data.campaignIds).toContain(res.body.data.id);
  });

  it('rejects unknown pulsar ids, naming them, and stores nothing', async () => {
    const [{ n: before }] = await t.knex('campaigns').count({ n: '*' });
    const res = await startCampaign({ name: 'Ghosts', pulsarIds: [2147480001], revisionChoice: 'latest' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', details: [{ path: ['pulsarIds'], message: 'unknown pulsar ids: 2147480001' }] });
    const [{ n: after }] = await t.knex('campaigns').count({ n: '*' });
    expect(Number(after)).toBe(Number(before));
  });

  it.each([
    [{ pulsarIds: 'all', revisionChoice: 'latest' }, 'name'],
    [{ name: '', pulsarIds: 'all', revisionChoice: 'latest' }, 'name'],
    [{ name: 'x'.repeat(121), pulsarIds: 'all', revisionChoice: 'latest' }, 'name'],
    [{ name: 'n', pulsarIds: [], revisionChoice: 'latest' }, 'pulsarIds'],
    [{ name: 'n', pulsarIds: 'some', revisionChoice: 'latest' }, 'pulsarIds'],
    [{ name: 'n', pulsarIds: 'all', revisionChoice: 'newest' }, 'revisionChoice'],
    [{ name: 'n', pulsarIds: 'all', revisionChoice: 'latest', extra: 1 }, 'extra'],
  ])('answers 400 validation_failed for %j at %s', async (body, field) => {
    const res = await startCampaign(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.map((d: { path: string[] }) => d.path[0])).toContain(field);
  });
});

describe('GET /api/campaigns and /api/campaigns/:id', () => {
  it('lists campaigns newest first and shows one with its runs to any signed-in user', async () => {
    const p = await createPulsarRow(t.knex);
    const first = (await startCampaign({ name: 'First', pulsarIds: [p.id], revisionChoice: 'latest' })).body.data;
    const second = (await startCampaign({ name: 'Second', pulsarIds: [p.id], revisionChoice: 'latest' })).body.data;
    await t.knex('campaign_runs').insert({ campaign_id: first.id, pulsar_id: p.id, status: 'skipped', skipped_reason: 'no TOAs' });

    const list = await viewerClient.agent.get('/api/campaigns').expect(200);
    const ids = list.body.data.map((c: { id: number }) => c.id);
    expect(ids.indexOf(second.id)).toBeLessThan(ids.indexOf(first.id));

    const detail = await viewerClient.agent.get(`/api/campaigns/${first.id}`).expect(200);
    expect(detail.body.data.runs).toEqual([{ pulsarId: p.id, pulsarName: p.name, revisionId: null, fitRunId: null, status: 'skipped', skippedReason: 'no TOAs' }]);
  });

  it('answers 404 for an unknown campaign and 400 for a bad id', async () => {
    const missing = await viewerClient.agent.get('/api/campaigns/2147480000').expect(404);
    expect(missing.body.error.code).toBe('not_found');
    const bad = await viewerClient.agent.get('/api/campaigns/abc').expect(400);
    expect(bad.body.error.code).toBe('validation_failed');
  });
});

describe('POST /api/campaigns/:id/cancel', () => {
  it('cancels the campaign and its queued fit runs, leaves running ones, and answers 409 the second time', async () => {
    const p1 = await createPulsarRow(t.knex);
    const p2 = await createPulsarRow(t.knex);
    const p3 = await createPulsarRow(t.knex);
    const campaign = (await startCampaign({ name: 'To cancel', pulsarIds: [p1.id, p2.id, p3.id], revisionChoice: 'latest' })).body.data;
    // The state a worker would have left mid-campaign: one fit queued, one running, one pulsar not fanned out yet.
    const fit = async (pulsarId: number, status: string) => {
      const [revisionId] = await t.knex('model_revisions').insert({ pulsar_id: pulsarId, message: 'start', model_json: '{}' });
      const [id] = await t.knex('fit_runs').insert({
        pulsar_id: pulsarId, revision_id: revisionId, campaign_id: campaign.id, inputs_hash: 'a'.repeat(64), settings: '{}', status,
      });
      return { revisionId, id };
    };
    const queued = await fit(p1.id, 'queued');
    const running = await fit(p2.id, 'running');
    await t.knex('campaigns').where({ id: campaign.id }).update({ status: 'running' });
    await t.knex('campaign_runs').insert([
      { campaign_id: campaign.id, pulsar_id: p1.id, revision_id: queued.revisionId, fit_run_id: queued.id, status: 'queued' },
      { campaign_id: campaign.id, pulsar_id: p2.id, revision_id: running.revisionId, fit_run_id: running.id, status: 'running' },
      { campaign_id: campaign.id, pulsar_id: p3.id, status: 'pending' },
    ]);

    const res = await leadClient.agent.post(`/api/campaigns/${campaign.id}/cancel`).set('x-csrf-token', leadClient.csrf).expect(200);
    expect(res.body.data.status).toBe('cancelled');
    expect(res.body.data.finishedAt).not.toBeNull();
    const statusOf = new Map(res.body.data.runs.map((r: { pulsarId: number; status: string }) => [r.pulsarId, r.status]));
    expect(statusOf).toEqual(new Map([[p1.id, 'cancelled'], [p2.id, 'running'], [p3.id, 'cancelled']]));
    expect((await t.knex('fit_runs').where({ id: queued.id }).first('status')).status).toBe('cancelled');
    expect((await t.knex('fit_runs').where({ id: running.id }).first('status')).status).toBe('running');

    const again = await leadClient.agent.post(`/api/campaigns/${campaign.id}/cancel`).set('x-csrf-token', leadClient.csrf).expect(409);
    expect(again.body.error).toMatchObject({ code: 'conflict', message: `campaign ${campaign.id} is already cancelled` });
  });

  it('answers 404 for an unknown campaign', async () => {
    const res = await leadClient.agent.post('/api/campaigns/2147480000/cancel').set('x-csrf-token', leadClient.csrf).expect(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
