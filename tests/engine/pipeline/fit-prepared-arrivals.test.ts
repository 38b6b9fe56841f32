import { describe, expect, it } from 'vitest';
import { toyGeometry } from './toy-geometry';
import { toyModel } from './toy-model';
import { fitPreparedArrivals } from '../../../worker/timing/pipeline/fit-prepared-arrivals';
import { simulateArrivals } from '../../../worker/timing/simulate/simulate-arrivals';
import { parameterHandle } from '../../../worker/timing/model/parameter-paths';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { ddAddNumber } from '../../../worker/timing/time/double-double-typed';
import { TimingInputError } from '../../../worker/timing/engine-error';
import type { TimingModel } from '../../../worker/timing/model/timing-model';

const SOLVE_FOR = ['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'astrometry.ra_hms', 'astrometry.dec_dms', 'astrometry.pm_ra_cosdec_mas_per_yr', 'companions[b].projected_semimajor_axis_lt_s'];

function simulated(model: TimingModel, seed: number, count = 80, uncertaintyUs = 1.5) {
  return simulateArrivals(model, { startMjd: parseMjd('57800'), endMjd: parseMjd('59300'), count, observatory: 'toy-site', uncertaintyUs, seed }, toyGeometry).toas;
}

describe('timing fit', () => {
  it('gives calibrated χ² and uncertainties over 30 simulated white-noise datasets (common practice)', () => {
    const truth = toyModel({ solveFor: SOLVE_FOR });
    const reduced: number[] = [];
    const pulls: number[] = [];
    for (let seed = 1; seed <= 30; seed += 1) {
      const toas = simulated(truth, seed);
      const fit = fitPreparedArrivals(truth, toas, toyGeometry(toas));
      expect(fit.converged).toBe(true);
      reduced.push(fit.reducedChi2);
      for (const path of SOLVE_FOR) {
        const h = parameterHandle(truth, path);
        const fitted = fit.parameters[path].internalValue;
        const trueValue = h.get(truth);
        const difference = fitted[1] - trueValue[1] + (fitted[0] - trueValue[0]);
        pulls.push(difference / fit.parameters[path].internalUncertainty);
      }
    }
    const meanReduced = reduced.reduce((a, b) => a + b, 0) / reduced.length;
    expect(Math.abs(meanReduced - 1)).toBeLessThan(0.1);
    const meanPull = pulls.reduce((a, b) => a + b, 0) / pulls.length;
    const sdPull = Math.sqrt(pulls.reduce((a, b) => a + (b - meanPull) ** 2, 0) / (pulls.length - 1));
    expect(Math.abs(sdPull - 1)).toBeLessThan(0.25);
  });

  it('recovers a frequency and position started several σ away', () => {
    const truth = toyModel({ solveFor: ['spin.frequency_hz', 'astrometry.ra_hms', 'dispersion.dm_pc_per_cm3'] });
    const band = (frequencyMhz: number, seed: number) =>
      simulateArrivals(truth, { startMjd: parseMjd('57800'), endMjd: parseMjd('59300'), count: 60, observatory: 'toy-site', uncertaintyUs: 1, seed, frequencyMhz }, toyGeometry).toas;
    const toas = [...band(700, 7), ...band(1500, 8)];
    toas.forEach((t, i) => { t.row = i + 1; });
    const start = structuredClone(truth);
    start.spin.frequencyHz = ddAddNumber(truth.spin.frequencyHz, 3e-11);
    start.astrometry.raRad += 2e-8;
    start.dispersion.dmPcPerCm3 += 1e-3;
    const fit = fitPreparedArrivals(start, toas, toyGeometry(toas));
    expect(fit.converged).toBe(true);
    expect(fit.iterations).toBeGreaterThanOrEqual(1);
    const df = fit.model.spin.frequencyHz[1] - truth.spin.frequencyHz[1] + (fit.model.spin.frequencyHz[0] - truth.spin.frequencyHz[0]);
    expect(Math.abs(df)).toBeLessThan(4 * fit.parameters['spin.frequency_hz'].internalUncertainty);
    expect(Math.abs(fit.model.astrometry.raRad - truth.astrometry.raRad)).toBeLessThan(4 * fit.parameters['astrometry.ra_hms'].internalUncertainty);
    expect(fit.reducedChi2).toBeLessThan(1.5);
    expect(fit.residuals).toHaveLength(120);
    expect(fit.residuals[0].row).toBe(1);
    expect(start.dispersion.dmPcPerCm3).toBe(truth.dispersion.dmPcPerCm3 + 1e-3); // input not modified
    expect(fit.parameters['astrometry.ra_hms'].value).toMatch(/^\d\d:\d\d:\d\d\.\d+$/);
  });

  it('fits a backend offset, and refuses an offset for a backend without TOAs', () => {
    const truth = toyModel({ offsets: [{ backend: 'second', seconds: 3e-6 }, { backend: 'absent', seconds: 0 }] });
    const toas = simulated(toyModel(), 3, 60, 0.5);
    toas.forEach((t, i) => { if (i % 3 === 0) { t.backend = 'second'; } });
    const start = structuredClone(truth);
    start.offsets[0].seconds = 0;
    start.solveFor = ['offsets[second].seconds'];
    const fit = fitPreparedArrivals(start, toas, toyGeometry(toas));
    expect(Math.abs(fit.model.offsets[0].seconds)).toBeLessThan(4 * fit.parameters['offsets[second].seconds'].uncertainty);
    start.solveFor = ['offsets[absent].seconds'];
    expect(() => fitPreparedArrivals(start, toas, toyGeometry(toas))).toThrow(/offsets\[absent\]\.seconds: no TOAs from this backend/);
  });

  it('names parameters with no effect, unknown paths and repeated paths', () => {
    const toas = simulated(toyModel(), 4, 40);
    const disabled = toyModel({ solveFor: ['companions[b].eccentricity'] });
    disabled.companions[0].enabled = false;
    expect(() => fitPreparedArrivals(disabled, toas, toyGeometry(toas))).toThrow(TimingInputError);
    expect(() => fitPreparedArrivals(disabled, toas, toyGeometry(toas))).toThrow(/companions\[b\]\.eccentricity/);
    expect(() => fitPreparedArrivals(toyModel({ solveFor: ['spin.wobble'] }), toas, toyGeometry(toas))).toThrow(/spin\.wobble/);
    expect(() => fitPreparedArrivals(toyModel({ solveFor: ['spin.frequency_hz', 'spin.frequency_hz'] }), toas, toyGeometry(toas))).toThrow(/more than once/);
    expect(() => fitPreparedArrivals(toyModel(), [], toyGeometry([]))).toThrow(/no TOAs/);
  });

  it('reports non-convergence with the last χ² instead of hiding it', () => {
    const truth = toyModel({ solveFor: ['companions[b].period_days', 'companions[b].periastron_epoch_mjd', 'companions[b].projected_semimajor_axis_lt_s'] });
    const toas = simulated(truth, 5, 200, 0.2);
    const start = structuredClone(truth);
    (start.companions[0] as { periodDays: number }).periodDays *= 1 + 3e-6;
    const fit = fitPreparedArrivals(start, toas, toyGeometry(toas), { maxIterations: 1 });
    expect(fit.converged).toBe(false);
    expect(fit.warnings.join(' ')).toMatch(/χ²/);
  });
});
