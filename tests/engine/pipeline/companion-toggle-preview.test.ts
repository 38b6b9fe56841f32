/**
 * The browser preview of an edited model (worker/timing/pipeline/companion-toggle-preview.ts)
 * against a full re-evaluation with computeTimingResiduals: exact (< 1 ns) for companion
 * toggles and edits, spin and offset edits; first order for small astrometry and DM edits.
 * The explorer columns come from the fit job's own code (worker/jobs/fit-run-explorer.ts).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { explorerColumns, explorerPartialPaths } from '../../../worker/jobs/fit-run-explorer';
import type { Companion, TimingModel } from '../../../worker/timing/model/timing-model';
import { companionDelaysFromDaysS } from '../../../worker/timing/orbits/companion-delays';
import { preparePreview, previewResiduals, type PreviewColumns } from '../../../worker/timing/pipeline/companion-toggle-preview';
import { fitPreparedArrivals } from '../../../worker/timing/pipeline/fit-prepared-arrivals';
import { effectiveUncertaintiesS, prepareArrivals } from '../../../worker/timing/pipeline/prepared-arrivals';
import { computeTimingResiduals } from '../../../worker/timing/pipeline/timing-residuals';
import { simulateArrivals } from '../../../worker/timing/simulate/simulate-arrivals';
import { ddAddNumber } from '../../../worker/timing/time/double-double-typed';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import type { Toa } from '../../../worker/timing/toas/toa';
import { toyGeometry } from './toy-geometry';
import { toyModel } from './toy-model';

const ONE_NS_US = 1e-3;

const planet: Companion = {
  kind: 'low-eccentricity', name: 'c', enabled: true, periodDays: 97.3, projectedSemimajorAxisLtS: 0.0004, // 400 µs: less than half a spin period, no wrap
  ascendingNodeEpochMjd: parseMjd('58470.25'), eSinOmega: 0.01, eCosOmega: -0.02, periodDerivative: 0,
};

function truthModel(): TimingModel {
  const base = toyModel({
    solveFor: ['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'astrometry.ra_hms', 'astrometry.dec_dms', 'dispersion.dm_pc_per_cm3', 'companions[b].projected_semimajor_axis_lt_s'],
    offsets: [{ backend: 'narrow', seconds: 2.5e-6 }],
  });
  base.companions.push(structuredClone(planet));
  return base;
}

/** Two backends at two frequencies, optionally with pulse numbers on every row. */
function simulatedToas(model: TimingModel, withPulseNumbers: boolean): Toa[] {
  const band = (frequencyMhz: number, backend: string, seed: number) =>
    simulateArrivals(
      model,
      { startMjd: parseMjd('57900'), endMjd: parseMjd('59200'), count: 150, observatory: 'toy-site', uncertaintyUs: 1, seed, frequencyMhz, withPulseNumbers },
      toyGeometry,
    ).toas.map((t) => ({ ...t, backend }));
  const toas = [...band(820, 'wide', 3), ...band(1500, 'narrow', 4)];
  toas.forEach((t, i) => { t.row = i + 1; });
  return toas;
}

interface Setup {
  fitted: TimingModel;
  toas: Toa[];
  phaseOffsetTurns: number;
  columns: PreviewColumns;
  weights: Float64Array;
}

function setUp(withPulseNumbers: boolean): Setup {
  const truth = truthModel();
  const toas = simulatedToas(truth, withPulseNumbers);
  const geometry = toyGeometry(toas);
  const start = structuredClone(truth);
  start.spin.frequencyHz = ddAddNumber(truth.spin.frequencyHz, 2e-11);
  const fit = fitPreparedArrivals(start, toas, geometry);
  expect(fit.converged).toBe(true);
  const paths = explorerPartialPaths(fit.model);
  const c = explorerColumns(fit.model, toas, geometry, fit.phaseOffsetTurns, paths);
  const excluded = toas.map((_, i) => i % 17 === 0); // excluded TOAs only lose their weight in the preview
  const columns: PreviewColumns = {
    count: c.count,
    barycentricDaysHi: c.barycentricDaysHi,
    barycentricDaysLo: c.barycentricDaysLo,
    backend: toas.map((t) => t.backend),
    residualUs: c.residualUs,
    uncertaintyUs: c.uncertaintyUs,
    excluded,
    nearestPulse: Array.from(c.nearestPulse, (x) => x === 1),
    partials: paths.map((p, j) => ({ parameter: p.parameter, secondsPerUnit: c.partials[j] })),
  };
  const sigmas = effectiveUncertaintiesS(prepareArrivals(toas, geometry, fit.model.epochMjd), fit.model.noise);
  const weights = Float64Array.from(sigmas, (s, i) => (excluded[i] ? 0 : 1 / (s * 1e6) ** 2));
  return { fitted: fit.model, toas, phaseOffsetTurns: fit.phaseOffsetTurns, columns, weights };
}

