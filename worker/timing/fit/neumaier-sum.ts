/**
 * Compensated summation (Neumaier's improvement of Kahan's algorithm).
 *
 * A plain running sum of 100 000 terms loses up to ~n·ε of the total; the
 * compensated sum keeps an error of about 2ε·Σ|x_i|, independent of n, at the
 * cost of a few extra additions per term. The fitting code uses it for χ²,
 * weighted means and every other long sum over TOAs.
 *
 * References: Neumaier 1974, ZAMM 54, 39 ("Rundungsfehleranalyse einiger
 * Verfahren zur Summation endlicher Summen"). Higham, Accuracy and Stability of
 * Numerical Algorithms (2nd ed., 2002), §4.3.
 */

/** A running compensated sum: call `add` per term, read `value` at the end. */
export class NeumaierSum {
  private sum = 0;
  private compensation = 0;

  /** Adds one term. */
  add(x: number): void {
    const t = this.sum + x;
    // The branch keeps the rounding error of whichever operand is smaller: Neumaier 1974.
    if (Math.abs(this.sum) >= Math.abs(x)) this.compensation += this.sum - t + x;
    else this.compensation += x - t + this.sum;
    this.sum = t;
  }

  /** The compensated total so far. */
  get value(): number {
    return this.sum + this.compensation;
  }
}

/**
 * Σ x_i with Neumaier compensation.
 *
 * @param values  the terms, any units (the result has the same units)
 * @returns       the sum; error ≈ 2ε·Σ|x_i| (module header)
 */
export function neumaierSum(values: ArrayLike<number>): number {
  const acc = new NeumaierSum();
  for (let i = 0; i < values.length; i++) acc.add(values[i]);
  return acc.value;
}
