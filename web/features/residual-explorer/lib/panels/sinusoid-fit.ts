/** A sinusoid fitted at one fixed frequency: y ≈ offset + amplitude·sin(2π·f·(t − zeroPhaseDays)). */
export interface FixedFrequencySinusoid {
  /** semi-amplitude, same unit as y; ≥ 0 */
  readonly amplitude: number;
  /** formal 1σ of the amplitude, same unit as y */
  readonly amplitudeUncertainty: number;
  /** a time (days, same origin as tDays) where the sinusoid crosses its offset upwards, within half a period of the data's weighted mean time (Note 4) */
  readonly zeroPhaseDays: number;
  /** constant term, same unit as y */
  readonly offset: number;
  /** χ² explained by the constant and the sinusoid together, cᵀ·(Σ w·g·y); larger is a better fit (Note 3) */
  readonly explainedChi2: number;
}

/**
 * Weighted least-squares fit of y = c + a·cos ωt + b·sin ωt at a fixed ω = 2πf (the model whose
 * χ² reduction the generalized Lomb–Scargle power measures), returned as amplitude and phase.
 *
 * @param tDays       sample times, days (any origin; centred internally, Note 1)
 * @param y           samples, any unit
 * @param sigma       1σ uncertainties of y, same unit; > 0
 * @param freqPerDay  the frequency, cycles per day; > 0
 * @returns           amplitude A = √(a² + b²), its 1σ, the upward zero crossing and the offset (Note 2)
 *
 * Notes:
 * 1. The times are centred on their weighted mean before ωt is formed, which keeps the phase small
 *    and the 3×3 normal equations well conditioned; the crossing is shifted back afterwards.
 * 2. a·cos ωt + b·sin ωt = A·sin(ω(t − t₀)) with A = √(a² + b²), ωt₀ = −atan2(a, b).
 *    σ_A from the covariance: σ_A² = (a²·Caa + 2ab·Cab + b²·Cbb)/A² (first-order propagation).
 * 3. χ²(fit) = Σw·y² − cᵀ·r for the least-squares coefficients c and r = Σ w·g·y, so comparing
 *    cᵀ·r between frequencies compares the fits' χ² (the quantity the periodogram power normalises).
 * 4. zeroPhaseDays is put within half a period of the weighted mean time (where the phase is best
 *    determined), then reduced to [0, 1/f) only if `nearOrigin` is set.
 * Throws RangeError for fewer than 3 samples, mismatched lengths, σ ≤ 0 or f ≤ 0, or when the
 * normal equations are singular (all samples at one phase).
 * References: Zechmeister & Kürster 2009, A&A 496, 577, §2 (the floating-mean sinusoid model);
 *   Press et al. 2007, Numerical Recipes 3rd ed., §15.4 (normal equations and covariance).
 */
export function fitSinusoidAtFrequency(
  tDays: Float64Array,
  y: Float64Array,
  sigma: Float64Array,
  freqPerDay: number,
  nearOrigin = false,
): FixedFrequencySinusoid {
  const n = tDays.length;
  if (n < 3) throw new RangeError(`tDays: need at least 3 samples, got ${n}`);
  if (y.length !== n || sigma.length !== n) throw new RangeError(`y (${y.length}) and sigma (${sigma.length}) must match tDays (${n})`);
  if (!(freqPerDay > 0) || !Number.isFinite(freqPerDay)) throw new RangeError(`freqPerDay: must be finite and > 0, got ${freqPerDay}`);
  let sumW = 0;
  let sumWt = 0;
  for (let i = 0; i < n; i++) {
    if (!(sigma[i] > 0) || !Number.isFinite(sigma[i])) throw new RangeError(`sigma[${i}]: must be finite and > 0, got ${sigma[i]}`);
    const w = 1 / (sigma[i] * sigma[i]);
    sumW += w;
    sumWt += w * tDays[i];
  }
  const centreDays = sumWt / sumW;
  const omega = 2 * Math.PI * freqPerDay;
  // Normal matrix Σ w·g·gᵀ and right side r = Σ w·g·y for the basis g = (1, cos ωt, sin ωt).
  let sw = 0, sc = 0, ss = 0, scc = 0, scs = 0, sss = 0, ry = 0, rc = 0, rs = 0;
  for (let i = 0; i < n; i++) {
    const w = 1 / (sigma[i] * sigma[i]);
    const phase = omega * (tDays[i] - centreDays);
    const c = Math.cos(phase);
    const sn = Math.sin(phase);
    sw += w;
    sc += w * c;
    ss += w * sn;
    scc += w * c * c;
    scs += w * c * sn;
    sss += w * sn * sn;
    ry += w * y[i];
    rc += w * c * y[i];
    rs += w * sn * y[i];
  }
  const r = [ry, rc, rs];
  const cov = invertSymmetric3(Float64Array.from([sw, sc, ss, sc, scc, scs, ss, scs, sss]));
  const coef = [0, 1, 2].map((j) => cov[3 * j] * r[0] + cov[3 * j + 1] * r[1] + cov[3 * j + 2] * r[2]);
  const [offset, a, b] = coef;
  const amplitude = Math.hypot(a, b);
  const amplitudeUncertainty =
    amplitude > 0
      ? Math.sqrt((a * a * cov[4] + 2 * a * b * cov[5] + b * b * cov[8]) / (amplitude * amplitude)) // first-order propagation of (a, b) → A
      : Math.sqrt(0.5 * (cov[4] + cov[8]));
  const periodDays = 1 / freqPerDay;
  const crossingCentred = -Math.atan2(a, b) / omega; // a·cos ωt + b·sin ωt = A·sin(ω(t − t₀)), ωt₀ = −atan2(a, b)
  const nearCentre = positiveModulo(crossingCentred + 0.5 * periodDays, periodDays) - 0.5 * periodDays + centreDays;
  const zeroPhaseDays = nearOrigin ? positiveModulo(nearCentre, periodDays) : nearCentre;
  const explainedChi2 = coef[0] * r[0] + coef[1] * r[1] + coef[2] * r[2]; // χ²_fit = Σwy² − cᵀr: Note 3
  return { amplitude, amplitudeUncertainty, zeroPhaseDays, offset, explainedChi2 };
}

