/**
 * The fit's view of a timing model: every numeric field a fit could adjust,
 * addressed by the path written in `solve_for` (docs/formats.md §2, "Parameter
 * paths"), with get/set in an internal unit and conversion of uncertainties to
 * the unit of the file key.
 *
 * Paths: dotted keys, `[k]` for an array index (no leading zeros), `[name]` for
 * a companion by name or an offset by backend. Epoch-valued fields read and
 * write as MJD days in double-double (day + fraction).
 */
import type { DoubleDouble, Mjd } from '../time/epoch';
import { ddAddNumber, ddToNumber } from '../time/double-double-typed';
import { mjdFromParts } from '../time/mjd-arithmetic';
import { TimingInputError } from '../engine-error';
import type { Companion, TimingModel } from './timing-model';
import { formatDoubleDouble } from './decimal-double-double';
import { formatDms, formatHms } from './sexagesimal';

export interface ParameterHandle {
  path: string; // as in solve_for
  internalUnit: string; // unit of get/set
  fileUnit: string; // unit of the file key and of the reported uncertainty
  get(m: TimingModel): DoubleDouble;
  set(m: TimingModel, value: DoubleDouble): void;
  toFileUncertainty(sigmaInternal: number): number;
  formatValue(value: DoubleDouble): string;
}

const SECONDS_OF_TIME_PER_RAD = 43_200 / Math.PI; // 12 h of time per π rad: definition of hour angle
const ARCSECONDS_PER_RAD = 648_000 / Math.PI; // 180·3600″ per π rad: definition of the degree

type Kind = Companion['kind'];
interface CompanionField { fileKey: string; modelKey: string; unit: string; epoch: boolean; kinds: readonly Kind[] }

const ALL_KINDS: readonly Kind[] = ['keplerian', 'low-eccentricity', 'damour-deruelle'];
const ECCENTRIC_KINDS: readonly Kind[] = ['keplerian', 'damour-deruelle'];

/** Numeric companion keys in file order; `kinds` lists the companion kinds that carry each. */
export const COMPANION_PARAMETER_FIELDS: readonly CompanionField[] = [
  { fileKey: 'period_days', modelKey: 'periodDays', unit: 'days', epoch: false, kinds: ALL_KINDS },
  { fileKey: 'projected_semimajor_axis_lt_s', modelKey: 'projectedSemimajorAxisLtS', unit: 'lt-s', epoch: false, kinds: ALL_KINDS },
  { fileKey: 'eccentricity', modelKey: 'eccentricity', unit: '', epoch: false, kinds: ECCENTRIC_KINDS },
  { fileKey: 'periastron_longitude_deg', modelKey: 'periastronLongitudeDeg', unit: 'deg', epoch: false, kinds: ECCENTRIC_KINDS },
  { fileKey: 'periastron_epoch_mjd', modelKey: 'periastronEpochMjd', unit: 'MJD days', epoch: true, kinds: ECCENTRIC_KINDS },
  { fileKey: 'ascending_node_epoch_mjd', modelKey: 'ascendingNodeEpochMjd', unit: 'MJD days', epoch: true, kinds: ['low-eccentricity'] },
  { fileKey: 'e_sin_omega', modelKey: 'eSinOmega', unit: '', epoch: false, kinds: ['low-eccentricity'] },
  { fileKey: 'e_cos_omega', modelKey: 'eCosOmega', unit: '', epoch: false, kinds: ['low-eccentricity'] },
  { fileKey: 'period_derivative', modelKey: 'periodDerivative', unit: '', epoch: false, kinds: ALL_KINDS },
  { fileKey: 'periastron_advance_deg_per_yr', modelKey: 'periastronAdvanceDegPerYr', unit: 'deg/yr', epoch: false, kinds: ECCENTRIC_KINDS },
  { fileKey: 'einstein_delay_s', modelKey: 'einsteinDelayS', unit: 's', epoch: false, kinds: ECCENTRIC_KINDS },
  { fileKey: 'shapiro_range_s', modelKey: 'shapiroRangeS', unit: 's', epoch: false, kinds: ['damour-deruelle'] },
  { fileKey: 'shapiro_shape', modelKey: 'shapiroShape', unit: '', epoch: false, kinds: ['damour-deruelle'] },
];

