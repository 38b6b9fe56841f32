import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readModelFile, readModelText } from '../../../worker/timing/model/read-model-file';
import { parseHms, parseDms } from '../../../worker/timing/model/sexagesimal';
import { parseDecimalToDd } from '../../../worker/timing/model/decimal-double-double';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { inputError } from '../helpers/input-error';

const fixture = (name: string) => readFileSync(new URL(`../../fixtures/formats/${name}`, import.meta.url), 'utf8');
const example = () => JSON.parse(fixture('example-model.json'));

describe('readModelFile: the documented example', () => {
  it('reads every key into the model', () => {
    const m = readModelFile(example());
    expect(m.pulsar).toBe('J1101-4417');
    expect(m.epochMjd).toEqual(parseMjd('58000'));
    expect(m.spin.frequencyHz).toEqual(parseDecimalToDd('287.45812645130'));
    expect(m.spin.frequencyDerivatives).toEqual([-8.1e-16, 0]);
    expect(m.astrometry.raRad).toBe(parseHms('11:01:07.4302'));
    expect(m.astrometry.decRad).toBe(parseDms('-44:17:21.880'));
    expect(m.dispersion).toEqual({ dmPcPerCm3: 41.27, dmDerivatives: [] });
    expect(m.companions).toEqual([{
      kind: 'keplerian', name: 'b', enabled: true, periodDays: 41.3, projectedSemimajorAxisLtS: 0.00085,
      eccentricity: 0, periastronLongitudeDeg: 0, periastronEpochMjd: parseMjd('58010.5'),
      periodDerivative: 0, periastronAdvanceDegPerYr: 0, einsteinDelayS: 0,
    }]);
    expect(m.offsets).toEqual([{ backend: 'wideband-2', seconds: 0 }]);
    expect(m.noise).toEqual([{ backend: 'wideband-1', uncertaintyScale: 1, addedJitterUs: 0 }]);
    expect(m.solveFor).toEqual(['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'companions[b].period_days']);
  });
  it('keeps a frequency string beyond 17 digits losslessly', () => {
    const file = example();
    file.spin.frequency_hz = '287.458126451301234567890123456';
    const f = readModelFile(file).spin.frequencyHz;
    expect(f).toEqual(parseDecimalToDd('287.458126451301234567890123456'));
    expect(f[0]).not.toBe(0);
  });
  it('fills defaults for optional sections', () => {
    const file = example();
    delete file.dispersion; delete file.companions; delete file.offsets; delete file.noise; delete file.glitches; delete file.solve_for;
    delete file.astrometry.parallax_mas;
    const m = readModelFile(file);
    expect(m.dispersion).toEqual({ dmPcPerCm3: 0, dmDerivatives: [] });
    expect([m.companions, m.offsets, m.noise, m.glitches, m.solveFor]).toEqual([[], [], [], [], []]);
    expect(m.astrometry.parallaxMas).toBe(0);
  });
  it('reads the full fixture: all companion kinds, glitches, offsets, noise', () => {
    const m = readModelFile(JSON.parse(fixture('full-model.json')));
    expect(m.companions.map((c) => c.kind)).toEqual(['keplerian', 'low-eccentricity', 'damour-deruelle']);
    expect(m.companions[0].enabled).toBe(false);
    expect(m.glitches[1]).toEqual({ epochMjd: parseMjd('59300'), phaseStepTurns: 0, frequencyStepHz: 0, frequencyDerivativeStepHzPerS: 0, decayingFrequencyStepHz: 0, decayTimeDays: 0 });
    expect(m.offsets[0].seconds).toBe(1.5e-6);
    expect(m.astrometry.decRad).toBeLessThan(0);
  });
});

describe('readModelFile: bad input, each problem with its path', () => {
  it('names unknown keys with their full path', () => {
    const file = example();
    file.companions[0].period_dayz = 3;
    file.spin.frequency_derivative = [];
    file.colour = 'blue';
    const error = inputError(() => readModelFile(file));
    expect(error.details).toEqual(expect.arrayContaining([
      { path: 'companions[0].period_dayz', message: 'unknown key' },
      { path: 'spin.frequency_derivative', message: 'unknown key' },
      { path: 'colour', message: 'unknown key' },
    ]));
    expect(error.details).toHaveLength(3);
    expect(error.message).toMatch(/: unknown key \(and 2 more\)$/);
  });
  it('names wrong types with their path', () => {
    const file = example();
    file.spin.frequency_hz = true;
    file.astrometry.pm_dec_mas_per_yr = 'fast';
    file.companions[0].enabled = 'yes';
    file.offsets = {};
    const { details } = inputError(() => readModelFile(file));
    expect(details).toEqual(expect.arrayContaining([
      { path: 'spin.frequency_hz', message: 'expected a number or a decimal string, got boolean true' },
      { path: 'astrometry.pm_dec_mas_per_yr', message: '"fast" is not a decimal number' },
      { path: 'companions[0].enabled', message: 'expected a boolean, got the string "yes"' },
      { path: 'offsets', message: 'expected an array, got an object' },
    ]));
  });
  it('names missing required keys and a wrong format tag', () => {
    const { details } = inputError(() => readModelFile({ format: 'other/2', spin: {} }));
    expect(details).toEqual([
      { path: 'format', message: 'must be "pulsekeeper-model/1"' },
      { path: 'pulsar', message: 'required key is missing' },
      { path: 'epoch_mjd', message: 'required key is missing' },
      { path: 'spin.frequency_hz', message: 'required key is missing' },
      { path: 'astrometry', message: 'required key is missing' },
    ]);
  });
  it('rejects a top level that is not an object', () => {
    expect(inputError(() => readModelFile([1, 2])).details).toEqual([{ path: '', message: 'expected an object, got an array' }]);
  });
  it('rejects an unknown companion kind, naming the kinds', () => {
    const file = example();
    file.companions[0].kind = 'circular';
    expect(inputError(() => readModelFile(file)).details).toEqual([
      { path: 'companions[0].kind', message: 'unknown kind the string "circular"; one of "keplerian", "low-eccentricity", "damour-deruelle"' },
    ]);
  });
  it('rejects a companion without a kind', () => {
    const file = example();
    delete file.companions[0].kind;
    expect(inputError(() => readModelFile(file)).details).toEqual([
      { path: 'companions[0].kind', message: 'required key is missing; one of "keplerian", "low-eccentricity", "damour-deruelle"' },
    ]);
  });
  it('rejects duplicate companion names, naming both entries', () => {
    const file = example();
    file.companions.push({ ...file.companions[0] });
    const error = inputError(() => readModelFile(file));
    expect(error.details).toEqual([{ path: 'companions[1].name', message: 'duplicate companion name "b" (also companions[0])' }]);
    expect(error.message).toBe('companions[1].name: duplicate companion name "b" (also companions[0])');
  });
  it('rejects duplicate offset and noise backends', () => {
    const file = example();
    file.offsets.push({ backend: 'wideband-2', seconds: 1 });
    file.noise.push({ backend: 'wideband-1' });
    expect(inputError(() => readModelFile(file)).details).toEqual([
      { path: 'offsets[1].backend', message: 'duplicate offset backend "wideband-2" (also offsets[0])' },
      { path: 'noise[1].backend', message: 'duplicate noise backend "wideband-1" (also noise[0])' },
    ]);
  });
  it.each([
    [1, 'must be < 1 (got 1)'],
    [-0.1, 'must be ≥ 0 (got -0.1)'],
    ['1.5', 'must be < 1 (got 1.5)'],
  ])('rejects eccentricity %j', (value, message) => {
    const file = example();
    file.companions[0].eccentricity = value;
    expect(inputError(() => readModelFile(file)).details).toEqual([{ path: 'companions[0].eccentricity', message }]);
  });
  it('rejects a low-eccentricity orbit whose e_sin_omega, e_cos_omega give e ≥ 1', () => {
    const file = example();
    file.companions[0] = { name: 'c', kind: 'low-eccentricity', period_days: 1, projected_semimajor_axis_lt_s: 1, ascending_node_epoch_mjd: '58000', e_sin_omega: 0.8, e_cos_omega: 0.8 };
    file.solve_for = [];
    expect(inputError(() => readModelFile(file)).details[0].path).toBe('companions[0].e_sin_omega');
  });
  it('checks ranges: period > 0, frequency > 0, declination, right ascension, noise', () => {
    const file = example();
    file.companions[0].period_days = 0;
    file.spin.frequency_hz = '-1';
    file.astrometry.dec_dms = '+91:00:00';
    file.astrometry.ra_hms = '24:00:00';
    file.noise[0].uncertainty_scale = 0;
    file.noise[0].added_jitter_us = -1;
    const paths = inputError(() => readModelFile(file)).details.map((d) => d.path);
    expect(paths.sort()).toEqual([
      'astrometry.dec_dms', 'astrometry.ra_hms', 'companions[0].period_days',
      'noise[0].added_jitter_us', 'noise[0].uncertainty_scale', 'spin.frequency_hz',
    ]);
  });
  it('keeps the sign of a negative-zero-degree declination', () => {
    const file = example();
    file.astrometry.dec_dms = '-00:30:00';
    expect(readModelFile(file).astrometry.decRad).toBe(-parseDms('+00:30:00'));
  });
  it('rejects an epoch with an exponent (not a plain decimal MJD)', () => {
    const file = example();
    file.epoch_mjd = '5.8e4';
    expect(inputError(() => readModelFile(file)).details).toEqual([
      { path: 'epoch_mjd', message: '"5.8e4" is not a plain decimal MJD (digits and an optional point, no exponent)' },
    ]);
  });
  it('accepts numbers where strings are usual', () => {
    const file = example();
    file.epoch_mjd = 58000.5;
    file.spin.frequency_hz = 287.5;
    const m = readModelFile(file);
    expect(m.epochMjd).toEqual(parseMjd('58000.5'));
    expect(m.spin.frequencyHz).toEqual([0, 287.5]);
  });
});

describe('readModelFile: solve_for paths must exist in this model', () => {
  it('lists every bad path with the reason', () => {
    const file = example();
    file.solve_for = [
      'companions[c].period_days',
      'spin.frequency_derivatives[2]',
      'offsets[wideband-1].seconds',
      'noise[wideband-1].uncertainty_scale',
      'companions[b].e_sin_omega',
      'astrometry.ra',
      'spin.frequency_derivatives[01]',
      'spin.frequency_hz',
    ];
    const { details } = inputError(() => readModelFile(file));
    expect(details).toEqual([
      { path: 'solve_for[0]', message: '"companions[c].period_days": the model has no companion named "c"' },
      { path: 'solve_for[1]', message: '"spin.frequency_derivatives[2]": the model has 2 spin frequency derivatives (no index 2)' },
      { path: 'solve_for[2]', message: '"offsets[wideband-1].seconds": the model has no offset for backend "wideband-1"' },
      { path: 'solve_for[3]', message: '"noise[wideband-1].uncertainty_scale": noise settings are not fit parameters' },
      { path: 'solve_for[4]', message: '"companions[b].e_sin_omega": a keplerian companion has no numeric key "e_sin_omega"' },
      { path: 'solve_for[5]', message: '"astrometry.ra": astrometry has no numeric key "ra"' },
      { path: 'solve_for[6]', message: '"spin.frequency_derivatives[01]": not a parameter path (see docs/formats.md, "Parameter paths")' },
    ]);
  });
  it('rejects a path listed twice', () => {
    const file = example();
    file.solve_for = ['spin.frequency_hz', 'offsets[wideband-2].seconds', 'spin.frequency_hz'];
    expect(inputError(() => readModelFile(file)).details).toEqual([{ path: 'solve_for[2]', message: '"spin.frequency_hz" is listed twice' }]);
  });
  it('accepts every path of the full fixture', () => {
    expect(() => readModelFile(JSON.parse(fixture('full-model.json')))).not.toThrow();
  });
});

describe('readModelText', () => {
  it('reports a JSON syntax error with line and column', () => {
    const error = inputError(() => readModelText('{\n  "format": "pulsekeeper-model/1",\n  "pulsar" "x"\n}'));
    expect(error.message).toMatch(/^line 3, column 12: the model file is not valid JSON/);
    expect(error.details[0].line).toBe(3);
  });
  it('reports truncated JSON at its end', () => {
    expect(inputError(() => readModelText('{\n  "format": 1,\n')).message).toMatch(/^line 3, column 1: /);
  });
  it('reads text with a byte-order mark', () => {
    expect(readModelText(`\uFEFF${fixture('example-model.json')}`).pulsar).toBe('J1101-4417');
  });
});
