/**
 * One round's residual periodogram: the fit's residuals as a weighted time
 * series, the generalized Lomb–Scargle power on the search grid, the highest
 * peak (refined between grid points) and its false-alarm probability.
 */
import type { ArrivalGeometry } from '../pipeline/arrival-geometry';
import type { TimingFitResult } from '../pipeline/fit-prepared-arrivals';
import { lombScargleFast } from '../periodogram/lomb-scargle-fast';
import { lombScargleDirect } from '../periodogram/lomb-scargle-direct';
import { falseAlarmBaluev } from '../periodogram/false-alarm-probability';
import { gridFrequenciesPerDay, type FrequencyGrid } from '../periodogram/frequency-grid';

/** Residuals of a fit as a weighted time series. */
export interface ResidualSeries {
  /** observatory TDB arrival − referenceDay, days (Note 1 of residualSeries) */
  tDays: Float64Array;
  /** integer MJD the times count from */
  referenceDay: number;
  residualUs: Float64Array;
  sigmaUs: Float64Array;
  /** 1/σ², µs⁻² */
  weights: Float64Array;
}

/**
 * The residual series of a fit.
 *
 * @param fit       fitPreparedArrivals(…) on the TOAs of `geometry` (same order)
 * @param geometry  the arrival geometry (its TDB arrival instants give the times)
 * @returns         times (days from the first TOA's integer MJD), residuals and σ in µs, weights 1/σ²
 *
 * Notes: 1. The times are the arrivals at the observatory in TDB, not at the barycentre: the
 *           difference (≤ 500 s) shifts the phase of a period P by at most 2π·0.006 d/P, negligible
 *           for the periods searched (≥ 1 d by default), and the orbit fit that follows uses the full
 *           barycentric chain anyway. Day and fraction are differenced separately (integer day first).
 */
export function residualSeries(fit: TimingFitResult, geometry: ArrivalGeometry): ResidualSeries {
  const n = fit.residuals.length;
  let referenceDay = Infinity;
  for (const t of geometry.tdb) referenceDay = Math.min(referenceDay, t.day);
  const tDays = new Float64Array(n);
  const residualUs = new Float64Array(n);
  const sigmaUs = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = geometry.tdb[i];
    tDays[i] = (t.day - referenceDay) + (t.frac[1] + t.frac[0]); // integer days first, then the fraction
    residualUs[i] = fit.residuals[i].residualUs;
    sigmaUs[i] = fit.residuals[i].uncertaintyUs;
    weights[i] = 1 / (sigmaUs[i] * sigmaUs[i]);
  }
  return { tDays, referenceDay, residualUs, sigmaUs, weights };
}

export interface RoundPeriodogram {
  grid: FrequencyGrid;
  frequencyPerDay: Float64Array;
  power: Float64Array;
  /** the highest peak, refined between grid points (Note 2 of roundPeriodogram) */
  peakFrequencyPerDay: number;
  peakPower: number;
  falseAlarmProbability: number;
}

/** Points of the local direct evaluation across ±1 grid step around the highest grid point. */
const REFINEMENT_POINTS = 41;

/**
 * Periodogram of a residual series on `grid` and the false-alarm probability of its highest peak.
 *
 * @param series  residualSeries(…)
 * @param grid    periodogramGrid(…) of the search
 * @returns       power per grid frequency, the refined highest peak and its false-alarm probability
 *
 * Notes: 1. Power: generalized Lomb–Scargle with a floating mean and weights 1/σ² (Zechmeister &
 *           Kürster 2009), evaluated by extirpolation and FFTs (lombScargleFast).
 *        2. The highest grid point is refined with the direct sum at 41 frequencies across ±1 grid step
 *           (a 5× oversampled grid can miss the true top by ~1/10 of the peak width).
 *        3. False-alarm probability: Baluev 2008 for the highest peak over frequencies up to the grid's
 *           last one, with the same weights. The residuals come from a fit that removed the timing
 *           model's own parameters; the test ignores those few lost degrees of freedom (N ≫ p).
 */
export function roundPeriodogram(series: ResidualSeries, grid: FrequencyGrid): RoundPeriodogram {
  const { tDays, residualUs, sigmaUs, weights } = series;
  const power = lombScargleFast(tDays, residualUs, sigmaUs, grid);
  let best = 0;
  for (let k = 1; k < power.length; k++) if (power[k] > power[best]) best = k;
  const frequencyPerDay = gridFrequenciesPerDay(grid);
  const local = new Float64Array(REFINEMENT_POINTS);
  const lo = Math.max(grid.minFreqPerDay, frequencyPerDay[best] - grid.stepPerDay);
  const hi = Math.min(frequencyPerDay[grid.count - 1], frequencyPerDay[best] + grid.stepPerDay);
  for (let j = 0; j < REFINEMENT_POINTS; j++) local[j] = lo + ((hi - lo) * j) / (REFINEMENT_POINTS - 1);
  const localPower = lombScargleDirect(tDays, residualUs, sigmaUs, local);
  let peakFrequencyPerDay = frequencyPerDay[best];
  let peakPower = power[best];
  for (let j = 0; j < REFINEMENT_POINTS; j++) {
    if (localPower[j] > peakPower) {
      peakPower = localPower[j];
      peakFrequencyPerDay = local[j];
    }
  }
  const fMaxPerDay = frequencyPerDay[grid.count - 1];
  const falseAlarmProbability = falseAlarmBaluev(Math.min(1, Math.max(0, peakPower)), tDays.length, fMaxPerDay, tDays, weights); // Baluev 2008
  return { grid, frequencyPerDay, power, peakFrequencyPerDay, peakPower, falseAlarmProbability };
}
