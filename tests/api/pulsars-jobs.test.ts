/** Pulsars (dashboard list with TOA statistics) and the toa-statistics job as seen through the API. */
import { Worker } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JOB_TYPES, QUEUE_NAME, ToaStatisticsJob, type ToaStatisticsResult } from '../../api/contracts/queues';
import { createRedis } from '../../api/queue/create-queue';
import { signedInClient, type Client } from './helpers/agents';
import { createUser, uniqueSuffix } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let analyst: Client;
let viewer: Client;

beforeAll(async () => {
  t = buildTestApp();
  const a = await createUser(t.knex, 'analyst');
  const v = await createUser(t.knex, 'viewer');
  analyst = await signedInClient(t.app, a.email, a.password);
  viewer = await signedInClient(t.app, v.email, v.password);
});
afterAll(() => t.close());

function createPulsar(body: object) {
  return analyst.agent.post('/api/pulsars').set('x-csrf-token', analyst.csrf).send(body);
}

describe('pulsars', () => {
  it('creates a pulsar with empty statistics and lists it', async () => {
    const name = `J0102+0304-${uniqueSuffix()}`.slice(0, 32);
    const created = await createPulsar({ name, raHms: '01:02:03.456', decDms: '-03:04:05.67' });
    expect(created.status).toBe(201);
    expect(created.body.data).toMatchObject({ name, raHms: '01:02:03.456', decDms: '-03:04:05.67', toaCount: 0, firstMjd: null, lastMjd: null, observatories: [] });

    const list = await viewer.agent.get('/api/pulsars').expect(200);
    const listed = list.body.data.find((p: { name: string }) => p.name === name);
    expect(listed).toEqual(created.body.data);
    const one = await viewer.agent.get(`/api/pulsars/${created.body.data.id}`).expect(200);
    expect(one.body.data).toEqual(created.body.data);
  });

  it('shows the statistics columns the job writes', async () => {
    const created = await createPulsar({ name: `S${uniqueSuffix()}`, raHms: '10:00:00', decDms: '+10:00:00' });
    await t.knex('pulsars').where({ id: created.body.data.id }).update({
      toa_count: 1234,
      first_mjd: '58000.123456789012345',
      last_mjd: '59000.5',
      observatories: JSON.stringify(['harrow-ridge', 'cardenal-plateau']),
      statistics_updated_at: new Date(),
    });
    const res = await viewer.agent.get(`/api/pulsars/${created.body.data.id}`).expect(200);
    expect(res.body.data).toMatchObject({ toaCount: 1234, firstMjd: '58000.123456789012345', lastMjd: '59000.5', observatories: ['harrow-ridge', 'cardenal-plateau'] });
    expect(res.body.data.statisticsUpdatedAt).toEqual(expect.any(String));
  });

  it('answers 409 for a taken name and 404 for an unknown id', async () => {
    const name = `D${uniqueSuffix()}`;
    await createPulsar({ name, raHms: '10:00:00', decDms: '+10:00:00' }).then((r) => expect(r.status).toBe(201));
    const dup = await createPulsar({ name, raHms: '11:00:00', decDms: '+11:00:00' });
    expect([dup.status, dup.body.error.code]).toEqual([409, 'conflict']);
    const missing = await viewer.agent.get('/api/pulsars/2147483000');
    expect([missing.status, missing.body.error.code]).toEqual([404, 'not_found']);
  });

  it('accepts the edges of the sky and rejects bad names', async () => {
    for (const [raHms, decDms] of [['00:00:00', '+90:00:00'], ['23:59:59.999999', '-90:00:00.0'], ['0:00:00', '89:59:59.99']]) {
      const res = await createPulsar({ name: `E${uniqueSuffix()}`, raHms, decDms });
      expect(res.status, `${raHms} ${decDms}`).toBe(201);
    }
    for (const name of ['', 'x'.repeat(33), 'has space', 'semi;colon', 'J0000+0000<']) {
      const res = await createPulsar({ name, raHms: '10:00:00', decDms: '+10:00:00' });
      expect(res.status, name).toBe(400);
      expect(res.body.error.details[0].path).toEqual(['name']);
    }
  });
});

