import { describe, expect, it } from 'vitest';
import { companionDelayPartials, TIME_RATE_KEY } from '../../../worker/timing/orbits/companion-delay-partials';
import { companionDelaysFromDaysS } from '../../../worker/timing/orbits/companion-delays';
import { barycentricDaysFromMjd, type BarycentricDays } from '../../../worker/timing/orbits/barycentric-days';
import { numericDerivativeColumn } from '../../../worker/timing/fit/numeric-derivative';
import type { DamourDeruelleCompanion } from '../../../worker/timing/model/timing-model';
import { mjdAddDays, mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import { toyModel } from '../pipeline/toy-model';
import { toyGeometry } from '../pipeline/toy-geometry';
import { simulateArrivals } from '../../../worker/timing/simulate/simulate-arrivals';
import { prepareArrivals } from '../../../worker/timing/pipeline/prepared-arrivals';
import { computeTimingResiduals } from '../../../worker/timing/pipeline/timing-residuals';
import { timingDesignMatrix } from '../../../worker/timing/pipeline/timing-design-matrix';
import { allParameterPaths, parameterHandle } from '../../../worker/timing/model/parameter-paths';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { ddAddNumber } from '../../../worker/timing/time/double-double-typed';

/** A relativistic binary with every post-Keplerian parameter non-zero (invented values). */
function relativistic(overrides: Partial<DamourDeruelleCompanion> = {}): DamourDeruelleCompanion {
  return {
    kind: 'damour-deruelle', name: 'b', enabled: true, periodDays: 0.4, projectedSemimajorAxisLtS: 2.2, eccentricity: 0.3,
    periastronLongitudeDeg: 40, periastronEpochMjd: mjdFromParts(58000, 0.25), periodDerivative: -2.4e-12,
    periastronAdvanceDegPerYr: 4.2, einsteinDelayS: 2e-3, shapiroRangeS: 6e-6, shapiroShape: 0.995, ...overrides,
  };
}

type NumericField = 'periodDays' | 'projectedSemimajorAxisLtS' | 'eccentricity' | 'periastronLongitudeDeg' | 'periodDerivative'
  | 'periastronAdvanceDegPerYr' | 'einsteinDelayS' | 'shapiroRangeS' | 'shapiroShape';
const FIELDS: Record<string, NumericField | 'epoch'> = {
  period_days: 'periodDays', projected_semimajor_axis_lt_s: 'projectedSemimajorAxisLtS', eccentricity: 'eccentricity',
  periastron_longitude_deg: 'periastronLongitudeDeg', periastron_epoch_mjd: 'epoch', period_derivative: 'periodDerivative',
  periastron_advance_deg_per_yr: 'periastronAdvanceDegPerYr', einstein_delay_s: 'einsteinDelayS', shapiro_range_s: 'shapiroRangeS', shapiro_shape: 'shapiroShape',
};

function shifted(c: DamourDeruelleCompanion, key: string, offset: number): DamourDeruelleCompanion {
  const field = FIELDS[key];
  if (field === 'epoch') return { ...c, periastronEpochMjd: mjdAddDays(c.periastronEpochMjd, offset) };
  return { ...c, [field]: c[field] + offset };
}

const STEP_FRACTION = 2 ** -9; // h = scale·2⁻⁹ (worker/timing/fit/numeric-derivative.ts)

/**
 * Worst |analytic − numeric| over the largest |analytic| (numeric by worker/timing/fit/numeric-derivative.ts),
 * and the floor set by rounding: ε·max|Δ| per evaluation and ε·|parameter| in the stepped value, over h·size.
 */
function relativeError(c: DamourDeruelleCompanion, days: BarycentricDays, key: string): { error: number; roundingFloor: number } {
  const [analytic] = companionDelayPartials(c, days, [key]);
  const size = Math.max(...Array.from(analytic, Math.abs));
  expect(size, key).toBeGreaterThan(0);
  // step scale: the delay moves by ~1e-5 s, and stays small against the scale on which the
  // parameter acts non-linearly. Shapiro shape: ln(L − δs·H) has k-th derivatives ∝ (H/L)^k with
  // L/H ≥ 1 − s; a scale 10(1 − s) keeps the truncation term ~(hH/L)⁴ below 1e-7
  const nonlinearScale = key === 'shapiro_shape' ? 10 * (1 - Math.abs(c.shapiroShape)) : Infinity;
  const scale = key === TIME_RATE_KEY ? 1 : Math.min(5e-3 / size, nonlinearScale);
  const numeric = key === TIME_RATE_KEY
    ? numericDerivativeColumn((offsetS) => companionDelaysFromDaysS([c], { ...days, lo: days.lo.map((v) => v + offsetS / 86_400) }), scale)
    : numericDerivativeColumn((offset) => companionDelaysFromDaysS([shifted(c, key, offset)], days), scale);
  const h = scale * STEP_FRACTION;
  const delay = companionDelaysFromDaysS([c], days);
  const field = FIELDS[key];
  const value = field === undefined || field === 'epoch' ? 0 : Math.abs(c[field]); // epochs step in double-double
  const roundingFloor = Number.EPSILON * (Math.max(...Array.from(delay, Math.abs)) / (h * size) + value / h);
  return { error: Math.max(...Array.from(analytic, (a, i) => Math.abs(a - numeric[i]))) / size, roundingFloor };
}

/** The relative error is below `tolerance`, or within 10× its rounding floor where that is larger. */
function expectAgreement(c: DamourDeruelleCompanion, days: BarycentricDays, key: string, tolerance: number): void {
  const { error, roundingFloor } = relativeError(c, days, key);
  expect(error, `${key} (rounding floor ${roundingFloor.toExponential(1)})`).toBeLessThan(Math.max(tolerance, 10 * roundingFloor));
}

describe('Damour–Deruelle partial derivatives', () => {
  const ts = Array.from({ length: 300 }, (_, i) => mjdFromParts(58000, 0.013 + i * 3.7));
  const days = barycentricDaysFromMjd(ts, mjdFromParts(58500, 0));

  it('agree with Richardson-extrapolated numeric differences to 1e-6 relative for every key', () => {
    for (const key of [...Object.keys(FIELDS), TIME_RATE_KEY]) expectAgreement(relativistic(), days, key, 1e-6);
  });

  it('stay right for a compact orbit, where the second-order inverse-formula terms are ~(nx)² ≈ 5e-6 of the delay', () => {
    const compact = relativistic({ periodDays: 0.1, projectedSemimajorAxisLtS: 3, eccentricity: 0.6 });
    // 1e-8: a few hundred times below the size of those terms, so a wrong factor in them shows
    for (const key of [...Object.keys(FIELDS), TIME_RATE_KEY]) expectAgreement(compact, days, key, 1e-8);
    // near T₀ the mean-anomaly part of ∂Δ/∂Pb vanishes, leaving the n- and k-dependence
    const nearEpoch = barycentricDaysFromMjd(Array.from({ length: 50 }, (_, i) => mjdFromParts(58000, 0.25 + (i - 25) * 0.002)), mjdFromParts(58000, 0));
    expectAgreement(compact, nearEpoch, 'period_days', 1e-8);
  });

  it('stay right at e = 0, s = 0 and r = 0 (straddling numeric steps)', () => {
    const plain = relativistic({ eccentricity: 0, shapiroShape: 0, shapiroRangeS: 0, einsteinDelayS: 0, periastronAdvanceDegPerYr: 0 });
    for (const key of ['eccentricity', 'periastron_longitude_deg', 'periastron_epoch_mjd', 'einstein_delay_s', 'periastron_advance_deg_per_yr']) {
      expectAgreement(plain, days, key, 1e-6);
    }
    // ∂Δ/∂s = 2rH/L vanishes at r = 0 and ∂Δ/∂r = −2 ln(1 − e cos u − sH) at e = s = 0: each with the other set
    expectAgreement({ ...plain, shapiroRangeS: 5e-6 }, days, 'shapiro_shape', 1e-6);
    expectAgreement({ ...plain, shapiroShape: 0.5 }, days, 'shapiro_range_s', 1e-6);
  });

  it('are zero for a disabled companion', () => {
    const out = companionDelayPartials({ ...relativistic(), enabled: false }, days, ['shapiro_range_s', TIME_RATE_KEY]);
    expect(out.every((column) => column.every((v) => v === 0))).toBe(true);
  });

  it('give design-matrix columns that match numeric residual derivatives through the whole pipeline', () => {
    const model = toyModel();
    model.companions = [relativistic({ periastronEpochMjd: parseMjd('58501.372') })];
    const sim = simulateArrivals(model, { startMjd: parseMjd('58000'), endMjd: parseMjd('59100'), count: 150, observatory: 'toy-site', uncertaintyUs: 1, addNoise: false }, toyGeometry);
    const prepared = prepareArrivals(sim.toas, toyGeometry(sim.toas), model.epochMjd);
    const base = computeTimingResiduals(model, prepared);
    const paths = allParameterPaths(model).filter((p) => p.startsWith('companions[b].') || p.startsWith('astrometry.'));
    expect(paths.filter((p) => p.startsWith('companions[b].')).length).toBe(10); // every damour-deruelle key
    const design = timingDesignMatrix(model, prepared, base, paths, false);
    const n = prepared.count;
    paths.forEach((path, j) => {
      const handle = parameterHandle(model, path);
      const value = handle.get(model);
      const trial = structuredClone(model);
      const analytic = design.subarray(j * n, (j + 1) * n);
      const size = Math.max(...Array.from(analytic, Math.abs));
      const nonlinearScale = path.endsWith('shapiro_shape') ? 0.005 : Infinity;
      const numeric = numericDerivativeColumn((offset) => {
        handle.set(trial, ddAddNumber(value, offset));
        return computeTimingResiduals(trial, prepared, { fixedPulseNumbers: base.pulseNumber }).residualS;
      }, Math.min(5e-3 / size, nonlinearScale));
      const worst = Math.max(...Array.from(analytic, (a, i) => Math.abs(a - numeric[i])));
      expect(size, path).toBeGreaterThan(0);
      expect(worst / size, path).toBeLessThan(1e-6);
    });
  });
});
