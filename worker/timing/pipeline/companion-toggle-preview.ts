/**
 * Preview residuals for an edited model without a fit, from a fit's stored
 * explorer columns (api/contracts/explorer.ts): what the residual explorer
 * shows while companions are toggled or values edited. Browser-safe: pure
 * arithmetic on arrays, no Node modules.
 *
 * Exact (the engine's own formulas, from the stored barycentric days): every
 * companion (on/off, added, removed, any orbital value, every kind the engine
 * evaluates), spin frequency and derivatives, glitches, backend offsets.
 * First order (stored partial derivatives): astrometry and dispersion, which
 * move the barycentric times themselves. Not previewed: noise settings (the
 * fitted uncertainties are kept) and the model epoch (refused).
 */
import { TimingInputError } from '../engine-error';
import { backendOffsetsS } from '../delays/backend-offset';
import { DAYS_PER_JULIAN_YEAR } from '../delays/physical-constants';
import { dispersionTaylorCoefficient } from '../delays/dispersion-measure-at';
import type { TimingModel } from '../model/timing-model';
import { parameterHandle } from '../model/parameter-paths';
import type { BarycentricDays } from '../orbits/barycentric-days';
import { addCompanionDelayS } from '../orbits/companion-delays';
import type { Companion } from '../model/timing-model';
import { ddAddNumber, ddSub, ddTimesNumber, ddToNumber } from '../time/double-double-typed';
import type { DoubleDouble } from '../time/epoch';
import { prepareSpin, spinPhase, type PreparedSpin, type SpinPhaseValue } from './spin-phase';

const SECONDS_PER_DAY = 86_400;

/** The explorer columns the preview reads (ExplorerTable of api/contracts/explorer.ts fits this shape). */
export interface PreviewColumns {
  count: number;
  barycentricDaysHi: ArrayLike<number>;
  barycentricDaysLo: ArrayLike<number>;
  backend: readonly string[];
  residualUs: ArrayLike<number | null>;
  uncertaintyUs: ArrayLike<number>;
  excluded: ArrayLike<boolean>;
  nearestPulse: ArrayLike<boolean>;
  /** false where the fit could not evaluate a TOA (default: every TOA with a residual) */
  evaluated?: ArrayLike<boolean>;
  partials: readonly { parameter: string; secondsPerUnit: ArrayLike<number> }[];
}

/** The fitted state, computed once per fit (preparePreview) and reused by every preview. */
export interface PreparedPreview {
  count: number;
  fitted: TimingModel;
  days: BarycentricDays;
  backend: readonly string[];
  usable: Uint8Array; // 1 where the TOA has a residual
  weights: Float64Array; // 1/σ² for fitted (not excluded) usable TOAs, else 0
  nearestPulse: Uint8Array;
  /** Fitted residual in turns and the emission phase under the fitted model (hi, lo). */
  turnsFitted: Float64Array;
  phaseFittedHi: Float64Array;
  phaseFittedLo: Float64Array;
  /** Under the fitted model at the fitted emission time: offset + companion delays (s), F (Hz) and dF/dt (Hz/s). */
  laterDelaysFittedS: Float64Array;
  frequencyFittedHz: Float64Array;
  frequencyRateFittedHzPerS: Float64Array;
  /** Each fitted companion's delay (s) by the companion's full description, so unchanged companions are not re-evaluated. */
  companionDelayCache: Map<string, Float64Array>;
  spinKey: string;
  partials: Map<string, ArrayLike<number>>;
}

export interface PreviewResult {
  /** Preview residuals (µs), weighted mean of the fitted TOAs removed; NaN where the TOA has none. */
  residualUs: Float64Array;
  /** The weighted mean that was removed (µs): a phase offset is always fitted. */
  removedMeanUs: number;
  /** Weighted RMS of the fitted (not excluded) TOAs after the mean is removed (µs). */
  weightedRmsUs: number;
  /** Parameters whose edit was applied first-order from partial derivatives. */
  firstOrder: string[];
  /** Edits the preview does not show (they need a fit): noise settings. */
  notPreviewed: string[];
}

const ASTROMETRY_PATHS = [
  'astrometry.ra_hms',
  'astrometry.dec_dms',
  'astrometry.pm_ra_cosdec_mas_per_yr',
  'astrometry.pm_dec_mas_per_yr',
  'astrometry.parallax_mas',
] as const;

/**
 * Emission time − epoch (s, double-double) of sample i: barycentric days · 86400 − later delays,
 * as in timing-residuals.ts phaseResiduals.
 */