/** Numeric glitch keys; all are parameters. */
export const GLITCH_PARAMETER_FIELDS: readonly { fileKey: string; modelKey: string; unit: string; epoch: boolean }[] = [
  { fileKey: 'epoch_mjd', modelKey: 'epochMjd', unit: 'MJD days', epoch: true },
  { fileKey: 'phase_step_turns', modelKey: 'phaseStepTurns', unit: 'turns', epoch: false },
  { fileKey: 'frequency_step_hz', modelKey: 'frequencyStepHz', unit: 'Hz', epoch: false },
  { fileKey: 'frequency_derivative_step_hz_per_s', modelKey: 'frequencyDerivativeStepHzPerS', unit: 'Hz/s', epoch: false },
  { fileKey: 'decaying_frequency_step_hz', modelKey: 'decayingFrequencyStepHz', unit: 'Hz', epoch: false },
  { fileKey: 'decay_time_days', modelKey: 'decayTimeDays', unit: 'days', epoch: false },
];

const ASTROMETRY_SCALARS: Record<string, { modelKey: 'pmRaCosDecMasPerYr' | 'pmDecMasPerYr' | 'parallaxMas'; unit: string }> = {
  pm_ra_cosdec_mas_per_yr: { modelKey: 'pmRaCosDecMasPerYr', unit: 'mas/yr' },
  pm_dec_mas_per_yr: { modelKey: 'pmDecMasPerYr', unit: 'mas/yr' },
  parallax_mas: { modelKey: 'parallaxMas', unit: 'mas' },
};

/** An epoch as MJD days in double-double: day + fraction. */
export function mjdToDaysDd(m: Mjd): DoubleDouble {
  return ddAddNumber(m.frac, m.day);
}

/** MJD days in double-double → normal-form `Mjd` (integer part taken exactly). */
export function daysDdToMjd(days: DoubleDouble): Mjd {
  const wholeDays = Math.floor(days[1]);
  return mjdFromParts(wholeDays, ddAddNumber(days, -wholeDays));
}

function powerUnit(base: string, power: number): string {
  return power === 1 ? base : `${base}^${power}`;
}

function numberHandle(path: string, unit: string, read: (m: TimingModel) => number, write: (m: TimingModel, x: number) => void): ParameterHandle {
  return {
    path,
    internalUnit: unit,
    fileUnit: unit,
    get: (m) => [0, read(m)],
    set: (m, value) => write(m, ddToNumber(value)),
    toFileUncertainty: (sigma) => sigma,
    // A float64 field: its shortest round-trip text (48.3, not the 40 digits of the binary double).
    formatValue: (value) => String(ddToNumber(value)),
  };
}

function epochHandle(path: string, read: (m: TimingModel) => Mjd, write: (m: TimingModel, x: Mjd) => void): ParameterHandle {
  return {
    path,
    internalUnit: 'MJD days',
    fileUnit: 'days',
    get: (m) => mjdToDaysDd(read(m)),
    set: (m, value) => write(m, daysDdToMjd(value)),
    toFileUncertainty: (sigma) => sigma,
    formatValue: (value) => formatDoubleDouble(value),
  };
}

const INDEX = '(0|[1-9]\\d*)';
const SPIN_DERIVATIVE = new RegExp(`^spin\\.frequency_derivatives\\[${INDEX}\\]$`);
const DM_DERIVATIVE = new RegExp(`^dispersion\\.dm_derivatives\\[${INDEX}\\]$`);
const ASTROMETRY_KEY = /^astrometry\.([a-z_]+)$/;
const COMPANION_KEY = /^companions\[([^\]]+)\]\.([a-z_]+)$/;
const OFFSET_KEY = /^offsets\[([^\]]+)\]\.seconds$/;
const GLITCH_KEY = new RegExp(`^glitches\\[${INDEX}\\]\\.([a-z_]+)$`);