/** Full re-evaluation of `model` (µs), the weighted mean of the not-excluded TOAs removed. */
function fullResidualsUs(s: Setup, model: TimingModel): Float64Array {
  const prepared = prepareArrivals(s.toas, toyGeometry(s.toas), model.epochMjd);
  const r = Float64Array.from(computeTimingResiduals(model, prepared, { phaseOffsetTurns: s.phaseOffsetTurns }).residualS, (x) => x * 1e6);
  let sw = 0;
  let swr = 0;
  s.weights.forEach((w, i) => { sw += w; swr += w * r[i]; });
  return r.map((x) => x - swr / sw);
}

const maxAbsDifference = (a: ArrayLike<number>, b: ArrayLike<number>) => {
  let m = 0;
  for (let i = 0; i < a.length; i += 1) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
};

type Edit = [string, (m: TimingModel) => void];
const EXACT_EDITS: Edit[] = [
  ['planet off', (m) => { m.companions[1].enabled = false; }],
  ['binary off (3.4 lt-s: many turns)', (m) => { m.companions[0].enabled = false; }],
  ['both off', (m) => { m.companions.forEach((c) => { c.enabled = false; }); }],
  ['planet period and size edited (to 4 ms: wraps)', (m) => { Object.assign(m.companions[1], { periodDays: 61.2, projectedSemimajorAxisLtS: 0.004 }); }],
  ['binary eccentricity and periastron edited', (m) => { Object.assign(m.companions[0], { eccentricity: 0.09, periastronLongitudeDeg: 40 }); }],
  ['a companion added', (m) => { m.companions.push({ ...structuredClone(planet), name: 'd', periodDays: 23.1, projectedSemimajorAxisLtS: 0.0007 }); }],
  ['spin frequency edited', (m) => { m.spin.frequencyHz = ddAddNumber(m.spin.frequencyHz, 3e-10); }],
  ['spin derivative edited', (m) => { m.spin.frequencyDerivatives[0] *= 1.001; }],
  ['an offset edited and one added', (m) => { m.offsets = [{ backend: 'narrow', seconds: 9e-6 }, { backend: 'wide', seconds: -4e-6 }]; }],
  ['a glitch added, and the planet switched off with it', (m) => {
    m.glitches.push({ epochMjd: parseMjd('58750.5'), phaseStepTurns: 0.01, frequencyStepHz: 2e-9, frequencyDerivativeStepHzPerS: 0, decayingFrequencyStepHz: 1e-9, decayTimeDays: 40 });
    m.companions[1].enabled = false;
  }],
];

describe.each([false, true])('companion toggles and exact edits (pulse numbers in the file: %s)', (withPulseNumbers) => {
  const s = setUp(withPulseNumbers);
  const prepared = preparePreview(s.columns, s.fitted);

  it('reproduces the fitted residuals for an unedited model', () => {
    const preview = previewResiduals(prepared, structuredClone(s.fitted));
    expect(maxAbsDifference(preview.residualUs, fullResidualsUs(s, s.fitted))).toBeLessThan(ONE_NS_US);
    expect(preview.firstOrder).toEqual([]);
  });

  it.each(EXACT_EDITS)('%s: equals a full re-evaluation to < 1 ns', (_name, edit) => {
    const edited = structuredClone(s.fitted);
    edit(edited);
    const preview = previewResiduals(prepared, edited);
    const full = fullResidualsUs(s, edited);
    const unchanged = fullResidualsUs(s, s.fitted);
    expect(maxAbsDifference(full, unchanged)).toBeGreaterThan(100 * ONE_NS_US); // the edit shows
    expect(maxAbsDifference(preview.residualUs, full)).toBeLessThan(ONE_NS_US);
    expect(preview.firstOrder).toEqual([]);
  });

  it('turning the planet off adds its delay to the residuals (before the mean is removed)', () => {
    const edited = structuredClone(s.fitted);
    edited.companions[1].enabled = false;
    const preview = previewResiduals(prepared, edited);
    const base = previewResiduals(prepared, s.fitted);
    const days = { reference: s.fitted.epochMjd, hi: Float64Array.from(s.columns.barycentricDaysHi), lo: Float64Array.from(s.columns.barycentricDaysLo) };
    const delayUs = Array.from(companionDelaysFromDaysS([s.fitted.companions[1]], days), (d) => d * 1e6);
    const shift = Array.from(preview.residualUs, (r, i) => r + preview.removedMeanUs - (base.residualUs[i] + base.removedMeanUs));
    expect(maxAbsDifference(shift, delayUs)).toBeLessThan(1e-4 * Math.max(...delayUs.map(Math.abs)));
    expect(preview.weightedRmsUs).toBeGreaterThan(base.weightedRmsUs);
  });
});

