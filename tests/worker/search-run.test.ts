/**
 * The search-run job end to end: TOAs simulated from an invented model with
 * one companion injected, the revision searched without it; queued through the
 * API, run by the real worker (BullMQ on the real Redis, in this process),
 * results read back through the API; the companion recovered and saved as a
 * revision; the job's result equal to the command line's `search` of the same
 * file; engine input errors; bad payloads; cancelling a running search.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { UnrecoverableError, type Job } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SearchPeriodograms, SearchRun } from '../../api/contracts/search-runs';
import { HIDDEN_COMPANIONS, STARTING_REVISION_MESSAGE } from '../../api/db/demo-scenario/demo-pulsars';
import type { ObservatoryJson } from '../../api/db/observatories';
import { seedDemo } from '../../api/db/seed-demo';
import { processSearchRun } from '../../worker/jobs/search-run';
import { startWorker } from '../../worker/index';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { signedInClient, type Client } from '../api/helpers/agents';
import { createPulsarRow, createUser } from '../api/helpers/factories';
import { buildTestApp, type TestApp } from '../api/helpers/test-app';
import { createTestObservatory, demoModelJson, simulatedCsv, storeCsv, saveRevision } from './fit-run-fixtures';

const TOA_COUNT = 300;
/** The injected companion (invented): 61.5 d, 30 µs light-travel amplitude (x = 3e-5 lt-s), circular. */
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
const TRUE_PERIOD_DAYS = 61.5;
const TRUE_X_LT_S = 3e-5;
const SEARCH = { minPeriodDays: 20, maxPeriodDays: 600, maxCompanions: 2 };
/** T☉ = GM☉/c³ = 4.925490947 µs (IAU nominal solar mass parameter; from memory). */
const T_SUN_S = 4.925490947e-6;

let t: TestApp;
let worker: ReturnType<typeof startWorker>;
let analyst: Client;
let viewer: Client;
let observatory: ObservatoryJson;
let pulsar: { id: number; name: string };
let csv: string;
let startModel: Record<string, unknown>;
let revisionId: number;

const newRevision = (pulsarId: number, model: Record<string, unknown>, message?: string) => saveRevision(analyst, pulsarId, model, message);

async function queueSearch(pulsarId: number, body: Record<string, unknown>) {
  return analyst.agent.post(`/api/pulsars/${pulsarId}/search-runs`).set('x-csrf-token', analyst.csrf).send(body);
}