function emissionSeconds(days: BarycentricDays, i: number, laterDelaysS: number): DoubleDouble {
  return ddAddNumber(ddTimesNumber([days.lo[i], days.hi[i]], SECONDS_PER_DAY), -laterDelaysS);
}

/** A companion's full description (a cache key: any edited value gives another key). */
const companionKey = (c: Companion): string => JSON.stringify({ ...c, enabled: true });
const spinKeyOf = (m: TimingModel): string => JSON.stringify([m.spin, m.glitches]);

/** Sum of the enabled companions' delays (s), reusing cached delays of unchanged companions. */
function companionDelaysS(companions: readonly Companion[], days: BarycentricDays, cache: ReadonlyMap<string, Float64Array>): Float64Array {
  const out = new Float64Array(days.hi.length);
  for (const c of companions) {
    if (!c.enabled) continue;
    const cached = cache.get(companionKey(c));
    if (cached === undefined) addCompanionDelayS(c, days, out);
    else for (let i = 0; i < out.length; i += 1) out[i] += cached[i];
  }
  return out;
}

/** Offsets (s) per TOA from a model's backend offsets. */
function offsetsPerToa(model: TimingModel, backends: readonly string[]): Float64Array {
  const byBackend = backendOffsetsS(model.offsets);
  return Float64Array.from(backends, (b) => byBackend.get(b) ?? 0);
}

/**
 * Prepares the fitted state for previews.
 *
 * @param columns  the fit's explorer columns
 * @param fitted   the fitted model (readModelFile(table.fittedModel))
 * @returns        PreparedPreview (arrays copied, the fitted phase evaluated once)
 * Throws TimingInputError when the columns' lengths differ from `count`.
 */
export function preparePreview(columns: PreviewColumns, fitted: TimingModel): PreparedPreview {
  const n = columns.count;
  const lengths = [columns.barycentricDaysHi.length, columns.barycentricDaysLo.length, columns.backend.length, columns.residualUs.length,
    columns.uncertaintyUs.length, columns.excluded.length, columns.nearestPulse.length];
  if (lengths.some((x) => x !== n)) throw new TimingInputError(`explorer columns: lengths ${lengths.join(', ')} differ from count ${n}`);
  const days: BarycentricDays = { reference: fitted.epochMjd, hi: Float64Array.from(columns.barycentricDaysHi), lo: Float64Array.from(columns.barycentricDaysLo) };
  const usable = new Uint8Array(n);
  const weights = new Float64Array(n);
  const nearestPulse = new Uint8Array(n);
  for (let i = 0; i < n; i += 1) {
    const r = columns.residualUs[i];
    usable[i] = r !== null && Number.isFinite(r) && (columns.evaluated === undefined || columns.evaluated[i]) ? 1 : 0;
    const sigma = columns.uncertaintyUs[i];
    weights[i] = usable[i] === 1 && !columns.excluded[i] && sigma > 0 ? 1 / (sigma * sigma) : 0;
    nearestPulse[i] = columns.nearestPulse[i] ? 1 : 0;
  }
  const companionDelayCache = new Map<string, Float64Array>();
  for (const c of fitted.companions) {
    const one = new Float64Array(n);
    addCompanionDelayS({ ...c, enabled: true }, days, one);
    companionDelayCache.set(companionKey(c), one);
  }
  const companions = companionDelaysS(fitted.companions, days, companionDelayCache);
  const offsets = offsetsPerToa(fitted, columns.backend);
  const laterDelaysFittedS = Float64Array.from(offsets, (o, i) => o + companions[i]);
  const frequencyFittedHz = new Float64Array(n);
  const frequencyRateFittedHzPerS = new Float64Array(n);
  const derivatives = fitted.spin.frequencyDerivatives;
  const spin = prepareSpin(fitted);
  const value: SpinPhaseValue = { turnsHi: 0, turnsLo: 0, frequencyHz: 0 };
  const turnsFitted = new Float64Array(n);
  const phaseFittedHi = new Float64Array(n);
  const phaseFittedLo = new Float64Array(n);
  for (let i = 0; i < n; i += 1) {
    if (usable[i] === 0) continue;
    const emission = emissionSeconds(days, i, laterDelaysFittedS[i]);
    spinPhase(spin, emission, value);
    phaseFittedHi[i] = value.turnsHi;
    phaseFittedLo[i] = value.turnsLo;
    frequencyFittedHz[i] = value.frequencyHz;
    // dF/dt = Σ_k F^(k+1) t^k / k! (derivative of the spin-phase.ts series; used only when no glitches)
    const t = emission[1] + emission[0];
    let rate = 0;
    let power = 1;
    for (let k = 0; k < derivatives.length; k += 1) {
      rate += derivatives[k] * power;
      power *= t / (k + 1);
    }
    frequencyRateFittedHzPerS[i] = rate;
    turnsFitted[i] = ((columns.residualUs[i] as number) * 1e-6) * value.frequencyHz; // r = turns / F (timing-residuals.ts Note 3)
  }
  return {
    count: n, fitted, days, backend: columns.backend, usable, weights, nearestPulse, turnsFitted, phaseFittedHi, phaseFittedLo,
    laterDelaysFittedS, frequencyFittedHz, frequencyRateFittedHzPerS, companionDelayCache, spinKey: spinKeyOf(fitted),
    partials: new Map(columns.partials.map((p) => [p.parameter, p.secondsPerUnit])),
  };
}

