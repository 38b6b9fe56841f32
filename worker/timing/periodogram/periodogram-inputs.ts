/**
 * Checks the inputs shared by every residual periodogram and turns the
 * uncertainties into normalised weights.
 *
 * @param tDays   sample times in days (any origin)
 * @param y       residuals, any unit
 * @param sigma   1σ uncertainties of y, same unit as y; finite and > 0
 * @returns       weights wᵢ = (1/σᵢ²)/Σ(1/σⱼ²), summing to 1 (Note 1)
 *
 * Notes: 1. Normalised weights as in Zechmeister & Kürster 2009, eq. 4.
 * Throws RangeError for fewer than 3 samples, mismatched lengths, non-finite
 * values or σ ≤ 0 (a weighted periodogram has no answer there).
 * References: Zechmeister & Kürster 2009, A&A 496, 577.
 */
export function periodogramWeights(tDays: Float64Array, y: Float64Array, sigma: Float64Array): Float64Array {
  const n = tDays.length;
  if (n < 3) throw new RangeError(`tDays: need at least 3 samples, got ${n}`);
  if (y.length !== n) throw new RangeError(`y: length ${y.length} differs from tDays length ${n}`);
  if (sigma.length !== n) throw new RangeError(`sigma: length ${sigma.length} differs from tDays length ${n}`);
  const w = new Float64Array(n);
  let total = 0;
  for (let i = 0; i < n; i++) {
    const s = sigma[i];
    if (!(s > 0) || !Number.isFinite(s)) throw new RangeError(`sigma[${i}]: must be finite and > 0, got ${s}`);
    if (!Number.isFinite(tDays[i])) throw new RangeError(`tDays[${i}]: must be finite, got ${tDays[i]}`);
    if (!Number.isFinite(y[i])) throw new RangeError(`y[${i}]: must be finite, got ${y[i]}`);
    w[i] = 1 / (s * s); // wᵢ ∝ 1/σᵢ²: Zechmeister & Kürster 2009, eq. 4
    total += w[i];
  }
  for (let i = 0; i < n; i++) w[i] /= total;
  return w;
}

/**
 * Weighted mean of y and the weighted variance YY about it (w sums to 1).
 * Data whose spread is within rounding of their size (every |yᵢ − Ȳ| ≤ 8ε·max|yᵢ|)
 * count as constant: YY = 0, so the power is 0 rather than rounding noise.
 */
export function weightedMeanAndSpread(y: Float64Array, w: Float64Array): { meanY: number; spreadYY: number } {
  let meanY = 0;
  for (let i = 0; i < y.length; i++) meanY += w[i] * y[i]; // Y = Σwᵢyᵢ: Zechmeister & Kürster 2009, eq. 7
  let spreadYY = 0;
  let maxDeviation = 0;
  let maxMagnitude = 0;
  for (let i = 0; i < y.length; i++) {
    const d = y[i] - meanY;
    spreadYY += w[i] * d * d; // YY = Σwᵢyᵢ² − Y², computed about the mean: Zechmeister & Kürster 2009, eq. 10
    maxDeviation = Math.max(maxDeviation, Math.abs(d));
    maxMagnitude = Math.max(maxMagnitude, Math.abs(y[i]));
  }
  if (maxDeviation <= 8 * Number.EPSILON * maxMagnitude) spreadYY = 0;
  return { meanY, spreadYY };
}
