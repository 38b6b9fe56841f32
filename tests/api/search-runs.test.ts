/**
 * Search runs through the API without a worker: queueing (202, one BullMQ job
 * per run), bad input refused with nothing stored or queued, reuse of a
 * succeeded run by inputs hash, listing and reading, periodograms read back
 * from their compressed rows, cancelling, and saving the resulting model as a
 * new revision (refused unless the run succeeded with a new companion). The
 * worker's outputs are written here by hand in the worker's own format
 * (api/db/search-runs.ts); tests/worker/search-run.test.ts runs the real job.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_SEARCH_FREQUENCIES, MAX_STORED_PERIODOGRAM_POINTS, type SearchCandidate, type SearchResult } from '../../api/contracts/search-runs';
import { encodeSearchPeriodogram } from '../../api/db/search-runs';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { writeModelFile } from '../../worker/timing/model/write-model-file';
import { createTestObservatory, demoModelJson, simulatedCsv, storeCsv } from '../worker/fit-run-fixtures';
import { signedInClient, type Client } from './helpers/agents';
import { countRows, createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let analyst: Client;
let viewer: Client;
let pulsar: { id: number; name: string };
let revisionId: number;
let startModel: Record<string, unknown>;
let analystId: number;

const NEW_COMPANION = {
  name: 'search-1',
  kind: 'keplerian',
  enabled: true,
  period_days: '61.5',
  projected_semimajor_axis_lt_s: '0.00003',
  eccentricity: 0,
  periastron_longitude_deg: 0,
  periastron_epoch_mjd: '58630.25',
};

beforeAll(async () => {
  t = buildTestApp();
  const a = await createUser(t.knex, 'analyst');
  analystId = a.id;
  const v = await createUser(t.knex, 'viewer');
  analyst = await signedInClient(t.app, a.email, a.password);
  viewer = await signedInClient(t.app, v.email, v.password);
  pulsar = await createPulsarRow(t.knex);
  const res = await analyst.agent
    .post(`/api/pulsars/${pulsar.id}/revisions`)
    .set('x-csrf-token', analyst.csrf)
    .send({ model: demoModelJson(pulsar.name), message: 'start' })
    .expect(201);
  revisionId = res.body.data.id;
  startModel = res.body.data.model;
});

afterAll(async () => {
  // No worker runs here: take this file's still-queued jobs off the shared queue, so a later file's worker never runs them.
  const queued = (await t.knex('search_runs').where({ requested_by: analystId, status: 'queued' }).select('job_id')) as { job_id: string | null }[];
  for (const { job_id: jobId } of queued) if (jobId) await (await t.queue.getJob(jobId))?.remove();
  await t.knex('search_runs').where({ requested_by: analystId, status: 'queued' }).update({ status: 'cancelled', stage: 'cancelled' });
  await t.close();
});

async function startSearch(body: Record<string, unknown>, pulsarId = pulsar.id, client = analyst) {
  return client.agent.post(`/api/pulsars/${pulsarId}/search-runs`).set('x-csrf-token', client.csrf).send(body);
}

async function saveRevision(runId: number, body: Record<string, unknown>, client = analyst) {
  return client.agent.post(`/api/search-runs/${runId}/save-revision`).set('x-csrf-token', client.csrf).send(body);
}

/** A candidate as the worker stores it (figures invented for the test). */
function candidate(status: SearchCandidate['status']): SearchCandidate {
  return {
    round: 1,
    name: NEW_COMPANION.name,
    kind: 'keplerian',
    status,
    reason: status === 'accepted' ? null : 'eccentricity reached 0.99',
    falseAlarmProbability: 1e-9,
    seedPeriodDays: 61.4,
    elements: {
      period_days: { value: '61.5', uncertainty: 0.04, unit: 'days' },
      eccentricity: { value: '0', uncertainty: null, unit: '' },
    },
    chi2Before: 2400,
    chi2After: 290,
    chi2Change: -2110,
    eccentricityTest: { attempted: true, statistic: 0.4, probability: 0.67, kept: false },
    converged: true,
    derived: {
      massFunctionSolar: 7.7e-15,
      assumedPulsarMassSolar: 1.4,
      minimumCompanionMass: { solarMasses: 2.4e-5, jupiterMasses: 0.025, earthMasses: 8 },
      separationAu: 0.35,
    },
  };
}