async function waitForRun(id: number, until: (status: string) => boolean, timeoutMs = 110_000): Promise<SearchRun> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await viewer.agent.get(`/api/search-runs/${id}`).expect(200);
    if (until(res.body.data.status)) return res.body.data as SearchRun;
    if (Date.now() > deadline) throw new Error(`search run ${id} still ${res.body.data.status} (${res.body.data.progress.stage})`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
const isFinal = (s: string) => s === 'succeeded' || s === 'failed' || s === 'cancelled';

async function periodogramRowCount(searchRunId: number): Promise<number> {
  const [row] = await t.knex('search_periodograms').where({ search_run_id: searchRunId }).count({ n: '*' });
  return Number(row.n);
}

beforeAll(async () => {
  t = buildTestApp();
  worker = startWorker(t.config);
  const a = await createUser(t.knex, 'analyst');
  const v = await createUser(t.knex, 'viewer');
  analyst = await signedInClient(t.app, a.email, a.password);
  viewer = await signedInClient(t.app, v.email, v.password);
  observatory = await createTestObservatory(t.knex);
  pulsar = await createPulsarRow(t.knex);
  startModel = demoModelJson(pulsar.name);
  const truth = { ...startModel, companions: [...(startModel.companions as unknown[]), INJECTED] };
  csv = simulatedCsv(truth, observatory, TOA_COUNT, 11);
  await storeCsv(t.knex, pulsar.id, csv, a.id);
  revisionId = await newRevision(pulsar.id, startModel);
});

afterAll(async () => {
  await worker.close();
  await t.close();
});

describe('a search through the API on data with one injected companion', () => {
  let run: SearchRun;

  it('is queued (202), run by the worker, and recovers the companion with elements ± uncertainties', async () => {
    const res = await queueSearch(pulsar.id, { revisionId, ...SEARCH });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body.data.searchRun).toMatchObject({ status: 'queued', toaCount: TOA_COUNT, result: null });
    run = await waitForRun(res.body.data.searchRun.id, isFinal);
    expect(run.status, run.errorMessage ?? '').toBe('succeeded');
    expect(run.progress).toEqual({ percent: 100, stage: 'done' });
    expect(run.durationMs).toBeGreaterThan(0);
    const result = run.result!;

    expect(result.peaks[0]).toMatchObject({ round: 1, significant: true });
    expect(result.peaks[0].falseAlarmProbability).toBeLessThan(1e-6);
    expect(Math.abs(result.peaks[0].periodDays - TRUE_PERIOD_DAYS) / TRUE_PERIOD_DAYS).toBeLessThan(0.05);

    // One discovery, no spurious second: the search stops on a peak above the threshold (white noise left).
    expect(result.companionsFound).toBe(1);
    expect(result.stopReason).toBe('false-alarm-above-threshold');
    const last = result.peaks[result.peaks.length - 1];
    expect(last.significant).toBe(false);
    expect(last.falseAlarmProbability).toBeGreaterThanOrEqual(0.001);

    const found = result.candidates.find((c) => c.status === 'accepted')!;
    expect(found).toMatchObject({ round: 1, kind: 'keplerian', reason: null, converged: true });
    const period = found.elements.period_days;
    const x = found.elements.projected_semimajor_axis_lt_s;
    expect(period.unit).toBe('days');
    expect(period.uncertainty).toBeGreaterThan(0);
    expect(x.uncertainty).toBeGreaterThan(0);
    // Recovered within 3σ of the injected values (common practice for injection–recovery).
    expect(Math.abs(Number(period.value) - TRUE_PERIOD_DAYS) / period.uncertainty!).toBeLessThan(3);
    expect(Math.abs(Number(x.value) - TRUE_X_LT_S) / x.uncertainty!).toBeLessThan(3);
    expect(found.chi2Change).toBeLessThan(0);
    expect(found.chi2Change).toBeCloseTo(found.chi2After! - found.chi2Before, 6);
    // White noise of the simulated σ once the companion is in: reduced χ² near 1 (within a few √(2/dof)).
    expect(Math.abs(result.finalFit.reducedChi2 - 1)).toBeLessThan(5 * Math.sqrt(2 / result.finalFit.dof));
    expect(result.finalFit.converged).toBe(true);

    // Mass function f = 4π² x³ / (T☉ Pb²) (Lorimer & Kramer 2005, eq. 8.34 with x in light-seconds).
    const pbSeconds = Number(period.value) * 86_400;
    const massFunction = (4 * Math.PI ** 2 * Number(x.value) ** 3) / (T_SUN_S * pbSeconds ** 2);
    expect(found.derived.massFunctionSolar! / massFunction).toBeCloseTo(1, 6);
    expect(found.derived.assumedPulsarMassSolar).toBe(1.4);
    expect(found.derived.minimumCompanionMass.earthMasses).toBeGreaterThan(0);
    expect(found.derived.separationAu).toBeGreaterThan(0);

    // The settings that produced the result are named.
    expect(result.engineSettings).toMatchObject({ ephemeris: expect.stringMatching(/DE405/) });
    expect(result.searchSettings).toMatchObject({ minPeriodDays: SEARCH.minPeriodDays, maxPeriodDays: SEARCH.maxPeriodDays, maxCompanions: 2, falseAlarmThreshold: 0.001 });

    // The resulting model is the start model plus the found companion.
    const model = readModelFile(result.resultingModel);
    expect(model.companions.map((c) => c.name)).toEqual(['b', found.name]);
  });

  it('stores one compressed periodogram per round whose highest power is at the reported peak', async () => {
    expect(await periodogramRowCount(run.id)).toBe(run.result!.peaks.length);
    const data = (await viewer.agent.get(`/api/search-runs/${run.id}/periodograms`).expect(200)).body.data as SearchPeriodograms;
    expect(data.rounds.map((r) => r.round)).toEqual(run.result!.peaks.map((p) => p.round));
    for (const round of data.rounds) {
      expect(round.power).toHaveLength(round.grid.count);
      let best = 0;
      round.power.forEach((p, k) => {
        if (p > round.power[best]) best = k;
      });
      const peak = run.result!.peaks[round.round - 1];
      const bestFrequency = round.grid.minFrequencyPerDay + best * round.grid.stepPerDay;
      expect(Math.abs(bestFrequency - peak.frequencyPerDay)).toBeLessThanOrEqual(round.grid.stepPerDay);
    }
  });

  it('reuses the succeeded run for identical inputs (200, nothing queued)', async () => {
    const again = await queueSearch(pulsar.id, { revisionId, ...SEARCH });
    expect(again.status).toBe(200);
    expect(again.body.data).toMatchObject({ reused: true, searchRun: { id: run.id, status: 'succeeded' } });
  });

  it('saves the resulting model as a new revision containing the companion, in one step', async () => {
    const res = await analyst.agent.post(`/api/search-runs/${run.id}/save-revision`).set('x-csrf-token', analyst.csrf).send({ message: 'companion from the search' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data).toMatchObject({ pulsarId: pulsar.id, parentId: revisionId, message: 'companion from the search' });
    const saved = readModelFile(res.body.data.model);
    const companion = saved.companions.find((c) => c.name !== 'b')!;
    const found = run.result!.candidates.find((c) => c.status === 'accepted')!;
    expect(companion.name).toBe(found.name);
    expect(companion.periodDays).toBe(Number(found.elements.period_days.value));
    expect(Math.abs(companion.periodDays - TRUE_PERIOD_DAYS) / found.elements.period_days.uncertainty!).toBeLessThan(3);
    expect((await viewer.agent.get(`/api/search-runs/${run.id}`).expect(200)).body.data.savedRevisionId).toBe(res.body.data.id);
  });

  it('equals the command line’s search of the same file', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'search-run-cli-'));
    const files = { toas: path.join(dir, 'toas.csv'), model: path.join(dir, 'model.json'), observatories: path.join(dir, 'observatories.json') };
    writeFileSync(files.toas, csv);
    writeFileSync(files.model, JSON.stringify(startModel));
    writeFileSync(files.observatories, JSON.stringify([observatory]));
    const args = ['run', '--silent', 'cli', '--', 'search', '--toas', files.toas, '--model', files.model];
    args.push('--min-period-days', String(SEARCH.minPeriodDays), '--max-period-days', String(SEARCH.maxPeriodDays), '--max-companions', String(SEARCH.maxCompanions));
    const cli = await new Promise<{ code: number | null; stdout: string; stderr: string }>((resolve) => {
      const child = spawn('npm', args, { cwd: t.config.rootDir, env: { ...process.env, PULSEKEEPER_OBSERVATORIES: files.observatories } });
      let stdout = '';
      let stderr = '';
      child.stdout.on('data', (d) => (stdout += d));
      child.stderr.on('data', (d) => (stderr += d));
      child.on('close', (code) => resolve({ code, stdout, stderr }));
    });
    expect(cli.code, cli.stderr).toBe(0);
    const fromCli = JSON.parse(cli.stdout) as { peaks: { period_days: number; false_alarm_probability: number }[]; model: Record<string, unknown>; chi2: number };
    const result = run.result!;
    expect(result.peaks.map((p) => [p.periodDays, p.falseAlarmProbability])).toEqual(fromCli.peaks.map((p) => [p.period_days, p.false_alarm_probability]));
    expect(result.finalFit.chi2).toBe(fromCli.chi2);
    expect(result.resultingModel).toEqual(fromCli.model);
  });
});

