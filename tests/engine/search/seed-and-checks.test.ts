/**
 * The pieces of the search one by one: the sinusoid seed of a new companion,
 * the eccentric seed from the second harmonic, the default period range, the
 * screen for unstable and degenerate candidates, and the derived masses.
 */
import { describe, expect, it } from 'vitest';
import { circularSeed, eccentricSeed } from '../../../worker/timing/search/sinusoid-seed';
import { residualSeries } from '../../../worker/timing/search/residual-periodogram';
import { defaultSearchPeriodRange } from '../../../worker/timing/search/search-period-range';
import { classifyCandidate } from '../../../worker/timing/search/candidate-checks';
import { candidateDerivedQuantities } from '../../../worker/timing/search/candidate-derived';
import { fitPreparedArrivals } from '../../../worker/timing/pipeline/fit-prepared-arrivals';
import type { KeplerianCompanion } from '../../../worker/timing/model/timing-model';
import { mjdToApproxNumber } from '../../../worker/timing/time/mjd-arithmetic';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { simulatedSearchData } from './search-test-data';

function phaseOffTurns(fittedEpochMjd: number, trueEpochMjd: number, periodDays: number): number {
  const turns = (fittedEpochMjd - trueEpochMjd) / periodDays;
  return Math.abs(turns - Math.round(turns));
}

describe('companion seeds', { timeout: 30_000 }, () => {
  it('a circular seed from the residual sinusoid has the injected amplitude and phase', () => {
    const injected = { name: 'p1', kind: 'keplerian', enabled: true, period_days: '41.3', projected_semimajor_axis_lt_s: '2e-5', eccentricity: 0, periastron_longitude_deg: 0, periastron_epoch_mjd: '59003.2' };
    const data = simulatedSearchData([injected], { count: 300, seed: 8 });
    const fit = fitPreparedArrivals(data.start, data.toas, data.geometry);
    const seed = circularSeed('b', 41.3, residualSeries(fit, data.geometry));
    expect(seed.eccentricity).toBe(0);
    expect(Math.abs(seed.projectedSemimajorAxisLtS - 2e-5)).toBeLessThan(0.05 * 2e-5); // within 5 % (σ/√N ≈ 0.3 % of x)
    // phase within 0.01 turn: a wrong sign of the residual would put it half a turn away
    expect(phaseOffTurns(mjdToApproxNumber(seed.periastronEpochMjd), 59003.2, 41.3)).toBeLessThan(0.01);
    // the epoch is moved next to the middle of the data (MJD 58000–60000)
    expect(Math.abs(mjdToApproxNumber(seed.periastronEpochMjd) - 59000)).toBeLessThan(41.3);
  });

  it('the eccentric seed reads e and ω from the second harmonic left by a circular fit', () => {
    const injected = { name: 'p1', kind: 'keplerian', enabled: true, period_days: '41.3', projected_semimajor_axis_lt_s: '2e-5', eccentricity: 0.1, periastron_longitude_deg: 60, periastron_epoch_mjd: '59003.2' };
    const data = simulatedSearchData([injected], { count: 300, seed: 8 });
    const base = fitPreparedArrivals(data.start, data.toas, data.geometry);
    const seed = circularSeed('b', 41.3, residualSeries(base, data.geometry));
    const circularModel = structuredClone(data.start);
    circularModel.companions.push(seed);
    circularModel.solveFor.push('companions[b].period_days', 'companions[b].projected_semimajor_axis_lt_s', 'companions[b].periastron_epoch_mjd');
    const circular = fitPreparedArrivals(circularModel, data.toas, data.geometry);
    const fitted = circular.model.companions[0] as KeplerianCompanion;
    const eccentric = eccentricSeed(fitted, residualSeries(circular, data.geometry));
    // first-order theory (Lange et al. 2001): good to ~e² ≈ 0.01 in e and a few degrees in ω
    expect(Math.abs(eccentric.eccentricity - 0.1)).toBeLessThan(0.02);
    expect(Math.abs(((eccentric.periastronLongitudeDeg - 60 + 540) % 360) - 180)).toBeLessThan(10);
    expect(phaseOffTurns(mjdToApproxNumber(eccentric.periastronEpochMjd), 59003.2, 41.3)).toBeLessThan(0.03);
  });
});

