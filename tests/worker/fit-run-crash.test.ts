/**
 * Crash safety: the worker process is killed with SIGKILL while a fit runs; a
 * new worker process picks the job up after stall detection and the run
 * completes exactly once — one fit_residuals row, one set of outputs.
 * Workers run as child processes (`node --import tsx worker/index.ts`, one
 * process, so SIGKILL hits the worker itself) with short lock and stall times.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type Client } from '../api/helpers/agents';
import { createPulsarRow, createUser } from '../api/helpers/factories';
import { buildTestApp, type TestApp } from '../api/helpers/test-app';
import { createTestObservatory, demoModelJson, offsetStartModel, simulatedCsv, storeCsv } from './fit-run-fixtures';

const TOA_COUNT = 5000;
const CHILD_ENV = { PULSEKEEPER_PROFILE: 'test', PULSEKEEPER_WORKER_LOCK_MS: '5000', PULSEKEEPER_WORKER_STALLED_INTERVAL_MS: '2000' };

let t: TestApp;
let analyst: Client;
const children: ChildProcess[] = [];

function startWorkerProcess(): ChildProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'worker/index.ts'], {
    cwd: t.config.rootDir,
    env: { ...process.env, ...CHILD_ENV },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.resume();
  child.stderr?.resume();
  children.push(child);
  return child;
}

async function statusOf(id: number): Promise<string> {
  const row = await t.knex('fit_runs').where({ id }).first('status');
  return row.status as string;
}

async function waitFor(what: string, check: () => Promise<boolean>, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

beforeAll(async () => {
  t = buildTestApp();
  const a = await createUser(t.knex, 'analyst');
  analyst = await signedInClient(t.app, a.email, a.password);
});

afterAll(async () => {
  for (const child of children) {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill('SIGTERM');
      await new Promise((resolve) => child.once('exit', resolve));
    }
  }
  await t.close();
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
