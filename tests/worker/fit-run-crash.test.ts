/**
 * Crash safety: the worker process is killed with SIGKILL while a fit runs; a
 * new worker process picks the job up after stall detection and the run
 * completes exactly once — one fit_residuals row, one set of outputs.
 * Workers run as child processes with short lock and stall times
 * (helpers/crash-harness.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Client } from '../api/helpers/agents';
import { createPulsarRow } from '../api/helpers/factories';
import type { TestApp } from '../api/helpers/test-app';
import { createTestObservatory, demoModelJson, offsetStartModel, simulatedCsv, storeCsv } from './fit-run-fixtures';
import { startCrashHarness, waitFor, type CrashHarness } from './helpers/crash-harness';

const TOA_COUNT = 5000;

let harness: CrashHarness;
let t: TestApp;
let analyst: Client;
let startWorkerProcess: CrashHarness['startWorkerProcess'];

async function statusOf(id: number): Promise<string> {
  const row = await t.knex('fit_runs').where({ id }).first('status');
  return row.status as string;
}

beforeAll(async () => {
  harness = await startCrashHarness();
  ({ t, analyst, startWorkerProcess } = harness);
});

afterAll(async () => {
  await harness?.close();
});

describe('a worker killed with SIGKILL during a fit', () => {
  it('is replaced by a new worker that completes the run exactly once', async () => {
    const observatory = await createTestObservatory(t.knex);
    const pulsar = await createPulsarRow(t.knex);
    const truth = demoModelJson(pulsar.name);
    await storeCsv(t.knex, pulsar.id, simulatedCsv(truth, observatory, TOA_COUNT, 13));
    const revision = await analyst.agent
      .post(`/api/pulsars/${pulsar.id}/revisions`)
      .set('x-csrf-token', analyst.csrf)
      .send({ model: offsetStartModel(truth, '218.8118472401'), message: 'start' })
      .expect(201);

    const first = startWorkerProcess();
    const queued = await analyst.agent
      .post(`/api/pulsars/${pulsar.id}/fit-runs`)
      .set('x-csrf-token', analyst.csrf)
      .send({ revisionId: revision.body.data.id })
      .expect(202);
    const id = queued.body.data.fitRun.id as number;

    await waitFor('the run to start', async () => (await statusOf(id)) === 'running', 60_000);
    first.kill('SIGKILL');
    await new Promise((resolve) => first.once('exit', resolve));
    expect(first.signalCode).toBe('SIGKILL');
    expect(await statusOf(id)).toBe('running'); // killed mid-fit: nothing was committed
    expect(Number((await t.knex('fit_residuals').where({ fit_run_id: id }).count({ n: '*' }))[0].n)).toBe(0);

    startWorkerProcess();
    await waitFor('the run to finish', async () => ['succeeded', 'failed', 'cancelled'].includes(await statusOf(id)), 120_000);
    const run = await t.knex('fit_runs').where({ id }).first();
    expect(run.status, run.error_message).toBe('succeeded');
    expect(JSON.parse(run.result_json).parameters['spin.frequency_hz'].uncertainty).toBeGreaterThan(0);
    const residualRows = await t.knex('fit_residuals').where({ fit_run_id: id }).select('count');
    expect(residualRows).toEqual([{ count: TOA_COUNT }]);

    // BullMQ marks the job completed just after the processor returns, i.e. after the run row was committed.
    await waitFor('BullMQ to mark the job completed', async () => (await (await t.queue.getJob(`fit-run-${id}`))?.isCompleted()) === true, 30_000);
    const job = await t.queue.getJob(`fit-run-${id}`);
    expect(job?.stalledCounter ?? 0).toBeGreaterThanOrEqual(1); // the first attempt was taken back by stall detection
    expect(await job?.isCompleted()).toBe(true);
  });
});