describe('the demo pulsar with two hidden companions (api/db/seed-demo.ts)', () => {
  it('recovers both invented companions within 3σ, nothing spurious, and saves them as a revision', async () => {
    await seedDemo(t.knex);
    const demo = await t.knex('pulsars').where({ name: 'FPG-J2208+4121' }).first('id');
    const start = await t.knex('model_revisions').where({ pulsar_id: demo.id, message: STARTING_REVISION_MESSAGE }).orderBy('id').first('id');
    const res = await queueSearch(Number(demo.id), { revisionId: Number(start.id), recompute: true });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const run = await waitForRun(res.body.data.searchRun.id, isFinal);
    expect(run.status, run.errorMessage ?? '').toBe('succeeded');
    const result = run.result!;
    const accepted = result.candidates.filter((c) => c.status === 'accepted');
    expect(result.companionsFound).toBe(HIDDEN_COMPANIONS.length);
    expect(result.stopReason).toBe('false-alarm-above-threshold');
    for (const truth of HIDDEN_COMPANIONS) {
      const match = accepted.find((c) => Math.abs(Number(c.elements.period_days.value) / Number(truth.period_days) - 1) < 0.05);
      expect(match, `a candidate near ${truth.period_days} d`).toBeDefined();
      const period = match!.elements.period_days;
      const x = match!.elements.projected_semimajor_axis_lt_s;
      expect(Math.abs(Number(period.value) - Number(truth.period_days)) / period.uncertainty!).toBeLessThan(3);
      expect(Math.abs(Number(x.value) - Number(truth.projected_semimajor_axis_lt_s)) / x.uncertainty!).toBeLessThan(3);
    }
    const saved = await analyst.agent.post(`/api/search-runs/${run.id}/save-revision`).set('x-csrf-token', analyst.csrf).send({ message: 'two companions found by the search' });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body.data.parentId).toBe(Number(start.id));
    expect(readModelFile(saved.body.data.model).companions.map((c) => c.name).sort()).toEqual(accepted.map((c) => c.name).sort());
  });
});