/** A succeeded search result whose resulting model is the start model plus NEW_COMPANION when `found`. */
function searchResult(found: boolean): SearchResult {
  const model = { ...startModel, companions: [...(startModel.companions as unknown[]), ...(found ? [NEW_COMPANION] : [])] };
  return {
    peaks: [
      { round: 1, periodDays: 61.4, frequencyPerDay: 1 / 61.4, power: 0.8, falseAlarmProbability: 1e-9, significant: true, aliasWarnings: [] },
      { round: 2, periodDays: 13.2, frequencyPerDay: 1 / 13.2, power: 0.05, falseAlarmProbability: 0.4, significant: false, aliasWarnings: [] },
    ],
    candidates: found ? [candidate('accepted')] : [candidate('degenerate')],
    companionsFound: found ? 1 : 0,
    stopReason: 'false-alarm-above-threshold',
    finalFit: { chi2: 290, dof: 280, reducedChi2: 1.04, weightedRmsUs: 1.5, converged: true, iterations: 3, parameters: { 'spin.frequency_hz': { value: '218.8', uncertainty: 1e-12, unit: 'Hz' } } },
    warnings: [],
    searchSettings: {
      minPeriodDays: 2,
      maxPeriodDays: 1200,
      maxCompanions: 3,
      falseAlarmThreshold: 0.001,
      eccentricityThreshold: 0.001,
      pulsarMassSolar: 1.4,
      oversampling: 5,
      frequencyCount: 3000,
      spanDays: 1200,
    },
    engineSettings: { periodogram: 'generalized Lomb–Scargle', ephemeris: 'DE405' },
    resultingModel: writeModelFile(readModelFile(model)),
  };
}

/** Writes a run's outputs as the worker's final transaction does. */
async function markSucceeded(runId: number, result: SearchResult): Promise<void> {
  await t.knex('search_runs').where({ id: runId }).update({
    status: 'succeeded',
    progress_percent: 100,
    stage: 'done',
    started_at: new Date(),
    finished_at: new Date(),
    duration_ms: 12,
    result_json: JSON.stringify(result),
    companions_found: result.companionsFound,
    final_chi2: result.finalFit.chi2,
  });
}

