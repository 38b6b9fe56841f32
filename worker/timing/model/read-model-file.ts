/**
 * Reading the timing-model file (docs/formats.md §2) into a `TimingModel`.
 *
 * Three layers of checks, every problem reported with its path:
 *   1. JSON syntax (readModelText): line and column of the error;
 *   2. structure, types and ranges per key (model-file-schema.ts, zod);
 *   3. checks across keys: unique companion names, one offset and one noise
 *      entry per backend, and `solve_for` paths that exist in this model.
 */
import type { EngineErrorDetail } from '../engine-error';
import { TimingInputError } from '../engine-error';
import type { Companion, TimingModel } from './timing-model';
import type { CompanionFile, ModelFile } from './model-file-schema';
import { modelFileSchema } from './model-file-schema';
import { parseOrThrow, throwInputProblems } from './model-file-fields';
import { parameterPathProblem } from './parameter-paths';

/**
 * A parsed JSON value (the file's content) → `TimingModel`.
 *
 * @param json  the value of JSON.parse of a model file
 * @returns     the model; optional keys take their documented defaults
 * Throws TimingInputError with one `{ path, message }` detail per problem and a
 * one-line message (first problem, "(and N more)").
 */
export function readModelFile(json: unknown): TimingModel {
  const file = parseOrThrow(modelFileSchema, json);
  const model = modelFromFile(file);
  const problems = [...duplicateNameProblems(file), ...solveForProblems(model)];
  if (problems.length > 0) throwInputProblems(problems);
  return model;
}

/**
 * Model file text → `TimingModel`; a JSON syntax error is reported as
 * `line L, column C: <reason>` (1-based). A leading byte-order mark is ignored.
 */
export function readModelText(text: string): TimingModel {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let json: unknown;
  try {
    json = JSON.parse(body);
  } catch (error) {
    const reason = (error as Error).message;
    const position = /position (\d+)/.exec(reason);
    const offset = position === null ? body.length : Number(position[1]);
    const { line, column } = lineAndColumn(body, offset);
    const message = `line ${line}, column ${column}: the model file is not valid JSON (${reason.replace(/ in JSON at position \d+.*$/, '')})`;
    throw new TimingInputError(message, [{ line, message }]);
  }
  return readModelFile(json);
}

function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = text.indexOf('\n'); i !== -1 && i < offset; i = text.indexOf('\n', i + 1)) {
    line += 1;
    lineStart = i + 1;
  }
  return { line, column: offset - lineStart + 1 };
}

function companionFromFile(c: CompanionFile): Companion {
  const common = {
    name: c.name,
    enabled: c.enabled,
    periodDays: c.period_days,
    projectedSemimajorAxisLtS: c.projected_semimajor_axis_lt_s,
    periodDerivative: c.period_derivative,
  };
  if (c.kind === 'low-eccentricity') {
    return { kind: c.kind, ...common, ascendingNodeEpochMjd: c.ascending_node_epoch_mjd, eSinOmega: c.e_sin_omega, eCosOmega: c.e_cos_omega };
  }
  const eccentric = {
    ...common,
    eccentricity: c.eccentricity,
    periastronLongitudeDeg: c.periastron_longitude_deg,
    periastronEpochMjd: c.periastron_epoch_mjd,
    periastronAdvanceDegPerYr: c.periastron_advance_deg_per_yr,
    einsteinDelayS: c.einstein_delay_s,
  };
  if (c.kind === 'keplerian') return { kind: c.kind, ...eccentric };
  return { kind: c.kind, ...eccentric, shapiroRangeS: c.shapiro_range_s, shapiroShape: c.shapiro_shape };
}

function modelFromFile(file: ModelFile): TimingModel {
  return {
    pulsar: file.pulsar,
    epochMjd: file.epoch_mjd,
    spin: { frequencyHz: file.spin.frequency_hz, frequencyDerivatives: file.spin.frequency_derivatives },
    astrometry: {
      raRad: file.astrometry.ra_hms,
      decRad: file.astrometry.dec_dms,
      pmRaCosDecMasPerYr: file.astrometry.pm_ra_cosdec_mas_per_yr,
      pmDecMasPerYr: file.astrometry.pm_dec_mas_per_yr,
      parallaxMas: file.astrometry.parallax_mas,
    },
    dispersion: { dmPcPerCm3: file.dispersion.dm_pc_per_cm3, dmDerivatives: file.dispersion.dm_derivatives },
    companions: file.companions.map(companionFromFile),
    offsets: file.offsets.map((o) => ({ backend: o.backend, seconds: o.seconds })),
    noise: file.noise.map((n) => ({ backend: n.backend, uncertaintyScale: n.uncertainty_scale, addedJitterUs: n.added_jitter_us })),
    glitches: file.glitches.map((g) => ({
      epochMjd: g.epoch_mjd,
      phaseStepTurns: g.phase_step_turns,
      frequencyStepHz: g.frequency_step_hz,
      frequencyDerivativeStepHzPerS: g.frequency_derivative_step_hz_per_s,
      decayingFrequencyStepHz: g.decaying_frequency_step_hz,
      decayTimeDays: g.decay_time_days,
    })),
    solveFor: file.solve_for,
  };
}

/** One problem per repeated name, at the later entry, naming the earlier one. */
function repeatedKeyProblems(list: readonly { key: string }[], section: string, field: string, what: string): EngineErrorDetail[] {
  const firstIndex = new Map<string, number>();
  const problems: EngineErrorDetail[] = [];
  list.forEach(({ key }, index) => {
    const earlier = firstIndex.get(key);
    if (earlier === undefined) firstIndex.set(key, index);
    else problems.push({ path: `${section}[${index}].${field}`, message: `duplicate ${what} "${key}" (also ${section}[${earlier}])` });
  });
  return problems;
}

function duplicateNameProblems(file: ModelFile): EngineErrorDetail[] {
  return [
    ...repeatedKeyProblems(file.companions.map((c) => ({ key: c.name })), 'companions', 'name', 'companion name'),
    ...repeatedKeyProblems(file.offsets.map((o) => ({ key: o.backend })), 'offsets', 'backend', 'offset backend'),
    ...repeatedKeyProblems(file.noise.map((n) => ({ key: n.backend })), 'noise', 'backend', 'noise backend'),
  ];
}

function solveForProblems(model: TimingModel): EngineErrorDetail[] {
  const problems: EngineErrorDetail[] = [];
  const seen = new Set<string>();
  model.solveFor.forEach((path, index) => {
    const problem = parameterPathProblem(model, path);
    if (problem !== null) problems.push({ path: `solve_for[${index}]`, message: `"${path}": ${problem}` });
    else if (seen.has(path)) problems.push({ path: `solve_for[${index}]`, message: `"${path}" is listed twice` });
    seen.add(path);
  });
  return problems;
}
