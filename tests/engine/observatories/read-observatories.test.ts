import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtinObservatories } from '../../../worker/timing/earth/builtin-observatories';
import { loadObservatories, observatoryFileSchema, parseObservatory, parseObservatoryList } from '../../../worker/timing/earth/read-observatories';
import { compareMjd } from '../../../worker/timing/time/mjd-arithmetic';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { inputError } from '../helpers/input-error';

const site = () => ({
  code: 'test-dish',
  name: 'Test Dish',
  itrf_x_m: 4_000_000,
  itrf_y_m: 3_000_000,
  itrf_z_m: 3_950_000, // √(4² + 3² + 3.95²) Mm = 6371.97 km
  clock_corrections: [{ mjd: '58000', correction_us: 0.5 }, { mjd: 58100.5, correction_us: '-0.25' }],
});

describe('parseObservatory', () => {
  it('reads a valid observatory', () => {
    expect(parseObservatory(site())).toEqual({
      code: 'test-dish', name: 'Test Dish', itrfXM: 4e6, itrfYM: 3e6, itrfZM: 3.95e6,
      clockCorrections: [{ mjd: parseMjd('58000'), correctionUs: 0.5 }, { mjd: parseMjd('58100.5'), correctionUs: -0.25 }],
    });
  });
  it('clock corrections are optional', () => {
    const { clock_corrections: _, ...rest } = site();
    expect(parseObservatory(rest).clockCorrections).toEqual([]);
  });
  it.each(['a', 'UPPER', 'has space', 'seventeen-chars-x', 'dot.code'])('rejects code %j', (code) => {
    expect(inputError(() => parseObservatory({ ...site(), code })).details).toEqual([{ path: 'code', message: `"${code}" must be 2–16 characters of a-z, 0-9, - and _` }]);
  });
  it.each(['ssb', 'geocenter'])('rejects the reserved code %s', (code) => {
    expect(inputError(() => parseObservatory({ ...site(), code })).details[0]).toMatchObject({ path: 'code', message: expect.stringContaining('reserved') });
  });
  it('rejects a site off the Earth, saying the distance found', () => {
    expect(inputError(() => parseObservatory({ ...site(), itrf_x_m: 4_000, itrf_y_m: 3_000, itrf_z_m: 0 })).details).toEqual([
      { path: 'itrf_x_m', message: 'the site is 5.000 km from the geocentre; ITRF coordinates in metres must put it 6350–6400 km away' },
    ]);
    expect(() => parseObservatory({ ...site(), itrf_z_m: 4_100_000 })).toThrow(/6466\.065 km from the geocentre/);
  });
  it('rejects clock corrections not strictly increasing in mjd', () => {
    const bad = { ...site(), clock_corrections: [{ mjd: '58000', correction_us: 1 }, { mjd: '58000', correction_us: 2 }, { mjd: '57000', correction_us: 3 }] };
    expect(inputError(() => parseObservatory(bad)).details.map((d) => d.path)).toEqual(['clock_corrections[1].mjd', 'clock_corrections[2].mjd']);
  });
  it('rejects unknown keys and wrong types with their paths', () => {
    const { details } = inputError(() => parseObservatory({ ...site(), altitude_m: 3, name: 7, clock_corrections: [{ mjd: 'soon', correction_us: 1 }] }));
    expect(details).toEqual(expect.arrayContaining([
      { path: 'altitude_m', message: 'unknown key' },
      { path: 'name', message: 'expected a string, got number 7' },
      { path: 'clock_corrections[0].mjd', message: '"soon" is not a decimal number' },
    ]));
  });
  it('exports the schema for the API', () => {
    expect(observatoryFileSchema.safeParse(site()).success).toBe(true);
    expect(observatoryFileSchema.safeParse({ ...site(), code: 'ssb' }).success).toBe(false);
  });
});

