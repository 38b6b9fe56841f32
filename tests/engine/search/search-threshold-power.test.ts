/**
 * Each round of a companion search carries the power of its false-alarm threshold
 * (the line drawn over the periodogram): the power at which the Baluev 2008 false-alarm
 * probability (MNRAS 385, 1279), with the round's samples, weights and highest searched
 * frequency, equals the threshold. Peaks above it are exactly the significant ones.
 */
import { describe, expect, it } from 'vitest';
import { falseAlarmBaluev } from '../../../worker/timing/periodogram/false-alarm-probability';
import { searchCompanions } from '../../../worker/timing/search/companion-search';
import { residualSeries } from '../../../worker/timing/search/residual-periodogram';
import { expectWithin } from '../time/expect-within';
import { simulatedSearchData } from './search-test-data';

// One invented companion (211 d, 40 µs against σ = 1 µs): round 1 finds it, round 2 finds nothing.
const ONE = [{ name: 'p1', kind: 'keplerian', enabled: true, period_days: '211.4', projected_semimajor_axis_lt_s: '4e-5', eccentricity: 0, periastron_longitude_deg: 0, periastron_epoch_mjd: '58950.4' }];

describe('searchCompanions: threshold power per round', { timeout: 60_000 }, () => {
  const data = simulatedSearchData(ONE, { count: 300, seed: 23 });

  it.each([1e-3, 1e-2])('round-trips the threshold %s through falseAlarmBaluev in every round', (threshold) => {
    const report = searchCompanions(data.start, data.toas, data.geometry, { falseAlarmThreshold: threshold, maxCompanions: 2 });
    expect(report.periodograms.length).toBeGreaterThanOrEqual(2);
    // σ are the TOAs' own (no noise parameters), so every round has the final fit's weights and times
    const series = residualSeries(report.finalFit, data.geometry);
    for (const pg of report.periodograms) {
      const fMaxPerDay = pg.frequencyPerDay[pg.grid.count - 1];
      const fap = falseAlarmBaluev(pg.thresholdPower, series.tDays.length, fMaxPerDay, series.tDays, series.weights);
      expectWithin(fap / threshold, 1, 1e-6, `round ${pg.round}: FAP at the threshold power / threshold`);
      const peak = report.peaks.find((p) => p.round === pg.round)!;
      expect(peak.power > pg.thresholdPower, `round ${pg.round}: peak above the line ⇔ FAP below the threshold`).toBe(peak.falseAlarmProbability < threshold);
    }
    expect(report.peaks[0].power).toBeGreaterThan(report.periodograms[0].thresholdPower); // the injected companion
    expect(report.peaks[report.peaks.length - 1].power).toBeLessThan(report.periodograms[report.periodograms.length - 1].thresholdPower); // the stop
  });
});
