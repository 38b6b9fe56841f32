/**
 * Speed of the fitting core on the target size, 100 000 TOAs × 30 parameters:
 * the Householder QR alone, the whole weighted least-squares solve, and one
 * Gauss–Newton iteration with a model whose evaluation costs nothing (so the
 * figure is the fitting machinery's own share of the 1.5 s per-iteration
 * budget), plus ml-matrix's QR once for comparison.
 *
 * Run: npx tsx -e "import('./scripts/bench/fit.ts').then(m=>m.bench())"
 */
import { cpus, loadavg } from 'node:os';
import { Matrix, QrDecomposition } from 'ml-matrix';
import { householderQr } from '../../worker/timing/fit/householder-qr';
import { solveWeightedLeastSquares } from '../../worker/timing/fit/weighted-least-squares';
import { fitGaussNewton } from '../../worker/timing/fit/gauss-newton-fit';
import { createSeededNormal, createSeededUniform } from '../../worker/timing/fit/seeded-normal';
import type { DoubleDouble } from '../../worker/timing/time/epoch';

const N = 100_000;
const P = 30;
const TARGET_ITERATION_S = 1.5;
/** The machine-independent yardstick: N·p² floating-point operations at 1 GFLOP/s. */
const REFERENCE_S = (N * P * P) / 1e9;

function fmt(seconds: number): string {
  return `${seconds.toFixed(3)} s`;
}

/** Median wall time of `repeats` runs after one warm-up run, seconds. */
function timeMedianS(run: () => void, repeats = 3): number {
  run();
  const times: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const start = performance.now();
    run();
    times.push((performance.now() - start) / 1000);
  }
  return times.sort((a, b) => a - b)[Math.floor(times.length / 2)];
}

function syntheticProblem() {
  const normal = createSeededNormal(2026);
  const uniform = createSeededUniform(12);
  const design = Float64Array.from({ length: N * P }, normal);
  const sigmasS = Float64Array.from({ length: N }, () => 1e-6 * (0.5 + uniform()));
  const truth = Float64Array.from({ length: P }, normal);
  const rhs = new Float64Array(N);
  for (let j = 0; j < P; j++) for (let i = 0; i < N; i++) rhs[i] += design[j * N + i] * truth[j] * 1e-6;
  for (let i = 0; i < N; i++) rhs[i] += sigmasS[i] * normal();
  return { design, sigmasS, rhs };
}

export async function bench(): Promise<void> {
  const { design, sigmasS, rhs } = syntheticProblem();
  console.log(`(1-minute load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores: figures grow with load)`);

  const qrS = timeMedianS(() => {
    householderQr(design.slice(), N, P, rhs.slice());
  });
  console.log(
    `householder QR ${N} x ${P}: ${fmt(qrS)}; N·p² at 1 GFLOP/s = ${fmt(REFERENCE_S)} → ratio ${(qrS / REFERENCE_S).toFixed(1)}`,
  );

  const lsqS = timeMedianS(() => {
    solveWeightedLeastSquares(design, N, P, rhs, sigmasS);
  });
  console.log(
    `least squares ${N} x ${P}: ${fmt(lsqS)} (target < ${TARGET_ITERATION_S} s per iteration, ratio ${(lsqS / TARGET_ITERATION_S).toFixed(2)}); ` +
      `N·p² at 1 GFLOP/s = ${fmt(REFERENCE_S)} → ratio ${(lsqS / REFERENCE_S).toFixed(1)}`,
  );

  // A linear model y = Σ A_ij x_j: evaluation is a p-column product (~2Np flops), negligible here.
  const negativeDesign = design.map((v) => -v);
  let evaluations = 0;
  const problem = {
    parameterNames: Array.from({ length: P }, (_, j) => `p${j}`),
    initialValues: Array.from({ length: P }, (): DoubleDouble => [0, 0]),
    sigmasS,
    evaluate(values: DoubleDouble[], wantDesign: boolean) {
      evaluations++;
      const residualsS = rhs.slice();
      for (let j = 0; j < P; j++) {
        const x = values[j][1] + values[j][0];
        for (let i = 0; i < N; i++) residualsS[i] -= design[j * N + i] * x;
      }
      return { residualsS, design: wantDesign ? negativeDesign : undefined };
    },
  };
  const start = performance.now();
  const outcome = fitGaussNewton(problem);
  const fitS = (performance.now() - start) / 1000;
  const perIterationS = fitS / outcome.iterations;
  console.log(
    `gauss-newton ${N} x ${P}: ${outcome.iterations} iterations, ${evaluations} model evaluations, ${fmt(fitS)} → ` +
      `${fmt(perIterationS)} per iteration (target < ${TARGET_ITERATION_S} s, ratio ${(perIterationS / TARGET_ITERATION_S).toFixed(2)}); ` +
      `converged ${outcome.converged}, reduced χ² ${outcome.reducedChi2.toFixed(4)}`,
  );

  // ml-matrix's QR for comparison, once (~5 s; shared/STACK.md §9).
  const rows = new Matrix(N, P);
  const b = new Matrix(N, 1);
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < P; j++) rows.set(i, j, design[j * N + i] / sigmasS[i]);
    b.set(i, 0, rhs[i] / sigmasS[i]);
  }
  const mlStart = performance.now();
  const reference = new QrDecomposition(rows).solve(b);
  const mlS = (performance.now() - mlStart) / 1000;
  const ours = solveWeightedLeastSquares(design, N, P, rhs, sigmasS);
  let worst = 0;
  for (let j = 0; j < P; j++) worst = Math.max(worst, Math.abs(ours.solution[j] - reference.get(j, 0)) / ours.uncertainties[j]);
  console.log(
    `ml-matrix QrDecomposition.solve ${N} x ${P}: ${fmt(mlS)} → ratio to ours ${(mlS / lsqS).toFixed(1)}; ` +
      `N·p² at 1 GFLOP/s → ratio ${(mlS / REFERENCE_S).toFixed(1)}; max |ours − ml-matrix| = ${worst.toExponential(1)} σ`,
  );
}
