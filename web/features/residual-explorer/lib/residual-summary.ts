/**
 * The figures of the explorer's summary line, over the TOAs in use (not excluded now),
 * with the engine's own definitions (worker/timing/fit/fit-statistics.ts).
 */
import { chiSquare, reducedChiSquare, weightedRms } from '../../../../worker/timing/fit/fit-statistics';

export interface ResidualSummary {
  usedCount: number;
  excludedCount: number;
  /** In use but without a residual (not evaluable); counted in neither figure. */
  unevaluatedCount: number;
  weightedRmsUs: number; // NaN with no TOA in use
  chi2: number;
  dof: number;
  reducedChi2: number; // NaN when dof ≤ 0
}

/**
 * @param residualUs     residual per TOA, µs (the shown ones: fitted or previewed); NaN = not evaluated
 * @param uncertaintyUs  effective 1σ per TOA, µs
 * @param isExcluded     whether TOA i is excluded now
 * @param freeParameters parameters the fit adjusts, including its phase offset (dof = n − this)
 */
export function residualSummary(
  residualUs: ArrayLike<number>,
  uncertaintyUs: ArrayLike<number>,
  isExcluded: (i: number) => boolean,
  freeParameters: number,
): ResidualSummary {
  const used: number[] = [];
  let unevaluated = 0;
  for (let i = 0; i < residualUs.length; i++) {
    if (isExcluded(i)) continue;
    if (Number.isFinite(residualUs[i])) used.push(i);
    else unevaluated += 1; // no residual: the engine could not evaluate this TOA
  }
  const r = Float64Array.from(used, (i) => residualUs[i]);
  const s = Float64Array.from(used, (i) => uncertaintyUs[i]);
  const chi2 = used.length > 0 ? chiSquare(r, s) : Number.NaN;
  const dof = used.length - freeParameters;
  return {
    usedCount: used.length,
    excludedCount: residualUs.length - used.length - unevaluated,
    unevaluatedCount: unevaluated,
    weightedRmsUs: used.length > 0 ? weightedRms(r, s) : Number.NaN,
    chi2,
    dof,
    reducedChi2: reducedChiSquare(chi2, dof),
  };
}
