/**
 * The worker end to end: a job queued through the API runs in the real worker
 * (BullMQ on the real Redis) and its result is visible through the API.
 */
import { UnrecoverableError, type Job } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { processToaStatistics } from '../../worker/jobs/toa-statistics';
import { startWorker } from '../../worker/index';
import { signedInClient, type Client } from '../api/helpers/agents';
import { createPulsarRow, createUser } from '../api/helpers/factories';
import { buildTestApp, type TestApp } from '../api/helpers/test-app';

let t: TestApp;
let worker: ReturnType<typeof startWorker>;
let analyst: Client;

beforeAll(async () => {
  t = buildTestApp();
  worker = startWorker(t.config);
  const user = await createUser(t.knex, 'analyst');
  analyst = await signedInClient(t.app, user.email, user.password);
});

afterAll(async () => {
  await worker.close();
  await t.close();
});

async function waitForFinalState(client: Client, jobId: string) {
  for (let i = 0; i < 100; i++) {
    const res = await client.agent.get(`/api/jobs/${jobId}`).expect(200);
    if (res.body.data.state === 'completed' || res.body.data.state === 'failed') return res.body.data;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`job ${jobId} did not finish`);
}

describe('toa-statistics job', () => {
  it('runs in the worker when queued through the API, and the API shows its result and the new counts', async () => {
    const pulsar = await createPulsarRow(t.knex);
    await t.knex('pulsars').where({ id: pulsar.id }).update({ toa_count: 99 }); // stale count the job must correct
    const queued = await analyst.agent
      .post(`/api/pulsars/${pulsar.id}/statistics-jobs`)
      .set('x-csrf-token', analyst.csrf)
      .expect(202);
    const job = await waitForFinalState(analyst, queued.body.data.jobId);
    expect(job.state).toBe('completed');
    expect(job.progress).toEqual({ percent: 100, stage: 'done' });
    expect(job.result).toMatchObject({ pulsarId: pulsar.id, toaCount: 0, observatories: [] });
    const detail = await analyst.agent.get(`/api/pulsars/${pulsar.id}`).expect(200);
    expect(detail.body.data.toaCount).toBe(0);
  });

  it('rejects a bad payload as unrecoverable (no retries)', async () => {
    const fakeJob = { data: { pulsarId: 'seven' }, updateProgress: async () => {} } as unknown as Job;
    await expect(processToaStatistics(fakeJob, { knex: t.knex })).rejects.toBeInstanceOf(UnrecoverableError);
  });

  it('fails unrecoverably for a pulsar that does not exist', async () => {
    const fakeJob = { data: { pulsarId: 987654321 }, updateProgress: async () => {} } as unknown as Job;
    await expect(processToaStatistics(fakeJob, { knex: t.knex })).rejects.toThrow(/does not exist/);
  });
});
