/**
 * Injection and recovery: companions put into simulated TOAs by the engine's
 * simulator are found again by the search, with elements within 3σ of the
 * injected ones, and nothing is found where nothing was put.
 */
import { describe, expect, it } from 'vitest';
import { searchCompanions } from '../../../worker/timing/search/companion-search';
import { CompanionSearchCancelled, type CompanionSearchReport } from '../../../worker/timing/search/companion-search-report';
import { massFunctionSolarMasses } from '../../../worker/timing/physics/mass-function';
import { simulatedSearchData, sigmasOff } from './search-test-data';

const THRESHOLD = 1e-3; // the documented default false-alarm threshold
const ELEMENTS = ['period_days', 'projected_semimajor_axis_lt_s', 'eccentricity', 'periastron_longitude_deg', 'periastron_epoch_mjd'];

function accepted(report: CompanionSearchReport) {
  return report.candidates.filter((c) => c.status === 'accepted');
}

// Three invented companions: different periods (13.7, 58.2, 211 d) and amplitudes (8, 25, 60 µs; σ = 1 µs).
const THREE = [
  { name: 'p1', kind: 'keplerian', enabled: true, period_days: '13.71', projected_semimajor_axis_lt_s: '8e-6', eccentricity: 0, periastron_longitude_deg: 0, periastron_epoch_mjd: '59003.2' },
  { name: 'p2', kind: 'keplerian', enabled: true, period_days: '58.23', projected_semimajor_axis_lt_s: '2.5e-5', eccentricity: 0.05, periastron_longitude_deg: 120, periastron_epoch_mjd: '59021.7' },
  { name: 'p3', kind: 'keplerian', enabled: true, period_days: '211.4', projected_semimajor_axis_lt_s: '6e-5', eccentricity: 0.1, periastron_longitude_deg: 300, periastron_epoch_mjd: '58950.4' },
];

