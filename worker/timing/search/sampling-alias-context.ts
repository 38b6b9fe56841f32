/**
 * What the alias screen needs to know about the sampling of a search: the
 * session cadence and the strongest peaks of the spectral window.
 */
import { spectralWindow } from '../periodogram/spectral-window';
import type { FrequencyGrid } from '../periodogram/frequency-grid';

/** Window peaks at least this high (W(0) = 1) are passed to the alias screen. */
export const WINDOW_PEAK_MIN_POWER = 0.2;
/** At most this many window peaks. */
export const WINDOW_PEAK_COUNT = 3;

/**
 * The strongest local maxima of the spectral window on the search band.
 *
 * @param tDays    sample times, days
 * @param weights  sample weights (1/σ²)
 * @param grid     the search grid; the window is evaluated at every `oversampling`-th point (Note 1)
 * @param oversampling  the grid's points per natural resolution
 * @returns        frequencies (cycles per day) of up to 3 window peaks with W ≥ 0.2, strongest first
 *
 * Notes: 1. The window (Deeming 1975, Ap&SS 36, 137) is a direct O(N·M) sum, so it is sampled once per
 *           natural resolution 1/T rather than on the oversampled grid; its peaks are ~1/T wide.
 *           Frequencies below 2/T (the main lobe at f = 0) are skipped.
 */
export function windowPeakFrequencies(tDays: Float64Array, weights: Float64Array, grid: FrequencyGrid, oversampling: number): number[] {
  const stride = Math.max(1, Math.floor(oversampling));
  const mainLobePerDay = 2 * oversampling * grid.stepPerDay; // 2/T
  const freqs: number[] = [];
  for (let k = 0; k < grid.count; k += stride) {
    const f = grid.minFreqPerDay + k * grid.stepPerDay;
    if (f >= mainLobePerDay) freqs.push(f);
  }
  if (freqs.length < 3) return [];
  const power = spectralWindow(tDays, weights, Float64Array.from(freqs)); // Deeming 1975
  const peaks: { f: number; p: number }[] = [];
  for (let k = 1; k + 1 < power.length; k++) {
    if (power[k] >= WINDOW_PEAK_MIN_POWER && power[k] >= power[k - 1] && power[k] > power[k + 1]) peaks.push({ f: freqs[k], p: power[k] });
  }
  return peaks.sort((a, b) => b.p - a.p).slice(0, WINDOW_PEAK_COUNT).map((x) => x.f);
}
