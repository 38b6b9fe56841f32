import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { TimingInputError } from '../../../worker/timing/engine-error';
import { readModelFile } from '../../../worker/timing/model/read-model-file';
import { allParameterPaths, parameterHandle } from '../../../worker/timing/model/parameter-paths';
import { parseDecimalToDd } from '../../../worker/timing/model/decimal-double-double';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { expectWithin } from '../time/expect-within';

const full = () => readModelFile(JSON.parse(readFileSync(new URL('../../fixtures/formats/full-model.json', import.meta.url), 'utf8')));

describe('allParameterPaths', () => {
  it('lists every adjustable numeric field of the full fixture, in file order', () => {
    const paths = allParameterPaths(full());
    expect(paths.slice(0, 11)).toEqual([
      'spin.frequency_hz', 'spin.frequency_derivatives[0]', 'spin.frequency_derivatives[1]',
      'astrometry.ra_hms', 'astrometry.dec_dms', 'astrometry.pm_ra_cosdec_mas_per_yr', 'astrometry.pm_dec_mas_per_yr', 'astrometry.parallax_mas',
      'dispersion.dm_pc_per_cm3', 'dispersion.dm_derivatives[0]', 'dispersion.dm_derivatives[1]',
    ]);
    expect(paths.filter((p) => p.startsWith('companions[inner]'))).toHaveLength(8);
    expect(paths.filter((p) => p.startsWith('companions[wide]'))).toEqual([
      'companions[wide].period_days', 'companions[wide].projected_semimajor_axis_lt_s', 'companions[wide].ascending_node_epoch_mjd',
      'companions[wide].e_sin_omega', 'companions[wide].e_cos_omega', 'companions[wide].period_derivative',
    ]);
    expect(paths.filter((p) => p.startsWith('companions[tight]'))).toHaveLength(10);
    expect(paths).toContain('offsets[wideband-2].seconds');
    expect(paths.filter((p) => p.startsWith('glitches['))).toHaveLength(12);
    expect(paths.some((p) => p.startsWith('noise'))).toBe(false);
    expect(new Set(paths).size).toBe(paths.length);
  });
  it('every listed path has a handle whose get works', () => {
    const m = full();
    for (const path of allParameterPaths(m)) {
      const value = parameterHandle(m, path).get(m);
      expect(Number.isFinite(value[1]), path).toBe(true);
    }
  });
});

describe('parameterHandle', () => {
  it('gets and sets the spin frequency in double-double Hz', () => {
    const m = full();
    const h = parameterHandle(m, 'spin.frequency_hz');
    expect([h.internalUnit, h.fileUnit]).toEqual(['Hz', 'Hz']);
    expect(h.get(m)).toEqual(parseDecimalToDd('173.687946184226345678901234567'));
    h.set(m, parseDecimalToDd('173.5'));
    expect(m.spin.frequencyHz).toEqual([0, 173.5]);
    expect(h.formatValue(parseDecimalToDd('173.687946184226345678901234567'))).toBe('173.687946184226345678901234567');
  });
  it('prints a float64 parameter as its shortest round-trip text, not the binary expansion', () => {
    const m = full();
    const dm = parameterHandle(m, 'dispersion.dm_pc_per_cm3');
    expect(dm.formatValue([0, 48.3])).toBe('48.3');
    expect(dm.formatValue(parseDecimalToDd('48.3'))).toBe('48.3'); // a fit value carried in double-double
    expect(parameterHandle(m, 'spin.frequency_derivatives[0]').formatValue([0, -4.0856813781514973e-16])).toBe('-4.0856813781514973e-16');
  });
  it('names derivative units by order', () => {
    const m = full();
    expect(parameterHandle(m, 'spin.frequency_derivatives[0]').internalUnit).toBe('Hz/s');
    expect(parameterHandle(m, 'spin.frequency_derivatives[1]').internalUnit).toBe('Hz/s^2');
    expect(parameterHandle(m, 'dispersion.dm_derivatives[1]').internalUnit).toBe('pc/cm^3/yr^2');
  });
  it('converts right-ascension and declination uncertainties to seconds of time and arcseconds', () => {
    const m = full();
    const ra = parameterHandle(m, 'astrometry.ra_hms');
    const dec = parameterHandle(m, 'astrometry.dec_dms');
    expect([ra.internalUnit, ra.fileUnit, dec.internalUnit, dec.fileUnit]).toEqual(['rad', 's (of time)', 'rad', 'arcsec']);
    // definitions: π rad = 12 h = 43 200 s of time = 180° = 648 000″
    expectWithin(ra.toFileUncertainty(Math.PI / 43_200), 1, 1e-15, 'RA sigma (s)');
    expectWithin(dec.toFileUncertainty(Math.PI / 648_000), 1, 1e-15, 'dec sigma (arcsec)');
    expect(ra.formatValue(ra.get(m))).toBe('23:59:59.999999');
    expect(dec.formatValue(dec.get(m))).toBe('-00:30:00.5');
  });
  it('keeps right ascension in [0, 2π) when a fit steps past 0', () => {
    const m = full();
    parameterHandle(m, 'astrometry.ra_hms').set(m, [0, -1e-9]);
    expectWithin(m.astrometry.raRad, 2 * Math.PI - 1e-9, 1e-15, 'RA (rad)');
  });
  it('reads and writes epochs as MJD days in double-double', () => {
    const m = full();
    const h = parameterHandle(m, 'companions[wide].ascending_node_epoch_mjd');
    expect(h.internalUnit).toBe('MJD days');
    const days = h.get(m);
    expect(days[1]).toBe(59000);
    expectWithin(days[0], 1e-15, 1e-30, 'fraction part (days)');
    h.set(m, [0.25, 59001]);
    expect(m.companions[1].kind === 'low-eccentricity' && m.companions[1].ascendingNodeEpochMjd).toEqual(parseMjd('59001.25'));
  });
  it('addresses companions and offsets by name, glitches by index', () => {
    const m = full();
    parameterHandle(m, 'companions[tight].shapiro_shape').set(m, [0, 0.5]);
    parameterHandle(m, 'offsets[narrow].seconds').set(m, [0, 2e-6]);
    parameterHandle(m, 'glitches[1].decay_time_days').set(m, [0, 12]);
    expect(m.companions[2].kind === 'damour-deruelle' && m.companions[2].shapiroShape).toBe(0.5);
    expect(m.offsets[1]).toEqual({ backend: 'narrow', seconds: 2e-6 });
    expect(m.glitches[1].decayTimeDays).toBe(12);
    expect(parameterHandle(m, 'offsets[narrow].seconds').fileUnit).toBe('s');
  });
  it.each([
    ['companions[nobody].period_days', 'the model has no companion named "nobody"'],
    ['glitches[2].epoch_mjd', 'the model has 2 glitches (no index 2)'],
    ['noise[wideband-1].added_jitter_us', 'noise settings are not fit parameters'],
    ['epoch_mjd', 'not a parameter path (see docs/formats.md, "Parameter paths")'],
  ])('throws TimingInputError naming %s', (path, reason) => {
    const m = full();
    expect(() => parameterHandle(m, path)).toThrow(TimingInputError);
    expect(() => parameterHandle(m, path)).toThrow(`${path}: ${reason}`);
  });
});
