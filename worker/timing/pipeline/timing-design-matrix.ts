/**
 * The design matrix of the timing fit: ∂residual_i/∂parameter_j in seconds
 * per internal parameter unit (column-major n×p): analytic for spin, astrometry,
 * dispersion, offsets, companion orbits and most glitch terms; numeric
 * (Richardson-extrapolated central differences) for glitch epochs and decay times.
 */
import type { TimingModel } from '../model/timing-model';
import { parameterHandle } from '../model/parameter-paths';
import type { PreparedArrivals } from './prepared-arrivals';
import type { TimingEvaluation } from './timing-residuals';
import { curvatureTermPerMas } from '../delays/roemer-delay';
import { AU_LIGHT_SECONDS, DM_DELAY_CONSTANT_S_MHZ2, RAD_PER_MAS, SUN_MASS_SECONDS } from '../delays/physical-constants';
import { dispersionTaylorCoefficient } from '../delays/dispersion-measure-at';
import { companionDelayPartials, TIME_RATE_KEY } from '../orbits/companion-delay-partials';
import { numericDerivativeColumn } from '../fit/numeric-derivative';
import { prepareSpin, spinPhase, type SpinPhaseValue } from './spin-phase';
import { ddAddNumber } from '../time/double-double-typed';
import type { DoubleDouble } from '../time/epoch';
import { mjdDiffDays } from '../time/mjd-arithmetic';

/** The name of the implicit phase-offset parameter (turns) appended to every fit. */
export const PHASE_OFFSET_PARAMETER = 'phase_offset_turns';

const COMPANION_PATH = /^companions\[([^\]]+)\]\.([a-z_]+)$/;
const GLITCH_PATH = /^glitches\[(\d+)\]\.([a-z_]+)$/;
const SPIN_DERIVATIVE_PATH = /^spin\.frequency_derivatives\[(\d+)\]$/;
const DM_DERIVATIVE_PATH = /^dispersion\.dm_derivatives\[(\d+)\]$/;
const OFFSET_PATH = /^offsets\[([^\]]+)\]\.seconds$/;

/**
 * Fills the design matrix for `paths` (then the phase offset when asked) at the model's current values.
 *
 * @param model       the model at the linearisation point (not modified)
 * @param prepared    the arrivals (prepareArrivals)
 * @param evaluation  computeTimingResiduals(model, prepared, …) at the same point
 * @param paths       parameter paths (solve_for), one column each, in order
 * @param withPhaseOffset  append the phase-offset column (∂r/∂offset = −1/F)
 * @returns           column-major Float64Array, n × (paths.length + 1 if withPhaseOffset)
 *
 * Notes: 1. A delay D subtracted from the arrival time gives ∂r/∂p = −∂D/∂p; the Roemer delay is
 *           added, so ∂r/∂p = +∂Roemer/∂p. Spin parameters: r = (φ − N)/F grows with φ, so
 *           ∂r/∂p = (∂φ/∂p)/F (F the instantaneous frequency; the change of 1/F itself multiplies
 *           the residual and is dropped, as in Gauss–Newton).
 *        2. Astrometry: n̂ = (cos δ cos α, cos δ sin α, sin δ) at the propagated position, so
 *           ∂n̂/∂α = cos δ(−sin α, cos α, 0) and ∂n̂/∂δ = (−sin δ cos α, −sin δ sin α, cos δ); proper
 *           motion enters through α(t) = α₀ + μ_α* t/cos δ₀ and δ(t) = δ₀ + μ_δ t. The gradient with
 *           respect to n̂ includes the Roemer, curvature, solar Shapiro and Doppler-dispersion terms
 *           (delayGradient); the dependence of α(t) on δ₀ through 1/cos δ₀ is dropped (∝ μt ≲ 1e-7).
 *        3. Companion columns are analytic (orbits/companion-delay-partials.ts: one pass per companion
 *           instead of four delay evaluations per parameter). Glitch epoch and decay-time columns are
 *           numeric (worker/timing/fit/numeric-derivative.ts, ≤ 1e-6 relative) on the glitch phase
 *           alone; the other glitch columns are analytic.
 *        4. A delay that moves the barycentric time also moves the time at which the companion orbits
 *           are evaluated: the emission time changes by (1 − dΔ_c/dt) per second of barycentric delay
 *           (dΔ_c/dt ≈ 2πx/Pb, up to ~1e-3), so astrometry and dispersion columns carry that factor.
 *           The backend offset is applied after the companions (an O(offset·dΔ_c/dt) simplification).
 * References: Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, ch. 8; Edwards, Hobbs & Manchester
 *             2006, MNRAS 372, 1549.
 */
