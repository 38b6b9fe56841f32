// Invented irregular data sets for the periodogram tests (seeded, deterministic).
export interface SampleSet { tDays: Float64Array; y: Float64Array; sigma: Float64Array }

/** Park–Miller minimal-standard generator on (0, 1). */
export function seededUniform(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647;
  };
}

/** n irregular times over spanDays, a sinusoid of periodDays plus uniform noise, σ in [0.5, 1.5). */
export function irregularSinusoid(n: number, spanDays: number, periodDays: number, amplitude: number, seed: number): SampleSet {
  const rnd = seededUniform(seed);
  const tDays = new Float64Array(n), y = new Float64Array(n), sigma = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    tDays[i] = 53000 + spanDays * rnd();
    sigma[i] = 0.5 + rnd();
    y[i] = amplitude * Math.sin((2 * Math.PI * tDays[i]) / periodDays + 1.1) + sigma[i] * (rnd() - 0.5) + 2;
  }
  return { tDays, y, sigma };
}

/** Largest |a − b|/|b| over all entries. */
export function worstRelativeDifference(a: Float64Array, b: Float64Array | number[]): number {
  let worst = 0;
  for (let k = 0; k < a.length; k++) worst = Math.max(worst, Math.abs(a[k] - b[k]) / Math.abs(b[k]));
  return worst;
}
