import { describe, expect, it } from 'vitest';
import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readToaCsv } from '../../../worker/timing/toas/read-toa-csv';

const FIXTURES = 'tests/fixtures/cli';
const TSX = 'node_modules/.bin/tsx';

interface Run { code: number; stdout: string; stderr: string }

function cli(args: string[], command: [string, string[]] = [TSX, ['worker/cli.ts']]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(command[0], [...command[1], ...args], { maxBuffer: 64 * 1024 * 1024, env: { ...process.env, PULSEKEEPER_OBSERVATORIES: '' } }, (error, stdout, stderr) => {
      resolve({ code: error === null ? 0 : (typeof error.code === 'number' ? error.code : 1), stdout, stderr });
    });
  });
}

function expectOneLineError(run: Run, pattern: RegExp): void {
  expect(run.code).not.toBe(0);
  const lines = run.stderr.trim().split('\n');
  expect(lines, run.stderr).toHaveLength(1);
  expect(lines[0]).toMatch(pattern);
}

// Each spawn starts tsx and loads DE405 (~3–5 s of CPU); under a loaded 2-core machine allow minutes.
describe.concurrent('command line', { timeout: 240_000 }, () => {
  it('fit (through npm run --silent cli) prints the documented JSON keys and converges on the demo files', async () => {
    const run = await cli(['fit', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/demo-model.json`], ['npm', ['run', '--silent', 'cli', '--']]);
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout);
    for (const key of ['model', 'parameters', 'chi2', 'dof', 'reduced_chi2', 'weighted_rms_us', 'residuals', 'converged', 'iterations', 'warnings', 'settings']) {
      expect(out, key).toHaveProperty(key);
    }
    expect(out.model.format).toBe('pulsekeeper-model/1');
    expect(out.converged).toBe(true);
    expect(out.dof).toBe(40 - 6);
    expect(out.reduced_chi2).toBeGreaterThan(0.4);
    expect(out.reduced_chi2).toBeLessThan(2);
    expect(typeof out.parameters['spin.frequency_hz'].value).toBe('string');
    expect(out.parameters['spin.frequency_hz'].uncertainty).toBeGreaterThan(0);
    expect(out.residuals[0]).toEqual({ row: 1, residual_us: expect.any(Number), uncertainty_us: 1.5 });
    expect(out.settings.ephemeris).toMatch(/DE405/);
  });

  it('delays prints one object per row with the documented keys and a consistent ssb_tdb_mjd', async () => {
    const run = await cli(['delays', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/demo-model.json`]);
    expect(run.code).toBe(0);
    const rows = JSON.parse(run.stdout);
    expect(rows).toHaveLength(40);
    const keys = ['row', 'ssb_tdb_mjd', 'clock_s', 'tt_minus_utc_s', 'tdb_minus_tt_s', 'roemer_s', 'shapiro_s', 'dispersion_s', 'companions_s'];
    for (const key of keys) expect(rows[0], key).toHaveProperty(key);
    expect(Math.abs(rows[0].roemer_s)).toBeLessThan(500); // ≤ 1 au of light time (common practice)
    expect(rows[0].tt_minus_utc_s).toBe(69.184); // 37 leap seconds + 32.184 s in 2018 (IERS Bulletin C)
    // ssb_tdb_mjd = mjd + (clock + tt−utc + tdb−tt + roemer − shapiro − dispersion)/86400 (docs/formats.md §4)
    const csv = readToaCsv(await import('node:fs').then((fs) => fs.readFileSync(`${FIXTURES}/demo-toas.csv`, 'utf8')), { knownObservatories: new Set(['harrow-ridge']) });
    if (!csv.ok) throw new Error('fixture unreadable');
    const r = rows[3];
    const sumS = r.clock_s + r.tt_minus_utc_s + r.tdb_minus_tt_s + r.roemer_s - r.shapiro_s - r.dispersion_s;
    const [day, frac] = r.ssb_tdb_mjd.split('.');
    const mjd = csv.toas[3].mjd;
    const differenceS = ((Number(day) - mjd.day) + (Number(`0.${frac}`) - mjd.frac[1] - mjd.frac[0])) * 86400;
    expect(Math.abs(differenceS - sumS)).toBeLessThan(1e-6); // float parsing of the text limits this check to ~µs
  });

  it('delays --jupiter-shapiro adds Jupiter\'s Shapiro delay (tens of ns away from conjunction, common practice)', async () => {
    const args = ['delays', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/demo-model.json`];
    const [sun, both] = await Promise.all([cli(args), cli([...args, '--jupiter-shapiro'])]);
    const a = JSON.parse(sun.stdout);
    const b = JSON.parse(both.stdout);
    const jupiterS = b.map((row: { shapiro_s: number }, i: number) => row.shapiro_s - a[i].shapiro_s);
    expect(Math.max(...jupiterS.map(Math.abs))).toBeGreaterThan(1e-9);
    expect(Math.max(...jupiterS.map(Math.abs))).toBeLessThan(2e-7);
    expect(b[0].roemer_s).toBe(a[0].roemer_s);
  });

  it('simulate writes a CSV that the fit then matches with χ²/dof near 1, reproducibly from the seed', async () => {
    const args = ['simulate', '--model', `${FIXTURES}/demo-model.json`, '--start-mjd', '58000', '--end-mjd', '58900', '--count', '60', '--observatory', 'cardenal-plateau', '--uncertainty-us', '2', '--frequency-mhz', '820', '--seed', '5'];
    const [a, b] = await Promise.all([cli(args), cli(args)]);
    expect(a.code).toBe(0);
    expect(a.stdout).toBe(b.stdout);
    const parsed = readToaCsv(a.stdout, { knownObservatories: new Set(['cardenal-plateau']) });
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.toas).toHaveLength(60);
    expect(parsed.toas[0].frequencyMhz).toBe(820);
    const dir = mkdtempSync(join(tmpdir(), 'pk-cli-'));
    writeFileSync(join(dir, 'sim.csv'), a.stdout);
    const fit = await cli(['fit', '--toas', join(dir, 'sim.csv'), '--model', `${FIXTURES}/demo-model.json`]);
    expect(fit.code).toBe(0);
    const out = JSON.parse(fit.stdout);
    expect(out.weighted_rms_us).toBeGreaterThan(1);
    expect(out.weighted_rms_us).toBeLessThan(3);
  });

  it.each([
    [['fit', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/demo-model.json`, '--colour', 'red'], /Unknown option '--colour'/],
    [['fit', '--toas', `${FIXTURES}/missing.csv`, '--model', `${FIXTURES}/demo-model.json`], /--toas .*missing\.csv: cannot read the file \(no such file\)/],
    [['fit', '--model', `${FIXTURES}/demo-model.json`], /missing required option --toas/],
    [['delays', '--toas', `${FIXTURES}/bad-rows.csv`, '--model', `${FIXTURES}/demo-model.json`], /line 4, column uncertainty_us: .*\(2 errors in total\)/],
    [['fit', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/unknown-key-model.json`], /spin\.wobble_hz: unknown key/],
    [['delays', '--toas', `${FIXTURES}/unknown-observatory.csv`, '--model', `${FIXTURES}/demo-model.json`], /line 4, column observatory: .*moon-base-7/],
    [['delays', '--toas', `${FIXTURES}/outside-ephemeris.csv`, '--model', `${FIXTURES}/demo-model.json`], /outside the ephemeris.*rows 2, 3/],
    [['fit', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/duplicate-companion-model.json`], /duplicate companion name "b"/],
    [['fit', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/bad-solve-for-model.json`], /companions\[c\]\.period_days.*no companion named "c"/],
    [['fit', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/idle-offset-model.json`], /offsets\[nobody\]\.seconds: no TOAs from this backend/],
    [['simulate', '--model', `${FIXTURES}/demo-model.json`, '--start-mjd', '58000', '--end-mjd', '58100', '--count', '5', '--observatory', 'harrow-ridge', '--uncertainty-us', '1', '--frequency-mhz=-3'], /--frequency-mhz must be a number > 0/],
    [['simulate', '--model', `${FIXTURES}/demo-model.json`, '--start-mjd', '58000', '--end-mjd', '58100', '--count', '5', '--observatory', 'harrow-ridge', '--uncertainty-us', '0'], /--uncertainty-us must be a number > 0/],
    [['simulate', '--model', `${FIXTURES}/demo-model.json`, '--start-mjd', '58000', '--end-mjd', '58100', '--count', '5', '--observatory', 'atlantis', '--uncertainty-us', '1'], /--observatory "atlantis" is not a registered observatory/],
    [['search', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/demo-model.json`, '--false-alarm', '2'], /search: --false-alarm must be a probability between 0 and 1/],
    [['launch'], /unknown command "launch"/],
  ])('rejects %j with a one-line reason', async (args, pattern) => {
    expectOneLineError(await cli(args as string[]), pattern as RegExp);
  });

  it('exits non-zero with the last χ² when the fit does not converge', async () => {
    const run = await cli(['fit', '--toas', `${FIXTURES}/demo-toas.csv`, '--model', `${FIXTURES}/far-start-model.json`, '--max-iterations', '1']);
    expectOneLineError(run, /did not converge after 1 iterations; last χ² = \d/);
    expect(JSON.parse(run.stdout).converged).toBe(false);
  });
});