/** x mod m in [0, m). */
export function positiveModulo(x: number, m: number): number {
  const r = x % m;
  return r < 0 ? r + m : r;
}

/** Inverse of a symmetric 3×3 matrix (row-major) by cofactors; RangeError when singular. */
function invertSymmetric3(m: Float64Array): Float64Array {
  const [a, b, c, , d, e, , , f] = m;
  const c00 = d * f - e * e;
  const c01 = c * e - b * f;
  const c02 = b * e - c * d;
  const det = a * c00 + b * c01 + c * c02;
  const scale = Math.abs(a * d * f) || 1;
  if (!(Math.abs(det) > 1e-12 * scale)) throw new RangeError('fitSinusoidAtFrequency: the samples do not constrain a sinusoid at this frequency (singular normal equations)');
  const c11 = a * f - c * c;
  const c12 = b * c - a * e;
  const c22 = a * d - b * b;
  return Float64Array.from([c00, c01, c02, c01, c11, c12, c02, c12, c22].map((v) => v / det));
}

// 0.618¹⁶ ≈ 4.5e-4 of the ±1-step bracket: frequency to ~1e-3 grid step, i.e. ≤ 2e-4 turns of phase drift over the span
const GOLDEN_STEPS = 16;
const INVERSE_GOLDEN = (Math.sqrt(5) - 1) / 2;

/**
 * The frequency within ±halfWidthPerDay of `freqPerDay` where the fixed-frequency sinusoid fits
 * best (largest explained χ²), by golden-section search; refines a periodogram grid peak to well
 * below the grid step.
 *
 * @param halfWidthPerDay  half-width of the bracket, cycles per day (e.g. one grid step); > 0
 * @returns                the refined frequency, cycles per day
 * Notes: assumes one maximum inside the bracket (true within a grid step of a sampled peak).
 * References: Kiefer 1953, Proc. AMS 4, 502 (golden-section search).
 */
export function refinePeakFrequency(
  tDays: Float64Array,
  y: Float64Array,
  sigma: Float64Array,
  freqPerDay: number,
  halfWidthPerDay: number,
): number {
  if (!(halfWidthPerDay > 0)) throw new RangeError(`halfWidthPerDay: must be > 0, got ${halfWidthPerDay}`);
  const score = (f: number) => fitSinusoidAtFrequency(tDays, y, sigma, f).explainedChi2;
  let lo = Math.max(freqPerDay - halfWidthPerDay, freqPerDay * 1e-3);
  let hi = freqPerDay + halfWidthPerDay;
  let x1 = hi - INVERSE_GOLDEN * (hi - lo);
  let x2 = lo + INVERSE_GOLDEN * (hi - lo);
  let s1 = score(x1);
  let s2 = score(x2);
  for (let step = 0; step < GOLDEN_STEPS; step++) {
    if (s1 > s2) {
      hi = x2;
      x2 = x1;
      s2 = s1;
      x1 = hi - INVERSE_GOLDEN * (hi - lo);
      s1 = score(x1);
    } else {
      lo = x1;
      x1 = x2;
      s1 = s2;
      x2 = lo + INVERSE_GOLDEN * (hi - lo);
      s2 = score(x2);
    }
  }
  return 0.5 * (lo + hi);
}
