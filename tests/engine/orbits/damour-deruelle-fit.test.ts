import { describe, expect, it } from 'vitest';
import { toyModel } from '../pipeline/toy-model';
import { toyGeometry } from '../pipeline/toy-geometry';
import { simulateArrivals } from '../../../worker/timing/simulate/simulate-arrivals';
import { fitPreparedArrivals } from '../../../worker/timing/pipeline/fit-prepared-arrivals';
import { parameterHandle } from '../../../worker/timing/model/parameter-paths';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { SUN_MASS_SECONDS } from '../../../worker/timing/delays/physical-constants';
import type { DamourDeruelleCompanion, TimingModel } from '../../../worker/timing/model/timing-model';

/** An invented double-neutron-star-like binary seen nearly edge-on: every post-Keplerian effect is large. */
function relativisticBinary(): DamourDeruelleCompanion {
  return {
    kind: 'damour-deruelle', name: 'b', enabled: true, periodDays: 0.3819, projectedSemimajorAxisLtS: 1.98, eccentricity: 0.171,
    periastronLongitudeDeg: 73.8, periastronEpochMjd: parseMjd('58500.1234'), periodDerivative: -1.9e-12,
    periastronAdvanceDegPerYr: 6.1, einsteinDelayS: 1.7e-3, shapiroRangeS: 1.25 * SUN_MASS_SECONDS, shapiroShape: 0.9985,
  };
}

const COMPANION_KEYS = [
  'period_days', 'projected_semimajor_axis_lt_s', 'eccentricity', 'periastron_longitude_deg', 'periastron_epoch_mjd',
  'period_derivative', 'periastron_advance_deg_per_yr', 'einstein_delay_s', 'shapiro_range_s', 'shapiro_shape',
];
const SOLVE_FOR = ['spin.frequency_hz', 'spin.frequency_derivatives[0]', ...COMPANION_KEYS.map((k) => `companions[b].${k}`)];

function truthModel(): TimingModel {
  return toyModel({ companions: [relativisticBinary()], solveFor: SOLVE_FOR });
}

describe('fitting a Damour–Deruelle companion', () => {
  it('recovers every post-Keplerian parameter from simulated TOAs within 3σ (injection and recovery, common practice)', () => {
    const truth = truthModel();
    const toas = simulateArrivals(truth, { startMjd: parseMjd('57800'), endMjd: parseMjd('59300'), count: 900, observatory: 'toy-site', uncertaintyUs: 1, seed: 11 }, toyGeometry).toas;
    // start away from the truth in the Shapiro and Einstein terms (the fit must move them)
    const start = structuredClone(truth);
    const startCompanion = start.companions[0] as DamourDeruelleCompanion;
    startCompanion.shapiroRangeS *= 1.2;
    startCompanion.shapiroShape = 0.997;
    startCompanion.einsteinDelayS *= 0.9;
    const fit = fitPreparedArrivals(start, toas, toyGeometry(toas));
    expect(fit.converged).toBe(true);
    expect(Math.abs(fit.reducedChi2 - 1)).toBeLessThan(0.15); // χ² of 888 degrees of freedom: σ ≈ 0.05
    for (const path of SOLVE_FOR) {
      const fitted = fit.parameters[path].internalValue;
      const trueValue = parameterHandle(truth, path).get(truth);
      const pull = (fitted[1] - trueValue[1] + (fitted[0] - trueValue[0])) / fit.parameters[path].internalUncertainty;
      expect(Math.abs(pull), path).toBeLessThan(3);
    }
    // the strong case: range and shape are measured, not just bounded
    const range = fit.parameters['companions[b].shapiro_range_s'];
    expect(Number(range.value) / range.uncertainty).toBeGreaterThan(10);
    const shape = fit.parameters['companions[b].shapiro_shape'];
    expect(shape.uncertainty).toBeLessThan(0.1 * (1 - 0.9985));
  });

  it('a disabled companion leaves the residuals of a model without it unchanged', () => {
    const withCompanion = truthModel();
    const toas = simulateArrivals({ ...withCompanion, companions: [] }, { startMjd: parseMjd('57800'), endMjd: parseMjd('59300'), count: 60, observatory: 'toy-site', uncertaintyUs: 1, seed: 3 }, toyGeometry).toas;
    const off = structuredClone(withCompanion);
    off.companions[0].enabled = false;
    off.solveFor = ['spin.frequency_hz'];
    const fit = fitPreparedArrivals(off, toas, toyGeometry(toas));
    expect(fit.converged).toBe(true);
    expect(Math.abs(fit.reducedChi2 - 1)).toBeLessThan(0.5);
    // and its parameters cannot be fitted while it is off
    expect(() => fitPreparedArrivals({ ...off, solveFor: ['companions[b].shapiro_range_s'] }, toas, toyGeometry(toas))).toThrow(/companions\[b\]\.shapiro_range_s/);
  });
});
