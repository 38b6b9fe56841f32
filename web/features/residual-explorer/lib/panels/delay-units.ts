/** A display unit for delays given in seconds. */
export interface DelayUnit {
  symbol: 's' | 'ms' | 'µs' | 'ns';
  /** how many of this unit make one second */
  perSecond: number;
  /** fractional digits that still show whole nanoseconds */
  decimals: number;
}

export const DELAY_UNITS: readonly DelayUnit[] = [
  { symbol: 's', perSecond: 1, decimals: 9 },
  { symbol: 'ms', perSecond: 1e3, decimals: 6 },
  { symbol: 'µs', perSecond: 1e6, decimals: 3 },
  { symbol: 'ns', perSecond: 1e9, decimals: 1 },
];

/**
 * The unit for a column of delays: the largest unit in which the biggest |value| is at least 1
 * (so 69.184 s stays seconds, 1.6e-3 s reads as ms, 2e-6 s as µs), nanoseconds below a µs or when
 * every value is 0 or missing. All values of a column share the unit, so they line up.
 *
 * @param valuesS  delays, seconds (non-finite entries ignored)
 */
export function chooseDelayUnit(valuesS: readonly number[]): DelayUnit {
  let maxAbs = 0;
  for (const v of valuesS) if (Number.isFinite(v) && Math.abs(v) > maxAbs) maxAbs = Math.abs(v);
  for (const unit of DELAY_UNITS) if (maxAbs * unit.perSecond >= 1) return unit;
  return DELAY_UNITS[DELAY_UNITS.length - 1];
}

/**
 * A delay in `unit`, down to whole nanoseconds, with a true minus sign: 0.0016123 s in ms →
 * "1.612300", −2.5e-6 s in µs → "−2.500". '—' for a missing value.
 */
export function formatDelay(valueS: number | null | undefined, unit: DelayUnit): string {
  if (typeof valueS !== 'number' || !Number.isFinite(valueS)) return '—';
  const text = (valueS * unit.perSecond).toFixed(unit.decimals);
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text.replace(/^-/, '−');
}
