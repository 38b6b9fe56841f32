/**
 * The command line over the timing engine (docs/formats.md §4):
 *
 *   npm run --silent cli -- fit      --toas F.csv --model M.json [--max-iterations K] [--jupiter-shapiro]
 *   npm run --silent cli -- delays   --toas F.csv --model M.json [--jupiter-shapiro]
 *   npm run --silent cli -- simulate --model M.json --start-mjd A --end-mjd B --count N
 *                                    --observatory CODE --uncertainty-us S
 *                                    [--frequency-mhz F] [--seed K] [--pulse-numbers] [--jupiter-shapiro]
 *   npm run --silent cli -- search   --toas F.csv --model M.json [--min-period-days A] [--max-period-days B]
 *                                    [--max-companions K] [--false-alarm P] [--pulsar-mass-solar M]
 *                                    [--max-iterations K] [--jupiter-shapiro]
 *
 * Results go to stdout (JSON; CSV for `simulate`). Problems go to stderr as one
 * line naming the option, file, row or parameter, with exit code 1; a fit that
 * does not converge prints its result and exits with code 2 and the last χ² (for `search`: the
 * final fit).
 */
import { readFileSync } from 'node:fs';
import { resolve as resolvePath } from 'node:path';
import { parseArgs } from 'node:util';
import { TimingInputError } from './timing/engine-error';
import { readModelText } from './timing/model/read-model-file';
import { fitReportJson } from './timing/run-timing-fit';
import type { TimingModel } from './timing/model/timing-model';
import { readToaCsv, formatToaFileErrors } from './timing/toas/read-toa-csv';
import { writeToaCsv } from './timing/toas/write-toa-csv';
import type { Toa } from './timing/toas/toa';
import { loadObservatories } from './timing/earth/read-observatories';
import type { Observatory } from './timing/earth/observatory';
import { fitTimingModel } from './timing/pipeline/fit-timing-model';
import { computeArrivalGeometry } from './timing/pipeline/compute-arrival-geometry';
import { timingDelayReport } from './timing/pipeline/timing-delay-report';
import { simulateToas } from './timing/simulate/simulate-toas';
import { parseMjd } from './timing/time/mjd-string';
import { checkFitRequest } from './timing/pipeline/fit-prepared-arrivals';
import { searchCompanions } from './timing/search/companion-search';
import { searchReportJson } from './timing/search/search-report-json';

/** A problem the user can fix; printed as one line, exit code 1 (or `exitCode`). */
class CliError extends Error {
  constructor(message: string, readonly exitCode = 1) {
    super(message);
  }
}

type Output = { stdout: string; exitCode: number; stderr?: string };

const FILE_OPTIONS: OptionSpec = { toas: { type: 'string' }, model: { type: 'string' }, 'jupiter-shapiro': { type: 'boolean' } };

type OptionSpec = Record<string, { type: 'string' | 'boolean' }>;
type OptionValues = Record<string, string | boolean | undefined>;

function parseCommandArgs(command: string, args: string[], options: OptionSpec): OptionValues {
  try {
    return parseArgs({ args, options, strict: true, allowPositionals: false }).values as OptionValues;
  } catch (error) {
    const reason = (error as Error).message.split('\n')[0];
    throw new CliError(`${command}: ${reason}`);
  }
}

function requireOption(command: string, values: Record<string, unknown>, name: string): string {
  const value = values[name];
  if (typeof value !== 'string' || value === '') throw new CliError(`${command}: missing required option --${name}`);
  return value;
}

function readTextFile(option: string, path: string): string {
  try {
    // `npm run cli` runs in the package root; relative paths mean the caller's folder (npm's INIT_CWD).
    return readFileSync(resolvePath(process.env.INIT_CWD ?? process.cwd(), path), 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a directory' : code ?? (error as Error).message;
    throw new CliError(`--${option} ${path}: cannot read the file (${reason})`);
  }
}

function readModel(path: string): TimingModel {
  const text = readTextFile('model', path);
  try {
    return readModelText(text);
  } catch (error) {
    if (error instanceof TimingInputError) throw new CliError(`--model ${path}: ${error.message}`);
    throw error;
  }
}

function readToas(path: string, observatories: ReadonlyMap<string, Observatory>): Toa[] {
  const text = readTextFile('toas', path);
  const result = readToaCsv(text, { knownObservatories: new Set(observatories.keys()) });
  if (!result.ok) {
    const first = formatToaFileErrors(result.errors)[0] ?? 'unreadable file';
    const more = result.errorCount > 1 ? ` (${result.errorCount} errors in total)` : ' (1 error)';
    throw new CliError(`--toas ${path}: ${first}${more}`);
  }
  return result.toas;
}

function parseNumberOption(command: string, name: string, text: string, rule: (x: number) => boolean, ruleText: string): number {
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value) || !rule(value)) throw new CliError(`${command}: --${name} must be ${ruleText}, got "${text}"`);
  return value;
}

