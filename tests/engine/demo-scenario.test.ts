/**
 * The invented demo scenario (api/db/demo-scenario/): the simulated TOAs are
 * consistent with the true models, and each starting model shows the problem
 * it was built to show, which the intended fit removes.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { buildDemoScenario, type DemoPulsarData } from '../../api/db/demo-scenario/build-demo-scenario';
import { DEMO_BACKEND_OFFSET_S, DEMO_PULSAR_PLANS, HIDDEN_COMPANIONS } from '../../api/db/demo-scenario/demo-pulsars';
import { fitTimingModel } from '../../worker/timing/pipeline/fit-timing-model';
import type { TimingFitResult } from '../../worker/timing/pipeline/fit-prepared-arrivals';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { readToaCsv } from '../../worker/timing/toas/read-toa-csv';
import type { Toa } from '../../worker/timing/toas/toa';
import { builtinObservatories } from '../../worker/timing/earth/builtin-observatories';
import { solveWeightedLeastSquares } from '../../worker/timing/fit/weighted-least-squares';
import { mjdToApproxNumber } from '../../worker/timing/time/mjd-arithmetic';
import { parseHms, parseDms } from '../../worker/timing/model/sexagesimal';

const observatories = new Map(builtinObservatories().map((o) => [o.code, o]));
const known = new Set(observatories.keys());
const OFFSET_PATH = 'offsets[narrowband-2].seconds';
const YEAR_DAYS = 365.25; // Julian year (IAU definition)

let scenario: DemoPulsarData[];
const toasOf = new Map<string, Toa[]>();

function readBatches(p: DemoPulsarData): Toa[] {
  return p.batches.flatMap((b) => {
    const read = readToaCsv(b.csv, { knownObservatories: known });
    if (!read.ok) throw new Error(`${b.fileName}: ${JSON.stringify(read.errors.slice(0, 3))}`);
    return read.toas;
  });
}

function pulsar(index: number): { data: DemoPulsarData; toas: Toa[] } {
  const data = scenario[index];
  return { data, toas: toasOf.get(data.name)! };
}

/** Fits `modelJson` with its solve_for replaced (and, optionally, extra keys merged in). */
function fitWith(modelJson: Record<string, unknown>, toas: Toa[], solveFor: string[], extra: Record<string, unknown> = {}): TimingFitResult {
  return fitTimingModel(readModelFile({ ...modelJson, ...extra, solve_for: solveFor }), toas, observatories);
}

function solveForOf(modelJson: Record<string, unknown>): string[] {
  return [...(modelJson.solve_for as string[])];
}

/**
 * Weighted RMS (µs) of what is left of the residuals after removing a mean, a slope and
 * a sine and cosine at each given period (ordinary linear least squares).
 */
function rmsAfterRemovingPeriodsUs(fit: TimingFitResult, toas: Toa[], periodsDays: number[]): number {
  const n = toas.length;
  const tDays = toas.map((t) => mjdToApproxNumber(t.mjd) - 59750); // centred near the span's middle
  const columns: ((t: number) => number)[] = [() => 1, (t) => t / 1000];
  for (const period of periodsDays) {
    columns.push((t) => Math.sin((2 * Math.PI * t) / period), (t) => Math.cos((2 * Math.PI * t) / period));
  }
  const p = columns.length;
  const design = new Float64Array(n * p);
  columns.forEach((f, j) => tDays.forEach((t, i) => { design[j * n + i] = f(t); }));
  const rhs = Float64Array.from(fit.residuals, (r) => r.residualUs);
  const sigmas = Float64Array.from(fit.residuals, (r) => r.uncertaintyUs);
  const solution = solveWeightedLeastSquares(design, n, p, rhs, sigmas);
  const weightSum = sigmas.reduce((s, x) => s + 1 / x ** 2, 0);
  return Math.sqrt(solution.chi2 / weightSum); // weighted RMS = sqrt(Σ w r² / Σ w)
}

function expectWhite(fit: TimingFitResult, label: string): void {
  expect(fit.converged, `${label}: converged`).toBe(true);
  expect(fit.reducedChi2, `${label}: reduced χ²`).toBeGreaterThan(0.7);
  expect(fit.reducedChi2, `${label}: reduced χ²`).toBeLessThan(1.3);
}