describe('first-order edits from the stored partials', () => {
  const s = setUp(false);
  const prepared = preparePreview(s.columns, s.fitted);
  const FIRST_ORDER: [string, (m: TimingModel) => void, string][] = [
    ['right ascension + 20 mas', (m) => { m.astrometry.raRad += 20 * 4.848e-9; }, 'astrometry.ra_hms'],
    ['declination − 30 mas', (m) => { m.astrometry.decRad -= 30 * 4.848e-9; }, 'astrometry.dec_dms'],
    ['proper motion in declination + 2 mas/yr (not fitted)', (m) => { m.astrometry.pmDecMasPerYr += 2; }, 'astrometry.pm_dec_mas_per_yr'],
    ['parallax + 1 mas (not fitted)', (m) => { m.astrometry.parallaxMas += 1; }, 'astrometry.parallax_mas'],
    ['DM + 0.002 pc/cm³', (m) => { m.dispersion.dmPcPerCm3 += 0.002; }, 'dispersion.dm_pc_per_cm3'],
    ['a second DM derivative the fit did not have', (m) => { m.dispersion.dmDerivatives.push(2e-4); }, 'dispersion.dm_derivatives[1]'],
  ];

  it.each(FIRST_ORDER)('%s: agrees with a full re-evaluation to 1%% of the change', (_name, edit, parameter) => {
    const edited = structuredClone(s.fitted);
    edit(edited);
    const preview = previewResiduals(prepared, edited);
    const full = fullResidualsUs(s, edited);
    const change = maxAbsDifference(full, fullResidualsUs(s, s.fitted));
    expect(change).toBeGreaterThan(0.05); // visible: > 50 ns
    expect(maxAbsDifference(preview.residualUs, full)).toBeLessThan(0.01 * change);
    expect(preview.firstOrder).toEqual([parameter]);
  });

  it('refuses a changed epoch and says noise edits are not previewed', () => {
    const moved = structuredClone(s.fitted);
    moved.epochMjd = parseMjd('58600');
    expect(() => previewResiduals(prepared, moved)).toThrow(/epoch/);
    const noisy = structuredClone(s.fitted);
    noisy.noise = [{ backend: 'wide', uncertaintyScale: 1.5, addedJitterUs: 0 }];
    expect(previewResiduals(prepared, noisy).notPreviewed).toEqual(['noise']);
  });
});

describe('browser safety', () => {
  it('imports no Node built-in anywhere in its module graph (only engine modules and pure packages)', () => {
    const nodeBuiltins = new Set(['fs', 'path', 'zlib', 'os', 'crypto', 'child_process', 'worker_threads', 'module', 'url', 'stream', 'buffer', 'util']);
    const seen = new Set<string>();
    const visit = (file: string) => {
      if (seen.has(file)) return;
      seen.add(file);
      const text = readFileSync(file, 'utf8');
      for (const match of text.matchAll(/^import\s[^;]*?from\s+'([^']+)'/gms)) {
        const spec = match[1];
        const builtin = spec.startsWith('node:') || nodeBuiltins.has(spec.split('/')[0]);
        expect(builtin, `${path.relative(process.cwd(), file)} imports ${spec}`).toBe(false);
        if (spec.startsWith('.')) visit(path.resolve(path.dirname(file), `${spec}.ts`));
      }
    };
    visit(path.resolve(import.meta.dirname, '../../../worker/timing/pipeline/companion-toggle-preview.ts'));
    expect(seen.size).toBeGreaterThan(5);
  });
});
