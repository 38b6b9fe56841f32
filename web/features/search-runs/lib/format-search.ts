/** A false-alarm probability: "0.023", "4.1e-5"; "< 1e-300" when it underflowed to 0. */
export function formatFap(value: number | null | undefined): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '—';
  if (value === 0) return '< 1e-300';
  if (value >= 0.01) return value.toPrecision(2);
  return value.toExponential(1);
}

/** A period in days with six significant digits, e.g. "41.2997 d". */
export function formatPeriodDays(value: number | null | undefined): string {
  return typeof value === 'number' && Number.isFinite(value) ? `${value.toPrecision(6)} d` : '—';
}

/** A normalised periodogram power (0–1) with three decimals. */
export function formatPower(value: number | null | undefined): string {
  return typeof value === 'number' && Number.isFinite(value) ? value.toFixed(3) : '—';
}

/** A derived physical quantity with three significant digits ("1.23e-5" below 1e-3 or from 1e5). */
export function formatQuantity(value: number | null | undefined): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  return magnitude < 1e-3 || magnitude >= 1e5 ? value.toExponential(2) : value.toPrecision(3);
}

/** A χ² change with its sign and one decimal, e.g. "−1 234.5" is written "-1234.5". */
export function formatChi2Change(value: number | null | undefined): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '—';
  return `${value > 0 ? '+' : ''}${value.toFixed(1)}`;
}