function expectWithinSigma(fit: TimingFitResult, path: string, trueValue: number, sigmas: number): void {
  const p = fit.parameters[path];
  const value = Number(p.value);
  expect(Math.abs(value - trueValue), `${path}: ${value} ± ${p.uncertainty} vs true ${trueValue}`).toBeLessThan(sigmas * p.uncertainty);
}

beforeAll(() => {
  scenario = buildDemoScenario();
  for (const p of scenario) toasOf.set(p.name, readBatches(p));
});

describe('demo scenario: the simulated data', () => {
  it('has four pulsars with 300–800 TOAs each over two fictional observatories, two backends and 700–3000 MHz', () => {
    expect(scenario.map((p) => p.name)).toEqual(DEMO_PULSAR_PLANS.map((p) => p.name));
    expect(scenario.length).toBeGreaterThanOrEqual(4);
    for (const p of scenario) {
      const toas = toasOf.get(p.name)!;
      expect(toas.length).toBeGreaterThanOrEqual(300);
      expect(toas.length).toBeLessThanOrEqual(800);
      expect(p.batches.reduce((s, b) => s + b.rowCount, 0)).toBe(toas.length);
      expect(new Set(toas.map((t) => t.observatory))).toEqual(new Set(['harrow-ridge', 'cardenal-plateau']));
      expect(new Set(toas.map((t) => t.backend))).toEqual(new Set(['wideband-1', 'narrowband-2']));
      const freqs = toas.map((t) => t.frequencyMhz);
      expect(Math.min(...freqs)).toBeGreaterThanOrEqual(700);
      expect(Math.max(...freqs)).toBeLessThanOrEqual(3000);
      expect(Math.max(...freqs) / Math.min(...freqs)).toBeGreaterThan(3);
      const mjds = toas.map((t) => mjdToApproxNumber(t.mjd));
      expect(Math.max(...mjds) - Math.min(...mjds)).toBeGreaterThan(5 * YEAR_DAYS);
      expect(p.trueModel).not.toEqual(p.startingModel);
    }
  });

  it('is deterministic: a second build gives the same bytes', () => {
    const again = buildDemoScenario();
    expect(again.map((p) => p.batches.map((b) => b.csv))).toEqual(scenario.map((p) => p.batches.map((b) => b.csv)));
  });

  it.each(DEMO_PULSAR_PLANS.map((p, i) => [p.name, i] as const))('%s: the STARTING model is still phase-connected (|residual| < 0.3 turn)', (_name, i) => {
    const { data, toas } = pulsar(i);
    const periodUs = 1e6 / Number((data.startingModel.spin as { frequency_hz: string }).frequency_hz);
    const unfitted = fitWith(data.startingModel, toas, []);
    const worstUs = Math.max(...unfitted.residuals.map((r) => Math.abs(r.residualUs)));
    expect(worstUs).toBeLessThan(0.3 * periodUs); // nearest-pulse numbering is right (docs/timing.md §6)
    expect(worstUs).toBeGreaterThan(10 * Math.min(...unfitted.residuals.map((r) => r.uncertaintyUs))); // but visibly imperfect
  });

  it.each(DEMO_PULSAR_PLANS.map((p, i) => [p.name, i] as const))('%s: the TRUE model fits its TOAs with reduced χ² ≈ 1', (_name, i) => {
    const { data, toas } = pulsar(i);
    expectWhite(fitWith(data.trueModel, toas, []), 'true model');
  });
});

