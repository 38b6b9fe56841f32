/**
 * `search` on the command line (docs/formats.md §4): a simulated pulsar with
 * one companion, written to files; the printed JSON has the documented keys,
 * the found companion with uncertainties keyed by its own field names, and a
 * final model that reads back as a model file.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeToaCsv } from '../../../worker/timing/toas/write-toa-csv';
import { writeModelFile } from '../../../worker/timing/model/write-model-file';
import { readModelFile } from '../../../worker/timing/model/read-model-file';
import { simulatedSearchData } from '../search/search-test-data';

const TSX = 'node_modules/.bin/tsx';
interface Run { code: number; stdout: string; stderr: string }

function cli(args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(TSX, ['worker/cli.ts', ...args], { maxBuffer: 64 * 1024 * 1024, env: { ...process.env, PULSEKEEPER_OBSERVATORIES: '' } }, (error, stdout, stderr) => {
      resolve({ code: error === null ? 0 : (typeof error.code === 'number' ? error.code : 1), stdout, stderr });
    });
  });
}

const INJECTED = { name: 'p1', kind: 'keplerian', enabled: true, period_days: '41.3', projected_semimajor_axis_lt_s: '2e-5', eccentricity: 0, periastron_longitude_deg: 0, periastron_epoch_mjd: '59003.2' };
let toasPath: string;
let modelPath: string;

beforeAll(() => {
  const data = simulatedSearchData([INJECTED], { count: 250, seed: 21 });
  const dir = mkdtempSync(join(tmpdir(), 'pk-cli-search-'));
  toasPath = join(dir, 'toas.csv');
  modelPath = join(dir, 'model.json');
  writeFileSync(toasPath, writeToaCsv(data.toas, { fractionDigits: 20 }));
  writeFileSync(modelPath, JSON.stringify(writeModelFile(data.start)));
}, 60_000);

// Each spawn starts tsx and loads DE405 (~3–5 s of CPU); under a loaded machine allow minutes.
describe.concurrent('command line: search', { timeout: 240_000 }, () => {
  it('prints peaks, the found companion with its uncertainties, and the final model', async () => {
    const run = await cli(['search', '--toas', toasPath, '--model', modelPath]);
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout);
    for (const key of ['peaks', 'companions', 'model', 'candidates', 'stop_reason', 'warnings', 'settings']) expect(out, key).toHaveProperty(key);
    expect(out.peaks).toHaveLength(2); // one per round: the companion's peak, then the one that stopped the search
    for (const peak of out.peaks) expect(Object.keys(peak)).toEqual(expect.arrayContaining(['period_days', 'power', 'false_alarm_probability']));
    expect(out.peaks[0].false_alarm_probability).toBeLessThan(1e-3);
    expect(out.peaks[1].false_alarm_probability).toBeGreaterThan(1e-3);
    expect(out.companions).toHaveLength(1);
    const found = out.companions[0];
    expect(found.kind).toBe('keplerian');
    expect(Number(found.period_days)).toBeGreaterThan(41.2);
    expect(Number(found.period_days)).toBeLessThan(41.4);
    expect(Object.keys(found.uncertainties)).toEqual(expect.arrayContaining(['period_days', 'projected_semimajor_axis_lt_s', 'periastron_epoch_mjd']));
    expect(Math.abs(Number(found.period_days) - 41.3)).toBeLessThan(3 * found.uncertainties.period_days);
    // the final model reads back and carries the companion, fitted
    const model = readModelFile(out.model);
    expect(model.companions.map((c) => c.name)).toEqual([found.name]);
    expect(model.solveFor).toContain(`companions[${found.name}].period_days`);
    expect(out.candidates[0].derived.minimum_companion_mass_earth).toBeGreaterThan(0);
    expect(out.candidates[0].chi2_change).toBeLessThan(0);
    expect(out.settings.ephemeris).toMatch(/DE405/);
    expect(out.settings.false_alarm_threshold).toBe(1e-3);
  });

  it('takes --max-companions 0 and --false-alarm: periodogram only, nothing added', async () => {
    const run = await cli(['search', '--toas', toasPath, '--model', modelPath, '--max-companions', '0', '--false-alarm', '0.01']);
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout);
    expect(out.peaks).toHaveLength(1);
    expect(out.companions).toEqual([]);
    expect(out.stop_reason).toBe('max-companions');
    expect(out.settings.false_alarm_threshold).toBe(0.01);
  });

  it.each([
    [['--min-period-days', '50', '--max-period-days', '20'], /search: --max-period-days \(20\) must be greater than --min-period-days \(50\)/],
    [['--max-companions', '1.5'], /search: --max-companions must be a whole number/],
    [['--min-period-days', '0'], /search: --min-period-days must be a number > 0/],
  ])('rejects %j with a one-line reason', async (extra, pattern) => {
    const run = await cli(['search', '--toas', toasPath, '--model', modelPath, ...(extra as string[])]);
    expect(run.code).toBe(1);
    const lines = run.stderr.trim().split('\n');
    expect(lines, run.stderr).toHaveLength(1);
    expect(lines[0]).toMatch(pattern as RegExp);
  });
});