describe('engine input errors', () => {
  it('mark the run failed with the engine’s message, without retries', async () => {
    const model = { ...startModel, offsets: [{ backend: 'absent-backend', seconds: 0 }], solve_for: ['spin.frequency_hz', 'offsets[absent-backend].seconds'] };
    const badRevision = await newRevision(pulsar.id, model, 'offset of a backend without TOAs');
    const res = await queueSearch(pulsar.id, { revisionId: badRevision, ...SEARCH });
    expect(res.status).toBe(202);
    const failed = await waitForRun(res.body.data.searchRun.id, isFinal);
    expect(failed.status).toBe('failed');
    expect(failed.errorMessage).toMatch(/offsets\[absent-backend\]\.seconds: no TOAs from this backend/);
    expect(failed.result).toBeNull();
    expect(await periodogramRowCount(failed.id)).toBe(0);
    const job = await t.queue.getJob(`search-run-${failed.id}`);
    expect(job?.attemptsMade).toBe(1);
  });

  it('reject a bad payload as unrecoverable', async () => {
    const fakeJob = { data: { searchRunId: 'x' }, opts: {}, attemptsMade: 0, updateProgress: async () => {} } as unknown as Job;
    await expect(processSearchRun(fakeJob, { knex: t.knex })).rejects.toBeInstanceOf(UnrecoverableError);
    const unknownRun = { data: { searchRunId: 2147480000 }, opts: {}, attemptsMade: 0, updateProgress: async () => {} } as unknown as Job;
    await expect(processSearchRun(unknownRun, { knex: t.knex })).rejects.toThrow(/does not exist/);
  });
});

describe('cancelling', () => {
  it('a running search stops at its next progress report, storing nothing', async () => {
    const big = await createPulsarRow(t.knex);
    const model = demoModelJson(big.name);
    await storeCsv(t.knex, big.id, simulatedCsv({ ...model, companions: [...(model.companions as unknown[]), INJECTED] }, observatory, 4000, 5));
    const rev = await newRevision(big.id, model);
    const res = await queueSearch(big.id, { revisionId: rev, ...SEARCH });
    const id = res.body.data.searchRun.id as number;
    await waitForRun(id, (s) => s !== 'queued');
    const cancelled = await analyst.agent.post(`/api/search-runs/${id}/cancel`).set('x-csrf-token', analyst.csrf).send({});
    expect(cancelled.status, JSON.stringify(cancelled.body)).toBe(200);
    const job = await t.queue.getJob(`search-run-${id}`);
    for (let i = 0; i < 300 && !(await job!.isFailed()); i++) await new Promise((r) => setTimeout(r, 100));
    expect((await t.queue.getJob(`search-run-${id}`))?.failedReason).toBe('cancelled');
    const after = (await viewer.agent.get(`/api/search-runs/${id}`).expect(200)).body.data;
    expect(after).toMatchObject({ status: 'cancelled', result: null });
    expect(await periodogramRowCount(id)).toBe(0);
  });
});