describe('demo scenario: each starting model shows its problem', () => {
  it('young pulsar: a quadratic trend until the spin-down rate is fitted, then white residuals', () => {
    const { data, toas } = pulsar(0);
    const start = fitWith(data.startingModel, toas, solveForOf(data.startingModel));
    const medianSigmaUs = [...start.residuals.map((r) => r.uncertaintyUs)].sort((a, b) => a - b)[Math.floor(toas.length / 2)];
    expect(start.weightedRmsUs).toBeGreaterThan(5 * medianSigmaUs);
    // the trend is quadratic: removing a mean and slope leaves it, a parabola in time takes it away
    const tDays = toas.map((t) => mjdToApproxNumber(t.mjd) - 59750);
    const n = toas.length;
    const design = new Float64Array(n * 3);
    tDays.forEach((t, i) => { design[i] = 1; design[n + i] = t / 1000; design[2 * n + i] = (t / 1000) ** 2; });
    const quadratic = solveWeightedLeastSquares(design, n, 3, Float64Array.from(start.residuals, (r) => r.residualUs), Float64Array.from(start.residuals, (r) => r.uncertaintyUs));
    expect(quadratic.chi2 / (n - 3)).toBeLessThan(1.3);
    const fitted = fitWith(data.startingModel, toas, [...solveForOf(data.startingModel), 'spin.frequency_derivatives[0]']);
    expectWhite(fitted, 'with the spin-down rate');
    const trueF1 = Number((data.trueModel.spin as { frequency_derivatives: string[] }).frequency_derivatives[0]);
    expectWithinSigma(fitted, 'spin.frequency_derivatives[0]', trueF1, 3);
  });

  it('eccentric binary: orbital residuals of hundreds of µs, removed by fitting the orbit and the backend offset', () => {
    const { data, toas } = pulsar(1);
    const unfitted = fitWith(data.startingModel, toas, []);
    expect(unfitted.weightedRmsUs).toBeGreaterThan(50);
    const fitted = fitWith(data.startingModel, toas, [...solveForOf(data.startingModel), OFFSET_PATH]);
    expectWhite(fitted, 'orbit fitted');
    const trueOrbit = (data.trueModel.companions as Record<string, unknown>[])[0];
    for (const key of ['period_days', 'projected_semimajor_axis_lt_s', 'eccentricity', 'periastron_longitude_deg', 'periastron_epoch_mjd']) {
      expectWithinSigma(fitted, `companions[b].${key}`, Number(trueOrbit[key]), 3);
    }
    expectWithinSigma(fitted, OFFSET_PATH, DEMO_BACKEND_OFFSET_S, 3);
  });

  it('hidden companions: tens of µs left after spin and astrometry, carried by the two periods', () => {
    const { data, toas } = pulsar(2);
    const start = fitWith(data.startingModel, toas, solveForOf(data.startingModel));
    expect(start.weightedRmsUs).toBeGreaterThan(20);
    const periods = HIDDEN_COMPANIONS.map((c) => Number(c.period_days));
    // sinusoids at the two true periods take away most of it; two other periods do not
    expect(rmsAfterRemovingPeriodsUs(start, toas, periods)).toBeLessThan(0.2 * start.weightedRmsUs);
    expect(rmsAfterRemovingPeriodsUs(start, toas, [50, 200])).toBeGreaterThan(0.8 * start.weightedRmsUs);
    const withCompanions = fitWith(data.startingModel, toas, [...solveForOf(data.startingModel), OFFSET_PATH], { companions: HIDDEN_COMPANIONS });
    expectWhite(withCompanions, 'with the two true companions');
    expectWithinSigma(withCompanions, OFFSET_PATH, DEMO_BACKEND_OFFSET_S, 3);
  });

  it('wrong position: an annual wave that disappears when right ascension and declination are fitted', () => {
    const { data, toas } = pulsar(3);
    const start = fitWith(data.startingModel, toas, solveForOf(data.startingModel));
    expect(start.weightedRmsUs).toBeGreaterThan(10);
    expect(rmsAfterRemovingPeriodsUs(start, toas, [YEAR_DAYS])).toBeLessThan(0.2 * start.weightedRmsUs);
    const fitted = fitWith(data.startingModel, toas, [...solveForOf(data.startingModel), 'astrometry.ra_hms', 'astrometry.dec_dms', OFFSET_PATH]);
    expectWhite(fitted, 'position fitted');
    const trueAstrometry = data.trueModel.astrometry as { ra_hms: string; dec_dms: string };
    // uncertainties are in seconds of time (RA) and arcseconds (Dec): docs/formats.md §2.1
    const raErrS = ((parseHms(fitted.parameters['astrometry.ra_hms'].value) - parseHms(trueAstrometry.ra_hms)) * 43_200) / Math.PI;
    const decErrArcsec = ((parseDms(fitted.parameters['astrometry.dec_dms'].value) - parseDms(trueAstrometry.dec_dms)) * 648_000) / Math.PI;
    expect(Math.abs(raErrS)).toBeLessThan(3 * fitted.parameters['astrometry.ra_hms'].uncertainty);
    expect(Math.abs(decErrArcsec)).toBeLessThan(3 * fitted.parameters['astrometry.dec_dms'].uncertainty);
    expectWithinSigma(fitted, OFFSET_PATH, DEMO_BACKEND_OFFSET_S, 3);
  });
});
