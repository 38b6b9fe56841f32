/**
 * Decimal text ⇄ `Mjd`, keeping every digit that matters.
 *
 * Both directions use the exact decimal ⇄ double-double conversion of
 * model/decimal-double-double.ts (BigInt arithmetic, one rounding, half to even):
 * parsing reads the integer day as an exact integer and the fractional digits as
 * the nearest double-double, so any text that formatMjd writes from an `Mjd`
 * with enough digits reads back to the identical day and fraction; printing
 * rounds the exact binary value of day + fraction once to the requested decimals.
 */
import type { Mjd } from './epoch';
import { mjdFromParts } from './mjd-arithmetic';
import { ddToScaledDecimal, parseDecimalFractionToDd } from '../model/decimal-double-double';

const PLAIN_DECIMAL = /^([+-]?)(\d+)(?:\.(\d*))?$/;

/**
 * Parses a plain decimal MJD such as `58000.123456789012345678901`.
 *
 * @param text  optional sign, at least one integer digit (leading zeros allowed),
 *              optional `.` followed by any number of digits (Note 1); no exponent,
 *              no spaces, no digits-free forms such as `.5`
 * @returns     `Mjd` in normal form (integer day, 0 ≤ frac < 1); negative values are
 *              carried as day −1, frac 0.5 for `-0.5`
 *
 * Notes: 1. A trailing point (`58000.`) is read as the integer 58000, as most
 *           languages read it. The integer part must be a safe integer (< 2^53).
 * Accuracy: the fraction is the nearest double-double to the decimal fraction
 *           (correctly rounded; tests/engine/time/mjd-string.test.ts).
 * Throws RangeError naming the text when it is not a plain decimal.
 */
export function parseMjd(text: string): Mjd {
  const match = PLAIN_DECIMAL.exec(text);
  if (match === null) {
    throw new RangeError(`parseMjd: "${text}" is not a plain decimal MJD (digits, optional sign and point, no exponent)`);
  }
  const [, sign, integerDigits, fractionDigits = ''] = match;
  const wholeDays = Number(integerDigits);
  if (!Number.isSafeInteger(wholeDays)) {
    throw new RangeError(`parseMjd: "${text}" has an integer part beyond 2^53`);
  }
  const fraction = parseDecimalFractionToDd(fractionDigits);
  if (sign === '-') {
    return mjdFromParts(-wholeDays, [-fraction[0], -fraction[1]]);
  }
  return mjdFromParts(wholeDays, fraction);
}

/**
 * Exact decimal text of an `Mjd`.
 *
 * @param m               the instant (any time scale; printed as-is)
 * @param fractionDigits  digits after the point, integer 0–40 (default 18 ≈ 1e-13 s)
 * @returns               e.g. `58000.500000000000000000`; `-0.5` for day −1, frac 0.5
 *
 * Rounding: the exact binary value is rounded once to `fractionDigits` decimals,
 * round half to even. Throws RangeError for a bad digit count.
 */
export function formatMjd(m: Mjd, fractionDigits = 18): string {
  if (!Number.isInteger(fractionDigits) || fractionDigits < 0 || fractionDigits > 40) {
    throw new RangeError(`formatMjd: fractionDigits ${fractionDigits} must be an integer 0–40`);
  }
  if (!Number.isSafeInteger(m.day)) {
    throw new RangeError(`formatMjd: day ${m.day} must be a safe integer`);
  }
  const decimalUnits = ddToScaledDecimal(m.frac, fractionDigits, BigInt(m.day));
  const negative = decimalUnits < 0n;
  const digits = (negative ? -decimalUnits : decimalUnits).toString().padStart(fractionDigits + 1, '0');
  const integerPart = digits.slice(0, digits.length - fractionDigits);
  const fractionPart = digits.slice(digits.length - fractionDigits);
  return `${negative ? '-' : ''}${integerPart}${fractionDigits > 0 ? `.${fractionPart}` : ''}`;
}
