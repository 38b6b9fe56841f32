/**
 * Value and first derivative of a Chebyshev series Σ cₙ Tₙ(τ), n = 0 … count−1.
 *
 * @param coefficients  array holding the series
 * @param start         index of c₀ in `coefficients`
 * @param count         number of coefficients
 * @param tau           normalised time, −1 ≤ τ ≤ 1
 * @param out           out[outIndex] = value, out[outIndex + 1] = d(value)/dτ
 *
 * Notes: 1. Tₙ₊₁ = 2τTₙ − Tₙ₋₁ and Tₙ₊₁′ = 2Tₙ + 2τTₙ′ − Tₙ₋₁′ (recurrences of the
 *           Chebyshev polynomials of the first kind; Abramowitz & Stegun 1964, 22.7.4).
 * Accuracy: rounding only (~1e-16 relative to the largest term).
 * References: Newhall 1989, Celest. Mech. 45, 305 (Chebyshev representation of ephemerides).
 */
export function chebyshevValueAndDerivative(
  coefficients: Float64Array,
  start: number,
  count: number,
  tau: number,
  out: Float64Array,
  outIndex = 0,
): void {
  let tPrevious = 1; // T₀
  let tCurrent = tau; // T₁
  let dPrevious = 0; // T₀′
  let dCurrent = 1; // T₁′
  let value = coefficients[start] + (count > 1 ? coefficients[start + 1] * tau : 0);
  let derivative = count > 1 ? coefficients[start + 1] : 0;
  const twoTau = 2 * tau;
  for (let n = 2; n < count; n++) {
    const tNext = twoTau * tCurrent - tPrevious; // A&S 22.7.4
    const dNext = 2 * tCurrent + twoTau * dCurrent - dPrevious; // derivative of the same recurrence
    value += coefficients[start + n] * tNext;
    derivative += coefficients[start + n] * dNext;
    tPrevious = tCurrent;
    tCurrent = tNext;
    dPrevious = dCurrent;
    dCurrent = dNext;
  }
  out[outIndex] = value;
  out[outIndex + 1] = derivative;
}
