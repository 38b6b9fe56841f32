/**
 * Fit comparisons through the API, on fit runs stored with known statistics:
 * AIC, BIC, the F-test and parameter differences checked against hand
 * formulas; the comparability warnings (TOA sets, settings, weights, fixed
 * values); bad input (nothing stored); saving, listing and reading back a
 * saved comparison; who may do what; the audit row of a save.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FitComparison } from '../../api/contracts/comparisons';
import { FIT_ENGINE_SETTINGS } from '../../api/contracts/fit-runs';
import { compareParameters } from '../../api/services/comparisons/compare-parameters';
import { modelWith, seedFitRun, seedRevision, toaIdRange } from './comparisons-fixtures';
import { signedInClient, type Client } from './helpers/agents';
import { countRows, createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

const N = 40; // TOAs of every run unless said otherwise
const SPIN_ONLY = ['spin.frequency_hz', 'spin.frequency_derivatives[0]'];
const WITH_POSITION = [...SPIN_ONLY, 'astrometry.ra_hms', 'astrometry.dec_dms'];
const F0_A = '218.81184724012345';
const F0_B = '218.81184724012845'; // F0_A + 5e-12 Hz
const CHI2_A = 61.5;
const CHI2_B = 40.2;

let t: TestApp;
let viewer: Client;
let analyst: Client;
let lead: Client;
let leadId: number;
let pulsar: { id: number; name: string };
let other: { id: number; name: string };
const run: Record<string, number> = {};
let revisionA: number;

const sigmasA = { 'spin.frequency_hz': 2e-12, 'spin.frequency_derivatives[0]': 1e-19 };
const sigmasB = { 'spin.frequency_hz': 3e-12, 'spin.frequency_derivatives[0]': 2e-19, 'astrometry.ra_hms': 2e-5, 'astrometry.dec_dms': 1e-4 };

beforeAll(async () => {
  t = buildTestApp();
  const v = await createUser(t.knex, 'viewer');
  const a = await createUser(t.knex, 'analyst');
  const l = await createUser(t.knex, 'lead');
  leadId = l.id;
  viewer = await signedInClient(t.app, v.email, v.password);
  analyst = await signedInClient(t.app, a.email, a.password);
  lead = await signedInClient(t.app, l.email, l.password);
  pulsar = await createPulsarRow(t.knex);
  other = await createPulsarRow(t.knex);

  const modelA = modelWith(pulsar.name, SPIN_ONLY, { spin: { frequency_hz: F0_A } });
  const modelB = modelWith(pulsar.name, WITH_POSITION, {
    spin: { frequency_hz: F0_B },
    astrometry: { ra_hms: '14:37:52.118404', dec_dms: '-21:05:43.51852' }, // +1e-4 s of time, +3e-4″ (towards the equator)
  });
  const modelPmMoved = modelWith(pulsar.name, WITH_POSITION, { spin: { frequency_hz: F0_B }, astrometry: { pm_ra_cosdec_mas_per_yr: -2 } });
  revisionA = await seedRevision(t.knex, pulsar.id, a.id, modelA, 'spin only');
  const revisionB = await seedRevision(t.knex, pulsar.id, a.id, modelB, 'with position');
  const revisionPm = await seedRevision(t.knex, pulsar.id, a.id, modelPmMoved, 'other proper motion');
  const base = { pulsarId: pulsar.id, toaIds: toaIdRange(N) };
  run.A = await seedFitRun(t.knex, { ...base, revisionId: revisionA, fittedModel: modelA, uncertainties: sigmasA, chi2: CHI2_A });
  run.B = await seedFitRun(t.knex, { ...base, revisionId: revisionB, fittedModel: modelB, uncertainties: sigmasB, chi2: CHI2_B });
  run.otherToas = await seedFitRun(t.knex, {
    ...base,
    toaIds: [...toaIdRange(N - 2), 5000],
    revisionId: revisionA,
    fittedModel: modelA,
    uncertainties: sigmasA,
    chi2: 58,
    excludedCount: 2,
  });
  run.otherEphemeris = await seedFitRun(t.knex, {
    ...base,
    revisionId: revisionB,
    fittedModel: modelB,
    uncertainties: sigmasB,
    chi2: CHI2_B,
    settings: { ...FIT_ENGINE_SETTINGS, ephemeris: 'DE440' },
  });
  run.reweighted = await seedFitRun(t.knex, {
    ...base,
    revisionId: revisionB,
    fittedModel: modelB,
    uncertainties: sigmasB,
    chi2: 39,
    uncertaintyUs: toaIdRange(N).map((_, i) => (i < 3 ? 2.5 : 1.5)),
  });
  run.pmMoved = await seedFitRun(t.knex, { ...base, revisionId: revisionPm, fittedModel: modelPmMoved, uncertainties: sigmasB, chi2: 41 });
  run.unconverged = await seedFitRun(t.knex, {
    ...base,
    revisionId: revisionA,
    fittedModel: modelA,
    uncertainties: sigmasA,
    chi2: 70,
    converged: false,
    warnings: ['did not converge in 3 iterations (last χ² 70)'],
  });
  run.queued = await seedFitRun(t.knex, { ...base, revisionId: revisionA, fittedModel: modelA, uncertainties: sigmasA, chi2: 0, status: 'queued' });
  run.failed = await seedFitRun(t.knex, { ...base, revisionId: revisionA, fittedModel: modelA, uncertainties: sigmasA, chi2: 0, status: 'failed' });
  const revisionOther = await seedRevision(t.knex, other.id, a.id, modelWith(other.name, SPIN_ONLY), 'other pulsar');
  run.otherPulsar = await seedFitRun(t.knex, {
    pulsarId: other.id,
    toaIds: toaIdRange(N),
    revisionId: revisionOther,
    fittedModel: modelWith(other.name, SPIN_ONLY),
    uncertainties: sigmasA,
    chi2: CHI2_A,
  });

  const released = await lead.agent.post(`/api/revisions/${revisionA}/release`).set('x-csrf-token', lead.csrf).send({ note: 'baseline' });
  expect(released.status, JSON.stringify(released.body)).toBe(200);
});
afterAll(() => t.close());

async function compare(ids: number[], client: Client = viewer, pulsarId = pulsar.id) {
  return client.agent.get(`/api/pulsars/${pulsarId}/fit-comparison?runs=${ids.join(',')}`);
}

async function comparison(ids: number[]): Promise<FitComparison> {
  const res = await compare(ids);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.data as FitComparison;
}

const codes = (c: FitComparison) => c.warnings.map((w) => w.code).sort();

describe('statistics of two nested runs on the same TOAs', () => {
  it('gives χ², dof, free parameters, AIC and BIC per run (hand formulas)', async () => {
    const c = await comparison([run.A, run.B]);
    const [a, b] = c.runs;
    expect(a).toMatchObject({ fitRunId: run.A, toaCount: N, chi2: CHI2_A, dof: N - 3, converged: true });
    expect(b).toMatchObject({ fitRunId: run.B, toaCount: N, chi2: CHI2_B, dof: N - 5 });
    expect(a.reducedChi2).toBeCloseTo(CHI2_A / (N - 3), 12);
    expect(a.freeParameters).toEqual({ count: 3, paths: [...SPIN_ONLY, 'phase_offset_turns'] });
    expect(b.freeParameters.count).toBe(5);
    // AIC = χ² + 2k (Akaike 1974); BIC = χ² + k ln N (Schwarz 1978)
    expect(a.aic).toBeCloseTo(CHI2_A + 2 * 3, 12);
    expect(b.aic).toBeCloseTo(CHI2_B + 2 * 5, 12);
    expect(a.bic).toBeCloseTo(CHI2_A + 3 * Math.log(N), 12);
    expect(b.bic).toBeCloseTo(CHI2_B + 5 * Math.log(N), 12);
    expect(a.settings).toEqual(FIT_ENGINE_SETTINGS);
    expect(c).toMatchObject({ pulsarId: pulsar.id, sameSettings: true, sameToas: true, statisticsComparable: true, differingSettings: [], warnings: [] });
    expect(c.references.join(' ')).toContain('Bevington & Robinson');
    expect(c.references.join(' ')).toContain('3rd ed. 2003');
  });

  it('names each run’s revision with its number, message and released flag', async () => {
    const c = await comparison([run.A, run.B]);
    expect(c.runs[0].revision).toMatchObject({ id: revisionA, number: 1, message: 'spin only', released: true });
    expect(c.runs[0].revision.releasedAt).toEqual(expect.any(String));
    expect(c.runs[1].revision).toMatchObject({ number: 2, message: 'with position', released: false, releasedAt: null });
  });

  it('gives the F-test of the nested pair, whichever run is the reference', async () => {
    const nu = N - 5;
    const f = ((CHI2_A - CHI2_B) / 2) / (CHI2_B / nu); // F = (Δχ²/Δk) / (χ²_larger/ν) (Bevington & Robinson 2003, §11.4)
    const p = (1 + (2 * f) / nu) ** (-nu / 2); // P(F > f) for F(2, ν) in closed form (from memory: the F density with d1 = 2 integrates exactly)
    for (const ids of [
      [run.A, run.B],
      [run.B, run.A],
    ]) {
      const c = await comparison(ids);
      expect(c.nestedTests).toHaveLength(1);
      const test = c.nestedTests[0];
      expect(test).toMatchObject({ smallerFitRunId: run.A, largerFitRunId: run.B, addedParameters: 2, dof: nu });
      expect(test.statistic).toBeCloseTo(f, 10);
      expect(test.probability / p).toBeCloseTo(1, 8);
    }
  });

  it('tables the union of free parameters with differences in combined σ against the reference', async () => {
    const c = await comparison([run.A, run.B]);
    expect(c.parameters.map((p) => p.path)).toEqual(WITH_POSITION);
    const [f0, f1, ra, dec] = c.parameters;
    expect(f0.unit).toBe('Hz');
    expect(f0.values[0]).toMatchObject({ value: F0_A, uncertainty: 2e-12, free: true, difference: null, differenceSigma: null });
    expect(f0.values[1]).toMatchObject({ value: F0_B, uncertainty: 3e-12, free: true });
    // Δ / √(σ1² + σ2²): 5e-12 Hz over √(4 + 9)·1e-12 Hz
    expect(f0.values[1]!.difference! / 5e-12).toBeCloseTo(1, 9);
    expect(f0.values[1]!.differenceSigma!).toBeCloseTo(5 / Math.sqrt(13), 8);
    expect(f1.values[1]).toMatchObject({ difference: 0, differenceSigma: 0 });
    // RA held fixed in A (σ = 0): 1e-4 s of time over 2e-5 s
    expect(ra.unit).toBe('s (of time)');
    expect(ra.values[0]).toMatchObject({ free: false, uncertainty: null });
    expect(ra.values[1]!.difference! / 1e-4).toBeCloseTo(1, 6);
    expect(ra.values[1]!.differenceSigma!).toBeCloseTo(5, 5);
    expect(dec.unit).toBe('arcsec');
    expect(dec.values[1]!.difference! / 3e-4).toBeCloseTo(1, 6);
    expect(dec.values[1]!.differenceSigma!).toBeCloseTo(3, 5);
  });

  it('folds right-ascension differences across 0 h', () => {
    const results = ['23:59:59.99', '00:00:00.01'].map((raHms) => {
      const model = modelWith('PKD-0001 (invented)', ['astrometry.ra_hms'], { astrometry: { ra_hms: raHms } });
      return {
        parameters: { 'astrometry.ra_hms': { value: raHms, uncertainty: 0.01, unit: 's (of time)', startValue: raHms, changeSigma: 0 } },
        chi2: 1, dof: 1, reducedChi2: 1, weightedRmsUs: 1, iterations: 1, converged: true, warnings: [],
        phaseOffsetTurns: 0, conditionNumber: 1, engineSettings: {}, fittedModel: model,
      };
    });
    const [ra] = compareParameters(results);
    expect(ra.values[1]!.difference! / 0.02).toBeCloseTo(1, 6); // 2 × 0.01 s across midnight, not −86 399.98 s
  });
});

describe('runs that are not comparable', () => {
  it('warns when the TOA sets differ and gives no F-test', async () => {
    const c = await comparison([run.A, run.otherToas]);
    expect(c).toMatchObject({ sameToas: false, sameSettings: true, statisticsComparable: false, nestedTests: [] });
    const warning = c.warnings.find((w) => w.code === 'toas-differ')!;
    expect(warning.fitRunIds).toEqual([run.A, run.otherToas]);
    expect(warning.message).toContain('1 TOAs not in');
    expect(warning.message).toContain('2 of');
    expect(warning.message).toContain('not comparable');
    expect(c.runs[1]).toMatchObject({ toaCount: N - 1, excludedCount: 2 });
  });

  it('warns when the engine settings differ, naming the setting and both values', async () => {
    const c = await comparison([run.A, run.otherEphemeris]);
    expect(c).toMatchObject({ sameSettings: false, sameToas: true, statisticsComparable: false, differingSettings: ['ephemeris'], nestedTests: [] });
    const warning = c.warnings.find((w) => w.code === 'settings-differ')!;
    expect(warning.message).toContain('DE405');
    expect(warning.message).toContain('DE440');
  });

  it('warns when the same TOAs carry different effective uncertainties', async () => {
    const c = await comparison([run.B, run.reweighted]);
    expect(c).toMatchObject({ sameToas: true, statisticsComparable: false, nestedTests: [] });
    expect(codes(c)).toEqual(['weights-differ']);
    expect(c.warnings[0].message).toContain('3 TOAs');
  });

  it('gives no F-test when a shared fixed parameter differs, and says why', async () => {
    const c = await comparison([run.A, run.pmMoved]);
    expect(c.statisticsComparable).toBe(true);
    expect(c.nestedTests).toEqual([]);
    const warning = c.warnings.find((w) => w.code === 'not-nested')!;
    expect(warning.message).toContain('astrometry.pm_ra_cosdec_mas_per_yr');
  });

  it('flags a run that did not converge', async () => {
    const c = await comparison([run.A, run.unconverged]);
    expect(codes(c)).toEqual(['fit-warnings', 'not-converged']);
    expect(c.runs[1]).toMatchObject({ converged: false, warnings: ['did not converge in 3 iterations (last χ² 70)'] });
  });

  it('compares four runs: every nested pair gets its test', async () => {
    const c = await comparison([run.B, run.A, run.unconverged, run.pmMoved]);
    expect(c.runs.map((r) => r.fitRunId)).toEqual([run.B, run.A, run.unconverged, run.pmMoved]);
    const pairs = c.nestedTests.map((x) => [x.smallerFitRunId, x.largerFitRunId]);
    expect(pairs.sort()).toEqual([
      [run.A, run.B],
      [run.unconverged, run.B],
    ].sort());
    expect(c.parameters[0].values.every((v) => v !== null)).toBe(true);
  });
});

describe('bad input', () => {
  const cases: [string, () => number[], () => string][] = [
    ['one run', () => [run.A], () => 'choose 2 to 4 fit runs'],
    ['five runs', () => [run.A, run.B, run.otherToas, run.reweighted, run.pmMoved], () => 'choose 2 to 4 fit runs'],
    ['the same run twice', () => [run.A, run.A], () => 'twice'],
    ['a run of another pulsar', () => [run.A, run.otherPulsar], () => `fit run ${run.otherPulsar} is not a fit run of this pulsar`],
    ['an unknown run', () => [run.A, 2147480000], () => 'not a fit run of this pulsar'],
    ['a queued run', () => [run.A, run.queued], () => `fit run ${run.queued} is still queued: only succeeded fit runs`],
    ['a failed run', () => [run.A, run.failed], () => `fit run ${run.failed} failed: only succeeded fit runs`],
  ];

  it.each(cases)('computing with %s → 400 naming the problem', async (_name, ids, message) => {
    const res = await compare(ids());
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details[0].path).toEqual(['query', 'runs']);
    expect(res.body.error.message).toContain(message());
  });

  it.each(cases)('saving with %s → 400 and nothing stored', async (_name, ids, message) => {
    const before = [await countRows(t.knex, 'fit_comparisons'), await countRows(t.knex, 'audit_log')];
    const res = await lead.agent.post(`/api/pulsars/${pulsar.id}/comparisons`).set('x-csrf-token', lead.csrf).send({ fitRunIds: ids(), comment: 'x' });
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.details[0].path).toEqual(['fitRunIds']);
    expect(res.body.error.message).toContain(message());
    expect([await countRows(t.knex, 'fit_comparisons'), await countRows(t.knex, 'audit_log')]).toEqual(before);
  });

  it('refuses runs given in another form, an unknown pulsar, an empty comment', async () => {
    const text = await viewer.agent.get(`/api/pulsars/${pulsar.id}/fit-comparison?runs=a,b`);
    expect(text.status).toBe(400);
    const missing = await viewer.agent.get(`/api/pulsars/${pulsar.id}/fit-comparison`);
    expect([missing.status, missing.body.error.details[0].path]).toEqual([400, ['query', 'runs']]);
    const unknown = await compare([run.A, run.B], viewer, 2147480000);
    expect(unknown.status).toBe(404);
    const empty = await lead.agent.post(`/api/pulsars/${pulsar.id}/comparisons`).set('x-csrf-token', lead.csrf).send({ fitRunIds: [run.A, run.B], comment: '  ' });
    expect([empty.status, empty.body.error.details[0].path]).toEqual([400, ['comment']]);
    await viewer.agent.get(`/api/pulsars/2147480000/comparisons`).expect(404);
    await viewer.agent.get(`/api/comparisons/2147480000`).expect(404);
  });
});

describe('saved comparisons', () => {
  it('are saved by a lead with a comment, audit-logged, listed and read back with the comparison', async () => {
    const res = await lead.agent
      .post(`/api/pulsars/${pulsar.id}/comparisons`)
      .set('x-csrf-token', lead.csrf)
      .send({ fitRunIds: [run.B, run.A], comment: ' position fit wins ' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const saved = res.body.data;
    expect(saved).toMatchObject({ pulsarId: pulsar.id, fitRunIds: [run.B, run.A], comment: 'position fit wins', createdBy: { id: leadId, displayName: 'Test lead' } });
    expect(saved.comparison.runs.map((r: { fitRunId: number }) => r.fitRunId)).toEqual([run.B, run.A]);

    const audit = await t.knex('audit_log').where({ pulsar_id: pulsar.id, action: 'comparison.save', user_id: leadId });
    expect(audit).toHaveLength(1);
    const details = typeof audit[0].details === 'string' ? JSON.parse(audit[0].details) : audit[0].details;
    expect(details).toEqual({ comparisonId: saved.id, fitRunIds: [run.B, run.A], comment: 'position fit wins' });

    const list = await viewer.agent.get(`/api/pulsars/${pulsar.id}/comparisons`).expect(200);
    expect(list.body.data[0]).toEqual({ id: saved.id, pulsarId: pulsar.id, fitRunIds: [run.B, run.A], comment: 'position fit wins', createdBy: saved.createdBy, createdAt: saved.createdAt });
    expect(list.body.data[0]).not.toHaveProperty('comparison');

    const read = await viewer.agent.get(`/api/comparisons/${saved.id}`).expect(200);
    expect(read.body.data).toEqual(saved);
    expect(read.body.data.comparison).toEqual((await compare([run.B, run.A])).body.data);
  });

  it('cannot be saved by an analyst or a viewer (403, nothing stored); viewers may compute and read', async () => {
    const before = await countRows(t.knex, 'fit_comparisons');
    for (const client of [analyst, viewer]) {
      const res = await client.agent.post(`/api/pulsars/${pulsar.id}/comparisons`).set('x-csrf-token', client.csrf).send({ fitRunIds: [run.A, run.B], comment: 'mine' });
      expect(res.status).toBe(403);
    }
    expect(await countRows(t.knex, 'fit_comparisons')).toBe(before);
    expect((await compare([run.A, run.B], viewer)).status).toBe(200);
    expect((await compare([run.A, run.B], analyst)).status).toBe(200);
  });
});
