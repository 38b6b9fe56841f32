import { periodogramWeights, weightedMeanAndSpread } from './periodogram-inputs';
import { generalizedPowerFromSums } from './generalized-power-from-sums';

/**
 * Generalized Lomb–Scargle periodogram (floating mean, weights 1/σ²) by the
 * direct O(N·M) sum; the reference for the fast method.
 *
 * @param tDays       sample times in days, any origin (Note 1)
 * @param y           residuals, any unit
 * @param sigma       1σ uncertainties of y, same unit; > 0
 * @param freqPerDay  trial frequencies, cycles per day
 * @returns           normalised power p ∈ [0, 1] per frequency (Note 2)
 *
 * Notes: 1. The time axis is centred on its midpoint so ω·t stays small and
 *    sin/cos keep their digits; the power does not depend on the origin.
 *    Every sin/cos is evaluated directly (no recurrence).
 * 2. p = 1 − χ²(f)/χ²(constant), ZK09 eq. 5 — the same as astropy's
 *    LombScargle(normalization='standard', fit_mean=True, center_data=True).
 * Throws RangeError for N < 3, σ ≤ 0, mismatched lengths.
 * Accuracy: agrees with astropy 5.2.1 to ≤1e-6 (tests/engine/periodogram).
 * References: Zechmeister & Kürster 2009, A&A 496, 577, eqs. 4–20.
 */
export function lombScargleDirect(
  tDays: Float64Array,
  y: Float64Array,
  sigma: Float64Array,
  freqPerDay: Float64Array,
): Float64Array {
  const w = periodogramWeights(tDays, y, sigma);
  const { meanY, spreadYY } = weightedMeanAndSpread(y, w);
  const n = tDays.length;
  const tCentredDays = centredTimesDays(tDays);
  const yCentred = new Float64Array(n);
  for (let i = 0; i < n; i++) yCentred[i] = y[i] - meanY;
  const power = new Float64Array(freqPerDay.length);
  for (let k = 0; k < freqPerDay.length; k++) {
    const omegaRadPerDay = 2 * Math.PI * freqPerDay[k];
    let c = 0, s = 0, yc = 0, ys = 0, c2 = 0, s2 = 0;
    for (let i = 0; i < n; i++) {
      const phase = omegaRadPerDay * tCentredDays[i];
      const cosP = Math.cos(phase);
      const sinP = Math.sin(phase);
      const wi = w[i];
      c += wi * cosP; // C = Σw cos ωt: Zechmeister & Kürster 2009, eq. 8
      s += wi * sinP; // S = Σw sin ωt: Zechmeister & Kürster 2009, eq. 9
      yc += wi * yCentred[i] * cosP; // YC: Zechmeister & Kürster 2009, eq. 11
      ys += wi * yCentred[i] * sinP; // YS: Zechmeister & Kürster 2009, eq. 12
      c2 += wi * (cosP * cosP - sinP * sinP); // cos 2ωt, for CC and SS
      s2 += wi * 2 * sinP * cosP; // sin 2ωt, for CS
    }
    power[k] = generalizedPowerFromSums({ c, s, yc, ys, c2, s2, spreadYY });
  }
  return power;
}

/** Times shifted so their midpoint is zero, days. */
function centredTimesDays(tDays: Float64Array): Float64Array {
  let lo = Infinity, hi = -Infinity;
  for (const t of tDays) { if (t < lo) lo = t; if (t > hi) hi = t; }
  const mid = 0.5 * (lo + hi);
  const out = new Float64Array(tDays.length);
  for (let i = 0; i < tDays.length; i++) out[i] = tDays[i] - mid;
  return out;
}