export function timingDesignMatrix(
  model: TimingModel,
  prepared: PreparedArrivals,
  evaluation: TimingEvaluation,
  paths: readonly string[],
  withPhaseOffset: boolean,
): Float64Array {
  const n = prepared.count;
  const p = paths.length + (withPhaseOffset ? 1 : 0);
  const design = new Float64Array(n * p);
  const needsRate = paths.some((path) => path.startsWith('astrometry.') || path.startsWith('dispersion.'));
  const orbital = companionPartialsFor(model, evaluation, paths, needsRate);
  paths.forEach((path, j) => {
    const column = design.subarray(j * n, (j + 1) * n);
    const companionPartial = orbital.byPath.get(path);
    if (companionPartial !== undefined) {
      for (let i = 0; i < n; i += 1) column[i] = -companionPartial[i]; // Note 1: companion delay is subtracted
      return;
    }
    fillColumn(model, prepared, evaluation, path, column);
    if (needsRate && (path.startsWith('astrometry.') || path.startsWith('dispersion.'))) {
      for (let i = 0; i < n; i += 1) column[i] *= 1 - orbital.rate[i]; // Note 4
    }
  });
  if (withPhaseOffset) {
    const column = design.subarray(paths.length * n, (paths.length + 1) * n);
    for (let i = 0; i < n; i += 1) column[i] = -1 / evaluation.frequencyHz[i]; // r = (φ − N − offset)/F
  }
  return design;
}

function fillColumn(model: TimingModel, prepared: PreparedArrivals, ev: TimingEvaluation, path: string, column: Float64Array): void {
  const n = prepared.count;
  const f = ev.frequencyHz;
  const t = ev.emissionSinceEpochS;
  if (path === 'spin.frequency_hz') {
    for (let i = 0; i < n; i += 1) column[i] = t[i] / f[i]; // ∂φ/∂F = dt
    return;
  }
  let match = SPIN_DERIVATIVE_PATH.exec(path);
  if (match !== null) {
    const order = Number(match[1]) + 2; // ∂φ/∂F^(k+1) = dt^(k+2)/(k+2)!
    for (let i = 0; i < n; i += 1) {
      let term = 1;
      for (let m = 1; m <= order; m += 1) term *= t[i] / m;
      column[i] = term / f[i];
    }
    return;
  }
  if (path.startsWith('astrometry.')) {
    fillAstrometryColumn(model, prepared, ev, path.slice('astrometry.'.length), column);
    return;
  }
  if (path === 'dispersion.dm_pc_per_cm3') {
    for (let i = 0; i < n; i += 1) column[i] = -dispersionPerDm(ev.barycentricFrequencyMhz[i]); // L&K 2005 eq. 4.7
    return;
  }
  match = DM_DERIVATIVE_PATH.exec(path);
  if (match !== null) {
    const k = Number(match[1]);
    for (let i = 0; i < n; i += 1) {
      column[i] = -dispersionPerDm(ev.barycentricFrequencyMhz[i]) * dispersionTaylorCoefficient(k, ev.yearsSinceEpoch[i]);
    }
    return;
  }
  match = OFFSET_PATH.exec(path);
  if (match !== null) {
    const b = prepared.backends.indexOf(match[1]);
    for (let i = 0; i < n; i += 1) column[i] = prepared.backendIndex[i] === b ? -1 : 0; // offset is subtracted
    return;
  }
  match = GLITCH_PATH.exec(path);
  if (match !== null) {
    fillGlitchColumn(model, ev, path, Number(match[1]), match[2], column);
    return;
  }
  parameterHandle(model, path); // throws TimingInputError naming the path
  throw new RangeError(`timingDesignMatrix: no derivative rule for ${path}`);
}

function dispersionPerDm(barycentricFreqMhz: number): number {
  return barycentricFreqMhz === Infinity ? 0 : DM_DELAY_CONSTANT_S_MHZ2 / (barycentricFreqMhz * barycentricFreqMhz);
}

/** ∂(delays)/∂α and ∂/∂δ per TOA at the propagated position (Note 2), computed once per design matrix. */
interface SkyGradients { dRa: Float64Array; dDec: Float64Array }
const skyGradientCache = new WeakMap<TimingEvaluation, SkyGradients>();