describe('starting a search', () => {
  it('queues the run (202) with its resolved options, settings and one BullMQ job', async () => {
    const res = await startSearch({ revisionId, maxPeriodDays: 500, maxCompanions: 2 });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const run = res.body.data.searchRun;
    expect(res.body.data.reused).toBe(false);
    expect(run).toMatchObject({
      pulsarId: pulsar.id,
      revisionId,
      status: 'queued',
      progress: { percent: 0, stage: 'queued' },
      options: { minPeriodDays: null, maxPeriodDays: 500, maxCompanions: 2, falseAlarmThreshold: 0.001, assumedPulsarMassSolar: 1.4 },
      toaCount: 0,
      excludedCount: 0,
      savedRevisionId: null,
      result: null,
      requestedBy: { displayName: 'Test analyst' },
    });
    expect(run.inputsHash).toMatch(/^[0-9a-f]{64}$/);
    expect(run.settings).toMatchObject({ ephemeris: 'DE405', timeScale: expect.any(String), clock: expect.any(String) });
    const job = await t.queue.getJob(`search-run-${run.id}`);
    expect(job?.name).toBe('search-run');
    expect(job?.data).toEqual({ searchRunId: run.id });
  });

  it.each([
    ['an unknown field', { revisionId: 1, period: 3 }, ['period']],
    ['a text revision id', { revisionId: 'one' }, ['revisionId']],
    ['a missing revision id', {}, ['revisionId']],
    ['a negative period', { revisionId: 1, minPeriodDays: -1 }, ['minPeriodDays']],
    ['max period below min period', { revisionId: 1, minPeriodDays: 50, maxPeriodDays: 20 }, ['maxPeriodDays']],
    ['zero companions', { revisionId: 1, maxCompanions: 0 }, ['maxCompanions']],
    ['a fractional companion count', { revisionId: 1, maxCompanions: 1.5 }, ['maxCompanions']],
    ['a false-alarm threshold of 1', { revisionId: 1, falseAlarmThreshold: 1 }, ['falseAlarmThreshold']],
    ['a zero pulsar mass', { revisionId: 1, assumedPulsarMassSolar: 0 }, ['assumedPulsarMassSolar']],
  ])('refuses %s (400, nothing stored or queued)', async (_what, body, path) => {
    const runsBefore = await countRows(t.knex, 'search_runs');
    const jobsBefore = await t.queue.getJobCountByTypes('waiting', 'delayed', 'active');
    const res = await startSearch({ ...body, ...('revisionId' in body && body.revisionId === 1 ? { revisionId } : {}) });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.map((d: { path: unknown }) => d.path)).toContainEqual(path);
    expect(await countRows(t.knex, 'search_runs')).toBe(runsBefore);
    expect(await t.queue.getJobCountByTypes('waiting', 'delayed', 'active')).toBe(jobsBefore);
  });

  it('refuses a revision of another pulsar (400) and unknown pulsars or revisions (404), storing nothing', async () => {
    const runsBefore = await countRows(t.knex, 'search_runs');
    const other = await createPulsarRow(t.knex);
    const res = await startSearch({ revisionId }, other.id);
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toEqual(['revisionId']);
    expect((await startSearch({ revisionId: 2147480000 })).body.error.code).toBe('not_found');
    expect((await startSearch({ revisionId }, 2147480000)).status).toBe(404);
    expect(await countRows(t.knex, 'search_runs')).toBe(runsBefore);
  });

  it('refuses a minimum period whose grid would exceed the frequency limit over the TOAs’ span (400, nothing stored)', async () => {
    const observatory = await createTestObservatory(t.knex);
    const withToas = await createPulsarRow(t.knex);
    const model = demoModelJson(withToas.name);
    await storeCsv(t.knex, withToas.id, simulatedCsv(model, observatory, 20));
    const span = await t.knex('toas').where({ pulsar_id: withToas.id }).first(t.knex.raw('MAX(mjd_day) - MIN(mjd_day) + 1 AS days'));
    const spanDays = Number(span.days);
    const rev = (await analyst.agent.post(`/api/pulsars/${withToas.id}/revisions`).set('x-csrf-token', analyst.csrf).send({ model, message: 'start' }).expect(201)).body.data.id;
    const runsBefore = await countRows(t.knex, 'search_runs');
    // 5 × span × (1/0.001 d − 1/span) frequencies: millions over a span of ~3 years
    const res = await startSearch({ revisionId: rev, minPeriodDays: 0.001 }, withToas.id);
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toEqual(['minPeriodDays']);
    const said = /would hold ([\d,]+) frequencies over the (\d+)-day span \(limit 2,000,000\); choose at least ([\d.e-]+) days/.exec(res.body.error.message);
    expect(said, res.body.error.message).not.toBeNull();
    expect(Number(said![2])).toBe(spanDays);
    expect(Number(said![1].replaceAll(',', ''))).toBeGreaterThan(MAX_SEARCH_FREQUENCIES);
    expect(await countRows(t.knex, 'search_runs')).toBe(runsBefore);
    // The suggested shortest period is the limit: a little below is refused, a little above accepted.
    const shortest = Number(said![3]);
    expect((await startSearch({ revisionId: rev, minPeriodDays: shortest * 0.99 }, withToas.id)).status).toBe(400);
    expect((await startSearch({ revisionId: rev, minPeriodDays: shortest * 1.01 }, withToas.id)).status).toBe(202);
  });

  it('is refused to a viewer (403)', async () => {
    const res = await startSearch({ revisionId }, pulsar.id, viewer);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });
});

