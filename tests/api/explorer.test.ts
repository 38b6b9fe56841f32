/**
 * GET /api/fit-runs/:id/explorer after a real fit run by the worker (BullMQ on
 * the real Redis, in this process), with two TOAs excluded through the API:
 * every TOA present, excluded ones evaluated; barycentric days, delays and
 * residuals equal to a direct engine computation on the uploaded file; partials
 * equal to numeric derivatives; the browser preview works on the table as sent;
 * runs without stored explorer columns answer 404 with a clear message.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ExplorerTable } from '../../api/contracts/explorer';
import type { ObservatoryJson } from '../../api/db/observatories';
import { startWorker } from '../../worker/index';
import { computeArrivalGeometry } from '../../worker/timing/pipeline/compute-arrival-geometry';
import { parseObservatory } from '../../worker/timing/earth/read-observatories';
import { parameterHandle } from '../../worker/timing/model/parameter-paths';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import type { TimingModel } from '../../worker/timing/model/timing-model';
import { preparePreview, previewResiduals } from '../../worker/timing/pipeline/companion-toggle-preview';
import { effectiveUncertaintiesS, prepareArrivals } from '../../worker/timing/pipeline/prepared-arrivals';
import { timingDelayReport } from '../../worker/timing/pipeline/timing-delay-report';
import { computeTimingResiduals, type TimingEvaluation } from '../../worker/timing/pipeline/timing-residuals';
import { ddAddNumber } from '../../worker/timing/time/double-double-typed';
import { readToaCsv } from '../../worker/timing/toas/read-toa-csv';
import type { Toa } from '../../worker/timing/toas/toa';
import { createTestObservatory, demoModelJson, offsetStartModel, simulatedCsv, storeCsv } from '../worker/fit-run-fixtures';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

const TOA_COUNT = 160;
const EXCLUDED_POSITIONS = [7, 120]; // by MJD
const ONE_NS_US = 1e-3;
const ONE_NS_DAYS = 1e-9 / 86_400;
/** Numeric-derivative steps (file units) of the parameters kept for previews only. */
const UNFITTED_STEPS: Record<string, number> = {
  'astrometry.pm_ra_cosdec_mas_per_yr': 1,
  'astrometry.pm_dec_mas_per_yr': 1,
  'astrometry.parallax_mas': 0.1,
  'dispersion.dm_pc_per_cm3': 1e-3,
};

let t: TestApp;
let worker: ReturnType<typeof startWorker>;
let analyst: Client;
let viewer: Client;
let observatory: ObservatoryJson;
let pulsar: { id: number; name: string };
let batchId: number;
let toaIdsByMjd: number[];
let fileToas: Toa[]; // the uploaded file read by the engine, in MJD order (= file order)
let runId: number;
let table: ExplorerTable;
let fitted: TimingModel;
let fitUncertainties: Record<string, number>; // 1σ per fitted parameter, file units

/** The fit's 1σ of a parameter, file units (a natural numeric-derivative step). */
function fittedUncertainty(parameter: string): number {
  const u = fitUncertainties[parameter];
  if (u === undefined || !(u > 0)) throw new Error(`no uncertainty for ${parameter}`);
  return u;
}