/**
 * Preview residuals of `edited` (µs).
 *
 * @param prepared  preparePreview(columns, fitted)
 * @param edited    the edited model (same epoch as the fitted one)
 * @returns         PreviewResult
 *
 * Notes: 1. Exact part: with t_b the stored barycentric time, emission e = t_b − offset − Σ companion
 *           delays (timing-residuals.ts Note 1) under both models; the residual in turns moves by
 *           φ_edited(e_edited) − φ_fitted(e_fitted) (spin-phase.ts, double-double), then re-wraps to the
 *           nearest pulse where the fit did, and becomes seconds with the edited model's instantaneous
 *           frequency. Turning a companion off therefore adds its delay to the residual.
 *           While spin and glitches are unedited (and the model has no glitch), the phase change is the
 *           series F·Δ + ½Ḟ·Δ² in Δ = e_edited − e_fitted, with F and Ḟ at the fitted emission time (the
 *           same number to ≪ 1 ps, without the double-double phase); unchanged companions reuse their
 *           fitted delays, so a toggle evaluates no orbit at all.
 *        2. First-order part: Σ ∂r/∂p · Δp over astrometry and dispersion parameters (Δp in file units,
 *           partials at the fitted values); a DM derivative the fit did not have uses the DM partial
 *           times its Taylor coefficient t^(k+1)/(k+1)! (t in Julian years from the barycentric days).
 *        3. The weighted mean of the fitted TOAs (weights 1/σ², σ the fit's effective uncertainty) is
 *           removed from every TOA, as the always-fitted phase offset would.
 * Throws TimingInputError when the epoch differs, a needed partial is missing, or a companion kind
 * is not evaluable.
 */
export function previewResiduals(prepared: PreparedPreview, edited: TimingModel): PreviewResult {
  const { fitted, days, count: n } = prepared;
  if (edited.epochMjd.day !== fitted.epochMjd.day || edited.epochMjd.frac[0] !== fitted.epochMjd.frac[0] || edited.epochMjd.frac[1] !== fitted.epochMjd.frac[1]) {
    throw new TimingInputError('the model epoch was changed: previews need the fitted epoch (queue a fit instead)', [{ path: 'epoch_mjd', message: 'changed' }]);
  }
  const companions = companionDelaysS(edited.companions, days, prepared.companionDelayCache);
  const offsets = offsetsPerToa(edited, prepared.backend);
  const residualS = new Float64Array(n);
  if (edited.glitches.length === 0 && spinKeyOf(edited) === prepared.spinKey) {
    // Note 1, spin unchanged: φ(e + Δ) − φ(e) = F·Δ + ½Ḟ·Δ² (the next term, F̈Δ³/6, is < 1e-12 turn for |Δ| < 1e4 s)
    for (let i = 0; i < n; i += 1) {
      if (prepared.usable[i] === 0) {
        residualS[i] = Number.NaN;
        continue;
      }
      const shiftS = prepared.laterDelaysFittedS[i] - (offsets[i] + companions[i]); // e_edited − e_fitted
      const f = prepared.frequencyFittedHz[i];
      const rate = prepared.frequencyRateFittedHzPerS[i];
      let turns = prepared.turnsFitted[i] + shiftS * (f + 0.5 * rate * shiftS);
      if (prepared.nearestPulse[i] === 1) turns -= Math.round(turns);
      residualS[i] = turns / (f + rate * shiftS);
    }
  } else {
    exactPhaseResiduals(prepared, edited, offsets, companions, residualS);
  }
  return finishPreview(prepared, edited, residualS);
}