describe('reuse by inputs hash', () => {
  it('offers a succeeded run with identical inputs (200, nothing queued); other options or recompute queue a new run', async () => {
    const body = { revisionId, minPeriodDays: 3, falseAlarmThreshold: 0.01 };
    const first = (await startSearch(body)).body.data.searchRun;
    await markSucceeded(first.id, searchResult(true));

    const runsBefore = await countRows(t.knex, 'search_runs');
    const again = await startSearch({ ...body });
    expect(again.status).toBe(200);
    expect(again.body.data).toMatchObject({ reused: true, searchRun: { id: first.id, status: 'succeeded', inputsHash: first.inputsHash } });
    expect(await countRows(t.knex, 'search_runs')).toBe(runsBefore);

    // Defaults written out give the same resolved options, hence the same hash.
    const explicit = await startSearch({ ...body, maxCompanions: 3, assumedPulsarMassSolar: 1.4 });
    expect(explicit.status).toBe(200);
    expect(explicit.body.data.searchRun.id).toBe(first.id);

    const otherOptions = await startSearch({ ...body, falseAlarmThreshold: 0.02 });
    expect(otherOptions.status).toBe(202);
    expect(otherOptions.body.data.searchRun.inputsHash).not.toBe(first.inputsHash);

    const recompute = await startSearch({ ...body, recompute: true });
    expect(recompute.status).toBe(202);
    expect(recompute.body.data).toMatchObject({ reused: false, searchRun: { status: 'queued', inputsHash: first.inputsHash } });
    expect(recompute.body.data.searchRun.id).not.toBe(first.id);
  });

  it('does not reuse a run that has not succeeded', async () => {
    const body = { revisionId, minPeriodDays: 4 };
    const first = (await startSearch(body)).body.data.searchRun;
    const second = await startSearch(body);
    expect(second.status).toBe(202);
    expect(second.body.data.searchRun.id).not.toBe(first.id);
  });
});