function runFit(args: string[]): Output {
  const values = parseCommandArgs('fit', args, { ...FILE_OPTIONS, 'max-iterations': { type: 'string' } });
  const model = readModel(requireOption('fit', values, 'model'));
  const observatories = loadObservatories();
  const toas = readToas(requireOption('fit', values, 'toas'), observatories);
  const maxIterations = values['max-iterations'] === undefined
    ? undefined
    : parseNumberOption('fit', 'max-iterations', values['max-iterations'] as string, (x) => Number.isInteger(x) && x >= 1, 'a whole number ≥ 1');
  const fit = fitTimingModel(model, toas, observatories, { maxIterations, includeJupiterShapiro: values['jupiter-shapiro'] === true });
  const output = fitReportJson(fit);
  const stdout = `${JSON.stringify(output, null, 2)}\n`;
  if (!fit.converged) {
    return { stdout, exitCode: 2, stderr: `fit: did not converge after ${fit.iterations} iterations; last χ² = ${fit.chi2}` };
  }
  return { stdout, exitCode: 0 };
}

function runDelays(args: string[]): Output {
  const values = parseCommandArgs('delays', args, FILE_OPTIONS);
  const model = readModel(requireOption('delays', values, 'model'));
  const observatories = loadObservatories();
  const toas = readToas(requireOption('delays', values, 'toas'), observatories);
  const geometry = computeArrivalGeometry(toas, observatories);
  const rows = timingDelayReport(model, toas, geometry, { includeJupiterShapiro: values['jupiter-shapiro'] === true });
  return { stdout: `${JSON.stringify(rows, null, 2)}\n`, exitCode: 0 };
}

function runSimulate(args: string[]): Output {
  const values = parseCommandArgs('simulate', args, {
    model: { type: 'string' },
    'start-mjd': { type: 'string' },
    'end-mjd': { type: 'string' },
    count: { type: 'string' },
    observatory: { type: 'string' },
    'uncertainty-us': { type: 'string' },
    'frequency-mhz': { type: 'string' },
    seed: { type: 'string' },
    'pulse-numbers': { type: 'boolean' },
    'jupiter-shapiro': { type: 'boolean' },
  });
  const model = readModel(requireOption('simulate', values, 'model'));
  const mjdOption = (name: string) => {
    const text = requireOption('simulate', values, name);
    try {
      return parseMjd(text);
    } catch {
      throw new CliError(`simulate: --${name} must be a decimal MJD, got "${text}"`);
    }
  };
  const startMjd = mjdOption('start-mjd');
  const endMjd = mjdOption('end-mjd');
  const count = parseNumberOption('simulate', 'count', requireOption('simulate', values, 'count'), (x) => Number.isInteger(x) && x >= 1, 'a whole number ≥ 1');
  const uncertaintyUs = parseNumberOption('simulate', 'uncertainty-us', requireOption('simulate', values, 'uncertainty-us'), (x) => x > 0, 'a number > 0');
  const frequencyText = values['frequency-mhz'] as string | undefined;
  const frequencyMhz = frequencyText === undefined ? undefined
    : frequencyText === 'inf' ? Infinity
    : parseNumberOption('simulate', 'frequency-mhz', frequencyText, (x) => x > 0, 'a number > 0 (or inf)');
  const seed = values.seed === undefined ? 1 : parseNumberOption('simulate', 'seed', values.seed as string, Number.isSafeInteger, 'a whole number');
  const observatories = loadObservatories();
  const observatory = requireOption('simulate', values, 'observatory');
  if (!observatories.has(observatory) && observatory !== 'ssb' && observatory !== 'geocenter') {
    throw new CliError(`simulate: --observatory "${observatory}" is not a registered observatory (known: ${[...observatories.keys(), 'ssb', 'geocenter'].join(', ')})`);
  }
  const result = simulateToas(model, { startMjd, endMjd, count, observatory, uncertaintyUs, frequencyMhz, seed, withPulseNumbers: values['pulse-numbers'] === true, includeJupiterShapiro: values['jupiter-shapiro'] === true }, observatories);
  const comments = [
    `simulated from the model of ${model.pulsar}: ${count} TOAs at ${observatory}, seed ${seed}, noise ${uncertaintyUs} us`,
    ...result.warnings,
  ];
  return { stdout: writeToaCsv(result.toas, { fractionDigits: 20, comments }), exitCode: 0 };
}

