/**
 * Shows an MJD (number or decimal string from the API) with `decimals` fractional digits.
 * Strings are cut, never parsed through a float, so no digits are invented or lost to rounding.
 */
export function formatMjd(value: number | string | null | undefined, decimals = 3): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'number') return Number.isFinite(value) ? value.toFixed(decimals) : '—';
  const match = /^(-?\d+)(?:\.(\d*))?$/.exec(value.trim());
  if (!match) return value;
  const fraction = (match[2] ?? '').padEnd(decimals, '0').slice(0, decimals);
  return decimals > 0 ? `${match[1]}.${fraction}` : match[1];
}

const integerFormat = new Intl.NumberFormat('en-GB');
export function formatCount(value: number | null | undefined): string {
  return typeof value === 'number' && Number.isFinite(value) ? integerFormat.format(value) : '—';
}

const dateTimeFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });
/** An ISO time as "1 Dec 2026, 22:15 UTC"; unparsable input is shown as it came. */
export function formatDateTimeUtc(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : `${dateTimeFormat.format(date)} UTC`;
}
