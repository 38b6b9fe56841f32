import { aliasFlags, dominantCadenceDays } from '../../../../../worker/timing/periodogram/alias-flags';
import { falseAlarmBaluev } from '../../../../../worker/timing/periodogram/false-alarm-probability';
import { gridFrequenciesPerDay, periodogramGrid, type FrequencyGrid } from '../../../../../worker/timing/periodogram/frequency-grid';
import { lombScargleFast } from '../../../../../worker/timing/periodogram/lomb-scargle-fast';
import { peakSinusoid, type PeakSinusoid } from './companion-seed';
import { powerAtFalseAlarm } from './fap-power-level';

/** The false-alarm probabilities drawn as levels on the plot. */
export const FAP_LEVELS = [1e-2, 1e-3] as const;
/** A best peak with a false-alarm probability above this is reported as not significant. */
export const SIGNIFICANT_FAP = 1e-3;
export const DEFAULT_MIN_PERIOD_DAYS = 1.5;
export const MAX_LISTED_PEAKS = 5;
/** Fewer samples than this give no periodogram (falseAlarmBaluev needs N ≥ 5). */
export const MIN_PERIODOGRAM_SAMPLES = 5;

export interface PeriodogramRequest {
  tDays: Float64Array;
  residualUs: Float64Array;
  uncertaintyUs: Float64Array;
  /** shortest trial period, days (default DEFAULT_MIN_PERIOD_DAYS) */
  minPeriodDays?: number;
  /** longest trial period, days (default: the data span) */
  maxPeriodDays?: number;
}

export interface PeriodogramPeak {
  freqPerDay: number;
  periodDays: number;
  power: number;
  /** Baluev false-alarm probability of a peak this high anywhere in the searched band */
  falseAlarmProbability: number;
  /** alias and systematics warnings (alias-flags.ts), code-prefixed */
  warnings: string[];
  /** the sinusoid behind the peak (refined frequency, amplitude, phase) for seeding a companion; null when it cannot be fitted */
  sinusoid: PeakSinusoid | null;
}

export interface ResidualPeriodogram {
  grid: FrequencyGrid;
  /** trial periods, days, one per grid frequency (descending) */
  periodDays: Float64Array;
  power: Float64Array;
  /** power at each FAP_LEVELS entry, same order */
  fapLevelPowers: number[];
  /** strongest local maxima, highest first, at least one resolution element 1/span apart */
  peaks: PeriodogramPeak[];
  sampleCount: number;
  spanDays: number;
  minPeriodDays: number;
  maxPeriodDays: number;
  elapsedMs: number;
}

/**
 * The residual periodogram the explorer shows: generalized Lomb–Scargle power (fast method) on the
 * standard grid, the Baluev FAP levels, and the strongest peaks with their FAP and alias warnings.
 *
 * @param request  times (days, any origin), residuals and 1σ (µs), optional period range (days)
 * @returns        the periodogram, levels and peaks (see ResidualPeriodogram)
 *
 * Notes: 1. Each listed peak's FAP is the Baluev probability of the highest peak reaching its power,
 *    i.e. the chance noise alone puts a peak that high anywhere in the band (an upper bound).
 * 2. Weights are 1/σ², normalised, as in the periodogram itself.
 * 3. Each listed peak carries its fitted sinusoid (companion-seed.ts peakSinusoid), so choosing a
 *    peak on the main thread costs nothing; this runs in the worker with the periodogram.
 * Throws RangeError for fewer than MIN_PERIODOGRAM_SAMPLES samples, zero span or bad ranges.
 * References: Zechmeister & Kürster 2009, A&A 496, 577; Press & Rybicki 1989, ApJ 338, 277;
 *   Baluev 2008, MNRAS 385, 1279; Deeming 1975, Ap&SS 36, 137 (aliases).
 */
