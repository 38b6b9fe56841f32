/**
 * Speed of the residual periodogram: the fast generalized Lomb–Scargle
 * (extirpolation + FFT) on 100 000 residuals at 100 000 frequencies (target
 * < 1 s), the direct sum on a smaller problem, and the fast/direct speed ratio
 * extrapolated to the full size (the direct sum scales as N·M).
 *
 * Run: npx tsx -e "import('./scripts/bench/periodogram.ts').then(m=>m.bench())"
 */
import { cpus, loadavg } from 'node:os';
import { lombScargleDirect } from '../../worker/timing/periodogram/lomb-scargle-direct';
import { lombScargleFast, LOMB_SCARGLE_FAST_SETTINGS } from '../../worker/timing/periodogram/lomb-scargle-fast';
import { gridFrequenciesPerDay, type FrequencyGrid } from '../../worker/timing/periodogram/frequency-grid';

const N_FAST = 100_000;
const M_FAST = 100_000;
const N_DIRECT = 2_000;
const M_DIRECT = 2_000;
const TARGET_FAST_S = 1;

/** Invented residuals: irregular times over 10 years, one sinusoid plus uniform noise. */
function residuals(n: number, seed: number): { tDays: Float64Array; y: Float64Array; sigma: Float64Array } {
  let state = seed;
  const rnd = (): number => { state = (state * 16807) % 2147483647; return state / 2147483647; };
  const tDays = new Float64Array(n), y = new Float64Array(n), sigma = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    tDays[i] = 55000 + 3652.5 * rnd();
    sigma[i] = 0.5 + rnd();
    y[i] = 0.1 * Math.sin((2 * Math.PI * tDays[i]) / 41.7) + sigma[i] * (rnd() - 0.5);
  }
  return { tDays, y, sigma };
}

/** Median wall time of `repeats` runs after one warm-up run, seconds. */
function timeMedianS(run: () => void, repeats = 3): number {
  run();
  const times: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const start = process.hrtime.bigint();
    run();
    times.push(Number(process.hrtime.bigint() - start) / 1e9);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

export async function bench(): Promise<void> {
  console.log(`periodogram bench — ${cpus().length} cores, load ${loadavg()[0].toFixed(2)}; fast settings ${JSON.stringify(LOMB_SCARGLE_FAST_SETTINGS)}`);
  const big = residuals(N_FAST, 7);
  const spanDays = 3652.5;
  const bigGrid: FrequencyGrid = { minFreqPerDay: 1 / spanDays, stepPerDay: 1 / (5 * spanDays), count: M_FAST };
  const fastS = timeMedianS(() => { lombScargleFast(big.tDays, big.y, big.sigma, bigGrid); });
  console.log(`fast  ${N_FAST} residuals × ${M_FAST} frequencies: ${fastS.toFixed(3)} s (target < ${TARGET_FAST_S} s: ${fastS < TARGET_FAST_S ? 'met' : 'MISSED'})`);

  const small = residuals(N_DIRECT, 9);
  const smallGrid: FrequencyGrid = { minFreqPerDay: 1 / spanDays, stepPerDay: 1 / (5 * spanDays), count: M_DIRECT };
  const smallF = gridFrequenciesPerDay(smallGrid);
  const directS = timeMedianS(() => { lombScargleDirect(small.tDays, small.y, small.sigma, smallF); }, 1);
  const fastSmallS = timeMedianS(() => { lombScargleFast(small.tDays, small.y, small.sigma, smallGrid); });
  console.log(`direct ${N_DIRECT} × ${M_DIRECT}: ${directS.toFixed(3)} s; fast on the same: ${fastSmallS.toFixed(4)} s (ratio direct/fast ${(directS / fastSmallS).toFixed(1)})`);
  const directFullS = directS * ((N_FAST * M_FAST) / (N_DIRECT * M_DIRECT)); // direct sum costs ∝ N·M
  console.log(`direct ${N_FAST} × ${M_FAST} extrapolated (∝ N·M): ${directFullS.toFixed(0)} s; fast/direct speed ratio ${(directFullS / fastS).toFixed(0)}×`);
}
