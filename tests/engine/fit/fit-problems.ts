/**
 * Small invented non-linear problems for the Gauss–Newton tests, with analytic
 * design matrices in the engine's convention (residual = observed − model,
 * design = ∂residual/∂parameter).
 */
import type { DoubleDouble } from '../../../worker/timing/time/epoch';
import type { FitEvaluation, FitProblem } from '../../../worker/timing/fit/gauss-newton-fit';
import { numericDerivativeColumn } from '../../../worker/timing/fit/numeric-derivative';
import { createSeededNormal } from '../../../worker/timing/fit/seeded-normal';

const dd = (x: number): DoubleDouble => [0, x];
const num = (x: DoubleDouble): number => x[1] + x[0];

export interface SimulatedProblem {
  problem: FitProblem;
  truth: number[];
  /** how many times evaluate was called, by wantDesign */
  calls: { withDesign: number; withoutDesign: number };
}

/** y = A·sin(2π t/P + φ) + noise, t in days, y in seconds; parameters A (s), P (days), φ (rad). */
export function sinusoidProblem(start: number[], seed = 11, maxIterations?: number): SimulatedProblem {
  const truth = [2e-6, 2.3, 0.4];
  const n = 400;
  const sigmaS = 1e-7;
  const normal = createSeededNormal(seed);
  const tDays = Float64Array.from({ length: n }, (_, i) => (20 * i) / (n - 1));
  const model = (a: number, periodDays: number, phaseRad: number, t: number) =>
    a * Math.sin((2 * Math.PI * t) / periodDays + phaseRad);
  const observed = tDays.map((t) => model(truth[0], truth[1], truth[2], t) + sigmaS * normal());
  const calls = { withDesign: 0, withoutDesign: 0 };
  const problem: FitProblem = {
    parameterNames: ['amplitudeS', 'periodDays', 'phaseRad'],
    initialValues: start.map(dd),
    sigmasS: new Float64Array(n).fill(sigmaS),
    maxIterations,
    evaluate(values, wantDesign): FitEvaluation {
      wantDesign ? calls.withDesign++ : calls.withoutDesign++;
      const [a, periodDays, phaseRad] = values.map(num);
      const residualsS = new Float64Array(n);
      const design = wantDesign ? new Float64Array(3 * n) : undefined;
      for (let i = 0; i < n; i++) {
        const theta = (2 * Math.PI * tDays[i]) / periodDays + phaseRad;
        residualsS[i] = observed[i] - a * Math.sin(theta);
        if (design) {
          design[i] = -Math.sin(theta); // ∂r/∂A
          design[n + i] = (a * Math.cos(theta) * 2 * Math.PI * tDays[i]) / (periodDays * periodDays); // ∂r/∂P
          design[2 * n + i] = -a * Math.cos(theta); // ∂r/∂φ
        }
      }
      return { residualsS, design };
    },
  };
  return { problem, truth, calls };
}

/** y = a·exp(−t/τ) + c + noise; design by numerical differentiation (numericDerivativeColumn). */
export function decayProblem(start: number[], seed = 5, maxIterations?: number): SimulatedProblem {
  const truth = [5e-6, 3.0, 1e-7];
  const n = 300;
  const normal = createSeededNormal(seed);
  const tDays = Float64Array.from({ length: n }, (_, i) => (15 * i) / (n - 1));
  const sigmasS = Float64Array.from({ length: n }, (_, i) => 5e-8 * (1 + (i % 3)));
  const model = (p: number[], t: number) => p[0] * Math.exp(-t / p[1]) + p[2];
  const observed = tDays.map((t, i) => model(truth, t) + sigmasS[i] * normal());
  const residuals = (p: number[]) => observed.map((y, i) => y - model(p, tDays[i]));
  const stepScales = (p: number[]) => [Math.abs(p[0]) || 1e-6, Math.abs(p[1]) || 1, 1e-6];
  const calls = { withDesign: 0, withoutDesign: 0 };
  const problem: FitProblem = {
    parameterNames: ['amplitudeS', 'decayDays', 'offsetS'],
    initialValues: start.map(dd),
    sigmasS,
    maxIterations,
    evaluate(values, wantDesign) {
      wantDesign ? calls.withDesign++ : calls.withoutDesign++;
      const p = values.map(num);
      if (!wantDesign) return { residualsS: residuals(p) };
      const design = new Float64Array(3 * n);
      const scales = stepScales(p);
      for (let j = 0; j < 3; j++) {
        const column = numericDerivativeColumn((o) => residuals(p.map((v, k) => (k === j ? v + o : v))), scales[j]);
        design.set(column, j * n);
      }
      return { residualsS: residuals(p), design };
    },
  };
  return { problem, truth, calls };
}