export function computeResidualPeriodogram(request: PeriodogramRequest): ResidualPeriodogram {
  const started = performance.now();
  const { tDays, residualUs, uncertaintyUs } = request;
  const n = tDays.length;
  if (n < MIN_PERIODOGRAM_SAMPLES) throw new RangeError(`tDays: need at least ${MIN_PERIODOGRAM_SAMPLES} samples, got ${n}`);
  let tMin = Infinity;
  let tMax = -Infinity;
  for (const t of tDays) {
    if (t < tMin) tMin = t;
    if (t > tMax) tMax = t;
  }
  const spanDays = tMax - tMin;
  if (!(spanDays > 0)) throw new RangeError('tDays: the samples span no time');
  const minPeriodDays = request.minPeriodDays ?? DEFAULT_MIN_PERIOD_DAYS;
  const maxPeriodDays = request.maxPeriodDays ?? spanDays;
  const grid = periodogramGrid(spanDays, { minPeriodDays, maxPeriodDays });
  const power = lombScargleFast(tDays, residualUs, uncertaintyUs, grid);
  const frequencies = gridFrequenciesPerDay(grid);
  const periodDays = frequencies.map((f) => 1 / f);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) weights[i] = 1 / (uncertaintyUs[i] * uncertaintyUs[i]);
  const fMaxPerDay = frequencies[frequencies.length - 1];
  const fapLevelPowers = FAP_LEVELS.map((level) => powerAtFalseAlarm(level, n, fMaxPerDay, tDays, weights));
  const cadence = dominantCadenceDays(tDays);
  const resolutionPerDay = 1 / spanDays;
  const peaks = strongestPeaks(frequencies, power, resolutionPerDay, MAX_LISTED_PEAKS).map((k, rank, all) => {
    const freqPerDay = frequencies[k];
    const strongerPeaksPerDay = all.slice(0, rank).map((j) => frequencies[j]);
    return {
      freqPerDay,
      periodDays: 1 / freqPerDay,
      power: power[k],
      falseAlarmProbability: falseAlarmBaluev(Math.min(1, Math.max(0, power[k])), n, fMaxPerDay, tDays, weights),
      warnings: aliasFlags(1 / freqPerDay, {
        ...(Number.isFinite(cadence) && cadence > 0 ? { cadenceDays: cadence } : {}),
        strongerPeaksPerDay,
        resolutionPerDay,
      }),
      sinusoid: sinusoidOrNull(tDays, residualUs, uncertaintyUs, freqPerDay, grid.stepPerDay),
    };
  });
  return {
    grid,
    periodDays,
    power,
    fapLevelPowers,
    peaks,
    sampleCount: n,
    spanDays,
    minPeriodDays,
    maxPeriodDays,
    elapsedMs: performance.now() - started,
  };
}

function sinusoidOrNull(tDays: Float64Array, y: Float64Array, sigma: Float64Array, freqPerDay: number, stepPerDay: number): PeakSinusoid | null {
  try {
    return peakSinusoid(tDays, y, sigma, freqPerDay, stepPerDay);
  } catch (error) {
    if (error instanceof RangeError) return null; // singular: no sinusoid at this frequency
    throw error;
  }
}

/**
 * Indices of the `count` highest local maxima of `power`, highest first; a maximum closer than
 * `separationPerDay` in frequency to a higher chosen one is the same peak and skipped.
 */
export function strongestPeaks(freqPerDay: Float64Array, power: Float64Array, separationPerDay: number, count: number): number[] {
  const maxima: number[] = [];
  for (let k = 0; k < power.length; k++) {
    const left = k === 0 ? -Infinity : power[k - 1];
    const right = k === power.length - 1 ? -Infinity : power[k + 1];
    if (power[k] > left && power[k] >= right) maxima.push(k);
  }
  maxima.sort((a, b) => power[b] - power[a]);
  const chosen: number[] = [];
  for (const k of maxima) {
    if (chosen.length >= count) break;
    if (chosen.some((j) => Math.abs(freqPerDay[j] - freqPerDay[k]) < separationPerDay)) continue;
    chosen.push(k);
  }
  return chosen;
}

/** The alias warning without its code prefix ("one-year: …" → "…"), for display. */
export function warningText(warning: string): string {
  const colon = warning.indexOf(': ');
  return colon > 0 && /^[a-z-]+$/.test(warning.slice(0, colon)) ? warning.slice(colon + 2) : warning;
}
