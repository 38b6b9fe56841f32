/**
 * Starting elements for a new companion from the residuals: a circular orbit
 * from the sinusoid at the periodogram peak, then eccentricity and periastron
 * longitude from the second harmonic left after the circular fit.
 */
import type { KeplerianCompanion } from '../model/timing-model';
import { solveWeightedLeastSquares } from '../fit/weighted-least-squares';
import { mjdFromParts } from '../time/mjd-arithmetic';
import { keplerianFromLowEccentricity } from '../orbits/low-eccentricity-delay';
import type { ResidualSeries } from './residual-periodogram';

const TWO_PI = 2 * Math.PI;
const LT_S_PER_US = 1e-6;

/**
 * Sign of the residual a missing delay leaves: residual = observed − model, and an
 * unmodelled delay Δ makes the pulses arrive later than predicted, so residual ≈ +Δ.
 */
export const RESIDUAL_SIGN_OF_MISSING_DELAY = 1;

/** Eccentricity the eccentric fit starts from when the second harmonic suggests less (Note 2 of eccentricSeed). */
export const MIN_START_ECCENTRICITY = 0.02;
/** … and at most (the first-order seed is poor beyond it). */
export const MAX_START_ECCENTRICITY = 0.5;

export interface HarmonicFit {
  /** r ≈ offset + sinUs·sin(2πkft) + cosUs·cos(2πkft), t in the series' days */
  offsetUs: number;
  sinUs: number;
  cosUs: number;
  sinUncertaintyUs: number;
  cosUncertaintyUs: number;
}

/**
 * Weighted linear least-squares fit of a constant and one sinusoid to the residuals.
 *
 * @param series        residualSeries(…)
 * @param freqPerDay    frequency of the sinusoid, cycles per day
 * @param originDays    phase origin, in the series' days (t − originDays enters the sin/cos)
 * @returns             the sine and cosine amplitudes (µs) with their formal 1σ
 * Throws TimingInputError (from the solver) when the sinusoid is degenerate with the constant.
 */
export function fitHarmonic(series: ResidualSeries, freqPerDay: number, originDays = 0): HarmonicFit {
  const n = series.tDays.length;
  const design = new Float64Array(3 * n);
  for (let i = 0; i < n; i++) {
    const phase = TWO_PI * freqPerDay * (series.tDays[i] - originDays);
    design[i] = 1;
    design[n + i] = Math.sin(phase);
    design[2 * n + i] = Math.cos(phase);
  }
  const s = solveWeightedLeastSquares(design, n, 3, series.residualUs, series.sigmaUs, ['constant', 'sine', 'cosine']);
  return { offsetUs: s.solution[0], sinUs: s.solution[1], cosUs: s.solution[2], sinUncertaintyUs: s.uncertainties[1], cosUncertaintyUs: s.uncertainties[2] };
}

/** Weighted mean of the series' times, days. */
export function weightedMeanTimeDays(series: ResidualSeries): number {
  let sw = 0;
  let swt = 0;
  for (let i = 0; i < series.tDays.length; i++) {
    sw += series.weights[i];
    swt += series.weights[i] * series.tDays[i];
  }
  return swt / sw;
}

/**
 * A circular Keplerian companion that reproduces the sinusoid at `periodDays` in the residuals.
 *
 * @param name        companion name
 * @param periodDays  trial period (the refined periodogram peak), days
 * @param series      residuals of the fit without this companion
 * @returns           e = 0, ω = 0, x = the sinusoid's amplitude, T₀ from its phase, nearest the
 *                    weighted mean time (Note 1)
 *
 * Notes: 1. For e = 0 and ω = 0 the Blandford–Teukolsky delay is x·sin(2π(t − T₀)/Pb) (Blandford &
 *           Teukolsky 1976, ApJ 205, 580, with α = 0, β = x). The residual of the missing delay is
 *           +Δ (RESIDUAL_SIGN_OF_MISSING_DELAY), so A·sin(2πft + φ) gives x = A and T₀ = −φ/(2πf);
 *           T₀ is moved by whole periods to the middle of the data, which keeps period and epoch
 *           nearly uncorrelated in the fit.
 */