describe('statistics jobs', () => {
  it('queues toa-statistics with the pulsar id and reports the job while it waits', async () => {
    const pulsar = (await createPulsar({ name: `Q${uniqueSuffix()}`, raHms: '12:00:00', decDms: '+00:00:00' })).body.data;
    const started = await analyst.agent.post(`/api/pulsars/${pulsar.id}/statistics-jobs`).set('x-csrf-token', analyst.csrf);
    expect(started.status).toBe(202);
    const { jobId } = started.body.data;
    expect(jobId).toEqual(expect.any(String));

    const job = await t.queue.getJob(jobId);
    expect(job?.name).toBe(JOB_TYPES.toaStatistics);
    expect(ToaStatisticsJob.parse(job?.data)).toEqual({ pulsarId: pulsar.id });

    const status = await viewer.agent.get(`/api/jobs/${jobId}`).expect(200);
    expect(status.body.data).toEqual({
      id: jobId,
      name: 'toa-statistics',
      state: 'waiting',
      progress: { percent: 0, stage: 'waiting' },
      result: null,
      failedReason: null,
    });
    await job?.remove();
  });

  it('reports progress, result and failure as a worker processes jobs', async () => {
    const ok = (await createPulsar({ name: `W${uniqueSuffix()}`, raHms: '12:00:00', decDms: '+00:00:00' })).body.data;
    const bad = (await createPulsar({ name: `F${uniqueSuffix()}`, raHms: '12:00:00', decDms: '+00:00:00' })).body.data;
    const workerRedis = createRedis(t.config.redis);
    // A stand-in processor (the real one is worker/jobs/toa-statistics.ts): reports progress, fails for `bad`.
    const worker = new Worker(
      QUEUE_NAME,
      async (job): Promise<ToaStatisticsResult> => {
        const { pulsarId } = ToaStatisticsJob.parse(job.data);
        await job.updateProgress({ percent: 50, stage: 'counting arrival times' });
        if (pulsarId === bad.id) throw new Error('stand-in failure');
        return { pulsarId, toaCount: 0, firstMjd: null, lastMjd: null, observatories: [], backends: [] };
      },
      { connection: workerRedis, autorun: true },
    );
    try {
      const okJob = (await analyst.agent.post(`/api/pulsars/${ok.id}/statistics-jobs`).set('x-csrf-token', analyst.csrf).expect(202)).body.data.jobId;
      const badJob = (await analyst.agent.post(`/api/pulsars/${bad.id}/statistics-jobs`).set('x-csrf-token', analyst.csrf).expect(202)).body.data.jobId;
      const done = await pollJob(okJob, (s) => s.state === 'completed');
      expect(done).toMatchObject({ state: 'completed', progress: { percent: 50, stage: 'counting arrival times' }, failedReason: null });
      expect(done.result).toEqual({ pulsarId: ok.id, toaCount: 0, firstMjd: null, lastMjd: null, observatories: [], backends: [] });
      // The queue retries (3 attempts, backoff) — the API shows the failure reason as soon as there is one.
      const failing = await pollJob(badJob, (s) => s.failedReason !== null);
      expect(failing.failedReason).toBe('stand-in failure');
      (await t.queue.getJob(badJob))?.remove().catch(() => undefined);
    } finally {
      await worker.close(true);
      workerRedis.disconnect();
    }
  });

  it('answers 404 for an unknown job and for a job of an unknown pulsar', async () => {
    const job = await viewer.agent.get('/api/jobs/999999999');
    expect([job.status, job.body.error.code]).toEqual([404, 'not_found']);
    const start = await analyst.agent.post('/api/pulsars/2147483000/statistics-jobs').set('x-csrf-token', analyst.csrf);
    expect([start.status, start.body.error.code]).toEqual([404, 'not_found']);
  });
});

interface Status {
  state: string;
  progress: unknown;
  result: unknown;
  failedReason: string | null;
}

async function pollJob(id: string, done: (s: Status) => boolean, timeoutMs = 10_000): Promise<Status> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await viewer.agent.get(`/api/jobs/${id}`).expect(200);
    if (done(res.body.data)) return res.body.data;
    if (Date.now() > deadline) throw new Error(`job ${id} still ${JSON.stringify(res.body.data)}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
