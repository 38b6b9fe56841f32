/** Reduced χ² with three significant digits; '—' when absent. */
export function formatReducedChi2(value: number | null | undefined): string {
  return typeof value === 'number' && Number.isFinite(value) ? value.toPrecision(3) : '—';
}

/** A weighted RMS in µs with three significant digits, e.g. "1.23 µs"; '—' when absent. */
export function formatRmsUs(value: number | null | undefined): string {
  return typeof value === 'number' && Number.isFinite(value) ? `${value.toPrecision(3)} µs` : '—';
}

/** An uncertainty with two significant digits (it is itself only known to about that). */
export function formatUncertainty(value: number): string {
  return Number.isFinite(value) ? value.toPrecision(2) : '—';
}

/** A change in units of σ with a sign, e.g. "+3.4σ". */
export function formatSigma(value: number): string {
  if (!Number.isFinite(value)) return '—';
  const text = Math.abs(value) >= 100 ? value.toFixed(0) : value.toFixed(1);
  return `${value > 0 ? '+' : ''}${text}σ`;
}

/** A duration in ms as "850 ms" or "12.3 s". */
export function formatDurationMs(value: number | null | undefined): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '—';
  return value < 1000 ? `${Math.round(value)} ms` : `${(value / 1000).toFixed(1)} s`;
}