export function circularSeed(name: string, periodDays: number, series: ResidualSeries): KeplerianCompanion {
  const freqPerDay = 1 / periodDays;
  const h = fitHarmonic(series, freqPerDay);
  const amplitudeUs = Math.hypot(h.sinUs, h.cosUs);
  let phaseRad = Math.atan2(h.cosUs, h.sinUs); // A sin(θ + φ) = A cos φ sin θ + A sin φ cos θ
  if (RESIDUAL_SIGN_OF_MISSING_DELAY < 0) phaseRad += Math.PI;
  const meanDays = weightedMeanTimeDays(series);
  let epochDays = (-phaseRad / TWO_PI) * periodDays;
  epochDays += Math.round((meanDays - epochDays) / periodDays) * periodDays;
  return {
    kind: 'keplerian',
    name,
    enabled: true,
    periodDays,
    projectedSemimajorAxisLtS: amplitudeUs * LT_S_PER_US,
    eccentricity: 0,
    periastronLongitudeDeg: 0,
    periastronEpochMjd: mjdFromParts(series.referenceDay, epochDays),
    periodDerivative: 0,
    periastronAdvanceDegPerYr: 0,
    einsteinDelayS: 0,
  };
}

/**
 * Eccentric starting elements for a companion fitted as circular (e = 0, ω = 0).
 *
 * @param circular  the fitted circular companion (its T₀ is then the ascending-node epoch)
 * @param series    residuals of the circular fit
 * @returns         the same orbit with e and ω from the second harmonic (Notes 1–2)
 *
 * Notes: 1. To first order in e the orbit delay is x[sin Φ + (κ/2) sin 2Φ − (η/2) cos 2Φ],
 *           Φ = 2π(t − T_asc)/Pb, η = e sin ω, κ = e cos ω (Lange et al. 2001, MNRAS 326, 274, §2);
 *           a linear fit of sin 2Φ and cos 2Φ to the circular fit's residuals gives κ and η, and
 *           keplerianFromLowEccentricity turns them into e, ω and T₀.
 *        2. e is clamped into [0.02, 0.5] keeping ω, so the fit starts away from e = 0, where ω and
 *           T₀ are degenerate, and inside the range where the first-order seed is fair.
 */
export function eccentricSeed(circular: KeplerianCompanion, series: ResidualSeries): KeplerianCompanion {
  const ascendingNodeDays = (circular.periastronEpochMjd.day - series.referenceDay) + (circular.periastronEpochMjd.frac[1] + circular.periastronEpochMjd.frac[0]);
  const x = circular.projectedSemimajorAxisLtS / LT_S_PER_US;
  let kappa = 0;
  let eta = 0;
  try {
    const h = fitHarmonic(series, 2 / circular.periodDays, ascendingNodeDays);
    kappa = (2 * h.sinUs) / (RESIDUAL_SIGN_OF_MISSING_DELAY * x); // κ/2 multiplies sin 2Φ: Lange et al. 2001 §2
    eta = (-2 * h.cosUs) / (RESIDUAL_SIGN_OF_MISSING_DELAY * x); // −η/2 multiplies cos 2Φ: Lange et al. 2001 §2
  } catch {
    // a harmonic degenerate with the constant (extremely sparse sampling): start from ω = 0
  }
  let e = Math.hypot(kappa, eta);
  if (!Number.isFinite(e)) { kappa = 0; eta = 0; e = 0; }
  const clamped = Math.min(MAX_START_ECCENTRICITY, Math.max(MIN_START_ECCENTRICITY, e));
  if (e === 0) { kappa = clamped; eta = 0; } else { kappa *= clamped / e; eta *= clamped / e; }
  return {
    ...keplerianFromLowEccentricity({
      kind: 'low-eccentricity',
      name: circular.name,
      enabled: circular.enabled,
      periodDays: circular.periodDays,
      projectedSemimajorAxisLtS: circular.projectedSemimajorAxisLtS,
      ascendingNodeEpochMjd: circular.periastronEpochMjd,
      eSinOmega: eta,
      eCosOmega: kappa,
      periodDerivative: circular.periodDerivative,
    }),
    periastronAdvanceDegPerYr: circular.periastronAdvanceDegPerYr,
    einsteinDelayS: circular.einsteinDelayS,
  };
}