function skyGradients(model: TimingModel, prepared: PreparedArrivals, ev: TimingEvaluation): SkyGradients {
  const cached = skyGradientCache.get(ev);
  if (cached !== undefined) return cached;
  const d = ev.directionXyz;
  const dRa = new Float64Array(prepared.count);
  const dDec = new Float64Array(prepared.count);
  for (let i = 0; i < prepared.count; i += 1) {
    const nx = d[3 * i];
    const ny = d[3 * i + 1];
    const nz = d[3 * i + 2];
    const cosDec = Math.hypot(nx, ny);
    const cosRa = cosDec > 0 ? nx / cosDec : 1;
    const sinRa = cosDec > 0 ? ny / cosDec : 0;
    const g = delayGradient(prepared, ev, model.astrometry.parallaxMas, i, nx, ny, nz);
    dRa[i] = cosDec * (-sinRa * g[0] + cosRa * g[1]); // G·∂n̂/∂α
    dDec[i] = -nz * cosRa * g[0] - nz * sinRa * g[1] + cosDec * g[2]; // G·∂n̂/∂δ
  }
  const gradients = { dRa, dDec };
  skyGradientCache.set(ev, gradients);
  return gradients;
}

function fillAstrometryColumn(model: TimingModel, prepared: PreparedArrivals, ev: TimingEvaluation, key: string, column: Float64Array): void {
  const n = prepared.count;
  const years = ev.yearsSinceEpoch;
  if (key === 'parallax_mas') {
    const r = prepared.geometry.observatoryPositionLs;
    const d = ev.directionXyz;
    for (let i = 0; i < n; i += 1) {
      const k = 3 * i;
      const along = r[k] * d[k] + r[k + 1] * d[k + 1] + r[k + 2] * d[k + 2];
      column[i] = -curvatureTermPerMas(r[k], r[k + 1], r[k + 2], along); // Edwards et al. 2006
    }
    return;
  }
  const { dRa, dDec } = skyGradients(model, prepared, ev);
  const raPerPm = RAD_PER_MAS / Math.cos(model.astrometry.decRad); // α(t) = α₀ + μ_α* t / cos δ₀
  switch (key) {
    case 'ra_hms':
      column.set(dRa);
      return;
    case 'dec_dms':
      column.set(dDec);
      return;
    case 'pm_ra_cosdec_mas_per_yr':
      for (let i = 0; i < n; i += 1) column[i] = dRa[i] * years[i] * raPerPm;
      return;
    case 'pm_dec_mas_per_yr':
      for (let i = 0; i < n; i += 1) column[i] = dDec[i] * years[i] * RAD_PER_MAS;
      return;
    default:
      throw new RangeError(`timingDesignMatrix: no derivative rule for astrometry.${key}`);
  }
}

/**
 * G = ∂(Roemer − Shapiro − dispersion)/∂n̂ at TOA i, light-seconds (Note 2):
 * r + (r·n̂)·r·ϖ/au (curvature) + 2T☉·s/(|s| + s·n̂) (solar Shapiro; s = Sun → observatory)
 * − 2·D·v/(1 − v·n̂) (dispersion D through the Doppler factor). Jupiter's term (≲ 1e-8 s/rad) is left out.
 */
const gradientOut: [number, number, number] = [0, 0, 0];
function delayGradient(prepared: PreparedArrivals, ev: TimingEvaluation, parallaxMas: number, i: number, nx: number, ny: number, nz: number): [number, number, number] {
  const g = prepared.geometry;
  const k = 3 * i;
  const r = g.observatoryPositionLs;
  const along = r[k] * nx + r[k + 1] * ny + r[k + 2] * nz;
  const curvature = (along * parallaxMas * RAD_PER_MAS) / AU_LIGHT_SECONDS; // ∂/∂n̂ of −(|r|² − (r·n̂)²)ϖ/(2 au)
  let [x, y, z] = [r[k] * (1 + curvature), r[k + 1] * (1 + curvature), r[k + 2] * (1 + curvature)];
  if (prepared.atBarycentre[i] === 0) {
    const s = g.sunToObservatoryLs;
    const shapiroFactor = (2 * SUN_MASS_SECONDS) / (Math.hypot(s[k], s[k + 1], s[k + 2]) + s[k] * nx + s[k + 1] * ny + s[k + 2] * nz); // Shapiro 1964
    x += shapiroFactor * s[k];
    y += shapiroFactor * s[k + 1];
    z += shapiroFactor * s[k + 2];
  }
  const v = g.observatoryVelocityC;
  const dopplerFactor = (-2 * ev.dispersionS[i]) / (1 - (v[k] * nx + v[k + 1] * ny + v[k + 2] * nz)); // D ∝ (1 − v·n̂)⁻²
  gradientOut[0] = x + dopplerFactor * v[k];
  gradientOut[1] = y + dopplerFactor * v[k + 1];
  gradientOut[2] = z + dopplerFactor * v[k + 2];
  return gradientOut;
}