function runSearch(args: string[]): Output {
  const values = parseCommandArgs('search', args, {
    ...FILE_OPTIONS,
    'min-period-days': { type: 'string' },
    'max-period-days': { type: 'string' },
    'max-companions': { type: 'string' },
    'false-alarm': { type: 'string' },
    'pulsar-mass-solar': { type: 'string' },
    'max-iterations': { type: 'string' },
  });
  const model = readModel(requireOption('search', values, 'model'));
  const observatories = loadObservatories();
  const toas = readToas(requireOption('search', values, 'toas'), observatories);
  const optional = (name: string, rule: (x: number) => boolean, ruleText: string): number | undefined =>
    values[name] === undefined ? undefined : parseNumberOption('search', name, values[name] as string, rule, ruleText);
  const minPeriodDays = optional('min-period-days', (x) => x > 0, 'a number > 0');
  const maxPeriodDays = optional('max-period-days', (x) => x > 0, 'a number > 0');
  if (minPeriodDays !== undefined && maxPeriodDays !== undefined && !(maxPeriodDays > minPeriodDays)) {
    throw new CliError(`search: --max-period-days (${maxPeriodDays}) must be greater than --min-period-days (${minPeriodDays})`);
  }
  const maxCompanions = optional('max-companions', (x) => Number.isInteger(x) && x >= 0 && x <= 25, 'a whole number from 0 to 25');
  const falseAlarmThreshold = optional('false-alarm', (x) => x > 0 && x < 1, 'a probability between 0 and 1 (exclusive)');
  const pulsarMassSolar = optional('pulsar-mass-solar', (x) => x > 0, 'a number > 0');
  const maxIterations = optional('max-iterations', (x) => Number.isInteger(x) && x >= 1, 'a whole number ≥ 1');
  checkFitRequest(model, toas);
  const geometry = computeArrivalGeometry(toas, observatories);
  const report = searchCompanions(model, toas, geometry, {
    minPeriodDays, maxPeriodDays, maxCompanions, falseAlarmThreshold, pulsarMassSolar,
    fitOptions: { maxIterations, includeJupiterShapiro: values['jupiter-shapiro'] === true },
  });
  const stdout = `${JSON.stringify(searchReportJson(report), null, 2)}\n`;
  if (!report.finalFit.converged) {
    return { stdout, exitCode: 2, stderr: `search: the final fit did not converge after ${report.finalFit.iterations} iterations; last χ² = ${report.finalFit.chi2}` };
  }
  return { stdout, exitCode: 0 };
}

const COMMANDS: Record<string, (args: string[]) => Output> = {
  fit: runFit,
  delays: runDelays,
  simulate: runSimulate,
  search: runSearch,
};

/** Runs one command line (without the program name); returns what to print and the exit code. */
export function runCli(argv: string[]): Output {
  const [command, ...args] = argv;
  try {
    if (command === undefined) throw new CliError(`missing command (one of: ${Object.keys(COMMANDS).join(', ')})`);
    const run = COMMANDS[command];
    if (run === undefined) throw new CliError(`unknown command "${command}" (one of: ${Object.keys(COMMANDS).join(', ')})`);
    return run(args);
  } catch (error) {
    if (error instanceof CliError) return { stdout: '', exitCode: error.exitCode, stderr: error.message };
    if (error instanceof TimingInputError || error instanceof RangeError) return { stdout: '', exitCode: 1, stderr: `${command}: ${error.message.split('\n')[0]}` };
    return { stdout: '', exitCode: 70, stderr: `${command ?? 'cli'}: internal error: ${(error as Error).message?.split('\n')[0] ?? String(error)}` };
  }
}

const isMain = process.argv[1] !== undefined && /(^|[\\/])cli\.(ts|js)$/.test(process.argv[1]);
if (isMain) {
  const { stdout, stderr, exitCode } = runCli(process.argv.slice(2));
  if (stdout !== '') process.stdout.write(stdout);
  if (stderr !== undefined) process.stderr.write(`${stderr}\n`);
  process.exitCode = exitCode;
}