async function waitForRun(id: number, timeoutMs = 90_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await viewer.agent.get(`/api/fit-runs/${id}`).expect(200);
    if (['succeeded', 'failed', 'cancelled'].includes(res.body.data.status)) return res.body.data;
    if (Date.now() > deadline) throw new Error(`fit run ${id} still ${res.body.data.status}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The engine's own evaluation of `model` on the uploaded file (geometry from the same observatory). */
function engineEvaluation(model: TimingModel, options: { fixedPulseNumbers?: Float64Array } = {}): TimingEvaluation {
  const site = parseObservatory(observatory);
  const geometry = computeArrivalGeometry(fileToas, new Map([[site.code, site]]), {});
  return computeTimingResiduals(model, prepareArrivals(fileToas, geometry, model.epochMjd), { phaseOffsetTurns: table.phaseOffsetTurns, ...options });
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
  const truth = demoModelJson(pulsar.name);
  const csv = simulatedCsv(truth, observatory, TOA_COUNT, 11);
  batchId = await storeCsv(t.knex, pulsar.id, csv, a.id);
  const read = readToaCsv(csv, { knownObservatories: new Set([observatory.code]) });
  if (!read.ok) throw new Error('simulated file does not read back');
  fileToas = read.toas;
  const rows = await t.knex('toas').where({ pulsar_id: pulsar.id }).orderBy([{ column: 'mjd_day' }, { column: 'mjd_fraction' }, { column: 'id' }]).select('id', 'row_number');
  toaIdsByMjd = rows.map((r) => Number(r.id));
  expect(rows.map((r) => Number(r.row_number))).toEqual(fileToas.map((toa) => toa.row)); // simulated in MJD order

  const excluded = await analyst.agent
    .post(`/api/pulsars/${pulsar.id}/exclusions`)
    .set('x-csrf-token', analyst.csrf)
    .send({ toaIds: EXCLUDED_POSITIONS.map((k) => toaIdsByMjd[k]), reason: 'explorer test: left out on purpose' });
  expect(excluded.status, JSON.stringify(excluded.body)).toBeLessThan(300);

  const revision = await analyst.agent
    .post(`/api/pulsars/${pulsar.id}/revisions`)
    .set('x-csrf-token', analyst.csrf)
    .send({ model: offsetStartModel(truth, '218.8118472401'), message: 'start' });
  expect(revision.status, JSON.stringify(revision.body)).toBe(201);
  const queued = await analyst.agent.post(`/api/pulsars/${pulsar.id}/fit-runs`).set('x-csrf-token', analyst.csrf).send({ revisionId: revision.body.data.id });
  expect(queued.status, JSON.stringify(queued.body)).toBe(202);
  runId = queued.body.data.fitRun.id;
  const run = await waitForRun(runId);
  expect(run.status, run.errorMessage).toBe('succeeded');
  expect(run.excludedCount).toBe(EXCLUDED_POSITIONS.length);
  fitUncertainties = Object.fromEntries(Object.entries(run.result.parameters as Record<string, { uncertainty: number }>).map(([k, p]) => [k, p.uncertainty]));
  const res = await viewer.agent.get(`/api/fit-runs/${runId}/explorer`).expect(200);
  table = res.body.data as ExplorerTable;
  fitted = readModelFile(table.fittedModel);
}, 120_000);

afterAll(async () => {
  await worker.close();
  await t.close();
});

describe('the explorer table of a fit', () => {
  it('lists every TOA of the pulsar in MJD order with its upload row, the excluded ones flagged and evaluated', () => {
    expect(table.fitRunId).toBe(runId);
    expect(table.count).toBe(TOA_COUNT);
    expect(table.toaId).toEqual(toaIdsByMjd);
    expect(table.batchId.every((b) => b === batchId)).toBe(true);
    expect(table.batchRow).toEqual(fileToas.map((toa) => toa.row));
    expect(table.excluded.flatMap((x, i) => (x ? [i] : []))).toEqual(EXCLUDED_POSITIONS);
    expect(table.evaluated.every(Boolean)).toBe(true);
    for (const k of EXCLUDED_POSITIONS) expect(Number.isFinite(table.residualUs[k])).toBe(true);
    expect(table.observatory.every((o) => o === observatory.code)).toBe(true);
    expect(table.frequencyMhz.every((f) => f === 1400)).toBe(true);
    expect(table.settings.ephemeris).toBe('DE405');
    expect(table.referenceMjd.startsWith('58600')).toBe(true); // the model epoch
    expect(table.nearestPulse.every(Boolean)).toBe(true); // the simulated file has no pulse numbers
  });

  it('agrees with the run’s residual table for the fitted TOAs (< 1 ns)', async () => {
    const res = await viewer.agent.get(`/api/fit-runs/${runId}/residuals`).expect(200);
    const residuals = res.body.data as { toaId: number[]; residualUs: number[]; uncertaintyUs: number[]; mjd: string[] };
    const index = new Map(table.toaId.map((id, i) => [id, i]));
    expect(residuals.toaId).toHaveLength(TOA_COUNT - EXCLUDED_POSITIONS.length);
    residuals.toaId.forEach((id, j) => {
      const i = index.get(id)!;
      expect(table.excluded[i]).toBe(false);
      expect(Math.abs((table.residualUs[i] as number) - residuals.residualUs[j])).toBeLessThan(ONE_NS_US);
      expect(table.uncertaintyUs[i]).toBe(residuals.uncertaintyUs[j]);
      expect(table.mjd[i]).toBe(residuals.mjd[j]);
    });
  });

  it('has barycentric days, residuals (excluded TOAs too) and delays equal to a direct engine computation on the file', () => {
    const ev = engineEvaluation(fitted);
    let worstDays = 0;
    let worstResidualUs = 0;
    for (let i = 0; i < TOA_COUNT; i += 1) {
      const d = (table.barycentricDaysHi[i] - ev.barycentricDays.hi[i]) + (table.barycentricDaysLo[i] - ev.barycentricDays.lo[i]);
      worstDays = Math.max(worstDays, Math.abs(d));
      worstResidualUs = Math.max(worstResidualUs, Math.abs((table.residualUs[i] as number) - ev.residualS[i] * 1e6));
    }
    // the fitted model is read back from its file text: its rounding moves times by far less than 1 ns
    expect(worstDays).toBeLessThan(ONE_NS_DAYS);
    expect(worstResidualUs).toBeLessThan(ONE_NS_US);
    const site = parseObservatory(observatory);
    const report = timingDelayReport(fitted, fileToas, computeArrivalGeometry(fileToas, new Map([[site.code, site]]), {}));
    const pairs: [keyof ExplorerTable['delays'], keyof (typeof report)[number]][] = [
      ['clockS', 'clock_s'], ['ttMinusUtcS', 'tt_minus_utc_s'], ['tdbMinusTtS', 'tdb_minus_tt_s'], ['roemerS', 'roemer_s'],
      ['shapiroS', 'shapiro_s'], ['dispersionS', 'dispersion_s'], ['companionsS', 'companions_s'], ['backendOffsetS', 'backend_offset_s'],
    ];
    for (const [ours, theirs] of pairs) {
      const worst = Math.max(...report.map((row, i) => Math.abs(table.delays[ours][i] - (row[theirs] as number))));
      expect(worst, ours).toBeLessThan(1e-9);
    }
    expect(Math.max(...table.delays.companionsS.map(Math.abs))).toBeGreaterThan(1); // the 2.21 lt-s companion is in there
  });

  it('has partial derivatives (file units) equal to numeric derivatives of the engine’s residuals', () => {
    const run = fitted.solveFor;
    expect(table.partials.filter((p) => p.fitted).map((p) => p.parameter)).toEqual(run);
    expect(table.partials.map((p) => p.parameter)).toContain('astrometry.parallax_mas'); // kept for previews, not fitted
    const base = engineEvaluation(fitted);
    const pulses = Float64Array.from(base.pulseNumber);
    for (const partial of table.partials) {
      const handle = parameterHandle(fitted, partial.parameter);
      const perFileUnit = handle.toFileUncertainty(1);
      const stepFile = partial.fitted ? 3 * fittedUncertainty(partial.parameter) : UNFITTED_STEPS[partial.parameter];
      expect(stepFile, partial.parameter).toBeGreaterThan(0);
      const shifted = (sign: number) => {
        const m = structuredClone(fitted);
        handle.set(m, ddAddNumber(handle.get(fitted), (sign * stepFile) / perFileUnit));
        return engineEvaluation(m, { fixedPulseNumbers: pulses }).residualS;
      };
      const plus = shifted(1);
      const minus = shifted(-1);
      const numeric = Array.from(plus, (p, i) => (p - minus[i]) / (2 * stepFile));
      const scale = Math.max(...numeric.map(Math.abs));
      expect(scale, partial.parameter).toBeGreaterThan(0);
      const worst = Math.max(...numeric.map((x, i) => Math.abs(x - partial.secondsPerUnit[i])));
      expect(worst / scale, `${partial.parameter} (${partial.fileUnit})`).toBeLessThan(1e-3);
    }
  });

  it('feeds the browser preview as sent: switching the companion off equals a full re-evaluation (< 1 ns)', () => {
    const prepared = preparePreview(table, fitted);
    const edited = structuredClone(fitted);
    edited.companions[0].enabled = false;
    const preview = previewResiduals(prepared, edited);
    const full = engineEvaluation(edited).residualS;
    const site = parseObservatory(observatory);
    const sigmas = effectiveUncertaintiesS(prepareArrivals(fileToas, computeArrivalGeometry(fileToas, new Map([[site.code, site]]), {}), fitted.epochMjd), fitted.noise);
    let sw = 0;
    let swr = 0;
    sigmas.forEach((s, i) => {
      if (table.excluded[i]) return;
      sw += 1 / (s * s);
      swr += full[i] / (s * s);
    });
    const worst = Math.max(...Array.from(full, (r, i) => Math.abs((r - swr / sw) * 1e6 - preview.residualUs[i])));
    expect(worst).toBeLessThan(ONE_NS_US);
    expect(preview.weightedRmsUs).toBeGreaterThan(100 * (table.weightedRmsUs ?? 0));
  });
});

describe('refusals', () => {
  it('answers 404 with a re-run message for a run fitted before explorer columns were stored', async () => {
    const row = await t.knex('fit_explorer_columns').where({ fit_run_id: runId }).first();
    await t.knex('fit_explorer_columns').where({ fit_run_id: runId }).del();
    try {
      const res = await viewer.agent.get(`/api/fit-runs/${runId}/explorer`).expect(404);
      expect(res.body.error.code).toBe('explorer_not_stored');
      expect(res.body.error.message).toMatch(/re-run the fit/);
    } finally {
      await t.knex('fit_explorer_columns').insert(row);
    }
  });

  it('answers 404 for an unknown run and 400 for a bad id', async () => {
    const res = await viewer.agent.get('/api/fit-runs/2147480000/explorer').expect(404);
    expect(res.body.error.code).toBe('not_found');
    await viewer.agent.get('/api/fit-runs/one/explorer').expect(400);
  });

  it('answers 409 for a run that has not succeeded', async () => {
    const [id] = await t.knex('fit_runs').insert({
      pulsar_id: pulsar.id, revision_id: table.revisionId, inputs_hash: '0'.repeat(64), settings: JSON.stringify(table.settings), status: 'failed', stage: 'failed', error_message: 'test',
    });
    const res = await viewer.agent.get(`/api/fit-runs/${id}/explorer`).expect(409);
    expect(res.body.error.message).toMatch(/status failed/);
  });
});
