/**
 * Crash safety of the search-run job: the worker process is killed with
 * SIGKILL while a search runs; a new worker process picks the job up after
 * stall detection and the run completes exactly once — one set of outputs, one
 * periodogram row per round. Workers run as child processes with short lock
 * and stall times (helpers/crash-harness.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SearchResult } from '../../api/contracts/search-runs';
import type { Client } from '../api/helpers/agents';
import { createPulsarRow } from '../api/helpers/factories';
import type { TestApp } from '../api/helpers/test-app';
import { createTestObservatory, demoModelJson, simulatedCsv, storeCsv } from './fit-run-fixtures';
import { startCrashHarness, waitFor, type CrashHarness } from './helpers/crash-harness';

const TOA_COUNT = 3000;
const INJECTED = {
  name: 'hidden',
  kind: 'keplerian',
  enabled: true,
  period_days: '61.5',
  projected_semimajor_axis_lt_s: '0.00003',
  eccentricity: 0,
  periastron_longitude_deg: 0,
  periastron_epoch_mjd: '58640.3',
};

let harness: CrashHarness;
let t: TestApp;
let analyst: Client;
let startWorkerProcess: CrashHarness['startWorkerProcess'];

async function rowOf(id: number): Promise<{ status: string; stage: string }> {
  return (await t.knex('search_runs').where({ id }).first('status', 'stage')) as { status: string; stage: string };
}

beforeAll(async () => {
  harness = await startCrashHarness();
  ({ t, analyst, startWorkerProcess } = harness);
});

afterAll(async () => {
  await harness?.close();
});

describe('a worker killed with SIGKILL during a search', () => {
  it('is replaced by a new worker that completes the run exactly once', async () => {
    const observatory = await createTestObservatory(t.knex);
    const pulsar = await createPulsarRow(t.knex);
    const model = demoModelJson(pulsar.name);
    await storeCsv(t.knex, pulsar.id, simulatedCsv({ ...model, companions: [...(model.companions as unknown[]), INJECTED] }, observatory, TOA_COUNT, 17));
    const revision = await analyst.agent
      .post(`/api/pulsars/${pulsar.id}/revisions`)
      .set('x-csrf-token', analyst.csrf)
      .send({ model, message: 'start' })
      .expect(201);

    const first = startWorkerProcess();
    const queued = await analyst.agent
      .post(`/api/pulsars/${pulsar.id}/search-runs`)
      .set('x-csrf-token', analyst.csrf)
      .send({ revisionId: revision.body.data.id, minPeriodDays: 20, maxPeriodDays: 600, maxCompanions: 2 })
      .expect(202);
    const id = queued.body.data.searchRun.id as number;

    // Killed once the search itself is under way (past loading and barycentring).
    await waitFor('the search rounds to start', async () => (await rowOf(id)).stage.startsWith('round'), 90_000);
    first.kill('SIGKILL');
    await new Promise((resolve) => first.once('exit', resolve));
    expect(first.signalCode).toBe('SIGKILL');
    expect((await rowOf(id)).status).toBe('running'); // killed mid-search: nothing was committed
    expect(Number((await t.knex('search_periodograms').where({ search_run_id: id }).count({ n: '*' }))[0].n)).toBe(0);

    startWorkerProcess();
    await waitFor('the run to finish', async () => ['succeeded', 'failed', 'cancelled'].includes((await rowOf(id)).status), 150_000);
    const run = await t.knex('search_runs').where({ id }).first();
    expect(run.status, run.error_message).toBe('succeeded');
    const result = JSON.parse(run.result_json) as SearchResult;
    expect(run.companions_found).toBe(result.companionsFound);
    expect(result.companionsFound).toBeGreaterThanOrEqual(1);
    const rounds = (await t.knex('search_periodograms').where({ search_run_id: id }).orderBy('round').select('round')).map((r) => r.round);
    expect(rounds).toEqual(result.peaks.map((p) => p.round));

    await waitFor('BullMQ to mark the job completed', async () => (await (await t.queue.getJob(`search-run-${id}`))?.isCompleted()) === true, 30_000);
    const job = await t.queue.getJob(`search-run-${id}`);
    expect(job?.stalledCounter ?? 0).toBeGreaterThanOrEqual(1); // the first attempt was taken back by stall detection
  });
});
