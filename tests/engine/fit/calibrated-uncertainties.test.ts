import { describe, expect, it } from 'vitest';
import { solveWeightedLeastSquares } from '../../../worker/timing/fit/weighted-least-squares';
import { createSeededNormal, createSeededUniform } from '../../../worker/timing/fit/seeded-normal';

// Common practice for calibrated uncertainties: with correct σ and a correct model, χ²/dof
// averages 1 and the pulls (fitted − true)/uncertainty are N(0, 1).
describe('uncertainties are calibrated on simulated linear-model data', () => {
  const datasets = 30;
  const n = 200;
  const truth = [3e-6, -2e-7, 5e-8, 1.5e-6]; // offset (s), slope (s/day), curvature (s/day²), sine amplitude (s)
  const p = truth.length;
  const reduced: number[] = [];
  const pulls: number[] = [];
  for (let d = 0; d < datasets; d++) {
    const normal = createSeededNormal(1000 + d);
    const uniform = createSeededUniform(5000 + d);
    const tDays = Float64Array.from({ length: n }, () => 400 * uniform() - 200); // centred time axis
    const sigmasS = Float64Array.from({ length: n }, () => 1e-7 * (0.5 + 3 * uniform())); // unequal errors
    const design = new Float64Array(n * p);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const row = [1, tDays[i] / 100, (tDays[i] / 100) ** 2, Math.sin((2 * Math.PI * tDays[i]) / 365.25)];
      row.forEach((v, j) => (design[j * n + i] = v));
      y[i] = row.reduce((s, v, j) => s + v * truth[j], 0) + sigmasS[i] * normal();
    }
    const fit = solveWeightedLeastSquares(design, n, p, y, sigmasS);
    reduced.push(fit.chi2 / (n - p));
    truth.forEach((t, j) => pulls.push((fit.solution[j] - t) / fit.uncertainties[j]));
  }

  it('reduced χ² averages within 1 ± 0.1 over 30 datasets', () => {
    const mean = reduced.reduce((s, v) => s + v, 0) / reduced.length;
    expect(Math.abs(mean - 1), `mean reduced χ² ${mean}`).toBeLessThan(0.1);
  });

  it('pulls have standard deviation within 1 ± 0.25 and mean near 0', () => {
    const mean = pulls.reduce((s, v) => s + v, 0) / pulls.length;
    const sd = Math.sqrt(pulls.reduce((s, v) => s + (v - mean) ** 2, 0) / (pulls.length - 1));
    expect(pulls.length).toBe(datasets * p);
    expect(Math.abs(sd - 1), `pull SD ${sd}`).toBeLessThan(0.25);
    expect(Math.abs(mean), `pull mean ${mean}`).toBeLessThan(4 / Math.sqrt(pulls.length)); // 4σ of the mean
  });
});
