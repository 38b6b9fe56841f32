/**
 * Normalised spectral window power of a sampling pattern.
 *
 * @param tDays       sample times in days (any origin; centred internally, Note 1)
 * @param weights     sample weights (e.g. 1/σ²), same length as tDays; all ≥ 0, sum > 0
 * @param freqPerDay  trial frequencies, cycles per day
 * @returns           |Σ w e^{2πi f t}|² / (Σ w)² at each frequency, dimensionless, in [0, 1]
 *
 * Notes:
 * 1. The times are centred on their mean before the phase 2π f t is formed; the modulus is
 *    unchanged by the shift and ω·t stays small, which saves digits in cos/sin.
 * 2. Peaks of the window at f_w produce aliases at f ± f_w of every real peak
 *    (Deeming 1975, §3); the window equals 1 at f = 0 by construction.
 * Accuracy: direct sum, relative error ≈ N·1e-16; O(N·M) for M frequencies.
 * References: Deeming 1975, Ap&SS 36, 137 (eq. for the spectral window W(ν)).
 */
export function spectralWindow(tDays: Float64Array, weights: Float64Array, freqPerDay: Float64Array): Float64Array {
  if (weights.length !== tDays.length) {
    throw new RangeError(`spectralWindow: weights length ${weights.length} differs from tDays length ${tDays.length}`);
  }
  let sumW = 0;
  let sumWt = 0;
  for (let i = 0; i < tDays.length; i++) {
    if (!(weights[i] >= 0)) throw new RangeError(`spectralWindow: weights[${i}] must be ≥ 0, got ${weights[i]}`);
    sumW += weights[i];
    sumWt += weights[i] * tDays[i];
  }
  if (!(sumW > 0)) throw new RangeError(`spectralWindow: weights must have a positive sum, got ${sumW}`);
  const meanDays = sumWt / sumW;
  const power = new Float64Array(freqPerDay.length);
  for (let k = 0; k < freqPerDay.length; k++) {
    const omegaRadPerDay = 2 * Math.PI * freqPerDay[k];
    let re = 0;
    let im = 0;
    for (let i = 0; i < tDays.length; i++) {
      const phase = omegaRadPerDay * (tDays[i] - meanDays);
      re += weights[i] * Math.cos(phase);
      im += weights[i] * Math.sin(phase);
    }
    power[k] = (re * re + im * im) / (sumW * sumW); // W(f) = |Σ w e^{2πift}|²/(Σw)²: Deeming 1975
  }
  return power;
}
