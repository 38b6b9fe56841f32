/**
 * The fit-run job end to end: queued through the API, run by the real worker
 * (BullMQ on the real Redis, in this process), results read back through the
 * API; reuse of identical inputs; cancelling queued and running fits; engine
 * input errors; and the result equal to the command line's fit of the same file.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { UnrecoverableError, type Job } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createKnex } from '../../api/db/create-knex';
import type { ObservatoryJson } from '../../api/db/observatories';
import { processFitRun } from '../../worker/jobs/fit-run';
import { onFitRunFinished, type FitRunFinished } from '../../worker/jobs/fit-run-events';
import { startWorker } from '../../worker/index';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { signedInClient, type Client } from '../api/helpers/agents';
import { createPulsarRow, createUser } from '../api/helpers/factories';
import { buildTestApp, type TestApp } from '../api/helpers/test-app';
import { createTestObservatory, demoModelJson, offsetStartModel, simulatedCsv, storeCsv, saveRevision } from './fit-run-fixtures';

const TOA_COUNT = 300;
const START_FREQUENCY_HZ = '218.8118472401'; // truth 218.81184724012345 (tests/fixtures/cli/demo-model.json): 2.3e-12 Hz off
const ONE_NS_IN_US = 1e-3;

let t: TestApp;
let worker: ReturnType<typeof startWorker>;
let analyst: Client;
let viewer: Client;
let observatory: ObservatoryJson;
let pulsar: { id: number; name: string };
let csv: string;
let startModel: Record<string, unknown>;
let revisionId: number;
const finished: FitRunFinished[] = [];
let stopListening: () => void;

const newRevision = (pulsarId: number, model: Record<string, unknown>, message?: string) => saveRevision(analyst, pulsarId, model, message);

async function queueFit(pulsarId: number, body: Record<string, unknown>) {
  return analyst.agent.post(`/api/pulsars/${pulsarId}/fit-runs`).set('x-csrf-token', analyst.csrf).send(body);
}

async function waitForRun(id: number, until: (status: string) => boolean, timeoutMs = 90_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await viewer.agent.get(`/api/fit-runs/${id}`).expect(200);
    if (until(res.body.data.status)) return res.body.data;
    if (Date.now() > deadline) throw new Error(`fit run ${id} still ${res.body.data.status} (${res.body.data.progress.stage})`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
async function residualRowCount(fitRunId: number): Promise<number> {
  const [row] = await t.knex('fit_residuals').where({ fit_run_id: fitRunId }).count({ n: '*' });
  return Number(row.n);
}
const isFinal = (s: string) => s === 'succeeded' || s === 'failed' || s === 'cancelled';

beforeAll(async () => {
  t = buildTestApp();
  worker = startWorker(t.config);
  stopListening = onFitRunFinished((event) => {
    finished.push(event);
  });
  const a = await createUser(t.knex, 'analyst');
  const v = await createUser(t.knex, 'viewer');
  analyst = await signedInClient(t.app, a.email, a.password);
  viewer = await signedInClient(t.app, v.email, v.password);
  observatory = await createTestObservatory(t.knex);
  pulsar = await createPulsarRow(t.knex);
  const truth = demoModelJson(pulsar.name);
  csv = simulatedCsv(truth, observatory, TOA_COUNT);
  await storeCsv(t.knex, pulsar.id, csv, a.id);
  startModel = offsetStartModel(truth, START_FREQUENCY_HZ);
  revisionId = await newRevision(pulsar.id, startModel);
});

afterAll(async () => {
  stopListening();
  await worker.close();
  await t.close();
});

describe('a fit through the API', () => {
  let runId: number;

  it('is queued (202), run by the worker, and returns parameters with uncertainties', async () => {
    const res = await queueFit(pulsar.id, { revisionId });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body.data.reused).toBe(false);
    expect(res.body.data.fitRun).toMatchObject({ status: 'queued', revisionId, pulsarId: pulsar.id, toaCount: TOA_COUNT, excludedCount: 0, result: null });
    expect(res.body.data.fitRun.inputsHash).toMatch(/^[0-9a-f]{64}$/);
    runId = res.body.data.fitRun.id;

    const run = await waitForRun(runId, isFinal);
    expect(run.status, run.errorMessage).toBe('succeeded');
    expect(run.progress).toEqual({ percent: 100, stage: 'done' });
    expect(run.durationMs).toBeGreaterThan(0);
    expect(run.result.converged).toBe(true);
    const solveFor = (startModel.solve_for as string[]).slice().sort();
    expect(Object.keys(run.result.parameters).sort()).toEqual(solveFor);
    for (const p of Object.values(run.result.parameters) as { uncertainty: number; unit: string }[]) {
      expect(p.uncertainty).toBeGreaterThan(0);
      expect(p.unit).not.toBe('');
    }
    const frequency = run.result.parameters['spin.frequency_hz'];
    expect(frequency.startValue).toBe(START_FREQUENCY_HZ);
    // The start is 2.3e-12 Hz (many σ) below the truth; the fit moves it back to within 5σ of the truth.
    expect(Math.abs(Number(frequency.value) - 218.81184724012345) / frequency.uncertainty).toBeLessThan(5);
    expect(Math.abs(frequency.changeSigma)).toBeGreaterThan(5);
    // White noise of the simulated σ: reduced χ² near 1 (common practice: within a few √(2/dof)).
    expect(Math.abs(run.result.reducedChi2 - 1)).toBeLessThan(5 * Math.sqrt(2 / run.result.dof));
    expect(run.result.dof).toBe(TOA_COUNT - solveFor.length - 1);
    expect(readModelFile(run.result.fittedModel).spin.frequencyHz).toBeDefined();
    expect(finished).toContainEqual({ fitRunId: runId, pulsarId: pulsar.id, campaignId: null, status: 'succeeded' });

    const list = await viewer.agent.get(`/api/pulsars/${pulsar.id}/fit-runs`).expect(200);
    const summary = list.body.data.find((r: { id: number }) => r.id === runId);
    expect(summary.result).toMatchObject({ chi2: run.result.chi2, weightedRmsUs: run.result.weightedRmsUs });
    expect(summary.result).not.toHaveProperty('parameters');
    expect(summary.result).not.toHaveProperty('fittedModel');
  });

  it('has exactly one residual row, read back columnar with the stored MJDs and as CSV', async () => {
    expect(await residualRowCount(runId)).toBe(1);
    const res = await viewer.agent.get(`/api/fit-runs/${runId}/residuals`).expect(200);
    const table = res.body.data;
    expect(table.count).toBe(TOA_COUNT);
    const toas = await t.knex('toas').where({ pulsar_id: pulsar.id }).orderBy([{ column: 'mjd_day' }, { column: 'mjd_fraction' }]);
    expect(table.toaId).toEqual(toas.map((r) => Number(r.id)));
    expect(table.mjd[0]).toBe(csv.split('\n')[1].split(',')[0].replace(/0+$/, ''));
    expect(table.frequencyMhz.every((f: number) => f === 1400)).toBe(true);
    expect(table.observatory.every((o: string) => o === observatory.code)).toBe(true);
    expect(table.backend.every((b: string) => b === 'default')).toBe(true);
    expect(table.uncertaintyUs.every((u: number) => u === 1.5)).toBe(true);

    const download = await viewer.agent.get(`/api/fit-runs/${runId}/residuals?format=csv`).expect(200);
    expect(download.headers['content-type']).toMatch(/^text\/csv/);
    expect(download.headers['content-disposition']).toMatch(/attachment/);
    const lines = download.text.trimEnd().split('\n');
    expect(lines[0]).toBe('toa_id,mjd,residual_us,uncertainty_us,frequency_mhz,observatory,backend');
    expect(lines).toHaveLength(TOA_COUNT + 1);
    const first = lines[1].split(',');
    expect([Number(first[0]), first[1], Number(first[2])]).toEqual([table.toaId[0], table.mjd[0], table.residualUs[0]]);
  });

  it('offers the fitted model as a download that the engine reads back', async () => {
    const res = await viewer.agent.get(`/api/fit-runs/${runId}/fitted-model`).expect(200);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?[A-Za-z0-9+._-]+-fit-\d+\.json"?$/);
    const model = JSON.parse(res.text);
    expect(model.pulsar).toBe(pulsar.name);
    expect(model.spin.frequency_hz).not.toBe(START_FREQUENCY_HZ);
    expect(() => readModelFile(model)).not.toThrow();
  });

  it('reuses the succeeded run for identical inputs (200, nothing queued) and queues again on recompute', async () => {
    const again = await queueFit(pulsar.id, { revisionId });
    expect(again.status).toBe(200);
    expect(again.body.data).toMatchObject({ reused: true, fitRun: { id: runId, status: 'succeeded' } });

    const recompute = await queueFit(pulsar.id, { revisionId, recompute: true });
    expect(recompute.status).toBe(202);
    expect(recompute.body.data.reused).toBe(false);
    const newId = recompute.body.data.fitRun.id;
    expect(newId).not.toBe(runId);
    expect(recompute.body.data.fitRun.inputsHash).toBe(again.body.data.fitRun.inputsHash);
    const run = await waitForRun(newId, isFinal);
    expect(run.status).toBe('succeeded');
  });

  it('does not reuse a run when the TOA selection changed (an exclusion)', async () => {
    const [toa] = await t.knex('toas').where({ pulsar_id: pulsar.id }).orderBy('id').limit(1);
    await t.knex('toa_exclusions').insert({ toa_id: toa.id, pulsar_id: pulsar.id, reason: 'test', excluded_by: null });
    try {
      const res = await queueFit(pulsar.id, { revisionId });
      expect(res.status).toBe(202);
      expect(res.body.data.fitRun).toMatchObject({ toaCount: TOA_COUNT - 1, excludedCount: 1 });
      const run = await waitForRun(res.body.data.fitRun.id, isFinal);
      expect(run.status).toBe('succeeded');
      const residuals = await viewer.agent.get(`/api/fit-runs/${run.id}/residuals`).expect(200);
      expect(residuals.body.data.toaId).not.toContain(Number(toa.id));
    } finally {
      await t.knex('toa_exclusions').where({ toa_id: toa.id }).del();
    }
  });

  it('refuses a revision of another pulsar (400) and unknown ones (404)', async () => {
    const other = await createPulsarRow(t.knex);
    const res = await queueFit(other.id, { revisionId });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toEqual(['revisionId']);
    expect((await queueFit(pulsar.id, { revisionId: 2147480000 })).status).toBe(404);
    expect((await queueFit(2147480000, { revisionId })).status).toBe(404);
    expect((await queueFit(pulsar.id, { revisionId: 'one' })).status).toBe(400);
  });
});

describe('engine input errors', () => {
  it('mark the run failed with the engine’s message, without retries', async () => {
    const model = { ...startModel, offsets: [{ backend: 'absent-backend', seconds: 0 }], solve_for: ['spin.frequency_hz', 'offsets[absent-backend].seconds'] };
    const badRevision = await newRevision(pulsar.id, model, 'offset of a backend without TOAs');
    const res = await queueFit(pulsar.id, { revisionId: badRevision });
    expect(res.status).toBe(202);
    const run = await waitForRun(res.body.data.fitRun.id, isFinal);
    expect(run.status).toBe('failed');
    expect(run.errorMessage).toMatch(/offsets\[absent-backend\]\.seconds: no TOAs from this backend/);
    expect(run.result).toBeNull();
    const job = await t.queue.getJob(`fit-run-${run.id}`);
    expect(job?.attemptsMade).toBe(1);
    expect(finished).toContainEqual({ fitRunId: run.id, pulsarId: pulsar.id, campaignId: null, status: 'failed' });
  });

  it('reject a bad payload as unrecoverable', async () => {
    const fakeJob = { data: { fitRunId: 'x' }, opts: {}, attemptsMade: 0, updateProgress: async () => {} } as unknown as Job;
    await expect(processFitRun(fakeJob, { knex: t.knex })).rejects.toBeInstanceOf(UnrecoverableError);
  });
});

describe('transient errors', () => {
  it('are thrown as ordinary errors (BullMQ retries them), not as unrecoverable ones', async () => {
    const unreachable = createKnex({ ...t.config, db: { ...t.config.db, port: 1 } }); // database down: nothing listens on port 1
    const fakeJob = { data: { fitRunId: 1 }, opts: { attempts: 3 }, attemptsMade: 0, updateProgress: async () => {} } as unknown as Job;
    try {
      const error = await processFitRun(fakeJob, { knex: unreachable }).catch((e: unknown) => e);
      expect(error).toBeInstanceOf(Error);
      expect(error).not.toBeInstanceOf(UnrecoverableError);
    } finally {
      await unreachable.destroy();
    }
  });
});

describe('cancelling', () => {
  it('a queued fit removes its job and marks it cancelled', async () => {
    await worker.close(); // no worker: the job stays waiting in the queue
    try {
      const res = await queueFit(pulsar.id, { revisionId, recompute: true });
      const id = res.body.data.fitRun.id;
      expect(await t.queue.getJob(`fit-run-${id}`)).toBeDefined();
      const cancelled = await analyst.agent.post(`/api/fit-runs/${id}/cancel`).set('x-csrf-token', analyst.csrf).send({});
      expect(cancelled.status).toBe(200);
      expect(cancelled.body.data).toMatchObject({ id, status: 'cancelled' });
      expect(await t.queue.getJob(`fit-run-${id}`)).toBeUndefined();
      const again = await analyst.agent.post(`/api/fit-runs/${id}/cancel`).set('x-csrf-token', analyst.csrf).send({});
      expect(again.status).toBe(409);
    } finally {
      worker = startWorker(t.config);
    }
  });

  it('a running fit stops it at its next progress report, storing nothing', async () => {
    const big = await createPulsarRow(t.knex);
    const truth = demoModelJson(big.name);
    await storeCsv(t.knex, big.id, simulatedCsv(truth, observatory, 4000, 5));
    const rev = await newRevision(big.id, offsetStartModel(truth, START_FREQUENCY_HZ));
    const res = await queueFit(big.id, { revisionId: rev });
    const id = res.body.data.fitRun.id;
    await waitForRun(id, (s) => s !== 'queued');
    const cancelled = await analyst.agent.post(`/api/fit-runs/${id}/cancel`).set('x-csrf-token', analyst.csrf).send({});
    expect(cancelled.status, JSON.stringify(cancelled.body)).toBe(200);
    const job = await t.queue.getJob(`fit-run-${id}`);
    for (let i = 0; i < 300 && !(await job!.isFailed()); i++) await new Promise((r) => setTimeout(r, 100));
    const failed = await t.queue.getJob(`fit-run-${id}`);
    expect(failed?.failedReason).toBe('cancelled');
    const run = (await viewer.agent.get(`/api/fit-runs/${id}`).expect(200)).body.data;
    expect(run).toMatchObject({ status: 'cancelled', result: null });
    expect(await residualRowCount(id)).toBe(0);
  });
});

describe('exactness', () => {
  it('equals the command line’s fit of the same file to < 1 ns in every residual', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'fit-run-cli-'));
    const files = { toas: path.join(dir, 'toas.csv'), model: path.join(dir, 'model.json'), observatories: path.join(dir, 'observatories.json') };
    writeFileSync(files.toas, csv);
    writeFileSync(files.model, JSON.stringify(startModel));
    writeFileSync(files.observatories, JSON.stringify([observatory]));
    const cli = await new Promise<{ code: number | null; stdout: string; stderr: string }>((resolve) => {
      const child = spawn('npm', ['run', '--silent', 'cli', '--', 'fit', '--toas', files.toas, '--model', files.model], {
        cwd: t.config.rootDir,
        env: { ...process.env, PULSEKEEPER_OBSERVATORIES: files.observatories },
      });
      let stdout = '';
      let stderr = '';
      child.stdout.on('data', (d) => (stdout += d));
      child.stderr.on('data', (d) => (stderr += d));
      child.on('close', (code) => resolve({ code, stdout, stderr }));
    });
    expect(cli.code, cli.stderr).toBe(0);
    const fromCli = JSON.parse(cli.stdout) as { chi2: number; residuals: { row: number; residual_us: number }[]; parameters: Record<string, { value: string }> };

    const runs = (await viewer.agent.get(`/api/pulsars/${pulsar.id}/fit-runs`).expect(200)).body.data as { id: number; revisionId: number; status: string; excludedCount: number }[];
    const run = runs.find((r) => r.revisionId === revisionId && r.status === 'succeeded' && r.excludedCount === 0)!;
    const table = (await viewer.agent.get(`/api/fit-runs/${run.id}/residuals`).expect(200)).body.data;
    const rowOf = new Map((await t.knex('toas').where({ pulsar_id: pulsar.id }).select('id', 'row_number')).map((r) => [Number(r.id), r.row_number as number]));
    const cliByRow = new Map(fromCli.residuals.map((r) => [r.row, r.residual_us]));
    expect(cliByRow.size).toBe(table.count);
    let worstUs = 0;
    table.toaId.forEach((id: number, i: number) => {
      worstUs = Math.max(worstUs, Math.abs(table.residualUs[i] - cliByRow.get(rowOf.get(id)!)!));
    });
    expect(worstUs).toBeLessThan(ONE_NS_IN_US);
    const detail = (await viewer.agent.get(`/api/fit-runs/${run.id}`).expect(200)).body.data;
    expect(detail.result.parameters['spin.frequency_hz'].value).toBe(fromCli.parameters['spin.frequency_hz'].value);
  });
});