describe('defaultSearchPeriodRange', () => {
  it('spans from twice the median TOA spacing (at least 1 d) to the data span', () => {
    const every4Days = Float64Array.from({ length: 101 }, (_, i) => 4 * i);
    expect(defaultSearchPeriodRange(every4Days)).toEqual({ minPeriodDays: 8, maxPeriodDays: 400, spanDays: 400, medianSpacingDays: 4, cadenceDays: 4 });
    const hourly = Float64Array.from({ length: 49 }, (_, i) => i / 24); // one session: no cadence, 1 d floor
    const range = defaultSearchPeriodRange(hourly);
    expect(range.minPeriodDays).toBe(1);
    expect(range.medianSpacingDays).toBeCloseTo(1 / 24, 12);
    expect(range.cadenceDays).toBeNaN();
    // sessions of 5 TOAs an hour apart every 14 days: the spacing inside sessions rules, the cadence is 14 d
    const sessions = Float64Array.from({ length: 50 }, (_, i) => 14 * Math.floor(i / 5) + (i % 5) / 24);
    expect(defaultSearchPeriodRange(sessions)).toMatchObject({ minPeriodDays: 1, cadenceDays: 14 });
    expect(() => defaultSearchPeriodRange(Float64Array.from([5, 5, 5]))).toThrow(/two distinct times/);
  });
});

const GOOD: KeplerianCompanion = {
  kind: 'keplerian', name: 'b', enabled: true, periodDays: 58.2, projectedSemimajorAxisLtS: 2.5e-5, eccentricity: 0.05,
  periastronLongitudeDeg: 120, periastronEpochMjd: parseMjd('59021.7'), periodDerivative: 0, periastronAdvanceDegPerYr: 0, einsteinDelayS: 0,
};
const GOOD_SIGMAS = { period_days: 0.002, projected_semimajor_axis_lt_s: 6e-8, periastron_epoch_mjd: 0.8, eccentricity: 0.005, periastron_longitude_deg: 5 };

describe('classifyCandidate', () => {
  const check = (companion: Partial<KeplerianCompanion>, sigmas: Record<string, number> = {}, converged = true) =>
    classifyCandidate({ companion: { ...GOOD, ...companion }, uncertainties: { ...GOOD_SIGMAS, ...sigmas }, converged, spanDays: 2000 });

  it('accepts a well-measured orbit inside the span', () => {
    expect(check({})).toEqual({ status: 'accepted' });
  });
  it('calls a fit that did not converge, e → 1 or a period beyond the span unstable', () => {
    expect(check({}, {}, false)).toMatchObject({ status: 'unstable', reason: expect.stringMatching(/did not converge/) });
    expect(check({ eccentricity: 0.97 })).toMatchObject({ status: 'unstable', reason: expect.stringMatching(/toward 1/) });
    expect(check({ periodDays: 2400 })).toMatchObject({ status: 'unstable', reason: expect.stringMatching(/beyond the data span/) });
  });
  it('calls an insignificant amplitude, an unconstrained period or a missing uncertainty degenerate', () => {
    expect(check({}, { projected_semimajor_axis_lt_s: 1e-5 })).toMatchObject({ status: 'degenerate', reason: expect.stringMatching(/2\.5σ/) });
    expect(check({}, { period_days: 10 })).toMatchObject({ status: 'degenerate', reason: expect.stringMatching(/period uncertainty/) });
    expect(check({}, { eccentricity: NaN })).toMatchObject({ status: 'degenerate', reason: expect.stringMatching(/eccentricity/) });
  });
});

describe('candidateDerivedQuantities', () => {
  it('gives the Hulse–Taylor mass function 0.1322 M☉ from its period and projected semimajor axis', () => {
    // Pb = 0.322997448918 d, x = 2.341782 lt-s → f = 0.1322 M☉ (Weisberg, Nice & Taylor 2010, from memory)
    const derived = candidateDerivedQuantities({ ...GOOD, periodDays: 0.322997448918, projectedSemimajorAxisLtS: 2.341782 }, 1.4);
    expect(Math.abs(derived.massFunctionSolar - 0.1322)).toBeLessThan(0.0001);
    // m_c,min solves f = m³/(m_p + m)² (Lorimer & Kramer 2005, eq. 8.34)
    const m = derived.minimumCompanionMass.solarMasses;
    expect(m ** 3 / (1.4 + m) ** 2).toBeCloseTo(derived.massFunctionSolar, 12);
    // a = (G·M·P²/4π²)^(1/3) ≈ 1.8e9 m ≈ 0.012 au for M = 1.4 + 0.88 M☉ and P = 7.75 h (Kepler's third law, by hand)
    expect(derived.separationAu).toBeGreaterThan(0.011);
    expect(derived.separationAu).toBeLessThan(0.013);
  });
  it('is NaN for a non-positive amplitude instead of throwing', () => {
    expect(candidateDerivedQuantities({ ...GOOD, projectedSemimajorAxisLtS: -1e-6 }, 1.4).massFunctionSolar).toBeNaN();
  });
});
