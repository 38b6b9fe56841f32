/**
 * Numerical first derivatives by Richardson-extrapolated central differences,
 * for model parameters whose analytic derivative is not (yet) written down.
 *
 * Scheme: D(h) = (f(+h) − f(−h)) / 2h has error c₂h² + c₄h⁴ + …; the
 * combination (4·D(h/2) − D(h)) / 3 cancels the h² term, leaving O(h⁴)
 * (Richardson 1911, Phil. Trans. R. Soc. A 210, 307; Press et al., Numerical
 * Recipes 3rd ed. 2007, §5.7). Four evaluations per derivative.
 *
 * Step-size rule: h = L·2⁻⁹ ≈ 0.002·L, with L the caller's `stepScale`: the
 * distance over which the function changes by about its own size (for
 * example |x| for a smooth function of a large x, 1 for an angle in radians,
 * 1/(2π·f) for a phase that turns over at frequency f). With f⁽ᵏ⁾ ≈ |f|/Lᵏ the
 * truncation error is ≈ (h/L)⁴/480 ≈ 3e-14 and the rounding error ≈ 3ε·L/h ≈
 * 3e-13 (relative to |f|/L), whose sum is smallest near this h. The power of
 * two keeps h and h/2 exact. A step scale 10× too large multiplies the
 * truncation error by 10⁴, one 10× too small the rounding error by 10; both
 * stay ≤ 1e-7 relative on the test functions, within the 1e-6 promise.
 *
 * Accuracy: ≤ 1e-10 relative on sin, exp, a quintic and Kepler's equation with
 * e = 0.6 (tests/engine/fit/numeric-derivative.test.ts; the promise is ≤ 1e-6).
 */

/** h = L·2⁻⁹ (module header: step-size rule). */
const STEP_FRACTION_OF_SCALE = 2 ** -9;

/**
 * df/dx at the point where `offset` = 0.
 *
 * @param fOfOffset  f evaluated at (x + offset); the caller adds the offset, so x
 *                   may be a double-double parameter and the offset stays a small float64
 * @param stepScale  L > 0, in x's units (module header)
 * @returns          the derivative, f's units per x unit
 * Throws RangeError when stepScale is not finite and > 0.
 */
export function numericDerivative(fOfOffset: (offset: number) => number, stepScale: number): number {
  const h = stepFor(stepScale);
  const wide = (fOfOffset(h) - fOfOffset(-h)) / (2 * h); // central difference: Numerical Recipes §5.7
  const narrow = (fOfOffset(h / 2) - fOfOffset(-h / 2)) / h;
  return (4 * narrow - wide) / 3; // Richardson: cancels the h² term
}

/**
 * ∂f_i/∂x for a vector-valued f (for example all residuals with respect to one
 * parameter: one column of a fit's design matrix).
 *
 * @param fOfOffset  the vector f at (x + offset), a fresh or reused array of a fixed length
 * @param stepScale  L > 0, in x's units (module header)
 * @returns          a new Float64Array of the derivatives, f's units per x unit
 * Throws RangeError when stepScale is not finite and > 0 or the lengths differ.
 */
export function numericDerivativeColumn(
  fOfOffset: (offset: number) => Float64Array,
  stepScale: number,
): Float64Array {
  const h = stepFor(stepScale);
  // Each evaluation is consumed before the next, so a caller may reuse one output array.
  const out = Float64Array.from(fOfOffset(h));
  accumulate(out, fOfOffset(-h), -1);
  for (let i = 0; i < out.length; i++) out[i] *= -1 / (6 * h); // −wide/3 = −(f₊ − f₋)/(6h)
  const narrowPlus = Float64Array.from(fOfOffset(h / 2));
  accumulate(narrowPlus, fOfOffset(-h / 2), -1);
  for (let i = 0; i < out.length; i++) out[i] += (4 / 3) * (narrowPlus[i] / h); // + 4·narrow/3
  return out;
}

function stepFor(stepScale: number): number {
  if (!(Number.isFinite(stepScale) && stepScale > 0)) {
    throw new RangeError(`numericDerivative: stepScale must be finite and > 0, got ${stepScale}`);
  }
  return stepScale * STEP_FRACTION_OF_SCALE;
}

function accumulate(target: Float64Array, values: Float64Array, factor: number): void {
  if (values.length !== target.length) {
    throw new RangeError(`numericDerivativeColumn: f returned ${values.length} values, expected ${target.length}`);
  }
  for (let i = 0; i < target.length; i++) target[i] += factor * values[i];
}
