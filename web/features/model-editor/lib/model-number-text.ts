/**
 * How the editor turns a value's text back into JSON. Epochs (`*_mjd`) and the spin frequency need
 * more digits than a double holds, so they are always written as decimal strings (docs/formats.md §2).
 * Any other text becomes a JSON number only when that number prints back as the very same text
 * (`"41.27"` → 41.27, `"1e-21"` → 1e-21); everything else (`"0.0"`, `"0.100000000000000000001"`,
 * text that is not a number) stays a string, so not one typed digit changes and the server judges it.
 */
const PLAIN_NUMBER = /^-?(?:0|[1-9]\d*)(?:\.\d+)?(?:e[+-]?\d+)?$/;

export function isPreciseKey(key: string): boolean {
  return key === 'frequency_hz' || key.endsWith('_mjd');
}

export function jsonValueOfText(text: string, precise: boolean): string | number {
  if (precise || !PLAIN_NUMBER.test(text)) return text;
  const value = Number(text);
  return Number.isFinite(value) && String(value) === text ? value : text;
}

/** The text shown for a value read from a file: strings as they are, numbers in JavaScript's shortest form. */
export function textOfJsonValue(value: unknown): string {
  if (value === undefined || value === null) return '';
  if (typeof value === 'string') return value;
  if (typeof value === 'number') return String(value);
  return JSON.stringify(value);
}