/** The handle for `path`, or the reason this model has no such parameter. */
function resolveParameter(model: TimingModel, path: string): ParameterHandle | string {
  if (path === 'spin.frequency_hz') {
    return {
      path,
      internalUnit: 'Hz',
      fileUnit: 'Hz',
      get: (m) => m.spin.frequencyHz,
      set: (m, value) => { m.spin.frequencyHz = value; },
      toFileUncertainty: (sigma) => sigma,
      formatValue: (value) => formatDoubleDouble(value),
    };
  }
  let match = SPIN_DERIVATIVE.exec(path);
  if (match !== null) {
    const k = Number(match[1]);
    if (k >= model.spin.frequencyDerivatives.length) return `the model has ${model.spin.frequencyDerivatives.length} spin frequency derivatives (no index ${k})`;
    return numberHandle(path, `Hz/${powerUnit('s', k + 1)}`, (m) => m.spin.frequencyDerivatives[k], (m, x) => { m.spin.frequencyDerivatives[k] = x; });
  }
  match = ASTROMETRY_KEY.exec(path);
  if (match !== null) return astrometryHandle(path, match[1]);
  if (path === 'dispersion.dm_pc_per_cm3') {
    return numberHandle(path, 'pc/cm^3', (m) => m.dispersion.dmPcPerCm3, (m, x) => { m.dispersion.dmPcPerCm3 = x; });
  }
  match = DM_DERIVATIVE.exec(path);
  if (match !== null) {
    const k = Number(match[1]);
    if (k >= model.dispersion.dmDerivatives.length) return `the model has ${model.dispersion.dmDerivatives.length} DM derivatives (no index ${k})`;
    return numberHandle(path, `pc/cm^3/${powerUnit('yr', k + 1)}`, (m) => m.dispersion.dmDerivatives[k], (m, x) => { m.dispersion.dmDerivatives[k] = x; });
  }
  match = COMPANION_KEY.exec(path);
  if (match !== null) return companionHandle(model, path, match[1], match[2]);
  match = OFFSET_KEY.exec(path);
  if (match !== null) {
    const backend = match[1];
    if (!model.offsets.some((o) => o.backend === backend)) return `the model has no offset for backend "${backend}"`;
    const find = (m: TimingModel) => {
      const offset = m.offsets.find((o) => o.backend === backend);
      if (offset === undefined) throw new TimingInputError(`${path}: the model has no offset for backend "${backend}"`, [{ path, message: 'no such offset' }]);
      return offset;
    };
    return numberHandle(path, 's', (m) => find(m).seconds, (m, x) => { find(m).seconds = x; });
  }
  match = GLITCH_KEY.exec(path);
  if (match !== null) return glitchHandle(model, path, Number(match[1]), match[2]);
  if (path.startsWith('noise')) return 'noise settings are not fit parameters';
  return 'not a parameter path (see docs/formats.md, "Parameter paths")';
}

function astrometryHandle(path: string, key: string): ParameterHandle | string {
  if (key === 'ra_hms') {
    return {
      path,
      internalUnit: 'rad',
      fileUnit: 's (of time)',
      get: (m) => [0, m.astrometry.raRad],
      set: (m, value) => {
        const twoPi = 2 * Math.PI;
        const rad = ddToNumber(value);
        m.astrometry.raRad = rad - Math.floor(rad / twoPi) * twoPi; // keep right ascension in [0, 2π)
      },
      toFileUncertainty: (sigma) => sigma * SECONDS_OF_TIME_PER_RAD,
      formatValue: (value) => formatHms(ddToNumber(value)),
    };
  }
  if (key === 'dec_dms') {
    return {
      path,
      internalUnit: 'rad',
      fileUnit: 'arcsec',
      get: (m) => [0, m.astrometry.decRad],
      set: (m, value) => { m.astrometry.decRad = ddToNumber(value); },
      toFileUncertainty: (sigma) => sigma * ARCSECONDS_PER_RAD,
      formatValue: (value) => formatDms(Math.max(-Math.PI / 2, Math.min(Math.PI / 2, ddToNumber(value)))),
    };
  }
  const scalar = ASTROMETRY_SCALARS[key];
  if (scalar === undefined) return `astrometry has no numeric key "${key}"`;
  const { modelKey } = scalar;
  return numberHandle(path, scalar.unit, (m) => m.astrometry[modelKey], (m, x) => { m.astrometry[modelKey] = x; });
}