/** Note 1 with the spin phase evaluated in full under the edited model (spin or glitch edits). */
function exactPhaseResiduals(prepared: PreparedPreview, edited: TimingModel, offsets: Float64Array, companions: Float64Array, residualS: Float64Array): void {
  const spin: PreparedSpin = prepareSpin(edited);
  const value: SpinPhaseValue = { turnsHi: 0, turnsLo: 0, frequencyHz: 0 };
  const days = prepared.days;
  for (let i = 0; i < prepared.count; i += 1) {
    if (prepared.usable[i] === 0) {
      residualS[i] = Number.NaN;
      continue;
    }
    spinPhase(spin, emissionSeconds(days, i, offsets[i] + companions[i]), value);
    let turns = prepared.turnsFitted[i] + ((value.turnsHi - prepared.phaseFittedHi[i]) + (value.turnsLo - prepared.phaseFittedLo[i])); // Note 1
    if (prepared.nearestPulse[i] === 1) turns -= Math.round(turns);
    residualS[i] = turns / value.frequencyHz;
  }
}

/** Notes 2 and 3: first-order terms, weighted mean removed, statistics. */
function finishPreview(prepared: PreparedPreview, edited: TimingModel, residualS: Float64Array): PreviewResult {
  const { fitted, count: n } = prepared;
  const firstOrder = addFirstOrder(prepared, edited, residualS);
  // Note 3
  let sumW = 0;
  let sumWr = 0;
  for (let i = 0; i < n; i += 1) {
    sumW += prepared.weights[i];
    if (prepared.weights[i] > 0) sumWr += prepared.weights[i] * residualS[i] * 1e6;
  }
  const mean = sumW > 0 ? sumWr / sumW : 0;
  const residualUs = new Float64Array(n);
  let sumWr2 = 0;
  for (let i = 0; i < n; i += 1) {
    residualUs[i] = residualS[i] * 1e6 - mean;
    if (prepared.weights[i] > 0) sumWr2 += prepared.weights[i] * residualUs[i] * residualUs[i];
  }
  return {
    residualUs,
    removedMeanUs: mean,
    weightedRmsUs: sumW > 0 ? Math.sqrt(sumWr2 / sumW) : Number.NaN, // sqrt(Σ w r² / Σ w), fit-statistics.ts weightedRms
    firstOrder,
    notPreviewed: JSON.stringify(edited.noise) === JSON.stringify(fitted.noise) ? [] : ['noise'],
  };
}

/** Note 2 of previewResiduals: adds Σ ∂r/∂p·Δp into residualS; returns the paths applied. */
function addFirstOrder(prepared: PreparedPreview, edited: TimingModel, residualS: Float64Array): string[] {
  const { fitted } = prepared;
  const changes: { path: string; deltaFileUnits: number; partial: ArrayLike<number> | ((i: number) => number) }[] = [];
  for (const path of ASTROMETRY_PATHS) {
    const handle = parameterHandle(fitted, path);
    const deltaInternal = ddToNumber(ddSub(handle.get(edited), handle.get(fitted)));
    if (deltaInternal !== 0) changes.push({ path, deltaFileUnits: deltaInternal * handle.toFileUncertainty(1), partial: partialOf(prepared, path) });
  }
  const dmDelta = edited.dispersion.dmPcPerCm3 - fitted.dispersion.dmPcPerCm3;
  if (dmDelta !== 0) changes.push({ path: 'dispersion.dm_pc_per_cm3', deltaFileUnits: dmDelta, partial: partialOf(prepared, 'dispersion.dm_pc_per_cm3') });
  const orders = Math.max(edited.dispersion.dmDerivatives.length, fitted.dispersion.dmDerivatives.length);
  for (let k = 0; k < orders; k += 1) {
    const delta = (edited.dispersion.dmDerivatives[k] ?? 0) - (fitted.dispersion.dmDerivatives[k] ?? 0);
    if (delta === 0) continue;
    const path = `dispersion.dm_derivatives[${k}]`;
    const stored = prepared.partials.get(path);
    const dm = partialOf(prepared, 'dispersion.dm_pc_per_cm3');
    const days = prepared.days;
    changes.push({
      path,
      deltaFileUnits: delta,
      partial: stored ?? ((i: number) => dm[i] * dispersionTaylorCoefficient(k, (days.hi[i] + days.lo[i]) / DAYS_PER_JULIAN_YEAR)),
    });
  }
  for (const change of changes) {
    const p = change.partial;
    for (let i = 0; i < prepared.count; i += 1) {
      residualS[i] += (typeof p === 'function' ? p(i) : p[i]) * change.deltaFileUnits;
    }
  }
  return changes.map((c) => c.path);
}

function partialOf(prepared: PreparedPreview, path: string): ArrayLike<number> {
  const partial = prepared.partials.get(path);
  if (partial === undefined) throw new TimingInputError(`${path}: the fit stored no partial derivative for it, so an edit cannot be previewed (queue a fit)`, [{ path, message: 'no partial derivative stored' }]);
  return partial;
}
