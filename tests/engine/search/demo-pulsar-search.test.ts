/**
 * The demo check of issue 5: the search, started from the demo scenario's
 * starting model of FPG-J2208+4121 (no companions) on its simulated TOAs,
 * finds the two hidden companions (71.38 d and 283.6 d) with periods within
 * 3σ, and nothing more.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { buildDemoScenario, type DemoPulsarData } from '../../../api/db/demo-scenario/build-demo-scenario';
import { HIDDEN_COMPANIONS } from '../../../api/db/demo-scenario/demo-pulsars';
import { readModelFile } from '../../../worker/timing/model/read-model-file';
import { readToaCsv } from '../../../worker/timing/toas/read-toa-csv';
import type { Toa } from '../../../worker/timing/toas/toa';
import { computeArrivalGeometry } from '../../../worker/timing/pipeline/compute-arrival-geometry';
import { searchCompanions } from '../../../worker/timing/search/companion-search';
import type { CompanionSearchReport } from '../../../worker/timing/search/companion-search-report';
import { observatories, sigmasOff } from './search-test-data';

const HIDDEN = 'FPG-J2208+4121';
let report: CompanionSearchReport;
let allToas: Toa[];
let startModel: ReturnType<typeof readModelFile>;

function toasOf(p: DemoPulsarData): Toa[] {
  return p.batches.flatMap((b) => {
    const read = readToaCsv(b.csv, { knownObservatories: new Set(observatories.keys()) });
    if (!read.ok) throw new Error(`${b.fileName}: unreadable`);
    return read.toas;
  });
}

beforeAll(() => {
  const pulsar = buildDemoScenario().find((p) => p.name === HIDDEN);
  if (pulsar === undefined) throw new Error(`${HIDDEN} is not in the demo scenario`);
  const toas = toasOf(pulsar);
  const start = readModelFile(pulsar.startingModel);
  expect(start.companions).toEqual([]);
  report = searchCompanions(start, toas, computeArrivalGeometry(toas, observatories));
  allToas = toas;
  startModel = start;
}, 120_000);

describe(`the companion search on the demo pulsar ${HIDDEN}`, () => {
  it('recovers both hidden companions with periods within 3σ', () => {
    const found = report.candidates.filter((c) => c.status === 'accepted');
    expect(found).toHaveLength(2);
    for (const hidden of HIDDEN_COMPANIONS) {
      const period = Number(hidden.period_days);
      const match = found.find((c) => Math.abs(c.companion.periodDays - period) < 0.01 * period);
      expect(match, `companion at ${period} d`).toBeDefined();
      expect(sigmasOff(match!, 'period_days', period), `period ${period} d`).toBeLessThan(3);
      // amplitudes: the light-travel-time signals of 42 and 130 µs, to 5 %
      expect(Math.abs(match!.companion.projectedSemimajorAxisLtS / Number(hidden.projected_semimajor_axis_lt_s) - 1)).toBeLessThan(0.05);
    }
  });

  it('stops on a peak that is not significant, with a final model that carries both companions', () => {
    expect(report.peaks).toHaveLength(3);
    expect(report.stopReason).toBe('false-alarm-above-threshold');
    expect(report.peaks[2].falseAlarmProbability).toBeGreaterThan(1e-3);
    expect(report.model.companions).toHaveLength(2);
    expect(report.finalFit.converged).toBe(true);
    expect(report.settings.fit.ephemeris).toMatch(/DE405/);
    // the starting model leaves the 1.47 µs backend offset unfitted: the search says the residuals are not white
    expect(report.finalFit.reducedChi2).toBeGreaterThan(1.5);
    expect(report.warnings.join('\n')).toMatch(/reduced χ² is \d\.\d\d/);
  });

  it('still finds both after two TOAs are excluded (the first orbit fit ends at a large-χ² minimum)', () => {
    // Rows 75 and 78 left out: the circular fit of the first companion, with the second one still unmodelled
    // (χ² ≈ 1e6), stalls where its predicted gain is below χ²'s rounding; that must count as converged.
    const toas = allToas.filter((_, i) => i !== 74 && i !== 77);
    const fewer = searchCompanions(startModel, toas, computeArrivalGeometry(toas, observatories));
    expect(fewer.candidates.map((c) => c.status)).toEqual(['accepted', 'accepted']);
  }, 120_000);
});