function companionHandle(model: TimingModel, path: string, name: string, key: string): ParameterHandle | string {
  const companion = model.companions.find((c) => c.name === name);
  if (companion === undefined) return `the model has no companion named "${name}"`;
  const field = COMPANION_PARAMETER_FIELDS.find((f) => f.fileKey === key);
  if (field === undefined || !field.kinds.includes(companion.kind)) return `a ${companion.kind} companion has no numeric key "${key}"`;
  const find = (m: TimingModel): Record<string, unknown> => {
    const c = m.companions.find((x) => x.name === name);
    if (c === undefined) throw new TimingInputError(`${path}: the model has no companion named "${name}"`, [{ path, message: 'no such companion' }]);
    return c as unknown as Record<string, unknown>;
  };
  if (field.epoch) {
    return epochHandle(path, (m) => find(m)[field.modelKey] as Mjd, (m, x) => { find(m)[field.modelKey] = x; });
  }
  return numberHandle(path, field.unit, (m) => find(m)[field.modelKey] as number, (m, x) => { find(m)[field.modelKey] = x; });
}

function glitchHandle(model: TimingModel, path: string, index: number, key: string): ParameterHandle | string {
  if (index >= model.glitches.length) return `the model has ${model.glitches.length} glitches (no index ${index})`;
  const field = GLITCH_PARAMETER_FIELDS.find((f) => f.fileKey === key);
  if (field === undefined) return `a glitch has no numeric key "${key}"`;
  const glitch = (m: TimingModel) => m.glitches[index] as unknown as Record<string, unknown>;
  if (field.epoch) {
    return epochHandle(path, (m) => glitch(m)[field.modelKey] as Mjd, (m, x) => { glitch(m)[field.modelKey] = x; });
  }
  return numberHandle(path, field.unit, (m) => glitch(m)[field.modelKey] as number, (m, x) => { glitch(m)[field.modelKey] = x; });
}

/**
 * Why `path` is not a parameter of `model`, or null when it is.
 */
export function parameterPathProblem(model: TimingModel, path: string): string | null {
  const resolved = resolveParameter(model, path);
  return typeof resolved === 'string' ? resolved : null;
}

/**
 * The handle of one fit parameter.
 *
 * @param model  the model whose structure (companion names, array lengths) the path must match
 * @param path   a parameter path as in `solve_for`
 * Throws TimingInputError naming the path (and why) when the model has no such parameter.
 */
export function parameterHandle(model: TimingModel, path: string): ParameterHandle {
  const resolved = resolveParameter(model, path);
  if (typeof resolved === 'string') {
    throw new TimingInputError(`${path}: ${resolved}`, [{ path, message: resolved }]);
  }
  return resolved;
}

/**
 * Every parameter path of `model`, in file order: spin, astrometry, dispersion,
 * companions (by name), offsets (by backend), glitches (by index).
 */
export function allParameterPaths(model: TimingModel): string[] {
  const paths = ['spin.frequency_hz'];
  model.spin.frequencyDerivatives.forEach((_, k) => paths.push(`spin.frequency_derivatives[${k}]`));
  paths.push('astrometry.ra_hms', 'astrometry.dec_dms');
  for (const key of Object.keys(ASTROMETRY_SCALARS)) paths.push(`astrometry.${key}`);
  paths.push('dispersion.dm_pc_per_cm3');
  model.dispersion.dmDerivatives.forEach((_, k) => paths.push(`dispersion.dm_derivatives[${k}]`));
  for (const companion of model.companions) {
    for (const field of COMPANION_PARAMETER_FIELDS) {
      if (field.kinds.includes(companion.kind)) paths.push(`companions[${companion.name}].${field.fileKey}`);
    }
  }
  for (const offset of model.offsets) paths.push(`offsets[${offset.backend}].seconds`);
  model.glitches.forEach((_, k) => {
    for (const field of GLITCH_PARAMETER_FIELDS) paths.push(`glitches[${k}].${field.fileKey}`);
  });
  return paths;
}
