/**
 * Dispersion measure at a time, from its value and derivatives at the epoch.
 */

/**
 * DM(t) = DM₀ + Σₖ D[k]·tʸ^(k+1)/(k+1)!   (Taylor series in Julian years).
 *
 * @param dmPcPerCm3      DM at the model epoch, pc cm⁻³
 * @param derivatives     D[k] = (k+1)-th time derivative, pc cm⁻³ yr^-(k+1) (docs/formats.md §2)
 * @param yearsSinceEpoch TDB Julian years (365.25 d) since the model epoch
 * @returns               pc cm⁻³
 * References: Taylor's theorem; the series and its year unit are the product's definition (docs/formats.md §2).
 */
export function dispersionMeasureAt(dmPcPerCm3: number, derivatives: readonly number[], yearsSinceEpoch: number): number {
  let dm = dmPcPerCm3;
  let term = 1;
  for (let k = 0; k < derivatives.length; k += 1) {
    term *= yearsSinceEpoch / (k + 1); // t^(k+1)/(k+1)!
    dm += derivatives[k] * term;
  }
  return dm;
}

/** ∂DM(t)/∂D[k] = t^(k+1)/(k+1)!, the Taylor coefficient of derivative k. */
export function dispersionTaylorCoefficient(k: number, yearsSinceEpoch: number): number {
  let term = 1;
  for (let j = 0; j <= k; j += 1) term *= yearsSinceEpoch / (j + 1);
  return term;
}
