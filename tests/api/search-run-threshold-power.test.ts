/**
 * GET /api/search-runs/:id/periodograms sends each round's threshold power (the
 * power at which the round's Baluev false-alarm probability equals the run's
 * threshold, kept by the worker on the round's peak in the result JSON) and the
 * run's threshold beside the rounds; a run stored before the power was kept
 * answers null, so the screen draws no line rather than a wrong one. Outputs are
 * written by hand in the worker's format (api/db/search-runs.ts), as in
 * tests/api/search-runs.test.ts; tests/engine/search/search-threshold-power.test.ts
 * checks the power itself.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SearchResult } from '../../api/contracts/search-runs';
import { encodeSearchPeriodogram } from '../../api/db/search-runs';
import { demoModelJson } from '../worker/fit-run-fixtures';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let analyst: Client;
let viewer: Client;
let pulsarId: number;
let revisionId: number;
let analystId: number;

beforeAll(async () => {
  t = buildTestApp();
  const a = await createUser(t.knex, 'analyst');
  analystId = a.id;
  const v = await createUser(t.knex, 'viewer');
  analyst = await signedInClient(t.app, a.email, a.password);
  viewer = await signedInClient(t.app, v.email, v.password);
  const pulsar = await createPulsarRow(t.knex);
  pulsarId = pulsar.id;
  const res = await analyst.agent
    .post(`/api/pulsars/${pulsarId}/revisions`)
    .set('x-csrf-token', analyst.csrf)
    .send({ model: demoModelJson(pulsar.name), message: 'start' })
    .expect(201);
  revisionId = res.body.data.id;
});

afterAll(async () => {
  // No worker runs here: take this file's still-queued jobs off the shared queue.
  const queued = (await t.knex('search_runs').where({ requested_by: analystId, status: 'queued' }).select('job_id')) as { job_id: string | null }[];
  for (const { job_id: jobId } of queued) if (jobId) await (await t.queue.getJob(jobId))?.remove();
  await t.knex('search_runs').where({ requested_by: analystId, status: 'queued' }).update({ status: 'cancelled', stage: 'cancelled' });
  await t.close();
});

/** A run queued through the API, then given the worker's outputs: peaks (with `thresholdPowers` when given) and periodograms. */
async function succeededRun(minPeriodDays: number, falseAlarmThreshold: number, thresholdPowers: number[] | null): Promise<number> {
  const created = await analyst.agent
    .post(`/api/pulsars/${pulsarId}/search-runs`)
    .set('x-csrf-token', analyst.csrf)
    .send({ revisionId, minPeriodDays, falseAlarmThreshold })
    .expect(202);
  const id = created.body.data.searchRun.id as number;
  // Invented figures: two rounds, the first significant.
  const peaks = [
    { round: 1, periodDays: 71.4, frequencyPerDay: 1 / 71.4, power: 0.7, falseAlarmProbability: 1e-12, significant: true, aliasWarnings: [] },
    { round: 2, periodDays: 9.3, frequencyPerDay: 1 / 9.3, power: 0.04, falseAlarmProbability: 0.6, significant: false, aliasWarnings: [] },
  ].map((p, i) => (thresholdPowers ? { ...p, thresholdPower: thresholdPowers[i] } : p));
  const result = {
    peaks,
    candidates: [],
    companionsFound: 0,
    stopReason: 'false-alarm-above-threshold',
    finalFit: { chi2: 300, dof: 290, reducedChi2: 1.03, weightedRmsUs: 1.1, converged: true, iterations: 2, parameters: {} },
    warnings: [],
    searchSettings: { minPeriodDays, maxPeriodDays: 1200, maxCompanions: 3, falseAlarmThreshold, eccentricityThreshold: 0.001, pulsarMassSolar: 1.4, oversampling: 5, frequencyCount: 50, spanDays: 1200 },
    engineSettings: { ephemeris: 'DE405' },
    resultingModel: {},
  } satisfies SearchResult;
  await t.knex('search_runs').where({ id }).update({
    status: 'succeeded', progress_percent: 100, stage: 'done', started_at: new Date(), finished_at: new Date(), duration_ms: 5,
    result_json: JSON.stringify(result), companions_found: 0, final_chi2: 300,
  });
  for (const round of [2, 1]) { // stored out of order: the answer is by round
    const power = Float64Array.from({ length: 50 }, (_, k) => Math.abs(Math.sin(k * round)) * 0.5);
    await t.knex('search_periodograms').insert(encodeSearchPeriodogram(id, { round, grid: { minFrequencyPerDay: 1 / 1200, stepPerDay: 1 / 3000, count: 50 }, power }));
  }
  return id;
}

describe('periodograms with the threshold power', () => {
  it('sends each round the threshold power kept on its peak, and the run’s threshold', async () => {
    const id = await succeededRun(4.25, 0.002, [0.1432, 0.1419]);
    const res = await viewer.agent.get(`/api/search-runs/${id}/periodograms`).expect(200);
    expect(res.body.data.searchRunId).toBe(id);
    expect(res.body.data.falseAlarmThreshold).toBe(0.002);
    expect(res.body.data.rounds.map((r: { round: number; thresholdPower: number | null }) => [r.round, r.thresholdPower])).toEqual([
      [1, 0.1432],
      [2, 0.1419],
    ]);
    expect(res.body.data.rounds[0].power).toHaveLength(50);
  });

  it('answers null for a run stored before the threshold power was kept', async () => {
    const id = await succeededRun(4.5, 0.001, null);
    const res = await viewer.agent.get(`/api/search-runs/${id}/periodograms`).expect(200);
    expect(res.body.data.falseAlarmThreshold).toBe(0.001);
    for (const round of res.body.data.rounds) expect(round.thresholdPower).toBeNull();
  });
});
