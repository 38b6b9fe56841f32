/**
 * The fit job's engine call with excluded TOAs (worker/jobs/fit-run-engine.ts,
 * worker/jobs/fit-run-explorer.ts): excluded TOAs are evaluated with the fitted
 * model but never change the fit; one the engine cannot evaluate (beyond the
 * ephemeris, unknown site) gets NaN rows instead of failing the fit.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runFitEngine, type FitEngineInput } from '../../../worker/jobs/fit-run-engine';
import { builtinObservatories } from '../../../worker/timing/earth/builtin-observatories';
import { readToaCsv } from '../../../worker/timing/toas/read-toa-csv';
import type { Toa } from '../../../worker/timing/toas/toa';
import { parseMjd } from '../../../worker/timing/time/mjd-string';

const FIXTURES = path.join(import.meta.dirname, '../../fixtures/cli');
const observatories = builtinObservatories();
const modelJson = JSON.parse(readFileSync(path.join(FIXTURES, 'demo-model.json'), 'utf8')) as Record<string, unknown>;
const read = readToaCsv(readFileSync(path.join(FIXTURES, 'demo-toas.csv')), { knownObservatories: new Set(observatories.map((o) => o.code)) });
if (!read.ok) throw new Error('demo-toas.csv does not read');
const allToas = read.toas;
const hooks = { onStage: () => {}, onIteration: () => {} };

function input(toas: Toa[], excludedToas: Toa[]): FitEngineInput {
  return { modelJson, toas, observatories, excludedToas };
}

describe('explorer output of the fit engine', () => {
  const excludedIndexes = [5, 30];
  const fittedToas = allToas.filter((_, i) => !excludedIndexes.includes(i));
  const excludedToas = excludedIndexes.map((i) => allToas[i]);
  const withExcluded = runFitEngine(input(fittedToas, excludedToas), hooks);

  it('fits exactly as without the excluded TOAs', () => {
    const alone = runFitEngine(input(fittedToas, []), hooks);
    expect(withExcluded.chi2).toBe(alone.chi2);
    expect(withExcluded.parameters).toEqual(alone.parameters);
    expect(withExcluded.explorer.excluded.count).toBe(2);
  });

  it('evaluates excluded TOAs (residuals of white-noise size) and repeats the fit’s own residuals for the fitted ones', () => {
    for (const r of withExcluded.explorer.excluded.residualUs) {
      expect(Number.isFinite(r)).toBe(true);
      expect(Math.abs(r)).toBeLessThan(10 * 1.5); // σ = 1.5 µs (demo-toas.csv header)
    }
    const worst = Math.max(...Array.from(withExcluded.explorer.fitted.residualUs, (r, i) => Math.abs(r - withExcluded.residualUs[i])));
    expect(worst).toBeLessThan(1e-3); // < 1 ns
  });

  it('keeps partials for every solve_for path and every astrometry and dispersion path, in file units', () => {
    const paths = withExcluded.explorer.partialPaths;
    expect(paths.filter((p) => p.fitted).map((p) => p.parameter)).toEqual(modelJson.solve_for);
    expect(paths.find((p) => p.parameter === 'astrometry.ra_hms')?.fileUnit).toBe('s (of time)');
    expect(paths.find((p) => p.parameter === 'astrometry.dec_dms')?.fileUnit).toBe('arcsec');
    expect(paths.map((p) => p.parameter)).toEqual(expect.arrayContaining(['astrometry.parallax_mas', 'dispersion.dm_pc_per_cm3']));
    expect(withExcluded.explorer.fitted.partials).toHaveLength(paths.length);
  });

  it('marks an excluded TOA the engine cannot evaluate with NaN instead of failing the fit', () => {
    const beyond: Toa = { ...allToas[0], row: 3, mjd: parseMjd('80000.5') }; // beyond DE405 (tests/fixtures/cli/outside-ephemeris.csv)
    const elsewhere: Toa = { ...allToas[1], row: 4, observatory: 'nowhere-site' };
    const out = runFitEngine({ ...input(fittedToas, [excludedToas[0], beyond, elsewhere]), observatories }, hooks);
    const r = Array.from(out.explorer.excluded.residualUs);
    expect(Number.isFinite(r[0])).toBe(true);
    expect(Number.isNaN(r[1])).toBe(true);
    expect(Number.isNaN(r[2])).toBe(true);
    expect(Math.abs(r[0] - withExcluded.explorer.excluded.residualUs[0])).toBeLessThan(1e-6);
  });
});