describe('searchCompanions: injection and recovery', { timeout: 60_000 }, () => {
  it('recovers three companions of different periods and amplitudes (periods within 3σ) and no spurious fourth', () => {
    const data = simulatedSearchData(THREE, { count: 600, seed: 11 });
    const report = searchCompanions(data.start, data.toas, data.geometry, { maxCompanions: 5 });
    const found = accepted(report);
    expect(found, JSON.stringify(report.peaks)).toHaveLength(3);
    expect(report.candidates).toHaveLength(3);
    for (const injected of THREE) {
      const period = Number(injected.period_days);
      const match = found.find((c) => Math.abs(c.companion.periodDays - period) < 0.01 * period);
      expect(match, `companion at ${period} d`).toBeDefined();
      expect(sigmasOff(match!, 'period_days', period), `period of ${period} d`).toBeLessThan(3);
      expect(sigmasOff(match!, 'projected_semimajor_axis_lt_s', Number(injected.projected_semimajor_axis_lt_s))).toBeLessThan(3);
      expect(match!.falseAlarmProbability).toBeLessThan(THRESHOLD);
      expect(match!.chi2After).toBeLessThan(match!.chi2Before);
    }
    // one peak per round; the last one stopped the search and is not significant
    expect(report.peaks).toHaveLength(4);
    expect(report.stopReason).toBe('false-alarm-above-threshold');
    expect(report.peaks[3].falseAlarmProbability).toBeGreaterThan(THRESHOLD);
    expect(report.finalFit.converged).toBe(true);
    expect(report.finalFit.reducedChi2).toBeGreaterThan(0.7);
    expect(report.finalFit.reducedChi2).toBeLessThan(1.3);
    // the final model carries the three companions with their elements in solve_for
    expect(report.model.companions.map((c) => c.name).sort()).toEqual(found.map((c) => c.name).sort());
    for (const c of found) expect(report.model.solveFor).toContain(`companions[${c.name}].period_days`);
  });

  it('fits an eccentric binary (e = 0.3) back within 3σ in every element', () => {
    const injected = { name: 'p1', kind: 'keplerian', enabled: true, period_days: '37.3', projected_semimajor_axis_lt_s: '3e-5', eccentricity: 0.3, periastron_longitude_deg: 75, periastron_epoch_mjd: '59003.2' };
    const data = simulatedSearchData([injected], { count: 400, seed: 5 });
    const report = searchCompanions(data.start, data.toas, data.geometry);
    const found = accepted(report);
    expect(found).toHaveLength(1);
    const candidate = found[0];
    expect(candidate.eccentricityTest.kept).toBe(true);
    expect(candidate.eccentricityTest.probability).toBeLessThan(1e-3);
    for (const key of ELEMENTS) {
      expect(sigmasOff(candidate, key, Number((injected as Record<string, unknown>)[key])), key).toBeLessThan(3);
    }
    // derived quantities follow from the fitted elements (f = 4π²x³/(T☉P²): Lorimer & Kramer 2005, eq. 8.34)
    const f = massFunctionSolarMasses(candidate.companion.projectedSemimajorAxisLtS, candidate.companion.periodDays * 86_400);
    expect(candidate.derived.massFunctionSolar).toBe(f);
    expect(candidate.derived.pulsarMassSolar).toBe(1.4);
    expect(candidate.derived.minimumCompanionMass.jupiterMasses).toBeGreaterThan(0);
    expect(candidate.derived.separationAu).toBeGreaterThan(0);
    expect(report.peaks.at(-1)!.falseAlarmProbability).toBeGreaterThan(THRESHOLD);
  });

  it('finds no companion in pure noise, and the false-alarm probability it reports is not small', () => {
    const data = simulatedSearchData([], { count: 400, seed: 5 });
    const report = searchCompanions(data.start, data.toas, data.geometry);
    expect(report.candidates).toEqual([]);
    expect(report.peaks).toHaveLength(1);
    expect(report.peaks[0].falseAlarmProbability).toBeGreaterThan(0.05);
    expect(report.stopReason).toBe('false-alarm-above-threshold');
    expect(report.model.companions).toEqual([]);
    expect(report.model.solveFor).toEqual(data.start.solveFor);
  });

  it('reports a companion whose period runs beyond the data span as unstable and does not add it', () => {
    // a 3000-day orbit in 2000 days of data, searched out to 6000 days on request
    const injected = { name: 'p1', kind: 'keplerian', enabled: true, period_days: '3000', projected_semimajor_axis_lt_s: '2e-4', eccentricity: 0, periastron_longitude_deg: 0, periastron_epoch_mjd: '59003.2' };
    const data = simulatedSearchData([injected], { count: 400, seed: 5 });
    const report = searchCompanions(data.start, data.toas, data.geometry, { maxPeriodDays: 6000 });
    expect(report.candidates).toHaveLength(1);
    expect(report.candidates[0].status).toBe('unstable');
    expect(report.candidates[0].reason).toMatch(/beyond the data span/);
    expect(report.stopReason).toBe('candidate-rejected');
    expect(report.model.companions).toEqual([]);
    expect(report.warnings.join('\n')).toMatch(/is unstable/);
  });

  it('stops at maxCompanions with a warning when significant signal remains', () => {
    const data = simulatedSearchData(THREE, { count: 600, seed: 11 });
    const report = searchCompanions(data.start, data.toas, data.geometry, { maxCompanions: 1 });
    expect(accepted(report)).toHaveLength(1);
    expect(accepted(report)[0].companion.periodDays).toBeCloseTo(211.4, 0); // the strongest signal first
    expect(report.peaks).toHaveLength(2);
    expect(report.stopReason).toBe('max-companions');
    expect(report.peaks[1].falseAlarmProbability).toBeLessThan(THRESHOLD);
    expect(report.warnings.join('\n')).toMatch(/more signal may remain/);
  });

  it('reports progress up to 1 and stops with CompanionSearchCancelled when asked to', () => {
    const data = simulatedSearchData([], { count: 100, seed: 3 });
    const fractions: number[] = [];
    searchCompanions(data.start, data.toas, data.geometry, { onProgress: (p) => fractions.push(p.fraction) });
    expect(fractions.at(-1)).toBe(1);
    expect(fractions.every((f, i) => i === 0 || f >= fractions[i - 1])).toBe(true);
    expect(() => searchCompanions(data.start, data.toas, data.geometry, { isCancelled: () => true })).toThrow(CompanionSearchCancelled);
  });

  it('rejects bad options by name', () => {
    const data = simulatedSearchData([], { count: 50, seed: 3 });
    expect(() => searchCompanions(data.start, data.toas, data.geometry, { falseAlarmThreshold: 0 })).toThrow(/falseAlarmThreshold/);
    expect(() => searchCompanions(data.start, data.toas, data.geometry, { maxCompanions: -1 })).toThrow(/maxCompanions/);
    expect(() => searchCompanions(data.start, data.toas, data.geometry, { pulsarMassSolar: 0 })).toThrow(/pulsarMassSolar/);
    expect(() => searchCompanions(data.start, data.toas, data.geometry, { minPeriodDays: 100, maxPeriodDays: 50 })).toThrow(/maxPeriodDays/);
  });
});