describe('reading search runs', () => {
  let runId: number;

  beforeAll(async () => {
    runId = (await startSearch({ revisionId, minPeriodDays: 5 })).body.data.searchRun.id;
    await markSucceeded(runId, searchResult(true));
  });

  it('returns one run with peaks, candidates, the final fit and the resulting model to a viewer', async () => {
    const res = await viewer.agent.get(`/api/search-runs/${runId}`).expect(200);
    const run = res.body.data;
    expect(run).toMatchObject({ id: runId, status: 'succeeded', progress: { percent: 100, stage: 'done' } });
    expect(run.result).toEqual(searchResult(true));
  });

  it('lists the pulsar’s runs newest first as summaries', async () => {
    const res = await viewer.agent.get(`/api/pulsars/${pulsar.id}/search-runs`).expect(200);
    const ids = res.body.data.map((r: { id: number }) => r.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    const summary = res.body.data.find((r: { id: number }) => r.id === runId);
    expect(summary.result).not.toHaveProperty('resultingModel');
    expect(summary.result.finalFit).not.toHaveProperty('parameters');
    expect(summary.result.finalFit.chi2).toBe(290);
    expect(summary.result.candidates[0]).not.toHaveProperty('elements');
    expect(summary.result.candidates[0]).toMatchObject({ name: NEW_COMPANION.name, status: 'accepted', chi2Change: -2110 });
    expect(summary.result.peaks).toHaveLength(2);
  });

  it('answers 404 for unknown runs and pulsars, 400 for a bad id', async () => {
    expect((await viewer.agent.get('/api/search-runs/2147480000')).status).toBe(404);
    expect((await viewer.agent.get('/api/pulsars/2147480000/search-runs')).status).toBe(404);
    const bad = await viewer.agent.get('/api/search-runs/abc');
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toEqual(['params', 'id']);
  });

  it('returns the periodograms per round, decoded bit for bit from their compressed rows', async () => {
    const rounds = [1, 2].map((round) => {
      const count = 1000 + round;
      const power = Float64Array.from({ length: count }, (_, k) => Math.abs(Math.sin(0.37 * k * round)) / (1 + k));
      return { round, grid: { minFrequencyPerDay: 1 / 1200, stepPerDay: 1 / 6000 / round, count }, power };
    });
    for (const r of rounds) await t.knex('search_periodograms').insert(encodeSearchPeriodogram(runId, r));
    const stored = await t.knex('search_periodograms').where({ search_run_id: runId }).first('power');
    expect((stored.power as Buffer).length).toBeLessThan(1001 * 8); // deflated

    const res = await viewer.agent.get(`/api/search-runs/${runId}/periodograms`).expect(200);
    expect(res.body.data.searchRunId).toBe(runId);
    expect(res.body.data.rounds).toEqual(rounds.map((r) => ({ round: r.round, grid: r.grid, pointsPerBin: 1, power: Array.from(r.power), thresholdPower: null }))); // searchResult's peaks carry no threshold power
  });

  it('keeps a periodogram longer than the storage limit max-pooled, so its peak keeps its height and bin', async () => {
    const count = 2 * MAX_STORED_PERIODOGRAM_POINTS + 1; // → bins of 3 grid points
    const power = Float64Array.from({ length: count }, (_, k) => 0.01 * Math.abs(Math.sin(k)));
    const spike = 123_457;
    power[spike] = 0.93;
    const grid = { minFrequencyPerDay: 0.001, stepPerDay: 1e-5, count };
    const id = (await startSearch({ revisionId, minPeriodDays: 5.5 })).body.data.searchRun.id;
    await markSucceeded(id, searchResult(true));
    await t.knex('search_periodograms').insert(encodeSearchPeriodogram(id, { round: 1, grid, power }));

    const [round] = (await viewer.agent.get(`/api/search-runs/${id}/periodograms`).expect(200)).body.data.rounds;
    expect(round.pointsPerBin).toBe(3);
    expect(round.grid).toMatchObject({ minFrequencyPerDay: 0.001, count: Math.ceil(count / 3) });
    expect(round.grid.stepPerDay).toBeCloseTo(3e-5, 15);
    expect(round.power).toHaveLength(round.grid.count);
    const best = round.power.indexOf(Math.max(...round.power));
    expect(best).toBe(Math.floor(spike / 3));
    expect(round.power[best]).toBe(0.93);
    // every bin is the highest of its three grid powers
    for (const b of [0, 1, 5000, round.grid.count - 1]) {
      expect(round.power[b]).toBe(Math.max(...power.subarray(3 * b, Math.min(count, 3 * b + 3))));
    }
  });

  it('answers 409 no_periodograms for a run that has not succeeded', async () => {
    const queued = (await startSearch({ revisionId, minPeriodDays: 6 })).body.data.searchRun.id;
    const res = await viewer.agent.get(`/api/search-runs/${queued}/periodograms`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_periodograms');
    expect((await viewer.agent.get('/api/search-runs/2147480000/periodograms')).status).toBe(404);
  });
});

describe('cancelling', () => {
  it('removes a queued run’s job and marks it cancelled; a second cancel is 409', async () => {
    const id = (await startSearch({ revisionId, minPeriodDays: 7 })).body.data.searchRun.id;
    expect(await t.queue.getJob(`search-run-${id}`)).toBeDefined();
    const res = await analyst.agent.post(`/api/search-runs/${id}/cancel`).set('x-csrf-token', analyst.csrf).send({});
    expect(res.status).toBe(200);
    expect(res.body.data).toMatchObject({ id, status: 'cancelled', progress: { stage: 'cancelled' }, result: null });
    expect(res.body.data.finishedAt).not.toBeNull();
    expect(await t.queue.getJob(`search-run-${id}`)).toBeUndefined();
    const again = await analyst.agent.post(`/api/search-runs/${id}/cancel`).set('x-csrf-token', analyst.csrf).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('conflict');
    expect((await analyst.agent.post('/api/search-runs/2147480000/cancel').set('x-csrf-token', analyst.csrf).send({})).status).toBe(404);
  });

  it('is refused to a viewer (403)', async () => {
    const id = (await startSearch({ revisionId, minPeriodDays: 8 })).body.data.searchRun.id;
    const res = await viewer.agent.post(`/api/search-runs/${id}/cancel`).set('x-csrf-token', viewer.csrf).send({});
    expect(res.status).toBe(403);
    expect((await t.knex('search_runs').where({ id }).first('status')).status).toBe('queued');
  });
});

describe('saving the resulting model as a revision', () => {
  it('creates a revision of the pulsar from the resulting model (parent: the searched revision) and remembers it on the run', async () => {
    const id = (await startSearch({ revisionId, minPeriodDays: 9 })).body.data.searchRun.id;
    const result = searchResult(true);
    await markSucceeded(id, result);
    const res = await saveRevision(id, { message: '  one companion from search  ' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const revision = res.body.data;
    expect(revision).toMatchObject({ pulsarId: pulsar.id, parentId: revisionId, message: 'one companion from search', author: { displayName: 'Test analyst' } });
    expect(revision.model).toEqual(result.resultingModel);
    const companions = revision.model.companions as { name: string; period_days: number }[];
    expect(companions.map((c) => c.name)).toEqual(['b', NEW_COMPANION.name]);
    expect(companions[1].period_days).toBe(61.5);

    const run = (await viewer.agent.get(`/api/search-runs/${id}`).expect(200)).body.data;
    expect(run.savedRevisionId).toBe(revision.id);
    const stored = (await viewer.agent.get(`/api/revisions/${revision.id}`).expect(200)).body.data;
    expect(stored.model).toEqual(result.resultingModel);

    const revisionsBefore = await countRows(t.knex, 'model_revisions');
    const twice = await saveRevision(id, { message: 'again' });
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toContain(`revision ${revision.id}`);
    expect(await countRows(t.knex, 'model_revisions')).toBe(revisionsBefore);
  });

  it('refuses a run that found nothing new, one that has not finished, and an unknown run — storing nothing', async () => {
    const nothing = (await startSearch({ revisionId, minPeriodDays: 10 })).body.data.searchRun.id;
    await markSucceeded(nothing, searchResult(false));
    const queued = (await startSearch({ revisionId, minPeriodDays: 11 })).body.data.searchRun.id;
    const revisionsBefore = await countRows(t.knex, 'model_revisions');

    const none = await saveRevision(nothing, { message: 'nothing' });
    expect(none.status).toBe(409);
    expect(none.body.error.message).toMatch(/found no new companion/);
    const notDone = await saveRevision(queued, { message: 'not yet' });
    expect(notDone.status).toBe(409);
    expect(notDone.body.error.message).toMatch(/has not finished \(status queued\)/);
    expect((await saveRevision(2147480000, { message: 'x' })).status).toBe(404);
    expect(await countRows(t.knex, 'model_revisions')).toBe(revisionsBefore);
    expect((await t.knex('search_runs').where({ id: nothing }).first('saved_revision_id')).saved_revision_id).toBeNull();
  });

  it.each([
    ['an empty message', { message: '   ' }],
    ['a message over 500 characters', { message: 'x'.repeat(501) }],
    ['no message', {}],
    ['an unknown field', { message: 'ok', parentId: 1 }],
  ])('refuses %s (400, nothing stored)', async (_what, body) => {
    const id = (await startSearch({ revisionId, minPeriodDays: 12, recompute: true })).body.data.searchRun.id;
    await markSucceeded(id, searchResult(true));
    const revisionsBefore = await countRows(t.knex, 'model_revisions');
    const res = await saveRevision(id, body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(await countRows(t.knex, 'model_revisions')).toBe(revisionsBefore);
  });

  it('is refused to a viewer (403)', async () => {
    const id = (await startSearch({ revisionId, minPeriodDays: 13 })).body.data.searchRun.id;
    await markSucceeded(id, searchResult(true));
    const res = await saveRevision(id, { message: 'viewer try' }, viewer);
    expect(res.status).toBe(403);
  });
});
