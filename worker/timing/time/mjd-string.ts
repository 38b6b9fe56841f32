/**
 * Decimal text ⇄ `Mjd`, keeping every digit that matters.
 *
 * Parsing never goes through one float64: the integer day is read as an exact
 * integer, and the fractional digits are read in chunks of at most 15 digits
 * (each chunk an exact integer < 2^53) folded together from the last chunk to
 * the first as frac = (chunk + frac) / 10^len in double-double (Horner's rule),
 * so the result is within ~1e-32 day of the decimal value whatever the number
 * of digits.
 *
 * Printing is exact: the double-double fraction is turned into an exact binary
 * rational with BigInt (every double is an integer multiple of 2^-1074) and
 * rounded once to the requested number of decimals, round half to even.
 */
import type { Mjd } from './epoch';
import { ddAddNumber, ddDivideByNumber } from './double-double-typed';
import type { DoubleDouble } from './epoch';
import { mjdFromParts } from './mjd-arithmetic';

const PLAIN_DECIMAL = /^([+-]?)(\d+)(?:\.(\d*))?$/;
const DIGITS_PER_CHUNK = 15; // 10^15 < 2^53: every chunk is an exact integer

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
 * Accuracy: ≤ ~1e-32 day from the decimal value (tests/engine/time/mjd-string.test.ts).
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
  const fraction = decimalFractionToDd(fractionDigits);
  if (sign === '-') {
    return mjdFromParts(-wholeDays, [-fraction[0], -fraction[1]]);
  }
  return mjdFromParts(wholeDays, fraction);
}

/** 0.d1d2d3… as a double-double, folded chunk by chunk from the end (Horner). */
function decimalFractionToDd(digits: string): DoubleDouble {
  let fraction: DoubleDouble = [0, 0];
  for (let end = digits.length; end > 0; end -= DIGITS_PER_CHUNK) {
    const start = Math.max(0, end - DIGITS_PER_CHUNK);
    const chunk = Number(digits.slice(start, end));
    fraction = ddDivideByNumber(ddAddNumber(fraction, chunk), 10 ** (end - start));
  }
  return fraction;
}

const BINARY_SCALE_BITS = 1074n; // 2^1074 · (any double) is an integer
const float64View = new Float64Array(1);
const bitsView = new BigUint64Array(float64View.buffer);

/** x · 2^1074 as an exact BigInt. */
function doubleTimesTwoTo1074(x: number): bigint {
  if (x === 0) return 0n;
  float64View[0] = x;
  const bits = bitsView[0];
  const negative = bits >> 63n === 1n;
  const biasedExponent = (bits >> 52n) & 0x7ffn;
  const mantissaBits = bits & 0xfffffffffffffn;
  // IEEE 754 binary64: normal x = (2^52 + m)·2^(e−1075); subnormal x = m·2^(−1074).
  const significand = biasedExponent === 0n ? mantissaBits : mantissaBits | (1n << 52n);
  const shift = biasedExponent === 0n ? 0n : biasedExponent - 1n;
  const magnitude = significand << shift;
  return negative ? -magnitude : magnitude;
}

/** round(n / d) for d > 0, ties to even. */
function divideRoundHalfEven(n: bigint, d: bigint): bigint {
  let q = n / d;
  let r = n % d;
  if (r < 0n) {
    q -= 1n;
    r += d;
  }
  const twice = 2n * r;
  if (twice > d || (twice === d && q % 2n !== 0n)) q += 1n;
  return q;
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
  const fractionScaled = doubleTimesTwoTo1074(m.frac[1]) + doubleTimesTwoTo1074(m.frac[0]);
  const totalScaled = (BigInt(m.day) << BINARY_SCALE_BITS) + fractionScaled;
  const tenPower = 10n ** BigInt(fractionDigits);
  const decimalUnits = divideRoundHalfEven(totalScaled * tenPower, 1n << BINARY_SCALE_BITS);
  const negative = decimalUnits < 0n;
  const digits = (negative ? -decimalUnits : decimalUnits).toString().padStart(fractionDigits + 1, '0');
  const integerPart = digits.slice(0, digits.length - fractionDigits);
  const fractionPart = digits.slice(digits.length - fractionDigits);
  return `${negative ? '-' : ''}${integerPart}${fractionDigits > 0 ? `.${fractionPart}` : ''}`;
}