describe('parseObservatoryList', () => {
  it('rejects repeated codes', () => {
    expect(inputError(() => parseObservatoryList([site(), site()])).details).toEqual([{ path: '[1].code', message: 'duplicate code "test-dish" (also [0])' }]);
  });
  it('names problems by index', () => {
    expect(inputError(() => parseObservatoryList([site(), { ...site(), code: 'x' }])).details[0].path).toBe('[1].code');
  });
});

describe('built-in observatories', () => {
  it('are two fictional sites on the Earth’s surface (6350–6400 km) that pass their own validation', () => {
    const sites = builtinObservatories();
    expect(sites.map((s) => s.code)).toEqual(['harrow-ridge', 'cardenal-plateau']);
    for (const s of sites) {
      const distanceKm = Math.hypot(s.itrfXM, s.itrfYM, s.itrfZM) / 1000;
      expect(distanceKm).toBeGreaterThan(6350);
      expect(distanceKm).toBeLessThan(6400);
      const asFile = {
        code: s.code, name: s.name, itrf_x_m: s.itrfXM, itrf_y_m: s.itrfYM, itrf_z_m: s.itrfZM,
        clock_corrections: s.clockCorrections.map((p) => ({ mjd: `${p.mjd.day}`, correction_us: p.correctionUs })),
      };
      expect(parseObservatory(asFile)).toEqual(s);
    }
    const clock = sites[1].clockCorrections;
    expect(clock.length).toBeGreaterThanOrEqual(2);
    clock.slice(1).forEach((p, i) => expect(compareMjd(p.mjd, clock[i].mjd)).toBe(1));
  });
  it('returns fresh objects on every call', () => {
    const a = builtinObservatories();
    a[0].name = 'changed';
    expect(builtinObservatories()[0].name).toBe('Harrow Ridge Radio Observatory');
  });
});

describe('loadObservatories', () => {
  const dir = mkdtempSync(join(tmpdir(), 'pulsekeeper-observatories-'));
  const file = (name: string, content: string) => {
    const path = join(dir, name);
    writeFileSync(path, content);
    return path;
  };
  it('gives the built-ins without PULSEKEEPER_OBSERVATORIES', () => {
    expect([...loadObservatories({}).keys()]).toEqual(['harrow-ridge', 'cardenal-plateau']);
  });
  it('adds the sites of the named file', () => {
    const sites = loadObservatories({ PULSEKEEPER_OBSERVATORIES: file('good.json', JSON.stringify([site()])) });
    expect([...sites.keys()]).toEqual(['harrow-ridge', 'cardenal-plateau', 'test-dish']);
  });
  it('names the file when it is missing, not JSON, invalid, or repeats a built-in code', () => {
    expect(() => loadObservatories({ PULSEKEEPER_OBSERVATORIES: join(dir, 'absent.json') })).toThrow(`PULSEKEEPER_OBSERVATORIES file ${join(dir, 'absent.json')}: cannot be read (ENOENT)`);
    const notJson = file('bad.json', '[{');
    expect(() => loadObservatories({ PULSEKEEPER_OBSERVATORIES: notJson })).toThrow(new RegExp(`^PULSEKEEPER_OBSERVATORIES file ${notJson}: not valid JSON`));
    const invalid = file('invalid.json', JSON.stringify([{ ...site(), itrf_z_m: 0 }]));
    const error = inputError(() => loadObservatories({ PULSEKEEPER_OBSERVATORIES: invalid }));
    expect(error.message).toMatch(new RegExp(`^PULSEKEEPER_OBSERVATORIES file ${invalid}: \\[0\\]\\.itrf_x_m: the site is 5\\d{3}\\.\\d{3} km`));
    const clash = file('clash.json', JSON.stringify([{ ...site(), code: 'harrow-ridge' }]));
    expect(() => loadObservatories({ PULSEKEEPER_OBSERVATORIES: clash })).toThrow(`PULSEKEEPER_OBSERVATORIES file ${clash}: [0].code: "harrow-ridge" is a built-in observatory code`);
  });
});