/**
 * Analytic ∂Δ_c/∂p for every companion path in `paths` (orbits/companion-delay-partials.ts), one pass
 * per companion, and the summed rate dΔ_c/dt of all enabled companions when asked (Note 4).
 */
function companionPartialsFor(model: TimingModel, ev: TimingEvaluation, paths: readonly string[], withRate: boolean): { byPath: Map<string, Float64Array>; rate: Float64Array } {
  const byPath = new Map<string, Float64Array>();
  const rate = new Float64Array(ev.count);
  for (const companion of model.companions) {
    const wanted = paths.filter((p) => COMPANION_PATH.exec(p)?.[1] === companion.name);
    if (wanted.length === 0 && !(withRate && companion.enabled)) continue;
    wanted.forEach((p) => parameterHandle(model, p)); // unknown keys: TimingInputError naming the path
    const keys = [...wanted.map((p) => COMPANION_PATH.exec(p)![2]), TIME_RATE_KEY];
    const partials = companionDelayPartials(companion, ev.barycentricDays, keys);
    wanted.forEach((p, j) => byPath.set(p, partials[j]));
    const companionRate = partials[keys.length - 1];
    for (let i = 0; i < ev.count; i += 1) rate[i] += companionRate[i];
  }
  return { byPath, rate };
}

function fillGlitchColumn(model: TimingModel, ev: TimingEvaluation, path: string, index: number, key: string, column: Float64Array): void {
  const glitch = model.glitches[index];
  const spin = prepareSpin({ ...model, glitches: [glitch] });
  const offsetS = spin.glitches[0].offsetS;
  const tauS = glitch.decayTimeDays * 86_400;
  const since = (i: number): number => ev.emissionSinceEpochS[i] - offsetS[1] + (ev.emissionSinceEpochLoS[i] - offsetS[0]);
  const analytic: Record<string, (s: number) => number> = {
    phase_step_turns: () => 1, // Edwards et al. 2006 glitch model (spin-phase.ts Note 2)
    frequency_step_hz: (s) => s,
    frequency_derivative_step_hz_per_s: (s) => 0.5 * s * s,
    decaying_frequency_step_hz: (s) => (tauS > 0 ? tauS * (1 - Math.exp(-s / tauS)) : 0),
  };
  const rule = analytic[key];
  if (rule !== undefined) {
    for (let i = 0; i < ev.count; i += 1) {
      const s = since(i);
      column[i] = s > 0 ? rule(s) / ev.frequencyHz[i] : 0;
    }
    return;
  }
  // Numeric (epoch, decay time): the glitch's own phase relative to its value at the base point.
  const handle = parameterHandle(model, path);
  const base = handle.get(model);
  const scale = key === 'epoch_mjd' ? 0.01 : Math.max(Math.abs(base[1]), 1);
  const baseTurns = glitchOnlyTurns(spin, ev);
  const trialModel = { ...model, glitches: [structuredClone(glitch)] } as TimingModel;
  const trialHandle = parameterHandle(trialModel, path.replace(/^glitches\[\d+\]/, 'glitches[0]'));
  const derivative = numericDerivativeColumn((offset) => {
    trialHandle.set(trialModel, ddAddNumber(base, offset));
    const turns = glitchOnlyTurns(prepareSpin(trialModel), ev);
    for (let i = 0; i < ev.count; i += 1) turns[i] -= baseTurns[i];
    return turns;
  }, scale);
  for (let i = 0; i < ev.count; i += 1) column[i] = derivative[i] / ev.frequencyHz[i];
}

/** Phase of a spin model holding one glitch and zero frequency: the glitch's own phase, turns. */
function glitchOnlyTurns(spin: ReturnType<typeof prepareSpin>, ev: TimingEvaluation): Float64Array {
  const glitchSpin = { ...spin, frequencyHz: [0, 0] as DoubleDouble, frequencyDerivatives: [] };
  const value: SpinPhaseValue = { turnsHi: 0, turnsLo: 0, frequencyHz: 0 };
  const out = new Float64Array(ev.count);
  for (let i = 0; i < ev.count; i += 1) {
    spinPhase(glitchSpin, [ev.emissionSinceEpochLoS[i], ev.emissionSinceEpochS[i]], value);
    out[i] = value.turnsHi + value.turnsLo;
  }
  return out;
}
